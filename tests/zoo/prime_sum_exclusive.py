"""Defective prime_sum: sums the primes p < x.

DEFECT: the sieve array has length x, so x itself is never looked at: the sum
is short by x exactly when x is prime (prime_sum(2) returns 0).
"""

import numpy as np


def prime_sum(x):
    if x < 2:
        return 0
    flags = np.ones(x, dtype=bool)                    # bug: indices 0 .. x-1 only
    flags[:2] = False
    for p in range(2, int(x**0.5) + 1):
        if flags[p]:
            flags[p * p::p] = False
    return int(np.flatnonzero(flags).astype(np.int64).sum())
