"""Defective prime_pi: an odd-only sieve whose cache forgets the prime 2.

DEFECT (nondeterministic): the sieve counts the odd primes up to x; a first
call adds 1 for the prime 2 before answering, but the cache keeps the odd
count, so asking again at the same x >= 2 returns prime_pi(x) - 1.  Every
first answer is right.
"""

import math

import numpy as np

_CACHE = {}


def _odd_primes_up_to(x):
    """The number of odd primes p <= x (x >= 2)."""
    size = (x - 1) // 2                                # flags[i] stands for 2*i + 3
    flags = np.ones(size, dtype=bool)
    for i in range((math.isqrt(x) - 1) // 2):
        if flags[i]:
            p = 2 * i + 3
            flags[(p * p - 3) // 2::p] = False
    return int(np.count_nonzero(flags))


def prime_pi(x):
    if x < 2:
        return 0
    if x in _CACHE:
        return _CACHE[x]                               # bug: the cached count lacks the prime 2
    count = _odd_primes_up_to(x)
    _CACHE[x] = count
    return count + 1
