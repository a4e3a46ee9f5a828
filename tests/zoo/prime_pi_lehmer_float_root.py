"""Defective prime_pi: Lehmer's formula with floating-point roots.

Lehmer (1959, Illinois J. Math. 3): with a = pi(x^(1/4)), b = pi(x^(1/2)),
c = pi(x^(1/3)),
  pi(x) = phi(x, a) + (b + a - 2)(b - a + 1)/2 - sum_{a<i<=b} pi(x/p_i)
          - sum_{a<i<=c} sum_{i<=j<=b_i} (pi(x/(p_i p_j)) - (j - 1)),
with b_i = pi(sqrt(x/p_i)).

DEFECT: the roots are taken as ``int(x ** (1/3))`` and ``int(x ** 0.25)``.  At an
exact cube x = p**3 the float cube root often comes out just below p
(343 ** (1/3) == 6.999999999999999), c misses the prime p, one term of value 1
is dropped, and the result is one too large.  Everywhere else it is correct.
Works up to about 10**10 (it sieves to x**(3/4)).
"""

import math
from functools import lru_cache

import numpy as np


def _prime_table(limit):
    flags = np.ones(limit + 1, dtype=bool)
    flags[:2] = False
    for p in range(2, math.isqrt(limit) + 1):
        if flags[p]:
            flags[p * p::p] = False
    primes = np.flatnonzero(flags)
    counts = np.cumsum(flags, dtype=np.int64)
    return [int(p) for p in primes], counts


def prime_pi(x):
    if x < 2:
        return 0
    limit = max(100, int(x ** 0.75) + 2)
    primes, counts = _prime_table(limit)

    def pi(y):
        return int(counts[y])

    @lru_cache(maxsize=1 << 16)
    def phi(y, k):
        """Legendre's phi: how many n <= y have no prime factor among p_1..p_k."""
        if k == 0 or y == 0:
            return y
        if y < primes[k] ** 2 and y <= limit:
            return 1 + max(0, pi(y) - k)   # only 1 and the primes in (p_k, y] remain
        return phi(y, k - 1) - phi(y // primes[k - 1], k - 1)

    if x <= limit:
        return pi(x)
    a = pi(int(x ** 0.25))                             # bug: float root
    b = pi(math.isqrt(x))
    c = pi(int(x ** (1 / 3)))                          # bug: float root
    total = phi(x, a) + (b + a - 2) * (b - a + 1) // 2
    for i in range(a + 1, b + 1):
        w = x // primes[i - 1]
        total -= pi(w)
        if i <= c:
            b_i = pi(math.isqrt(w))
            for j in range(i, b_i + 1):
                total -= pi(w // primes[j - 1]) - (j - 1)
    return total
