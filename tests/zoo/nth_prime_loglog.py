"""Defective nth_prime: sieve sized by Rosser's bound n(ln n + ln ln n), also at n = 1.

DEFECT (exception): p_n < n(ln n + ln ln n) is proven for n >= 6 (Rosser
1941); here the bound, padded by 3 so that 2 <= n <= 5 fit too, is computed
for every n, and at n = 1 ln ln 1 = ln 0 raises ValueError (math domain
error).  Correct for n >= 2.
"""

import math

import numpy as np


def nth_prime(n):
    limit = int(n * (math.log(n) + math.log(math.log(n)))) + 3   # bug: log(log(1)) = log(0)
    flags = np.ones(limit + 1, dtype=bool)
    flags[:2] = False
    for p in range(2, math.isqrt(limit) + 1):
        if flags[p]:
            flags[p * p::p] = False
    return int(np.flatnonzero(flags)[n - 1])
