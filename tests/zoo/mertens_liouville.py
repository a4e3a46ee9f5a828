"""Defective mertens: takes mu(n) = (-1)^Omega(n), counting prime factors with multiplicity.

DEFECT: the sieve flips the sign once per prime power dividing n but never sets
mu(n) = 0 on multiples of squares, so it sums Liouville's lambda instead of mu:
wrong from x = 4 on (lambda(4) = 1, mu(4) = 0).
"""

import numpy as np


def mertens(x):
    if x < 1:
        return 0
    sign = np.ones(x + 1, dtype=np.int64)
    rest = np.arange(x + 1, dtype=np.int64)
    for p in range(2, x + 1):
        if rest[p] == p:                      # p is prime: nothing smaller divided it
            power = p
            while power <= x:
                sign[power::power] *= -1      # bug: no zero on the multiples of p*p
                rest[power::power] //= p
                power *= p
    return int(sign[1:].sum())
