"""Correct prime_sum: Lucy_Hedgehog's method in numpy, run twice and joined exactly.

S(v), the sum of 2..v not yet crossed off, is kept for every v = floor(x/n); for each
prime p <= sqrt(x), S(v) -= p * (S(v/p) - S(p-1)) for v >= p*p.  One pass runs in uint64
(exact modulo 2**64), one modulo the prime 2**31 - 1 (int64, no overflow: p < 2**20 times
a residue < 2**31); the Chinese remainder theorem joins them, exact for sums below
2**64 * (2**31 - 1) -- far above any x this candidate can reach (about 2 s at 10**10).
"""

import math

import numpy as np

_MODULUS = 2**31 - 1


def _residue(x, modulus):
    root = math.isqrt(x)
    large = [x // n for n in range(1, root + 1)]
    top_small = large[-1] - 1 if large[-1] == root else large[-1]
    values = np.array(large + list(range(top_small, 0, -1)), dtype=np.int64)
    start = [v * (v + 1) // 2 - 1 for v in values.tolist()]
    if modulus is None:
        sums = np.array([s % 2**64 for s in start], dtype=np.uint64)
    else:
        sums = np.array([s % modulus for s in start], dtype=np.int64)
    count_large = len(large)

    def position(v):
        return np.where(v > top_small, x // np.maximum(v, 1) - 1, count_large + (top_small - v))

    def at(v):
        return count_large + (top_small - v) if v <= top_small else x // v - 1

    with np.errstate(over="ignore"):
        for p in range(2, root + 1):
            if sums[at(p)] == sums[at(p - 1)]:
                continue
            reach = int(np.searchsorted(-values, -p * p, side="right"))
            if reach == 0:
                break
            difference = sums[position(values[:reach] // p)] - sums[at(p - 1)]
            if modulus is None:
                sums[:reach] -= np.uint64(p) * difference
            else:
                sums[:reach] = (sums[:reach] - p * (difference % modulus)) % modulus
    return int(sums[0])


def prime_sum(x):
    if x < 2:
        return 0
    low, other = _residue(x, None), _residue(x, _MODULUS)
    k = (other - low) * pow(2**64, -1, _MODULUS) % _MODULUS
    return low + 2**64 * k
