"""Tests of the sieve engine, ``oracle.exact.sieve``.

External references: first terms of OEIS sequences (named beside each list),
pi(10**n) (OEIS A006880) and pi_2(10**n) (OEIS A007508), and the test-only
reference libraries sympy (``primerange``, ``isprime``) and primecountpy.  The
two engines (primesieve and our numpy sieve) are also checked against each
other on boundary and random intervals.  Values written here from memory are
marked so; each is also checked by an independent computation.
"""

from __future__ import annotations

import random

import numpy as np
import pytest
import sympy
from hypothesis import HealthCheck, given, settings, strategies as st

from oracle._errors import InvalidInputError, OutOfReachError
from oracle.exact import sieve
from oracle.exact.sieve import _beyond_64, _constellations, _segmented

ENGINES = sieve._engines()
NUMPY = ENGINES["numpy"]
PRIMESIEVE = ENGINES.get("primesieve")
needs_primesieve = pytest.mark.skipif(PRIMESIEVE is None, reason="primesieve not installed")
each_engine = pytest.mark.parametrize("engine", list(ENGINES.values()), ids=list(ENGINES))

TWO_64 = 2**64
#: Numbers covered by one segment of the numpy sieve (odd numbers only).
SEGMENT_SPAN = 2 * _segmented.SEGMENT_LENGTH


def brute_force_count(kind: str, a: int, b: int) -> int:
    """Tuples of ``kind`` wholly in [a, b], from sympy.isprime (test-only reference)."""
    offsets = sieve.PATTERNS[kind]
    prime = {n for n in range(max(a, 0), b + 1) if sympy.isprime(n)}
    return sum(1 for p in prime if p + offsets[-1] <= b and all(p + d in prime for d in offsets))


# --- the patterns ------------------------------------------------------------------------

def test_patterns_are_the_published_constellations():
    # OEIS A001359 (p, p+2), A022004 (p, p+2, p+6), A022005 (p, p+4, p+6),
    # A007530 (p, p+2, p+6, p+8): the definitions of the sequences.
    assert dict(sieve.PATTERNS) == {
        "primes": (0,), "twins": (0, 2), "triplets_026": (0, 2, 6),
        "triplets_046": (0, 4, 6), "quadruplets": (0, 2, 6, 8)}
    assert sieve.KINDS == ("primes", "twins", "triplets_026", "triplets_046", "quadruplets")
    assert sieve.ENGINE_LIMIT == 2**64


def test_patterns_cannot_be_changed_by_a_caller():
    with pytest.raises(TypeError):
        sieve.PATTERNS["twins"] = (0, 4)


@pytest.mark.parametrize("offsets, admissible", [
    ((0, 2), True), ((0, 2, 6), True), ((0, 4, 6), True), ((0, 2, 6, 8), True),
    ((0, 2, 4), False),        # covers 0, 1, 2 mod 3 (common practice: only (3, 5, 7))
    ((0, 1), False),           # covers 0, 1 mod 2
    ((0, 2, 6, 8, 12), True),  # the quintuplet pattern of OEIS A022006
    ((0, 2, 4, 6, 8), False),  # covers every class mod 3 and mod 5
])
def test_admissibility_follows_hardy_littlewood(offsets, admissible):
    assert _constellations.is_admissible(offsets) is admissible


# --- hand checks against the first terms of OEIS ----------------------------------------

# First terms, from memory; each list is confirmed by sympy in
# test_first_terms_are_what_sympy_finds below.
A001097_TWIN_PRIMES = [3, 5, 7, 11, 13, 17, 19, 29, 31, 41, 43, 59, 61, 71, 73, 101, 103,
                       107, 109, 137, 139, 149, 151, 179, 181, 191, 193, 197, 199]
A022004_TRIPLETS_026 = [5, 11, 17, 41, 101, 107, 191, 227, 311, 347, 461, 641, 821, 857,
                        881, 1091, 1277, 1301, 1427, 1481, 1487, 1607]
A022005_TRIPLETS_046 = [7, 13, 37, 67, 97, 103, 193, 223, 277, 307, 457, 613, 823, 853,
                        877, 1087, 1297, 1423, 1447, 1483]
A007530_QUADRUPLETS = [5, 11, 101, 191, 821, 1481, 1871, 2081, 3251, 3461, 5651, 9431,
                       13001, 15641, 15731, 16061, 18041, 18911, 19421, 21011, 22271,
                       25301, 31721, 34841, 43781]
LESSER_TWINS = [p for p in A001097_TWIN_PRIMES if p + 2 in A001097_TWIN_PRIMES]

FIRST_STARTS = {
    "twins": LESSER_TWINS,
    "triplets_026": A022004_TRIPLETS_026,
    "triplets_046": A022005_TRIPLETS_046,
    "quadruplets": A007530_QUADRUPLETS,
}


@pytest.mark.parametrize("kind", list(FIRST_STARTS))
def test_first_terms_are_what_sympy_finds(kind):
    starts = FIRST_STARTS[kind]
    offsets = sieve.PATTERNS[kind]
    found = [p for p in sympy.primerange(0, starts[-1] + 1)
             if all(sympy.isprime(p + d) for d in offsets)]
    assert found == starts


@each_engine
@pytest.mark.parametrize("kind", list(FIRST_STARTS))
def test_count_steps_up_exactly_when_a_tuple_ends(engine, kind):
    # Tuple i (0-based) starting at p is counted in [0, p + last] but not in
    # [0, p + last - 1]: its start is >= a but its end is beyond b.
    last = sieve.PATTERNS[kind][-1]
    for index, p in enumerate(FIRST_STARTS[kind]):
        assert engine.count(kind, 0, p + last) == index + 1
        assert engine.count(kind, 0, p + last - 1) == index
        assert engine.count(kind, p, p + last) == 1
        assert engine.count(kind, p + 1, p + last) == 0


@each_engine
def test_twin_prime_members_match_oeis_a001097(engine):
    members = [p for p in engine.primes(0, 199).tolist()
               if engine.count("twins", max(p - 2, 0), p) + engine.count("twins", p, p + 2) > 0]
    assert members == A001097_TWIN_PRIMES


@each_engine
@pytest.mark.parametrize("kind, a, b, expected", [
    # Hand checks: the constellations that contain small primes, (2, 3) is not a twin pair.
    ("twins", 2, 3, 0), ("twins", 0, 4, 0), ("twins", 3, 5, 1), ("twins", 5, 7, 1),
    ("twins", 0, 7, 2), ("twins", 4, 7, 1), ("twins", 3, 6, 1),
    ("triplets_026", 5, 11, 1), ("triplets_026", 5, 10, 0), ("triplets_026", 6, 11, 0),
    ("triplets_026", 0, 11, 1),  # (3, 5, 9) is not a triplet
    ("triplets_046", 7, 13, 1), ("triplets_046", 3, 9, 0), ("triplets_046", 0, 13, 1),
    ("quadruplets", 5, 13, 1), ("quadruplets", 5, 12, 0), ("quadruplets", 0, 13, 1),
    ("quadruplets", 3, 11, 0),
    ("primes", 0, 0, 0), ("primes", 0, 1, 0), ("primes", 0, 2, 1), ("primes", 1, 1, 0),
    ("primes", 2, 2, 1), ("primes", 3, 3, 1), ("primes", 4, 4, 0), ("primes", 1, 3, 2),
    ("primes", 2, 7, 4), ("primes", 97, 97, 1), ("primes", 90, 96, 0),
])
def test_small_interval_hand_checks(engine, kind, a, b, expected):
    assert engine.count(kind, a, b) == expected


@each_engine
def test_empty_and_reversed_intervals(engine):
    for kind in sieve.KINDS:
        assert engine.count(kind, 10, 9) == 0
    assert len(engine.primes(10, 9)) == 0
    assert engine.primes(13, 13).tolist() == [13]
    assert engine.primes(14, 16).tolist() == []


# --- published counts ------------------------------------------------------------------

# OEIS A006880, pi(10^n) for n = 0..9 (from memory; checked against primecountpy below).
A006880 = [0, 4, 25, 168, 1229, 9592, 78498, 664579, 5761455, 50847534]
# OEIS A007508, pi_2(10^n) twin pairs (p, p+2) with p+2 <= 10^n, n = 1..9 (from memory;
# the two engines are independent implementations that must both agree).
A007508 = {1: 2, 2: 8, 3: 35, 4: 205, 5: 1224, 6: 8169, 7: 58980, 8: 440312, 9: 3424506}


def test_published_prime_counts_agree_with_primecountpy():
    primecount = pytest.importorskip("primecountpy.primecount")
    assert [primecount.prime_pi(10**n) for n in range(10)] == A006880


@pytest.fixture(scope="module")
def counts_to_10_9():
    """pi(10**9) and pi_2(10**9) once per engine (the numpy sieve counts every kind in one pass)."""
    counts = {"numpy": NUMPY.count_all(0, 10**9)}
    if PRIMESIEVE is not None:
        counts["primesieve"] = {kind: PRIMESIEVE.count(kind, 0, 10**9)
                                for kind in ("primes", "twins")}
    return counts


@pytest.mark.parametrize("name", list(ENGINES))
def test_pi_of_10_to_9(counts_to_10_9, name):
    assert counts_to_10_9[name]["primes"] == A006880[9]


@pytest.mark.parametrize("name", list(ENGINES))
def test_twin_pi_of_10_to_9(counts_to_10_9, name):
    assert counts_to_10_9[name]["twins"] == A007508[9]


@each_engine
@pytest.mark.parametrize("n", range(0, 9))
def test_pi_of_powers_of_ten(engine, n):
    assert engine.count("primes", 0, 10**n) == A006880[n]


@each_engine
@pytest.mark.parametrize("n", range(1, 9))
def test_twin_pi_of_powers_of_ten(engine, n):
    assert engine.count("twins", 0, 10**n) == A007508[n]


@needs_primesieve
def test_both_engines_agree_on_every_kind_to_10_8():
    assert NUMPY.count_all(0, 10**8) == PRIMESIEVE.count_all(0, 10**8)


@needs_primesieve
def test_primesieve_triplets_are_both_patterns_together():
    # primesieve's own convention: count_triplets counts (0,2,6) and (0,4,6) together.
    import primesieve
    for a, b in [(0, 10**6), (5, 13), (10**9, 10**9 + 10**6)]:
        ours = NUMPY.count_all(a, b)
        assert primesieve.count_triplets(a, b) == ours["triplets_026"] + ours["triplets_046"]


# --- prime lists against sympy ---------------------------------------------------------

@each_engine
@pytest.mark.parametrize("a, b", [(0, 0), (0, 1), (0, 2), (1, 3), (2, 2), (0, 100), (3, 3),
                                  (10**6, 10**6 + 5000), (2**32 - 3000, 2**32 + 3000)])
def test_prime_lists_match_sympy(engine, a, b):
    found = engine.primes(a, b)
    assert found.dtype == np.uint64
    assert found.tolist() == list(sympy.primerange(a, b + 1))


@each_engine
def test_prime_lists_match_sympy_on_random_intervals(engine):
    rng = random.Random(20240611)
    for _ in range(15):
        a = rng.randrange(0, 10**rng.randrange(2, 13))
        b = a + rng.randrange(0, 20000)
        assert engine.primes(a, b).tolist() == list(sympy.primerange(a, b + 1)), (a, b)


def test_prime_list_across_segments_matches_sympy():
    a = SEGMENT_SPAN - 5001
    assert NUMPY.primes(a, a + 10**4).tolist() == list(sympy.primerange(a, a + 10**4 + 1))


# --- the two engines side by side ------------------------------------------------------

def boundary_intervals():
    """Intervals whose ends or tuples sit on the numpy sieve's segment boundaries."""
    intervals = []
    for segments in (1, 2):
        edge = SEGMENT_SPAN * segments
        for delta in (-9, -8, -7, -3, -2, -1, 0, 1, 2, 3, 7, 8, 9):
            intervals.append((0, edge + delta))
            intervals.append((1, edge + 1 + delta))
            intervals.append((edge - 100 + delta, edge + 100))
    intervals += [(2**32 + d1, 2**32 + d2) for d1, d2 in [(-50, 50), (-1, 0), (0, 1), (-200, -1)]]
    intervals += [(n, n) for n in (2, 3, 5, 7, 11, 13, 97, 2**31 - 1, 2**32 - 5)]
    intervals += [(2**56 - 2000, 2**56 + 2000), (10**15 - SEGMENT_SPAN - 50, 10**15)]
    return intervals


@needs_primesieve
@pytest.mark.parametrize("a, b", boundary_intervals())
def test_engines_agree_on_boundary_intervals(a, b):
    assert NUMPY.count_all(a, b) == PRIMESIEVE.count_all(a, b)


def test_tuple_straddling_a_segment_boundary_is_counted_once():
    # A quadruplet q (found by sympy) with the first segment of [a, ...] ending inside it.
    q = next(n for n in range(SEGMENT_SPAN // 30 * 30 + 11, 10**9, 30)
             if all(sympy.isprime(n + d) for d in (0, 2, 6, 8)))
    a = q + 4 - SEGMENT_SPAN             # odd, so the segment ends at q + 3
    before = NUMPY.count("quadruplets", a, q + 7)
    assert NUMPY.count("quadruplets", a, q + 8) == before + 1
    assert NUMPY.count("twins", a, q + 8) - NUMPY.count("twins", a, q + 5) == 1  # (q+6, q+8)
    assert NUMPY.count("triplets_046", a, q + 8) - NUMPY.count("triplets_046", a, q + 7) == 1


@needs_primesieve
@settings(derandomize=True, max_examples=40, deadline=None,
          suppress_health_check=[HealthCheck.too_slow])
@given(a=st.integers(0, 10**13), length=st.integers(-5, 3 * 10**5))
def test_engines_agree_on_random_intervals(a, length):
    assert NUMPY.count_all(a, a + length) == PRIMESIEVE.count_all(a, a + length)


@needs_primesieve
def test_engines_agree_on_intervals_longer_than_a_segment():
    rng = random.Random(7)
    for _ in range(3):
        a = rng.randrange(0, 10**11)
        b = a + 2 * SEGMENT_SPAN + rng.randrange(0, 1000)
        assert NUMPY.count_all(a, b) == PRIMESIEVE.count_all(a, b), (a, b)


# --- near 2**64 ------------------------------------------------------------------------

@pytest.mark.parametrize("lo", [TWO_64 - 3 * 2**32 - 1, TWO_64 - 2 * SEGMENT_SPAN - 1,
                                TWO_64 - 1001])
def test_first_multiples_near_2_to_64_match_python_integers(lo):
    # The uint64 index arithmetic of the numpy sieve against exact Python ints,
    # for sieving primes up to 2**32 (found by sympy) and segment starts near 2**64.
    primes = np.array(list(sympy.primerange(3, 3000)) + list(sympy.primerange(2**32 - 3000, 2**32)),
                      dtype=np.uint64)
    expected = []
    for p in primes.tolist():
        multiple = max(-(-lo // p) * p, p * p)
        if multiple % 2 == 0:
            multiple += p
        expected.append((multiple - lo) // 2)
    assert _segmented._first_indices(lo, primes).tolist() == expected


def test_numpy_primes_near_2_to_56_match_sympy():
    a, b = 2**56 - 1500, 2**56 + 1500
    assert NUMPY.primes(a, b).tolist() == [n for n in range(a, b + 1) if sympy.isprime(n)]


def test_numpy_counts_just_below_2_to_64_match_sympy():
    # Short beside sqrt(b): the numpy engine sieves by small primes and proves the survivors.
    a, b = TWO_64 - 1200, TWO_64 - 1
    assert NUMPY.count_all(a, b) == {kind: brute_force_count(kind, a, b) for kind in sieve.KINDS}


@needs_primesieve
def test_primesieve_counts_just_below_2_to_64_match_sympy():
    a, b = TWO_64 - 1200, TWO_64 - 1
    assert PRIMESIEVE.count_all(a, b) == {kind: brute_force_count(kind, a, b)
                                          for kind in sieve.KINDS}


@pytest.mark.slow
def test_numpy_primes_just_below_2_to_64_match_sympy():
    a, b = TWO_64 - 1500, TWO_64 - 1
    assert NUMPY.primes(a, b).tolist() == [n for n in range(a, b + 1) if sympy.isprime(n)]


@pytest.mark.slow
@needs_primesieve
@pytest.mark.parametrize("a, b", [(TWO_64 - 10**5, TWO_64 - 1), (TWO_64 - 2, TWO_64 - 1),
                                  (TWO_64 - 59, TWO_64 - 59), (TWO_64 - 3 * 10**6, TWO_64 - 10**6)])
def test_engines_agree_just_below_2_to_64(a, b):
    assert NUMPY.count_all(a, b) == PRIMESIEVE.count_all(a, b)


# --- short intervals high up: small primes only, survivors proven ----------------------

def takes_the_proof_route(a: int, b: int) -> bool:
    """Whether the numpy engine sieves ``[a, b]`` by small primes only and proves the survivors."""
    return _segmented._sieves_by_small_primes_only(a + 1 if a % 2 == 0 else a, b)


SHORT_HIGH_INTERVALS = [(TWO_64 - 3000, TWO_64 - 1), (2**63 - 1500, 2**63 + 1500),
                        (10**18 - 1500, 10**18 + 1500), (10**16 + 10**9, 10**16 + 10**9 + 1000)]


@pytest.mark.parametrize("a, b", SHORT_HIGH_INTERVALS)
def test_short_high_intervals_match_sympy(a, b):
    assert takes_the_proof_route(a, b)
    assert NUMPY.primes(a, b).tolist() == list(sympy.primerange(a, b + 1))


@needs_primesieve
@pytest.mark.parametrize("a, b", SHORT_HIGH_INTERVALS + [(TWO_64 - 10**6, TWO_64 - 1),
                                                         (10**18, 10**18 + 10**6)])
def test_short_high_intervals_match_primesieve_on_every_kind(a, b):
    assert takes_the_proof_route(a, b)
    assert NUMPY.count_all(a, b) == PRIMESIEVE.count_all(a, b)


def test_proof_route_agrees_with_the_full_base_sieve(monkeypatch):
    # The same intervals by both routes of the numpy engine (sympy's primes as the witness).
    rng = random.Random(20261203)
    intervals = [(a, a + rng.randrange(1, 3000)) for a in
                 (rng.randrange(10**14, 10**16) for _ in range(6))]
    proven = [NUMPY.count_all(a, b) for a, b in intervals]
    assert all(takes_the_proof_route(a, b) for a, b in intervals)
    monkeypatch.setattr(_segmented, "_PROOF_TO_SIEVE_COST", 10**30)   # never the proof route
    assert not any(takes_the_proof_route(a, b) for a, b in intervals)
    assert [NUMPY.count_all(a, b) for a, b in intervals] == proven
    a, b = intervals[0]
    assert sum(1 for n in range(a, b + 1) if sympy.isprime(n)) == proven[0]["primes"]


@pytest.mark.parametrize("p", [65537, 65539, 65543, 65551, 65557])
def test_squares_of_primes_just_above_the_small_prime_limit_are_not_prime(p):
    # p (prime, checked by sympy) exceeds SMALL_PRIME_LIMIT = 2**16, so p*p survives the
    # small-prime sieve and only the strong test can strike it.
    assert sympy.isprime(p) and p > _segmented.SMALL_PRIME_LIMIT
    a, b = p * p - 300, p * p + 300
    assert takes_the_proof_route(a, b)
    found = NUMPY.primes(a, b).tolist()
    assert p * p not in found
    assert found == list(sympy.primerange(a, b + 1))


def test_squares_and_products_of_large_primes_near_2_to_64_are_not_prime():
    # q = the largest prime below 2**32 (sympy.prevprime); q*q < 2**64 has no factor below 2**16.
    q = sympy.prevprime(2**32)
    r = sympy.prevprime(q)
    for n in (q * q, q * r):
        a, b = n - 500, min(n + 500, TWO_64 - 1)
        assert takes_the_proof_route(a, b)
        found = NUMPY.primes(a, b).tolist()
        assert n not in found
        assert found == list(sympy.primerange(a, b + 1))


@pytest.mark.parametrize("psi", [341550071728321, 3825123056546413051])
def test_strong_pseudoprimes_without_small_factors_are_not_prime(psi):
    # OEIS A014233: psi_7 = psi_8 and psi_9 = psi_10 = psi_11, strong pseudoprimes to the
    # first 8 (resp. 11) prime bases; every prime factor (sympy.factorint) exceeds 2**16,
    # so they survive the small-prime sieve and the right number of bases must reject them.
    assert min(sympy.factorint(psi)) > _segmented.SMALL_PRIME_LIMIT
    a, b = psi - 1000, psi + 1000
    assert takes_the_proof_route(a, b)
    found = NUMPY.primes(a, b).tolist()
    assert psi not in found
    assert found == list(sympy.primerange(a, b + 1))


def test_long_or_low_intervals_keep_the_full_base_sieve():
    assert not takes_the_proof_route(0, 10**9)
    assert not takes_the_proof_route(TWO_64 - 10**8, TWO_64 - 1)
    assert not takes_the_proof_route(2**32 - 100, 2**32)        # sqrt(b) within the small primes


# --- beyond 2**64 ----------------------------------------------------------------------

@pytest.mark.parametrize("kind", sieve.KINDS)
@pytest.mark.parametrize("a", [TWO_64, TWO_64 + 10**12 + 1, 3 * TWO_64 + 17])
def test_counts_beyond_2_to_64_match_sympy(kind, a):
    b = a + 1500
    assert sieve.count_beyond_64(kind, a, b) == brute_force_count(kind, a, b)


@pytest.mark.parametrize("kind", sieve.KINDS)
def test_count_straddling_2_to_64_matches_sympy(kind):
    a, b = TWO_64 - 700, TWO_64 + 700
    assert sieve.count(kind, a, b) == brute_force_count(kind, a, b)


@pytest.mark.parametrize("kind", sieve.KINDS)
def test_beyond_2_to_64_across_window_edges(monkeypatch, kind):
    # Small windows put many window edges inside the interval; tuples across them count once.
    monkeypatch.setattr(_beyond_64, "_WINDOW", 97)
    a, b = TWO_64 + 10**9, TWO_64 + 10**9 + 2000
    assert sieve.count_beyond_64(kind, a, b) == brute_force_count(kind, a, b)


def test_beyond_2_to_64_refuses_long_intervals():
    with pytest.raises(OutOfReachError, match=r"10\*\*8"):
        sieve.count_beyond_64("primes", TWO_64, TWO_64 + _beyond_64.MAX_SPAN)
    with pytest.raises(OutOfReachError):
        sieve.count("twins", 0, TWO_64)


def test_beyond_2_to_64_refuses_intervals_below_it():
    with pytest.raises(InvalidInputError):
        sieve.count_beyond_64("primes", 0, TWO_64 - 1)


# --- the public functions --------------------------------------------------------------

@pytest.mark.parametrize("call", [
    lambda: sieve.count("sextuplets", 0, 10),
    lambda: sieve.count(None, 0, 10),
    lambda: sieve.count("primes", 1.0, 10),
    lambda: sieve.count("primes", 0, 10.0),
    lambda: sieve.count("primes", True, 10),
    lambda: sieve.count("primes", -1, 10),
    lambda: sieve.count("primes", "0", 10),
    lambda: sieve.primes(-5, 10),
    lambda: sieve.primes(0, 2.5),
    lambda: sieve.primes(0, TWO_64),
    lambda: sieve.count_beyond_64("pairs", TWO_64, TWO_64 + 10),
])
def test_bad_arguments_raise_invalid_input(call):
    with pytest.raises(InvalidInputError):
        call()


def test_primes_refuses_a_list_longer_than_the_limit():
    with pytest.raises(OutOfReachError, match=r"2\*\*32"):
        sieve.primes(0, sieve.MAX_LIST_SPAN)


def test_reversed_and_negative_upper_ends_give_nothing():
    assert sieve.count("primes", 10, 9) == 0
    assert sieve.count("twins", 0, -5) == 0
    assert sieve.count("primes", TWO_64 + 10, TWO_64) == 0
    assert sieve.primes(10, 3).dtype == np.uint64 and len(sieve.primes(10, 3)) == 0


def test_numpy_and_gmpy2_integers_are_accepted():
    gmpy2 = pytest.importorskip("gmpy2")
    assert sieve.count("primes", np.uint64(0), gmpy2.mpz(100)) == 25   # OEIS A006880
    assert sieve.primes(np.int64(10), 20).tolist() == [11, 13, 17, 19]


def test_primes_near_the_top_of_uint64():
    top = sieve.primes(TWO_64 - 100, TWO_64 - 1).tolist()
    assert top == [n for n in range(TWO_64 - 100, TWO_64) if sympy.isprime(n)]
    # common practice: 2**64 - 59 is the largest prime below 2**64
    assert top[-1] == TWO_64 - 59


def test_engine_choice_follows_the_environment(monkeypatch):
    monkeypatch.setenv("NTORACLE_SIEVE_ENGINE", "numpy")
    assert sieve.active_engine() == "numpy segmented sieve (forced by NTORACLE_SIEVE_ENGINE=numpy)"
    assert sieve.count("primes", 0, 1000) == 168             # OEIS A006880
    monkeypatch.setenv("NTORACLE_SIEVE_ENGINE", "fastest")
    with pytest.raises(InvalidInputError, match="NTORACLE_SIEVE_ENGINE"):
        sieve.count("primes", 0, 1000)
    monkeypatch.delenv("NTORACLE_SIEVE_ENGINE")
    if PRIMESIEVE is not None:
        import primesieve
        assert sieve.active_engine() == f"primesieve {primesieve.primesieve_version().decode()}"


def test_engine_choice_without_primesieve(monkeypatch):
    monkeypatch.setattr(sieve, "_PRIMESIEVE_ENGINE", None)
    monkeypatch.delenv("NTORACLE_SIEVE_ENGINE", raising=False)
    assert sieve.active_engine() == "numpy segmented sieve (primesieve not installed)"
    assert sieve.count("twins", 0, 1000) == 35                # OEIS A007508
    monkeypatch.setenv("NTORACLE_SIEVE_ENGINE", "primesieve")
    with pytest.raises(InvalidInputError, match="not installed"):
        sieve.active_engine()


# --- slower cross-checks ---------------------------------------------------------------

@pytest.mark.slow
@each_engine
def test_pi_and_twin_pi_of_10_to_10(engine):
    counts = engine.count_all(0, 10**10)
    assert counts["primes"] == 455052511      # OEIS A006880 (from memory)
    assert counts["twins"] == 27412679        # OEIS A007508 (from memory)


@pytest.mark.slow
@needs_primesieve
@settings(derandomize=True, max_examples=300, deadline=None,
          suppress_health_check=[HealthCheck.too_slow])
@given(a=st.integers(0, 10**15), length=st.integers(-5, 10**6))
def test_engines_agree_on_many_random_intervals(a, length):
    assert NUMPY.count_all(a, a + length) == PRIMESIEVE.count_all(a, a + length)
