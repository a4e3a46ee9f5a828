"""Tests of oracle.exact.combinatorial: exact pi(x) and p_n by the combinatorial method.

References outside the project:
* the sieve of Eratosthenes in ``primesieve`` (a general-purpose library);
* ``primecountpy`` and ``sympy`` as test-only reference implementations;
* published tables: OEIS A006880 (pi(10^n)) and OEIS A007053 (pi(2^n)).
"""

from __future__ import annotations

import math
import random
import re
import time
import warnings

import numpy as np
import pytest

from oracle._errors import InvalidInputError, OracleError, OutOfReachError
from oracle.exact import combinatorial
from oracle.exact.combinatorial import _parallel, _prime_pi
from oracle.exact.combinatorial._arithmetic_tables import (least_prime_factor_and_moebius,
                                                           prime_count_table)
from oracle.exact.combinatorial._deleglise_rivat import prime_pi_deleglise_rivat
from oracle.exact.combinatorial._exact_sum import exact_sum
from oracle.exact.combinatorial._flatten import chunks_by_total, flat_ranges
from oracle.exact.combinatorial._parameters import choose_y, integer_cube_root
from oracle.exact.combinatorial._partial_sieve import SEGMENT_GRANULE, PartialSieve
from oracle.exact.combinatorial._phi import ordinary_leaves, phi_small
from oracle.exact.combinatorial._quotients import floor_quotients
from oracle.exact.combinatorial._riemann_r import inverse_riemann_r, riemann_r
from oracle.exact.combinatorial._run_clock import RunClock
from oracle.exact.combinatorial._small_range import SMALL_LIMIT
from _references import primecount, primesieve, sympy

# OEIS A006880: pi(10^n), n = 0..18 (values from memory; every one is recomputed
# by primecountpy in test_decimal_table_matches_primecountpy and the slow tests).
PI_POWERS_OF_TEN = [0, 4, 25, 168, 1229, 9592, 78498, 664579, 5761455, 50847534,
                    455052511, 4118054813, 37607912018, 346065536839, 3204941750802,
                    29844570422669, 279238341033925, 2623557157654233, 24739954287740860]

# OEIS A007053: pi(2^n), n = 0..52 (values from memory, recomputed by primecountpy
# in test_binary_table_matches_primecountpy).
PI_POWERS_OF_TWO = [0, 1, 2, 4, 6, 11, 18, 31, 54, 97, 172, 309, 564, 1028, 1900, 3512, 6542,
                    12251, 23000, 43390, 82025, 155611, 295947, 564163, 1077871, 2063689,
                    3957809, 7603553, 14630843, 28192750, 54400028, 105097565, 203280221,
                    393615806, 762939111, 1480206279, 2874398515, 5586502348, 10866266172,
                    21151907950, 41203088796, 80316571436, 156661034233, 305761713237,
                    597116381732, 1166746786182, 2280998753949, 4461632979717, 8731188863470,
                    17094432576778, 33483379603407, 65612899915304, 128625503610475]


def sieve_counts(limit: int) -> np.ndarray:
    """counts[x] = pi(x) for 0 <= x <= limit, from primesieve's list of primes."""
    marks = np.zeros(limit + 1, dtype=np.int64)
    marks[np.array(primesieve.primes(limit), dtype=np.int64)] = 1
    return np.cumsum(marks)


def sieve_counts_at(points: list[int]) -> list[int]:
    """pi at sorted points by counting primes between neighbours (one pass of primesieve)."""
    counts, total, previous = [], 0, 0
    for x in points:
        if x > previous:
            total += primesieve.count_primes(previous + 1, x)
            previous = x
        counts.append(total)
    return counts


def log_uniform(rng: random.Random, low: int, high: int) -> int:
    """An integer roughly log-uniform in [low, high] (every size class is visited)."""
    digits = rng.uniform(math.log10(low), math.log10(high))
    return max(low, min(high, int(10**digits) + rng.randrange(1000)))


# --------------------------------------------------------------------------------------
# Agreement with the sieve
# --------------------------------------------------------------------------------------

def test_prime_pi_every_x_up_to_10_to_5_agrees_with_the_sieve():
    counts = sieve_counts(10**5)
    answers = np.array([combinatorial.prime_pi(x) for x in range(10**5 + 1)])
    mismatches = np.flatnonzero(answers != counts)
    assert mismatches.size == 0, f"first mismatch at x = {mismatches[:5]}"


def test_combinatorial_method_every_x_from_27_to_6000_agrees_with_the_sieve():
    # The table fast path answers these in prime_pi; here the method itself runs.
    counts = sieve_counts(6000)
    wrong = [x for x in range(27, 6001) if prime_pi_deleglise_rivat(x) != counts[x]]
    assert wrong == []


@pytest.mark.parametrize("alpha", [1.0, 2.5, 9.0])
@pytest.mark.parametrize("segment_size", [SEGMENT_GRANULE, 4 * SEGMENT_GRANULE, None])
def test_combinatorial_method_with_other_parameters_agrees_with_the_sieve(alpha, segment_size):
    # Small segments and other y exercise segment boundaries, activation of
    # primes in later segments and the easy/hard split.
    rng = random.Random(f"{alpha}-{segment_size}")
    points = sorted(log_uniform(rng, 27, 2 * 10**8) for _ in range(40))
    expected = sieve_counts_at(points)
    got = [prime_pi_deleglise_rivat(x, alpha=alpha, segment_size=segment_size) for x in points]
    assert got == expected


def test_prime_pi_two_thousand_random_x_up_to_10_to_10_agree_with_the_sieve():
    rng = random.Random(20240601)
    points = sorted(log_uniform(rng, 2, 10**10) for _ in range(2000))
    assert [combinatorial.prime_pi(x) for x in points] == sieve_counts_at(points)


@pytest.mark.slow
def test_prime_pi_five_thousand_uniform_random_x_up_to_10_to_10_agree_with_the_sieve():
    rng = random.Random(7)
    points = sorted(rng.randrange(10**10) for _ in range(5000))
    assert [combinatorial.prime_pi(x) for x in points] == sieve_counts_at(points)


def test_the_table_fast_path_boundary():
    for x in range(SMALL_LIMIT - 50, SMALL_LIMIT + 50):
        assert combinatorial.prime_pi(x) == primesieve.count_primes(x), x


# --------------------------------------------------------------------------------------
# Published tables and the reference library
# --------------------------------------------------------------------------------------

@pytest.mark.parametrize("n", range(0, 14))
def test_powers_of_ten_match_oeis_a006880(n):
    assert combinatorial.prime_pi(10**n) == PI_POWERS_OF_TEN[n]  # OEIS A006880


@pytest.mark.slow
@pytest.mark.parametrize("n", range(14, 17))
def test_larger_powers_of_ten_match_oeis_a006880(n):
    assert combinatorial.prime_pi(10**n) == PI_POWERS_OF_TEN[n]  # OEIS A006880


@pytest.mark.parametrize("n", range(0, 44))
def test_powers_of_two_match_oeis_a007053(n):
    assert combinatorial.prime_pi(2**n) == PI_POWERS_OF_TWO[n]  # OEIS A007053


@pytest.mark.slow
@pytest.mark.parametrize("n", range(44, 53))
def test_larger_powers_of_two_match_oeis_a007053(n):
    assert combinatorial.prime_pi(2**n) == PI_POWERS_OF_TWO[n]  # OEIS A007053


def test_decimal_table_matches_primecountpy():
    # The tables above are quoted from memory; the reference library confirms them.
    assert [primecount.prime_pi(10**n) for n in range(15)] == PI_POWERS_OF_TEN[:15]


def test_binary_table_matches_primecountpy():
    assert [primecount.prime_pi(2**n) for n in range(47)] == PI_POWERS_OF_TWO[:47]


@pytest.mark.slow
def test_larger_table_entries_match_primecountpy():
    assert [primecount.prime_pi(10**n) for n in range(15, 18)] == PI_POWERS_OF_TEN[15:18]
    assert [primecount.prime_pi(2**n) for n in range(47, 53)] == PI_POWERS_OF_TWO[47:]


@pytest.mark.slow
def test_pi_of_10_to_18_matches_primecountpy():
    assert primecount.prime_pi(10**18) == PI_POWERS_OF_TEN[18]  # OEIS A006880


def test_twenty_random_x_up_to_10_to_13_agree_with_primecountpy():
    rng = random.Random(31)
    for _ in range(20):
        x = log_uniform(rng, 10**10, 10**13)
        assert combinatorial.prime_pi(x) == primecount.prime_pi(x), x


@pytest.mark.slow
def test_three_hundred_random_x_up_to_10_to_14_agree_with_primecountpy():
    rng = random.Random(14)
    for _ in range(300):
        x = log_uniform(rng, 10**10, 10**14)
        assert combinatorial.prime_pi(x) == primecount.prime_pi(x), x


def test_sympy_agrees_at_a_few_points():
    for x in (10**7 + 19, 3 * 10**8 + 1, 2**31 - 1):
        assert combinatorial.prime_pi(x) == int(sympy.primepi(x))


# --------------------------------------------------------------------------------------
# Edge cases
# --------------------------------------------------------------------------------------

def _edge_points() -> list[int]:
    """Primes, prime squares and cubes and their neighbours, across the size range."""
    points = set()
    for p in (2, 3, 5, 7, 11, 101, 211, 1009, 2003, 4001, 10007, 21023, 46337, 99991):
        for power in (1, 2, 3):
            value = p**power
            if 8 <= value <= 10**13:
                points.update({value - 1, value, value + 1})
    for p in (1_000_003, 1_000_000_007, 10_000_000_019, 99_999_999_977):
        points.update({p - 1, p, p + 1})
    return sorted(points)


@pytest.mark.parametrize("x", _edge_points())
def test_primes_prime_squares_and_prime_cubes(x):
    expected = primesieve.count_primes(x) if x <= 10**8 else primecount.prime_pi(x)
    assert combinatorial.prime_pi(x) == expected


def test_cube_of_a_prime_puts_y_exactly_on_the_cube_root():
    # x = p^3 makes floor(x^(1/3)) = p exactly: p_(a+1)^3 > x must still hold.
    for p in (997, 1999, 7919):
        x = p**3
        assert integer_cube_root(x) == p
        assert prime_pi_deleglise_rivat(x, alpha=1.0) == primecount.prime_pi(x)


def test_y_at_the_square_root_leaves_no_p2_term():
    x = 10**9
    assert prime_pi_deleglise_rivat(x, alpha=1e6) == PI_POWERS_OF_TEN[9]  # OEIS A006880


@pytest.mark.parametrize("x", [-10**30, -5, -1, 0, 1])
def test_below_two_there_are_no_primes(x):
    assert combinatorial.prime_pi(x) == 0


@pytest.mark.parametrize("x", [2**64 - 1, 2**64, 2**64 + 1, 10**18 + 1, 10**40])
def test_beyond_max_x_is_out_of_reach_not_wrong(x):
    with pytest.raises(OutOfReachError, match="10\\*\\*18"):
        combinatorial.prime_pi(x)


def test_max_x_is_at_least_10_to_18_and_documented():
    assert combinatorial.MAX_X >= 10**18


def test_max_x_within_a_budget_is_refused_before_running():
    started = time.monotonic()
    with pytest.raises(OutOfReachError, match="estimated .* exceeds the time budget"):
        combinatorial.prime_pi(combinatorial.MAX_X, time_budget=1.0)
    assert time.monotonic() - started < 1.0


@pytest.mark.parametrize("bad", [1.0, 1e12, "1000", None, True, [10], 2.5])
def test_non_integers_are_refused(bad):
    with pytest.raises(InvalidInputError):
        combinatorial.prime_pi(bad)


def test_integer_like_objects_are_accepted():
    assert combinatorial.prime_pi(np.int64(10**12)) == PI_POWERS_OF_TEN[12]  # OEIS A006880
    assert combinatorial.prime_pi(np.uint64(2**40)) == PI_POWERS_OF_TWO[40]  # OEIS A007053


@pytest.mark.parametrize("budget", [0, -1, float("nan"), "5", True])
def test_bad_time_budgets_are_refused(budget):
    with pytest.raises(InvalidInputError):
        combinatorial.prime_pi(10**12, time_budget=budget)


def test_all_errors_are_oracle_errors_and_value_errors():
    assert issubclass(OutOfReachError, OracleError) and issubclass(OracleError, ValueError)


# --------------------------------------------------------------------------------------
# Time budget and progress
# --------------------------------------------------------------------------------------

def test_estimate_over_budget_is_refused_with_both_figures():
    with pytest.raises(OutOfReachError) as caught:
        combinatorial.prime_pi(10**16, time_budget=0.001)
    message = str(caught.value)
    assert "estimated" in message and "0.001 s" in message


def test_estimated_seconds_grows_with_x():
    estimates = [combinatorial.estimated_seconds(10**n) for n in range(8, 19)]
    assert all(a < b for a, b in zip(estimates, estimates[1:]))
    assert combinatorial.estimated_seconds(100) == 0.0
    assert combinatorial.estimated_seconds(10**3000) == float("inf")   # no OverflowError


def test_no_numpy_overflow_warning_during_a_run():
    # numpy warns when a scalar operation overflows; none may happen anywhere.
    with warnings.catch_warnings():
        warnings.simplefilter("error")
        assert combinatorial.prime_pi(10**13 + 12345) == primecount.prime_pi(10**13 + 12345)


def test_a_run_that_outgrows_its_budget_stops():
    clock = RunClock("prime_pi(demo)", time_budget=1e-6, progress=None)
    time.sleep(0.002)
    with pytest.raises(OutOfReachError, match="over the time budget"):
        clock.report(0.5, "hard special leaves")


def test_progress_is_reported_in_order_and_ends_with_done():
    calls = []
    value = combinatorial.prime_pi(3 * 10**13, progress=lambda f, s: calls.append((f, s)))
    assert value == primecount.prime_pi(3 * 10**13)
    fractions = [f for f, _ in calls]
    assert calls[-1] == (1.0, "done")
    assert all(0.0 <= f <= 1.0 for f in fractions)
    assert fractions == sorted(fractions)
    assert all(isinstance(s, str) and s for _, s in calls)


def test_progress_is_throttled():
    calls = []
    started = time.monotonic()
    combinatorial.prime_pi(10**13, progress=lambda f, s: calls.append(f))
    elapsed = time.monotonic() - started
    assert len(calls) <= 4 * elapsed + 2


# --------------------------------------------------------------------------------------
# nth_prime
# --------------------------------------------------------------------------------------

@pytest.mark.parametrize("n", [1, 2, 3, 4, 5, 6, 100, 10**4, 82025, 82026, 82027, 10**6])
def test_nth_prime_small_n_agrees_with_the_sieve(n):
    assert combinatorial.nth_prime(n) == primesieve.nth_prime(n)


def test_nth_prime_random_n_agrees_with_the_sieve():
    rng = random.Random(5)
    for _ in range(25):
        n = log_uniform(rng, 10**5, 2 * 10**8)
        assert combinatorial.nth_prime(n) == primesieve.nth_prime(n), n


@pytest.mark.parametrize("k", range(6, 13))
def test_nth_prime_at_pi_of_powers_of_ten_is_the_largest_prime_below(k):
    n = PI_POWERS_OF_TEN[k]  # OEIS A006880
    p = combinatorial.nth_prime(n)
    assert p <= 10**k and primesieve.count_primes(p + 1, 10**k) == 0
    assert sympy.isprime(p)


def test_nth_prime_inverts_prime_pi():
    rng = random.Random(9)
    for _ in range(10):
        x = log_uniform(rng, 10**9, 10**12)
        n = combinatorial.prime_pi(x)
        assert combinatorial.nth_prime(n) <= x < combinatorial.nth_prime(n + 1)


@pytest.mark.slow
def test_nth_prime_large_n_agrees_with_primecountpy():
    for n in (10**12, 3 * 10**12 + 7, 10**13):
        assert combinatorial.nth_prime(n) == primecount.nth_prime(n)


@pytest.mark.parametrize("n", [0, -1, -10**20])
def test_nth_prime_needs_a_positive_index(n):
    with pytest.raises(InvalidInputError):
        combinatorial.nth_prime(n)


def test_nth_prime_beyond_max_n_is_out_of_reach():
    with pytest.raises(OutOfReachError):
        combinatorial.nth_prime(combinatorial.MAX_N + 1)
    with pytest.raises(OutOfReachError, match="estimated"):
        combinatorial.nth_prime(10**15, time_budget=0.01)


def test_max_n_is_pi_of_max_x():
    assert combinatorial.MAX_N == PI_POWERS_OF_TEN[18]  # OEIS A006880


# --------------------------------------------------------------------------------------
# The stages, each against an independent computation
# --------------------------------------------------------------------------------------

def test_moebius_and_least_prime_factor_tables_agree_with_sympy():
    limit = 3000
    primes = np.array(primesieve.primes(limit), dtype=np.int64)
    lpf, mu = least_prime_factor_and_moebius(limit, primes)
    for n in range(2, limit + 1):
        assert mu[n] == sympy.mobius(n), n
        assert lpf[n] == min(sympy.factorint(n)), n
    assert mu[1] == 1 and lpf[1] > limit
    counts = prime_count_table(limit, primes)
    assert [int(counts[n]) for n in range(0, limit + 1, 97)] == \
        [int(sympy.primepi(n)) for n in range(0, limit + 1, 97)]


@pytest.mark.parametrize("c", range(1, 8))
def test_phi_of_the_first_c_primes_agrees_with_a_direct_count(c):
    primes = [2, 3, 5, 7, 11, 13, 17][:c]
    values = np.array([0, 1, 2, 17, 1000, 30029, 30030, 30031, 510511, 1234567], dtype=np.int64)
    n = np.arange(1, 1234568)
    free = np.ones(n.size, dtype=bool)
    for p in primes:
        free &= n % p != 0
    direct = np.concatenate([[0], np.cumsum(free)])        # direct[v] = phi(v, c)
    assert phi_small(values, c).tolist() == direct[values].tolist()


def test_ordinary_leaves_agree_with_the_definition():
    x, y, c = 10**6, 120, 3
    primes = np.array(primesieve.primes(y), dtype=np.int64)
    lpf, mu = least_prime_factor_and_moebius(y, primes)
    direct = 0
    for n in range(1, y + 1):
        if sympy.mobius(n) and (n == 1 or min(sympy.factorint(n)) > 5):
            direct += sympy.mobius(n) * sum(1 for k in range(1, x // n + 1)
                                            if k % 2 and k % 3 and k % 5)
    assert ordinary_leaves(x, y, c, lpf, mu) == direct


def test_partial_sieve_counts_agree_with_brute_force():
    rng = random.Random(3)
    lo = 4 * SEGMENT_GRANULE
    hi = lo + 8 * SEGMENT_GRANULE
    sieve = PartialSieve(lo, hi, (5,))
    removed = [2, 3, 5]
    for p in [int(p) for p in primesieve.primes(7, 200)]:
        survivors = np.array([n for n in range(lo, hi) if all(n % q for q in removed)])
        queries = np.array(sorted(rng.randrange(lo, hi) for _ in range(200)) + [lo, hi - 1],
                           dtype=np.int64)
        expected = np.searchsorted(survivors, queries, side="right")
        assert np.array_equal(sieve.count_up_to(queries), expected), p
        assert sieve.survivors() == survivors.size
        sieve.remove_multiples(p)
        removed.append(p)


def test_exact_sum_does_not_wrap_around():
    terms = np.full(1000, 2**62, dtype=np.int64)
    assert exact_sum(terms, 2**62) == 1000 * 2**62          # int64 would overflow
    assert exact_sum(-terms, 2**62) == -1000 * 2**62


@pytest.mark.parametrize("n", [10**6, 2**52 - 1, 2**52, 2**53 + 1, 10**18, 2**63 - 1])
def test_floor_quotients_are_exact_on_both_paths(n):
    rng = random.Random(n)
    # Divisors just around n // k make the true quotient sit next to an integer.
    divisors = {1, 2, 3, n, n - 1, max(1, n // 2), max(1, math.isqrt(n))}
    for _ in range(300):
        k = rng.randrange(1, 10**6)
        for d in (n // k - 1, n // k, n // k + 1, rng.randrange(1, n)):
            if 1 <= d <= n:
                divisors.add(d)
    d = np.array(sorted(divisors), dtype=np.int64)
    assert floor_quotients(n, d).tolist() == [n // int(v) for v in d]


def test_flat_ranges_and_chunks():
    index, owner = flat_ranges(np.array([3, 10, 7]), np.array([2, 3, 0]))
    assert index.tolist() == [3, 4, 10, 11, 12] and owner.tolist() == [0, 0, 1, 1, 1]
    assert chunks_by_total(np.array([5, 5, 5, 20, 1]), 10) == [(0, 2), (2, 3), (3, 4), (4, 5)]


@pytest.mark.parametrize("n", [0, 1, 7, 8, 26, 27, 28, 10**18, 2**64 - 1, 10**40, 10**40 - 1])
def test_integer_cube_root_is_exact(n):
    r = integer_cube_root(n)
    assert r**3 <= n < (r + 1) ** 3


def test_y_stays_between_cube_root_and_square_root():
    for x in (8, 10**6, 10**12, 10**18):
        y = choose_y(x, 1000.0)
        assert integer_cube_root(x) <= y <= math.isqrt(x)


def test_riemann_r_agrees_with_mpmath():
    mpmath = pytest.importorskip("mpmath")
    for x in (100.0, 1e6, 1e12, 1e18):
        assert riemann_r(x) == pytest.approx(float(mpmath.riemannr(x)), rel=1e-12)
    assert inverse_riemann_r(riemann_r(1e15)) == pytest.approx(1e15, rel=1e-12)


# --------------------------------------------------------------------------------------
# Both cores: the costly stages in worker processes (forkserver or spawn, never fork)
# --------------------------------------------------------------------------------------

def test_worker_processes_are_never_started_by_plain_fork():
    # After fork() of a process that used primecountpy its thread pool deadlocks.
    assert _parallel._context().get_start_method() in ("forkserver", "spawn")


def test_two_workers_after_primecountpy_ran_in_this_process():
    # primecountpy's threads are running in this process; a forked worker would hang.
    x = 10**13 + 4321
    expected = primecount.prime_pi(x)
    assert combinatorial.prime_pi(x, workers=2) == expected


def test_workers_one_and_two_agree_with_primecountpy_near_powers_of_ten():
    xs = [10**k + d for k in range(6, 14) for d in (-1, 0, 1, 999)]
    for x in xs:
        single = combinatorial.prime_pi(x, workers=1)
        assert combinatorial.prime_pi(x, workers=2) == single == primecount.prime_pi(x), x


def test_workers_one_and_two_agree_with_primecountpy_at_random_x():
    rng = random.Random(2026)
    for _ in range(25):
        x = log_uniform(rng, 10**6, 3 * 10**13)
        single = combinatorial.prime_pi(x, workers=1)
        assert combinatorial.prime_pi(x, workers=2) == single == primecount.prime_pi(x), x


@pytest.mark.parametrize("segment_size", [SEGMENT_GRANULE, 4 * SEGMENT_GRANULE, 64 * SEGMENT_GRANULE])
def test_many_uniform_blocks_join_to_the_single_process_answer(segment_size):
    # Short segments give dozens of hard-leaf blocks whose carried counts must be joined.
    rng = random.Random(segment_size)
    for x in [10**9, 2**33 + 17] + [log_uniform(rng, 10**7, 10**11) for _ in range(4)]:
        expected = prime_pi_deleglise_rivat(x, segment_size=segment_size)
        assert _parallel.prime_pi_in_workers(x, 2, segment_size=segment_size) == expected, x
        assert expected == primecount.prime_pi(x), x


def test_three_workers_give_the_same_answer():
    x = 7 * 10**12 + 12345
    assert combinatorial.prime_pi(x, workers=3) == primecount.prime_pi(x)


@pytest.mark.parametrize("n", [13, 14])
def test_two_workers_at_powers_of_ten_match_oeis_a006880(n):
    assert combinatorial.prime_pi(10**n, workers=2) == PI_POWERS_OF_TEN[n]  # OEIS A006880


@pytest.mark.slow
@pytest.mark.parametrize("n", [15, 16])
def test_two_workers_at_larger_powers_of_ten_match_oeis_a006880(n):
    assert combinatorial.prime_pi(10**n, workers=2) == PI_POWERS_OF_TEN[n]  # OEIS A006880


@pytest.mark.slow
def test_workers_one_and_two_agree_with_primecountpy_at_random_x_up_to_10_to_15():
    rng = random.Random(15)
    for _ in range(6):
        x = log_uniform(rng, 10**14, 10**15)
        single = combinatorial.prime_pi(x, workers=1)
        assert combinatorial.prime_pi(x, workers=2) == single == primecount.prime_pi(x), x


def test_default_workers_use_the_cores_only_for_large_x():
    assert _parallel.default_workers(combinatorial.MIN_PARALLEL_X - 1) == 1
    assert _parallel.default_workers(combinatorial.MIN_PARALLEL_X) == _parallel.available_cores()


@pytest.mark.parametrize("bad", [0, -1, 1.5, "2", True])
def test_bad_worker_counts_are_refused(bad):
    with pytest.raises(InvalidInputError, match="workers"):
        combinatorial.prime_pi(10**12, workers=bad)


def test_progress_with_two_workers_is_ordered_and_ends_with_done():
    calls = []
    x = 2 * 10**14 + 77
    value = combinatorial.prime_pi(x, workers=2, progress=lambda f, s: calls.append((f, s)))
    assert value == primecount.prime_pi(x)
    fractions = [f for f, _ in calls]
    assert len(calls) >= 2 and calls[-1] == (1.0, "done")
    assert fractions == sorted(fractions) and all(0.0 <= f <= 1.0 for f in fractions)
    assert any("blocks left" in s for _, s in calls)


def test_time_budget_stops_the_workers_and_the_next_run_still_works(monkeypatch):
    # The cost model would refuse 10**16 with a 0.5 s budget before starting; silence it
    # so the run starts and must be stopped by the clock while the workers compute.
    monkeypatch.setattr(_prime_pi, "estimated_seconds", lambda x: 0.0)
    assert combinatorial.prime_pi(10**13 + 1, workers=2) == primecount.prime_pi(10**13 + 1)
    assert _parallel._pool is not None                    # a pool is running
    with pytest.raises(OutOfReachError, match="over the time budget"):
        combinatorial.prime_pi(10**16, time_budget=0.5, workers=2)
    assert _parallel._pool is None                        # the workers were terminated
    x = 10**13 + 99
    assert combinatorial.prime_pi(x, workers=2) == primecount.prime_pi(x)


def test_a_script_without_the_main_guard_still_finishes(tmp_path):
    # spawn/forkserver children re-run the script's top level; they must not start workers
    # of their own (multiprocessing would refuse, and the pool would restart them for ever).
    import os
    import subprocess
    import sys

    x = 10**13 + 7
    script = tmp_path / "unguarded.py"
    script.write_text("import oracle.exact.combinatorial as c\n"
                      f"print(c.prime_pi({x}, workers=2))\n")
    environment = dict(os.environ, PYTHONPATH=os.pathsep.join(sys.path))
    done = subprocess.run([sys.executable, str(script)], capture_output=True, text=True,
                          timeout=300, env=environment)
    assert done.returncode == 0, done.stderr[-2000:]
    assert "RuntimeError" not in done.stderr
    # The children print too, and their writes may interleave with the parent's without a
    # newline between them: the output must be the right value, once or several times over.
    expected = str(primecount.prime_pi(x))
    assert re.fullmatch(f"(?:{expected}\\s*)+", done.stdout), done.stdout
