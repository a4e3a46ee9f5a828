"""Defective factor: factor(1) returns {1: 1}.

DEFECT: the author treats 1 as "its own factor" for the empty product; the
convention is factor(1) == {} (1 has no prime factors).  Everything else is
right (sympy.factorint).
"""

import sympy


def factor(n):
    if n == 1:
        return {1: 1}                                  # bug: 1 is not a prime factor
    return {int(p): int(e) for p, e in sympy.factorint(n).items()}
