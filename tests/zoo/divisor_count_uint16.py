"""Defective divisor_count: the count kept in an unsigned 16-bit word.

DEFECT: the product of (e + 1) is stored in a ctypes.c_uint16, as a C
implementation sized by "d(n) is at most a few thousand" would: d(n) >= 65536
wraps modulo 65536.  That happens first at 106858629141264000 =
2**7 * 3**3 * 5**3 * 7 * 11 * 13 * 17 * 19 * 23 * 29 * 31 * 37, the least
n with 65536 divisors (a highly composite number, OEIS A002182), which comes
back as 0.  Right wherever d(n) < 65536.
"""

import ctypes

import sympy


def divisor_count(n):
    count = ctypes.c_uint16(1)
    for e in sympy.factorint(n).values():
        count = ctypes.c_uint16(count.value * (e + 1))    # bug: wraps modulo 65536
    return count.value
