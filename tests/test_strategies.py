"""Tests of oracle.strategies: defining properties, argument checks, shrinking, laziness.

References used only here: sympy (primality, factorisation, Miller--Rabin and
Lucas tests, next/previous prime), gmpy2 (Jacobi symbol), and published OEIS
terms named beside each value.
"""

from __future__ import annotations

import math
import subprocess
import sys

import pytest
import sympy
from hypothesis import HealthCheck, find, given, settings
from hypothesis import strategies as st
from hypothesis.errors import InvalidArgument
from sympy.ntheory.primetest import is_lucas_prp, is_strong_lucas_prp, mr

from oracle import InvalidInputError
from oracle import strategies as nts
from oracle.strategies._points import SEGMENT_EXPONENTS, SQUARE_ROOT_CENTRES, boundary_points

CI = settings(settings.get_profile(nts.CI_PROFILE), max_examples=60)
FIND = settings(database=None, max_examples=300)


def minimal(strategy, condition=lambda value: True):
    return find(strategy, condition, settings=FIND)


# --- numbers in a range -----------------------------------------------------------------

@pytest.mark.parametrize("low, high", [(2, 10**6), (10**12, 10**12 + 10**4),
                                       (2**64, 2**65), (24, 29), (90, 97)])
def test_primes_are_prime_and_in_range(low, high):
    @CI
    @given(nts.primes(low, high))
    def check(p):
        assert low <= p <= high and sympy.isprime(p)
    check()


@pytest.mark.parametrize("low, high", [(0, 10**6), (2**61 - 1, 2**61 + 10), (5, 6), (7, 9)])
def test_composites_are_composite_and_in_range(low, high):
    @CI
    @given(nts.composites(low, high))
    def check(n):
        assert low <= n <= high and n >= 4 and not sympy.isprime(n)
    check()


@pytest.mark.parametrize("max_value, min_exponent", [(10**6, 2), (2**64, 3), (10**4, 1)])
def test_prime_powers_have_one_prime_factor(max_value, min_exponent):
    @CI
    @given(nts.prime_powers(max_value, min_exponent=min_exponent))
    def check(n):
        factors = sympy.factorint(n)
        assert n <= max_value and len(factors) == 1
        assert next(iter(factors.values())) >= min_exponent
    check()


@CI
@given(nts.balanced_semiprimes(4, 48))
def test_balanced_semiprimes_have_two_prime_factors_of_equal_size(n):
    factors = sympy.factorint(n)
    assert sum(factors.values()) == 2
    p, q = sorted(sympy.factorint(n, multiple=True))
    assert q.bit_length() - p.bit_length() in (0, 1)


@CI
@given(nts.unbalanced_semiprimes(8, 64))
def test_unbalanced_semiprimes_have_a_small_and_a_large_factor(n):
    p, q = sorted(sympy.factorint(n, multiple=True))
    assert 4 * p.bit_length() <= p.bit_length() + q.bit_length()


@pytest.mark.parametrize("bound, max_value", [(7, 10**6), (100, 2**64), (2, 1000)])
def test_smooth_numbers_have_no_large_prime_factor(bound, max_value):
    @CI
    @given(nts.smooth_numbers(bound, max_value))
    def check(n):
        assert 1 <= n <= max_value
        assert all(p <= bound for p in sympy.factorint(n))
    check()


# --- adversarial families ---------------------------------------------------------------

def _fibonacci_mod(k, n):
    """``F_k mod n`` by fast doubling (F_2k = F_k (2 F_{k+1} - F_k), F_2k+1 = F_k^2 + F_{k+1}^2)."""
    a, b = 0, 1
    for bit in bin(k)[2:]:
        a, b = a * (2 * b - a) % n, (a * a + b * b) % n
        if bit == "1":
            a, b = b, (a + b) % n
    return a


@pytest.mark.parametrize("bases", [(2,), (3,), (2, 3, 5, 7), (2, 3, 5, 7, 11, 13)])
def test_strong_pseudoprimes_are_composites_that_pass_every_base(bases):
    @CI
    @given(nts.strong_pseudoprimes(bases))
    def check(n):
        assert n % 2 == 1 and not sympy.isprime(n)
        assert mr(n, list(bases))  # sympy's Miller--Rabin to the given bases
    check()


@CI
@given(nts.carmichael_numbers())
def test_carmichael_numbers_satisfy_korselt(n):
    factors = sympy.factorint(n)
    assert len(factors) >= 3 and all(e == 1 for e in factors.values())  # squarefree
    assert all((n - 1) % (p - 1) == 0 for p in factors)


@CI
@given(nts.lucas_pseudoprimes())
def test_lucas_pseudoprimes_pass_the_lucas_test(n):
    assert not sympy.isprime(n) and is_lucas_prp(n)


@CI
@given(nts.strong_lucas_pseudoprimes())
def test_strong_lucas_pseudoprimes_pass_the_strong_lucas_test(n):
    assert not sympy.isprime(n) and is_strong_lucas_prp(n)


@CI
@given(nts.fibonacci_pseudoprimes())
def test_fibonacci_pseudoprimes_divide_their_fibonacci_number(n):
    assert n % 2 == 1 and n % 5 != 0 and not sympy.isprime(n)
    assert _fibonacci_mod(n - sympy.jacobi_symbol(5, n), n) == 0


def test_primes_near_are_the_consecutive_primes_around_the_value():
    value, count = 2**32, 3
    expected, p = [], value + 1
    for _ in range(count):
        p = sympy.prevprime(p)
        expected.insert(0, p)
    p = value
    for _ in range(count):
        p = sympy.nextprime(p)
        expected.append(p)
    seen = set()

    @CI
    @given(nts.primes_near(value, count=count))
    def check(q):
        seen.add(q)
        assert q in expected
    check()
    assert min(seen) == expected[0]


@CI
@given(nts.squares_near(2**32, count=2))
def test_squares_near_are_prime_squares_and_their_neighbours(n):
    root = next(r for r in (math.isqrt(n - 1), math.isqrt(n), math.isqrt(n + 1))
                if abs(r * r - n) <= 1 and sympy.isprime(r))
    assert abs(root - 2**16) < 100


# --- counting points and sieve intervals -----------------------------------------------

def _is_near_boundary(x):
    """Independent restatement of the boundaries in oracle.strategies._points."""
    for base in (2, 10):
        k = 0
        while base**k <= x + 2:
            if abs(x - base**k) <= 2:
                return True
            k += 1
    for p in (x - 1, x, x + 1):
        if p >= 2 and sympy.isprime(p):
            if p < 4 or sympy.prevprime(p) < 1 << (p.bit_length() - 1) or \
                    sympy.nextprime(p) > 1 << p.bit_length():
                return True  # a prime next to a power of two
            if any(abs(p - c) < 2000 for c in SQUARE_ROOT_CENTRES):
                return True
    for r in {math.isqrt(x - 1), math.isqrt(x), math.isqrt(x + 1)}:
        if abs(r * r - x) <= 1 and sympy.isprime(r) and any(abs(r - c) < 2000
                                                            for c in SQUARE_ROOT_CENTRES):
            return True
    return False


def test_every_boundary_point_is_near_a_boundary():
    points = boundary_points(0, 2**64)
    assert list(points) == sorted(set(points)) and all(0 <= x <= 2**64 for x in points)
    assert all(_is_near_boundary(x) for x in points)
    # from memory: 2**32 - 5 and 2**32 + 15 are the primes next to 2**32
    assert {2**32 - 5, 2**32 - 4, 2**32 + 15, 2**32 + 16} <= set(points)


def _near_a_segment_end(x):
    return any(min(x % 2**j, 2**j - x % 2**j) <= 2 for j in SEGMENT_EXPONENTS)


def test_counting_points_are_in_range_and_biased_to_boundaries():
    low, high = 10**3, 2**64
    drawn = []

    @settings(CI, max_examples=300)
    @given(nts.counting_points(high, min_value=low))
    def collect(x):
        assert low <= x <= high
        drawn.append(x)
    collect()
    near = [x for x in drawn if _near_a_segment_end(x) or x in boundary_points(low, high)]
    # A uniform draw would land this close to a boundary with probability < 10**-3.
    assert len(near) >= len(drawn) // 4


def test_sieve_intervals_respect_the_bounds_and_include_points_and_straddlers():
    low, high, longest = 5, 2**40, 2**12
    drawn = []

    @settings(CI, max_examples=300)
    @given(nts.sieve_intervals(high, longest, min_value=low))
    def collect(interval):
        a, b = interval
        assert low <= a <= b <= high and b - a + 1 <= longest
        drawn.append(interval)
    collect()
    assert any(a == b for a, b in drawn)
    straddling = [(a, b) for a, b in drawn
                  if any(a < c <= b for c in (2**32, 10**6)) or
                  any(a // 2**j != b // 2**j for j in SEGMENT_EXPONENTS)]
    assert len(straddling) >= len(drawn) // 10


def test_sieve_intervals_of_length_one_are_points():
    @CI
    @given(nts.sieve_intervals(100, 1))
    def check(interval):
        assert interval[0] == interval[1]
    check()


# --- shrinking ------------------------------------------------------------------------

SHRINKS_TO = [
    (lambda: nts.primes(100, 10**6), lambda p: True, sympy.nextprime(99)),
    (lambda: nts.primes(2, 10**6), lambda p: p > 1000, sympy.nextprime(1000)),
    (lambda: nts.composites(), lambda n: True, 4),
    (lambda: nts.composites(97, 10**6), lambda n: n > 1000, 1001),  # 1001 = 7 * 11 * 13
    (lambda: nts.prime_powers(10**6), lambda n: n % 2 == 1, 9),
    (lambda: nts.prime_powers(10**6, min_exponent=3), lambda n: True, 8),
    (lambda: nts.balanced_semiprimes(8, 32), lambda n: True, sympy.nextprime(8) ** 2),
    (lambda: nts.unbalanced_semiprimes(8, 32), lambda n: True, 2 * sympy.nextprime(32)),
    (lambda: nts.smooth_numbers(7, 10**6), lambda n: n % 3 == 0, 3),
    (lambda: nts.strong_pseudoprimes(), lambda n: True, 2047),  # OEIS A001262
    (lambda: nts.strong_pseudoprimes((2, 3, 5, 7)), lambda n: True, 3215031751),  # OEIS A014233
    (lambda: nts.carmichael_numbers(), lambda n: True, 561),  # OEIS A002997
    (lambda: nts.carmichael_numbers(), lambda n: n > 2**32, 9624742921),  # OEIS A033502
    (lambda: nts.lucas_pseudoprimes(), lambda n: True, 323),  # OEIS A217120
    (lambda: nts.strong_lucas_pseudoprimes(), lambda n: True, 5459),  # OEIS A217255
    (lambda: nts.fibonacci_pseudoprimes(), lambda n: n > 1000, 1891),  # OEIS A081264
    (lambda: nts.counting_points(10**6), lambda x: x >= 1000, 1000),
    (lambda: nts.sieve_intervals(10**6), lambda ab: True, (0, 0)),
    (lambda: nts.sieve_intervals(10**6), lambda ab: ab[1] - ab[0] >= 9, (0, 9)),
]


@pytest.mark.parametrize("make, condition, expected", SHRINKS_TO)
def test_shrinks_to_the_documented_minimal_example(make, condition, expected):
    assert minimal(make(), condition) == expected


def test_primes_near_shrinks_to_the_smallest_prime_listed():
    assert minimal(nts.primes_near(2**16, count=2)) == sympy.prevprime(sympy.prevprime(2**16 + 1))


# --- argument checks ------------------------------------------------------------------

INVALID = [
    (nts.primes, (2.0,), {}, "min_value=2.0"),
    (nts.primes, (True,), {}, "min_value=True"),
    (nts.primes, (-1,), {}, "min_value=-1"),
    (nts.primes, (10, 5), {}, "max_value=5"),
    (nts.primes, (24, 28), {}, "min_value=24, max_value=28"),
    (nts.primes, (0, 1), {}, "min_value=0, max_value=1"),
    (nts.composites, (5, 5), {}, "min_value=5, max_value=5"),
    (nts.composites, (0, 3), {}, "min_value=0, max_value=3"),
    (nts.composites, ("4",), {}, "min_value='4'"),
    (nts.prime_powers, (3,), {}, "max_value=3"),
    (nts.prime_powers, (100,), {"min_exponent": 0}, "min_exponent=0"),
    (nts.balanced_semiprimes, (3,), {}, "min_bits=3"),
    (nts.balanced_semiprimes, (10, 8), {}, "max_bits=8"),
    (nts.unbalanced_semiprimes, (7,), {}, "min_bits=7"),
    (nts.unbalanced_semiprimes, (8, 5000), {}, "max_bits=5000"),
    (nts.smooth_numbers, (1, 100), {}, "bound=1"),
    (nts.smooth_numbers, (7, 0), {}, "max_value=0"),
    (nts.strong_pseudoprimes, ("2",), {}, "bases='2'"),
    (nts.strong_pseudoprimes, ((),), {}, "bases=()"),
    (nts.strong_pseudoprimes, ((2, 2),), {}, "bases=(2, 2)"),
    (nts.strong_pseudoprimes, ((1,),), {}, "bases[0]=1"),
    (nts.strong_pseudoprimes, ((2,),), {"max_value": -1}, "max_value=-1"),
    (nts.carmichael_numbers, (), {"max_value": 1.5}, "max_value=1.5"),
    (nts.primes_near, (), {"count": 0}, "count=0"),
    (nts.squares_near, (-1,), {}, "value=-1"),
    (nts.counting_points, (-1,), {}, "max_value=-1"),
    (nts.counting_points, (10,), {"min_value": 11}, "max_value=10"),
    (nts.sieve_intervals, (100, 0), {}, "max_length=0"),
    (nts.sieve_intervals, (100,), {"min_value": -3}, "min_value=-3"),
]


@pytest.mark.parametrize("function, args, kwargs, message", INVALID)
def test_invalid_arguments_are_refused_when_the_strategy_is_built(function, args, kwargs,
                                                                  message):
    with pytest.raises(InvalidArgument, match="^" + message.replace("(", r"\(")
                       .replace(")", r"\)").replace("[", r"\[").replace("]", r"\]")) as caught:
        function(*args, **kwargs)
    assert isinstance(caught.value, InvalidInputError)


@pytest.mark.parametrize("strategy, message", [
    (lambda: nts.carmichael_numbers(max_value=560), "max_value=560"),
    (lambda: nts.lucas_pseudoprimes(max_value=322), "max_value=322"),
    # from memory: Sinclair's seven bases are a deterministic Miller--Rabin set below 2**64
    (lambda: nts.strong_pseudoprimes((2, 325, 9375, 28178, 450775, 9780504, 1795265022)),
     r"bases=\(2, 325,"),
])
def test_an_empty_family_is_refused_on_first_use(strategy, message):
    with pytest.raises(InvalidArgument, match="^" + message):
        strategy().validate()


# --- profiles and laziness ------------------------------------------------------------

def test_profiles_are_registered_with_the_documented_settings():
    ci = settings.get_profile(nts.CI_PROFILE)
    assert ci.derandomize and ci.deadline is None and ci.database is None and ci.print_blob
    assert HealthCheck.too_slow in ci.suppress_health_check
    dev = settings.get_profile(nts.DEV_PROFILE)
    assert not dev.derandomize and dev.deadline is None and dev.max_examples == 25


def test_ci_profile_gives_the_same_examples_on_every_run():
    runs = []
    for _ in range(2):
        drawn = []

        @settings(CI, max_examples=20)
        @given(nts.counting_points(2**64))
        def collect(x):
            drawn.append(x)
        collect()
        runs.append(drawn)
    assert runs[0] == runs[1]


def test_import_and_construction_load_neither_numpy_nor_gmpy2():
    program = (
        "import sys\n"
        "import oracle.strategies as nts\n"
        "nts.primes(2, 10**6); nts.composites(4, 100); nts.prime_powers(10**6)\n"
        "nts.balanced_semiprimes(); nts.unbalanced_semiprimes(); nts.smooth_numbers(7, 100)\n"
        "nts.strong_pseudoprimes((2, 3)); nts.carmichael_numbers(max_value=10**6)\n"
        "nts.lucas_pseudoprimes(); nts.primes_near(); nts.squares_near()\n"
        "nts.counting_points(2**64); nts.sieve_intervals(2**64, 2**20)\n"
        "loaded = [m for m in ('numpy', 'gmpy2', 'oracle.exact', 'oracle.adversarial')\n"
        "          if m in sys.modules]\n"
        "print(','.join(loaded))\n"
    )
    result = subprocess.run([sys.executable, "-c", program], capture_output=True, text=True,
                            check=True)
    assert result.stdout.strip() == ""


def test_strategies_compose_with_plain_hypothesis():
    @CI
    @given(st.tuples(nts.primes(2, 100), nts.composites(4, 100)))
    def check(pair):
        p, n = pair
        assert sympy.isprime(p) and not sympy.isprime(n)
    check()
