"""Defective primes_in: above 2**32 the sieving primes stop one short of isqrt(b).

Below 2**32 the member lists with a plain sieve of [a, b]; above, it sieves the
interval with the primes of range(2, isqrt(b)).  DEFECT: the bound is exclusive,
so the square of the prime p = isqrt(b) is never crossed off: the first is
4295098369 = 65537**2, listed as a prime by primes_in(4295098369, 4295098369).
Intervals whose last square of a prime has p < isqrt(b) come out right.  The
sieving primes come from a sieve up to 2**20, so it claims b <= 2**40.
"""

import bisect
import itertools
import math

_LIMIT = 2**20


def _primes_up_to(limit):
    flags = bytearray([1]) * (limit + 1)
    flags[0:2] = b"\x00\x00"[: limit + 1]
    for p in range(2, math.isqrt(limit) + 1):
        if flags[p]:
            flags[p * p::p] = bytes(len(range(p * p, limit + 1, p)))
    return [p for p in range(limit + 1) if flags[p]]


_SMALL = _primes_up_to(_LIMIT)


def _sieve(a, b, sieving):
    a = max(a, 2)
    if a > b:
        return []
    flags = bytearray([1]) * (b - a + 1)
    for p in sieving:
        start = max(p * p, (a + p - 1) // p * p)
        flags[start - a::p] = bytes(len(range(start - a, b - a + 1, p)))
    return list(itertools.compress(range(a, b + 1), flags))


def primes_in(a, b):
    root = math.isqrt(max(b, 0))
    if b < 2**32:
        return _sieve(a, b, _SMALL[:bisect.bisect_right(_SMALL, root)])
    return _sieve(a, b, _SMALL[:bisect.bisect_left(_SMALL, root)])      # bug: p <= root
