"""Defective prev_prime: the argument is stored in an unsigned 32-bit integer.

DEFECT: emulates a ``uint32_t`` parameter: n is reduced mod 2**32 first, so
prev_prime(2**32 + 20) returns 19.  Correct for 3 <= n < 2**32.
"""

import sympy


def prev_prime(n):
    n32 = n & 0xFFFFFFFF                               # bug: silent truncation
    return int(sympy.prevprime(n32)) if n32 >= 3 else 2
