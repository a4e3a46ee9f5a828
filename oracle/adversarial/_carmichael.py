"""Carmichael numbers: composites ``n`` with ``a**(n-1) = 1 (mod n)`` for every ``a`` coprime to ``n``.

Korselt's criterion (1899): a composite ``n`` is a Carmichael number exactly
when it is squarefree and ``p - 1`` divides ``n - 1`` for every prime ``p | n``.
They defeat the Fermat test for every base coprime to them.

* :data:`CARMICHAEL_NUMBERS` -- the published small ones (OEIS A002997);
* :func:`carmichael_numbers_below` -- exhaustive search by Korselt's criterion;
* :func:`chernick_carmichael_numbers` -- J. Chernick (1939, Bull. Amer. Math.
  Soc. 45): if ``6k+1``, ``12k+1`` and ``18k+1`` are all prime, their product
  is a Carmichael number (OEIS A033502 lists those products).
"""

from __future__ import annotations

import math
from collections.abc import Iterator

import numpy as np

from .._integers import require_int
from ..exact.primality import is_prime

__all__ = ["CARMICHAEL_NUMBERS", "CHERNICK_CARMICHAEL_NUMBERS",
           "carmichael_numbers_below", "chernick_carmichael_numbers"]

#: OEIS A002997, the Carmichael numbers below 520,000 (33 terms, from memory;
#: the tests re-derive them by exhaustive search).
CARMICHAEL_NUMBERS = (561, 1105, 1729, 2465, 2821, 6601, 8911, 10585, 15841,
                      29341, 41041, 46657, 52633, 62745, 63973, 75361, 101101,
                      115921, 126217, 162401, 172081, 188461, 252601, 278545,
                      294409, 314821, 334153, 340561, 399001, 410041, 449065,
                      488881, 512461)

#: OEIS A033502, Chernick's products (6k+1)(12k+1)(18k+1) with three prime
#: factors, first 10 terms (from memory; the tests re-derive them).
CHERNICK_CARMICHAEL_NUMBERS = (1729, 294409, 56052361, 118901521, 172947529,
                               216821881, 228842209, 1299963601, 2301745249,
                               9624742921)

#: The exhaustive search tabulates smallest prime factors up to this limit.
_SEARCH_LIMIT = 2 * 10**7


def carmichael_numbers_below(limit: int) -> list[int]:
    """All Carmichael numbers ``n < limit`` (``limit <= 2 * 10**7``), by Korselt's criterion."""
    limit = require_int("limit", limit, minimum=0, maximum=_SEARCH_LIMIT)
    smallest_factor = _smallest_prime_factors(limit)
    found = []
    for n in range(3, limit, 2):
        if smallest_factor[n] != n and _satisfies_korselt(n, smallest_factor):
            found.append(n)
    return found


def chernick_carmichael_numbers(count: int, start: int = 1) -> list[int]:
    """The first ``count`` products ``(6k+1)(12k+1)(18k+1)`` of three primes, ``k >= start``."""
    count = require_int("count", count, minimum=0, maximum=10**4)
    start = require_int("start", start, minimum=1)
    return [product for product, _ in zip(_chernick_products(start), range(count))]


def _chernick_products(start: int) -> Iterator[int]:
    k = start
    while True:
        factors = (6 * k + 1, 12 * k + 1, 18 * k + 1)
        if all(is_prime(factor) for factor in factors):
            yield factors[0] * factors[1] * factors[2]
        k += 1


def _smallest_prime_factors(limit: int) -> np.ndarray:
    """``table[n]`` = least prime factor of ``n`` for ``2 <= n < limit`` (sieve of Eratosthenes)."""
    table = np.arange(max(limit, 2), dtype=np.int64)
    for p in range(2, math.isqrt(max(limit - 1, 1)) + 1):
        if table[p] == p:
            multiples = table[p * p::p]
            np.minimum(multiples, p, out=multiples)
    return table


def _satisfies_korselt(n: int, smallest_factor: np.ndarray) -> bool:
    """Squarefree, and ``p - 1 | n - 1`` for each prime ``p | n`` (``n`` composite)."""
    remaining = n
    while remaining > 1:
        p = int(smallest_factor[remaining])
        remaining //= p
        if remaining % p == 0 or (n - 1) % (p - 1) != 0:
            return False
    return True
