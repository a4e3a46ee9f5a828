"""Defective totient: Euler's product n * prod(1 - 1/p) evaluated in floats.

DEFECT: ``phi = phi * (p - 1) / p`` uses true division, so phi becomes a
float: int() truncates a step that lands just below an integer
(totient(3**19 - 2) = totient(1162261465) comes back as 929809167, one short) and
the low bits are lost once phi passes 2**53 (totient(2**60 + 3) is off;
totient(2**64 + 1) happens to come out right).  Right for small n, where every
step is exact.
"""

import sympy


def totient(n):
    phi = n
    for p in sympy.factorint(n):
        phi = phi * (p - 1) / p                          # bug: float arithmetic
    return int(phi)
