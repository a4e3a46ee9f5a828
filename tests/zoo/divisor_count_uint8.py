"""Defective divisor_count: the count kept in an unsigned 8-bit word.

DEFECT: the product of (e + 1) is stored in a ctypes.c_uint8, as a C
implementation sized for "small" divisor counts would: d(n) >= 256 wraps
modulo 256.  divisor_count(2**5 * 3**3 * 5 * 7**2 * 11 * 13) = 576 comes back
as 64.  Right wherever d(n) < 256.
"""

import ctypes

import sympy


def divisor_count(n):
    count = ctypes.c_uint8(1)
    for e in sympy.factorint(n).values():
        count = ctypes.c_uint8(count.value * (e + 1))    # bug: wraps modulo 256
    return count.value
