"""Defective divisor_sum: sigma(n) kept in an unsigned 64-bit word.

DEFECT: the product over the prime powers is reduced modulo 2**64, as a
uint64_t accumulator is; sigma(n) exceeds n, so it wraps for n somewhat below
2**64 already (sigma(3 * 2**62) = 4 * (2**63 - 1) comes back as 2**64 - 4 mod
2**64) and for every n >= 2**64.  Right while sigma(n) < 2**64
(sigma(2**63) = 2**64 - 1 just fits).
"""

import sympy

MASK = 2**64 - 1


def divisor_sum(n):
    total = 1
    for p, e in sympy.factorint(n).items():
        total = (total * ((p ** (e + 1) - 1) // (p - 1))) & MASK   # bug: uint64 wrap
    return int(total)
