"""Defective primes_in: an odd-only sieve that forgets to add 2.

DEFECT: the sieve stores only odd numbers and the special case for 2 is
missing, so 2 is lost from every range that contains it
(primes_in(0, 10) returns [3, 5, 7]).  Ranges starting at 3 or above are right.
"""

import math


def primes_in(a, b):
    if b < 3:
        return []
    size = (b - 1) // 2                                # index i stands for 2i + 1, i >= 1
    flags = bytearray([1]) * (size + 1)
    flags[0] = 0
    for i in range(1, (math.isqrt(b) - 1) // 2 + 1):
        if flags[i]:
            p = 2 * i + 1
            flags[p * p // 2::p] = bytes(len(range(p * p // 2, size + 1, p)))
    return [2 * i + 1 for i in range(1, size + 1) if flags[i] and 2 * i + 1 >= a]   # bug: 2 is missing
