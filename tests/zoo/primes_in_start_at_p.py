"""Defective primes_in: the segment sieve crosses off the sieving primes themselves.

DEFECT: for each sieving prime p <= isqrt(b), multiples are crossed off from
the first multiple of p that is >= a, instead of from max(p*p, that
multiple); when a <= p the prime p itself is crossed off, so primes up to
isqrt(b) inside [a, b] go missing: primes_in(2, 10) = [5, 7].  Right when
a > isqrt(b).
"""

import math

import numpy as np


def _small_primes(limit):
    flags = np.ones(limit + 1, dtype=bool)
    flags[:2] = False
    for p in range(2, math.isqrt(limit) + 1):
        if flags[p]:
            flags[p * p::p] = False
    return np.flatnonzero(flags)


def primes_in(a, b):
    a = max(a, 2)
    if a > b:
        return []
    flags = np.ones(b - a + 1, dtype=bool)
    for p in _small_primes(math.isqrt(b)):
        p = int(p)
        start = -(-a // p) * p                         # bug: should be max(p * p, ...)
        flags[start - a::p] = False
    return [a + int(i) for i in np.flatnonzero(flags)]
