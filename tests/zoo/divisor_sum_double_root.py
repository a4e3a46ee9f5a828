"""Defective divisor_sum: pairs (i, n // i) up to the square root, the root counted twice.

DEFECT: for every divisor i <= isqrt(n) both i and n // i are added, also when
i * i == n: divisor_sum(4) returns 9 instead of 7, divisor_sum(9) 16 instead of
13.  Right for every n that is not a perfect square.  O(sqrt n) per call.
"""

import math


def divisor_sum(n):
    total = 0
    for i in range(1, math.isqrt(n) + 1):
        if n % i == 0:
            total += i + n // i                          # bug: i == n // i is added twice
    return total
