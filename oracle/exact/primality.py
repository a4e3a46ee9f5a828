"""Primality of non-negative integers, with the strength of each answer stated.

Method, by size of ``n``:

* ``n`` below :data:`DETERMINISTIC_LIMIT` -- trial division by the primes up to
  53, then the strong (Miller--Rabin) test to the first ``k`` prime bases, where
  ``k`` is the smallest index with ``n < psi_k``.  Here ``psi_k`` is the least
  odd composite that is a strong pseudoprime to all of the first ``k`` prime
  bases (OEIS A014233).  The values were found by Pomerance, Selfridge and
  Wagstaff (1980, Math. Comp. 35) for ``k <= 4``, Jaeschke (1993, Math. Comp.
  61) up to ``k = 8``, Jiang and Deng (2014, Math. Comp. 83) for ``k = 9..11``
  and Sorenson and Webster (2017, Math. Comp. 86; preprint 2015) for
  ``k = 12, 13`` (attributions from memory; the values are checked in the
  tests by the strong test itself).  Below ``psi_12`` the answer is
  therefore a theorem.

* ``n`` at or above the limit -- the Baillie--PSW test (Baillie and Wagstaff
  1980, Math. Comp. 35; Pomerance, Selfridge and Wagstaff 1980): a strong
  probable-prime test to base 2 followed by a strong Lucas probable-prime test
  with Selfridge's parameters (method A: the first ``D`` in 5, -7, 9, -11, ...
  with Jacobi symbol ``(D/n) = -1``, ``P = 1``, ``Q = (1 - D)/4``).

Caution: above the limit a ``True`` answer means *probable prime*, not proven
prime.  No composite passing Baillie--PSW is known, but none is proven not to
exist.  A ``False`` answer is always certain: a failed strong test is a witness
of compositeness.  :func:`verdict` names the method ("deterministic" or
"probable") that answers for ``n``.  For cryptographic use, defer to the
published standards (e.g. FIPS 186-5 appendix B) and a vetted library.

The modular exponentiations and the Lucas sequences are computed by gmpy2.
"""

from __future__ import annotations

import bisect
from collections.abc import Iterator, Sequence

import gmpy2
import numpy as np

from .._errors import InvalidInputError
from .._integers import require_int

__all__ = [
    "DETERMINISTIC_LIMIT",
    "MR_BASES",
    "is_prime",
    "verdict",
    "next_prime",
    "prev_prime",
    "is_prime_batch",
]

#: ``psi_k`` for k = 1..12 (OEIS A014233): the least odd composite that is a
#: strong pseudoprime to each of the first ``k`` prime bases.
_LEAST_STRONG_PSEUDOPRIMES = (
    2047,
    1373653,
    25326001,
    3215031751,
    2152302898747,
    3474749660383,
    341550071728321,
    341550071728321,
    3825123056546413051,
    3825123056546413051,
    3825123056546413051,
    318665857834031151167461,
)

#: The first twelve primes, the Miller--Rabin bases used below the limit.
MR_BASES = (2, 3, 5, 7, 11, 13, 17, 19, 23, 29, 31, 37)

#: ``psi_12`` (OEIS A014233, 12th term; Sorenson and Webster 2017): every
#: ``n`` below it is decided with proof by the strong test to :data:`MR_BASES`.
DETERMINISTIC_LIMIT = _LEAST_STRONG_PSEUDOPRIMES[-1]

#: Primes used for trial division; they include every base in MR_BASES, so a
#: number that survives trial division is coprime to each base.
_TRIAL_PRIMES = (2, 3, 5, 7, 11, 13, 17, 19, 23, 29, 31, 37, 41, 43, 47, 53)
_TRIAL_PRODUCT = gmpy2.mpz(1)
for _p in _TRIAL_PRIMES:
    _TRIAL_PRODUCT *= _p
del _p

#: A number with no prime factor up to 53 is prime when it is below 59**2.
_TRIAL_DIVISION_DECIDES_BELOW = 59 * 59

#: The residues modulo 30 that are coprime to 30 (the mod-30 wheel).
_WHEEL_RESIDUES = (1, 7, 11, 13, 17, 19, 23, 29)


def verdict(n: int) -> str:
    """Name the method that decides ``n``: ``"deterministic"`` or ``"probable"``.

    ``"deterministic"`` for ``0 <= n < DETERMINISTIC_LIMIT`` (Miller--Rabin to
    proven bases); ``"probable"`` at and above it (Baillie--PSW).  The word
    qualifies a *prime* answer; a composite answer is always proven.
    """
    n = require_int("n", n, minimum=0)
    return "deterministic" if n < DETERMINISTIC_LIMIT else "probable"


def is_prime(n: int) -> bool:
    """Return whether ``n >= 0`` is prime (see the module docstring for the method).

    Proven below :data:`DETERMINISTIC_LIMIT`; a Baillie--PSW probable prime at
    and above it.
    """
    n = require_int("n", n, minimum=0)
    return _is_prime_unchecked(n)


def next_prime(n: int) -> int:
    """Return the smallest prime ``p > n`` for ``n >= 0`` (``next_prime(0) == 2``).

    Candidates step over the mod-30 wheel.  For a result at or above
    :data:`DETERMINISTIC_LIMIT`, ``verdict(result)`` is ``"probable"``.
    """
    n = require_int("n", n, minimum=0)
    for small_prime in (2, 3, 5):
        if n < small_prime:
            return small_prime
    for candidate in _wheel_numbers_above(n):
        if _is_prime_unchecked(candidate):
            return candidate
    raise AssertionError("unreachable: there are infinitely many primes")


def prev_prime(n: int) -> int:
    """Return the largest prime ``p < n`` for ``n >= 3`` (``prev_prime(3) == 2``).

    Candidates step down the mod-30 wheel.  For a result at or above
    :data:`DETERMINISTIC_LIMIT`, ``verdict(result)`` is ``"probable"``.
    """
    n = require_int("n", n, minimum=3)
    if n <= 7:
        return max(p for p in (2, 3, 5) if p < n)
    for candidate in _wheel_numbers_below(n):
        if _is_prime_unchecked(candidate):
            return candidate
    raise AssertionError("unreachable: 7 is prime and is on the wheel")


def is_prime_batch(values: np.ndarray | Sequence[int]) -> np.ndarray:
    """Return a numpy ``bool`` array: ``is_prime`` of each value.

    ``values`` is a numpy integer array (any shape; the result has the same
    shape) or a sequence of ints (the result is one-dimensional).  Negative
    values, floats and bools are refused with :class:`InvalidInputError`.
    Unsigned and non-negative signed numpy arrays get vectorised trial
    division before the per-element strong tests.
    """
    if isinstance(values, np.ndarray) and values.dtype.kind in "ui":
        return _is_prime_integer_array(values)
    if isinstance(values, np.ndarray) and values.dtype.kind != "O":
        raise InvalidInputError(
            f"values: numpy array of dtype {values.dtype} refused; pass an integer array")
    numbers = [require_int(f"values[{index}]", value, minimum=0)
               for index, value in enumerate(np.asarray(values, dtype=object).ravel())]
    result = np.fromiter((_is_prime_unchecked(number) for number in numbers),
                         dtype=bool, count=len(numbers))
    if isinstance(values, np.ndarray):
        return result.reshape(values.shape)
    return result


def _is_prime_unchecked(n: int) -> bool:
    """``is_prime`` for an ``int`` already validated as ``n >= 0``."""
    if gmpy2.gcd(n, _TRIAL_PRODUCT) != 1:
        return n in _TRIAL_PRIMES
    if n < _TRIAL_DIVISION_DECIDES_BELOW:
        return n > 1
    return _is_prime_without_small_factors(n)


def _is_prime_without_small_factors(n: int) -> bool:
    """Decide ``n >= 59**2`` that has no prime factor up to 53.

    Both methods open with the strong test to base 2, which rejects nearly
    every composite; the further bases (below the limit) or the strong Lucas
    test (at and above it) then settle the rest.
    """
    if not gmpy2.is_strong_prp(n, 2):
        return False
    if n < DETERMINISTIC_LIMIT:
        return _passes_strong_tests(n, _bases_that_decide(n)[1:])
    return _passes_strong_lucas_test(n)


def _bases_that_decide(n: int) -> tuple[int, ...]:
    """The first ``k`` prime bases, ``k`` least with ``n < psi_k`` (OEIS A014233).

    The caller guarantees ``n < DETERMINISTIC_LIMIT = psi_12``.
    """
    count = bisect.bisect_right(_LEAST_STRONG_PSEUDOPRIMES, n) + 1
    return MR_BASES[:count]


def _passes_strong_tests(n: int, bases: Sequence[int]) -> bool:
    """Whether odd ``n`` is a strong probable prime to every base (Miller 1976; Rabin 1980).

    Requires ``gcd(n, a) = 1`` for each base ``a``.
    """
    return all(gmpy2.is_strong_prp(n, base) for base in bases)


def _passes_strong_lucas_test(n: int) -> bool:
    """The strong Lucas test with Selfridge's parameters, for odd ``n`` > 53**2.

    A perfect square has no ``D`` with ``(D/n) = -1``; it is composite and is
    rejected before the Lucas test.  Together with a passed strong test to
    base 2 this is the Baillie--PSW test.
    """
    if gmpy2.is_square(n):
        return False
    return bool(gmpy2.is_strong_selfridge_prp(n))


def _is_prime_integer_array(values: np.ndarray) -> np.ndarray:
    """Vectorised trial division of an integer array, then per-element strong tests."""
    if values.dtype.kind == "i":
        if values.size and int(values.min()) < 0:
            raise InvalidInputError(
                f"values: contains the negative value {int(values.min())}; is_prime needs n >= 0")
    flat = values.ravel().astype(np.uint64)
    result = np.zeros(flat.shape, dtype=bool)
    undecided = flat >= 2
    for prime in _TRIAL_PRIMES:
        divisible = flat % np.uint64(prime) == 0
        result[flat == prime] = True
        undecided &= ~divisible
    below_square = flat < _TRIAL_DIVISION_DECIDES_BELOW
    result[undecided & below_square] = True
    undecided &= ~below_square
    positions = np.flatnonzero(undecided)
    survivors = flat[positions].tolist()
    result[positions] = [_is_prime_without_small_factors(number) for number in survivors]
    return result.reshape(values.shape)


def _wheel_numbers_above(n: int) -> Iterator[int]:
    """Numbers ``> n`` coprime to 30, ascending."""
    block = n - n % 30
    while True:
        for residue in _WHEEL_RESIDUES:
            if block + residue > n:
                yield block + residue
        block += 30


def _wheel_numbers_below(n: int) -> Iterator[int]:
    """Numbers ``< n`` coprime to 30, descending, down to 1."""
    block = n - n % 30
    while block >= 0:
        for residue in reversed(_WHEEL_RESIDUES):
            if block + residue < n:
                yield block + residue
        block -= 30
