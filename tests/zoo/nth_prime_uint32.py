"""Defective nth_prime: the result is stored in an unsigned 32-bit integer.

DEFECT: emulates a ``uint32_t`` return value: p_n is reduced mod 2**32.  Correct
while p_n < 2**32, i.e. n <= pi(2**32) = 203280221; nth_prime(203280222)
returns 15 (the true value is 4294967311).
"""

import primecountpy


def nth_prime(n):
    return int(primecountpy.nth_prime(n)) & 0xFFFFFFFF   # bug: silent truncation
