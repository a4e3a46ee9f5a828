"""Defective next_prime: candidates kept in an unsigned 32-bit integer.

DEFECT: emulates ``uint32_t candidate``: the search wraps past 2**32 - 1 to 0
and then finds 2.  Correct for n < 4294967291 (the largest prime below 2**32);
next_prime(4294967291) returns 2 instead of 4294967311, and every n >= 2**32 is
answered as next_prime(n mod 2**32).
"""

import sympy


def next_prime(n):
    candidate = (n + 1) & 0xFFFFFFFF                   # bug: 32-bit wrap
    while not sympy.isprime(candidate):
        candidate = (candidate + 1) & 0xFFFFFFFF
    return candidate
