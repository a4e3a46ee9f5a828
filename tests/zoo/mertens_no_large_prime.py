"""Defective mertens: forgets the one prime factor above the square root.

DEFECT: mu is sieved with the primes p <= sqrt(x) only, and the cofactor left over
(a prime above sqrt(x)) never flips the sign: every such n is given the sign of its
small part, so mertens(2) returns 2 instead of 0 (mu(2) counted as +1).
"""

import math

import numpy as np


def mertens(x):
    if x < 1:
        return 0
    mu = np.ones(x + 1, dtype=np.int64)
    root = math.isqrt(x)
    flags = np.ones(root + 1, dtype=bool)
    for p in range(2, root + 1):
        if flags[p]:
            flags[p * p::p] = False
            mu[p::p] *= -1
            mu[p * p::p * p] = 0
    return int(mu[1:].sum())                  # bug: the prime cofactor > sqrt(x) is ignored
