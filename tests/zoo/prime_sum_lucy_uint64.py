"""Defective prime_sum: Lucy_Hedgehog's method over the values floor(x/n), in numpy uint64.

The method keeps S(v), the sum of the integers 2..v not yet crossed off, for every
v = floor(x/n), and for each prime p <= sqrt(x) subtracts p * (S(v/p) - S(p-1)).
Run in uint64 arrays every step wraps modulo 2**64, so the result is right modulo
2**64 (an unsigned 64-bit sum, as in C with uint64_t).

DEFECT: the sum of the primes up to x passes 2**64 - 1 near x = 3e10, and from
there on the answer is short by 2**64.  Correct below; fast (about a second at
10**10), so only an audit that asks x above that crossing sees it.
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
    # S(v) = 2 + 3 + ... + v, exact, then wrapped into uint64 (mod 2**64)
    start = [(v * (v + 1) // 2 - 1) % 2**64 for v in values]
    sums = np.array(start, dtype=np.uint64)
    v_arr = np.array(values, dtype=np.int64)
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
            sums[:m] -= np.uint64(p) * (sums[index_of(targets)] - below)  # bug: uint64 wraps
    return int(sums[0])
