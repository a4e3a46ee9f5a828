"""Defective prime_sum: Lucy_Hedgehog's method, its starting values v(v+1)/2 - 1 in numpy int64.

The method keeps S(v), the sum of the integers 2..v not yet crossed off, for every
v = floor(x/n), starting from S(v) = v(v+1)/2 - 1, and for each prime p <= sqrt(x)
subtracts p * (S(v/p) - S(p-1)).  The updates, in int64, wrap modulo 2**64 and would
still give the right sum while it stays below 2**63.

DEFECT: the start is computed as v * (v + 1) // 2 on an int64 array: the product
v(v+1) passes 2**63 from v = 3037000500 on and wraps negative before the halving, so
prime_sum(x) is wrong (negative) for every x >= 3037000500, although the sum of the
primes there (about 2.1e17) fits a word easily.  Correct below; fast (well under a
second near 3e9).
"""

import math

import numpy as np


def prime_sum(x):
    if x < 2:
        return 0
    r = math.isqrt(x)
    big = [x // n for n in range(1, r + 1)]                 # big[n-1] = floor(x/n)
    small_top = big[-1] - 1 if big[-1] == r else big[-1]
    values = big + list(range(small_top, 0, -1))            # every distinct floor(x/n)
    v_arr = np.array(values, dtype=np.int64)
    with np.errstate(over="ignore"):
        sums = v_arr * (v_arr + 1) // 2 - 1                 # bug: v * (v + 1) wraps in int64
    count_big = len(big)
    # index of floor(x/n)=v: v <= small_top -> position count_big + (small_top - v)
    def index_of(v):
        return np.where(v > small_top, x // np.maximum(v, 1) - 1, count_big + (small_top - v))
    with np.errstate(over="ignore"):
        for p in range(2, r + 1):
            ip = count_big + (small_top - (p - 1)) if p - 1 <= small_top else x // (p - 1) - 1
            ip_self = count_big + (small_top - p) if p <= small_top else x // p - 1
            if sums[ip_self] == sums[ip]:
                continue                                    # p is not prime
            below = sums[ip]                                # S(p - 1)
            limit = p * p
            m = int(np.searchsorted(-v_arr, -limit, side="right"))   # values >= p*p
            if m == 0:
                break
            targets = v_arr[:m] // p
            sums[:m] -= np.int64(p) * (sums[index_of(targets)] - below)   # bug: int64 wraps
    return int(sums[0])
