"""Tests of oracle.adversarial: every family checked by its defining property.

References: sympy (test-only: ``mr`` strong test, ``is_lucas_prp``,
``is_strong_lucas_prp``, ``factorint``, ``isprime``, ``integer_nthroot``), a
Fibonacci-by-doubling written here, and published OEIS first terms copied
here independently of the module's own constants.
"""

from __future__ import annotations

import dataclasses
import math
import random

import pytest
import sympy
from sympy.ntheory import primetest as sympy_primetest

from oracle import adversarial
from oracle._errors import InvalidInputError
from oracle.exact import primality

# --------------------------------------------------------------------------
# Published first terms (copied here, not imported from the modules)
# --------------------------------------------------------------------------

# OEIS A001262: strong pseudoprimes to base 2 (from memory).
A001262 = [2047, 3277, 4033, 4681, 8321, 15841, 29341, 42799, 49141, 52633, 65281, 74665]
# OEIS A014233 (as in tests/test_primality.py).
A014233 = [2047, 1373653, 25326001, 3215031751, 2152302898747, 3474749660383,
           341550071728321, 341550071728321, 3825123056546413051,
           3825123056546413051, 3825123056546413051, 318665857834031151167461,
           3317044064679887385961981]
# OEIS A074773: strong pseudoprimes to bases 2, 3, 5, 7, first 4 terms.
A074773 = [3215031751, 118670087467, 307768373641, 315962312077]
# OEIS A002997: Carmichael numbers, first 16 terms (from memory).
A002997 = [561, 1105, 1729, 2465, 2821, 6601, 8911, 10585, 15841, 29341, 41041,
           46657, 52633, 62745, 63973, 75361]
# OEIS A033502: Chernick's Carmichael numbers (6k+1)(12k+1)(18k+1), first 5 (from memory).
A033502 = [1729, 294409, 56052361, 118901521, 172947529]
# OEIS A217120: Lucas pseudoprimes, Selfridge parameters, first 10 terms.
A217120 = [323, 377, 1159, 1829, 3827, 5459, 5777, 9071, 9179, 10877]
# OEIS A217255: strong Lucas pseudoprimes, Selfridge parameters, first 12 terms.
A217255 = [5459, 5777, 10877, 16109, 18971, 22499, 24569, 25199, 40309, 58519, 75077, 97439]
# OEIS A081264: odd Fibonacci pseudoprimes, first 15 terms.
A081264 = [323, 377, 1891, 3827, 4181, 5777, 6601, 6721, 8149, 10877, 11663,
           13201, 13981, 15251, 17119]
# OEIS A003586: 3-smooth numbers, first 30 terms (from memory; re-checked by factorint).
A003586 = [1, 2, 3, 4, 6, 8, 9, 12, 16, 18, 24, 27, 32, 36, 48, 54, 64, 72, 81,
           96, 108, 128, 144, 162, 192, 216, 243, 256, 288, 324]
# OEIS A002473: 7-smooth numbers, first 30 terms (from memory; re-checked by factorint).
A002473 = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 12, 14, 15, 16, 18, 20, 21, 24, 25, 27,
           28, 30, 32, 35, 36, 40, 42, 45, 48, 49]

FIRST_12_PRIMES = [2, 3, 5, 7, 11, 13, 17, 19, 23, 29, 31, 37]
FIRST_13_PRIMES = [*FIRST_12_PRIMES, 41]


def passes_strong_test(n: int, bases) -> bool:
    return all(sympy_primetest.mr(n, [base]) for base in bases)


def is_korselt(n: int) -> bool:
    factors = sympy.factorint(n)
    return (len(factors) >= 2 and set(factors.values()) == {1}
            and all((n - 1) % (p - 1) == 0 for p in factors))


def fibonacci_mod(k: int, n: int) -> int:
    """F_k mod n by fast doubling: F_2m = F_m (2 F_{m+1} - F_m), F_{2m+1} = F_m^2 + F_{m+1}^2."""
    a, b = 0, 1
    for bit in bin(k)[2:]:
        a, b = a * (2 * b - a) % n, (a * a + b * b) % n
        if bit == "1":
            a, b = b, (a + b) % n
    return a


def is_fibonacci_pseudoprime(n: int) -> bool:
    symbol = sympy.jacobi_symbol(5, n)
    return (n % 2 == 1 and n % 5 != 0 and not sympy.isprime(n)
            and fibonacci_mod(n - symbol, n) == 0)


# --------------------------------------------------------------------------
# Strong pseudoprimes
# --------------------------------------------------------------------------

def test_search_finds_a001262():
    assert adversarial.strong_pseudoprimes_below(A001262[-1] + 1) == A001262


def test_search_finds_least_strong_pseudoprime_to_bases_2_and_3():
    assert adversarial.strong_pseudoprimes_below(A014233[1] + 1, (2, 3)) == [A014233[1]]


@pytest.mark.slow
def test_search_finds_least_strong_pseudoprime_to_bases_2_3_5():
    assert adversarial.strong_pseudoprimes_below(A014233[2] + 1, (2, 3, 5)) == [A014233[2]]


def test_published_tables_have_the_defining_property():
    for k, n in enumerate(adversarial.LEAST_STRONG_PSEUDOPRIMES_FIRST_PRIME_BASES, start=1):
        assert n == A014233[k - 1]
        assert not sympy.isprime(n) and passes_strong_test(n, FIRST_13_PRIMES[:k])
    for n in adversarial.STRONG_PSEUDOPRIMES_BASES_2_3_5_7:
        assert not sympy.isprime(n) and passes_strong_test(n, (2, 3, 5, 7))
    assert list(adversarial.STRONG_PSEUDOPRIMES_BASES_2_3_5_7[:4]) == A074773
    assert list(adversarial.STRONG_PSEUDOPRIMES_BASE_2[:12]) == A001262
    for p in adversarial.WIEFERICH_PRIMES:      # OEIS A001220
        assert sympy.isprime(p) and pow(2, p - 1, p * p) == 1
        assert passes_strong_test(p * p, (2,))


# Least strong pseudoprimes to the base sets published as deterministic below a bound
# (G. Jaeschke 1993, Math. Comp. 61; the last from the Prime Pages), copied here from memory,
# independently of the module's constants.
LEAST_SPSP_OF_BASE_SETS = {(31, 73): 9080191, (2, 7, 61): 4759123141,
                           (2, 13, 23, 1662803): 1122004669633,
                           (2, 3, 7, 61, 24251): 46856248255981}


def test_least_pseudoprimes_of_deterministic_base_sets_have_the_defining_property():
    assert adversarial.LEAST_STRONG_PSEUDOPRIMES_OF_BASE_SETS == LEAST_SPSP_OF_BASE_SETS
    published = {bases: bound for bases, bound in adversarial.DETERMINISTIC_BASE_SETS}
    for bases, n in LEAST_SPSP_OF_BASE_SETS.items():
        assert not sympy.isprime(n) and passes_strong_test(n, bases)     # sympy's strong test
        assert len(sympy.factorint(n)) == 2
        assert n >= published[bases] or bases == (2, 3, 7, 61, 24251)   # the one exception


@pytest.mark.slow
def test_search_finds_least_strong_pseudoprime_to_bases_31_and_73():
    assert adversarial.strong_pseudoprimes_below(9080191 + 1, (31, 73)) == [9080191]


@pytest.mark.slow
def test_least_pseudoprimes_without_small_factors_by_exhaustive_search():
    found = {}
    for (bases, limit), n in adversarial.STRONG_PSEUDOPRIMES_WITHOUT_SMALL_FACTORS.items():
        # the defining test written out here (sympy's strong test), odd n from 9 on
        least = next(m for m in range(9, n + 1, 2) if passes_strong_test(m, bases)
                     and not sympy.isprime(m) and min(sympy.factorint(m)) > limit)
        found[(bases, limit)] = least
    assert found == {((2, 3), 1000): 2284453}       # 2284453 = 1069 * 2137 (sympy)


def test_base_divisor_primes_are_the_primes_dividing_the_published_bases():
    expected = set()
    for bases, _bound in adversarial.DETERMINISTIC_BASE_SETS:
        for base in bases:
            expected.update(sympy.factorint(base))
    found = adversarial.base_divisor_primes()
    assert found == sorted(expected)
    # the seven-base set for n < 2**64: 9780504 = 2**3 * 3 * 407521, 1795265022 = 2 * 3 * 299210837
    assert {407521, 299210837, 73, 193} <= set(found)
    for p, base in ((407521, 9780504), (299210837, 1795265022)):
        # the base is 0 mod p, so a**d = 0 (mod p): an unskipped base calls the prime p composite
        assert sympy.isprime(p) and pow(base, p - 1, p) == 0


def _strong_to_base_2(n: int) -> bool:
    """The defining test, written out here (independent of the library's search)."""
    d, s = n - 1, 0
    while d % 2 == 0:
        d, s = d // 2, s + 1
    x = pow(2, d, n)
    if x in (1, n - 1):
        return True
    for _ in range(s - 1):
        x = x * x % n
        if x == n - 1:
            return True
    return False


def test_the_base_2_table_is_every_strong_pseudoprime_below_its_end():
    # OEIS A001262: complete below 2 * 10**6 by an exhaustive search with the test above
    found = [n for n in range(9, 2 * 10**6, 2) if _strong_to_base_2(n) and not sympy.isprime(n)]
    assert list(adversarial.STRONG_PSEUDOPRIMES_BASE_2) == found
    assert 1093**2 in found                      # a Wieferich square (OEIS A001220)


@pytest.mark.parametrize("bases", [(2,), (3, 5), (2, 3, 5, 7), tuple(FIRST_12_PRIMES)])
def test_constructed_strong_pseudoprimes_fool_the_bases(bases):
    found = adversarial.constructed_strong_pseudoprimes(bases, 3)
    assert len(found) == 3 and found == sorted(set(found))
    for n in found:
        assert not sympy.isprime(n)
        assert passes_strong_test(n, bases)
        assert not primality.is_prime(n)


def test_constructed_strong_pseudoprimes_to_all_primes_below_100():
    bases = list(sympy.primerange(2, 100))
    (n,) = adversarial.constructed_strong_pseudoprimes(bases, 1)
    assert n > primality.DETERMINISTIC_LIMIT
    assert passes_strong_test(n, bases)
    assert not sympy.isprime(n)
    assert not primality.is_prime(n)  # Baillie--PSW rejects what 25 bases accept


def test_constructed_strong_pseudoprimes_are_deterministic_and_accept_multipliers():
    first = adversarial.constructed_strong_pseudoprimes((2, 3, 5), 2)
    assert adversarial.constructed_strong_pseudoprimes((2, 3, 5), 2) == first
    chosen = adversarial.constructed_strong_pseudoprimes((2,), 2, multipliers=(5, 13))
    for n in chosen:
        assert passes_strong_test(n, (2,)) and not sympy.isprime(n)


@pytest.mark.parametrize("arguments", [((4,), 1), ((), 1), ((2,), -1), ((2.0,), 1)])
def test_constructed_strong_pseudoprimes_refuse_bad_arguments(arguments):
    with pytest.raises(InvalidInputError):
        adversarial.constructed_strong_pseudoprimes(*arguments)


def test_constructed_strong_pseudoprimes_refuse_bad_multipliers():
    with pytest.raises(InvalidInputError):
        adversarial.constructed_strong_pseudoprimes((2,), 1, multipliers=(9, 13))
    with pytest.raises(InvalidInputError):
        adversarial.constructed_strong_pseudoprimes((2, 3), 1, multipliers=(3, 13))


# --------------------------------------------------------------------------
# Carmichael numbers
# --------------------------------------------------------------------------

def test_carmichael_search_matches_a002997():
    assert adversarial.carmichael_numbers_below(A002997[-1] + 1) == A002997
    assert list(adversarial.CARMICHAEL_NUMBERS[:len(A002997)]) == A002997


def test_carmichael_search_output_satisfies_korselt():
    found = adversarial.carmichael_numbers_below(520_000)  # the constant lists all below 520,000
    assert found == list(adversarial.CARMICHAEL_NUMBERS)
    assert all(is_korselt(n) for n in found)


def test_chernick_numbers():
    found = adversarial.chernick_carmichael_numbers(10)
    assert found[:len(A033502)] == A033502
    assert found == list(adversarial.CHERNICK_CARMICHAEL_NUMBERS)
    for n in found:
        assert is_korselt(n)
        assert len(sympy.factorint(n)) == 3
        assert not primality.is_prime(n)


def test_large_chernick_numbers_are_carmichael():
    for n in adversarial.chernick_carmichael_numbers(3, start=10**6):
        factors = sympy.factorint(n)
        assert len(factors) == 3 and is_korselt(n)
        assert pow(2, n - 1, n) == 1 and not primality.is_prime(n)


# --------------------------------------------------------------------------
# Lucas-type pseudoprimes
# --------------------------------------------------------------------------

def test_lucas_pseudoprime_search_matches_a217120():
    found = adversarial.lucas_pseudoprimes_below(A217120[-1] + 1)
    assert found == A217120
    assert all(sympy_primetest.is_lucas_prp(n) and not sympy.isprime(n) for n in found)


def test_strong_lucas_pseudoprime_search_matches_a217255():
    found = adversarial.strong_lucas_pseudoprimes_below(10**5)
    assert found == A217255
    assert all(sympy_primetest.is_strong_lucas_prp(n) and not sympy.isprime(n) for n in found)


def test_strong_lucas_pseudoprimes_are_lucas_pseudoprimes():
    lucas = set(adversarial.lucas_pseudoprimes_below(10**5))
    assert set(adversarial.strong_lucas_pseudoprimes_below(10**5)) <= lucas


def test_fibonacci_pseudoprime_search_matches_a081264_and_the_definition():
    limit = 20_000
    found = adversarial.fibonacci_pseudoprimes_below(limit)
    assert found[:len(A081264)] == A081264
    assert found == [n for n in range(3, limit, 2) if is_fibonacci_pseudoprime(n)]


# OEIS A013998, Perrin pseudoprimes, first 6 terms (from memory, copied independently).
A013998 = [271441, 904631, 16532714, 24658561, 27422714, 27664033]


def perrin_mod(n: int) -> int:
    """P(n) mod n by the recurrence's 3x3 companion matrix raised to the n-th power."""
    def times(a, b):
        return [[sum(a[i][k] * b[k][j] for k in range(3)) % n for j in range(3)] for i in range(3)]
    power, result, e = [[0, 1, 1], [1, 0, 0], [0, 1, 0]], [[1, 0, 0], [0, 1, 0], [0, 0, 1]], n
    while e:
        if e & 1:
            result = times(result, power)
        power, e = times(power, power), e >> 1
    # (P(n + 2), P(n + 1), P(n)) = M**n (P(2), P(1), P(0)) = M**n (2, 0, 3)
    return (result[2][0] * 2 + result[2][2] * 3) % n


def test_perrin_pseudoprimes_have_the_defining_property():
    assert list(adversarial.PERRIN_PSEUDOPRIMES[:6]) == A013998
    assert all(perrin_mod(p) == 0 for p in sympy.primerange(2, 2000))   # p | P(p) for primes
    assert [n for n in range(2, 3000) if perrin_mod(n) == 0 and not sympy.isprime(n)] == []
    for n in adversarial.PERRIN_PSEUDOPRIMES:
        assert perrin_mod(n) == 0 and not sympy.isprime(n)
    assert sympy.factorint(271441) == {521: 2}


def test_published_lucas_constants_have_their_defining_property():
    assert all(sympy_primetest.is_lucas_prp(n) for n in adversarial.LUCAS_PSEUDOPRIMES)
    assert all(sympy_primetest.is_strong_lucas_prp(n) for n in adversarial.STRONG_LUCAS_PSEUDOPRIMES)
    assert all(is_fibonacci_pseudoprime(n) for n in adversarial.FIBONACCI_PSEUDOPRIMES)


@pytest.mark.parametrize("search", [adversarial.lucas_pseudoprimes_below,
                                    adversarial.strong_lucas_pseudoprimes_below,
                                    adversarial.fibonacci_pseudoprimes_below,
                                    adversarial.carmichael_numbers_below,
                                    adversarial.strong_pseudoprimes_below])
@pytest.mark.parametrize("bad", [-1, 10**12, 1.5, True])
def test_searches_refuse_bad_limits(search, bad):
    with pytest.raises(InvalidInputError):
        search(bad)


# --------------------------------------------------------------------------
# Near powers of two
# --------------------------------------------------------------------------

@pytest.mark.parametrize("boundary", adversarial.WORD_BOUNDARIES)
def test_primes_around_boundaries(boundary):
    found = adversarial.primes_around(boundary, 3)
    assert found == sorted(found) and len(found) == 6
    assert all(sympy.isprime(p) for p in found)
    assert found[2] == sympy.prevprime(boundary + 1) and found[3] == sympy.nextprime(boundary)
    assert found[2] <= boundary < found[3]


@pytest.mark.parametrize("boundary", [2**32, 2**53, 2**64])
def test_prime_squares_and_cubes_straddle_the_boundary(boundary):
    squares = adversarial.prime_squares_around(boundary, 2)
    assert squares[1] <= boundary < squares[2]
    for n in squares:
        root = math.isqrt(n)
        assert root * root == n and sympy.isprime(root)
    cubes = adversarial.prime_cubes_around(boundary, 2)
    assert cubes[1] <= boundary < cubes[2]
    for n in cubes:
        root, exact = sympy.integer_nthroot(n, 3)
        assert exact and sympy.isprime(root)
    # the nearest prime roots: no prime between the two middle roots
    low, high = math.isqrt(squares[1]), math.isqrt(squares[2])
    assert sympy.nextprime(low) == high


def test_near_squares_are_neighbours_of_prime_squares():
    values = adversarial.near_squares_around(2**53, 1)
    assert len(values) == 6
    for centre in values[1::3]:
        root = math.isqrt(centre)
        assert root * root == centre and sympy.isprime(root)
        assert centre - 1 in values and centre + 1 in values


def test_float_square_root_traps_break_float_sqrt():
    traps = adversarial.float_square_root_traps(20)
    assert len(traps) == 20
    for n in traps:
        m = math.isqrt(n + 1)
        assert m * m == n + 1
        assert int(math.sqrt(n)) == m != math.isqrt(n)


# --------------------------------------------------------------------------
# Semiprimes
# --------------------------------------------------------------------------

def two_prime_factors(n: int) -> tuple[int, int]:
    factors = sympy.factorint(n)
    assert sum(factors.values()) == 2, (n, factors)
    p, q = sorted(p for p, e in factors.items() for _ in range(e))
    return p, q


def test_close_prime_products_are_consecutive_primes():
    for n in adversarial.close_prime_products(64, 10, random.Random(1)):
        p, q = two_prime_factors(n)
        assert p.bit_length() == 32 and q == sympy.nextprime(p)
        # Fermat's method: ceil(sqrt(n)) already gives the first square difference
        a = math.isqrt(n - 1) + 1
        assert math.isqrt(a * a - n) ** 2 == a * a - n


def test_balanced_and_unbalanced_semiprimes():
    for n in adversarial.balanced_semiprimes(64, 10, random.Random(2)):
        p, q = two_prime_factors(n)
        assert p.bit_length() == q.bit_length() == 32
    for n in adversarial.unbalanced_semiprimes(12, 80, 10, random.Random(3)):
        p, q = two_prime_factors(n)
        assert p.bit_length() == 12 and q.bit_length() == 68


def test_semiprimes_are_deterministic_given_the_generator():
    assert (adversarial.balanced_semiprimes(100, 5, random.Random(9))
            == adversarial.balanced_semiprimes(100, 5, random.Random(9)))


@pytest.mark.parametrize("arguments", [(4, 1, random.Random(0)), (64, -1, random.Random(0)),
                                       (64, 1, 5), (64.0, 1, random.Random(0))])
def test_semiprimes_refuse_bad_arguments(arguments):
    with pytest.raises(InvalidInputError):
        adversarial.balanced_semiprimes(*arguments)


# --------------------------------------------------------------------------
# Smooth numbers
# --------------------------------------------------------------------------

def is_smooth(n: int, bound: int) -> bool:
    return n == 1 or max(sympy.factorint(n)) <= bound


def test_smooth_numbers_match_oeis():
    assert adversarial.smooth_numbers_up_to(A003586[-1], 3) == A003586
    assert adversarial.smooth_numbers_up_to(A002473[-1], 7) == A002473


def test_smooth_numbers_up_to_are_all_and_only_the_smooth_ones():
    assert adversarial.smooth_numbers_up_to(5000, 13) == [n for n in range(1, 5001) if is_smooth(n, 13)]


def test_smooth_numbers_between_agree_with_factorint():
    low, high = 10**12, 10**12 + 3000
    found = adversarial.smooth_numbers_between(low, high, 1000)
    assert found == [n for n in range(low, high + 1) if is_smooth(n, 1000)]
    assert found  # the interval holds some 1000-smooth numbers, e.g. 10**12 itself
    assert adversarial.smooth_numbers_between(1, 100, 5) == adversarial.smooth_numbers_up_to(100, 5)


def test_smooth_numbers_near_2_to_64():
    found = adversarial.smooth_numbers_up_to(2**64, 5)
    assert found[-1] <= 2**64 and all(is_smooth(n, 5) for n in found[-50:])
    # count of 5-smooth numbers below 2**64 checked against the triple enumeration
    count = sum(1 for i in range(65) for j in range(41) for k in range(28)
                if 2**i * 3**j * 5**k <= 2**64)
    assert len(found) == count


def test_smooth_numbers_refuse_bad_arguments():
    with pytest.raises(InvalidInputError):
        adversarial.smooth_numbers_between(10, 10**8, 7)
    with pytest.raises(InvalidInputError):
        adversarial.smooth_numbers_up_to(10, 0)
    with pytest.raises(InvalidInputError):
        adversarial.smooth_numbers_up_to(2**2000, 1000)


# --------------------------------------------------------------------------
# Twin primes
# --------------------------------------------------------------------------

@pytest.mark.parametrize("exponent", [3, 4, 8, 16, 31, 32, 53, 64, 100])
def test_twin_pairs_straddle_power_of_two(exponent):
    (p, p2), (q, q2) = adversarial.twin_pairs_around_power_of_two(exponent)
    power = 2**exponent
    assert p2 == p + 2 and q2 == q + 2 and p2 < power < q
    assert all(sympy.isprime(x) for x in (p, p2, q, q2))
    primes_between = list(sympy.primerange(p2, q))
    assert all(b - a != 2 for a, b in zip(primes_between, primes_between[1:]))


def test_twin_pairs_small_cases():
    # by hand from the primes up to 40
    assert adversarial.twin_pairs_around_power_of_two(3) == ((5, 7), (11, 13))
    assert adversarial.twin_pairs_around_power_of_two(5) == ((29, 31), (41, 43))


def test_twin_boundary_points():
    points = adversarial.twin_boundary_points((8, 16))
    (p, _), (q, _) = adversarial.twin_pairs_around_power_of_two(16)
    assert {2**8, 2**16, p + 1, p + 2, q + 1, q + 2} <= set(points)
    assert points == sorted(set(points))


# --------------------------------------------------------------------------
# Certified primes
# --------------------------------------------------------------------------

@pytest.mark.parametrize("bits", [2, 5, 20, 24, 25, 33, 64, 100, 256, 521])
def test_certified_primes_verify_and_are_prime(bits):
    certificate = adversarial.certified_prime(bits, random.Random(bits))
    assert certificate.n.bit_length() == bits
    assert adversarial.verify_certificate(certificate)
    assert sympy.isprime(certificate.n)


def test_certified_primes_are_deterministic_given_the_generator():
    first = adversarial.certified_primes(80, 3, random.Random(11))
    assert first == adversarial.certified_primes(80, 3, random.Random(11))
    assert len({c.n for c in first}) == 3


def test_certified_product_has_proven_factorisation():
    n, certificates = adversarial.certified_product((26, 30, 34, 38), random.Random(4))
    assert n == math.prod(c.n for c in certificates)
    assert all(adversarial.verify_certificate(c) for c in certificates)
    assert sorted(sympy.factorint(n)) == sorted(c.n for c in certificates)


def test_corrupted_certificates_are_rejected():
    good = adversarial.certified_prime(128, random.Random(7))
    q, _ = good.factored_part[0]
    corrupted = [
        dataclasses.replace(good, n=good.n + 2),
        dataclasses.replace(good, witnesses=(1,)),
        dataclasses.replace(good, witnesses=(good.n - 1,)),
        dataclasses.replace(good, factored_part=((q, 2),)),
        dataclasses.replace(good, factored_part=((2, 1),)),
        # valid witness for the prime 2 of n - 1, but F = 2 is far below sqrt(n)
        adversarial.PrimeCertificate(good.n, ((2, 1),), (_witness_for(good.n, 2),),
                                     (adversarial.PrimeCertificate(2),)),
        dataclasses.replace(good, factored_part=(), witnesses=(), proofs=()),
        dataclasses.replace(good, proofs=(dataclasses.replace(good.proofs[0], n=q + 2),)),
        dataclasses.replace(good, witnesses=(2.0,)),
        adversarial.PrimeCertificate(12, (), (), ()),
        adversarial.PrimeCertificate(1, (), (), ()),
    ]
    for certificate in corrupted:
        assert not adversarial.verify_certificate(certificate), certificate


def _witness_for(n: int, q: int) -> int:
    return next(a for a in range(2, 1000)
                if pow(a, n - 1, n) == 1 and math.gcd(pow(a, (n - 1) // q, n) - 1, n) == 1)


def test_fabricated_certificate_for_a_carmichael_number_is_rejected():
    # 56052361 = 211 * 421 * 631 (OEIS A033502) fools Fermat for every coprime
    # base, but no witness meets Pocklington's gcd condition with F = n - 1.
    n = 56052361
    assert n > adversarial._certified.TRIAL_DIVISION_LIMIT and is_korselt(n)
    factors = sympy.factorint(n - 1)
    primes = tuple(sorted(factors))
    proofs = tuple(adversarial.PrimeCertificate(q) for q in primes)
    assert all(adversarial.verify_certificate(proof) for proof in proofs)
    for a in range(2, 300):
        fake = adversarial.PrimeCertificate(n, tuple((q, factors[q]) for q in primes),
                                            (a,) * len(primes), proofs)
        assert not adversarial.verify_certificate(fake)
    # 5 and 7 divide every p - 1, so witnesses exist for F = 35 < sqrt(n): rejected
    small = adversarial.PrimeCertificate(n, ((5, 1), (7, 1)), (_witness_for(n, 5), _witness_for(n, 7)),
                                         (adversarial.PrimeCertificate(5), adversarial.PrimeCertificate(7)))
    assert not adversarial.verify_certificate(small)
    big = 2**64 + 1  # = 274177 * 67280421310721 (Landry 1880; from memory, checked by sympy)
    assert sympy.factorint(big) == {274177: 1, 67280421310721: 1}
    two = adversarial.PrimeCertificate(2)
    for a in range(2, 50):
        assert not adversarial.verify_certificate(adversarial.PrimeCertificate(big, ((2, 64),), (a,), (two,)))


def test_verify_certificate_refuses_non_certificates():
    with pytest.raises(InvalidInputError):
        adversarial.verify_certificate(97)


def test_exhaustive_search_accepts_composite_bases():
    # A number sharing a factor with a composite base (325 = 5^2 * 13) is skipped, not an error.
    from sympy.ntheory.primetest import mr   # sympy, test-only reference

    found = adversarial.strong_pseudoprimes_below(10**4, (325,))
    assert found and all(mr(n, [325]) and not sympy.isprime(n) for n in found)
    assert all(math.gcd(n, 325) == 1 for n in found)
