"""Numbers at the edges of machine arithmetic: primes, prime squares and cubes near powers of two.

Fixed-width code fails at a few places (common practice):

* a product ``a * b`` of residues modulo ``n`` overflows a ``w``-bit word once
  ``n > 2**(w/2)``; moduli just above ``2**16`` / ``2**32`` and just below
  ``2**32`` / ``2**64`` (or ``2**31`` / ``2**63`` when signed) expose it;
* a double has a 53-bit significand, so ``float(n)`` is inexact above
  ``2**53`` and ``int(math.sqrt(n))`` can be off by one well below it --
  squares ``p**2`` and their neighbours ``p**2 - 1`` find the off-by-one in
  an integer square root, and a wrong root hides a square factor ``p**2``;
* the same holds for cube roots and ``p**3``.

Everything here is computed with Python integers and :mod:`oracle.exact.primality`.
"""

from __future__ import annotations

import math

import gmpy2

from .._errors import InvalidInputError
from .._integers import require_int
from ..exact.primality import next_prime, prev_prime

__all__ = [
    "WORD_BOUNDARIES",
    "primes_around",
    "prime_squares_around",
    "prime_cubes_around",
    "near_squares_around",
    "float_square_root_traps",
]

#: Powers of two where fixed-width arithmetic changes behaviour: 16/32-bit
#: products, signed and unsigned 32- and 64-bit words, the 53-bit significand,
#: and 128-bit products of 64-bit words.
WORD_BOUNDARIES = (2**16, 2**31, 2**32, 2**53, 2**63, 2**64, 2**128)


def primes_around(value: int, count: int = 3) -> list[int]:
    """Up to ``count`` largest primes ``<= value`` and the ``count`` smallest ``> value``, ascending."""
    value = require_int("value", value, minimum=0)
    count = require_int("count", count, minimum=1, maximum=1000)
    below = []
    candidate = value + 1
    while len(below) < count and candidate > 2:
        candidate = prev_prime(candidate)
        below.append(candidate)
    above = [next_prime(value)]
    while len(above) < count:
        above.append(next_prime(above[-1]))
    return sorted(below) + above


def prime_squares_around(value: int, count: int = 2) -> list[int]:
    """Squares ``p**2`` of primes: the ``count`` largest ``<= value`` and ``count`` smallest above."""
    value = require_int("value", value, minimum=0)
    return [p * p for p in primes_around(math.isqrt(value), count)]


def prime_cubes_around(value: int, count: int = 2) -> list[int]:
    """Cubes ``p**3`` of primes: the ``count`` largest ``<= value`` and ``count`` smallest above."""
    value = require_int("value", value, minimum=0)
    root = int(gmpy2.iroot(value, 3)[0])
    return [p**3 for p in primes_around(root, count)]


def near_squares_around(value: int, count: int = 2) -> list[int]:
    """``p**2 - 1, p**2, p**2 + 1`` for the primes of :func:`prime_squares_around`, ascending."""
    return sorted(square + offset for square in prime_squares_around(value, count)
                  for offset in (-1, 0, 1))


def float_square_root_traps(count: int, start: int = 2**26) -> list[int]:
    """The first ``count`` numbers ``n = m**2 - 1`` (``m > start``) with ``int(math.sqrt(n)) != isqrt(n)``.

    Found by computation: for ``m`` beyond about ``2**26`` the double nearest
    to ``sqrt(m**2 - 1)`` is ``m`` itself, so the float root is one too big.
    """
    count = require_int("count", count, minimum=0, maximum=10**4)
    start = require_int("start", start, minimum=1, maximum=2**500)
    traps = []
    m = start + 1
    while len(traps) < count:
        n = m * m - 1
        if int(math.sqrt(n)) != math.isqrt(n):
            traps.append(n)
        m += 1
        if m > start + 10**6 and not traps:
            raise InvalidInputError(f"start={start}: no trap in the first 10**6 values of m")
    return traps

