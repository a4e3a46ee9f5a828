"""Tests of oracle.bounds: the catalogue, its proven evaluation, and self-validation.

References outside the project:
* exact pi, p_n, pi_2, theta, psi up to 10**7 from a sieve written here, whose
  count is checked against primesieve (test-only reference);
* pi(x) and p_n sampled up to 10**16 with primecountpy (test-only reference);
* li(x) against mpmath.li at 60 digits (test-only reference);
* published values, each named beside its check.
"""

from __future__ import annotations

import math
import random
from fractions import Fraction

import gmpy2
import mpmath
import numpy as np
import primesieve
import pytest
from mpmath import iv

from oracle import bounds
from oracle._errors import InvalidInputError
from oracle.bounds import _enclosures, _expressions, _selfcheck
from oracle.bounds._catalogue import CatalogueError, load_catalogue
from _references import primecountpy

LIMIT = 10 ** 7                      # exhaustive range (issue 4, item 3)
MARGIN = 2_000                       # sieve a little further, so every x <= LIMIT has a next prime
UNCONDITIONAL = [b for b in bounds.catalogue() if not b.conditional]


def _ids(function, *, conditional=False):
    return [b.id for b in bounds.catalogue() if b.function == function and b.conditional == conditional]


# ----------------------------------------------------------------- exact data

@pytest.fixture(scope="module")
def sieve():
    """is_prime flags for 0..LIMIT+MARGIN (Eratosthenes), checked against primesieve."""
    size = LIMIT + MARGIN + 1
    flags = np.ones(size, dtype=bool)
    flags[:2] = False
    for p in range(2, math.isqrt(size - 1) + 1):
        if flags[p]:
            flags[p * p::p] = False
    assert int(flags[:LIMIT + 1].sum()) == primesieve.count_primes(LIMIT)   # primesieve (reference)
    assert int(flags[:LIMIT + 1].sum()) == 664579                          # OEIS A006880: pi(10^7)
    return flags


@pytest.fixture(scope="module")
def data(sieve):
    x = np.arange(LIMIT + 1, dtype=np.int64)
    pi = np.cumsum(sieve[:LIMIT + 1], dtype=np.int64)
    primes = np.flatnonzero(sieve).astype(np.int64)
    logs = np.zeros(LIMIT + 1)
    small_primes = primes[primes <= LIMIT]
    logs[small_primes] = np.log(small_primes.astype(np.float64))
    theta = np.cumsum(logs)
    mangoldt = logs.copy()
    for p in small_primes[small_primes <= math.isqrt(LIMIT)]:
        power = int(p) * int(p)
        while power <= LIMIT:
            mangoldt[power] = math.log(int(p))
            power *= int(p)
    psi = np.cumsum(mangoldt)
    twin_end = np.zeros(LIMIT + 1, dtype=np.int64)        # pair (p, p+2) counted once p + 2 <= x
    pairs = small_primes[(small_primes + 2 <= LIMIT) & sieve[np.minimum(small_primes + 2, LIMIT + MARGIN)]]
    twin_end[pairs + 2] = 1
    twin = np.cumsum(twin_end)
    return {"x": x, "pi": pi, "primes": primes, "theta": theta, "psi": psi, "twin": twin, "cache": {}}


def test_twin_counting_convention_matches_primesieve(data):
    # primesieve counts pairs (p, p+2) with p >= start and p+2 <= stop (reference library).
    for stop in (4, 5, 6, 7, 13, 10 ** 6, LIMIT):
        assert int(data["twin"][stop]) == primesieve.count_twins(0, stop)
    assert int(data["twin"][10 ** 6]) == 8169            # OEIS A007508: pi_2(10^6) = 8169


def _primorial_log(x, primes):
    product = gmpy2.mpz(1)
    for p in primes[primes <= x]:
        product *= int(p)
    return iv.log(iv.mpf(int(product)))


# ------------------------------------------------------------ the catalogue

def test_catalogue_covers_the_families_of_the_issue():
    ids = {b.id for b in bounds.catalogue()}
    required = {
        "pi-lower-rs62", "pi-upper-rs62",                                   # Rosser-Schoenfeld 1962
        "pi-lower-dusart18-2", "pi-upper-dusart10-2.334", "pi-upper-dusart-1.2762",  # 1/ln, 1/ln^2 forms
        "pi-lower-dusart10-lnm1", "pi-upper-dusart10-lnm1.1",               # x/(ln x - 1) forms
        "pi-li-buthe18-positive",                                           # li(x) > pi(x), proven range
        "pn-lower-rosser39", "pn-lower-dusart99", "pn-upper-dusart10-2",    # p_n bounds
        "int-bertrand", "int-nagura52", "int-schoenfeld76", "int-dusart10-396738",  # short intervals
        "int-mv73-brun-titchmarsh", "theta-upper-rs62", "psi-dusart18-k1-0.85",
        "twin-upper-siebert", "rh-pi-li-schoenfeld76",
        "pn-upper-euclid", "pi-lower-erdos-log2", "pi-upper-sieve-2", "theta-upper-erdos-4x",
    }
    assert required <= ids
    assert all(bounds.entry(i).conditional for i in ids if i.startswith("rh-"))
    assert not any(bounds.entry(i).conditional for i in ids if not i.startswith("rh-"))


def test_every_entry_names_source_status_and_range():
    for bound in bounds.catalogue():
        assert bound.source and bound.statement
        assert bound.status in ("confirmed", "partial", "from-memory", "elementary")
        assert bound.assumption in ("unconditional", "RH")
        if bound.status == "elementary":
            assert bound.proof or bound.source.startswith(("definition", "common practice")) \
                or "definition" in bound.source


def test_errata_are_kept_apart():
    errata_ids = {b.id for b in bounds.errata()}
    assert "pn-upper-robin83-0.9385" in errata_ids
    assert not errata_ids & {b.id for b in bounds.catalogue()}


@pytest.mark.parametrize("text", ["__import__('os')", "x.real", "x if x else 1", "lambda: 1", "y + 1",
                                  "ln(x, 2)", "[x]", "x @ x", ""])
def test_formula_language_refuses_everything_else(text):
    with pytest.raises(_expressions.FormulaError):
        _expressions.parse_formula(text)


def test_decimal_constants_are_exact():
    assert _expressions.parse_constant("1.25506") == Fraction(125506, 100000)
    assert _expressions.parse_constant("1.101e26") == 110100000000000000000000000
    assert _expressions.parse_constant("10**19") == 10 ** 19


@pytest.mark.parametrize("change, message", [
    (("from: '17'", "from: 17.5"), "quoted"),
    (("function: pi\n", "function: pie\n"), "function"),
    (("lower: x/ln(x)\n", "lower: n/ln(n)\n"), "uses 'n'"),
    (("assumption: unconditional", "assumption: maybe"), "assumption"),
])
def test_malformed_catalogue_is_refused(tmp_path, change, message):
    text = open(bounds.load_catalogue().path).read()
    assert change[0] in text
    copy = tmp_path / "bounds.yaml"
    copy.write_text(text.replace(change[0], change[1], 1))
    with pytest.raises(CatalogueError, match=message):
        load_catalogue(copy)


# ---------------------------------------------------- proven evaluation (unit)

def test_integer_rounding_uses_the_right_endpoint():
    with _enclosures.precision(64):
        point = iv.mpf(3)
        wide = iv.mpf(["2.5", "3.5"])
    assert _enclosures.integer_lower(point, strict=False) == 3
    assert _enclosures.integer_lower(point, strict=True) == 4
    assert _enclosures.integer_upper(point, strict=False) == 3
    assert _enclosures.integer_upper(point, strict=True) == 2
    assert _enclosures.integer_lower(wide, strict=False) == 3      # ceil(2.5), not ceil(3.5)
    assert _enclosures.integer_upper(wide, strict=False) == 3      # floor(3.5)


@pytest.mark.parametrize("x", [2, 3, 10, 1000, 10 ** 6, 10 ** 12, 10 ** 19, 10 ** 30, 2 ** 80])
def test_li_enclosure_contains_mpmath_li(x):
    enclosure = _expressions.enclose(_expressions.parse_formula("li(x)"), x, _enclosures.working_precision(x))
    low, high = _enclosures.endpoints(enclosure)
    with mpmath.workdps(80):
        reference = mpmath.li(x)                                   # mpmath (test-only reference)
        assert mpmath.mpf(low.numerator) / low.denominator <= reference
        assert reference <= mpmath.mpf(high.numerator) / high.denominator
    assert (high - low) / low < Fraction(1, 10 ** 25)


def test_pi_intervals_contain_published_values():
    published = {                      # OEIS A006880 (values from memory; 10^12..10^16 re-checked below)
        10 ** 12: 37607912018, 10 ** 16: 279238341033925, 10 ** 19: 234057667276344607,
        10 ** 20: 2220819602560918840,
    }
    assert primecountpy.prime_pi(10 ** 12) == published[10 ** 12]
    for x, value in published.items():
        interval = bounds.pi(x)
        assert interval.lower <= value <= interval.upper, x
        assert type(interval.lower) is int and type(interval.upper) is int


def test_nth_prime_interval_contains_published_values():
    for n, value in {10 ** 6: 15485863, 10 ** 9: 22801763489}.items():   # OEIS A006988
        interval = bounds.nth_prime(n)
        assert interval.lower <= value <= interval.upper


def test_twin_pi_interval_contains_brent_count():
    interval = bounds.twin_pi(8 * 10 ** 10)
    assert interval.lower <= 182855913 <= interval.upper                # Brent 1976 (Platt & Trudgian 2018)


@pytest.mark.parametrize("x", [10 ** 30, 2 ** 80, 10 ** 100, 10 ** 1000])
def test_far_arguments_get_finite_proven_intervals(x):
    interval = bounds.pi(x)
    assert 0 < interval.lower < interval.upper
    assert interval.upper - interval.lower < interval.lower // 10 ** 3
    p_n = bounds.nth_prime(x)
    assert x * 1 < p_n.lower < p_n.upper


def test_theta_and_psi_contain_dusart_table_values():
    # Dusart 2018, Ramanujan J. 45, Table 2: theta(1e10) = 9999939830.657757..., psi - theta = 102289.1757...
    theta_value = Fraction("9999939830.657757")
    assert bounds.theta(10 ** 10).contains(theta_value)
    assert bounds.psi(10 ** 10).contains(theta_value + Fraction("102289.175716"))


def test_only_ranges_containing_the_argument_are_used():
    assert "pi-lower-dusart18-2" not in {b.id for b in bounds.applicable("pi", 88788)}
    assert "pi-lower-dusart18-2" in {b.id for b in bounds.applicable("pi", 88789)}
    end = 2165 * 10 ** 27                                              # Johnston 2023 range end 2.165e30
    assert "pi-li-johnston-weak" in {b.id for b in bounds.applicable("pi", end)}
    assert "pi-li-johnston-weak" not in {b.id for b in bounds.applicable("pi", end + 1)}
    far = bounds.pi(10 ** 31)
    assert not any("li" in bound_id for bound_id in far.theorems)


@pytest.mark.parametrize("x", [3000, 10 ** 6, 10 ** 12, 10 ** 20, 10 ** 40])
def test_rh_entries_are_never_used_as_proof(x):
    for interval in (bounds.pi(x), bounds.theta(x), bounds.psi(x)):
        assert not any(bounds.entry(i).conditional for i in interval.theorems)
    proven, conditional = bounds.pi(x), bounds.pi_assuming_rh(x)
    assert conditional.assumption == "RH"
    assert proven.lower <= conditional.lower <= conditional.upper <= proven.upper
    if x >= 10 ** 20:
        assert any(bounds.entry(i).conditional for i in conditional.theorems)


@pytest.mark.parametrize("call", [
    lambda: bounds.pi(1.5), lambda: bounds.pi(True), lambda: bounds.pi(-1), lambda: bounds.pi("10"),
    lambda: bounds.nth_prime(0), lambda: bounds.primes_between(5, 3), lambda: bounds.twin_pi(-2),
])
def test_bad_input_is_refused(call):
    with pytest.raises(InvalidInputError):
        call()


def test_primes_between_against_exact_counts(data):
    rng = random.Random(4)
    pi = data["pi"]
    for _ in range(25):
        a = rng.randrange(0, LIMIT // 2)
        b = a + rng.choice([0, 1, 2, 10, 100, 10_000, a])
        interval = bounds.primes_between(a, b)
        exact = int(pi[b] - pi[a])
        assert interval.lower <= exact <= interval.upper, (a, b)
    big = bounds.primes_between(10 ** 15, 10 ** 15 + 10 ** 6)          # primecountpy (reference)
    exact = primecountpy.prime_pi(10 ** 15 + 10 ** 6) - primecountpy.prime_pi(10 ** 15)
    assert 0 < big.lower <= exact <= big.upper


def test_oracle_intervals_contain_exact_values_at_random_points(data):
    rng = random.Random(2024)
    for x in [0, 1, 2, 3, 4, 5, 10, 16, 17, 100, 113, 1000] + [rng.randrange(LIMIT) for _ in range(60)]:
        assert bounds.pi(x).contains(int(data["pi"][x])), x
        assert bounds.twin_pi(x).contains(int(data["twin"][x])), x
        assert bounds.theta(x).contains(Fraction(float(data["theta"][x]))) or x < 2, x
    for n in [1, 2, 3, 5, 6, 20] + [rng.randrange(1, 664579) for _ in range(40)]:
        assert bounds.nth_prime(n).contains(int(data["primes"][n - 1])), n


# ---------------------------------------------------- self-validation (item 3)

@pytest.mark.parametrize("bound_id", [i for i in _ids("pi")] + [i for i in _ids("pi", conditional=True)])
def test_pi_bound_holds_at_every_integer_to_1e7(bound_id, data):
    bound = bounds.entry(bound_id)
    violations = _selfcheck.check_values(bound, data["x"], data["pi"], cache=data["cache"])
    assert violations == []


@pytest.mark.parametrize("bound_id", _ids("twin_pi"))
def test_twin_bound_holds_at_every_integer_to_1e7(bound_id, data):
    assert _selfcheck.check_values(bounds.entry(bound_id), data["x"], data["twin"], cache=data["cache"]) == []


@pytest.mark.parametrize("bound_id", _ids("nth_prime"))
def test_nth_prime_bound_holds_for_every_n_to_664579(bound_id, data):
    primes = data["primes"][data["primes"] <= LIMIT]
    n = np.arange(1, primes.size + 1, dtype=np.int64)
    assert _selfcheck.check_values(bounds.entry(bound_id), n, primes) == []


#: float64 cumulative sums of <= 10^7 logarithms: absolute error far below 1e-3 (common practice)
THETA_FLOAT_ERROR = 1e-3


@pytest.mark.parametrize("bound_id", _ids("theta") + _ids("theta", conditional=True))
def test_theta_bound_holds_at_every_integer_to_1e7(bound_id, data):
    primes = data["primes"]
    violations = _selfcheck.check_values(
        bounds.entry(bound_id), data["x"], data["theta"], float_error=THETA_FLOAT_ERROR,
        cache=data["cache"], exact_enclosure=lambda x, _value: _primorial_log(x, primes))
    assert violations == []


def _psi_enclosure(x, primes):
    product = gmpy2.mpz(1)
    for p in primes[primes <= x]:
        power = int(p)
        while power * int(p) <= x:
            power *= int(p)
        product *= power
    return iv.log(iv.mpf(int(product)))


@pytest.mark.parametrize("bound_id", _ids("psi") + _ids("psi", conditional=True))
def test_psi_bound_holds_at_every_integer_to_1e7(bound_id, data):
    primes = data["primes"]
    violations = _selfcheck.check_values(
        bounds.entry(bound_id), data["x"], data["psi"], float_error=THETA_FLOAT_ERROR,
        cache=data["cache"], exact_enclosure=lambda x, _value: _psi_enclosure(x, primes))
    assert violations == []


@pytest.mark.parametrize("bound_id", _ids("prime_in_interval") + _ids("prime_in_interval", conditional=True))
def test_short_interval_theorem_holds_for_every_x_to_1e7(bound_id, data):
    bound = bounds.entry(bound_id)
    x = data["x"][1:]
    assert _selfcheck.check_prime_in_interval(bound, x, data["primes"]) == []


@pytest.mark.parametrize("bound_id", _ids("primes_between"))
def test_interval_count_bound_holds_to_1e7(bound_id, data):
    bound, pi = bounds.entry(bound_id), data["pi"]
    for h in [0, 1, 2, 3, 5, 10, 30, 100, 211, 1000, 4096, 10 ** 5, 10 ** 6]:
        start = np.arange(1, LIMIT - h + 1, 7, dtype=np.int64)          # every 7th x, all residues mod 6
        counts = pi[start + h] - pi[start]
        lengths = np.full(start.shape, h, dtype=np.int64)
        assert _selfcheck.check_values(bound, lengths, counts) == [], h


@pytest.mark.parametrize("bound_id", _ids("primes_in_dyadic"))
def test_dyadic_count_bound_holds_to_5e6(bound_id, data):
    x = np.arange(1, LIMIT // 2 + 1, dtype=np.int64)
    counts = data["pi"][2 * x] - data["pi"][x]
    assert _selfcheck.check_values(bounds.entry(bound_id), x, counts) == []


def _log_uniform(rng, low, high, count):
    return sorted({int(10 ** rng.uniform(math.log10(low), math.log10(high))) for _ in range(count)})


def _sampled_pi_points(seed, count, high):
    """(x, pi(x)) at samples s and at q - 1, q with q the next prime (worst points of the cell)."""
    rng = random.Random(seed)
    points = []
    for s in _log_uniform(rng, LIMIT, high, count):
        value = primecountpy.prime_pi(s)                                # primecountpy (reference)
        q = int(gmpy2.next_prime(s))
        points += [(s, value), (q - 1, value), (q, value + 1)]
    return np.array([p[0] for p in points], dtype=np.int64), np.array([p[1] for p in points], dtype=np.int64)


@pytest.fixture(scope="module")
def sampled_pi():
    return _sampled_pi_points(seed=16, count=14, high=10 ** 16)


@pytest.mark.parametrize("bound_id", _ids("pi"))
def test_pi_bound_holds_at_samples_to_1e16(bound_id, sampled_pi):
    x, values = sampled_pi
    assert _selfcheck.check_values(bounds.entry(bound_id), x, values) == []


@pytest.fixture(scope="module")
def sampled_nth_prime():
    rng = random.Random(14)
    n = np.array(_log_uniform(rng, 664580, 10 ** 14, 10), dtype=np.int64)
    return n, np.array([primecountpy.nth_prime(int(k)) for k in n], dtype=np.int64)   # reference


@pytest.mark.parametrize("bound_id", _ids("nth_prime"))
def test_nth_prime_bound_holds_at_samples_to_n_1e14(bound_id, sampled_nth_prime):
    n, values = sampled_nth_prime
    assert _selfcheck.check_values(bounds.entry(bound_id), n, values) == []


# ----------------------------------------------- the validation catches errors

def test_mistyped_constant_is_caught(tmp_path, data):
    original = open(bounds.load_catalogue().path).read()
    assert original.count("upper: 1.25506*x/ln(x)") == 1
    copy = tmp_path / "bounds.yaml"
    copy.write_text(original.replace("upper: 1.25506*x/ln(x)", "upper: 1.15506*x/ln(x)"))
    mistyped = load_catalogue(copy)
    x, pi = data["x"][:10 ** 6 + 1], data["pi"][:10 ** 6 + 1]
    violations = _selfcheck.check_values(mistyped.entry("pi-upper-rs62"), x, pi)
    assert violations and all(v.proven for v in violations)
    assert violations[0].argument > 1
    assert _selfcheck.check_values(bounds.entry("pi-upper-rs62"), x, pi) == []
    assert bounds.pi(113, catalogue=mistyped).upper < 30   # the lie the validation prevents: pi(113) = 30


def test_known_errata_fail_where_the_literature_says(data):
    primes = data["primes"]
    n = np.arange(1, 10001, dtype=np.int64)
    robin = _selfcheck.check_values(bounds.load_catalogue().errata[0], n, primes[:10000])
    assert robin and robin[0].argument == 7022 and robin[0].exact == 70919   # math.SE question 2569128 (from memory)
    early = next(b for b in bounds.errata() if b.id == "pi-lower-dusart10-2-at-88783")
    failing = {v.argument for v in _selfcheck.check_values(early, data["x"][:100_000], data["pi"][:100_000])}
    assert failing == {88783, 88784, 88785, 88786, 88787, 88788}   # sieve here: 88783 too, beside the catalogue notes' 88784..88788
    late = next(b for b in bounds.errata() if b.id.endswith("at-2953652287"))
    x = np.array([2953652287], dtype=np.int64)
    assert _selfcheck.check_values(late, x, np.array([primecountpy.prime_pi(2953652287)])) != []


def test_threshold_2953652302_is_where_the_2010_bound_starts_to_hold():
    bound = bounds.entry("pi-upper-dusart10-2.334")
    x = np.array([2953652302, 2953652303], dtype=np.int64)
    values = np.array([primecountpy.prime_pi(int(v)) for v in x], dtype=np.int64)
    assert _selfcheck.check_values(bound, x, values) == []


# ------------------------------------------------------------------- slow

@pytest.mark.slow
@pytest.mark.parametrize("bound_id", _ids("pi"))
def test_pi_bound_holds_at_many_samples_to_1e16(bound_id):
    x, values = _sampled_pi_points(seed=1016, count=60, high=10 ** 16)
    assert _selfcheck.check_values(bounds.entry(bound_id), x, values) == []


@pytest.mark.slow
def test_published_pi_values_recomputed():
    assert primecountpy.prime_pi(10 ** 17) == 2623557157654233       # OEIS A006880
    assert primecountpy.prime_pi(10 ** 18) == 24739954287740860      # OEIS A006880


@pytest.mark.slow
@pytest.mark.parametrize("bound_id", _ids("twin_pi"))
def test_twin_bounds_at_primesieve_samples(bound_id):
    x = np.array([10 ** 8, 3 * 10 ** 8, 10 ** 9, 10 ** 10], dtype=np.int64)
    values = np.array([primesieve.count_twins(0, int(v)) for v in x], dtype=np.int64)   # reference
    assert _selfcheck.check_values(bounds.entry(bound_id), x, values) == []
