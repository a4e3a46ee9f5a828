"""The facade: exact answers with provenance, checked against outside references.

References used here: OEIS tables (named beside each value), sympy and primecountpy (test-only
reference libraries).
"""

import random

import mpmath
import pytest
import sympy
from hypothesis import given, settings, strategies as st

import oracle
from _references import primecount
from oracle import InvalidInputError, OutOfReachError

SEED = 20261201


def boundary_points():
    """2^k ± small, 10^k ± small, primes and their neighbours, segment-size multiples."""
    points = set()
    for k in range(1, 47):
        points.update(2**k + d for d in (-2, -1, 0, 1, 2))
    for k in range(1, 15):
        points.update(10**k + d for d in (-1, 0, 1, 5))
    for p in (2, 3, 5, 7, 65521, 65537, 4294967291, 4294967311):
        points.update((p - 1, p, p + 1, p * p - 1, p * p, p * p + 1))
    for segment in (2**15, 2**18, 2**20):
        points.update(segment * m + d for m in (1, 3, 1000) for d in (-1, 0, 1))
    return sorted(p for p in points if 0 <= p <= 10**14)


@pytest.mark.parametrize("x", boundary_points())
def test_pi_at_boundaries_matches_primecount(x):
    assert oracle.pi(x) == primecount.prime_pi(x)


def test_pi_at_random_points_matches_primecount():
    rng = random.Random(SEED)
    points = [rng.randrange(0, 10**9) for _ in range(400)]
    points += [int(10 ** rng.uniform(9, 12)) for _ in range(40)]
    for x in points:
        assert oracle.pi(x) == primecount.prime_pi(x), x


def test_pi_matches_sympy_for_small_x():
    for x in range(0, 3000):
        assert oracle.pi(x) == sympy.primepi(x)


@pytest.mark.parametrize("n, expected", [
    (1, 4), (2, 25), (3, 168), (4, 1229), (5, 9592), (6, 78498), (7, 664579),
    (8, 5761455), (9, 50847534), (10, 455052511), (11, 4118054813), (12, 37607912018),
    (13, 346065536839), (14, 3204941750802), (15, 29844570422669),
])
def test_pi_of_powers_of_ten(n, expected):
    # OEIS A006880 (typed from memory; test_tables checks the fixture against primecountpy).
    # The facade answers these from its table; the same values are also computed here, by
    # the combinatorial method up to 10^13 and by the sieve engine up to 10^9, so that the
    # table is not the only witness of the oracle's own computation.
    from oracle.exact import sieve
    from oracle.exact.combinatorial import prime_pi as combinatorial_pi

    assert oracle.pi(10**n) == expected
    if n <= 13:
        assert combinatorial_pi(10**n) == expected
    if n <= 9:
        assert sieve.count("primes", 0, 10**n) == expected


def test_pi_near_a_table_point_uses_the_table_and_a_short_sieve():
    result = oracle.answer("pi", 10**11 + 5)
    assert result.value == primecount.prime_pi(10**11 + 5)
    assert result.provenance.startswith("table:") and result.provenance.endswith("+sieve")
    below = oracle.answer("pi", 10**12 - 3)
    assert below.value == primecount.prime_pi(10**12 - 3)
    assert below.provenance.startswith("table:")


@pytest.mark.parametrize("n, expected", [
    (1, 2), (2, 8), (3, 35), (4, 205), (5, 1224), (6, 8169), (7, 58980), (8, 440312),
    (9, 3424506), (10, 27412679),
])
def test_twin_pi_of_powers_of_ten(n, expected):
    # OEIS A007508 (twin pairs below 10^n; typed from memory).  The facade answers from its
    # table; the sieve engine counts the same pairs itself up to 10^9, and sympy up to 10^6.
    from oracle.exact import sieve

    assert oracle.twin_pi(10**n) == expected
    if n <= 9:
        assert sieve.count("twins", 0, 10**n) == expected
    if n <= 6:
        assert _twin_pi_by_sympy(10**n) == expected


def _twin_pi_by_sympy(x):
    return sum(1 for p in sympy.primerange(2, x - 1) if sympy.isprime(p + 2))


@pytest.mark.parametrize("x", [0, 1, 2, 3, 4, 5, 6, 7, 8, 12, 13, 14, 100, 1000, 10**4 + 7,
                               65537, 2**17 + 1])
def test_twin_pi_convention_p_plus_2_at_most_x(x):
    assert oracle.twin_pi(x) == _twin_pi_by_sympy(x)


def test_twin_pi_away_from_table_points():
    rng = random.Random(SEED)
    for _ in range(40):
        x = rng.randrange(10**5, 3 * 10**5)
        assert oracle.twin_pi(x) == _twin_pi_by_sympy(x)


@pytest.mark.parametrize("kind, pattern", [
    ("twins", (0, 2)), ("triplets_026", (0, 2, 6)), ("triplets_046", (0, 4, 6)),
    ("quadruplets", (0, 2, 6, 8)),
])
def test_count_constellations_against_sympy(kind, pattern):
    rng = random.Random(SEED + len(kind))
    for _ in range(25):
        a = rng.randrange(0, 10**5)
        b = a + rng.randrange(0, 2 * 10**4)
        expected = sum(1 for p in sympy.primerange(a, b + 1)
                       if p + pattern[-1] <= b and all(sympy.isprime(p + d) for d in pattern))
        assert oracle.count(kind, a, b) == expected, (kind, a, b)


def test_tuplet_pi_of_primes_is_pi():
    assert oracle.tuplet_pi("primes", 10**7) == 664579        # OEIS A006880
    assert oracle.tuplet_pi("quadruplets", 10**6) == 166       # OEIS A050258: quadruplets below 10^6 (from memory)


@pytest.mark.parametrize("n, expected", [
    (1, 2), (2, 3), (10, 29), (100, 541), (1000, 7919), (10**4, 104729), (10**5, 1299709),
    (10**6, 15485863), (10**7, 179424673),
])
def test_nth_prime_of_powers_of_ten(n, expected):
    # OEIS A006988 (n = 10^k) and the first primes (typed from memory), each also computed by
    # primecountpy and, below 10^6, by sympy.prime.
    assert oracle.nth_prime(n) == expected
    assert primecount.nth_prime(n) == expected
    if n <= 10**6:
        assert sympy.prime(n) == expected


def test_nth_prime_at_random_n_matches_primecount():
    rng = random.Random(SEED)
    for _ in range(60):
        n = rng.randrange(1, 10**7)
        assert oracle.nth_prime(n) == primecount.nth_prime(n)


def test_nth_prime_inverts_pi():
    rng = random.Random(SEED + 1)
    for _ in range(30):
        n = rng.randrange(1, 10**6)
        p = oracle.nth_prime(n)
        assert oracle.pi(p) == n and oracle.pi(p - 1) == n - 1


@given(st.integers(min_value=0, max_value=2**70))
@settings(max_examples=300, derandomize=True)
def test_is_prime_next_prev_agree_with_sympy(n):
    assert oracle.is_prime(n) == sympy.isprime(n)
    assert oracle.next_prime(n) == sympy.nextprime(n)
    if n >= 3:
        assert oracle.prev_prime(n) == sympy.prevprime(n)


@pytest.mark.parametrize("n, verdict", [
    (2**61 - 1, "deterministic"),                     # Mersenne prime, OEIS A000043 (p = 61)
    (318665857834031151167461, "deterministic"),      # OEIS A014233(12): composite, proven by MR
    (2**89 - 1, "probable"),                          # Mersenne prime, OEIS A000043 (p = 89)
])
def test_is_prime_verdicts(n, verdict):
    result = oracle.answer("is_prime", n)
    assert result.provenance == verdict
    assert result.value == sympy.isprime(n)


def test_primes_lists_match_sympy():
    assert oracle.primes(0, 30) == [2, 3, 5, 7, 11, 13, 17, 19, 23, 29]
    assert oracle.primes(10**12, 10**12 + 200) == list(sympy.primerange(10**12, 10**12 + 201))
    assert oracle.primes(5, 4) == []
    start = 2**64 - 100
    assert oracle.primes(start, 2**64 + 100) == list(sympy.primerange(start, 2**64 + 101))


def test_count_above_two_to_the_64_is_probable():
    a = 2**64 + 10**6
    result = oracle.answer("count", "primes", a, a + 10**4)
    assert result.provenance == "probable"
    assert result.value == sum(1 for _ in sympy.primerange(a, a + 10**4 + 1))


def test_verify_factorization_accepts_the_three_shapes():
    # F5 = 2^32 + 1 = 641 * 6700417 (Euler 1732)
    n = 2**32 + 1
    for shape in ({641: 1, 6700417: 1}, [641, 6700417], [(641, 1), (6700417, 1)]):
        report = oracle.verify_factorization(n, shape)
        assert report.ok and report.provenance == "deterministic"
    assert oracle.verify_factorization(1, {}).ok
    assert oracle.verify_factorization(360, [2, 2, 2, 3, 3, 5]).ok


def test_verify_factorization_reports_each_problem():
    wrong_product = oracle.verify_factorization(2**32 + 1, [641, 6700419])
    assert not wrong_product and not wrong_product.product_matches
    composite = oracle.verify_factorization(3215031751 * 2, [2, 3215031751])   # OEIS A014233
    assert not composite and composite.verdicts[3215031751] == "composite"
    assert "composite" in composite.problems[0]


@pytest.mark.parametrize("call", [
    lambda: oracle.pi(2.0), lambda: oracle.pi(True), lambda: oracle.pi("10"),
    lambda: oracle.nth_prime(0), lambda: oracle.prev_prime(2), lambda: oracle.is_prime(-1),
    lambda: oracle.count("cousins", 0, 10), lambda: oracle.count("primes", -1, 10),
    lambda: oracle.verify_factorization(0, []), lambda: oracle.verify_factorization(6, "23"),
    lambda: oracle.answer("nosuch", 3), lambda: oracle.answer("pi", 1, 2),
    lambda: oracle.pi(10, budget=-1),
])
def test_bad_input_raises_our_value_error(call):
    with pytest.raises(InvalidInputError):
        call()


def test_out_of_reach_is_refused_with_the_proven_interval():
    with pytest.raises(OutOfReachError) as raised:
        oracle.pi(10**40)
    error = raised.value
    # The oracle's interval must name its theorems and be at least as tight as Rosser and
    # Schoenfeld's x/ln x < π(x) < 1.25506 x/ln x (1962, Illinois J. Math. 6, Thm 1 and Cor. 1;
    # statement from memory), computed here with mpmath.
    assert error.lower is not None and error.upper is not None and error.theorems
    assert error.lower < error.upper
    with mpmath.workdps(50):
        x = mpmath.mpf(10) ** 40
        assert error.lower >= int(x / mpmath.log(x))
        assert error.upper <= int(mpmath.mpf("1.25506") * x / mpmath.log(x)) + 1


def test_budget_is_respected_by_refusal():
    with pytest.raises(OutOfReachError, match="budget"):
        oracle.twin_pi(5 * 10**13, budget=0.5)


def test_import_oracle_does_not_load_heavy_modules():
    import subprocess
    import sys

    probe = ("import sys, oracle; heavy = {'numpy', 'gmpy2', 'primesieve', 'yaml'} & set(sys.modules);"
             " print(sorted(heavy))")
    result = subprocess.run([sys.executable, "-c", probe], capture_output=True, text=True, timeout=60)
    assert result.stdout.strip() == "[]", result.stdout + result.stderr


@pytest.mark.parametrize("a, width, provenance", [
    (10**6, 1000, "sieve"),
    (2**50, 2000, "deterministic"),        # tested one by one: shorter than a sieve up to 2^25
    (2**64 - 1000, 2000, "deterministic"),
    (318665857834031151167461 - 500, 1000, "probable"),   # straddles OEIS A014233(12)
])
def test_primes_answer_names_the_route_and_agrees_with_sympy(a, width, provenance):
    listing = oracle.answer("primes", a, a + width)
    assert listing.value == list(sympy.primerange(a, a + width + 1))
    assert listing.provenance == provenance
