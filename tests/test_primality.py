"""Tests of oracle.exact.primality against references outside the project.

References: a local sieve of Eratosthenes; sympy and python-flint as test-only
libraries (``flint.fmpz(n).is_prime()`` is a proven test); published tables
(OEIS) named beside each list; and an independent pure-Python strong
(Miller--Rabin) test and strong Lucas test written here from their
definitions, so that gmpy2's routines are cross-checked by other code.
"""

from __future__ import annotations

import bisect
import math
import random

import numpy as np
import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from oracle._errors import InvalidInputError, OracleError
from oracle.exact import primality
from _references import flint, reference, sympy

sympy_primetest = reference("sympy.ntheory.primetest", "sympy")

SIEVE_LIMIT = 10**5


# --------------------------------------------------------------------------
# Independent references written from the definitions
# --------------------------------------------------------------------------

def sieve_of_eratosthenes(limit: int) -> list[bool]:
    """flags[n] is True iff n is prime, for 0 <= n < limit."""
    flags = [True] * limit
    flags[0] = flags[1] = False
    for p in range(2, math.isqrt(limit - 1) + 1):
        if flags[p]:
            flags[p * p::p] = [False] * len(range(p * p, limit, p))
    return flags


PRIME_FLAGS = sieve_of_eratosthenes(SIEVE_LIMIT)


def is_strong_probable_prime(n: int, base: int) -> bool:
    """Strong test of odd n > 2 to ``base``: n-1 = d*2^s, a^d = 1 or a^(d*2^r) = -1."""
    d, s = n - 1, 0
    while d % 2 == 0:
        d //= 2
        s += 1
    x = pow(base, d, n)
    if x in (1, n - 1):
        return True
    for _ in range(s - 1):
        x = x * x % n
        if x == n - 1:
            return True
    return False


def jacobi_symbol(a: int, n: int) -> int:
    """Jacobi symbol (a/n) for odd n > 0, by quadratic reciprocity."""
    a %= n
    result = 1
    while a:
        while a % 2 == 0:
            a //= 2
            if n % 8 in (3, 5):
                result = -result
        a, n = n, a
        if a % 4 == 3 and n % 4 == 3:
            result = -result
        a %= n
    return result if n == 1 else 0


def selfridge_parameters(n: int) -> tuple[int, int, int] | None:
    """(D, P, Q) by Selfridge's method A, or None when some (D/n) = 0 shows n composite."""
    d = 5
    while True:
        symbol = jacobi_symbol(d, n)
        if symbol == -1:
            return d, 1, (1 - d) // 4
        if symbol == 0 and abs(d) != n:
            return None
        d = -d - 2 if d > 0 else -d + 2


def lucas_sequences(p: int, q: int, k: int, n: int) -> tuple[int, int, int]:
    """(U_k, V_k, Q^k) mod n for odd n, by binary doubling and the +1 step."""
    d = p * p - 4 * q
    u, v, q_power = 0, 2 % n, 1
    half = (n + 1) // 2  # inverse of 2 modulo odd n
    for bit in bin(k)[2:]:
        u, v, q_power = u * v % n, (v * v - 2 * q_power) % n, q_power * q_power % n
        if bit == "1":
            u, v = (p * u + v) * half % n, (d * u + p * v) * half % n
            q_power = q_power * q % n
    return u, v, q_power


def is_strong_lucas_probable_prime(n: int) -> bool:
    """Strong Lucas test, Selfridge parameters (Baillie & Wagstaff 1980, Math. Comp. 35).

    n + 1 = d * 2^s with d odd: U_d = 0, or V_{d 2^r} = 0 for some 0 <= r < s.
    """
    if math.isqrt(n) ** 2 == n:
        return False
    parameters = selfridge_parameters(n)
    if parameters is None:
        return False
    _, p, q = parameters
    d, s = n + 1, 0
    while d % 2 == 0:
        d //= 2
        s += 1
    u, v, q_power = lucas_sequences(p, q, d, n)
    if u == 0 or v == 0:
        return True
    for _ in range(s - 1):
        v, q_power = (v * v - 2 * q_power) % n, q_power * q_power % n
        if v == 0:
            return True
    return False


def first_primes(count: int) -> list[int]:
    return [p for p in range(2, 200) if PRIME_FLAGS[p]][:count]


# --------------------------------------------------------------------------
# Published tables (each list with its source)
# --------------------------------------------------------------------------

# OEIS A014233: smallest odd number that is a strong pseudoprime to all of the
# first k prime bases, k = 1..13 (Sorenson & Webster 2017 for k = 12, 13).
A014233 = [2047, 1373653, 25326001, 3215031751, 2152302898747, 3474749660383,
           341550071728321, 341550071728321, 3825123056546413051,
           3825123056546413051, 3825123056546413051, 318665857834031151167461,
           3317044064679887385961981]

# OEIS A002997: Carmichael numbers, first 20 terms (from memory; each is
# re-verified below by Korselt's criterion with sympy.factorint).
A002997 = [561, 1105, 1729, 2465, 2821, 6601, 8911, 10585, 15841, 29341, 41041,
           46657, 52633, 62745, 63973, 75361, 101101, 115921, 126217, 162401]

# OEIS A217255: strong Lucas pseudoprimes (Selfridge parameters), first 34 terms.
A217255 = [5459, 5777, 10877, 16109, 18971, 22499, 24569, 25199, 40309, 58519,
           75077, 97439, 100127, 113573, 115639, 130139, 155819, 158399, 161027,
           162133, 176399, 176471, 189419, 192509, 197801, 224369, 230691,
           231703, 243629, 253259, 268349, 288919, 313499, 324899]

# OEIS A217120: Lucas pseudoprimes (Selfridge parameters), first 10 terms.
A217120 = [323, 377, 1159, 1829, 3827, 5459, 5777, 9071, 9179, 10877]

# OEIS A001262: strong pseudoprimes to base 2, first 12 terms (from memory;
# checked below by the strong test and by exhaustive search).
A001262 = [2047, 3277, 4033, 4681, 8321, 15841, 29341, 42799, 49141, 52633,
           65281, 74665]

# OEIS A000043: Mersenne exponents (2**p - 1 prime), first 12 terms.
A000043 = [2, 3, 5, 7, 13, 17, 19, 31, 61, 89, 107, 127]


# --------------------------------------------------------------------------
# Exhaustive and table checks
# --------------------------------------------------------------------------

def test_is_prime_matches_sieve_below_10_to_5():
    got = [primality.is_prime(n) for n in range(SIEVE_LIMIT)]
    assert got == PRIME_FLAGS


def test_is_prime_batch_matches_sieve_below_10_to_5():
    values = np.arange(SIEVE_LIMIT, dtype=np.uint64)
    assert primality.is_prime_batch(values).tolist() == PRIME_FLAGS
    assert primality.is_prime_batch(list(range(SIEVE_LIMIT))).tolist() == PRIME_FLAGS


def test_next_and_prev_prime_match_sieve_below_10_to_5():
    primes = [n for n, flag in enumerate(PRIME_FLAGS) if flag]
    for n in range(primes[-1]):
        assert primality.next_prime(n) == primes[bisect.bisect_right(primes, n)], n
    for n in range(3, SIEVE_LIMIT):
        assert primality.prev_prime(n) == primes[bisect.bisect_left(primes, n) - 1], n


def test_first_prime_bases_match_published_table():
    assert list(primality.MR_BASES) == first_primes(12)
    assert primality.DETERMINISTIC_LIMIT == A014233[11]
    assert primality.DETERMINISTIC_LIMIT == 318665857834031151167461


@pytest.mark.parametrize("k", range(1, 14))
def test_a014233_terms_are_composite_strong_pseudoprimes(k):
    n = A014233[k - 1]
    assert not primality.is_prime(n)
    assert not sympy.isprime(n)
    assert not flint.fmpz(n).is_prime()
    assert all(is_strong_probable_prime(n, a) for a in first_primes(k))


def test_smallest_strong_pseudoprime_to_base_2_is_2047():
    # A014233(1) = 2047 is the least: no odd composite below it passes base 2.
    liars = [n for n in range(3, 2048, 2)
             if not PRIME_FLAGS[n] and is_strong_probable_prime(n, 2)]
    assert liars == [2047]


def test_a001262_is_every_strong_base_2_pseudoprime_up_to_its_12th_term():
    found = [n for n in range(3, A001262[-1] + 1, 2)
             if not PRIME_FLAGS[n] and is_strong_probable_prime(n, 2)]
    assert found == A001262
    assert not any(primality.is_prime(n) for n in A001262)


@pytest.mark.parametrize("n", A002997)
def test_carmichael_numbers_are_composite(n):
    factors = sympy.factorint(n)
    # Korselt's criterion: squarefree, at least two primes, p - 1 | n - 1.
    assert len(factors) >= 2 and set(factors.values()) == {1}
    assert all((n - 1) % (p - 1) == 0 for p in factors)
    assert not primality.is_prime(n)


def test_strong_lucas_pseudoprimes_are_rejected():
    for n in A217255:
        assert is_strong_lucas_probable_prime(n), n
        assert primality._passes_strong_lucas_test(n), n
        assert not primality.is_prime(n), n


def test_lucas_pseudoprimes_are_rejected():
    for n in A217120:
        assert not PRIME_FLAGS[n]
        assert sympy_primetest.is_lucas_prp(n), n
        assert not primality.is_prime(n), n


def test_reference_strong_lucas_finds_a217255_below_10_to_5():
    found = [n for n in range(3, SIEVE_LIMIT, 2)
             if not PRIME_FLAGS[n] and is_strong_lucas_probable_prime(n)]
    assert found == [n for n in A217255 if n < SIEVE_LIMIT]


def test_gmpy2_strong_lucas_agrees_with_reference_below_10_to_5():
    # Odd n > 53**2 with no factor up to 53: the domain where the module calls it.
    for n in range(53**2 + 2, SIEVE_LIMIT, 2):
        if math.gcd(n, math.prod(first_primes(16))) == 1:
            assert primality._passes_strong_lucas_test(n) == is_strong_lucas_probable_prime(n), n


def test_gmpy2_strong_lucas_agrees_with_references_on_large_numbers():
    rng = random.Random(20261201)
    small_product = math.prod(first_primes(16))
    checked = 0
    while checked < 300:
        bits = rng.randrange(70, 400)
        n = rng.getrandbits(bits) | 1 | (1 << (bits - 1))
        if checked % 3 == 0:
            n = int(sympy.nextprime(n))
        if math.gcd(n, small_product) != 1:
            continue
        expected = is_strong_lucas_probable_prime(n)
        assert primality._passes_strong_lucas_test(n) == expected, n
        assert sympy_primetest.is_strong_lucas_prp(n) == expected, n
        checked += 1


# --------------------------------------------------------------------------
# Known primes and composites at critical places
# --------------------------------------------------------------------------

def test_largest_and_smallest_primes_around_2_to_32():
    # From memory: 2**32 - 5 and 2**32 + 15; cross-checked with sympy.
    assert primality.prev_prime(2**32) == 2**32 - 5 == sympy.prevprime(2**32)
    assert primality.next_prime(2**32) == 2**32 + 15 == sympy.nextprime(2**32)


def test_largest_prime_below_2_to_64():
    # 2**64 - 59 (from memory); cross-checked with sympy and flint.
    assert primality.prev_prime(2**64) == 2**64 - 59 == sympy.prevprime(2**64)
    assert flint.fmpz(2**64 - 59).is_prime()
    assert primality.next_prime(2**64) == sympy.nextprime(2**64)
    assert primality.is_prime(2**64 - 59)


@pytest.mark.parametrize("centre", [2**32, 2**53, 2**63, 2**64, 10**18, 10**19])
def test_window_around_critical_points_matches_flint(centre):
    window = range(centre - 300, centre + 300)
    expected = [bool(flint.fmpz(n).is_prime()) for n in window]
    assert [primality.is_prime(n) for n in window] == expected
    assert primality.is_prime_batch(list(window)).tolist() == expected


@pytest.mark.parametrize("exponent", A000043)
def test_mersenne_primes(exponent):
    n = 2**exponent - 1
    assert primality.is_prime(n)
    expected_verdict = "deterministic" if n < A014233[11] else "probable"
    assert primality.verdict(n) == expected_verdict


def test_mersenne_composites_with_prime_exponent():
    # 2**67 - 1 = 193707721 * 761838257287 (Cole 1903; from memory, product checked).
    assert 193707721 * 761838257287 == 2**67 - 1
    for exponent in (11, 23, 29, 37, 41, 43, 47, 53, 59, 67, 71, 73, 79, 83, 97, 101, 103, 109, 113):
        n = 2**exponent - 1
        assert not flint.fmpz(n).is_prime()
        assert not primality.is_prime(n), exponent


def test_both_sides_of_deterministic_limit_match_flint():
    limit = primality.DETERMINISTIC_LIMIT
    window = range(limit - 500, limit + 500)
    assert [primality.is_prime(n) for n in window] == [bool(flint.fmpz(n).is_prime()) for n in window]
    below = primality.prev_prime(limit)
    above = primality.next_prime(limit)
    assert below == sympy.prevprime(limit) and above == sympy.nextprime(limit)
    assert primality.verdict(below) == "deterministic"
    assert primality.verdict(above) == "probable"


def test_verdict_at_the_boundary():
    limit = primality.DETERMINISTIC_LIMIT
    assert primality.verdict(0) == "deterministic"
    assert primality.verdict(limit - 1) == "deterministic"
    assert primality.verdict(limit) == "probable"
    assert primality.verdict(limit + 1) == "probable"
    assert primality.verdict(2**4000) == "probable"


def test_limit_itself_is_rejected_by_baillie_psw():
    # psi_12 passes the strong test to the 12 bases, so only Baillie--PSW can reject it.
    limit = primality.DETERMINISTIC_LIMIT
    assert all(is_strong_probable_prime(limit, a) for a in primality.MR_BASES)
    assert not primality.is_prime(limit)


def test_squares_of_primes_are_composite():
    for p in (59, 61, 65521, 2**31 - 1, 4294967291, 2**61 - 1, 2**89 - 1):
        assert not primality.is_prime(p * p)
        assert not primality.is_prime(p * p * p)


def test_random_numbers_of_many_sizes_match_sympy_and_flint():
    rng = random.Random(1201)
    for _ in range(2000):
        bits = rng.randrange(2, 300)
        n = rng.getrandbits(bits)
        expected = bool(flint.fmpz(n).is_prime())
        assert primality.is_prime(n) == expected, n
        assert sympy.isprime(n) == expected, n


def test_random_primes_and_semiprimes_match_flint():
    rng = random.Random(64)
    for _ in range(200):
        bits = rng.randrange(20, 120)
        p = int(sympy.nextprime(rng.getrandbits(bits)))
        q = int(sympy.nextprime(p + rng.randrange(1, 1000)))
        assert primality.is_prime(p)
        assert not primality.is_prime(p * q)
        assert not primality.is_prime(p * (2 * p - 1))


@settings(max_examples=200, deadline=None)
@given(st.integers(min_value=0, max_value=2**90))
def test_next_prime_is_the_next_prime(n):
    assert primality.next_prime(n) == sympy.nextprime(n)


@settings(max_examples=200, deadline=None)
@given(st.integers(min_value=3, max_value=2**90))
def test_prev_prime_is_the_previous_prime(n):
    assert primality.prev_prime(n) == sympy.prevprime(n)


# --------------------------------------------------------------------------
# Batch interface
# --------------------------------------------------------------------------

def test_batch_of_random_64_bit_values_matches_scalar_and_flint():
    generator = np.random.default_rng(7)
    values = generator.integers(0, 2**64, size=3000, dtype=np.uint64) | np.uint64(1)
    got = primality.is_prime_batch(values)
    assert got.dtype == bool and got.shape == values.shape
    assert got.tolist() == [bool(flint.fmpz(int(v)).is_prime()) for v in values]


@pytest.mark.parametrize("dtype", [np.uint8, np.uint16, np.uint32, np.uint64,
                                   np.int8, np.int16, np.int32, np.int64])
def test_batch_accepts_integer_dtypes(dtype):
    values = np.arange(0, 120, dtype=dtype)
    assert primality.is_prime_batch(values).tolist() == PRIME_FLAGS[:120]


def test_batch_keeps_shape_and_handles_empty_and_big_ints():
    grid = np.arange(100, dtype=np.int64).reshape(10, 10)
    assert primality.is_prime_batch(grid).shape == (10, 10)
    assert primality.is_prime_batch(grid).ravel().tolist() == PRIME_FLAGS[:100]
    assert primality.is_prime_batch(np.array([], dtype=np.uint64)).shape == (0,)
    assert primality.is_prime_batch([]).shape == (0,)
    big = [2**127 - 1, 2**128 + 1, A014233[12], 2**89 - 1]
    assert primality.is_prime_batch(big).tolist() == [True, False, False, True]
    assert primality.is_prime_batch(np.array(big, dtype=object)).tolist() == [True, False, False, True]


# --------------------------------------------------------------------------
# Bad input
# --------------------------------------------------------------------------

@pytest.mark.parametrize("function", [primality.is_prime, primality.verdict,
                                      primality.next_prime, primality.prev_prime])
@pytest.mark.parametrize("bad", [True, False, 7.0, "7", None, -1, 2**20000],
                         ids=["True", "False", "float", "str", "None", "negative", "absurd_size"])
def test_bad_scalar_input_is_refused(function, bad):
    with pytest.raises(InvalidInputError):
        function(bad)


@pytest.mark.parametrize("n", [0, 1, 2])
def test_prev_prime_needs_n_at_least_3(n):
    with pytest.raises(InvalidInputError, match="n=.*>= 3"):
        primality.prev_prime(n)


@pytest.mark.parametrize("bad", [np.array([3.0, 5.0]), np.array([True, False]),
                                 np.array([5, -3], dtype=np.int64), [5, 7.0], [5, True],
                                 [5, -7], ["11"]])
def test_bad_batch_input_is_refused(bad):
    with pytest.raises(InvalidInputError):
        primality.is_prime_batch(bad)


def test_errors_are_value_errors_of_one_family():
    with pytest.raises(OracleError):
        primality.is_prime(-5)
    with pytest.raises(ValueError):
        primality.is_prime(1.5)


def test_numpy_and_gmpy2_integers_are_accepted():
    import gmpy2
    assert primality.is_prime(np.uint64(2**64 - 59))
    assert primality.is_prime(gmpy2.mpz(2**61 - 1))
    assert primality.next_prime(np.int32(13)) == 17


# --------------------------------------------------------------------------
# Slow cross-checks against primesieve (test-only reference)
# --------------------------------------------------------------------------

@pytest.mark.slow
def test_batch_matches_primesieve_below_10_to_7():
    import primesieve
    limit = 10**7
    expected = np.zeros(limit, dtype=bool)
    expected[np.array(primesieve.primes(limit - 1), dtype=np.int64)] = True
    assert np.array_equal(primality.is_prime_batch(np.arange(limit, dtype=np.uint64)), expected)


@pytest.mark.slow
@pytest.mark.parametrize("start", [10**18, 2**63 - 10**6, 2**64 - 10**6])
def test_batch_matches_primesieve_on_a_million_values_near_2_to_64(start):
    import primesieve
    stop = min(start + 10**6, 2**64 - 1)
    values = np.arange(start, stop, dtype=np.uint64)
    expected = np.isin(values, np.array(primesieve.primes(start, stop - 1), dtype=np.uint64))
    assert np.array_equal(primality.is_prime_batch(values), expected)
