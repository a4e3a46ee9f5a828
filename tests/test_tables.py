"""Checks of the published tables in fixtures/ and of their loader, oracle.tables.

Every tabulated value this machine can reach is recomputed by an independent
program: primesieve (a segmented sieve of Eratosthenes) and primecount
(Deléglise-Rivat / Gourdon), both used here as test-only references, and
gmpy2, sympy and python-flint for primality.  The rest is listed by
``test_unverifiable_entries_are_sourced_and_within_proven_bounds`` and held to
proven bounds.  Slower recomputations carry ``@pytest.mark.slow``.

Where a value is "verified", that is evidence about the transcription, not a
certificate of the published result; probable-prime checks are marked as such.
"""

from __future__ import annotations

import math
import shutil
from pathlib import Path

import gmpy2
import mpmath
import numpy as np
import pytest
import yaml

from oracle import tables
from _references import flint, primecount, primesieve, sympy
from oracle._errors import InvalidInputError, OracleError

# --------------------------------------------------------------------------- reach of this machine
#: π(x) by primesieve's sieve up to here; primecount above (test-only references).
SIEVE_LIMIT = 10 ** 10
#: Default run: π(x) up to 2^47 (about 1.4e14); slow run up to 10^17.
PI_LIMIT, PI_SLOW_LIMIT = 2 ** 47, 10 ** 17
#: π₂ by primesieve.count_twins: default 10^10, slow 10^11.
TWIN_LIMIT, TWIN_SLOW_LIMIT = 10 ** 10, 10 ** 11
#: p_n by primecount.nth_prime: default n ≤ 10^13, slow n ≤ 10^15.
NTH_LIMIT, NTH_SLOW_LIMIT = 10 ** 13, 10 ** 15
#: Maximality of gaps by sieving every prime: default below 10^9, slow below 2^36.
GAP_SIEVE_LIMIT, GAP_SIEVE_SLOW_LIMIT = 10 ** 9, 2 ** 36
#: Minimality of A014233(k) by exhaustive search: default k ≤ 2, slow k = 3.
SPSP_MINIMAL_K, SPSP_MINIMAL_SLOW_K = 2, 3
#: Factors proved prime by python-flint (FLINT fmpz_is_prime, a proving test:
#: Pocklington/Morrison or APR-CL) up to this many digits by default; all when slow.
PROOF_DIGITS = 300

TWO_64 = 2 ** 64

# OEIS A006879 (number of primes with exactly n digits), data section n = 0..22,
# read with the search tool on 2026-12-01 -- an independent published check of the
# differences of our π(10^n) table beyond this machine's reach.
A006879 = [0, 4, 21, 143, 1061, 8363, 68906, 586081, 5096876, 45086079, 404204977,
           3663002302, 33489857205, 308457624821, 2858876213963, 26639628671867,
           249393770611256, 2344318816620308, 22116397130086627, 209317712988603747,
           1986761935284574233, 18906449883457813088, 180340017203297174362]


def entries_of(function: str):
    """(table id, entry) for every entry of ``function``, in id order."""
    return [(t.id, e) for t in tables.tables_for(function) for e in t.entries]


def entry_id(item) -> str:
    table_id, entry = item
    if entry.index is not None:
        return f"{table_id}:n={entry.index}"
    return f"{table_id}:{entry.argument}"


def reach(argument: int, default_limit: int, slow_limit: int):
    """pytest.param marks for an entry: default run, slow run, or out of reach (None)."""
    if argument <= default_limit:
        return ()
    if argument <= slow_limit:
        return (pytest.mark.slow,)
    return None


def params(function: str, default_limit: int, slow_limit: int, key=lambda e: e.argument):
    chosen = []
    for item in entries_of(function):
        marks = reach(key(item[1]), default_limit, slow_limit)
        if marks is not None:
            chosen.append(pytest.param(item, marks=marks, id=entry_id(item)))
    return chosen


def first_primes(k: int) -> list[int]:
    return list(sympy.primerange(2, sympy.prime(k) + 1))


# --------------------------------------------------------------------------- π(x)


@pytest.mark.parametrize("item", params("pi", SIEVE_LIMIT, SIEVE_LIMIT))
def test_pi_by_sieve(item):
    _, entry = item
    assert primesieve.count_primes(entry.argument) == entry.value


@pytest.mark.parametrize("item", params("pi", PI_LIMIT, PI_SLOW_LIMIT))
def test_pi_by_primecount(item):
    _, entry = item
    assert primecount.prime_pi(entry.argument) == entry.value


def test_pi_tables_agree_where_they_overlap():
    # 10^0 = 2^0 = 1 is in both A006880 and A007053.
    decimal = tables.table("oeis-a006880").value_at(1)
    binary = tables.table("oeis-a007053").value_at(1)
    assert decimal == binary == 0
    assert tables.values("pi")[1] == (0, "oeis-a006880")


def test_pi_of_powers_of_ten_differences_match_oeis_a006879():
    # OEIS A006879: a(n) = π(10^n) - π(10^(n-1)), with π(10^-1) := 0.
    pi_10 = {e.index: e.value for e in tables.table("oeis-a006880").entries}
    for n, digits_count in enumerate(A006879):
        assert pi_10[n] - pi_10.get(n - 1, 0) == digits_count, f"n={n}"


@pytest.mark.parametrize("table_id", ["oeis-a006880", "oeis-a007053", "oeis-a007508",
                                      "oeis-a006988", "oeis-a002997"])
def test_values_increase_with_the_argument(table_id):
    entries = tables.table(table_id).entries
    assert all(a.value <= b.value for a, b in zip(entries, entries[1:]))


def test_every_pi_value_is_within_rosser_schoenfeld_bounds():
    # Rosser & Schoenfeld 1962, Illinois J. Math. 6, Cor. 1: for x >= 17,
    # x/ln x < π(x) < 1.25506 x/ln x.  Exact-enough arithmetic: 60 digits, and
    # a relative safety margin of 10^-30 that no rounding at that precision reaches.
    with mpmath.workdps(60):
        margin = mpmath.mpf(10) ** -30
        for argument, (value, table_id) in tables.values("pi").items():
            if argument < 17:
                continue
            x = mpmath.mpf(argument)
            lower = x / mpmath.log(x)
            upper = mpmath.mpf("1.25506") * lower
            assert lower * (1 + margin) < value < upper * (1 - margin), f"{table_id}: {argument}"


# --------------------------------------------------------------------------- π₂(x)


def test_primesieve_counts_twins_with_p_plus_2_at_most_x():
    # Our convention (docs/DESIGN.md): pairs (p, p + 2), both prime, p + 2 <= x.
    # Checked here against a direct count so that the reference is known to agree.
    for x in range(0, 400):
        direct = sum(1 for p in range(2, x - 1) if sympy.isprime(p) and sympy.isprime(p + 2))
        assert primesieve.count_twins(x) == direct, f"x={x}"


@pytest.mark.parametrize("item", params("twin_pi", TWIN_LIMIT, TWIN_SLOW_LIMIT))
def test_twin_pi_by_sieve(item):
    _, entry = item
    assert primesieve.count_twins(entry.argument) == entry.value


@pytest.mark.parametrize("n", range(1, 11))
def test_twin_count_at_powers_of_ten_is_the_same_under_every_boundary_reading(n):
    # The argument written in table-oeis-a007508.yaml: none of 10^n - 2, 10^n - 1, 10^n
    # is prime for n >= 1, so p + 2 < x, p + 2 <= x, p < x and p <= x count the same pairs.
    x = 10 ** n
    assert not any(sympy.isprime(m) for m in (x - 2, x - 1, x))
    if x <= 10 ** 8:
        # primesieve.count_twins(y) counts pairs with p + 2 <= y (checked above).
        readings = {primesieve.count_twins(x - 1), primesieve.count_twins(x),
                    primesieve.count_twins(x + 1), primesieve.count_twins(x + 2)}
        assert len(readings) == 1


def test_twin_counts_leave_room_in_the_prime_counts():
    # The members of the π₂(x) pairs are 2π₂(x) - 1 distinct primes ≤ x (only 5 is in
    # two pairs), so 2π₂(x) - 1 <= π(x): a proven consequence of the definitions.
    pi = tables.values("pi")
    for argument, (twins, _) in tables.values("twin_pi").items():
        assert 2 * twins - 1 <= pi[argument][0], argument


# --------------------------------------------------------------------------- p_n


@pytest.mark.parametrize("item", params("nth_prime", 10 ** 8, 10 ** 8))
def test_nth_prime_by_sieve(item):
    _, entry = item
    assert primesieve.nth_prime(entry.argument) == entry.value


@pytest.mark.parametrize("item", params("nth_prime", NTH_LIMIT, NTH_SLOW_LIMIT))
def test_nth_prime_by_primecount(item):
    _, entry = item
    assert primecount.nth_prime(entry.argument) == entry.value


def test_nth_primes_interleave_with_prime_counts():
    # p_m <= x  if and only if  π(x) >= m: every pair of tables must respect it.
    pi = tables.values("pi")
    for m, (p_m, _) in tables.values("nth_prime").items():
        for x, (count, _) in pi.items():
            assert (p_m <= x) == (count >= m), f"p_{m} = {p_m} against π({x}) = {count}"


def test_nth_primes_within_proven_bounds():
    # Dusart 1999 (Math. Comp. 68, 411-415): p_n > n(ln n + ln ln n - 1) for n >= 2;
    # Rosser & Schoenfeld 1962 (Illinois J. Math. 6, (3.13)): p_n < n(ln n + ln ln n)
    # for n >= 6.  (Statements and references from memory.)
    with mpmath.workdps(60):
        margin = mpmath.mpf(10) ** -30
        for n, (p_n, _) in tables.values("nth_prime").items():
            if n < 6:
                continue
            log_n = mpmath.log(n)
            lower = n * (log_n + mpmath.log(log_n) - 1)
            upper = n * (log_n + mpmath.log(log_n))
            assert lower * (1 + margin) < p_n < upper * (1 - margin), n


# --------------------------------------------------------------------------- maximal gaps


GAP_TABLE = "oeis-a002386-a005250"


@pytest.mark.parametrize("item", params("prime_gap_record", TWO_64, TWO_64))
def test_gap_ends_are_consecutive_primes(item):
    # Both ends proven prime (sympy.isprime is exact below 2^64) and no prime in
    # between: gmpy2.next_prime never skips a prime, so next_prime(p) == p + g.
    _, entry = item
    p, g = entry.argument, entry.value
    assert sympy.isprime(p) and sympy.isprime(p + g)
    assert gmpy2.next_prime(p) == p + g


def test_gap_records_strictly_increase():
    entries = tables.table(GAP_TABLE).entries
    assert [e.index for e in entries] == list(range(1, len(entries) + 1))
    assert all(a.value < b.value for a, b in zip(entries, entries[1:]))


def test_gap_table_covers_every_prime_below_2_to_64():
    gap_table = tables.table(GAP_TABLE)
    last = gap_table.entries[-1]
    assert gap_table.complete_up_to == TWO_64 - 1
    assert last.argument + last.value < TWO_64


def maximal_gaps_below(limit: int, segment: int = 10 ** 8) -> list[tuple[int, int]]:
    """Every (p, g) with g larger than all earlier gaps and p + g < limit, by sieving."""
    records: list[tuple[int, int]] = []
    largest = 0
    previous: int | None = None
    low = 0
    while low < limit:
        high = min(low + segment, limit)
        primes = np.frombuffer(primesieve.primes(low, high - 1), dtype=np.uint64)
        if previous is not None:
            primes = np.concatenate((np.array([previous], dtype=np.uint64), primes))
        if len(primes) >= 2:
            gaps = np.diff(primes)
            largest_before = np.maximum.accumulate(np.concatenate(([largest], gaps)))[:-1]
            for i in np.nonzero(gaps > largest_before)[0]:
                records.append((int(primes[i]), int(gaps[i])))
            largest = max(largest, int(gaps.max()))
        if len(primes):
            previous = int(primes[-1])
        low = high
    return records


@pytest.mark.parametrize("limit", [
    pytest.param(GAP_SIEVE_LIMIT, id="below-10^9"),
    pytest.param(GAP_SIEVE_SLOW_LIMIT, id="below-2^36", marks=pytest.mark.slow),
])
def test_gap_maximality_by_sieving_every_prime(limit):
    tabulated = [(e.argument, e.value) for e in tables.table(GAP_TABLE).entries
                 if e.argument + e.value < limit]
    assert maximal_gaps_below(limit) == tabulated


# --------------------------------------------------------------------------- A014233


def is_strong_probable_prime(n: int, base: int) -> bool:
    if math.gcd(n, base) != 1:
        return False
    return gmpy2.is_strong_prp(n, base)


@pytest.mark.parametrize("item", entries_of("strong_pseudoprime_bound"), ids=entry_id)
def test_strong_pseudoprime_bound_has_its_defining_property(item):
    _, entry = item
    k, n = entry.argument, entry.value
    assert n % 2 == 1
    assert not sympy.isprime(n)  # a "composite" verdict of BPSW is always right
    assert all(is_strong_probable_prime(n, base) for base in first_primes(k))


def test_strong_pseudoprime_bounds_are_consistent_with_each_other():
    # a(k) <= a(k+1); and a(k) < a(k+1) exactly when a(k) fails the (k+1)-th base.
    bound = tables.values("strong_pseudoprime_bound")
    ks = sorted(bound)
    for k, k_next in zip(ks, ks[1:]):
        here, there = bound[k][0], bound[k_next][0]
        assert here <= there
        passes_next = is_strong_probable_prime(here, sympy.prime(k_next))
        assert passes_next == (here == there), k


def no_smaller_strong_pseudoprime(k: int, bound: int) -> bool:
    """No odd composite n < bound is a strong probable prime to the first k primes."""
    bases = first_primes(k)
    for n in range(9, bound, 2):
        if all(is_strong_probable_prime(n, base) for base in bases) and not sympy.isprime(n):
            return False
    return True


@pytest.mark.parametrize("k", [
    *[pytest.param(k, id=f"k={k}") for k in range(1, SPSP_MINIMAL_K + 1)],
    pytest.param(SPSP_MINIMAL_SLOW_K, id=f"k={SPSP_MINIMAL_SLOW_K}", marks=pytest.mark.slow),
])
def test_strong_pseudoprime_bound_is_the_smallest(k):
    assert no_smaller_strong_pseudoprime(k, tables.table("oeis-a014233").value_at(k))


# --------------------------------------------------------------------------- Carmichael numbers


def satisfies_korselt(n: int) -> bool:
    """Korselt 1899: composite, squarefree, and p - 1 | n - 1 for every prime p | n."""
    factors = sympy.factorint(n)
    return (len(factors) >= 2 and all(e == 1 for e in factors.values())
            and all((n - 1) % (p - 1) == 0 for p in factors))


@pytest.mark.parametrize("item", entries_of("carmichael"), ids=entry_id)
def test_carmichael_number_satisfies_korselt(item):
    _, entry = item
    assert satisfies_korselt(entry.value)


def test_carmichael_list_has_no_gaps():
    # Every Carmichael number n is odd and has 2^(n-1) ≡ 1 (mod n); so searching the
    # base-2 Fermat probable primes that are composite finds all of them below the bound.
    listed = [e.value for e in tables.table("oeis-a002997").entries]
    assert [e.index for e in tables.table("oeis-a002997").entries] == list(range(1, 51))
    found = [n for n in range(3, listed[-1] + 1, 2)
             if pow(2, n - 1, n) == 1 and not sympy.isprime(n) and satisfies_korselt(n)]
    assert found == listed


# --------------------------------------------------------------------------- factorisations


def factor_params():
    chosen = []
    for table_id, entry in entries_of("factorization"):
        for position, factor in enumerate(entry.value, start=1):
            label = f"{table_id}:n={entry.index}:factor{position}"
            if factor < TWO_64:
                kind, marks = "proven-below-2^64", ()
            elif len(str(factor)) <= PROOF_DIGITS:
                kind, marks = "proven-by-flint", ()
            else:
                kind, marks = "proven-by-flint", (pytest.mark.slow,)
            chosen.append(pytest.param(factor, kind, marks=marks, id=f"{label}-{kind}"))
    return chosen


@pytest.mark.parametrize(("factor", "kind"), factor_params())
def test_factor_is_prime(factor, kind):
    if kind == "proven-below-2^64":
        assert sympy.isprime(factor)  # exact below 2^64 (sympy documents this)
    else:
        assert gmpy2.is_prime(factor)  # probable prime (BPSW plus Miller-Rabin) ...
        assert flint.fmpz(factor).is_prime()  # ... then proved by FLINT


@pytest.mark.parametrize("factor", [
    pytest.param(f, id=f"{len(str(f))}-digits-probable")
    for _, e in entries_of("factorization") for f in e.value if len(str(f)) > PROOF_DIGITS
])
def test_largest_factors_are_probable_primes(factor):
    # Default-run stand-in for the slow proof above: a probable prime, not a proof.
    assert gmpy2.is_prime(factor)


@pytest.mark.parametrize("item", entries_of("factorization"), ids=entry_id)
def test_factorisation_multiplies_back(item):
    table_id, entry = item
    if table_id == "fermat-factorizations":
        expected = 2 ** (2 ** entry.index) + 1
    else:
        expected = 2 ** entry.index - 1
    assert entry.argument == expected
    assert math.prod(entry.value) == expected


def test_fermat_factors_have_the_form_k_2_to_n_plus_2_plus_1():
    # Euler-Lucas: every prime factor of F_n (n >= 2) is ≡ 1 (mod 2^(n+2)).  (From memory.)
    for entry in tables.table("fermat-factorizations").entries:
        assert all((q - 1) % 2 ** (entry.index + 2) == 0 for q in entry.value), entry.index


def test_mersenne_factors_have_the_form_2kp_plus_1():
    # Fermat/Euler: a prime q | 2^p - 1 (p an odd prime) has q ≡ 1 (mod 2p) and
    # q ≡ ±1 (mod 8).  (From memory.)
    for entry in tables.table("mersenne-factorizations").entries:
        p = entry.index
        assert sympy.isprime(p)
        assert all((q - 1) % (2 * p) == 0 and q % 8 in (1, 7) for q in entry.value), p


# --------------------------------------------------------------------------- what is not verified here


def unverifiable_entries() -> list[tuple[str, int, str]]:
    """(table id, argument, why) for each entry no check of this file recomputes."""
    reasons = []
    for table_id, entry in entries_of("pi"):
        if entry.argument > PI_SLOW_LIMIT:
            reasons.append((table_id, entry.argument, "π(x) beyond primecount's reach here"))
    for table_id, entry in entries_of("twin_pi"):
        if entry.argument > TWIN_SLOW_LIMIT:
            reasons.append((table_id, entry.argument, "π₂(x) beyond the sieve's reach here"))
    for table_id, entry in entries_of("nth_prime"):
        if entry.argument > NTH_SLOW_LIMIT:
            reasons.append((table_id, entry.argument, "p_n beyond primecount's reach here"))
    for table_id, entry in entries_of("prime_gap_record"):
        if entry.argument + entry.value >= GAP_SIEVE_SLOW_LIMIT:
            reasons.append((table_id, entry.argument,
                            "gap checked, maximality not: no full sieve that far here"))
    for table_id, entry in entries_of("strong_pseudoprime_bound"):
        if entry.argument > SPSP_MINIMAL_SLOW_K:
            reasons.append((table_id, entry.argument,
                            "defining property checked, minimality not (searches of years)"))
    return reasons


def test_unverifiable_entries_are_sourced_and_within_proven_bounds(record_property):
    unverifiable = unverifiable_entries()
    record_property("unverifiable_entries", [(t, a, why) for t, a, why in unverifiable])
    assert unverifiable, "expected some published values beyond this machine's reach"
    for table_id, argument, _ in unverifiable:
        source_table = tables.table(table_id)
        assert source_table.source and source_table.citation and source_table.transcription
        entry = next(e for e in source_table.entries if e.argument == argument)
        if entry.from_memory:
            assert entry.note, f"{table_id}:{argument} is from memory and says nothing more"
        lower, upper = _proven_interval(source_table.function, argument)
        assert lower <= entry.value <= upper, (table_id, argument, "outside the proven interval")
    checked = [a for t, a, _ in unverifiable
               if tables.table(t).function in ("pi", "twin_pi", "nth_prime")]
    assert checked, "no unverifiable count or n-th prime was held to a bound"


def _proven_interval(function: str, argument: int) -> tuple:
    """A proven interval for the value of ``function`` at ``argument``, computed here with mpmath
    from the statements (not from the oracle's bounds module, which this would then only repeat):
    Rosser & Schoenfeld 1962, Illinois J. Math. 6, Thm 1 and Cor. 1: x/ln x < π(x) for x >= 17
    and π(x) < 1.25506 x/ln x for x > 1; π₂(x) <= π(x); Dusart 1999, Math. Comp. 68, 411-415:
    p_n > n(ln n + ln ln n - 1) for n >= 2, and Rosser & Schoenfeld (3.13): p_n < n(ln n + ln ln n)
    for n >= 6 (statements from memory).  Other tables: no interval (defining properties are
    checked by the tests above)."""
    with mpmath.workdps(60):
        x = mpmath.mpf(argument)
        if function in ("pi", "twin_pi") and argument >= 17:
            upper = int(mpmath.floor(mpmath.mpf("1.25506") * x / mpmath.log(x)))
            lower = int(mpmath.ceil(x / mpmath.log(x))) if function == "pi" else 0
            return lower, upper
        if function == "nth_prime" and argument >= 6:
            log_n = mpmath.log(x)
            return (int(mpmath.ceil(x * (log_n + mpmath.log(log_n) - 1))),
                    int(mpmath.floor(x * (log_n + mpmath.log(log_n)))))
    return -math.inf, math.inf


def test_merged_pi_values_are_monotone_across_tables():
    # π(10^n) and π(2^m) interleave; together they must still never decrease.
    merged = [value for value, _ in tables.values("pi").values()]
    assert merged == sorted(merged)


def test_no_shipped_value_is_from_memory():
    # Every value was read in a source (see each file's transcription); the field
    # exists for tables that cannot meet that standard, and none ships today.
    assert not [(t, e.argument) for t, e in
                ((t.id, e) for t in tables.all_tables().values() for e in t.entries)
                if e.from_memory]


# --------------------------------------------------------------------------- the loader


def test_every_function_has_a_table():
    assert {t.function for t in tables.all_tables().values()} == set(tables.FUNCTIONS)


def test_provenance_names_the_table():
    assert tables.table("oeis-a006880").provenance == "table:oeis-a006880"


def test_anchor_at_or_below_takes_the_largest_argument_not_above_x():
    assert tables.anchor_at_or_below("pi", 10 ** 12 + 5) == (10 ** 12, 37607912018,
                                                             "oeis-a006880")
    assert tables.anchor_at_or_below("pi", 2 ** 40) == (2 ** 40, 41203088796, "oeis-a007053")
    assert tables.anchor_at_or_below("twin_pi", 9) is None
    assert tables.anchor_at_or_below("nth_prime", 1) == (1, 2, "oeis-a006988")


@pytest.mark.parametrize("bad", [1.5, True, "10", None])
def test_anchor_refuses_non_integers(bad):
    with pytest.raises(InvalidInputError):
        tables.anchor_at_or_below("pi", bad)


def test_unknown_names_are_refused():
    with pytest.raises(OracleError, match="no table with id"):
        tables.table("oeis-a000000")
    with pytest.raises(OracleError, match="function='primes'"):
        tables.values("primes")
    with pytest.raises(OracleError, match="no entry at argument 7"):
        tables.table("oeis-a006880").value_at(7)


def test_fixtures_are_found_in_a_checkout_without_the_installed_package(monkeypatch):
    def missing(package):
        raise ModuleNotFoundError(package)

    monkeypatch.setattr(tables.importlib.resources, "files", missing)
    directory = tables._fixtures_directory()
    assert directory == Path(tables.__file__).resolve().parent.parent / "fixtures"
    assert set(tables.load_directory(directory)) == set(tables.all_tables())


FIXTURES = Path(tables.__file__).resolve().parent.parent / "fixtures"
SMALL_TABLE = "table-oeis-a014233.yaml"


def rewrite(document: dict, key_path: tuple, new_value) -> dict:
    target = document
    for key in key_path[:-1]:
        target = target[key]
    if new_value is _DELETE:
        del target[key_path[-1]]
    else:
        target[key_path[-1]] = new_value
    return document


_DELETE = object()


@pytest.mark.parametrize(("key_path", "new_value", "problem"), [
    (("source",), _DELETE, "source is missing or empty"),
    (("citation",), "  ", "citation is missing or empty"),
    (("id",), "oeis-a999999", "does not match the file name"),
    (("function",), "primes", "function 'primes' is not one of"),
    (("argument_form",), "3**n", "argument_form '3**n' is not one of"),
    (("entries",), [], "entries must be a non-empty list"),
    (("entries", 0, "value"), 2047.0, "value must be a non-negative integer"),
    (("entries", 0, "value"), True, "value must be a non-negative integer"),
    (("entries", 0, "value"), "2047", "value must be a non-negative integer"),
    (("entries", 0, "value"), _DELETE, "value is missing"),
    (("entries", 0, "n"), 2, "strictly increasing order of argument"),
    (("entries", 0, "from_memory"), "yes", "from_memory must be true or false"),
    (("entries", 0, "colour"), "red", "unknown keys ['colour']"),
    (("entries", 0, "argument"), 5, "give n, not argument"),
    (("publisher",), "us", "unknown keys ['publisher']"),
])
def test_malformed_table_is_rejected_naming_file_and_problem(tmp_path, key_path, new_value,
                                                              problem):
    document = yaml.safe_load((FIXTURES / SMALL_TABLE).read_text(encoding="utf-8"))
    (tmp_path / SMALL_TABLE).write_text(yaml.safe_dump(rewrite(document, key_path, new_value),
                                                       allow_unicode=True), encoding="utf-8")
    with pytest.raises(OracleError) as caught:
        tables.load_directory(tmp_path)
    assert SMALL_TABLE in str(caught.value)
    assert problem in str(caught.value)


def test_wrong_factorisation_is_rejected(tmp_path):
    name = "table-mersenne-factorizations.yaml"
    document = yaml.safe_load((FIXTURES / name).read_text(encoding="utf-8"))
    document["entries"][0]["value"] = [23, 87]
    (tmp_path / name).write_text(yaml.safe_dump(document, allow_unicode=True), encoding="utf-8")
    with pytest.raises(OracleError, match=f"{name}: .*do not multiply to the argument"):
        tables.load_directory(tmp_path)


def test_unsorted_factors_are_rejected(tmp_path):
    name = "table-mersenne-factorizations.yaml"
    document = yaml.safe_load((FIXTURES / name).read_text(encoding="utf-8"))
    document["entries"][0]["value"] = [89, 23]
    (tmp_path / name).write_text(yaml.safe_dump(document, allow_unicode=True), encoding="utf-8")
    with pytest.raises(OracleError, match=f"{name}: .*ascending order"):
        tables.load_directory(tmp_path)


def test_tables_that_disagree_are_rejected(tmp_path):
    for name in ("table-oeis-a006880.yaml", "table-oeis-a007053.yaml"):
        shutil.copy(FIXTURES / name, tmp_path / name)
    name = "table-oeis-a007053.yaml"
    document = yaml.safe_load((tmp_path / name).read_text(encoding="utf-8"))
    document["entries"][0]["value"] = 1  # π(2^0) = π(1) is 0, as A006880 says
    (tmp_path / name).write_text(yaml.safe_dump(document, allow_unicode=True), encoding="utf-8")
    with pytest.raises(OracleError, match=f"{name}: pi\\(1\\) = 1 disagrees with table oeis-a006880"):
        tables.load_directory(tmp_path)


def test_invalid_yaml_is_rejected(tmp_path):
    (tmp_path / SMALL_TABLE).write_text("id: [unclosed\n", encoding="utf-8")
    with pytest.raises(OracleError, match=f"{SMALL_TABLE}: not valid YAML"):
        tables.load_directory(tmp_path)


def test_other_yaml_files_are_not_read(tmp_path):
    shutil.copy(FIXTURES / SMALL_TABLE, tmp_path / SMALL_TABLE)
    (tmp_path / "bounds.yaml").write_text("something: [else\n", encoding="utf-8")
    assert set(tables.load_directory(tmp_path)) == {"oeis-a014233"}


def test_large_values_round_trip_exactly():
    # YAML integers are read exactly, never through a float.
    assert tables.table("oeis-a006880").value_at(10 ** 29) == 1520698109714272166094258063
    assert type(tables.table("oeis-a007053").value_at(2 ** 92)) is int
