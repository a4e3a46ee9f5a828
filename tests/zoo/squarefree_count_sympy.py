"""Correct squarefree_count: Q(x) = sum over d <= sqrt(x) of mu(d) * (x // d**2), mu from sympy.

The Moebius values come from sympy.sieve.mobiusrange and are kept between calls.
"""

import math

import sympy

_MU = [0]          # _MU[d] = mu(d)


def squarefree_count(x):
    if x < 1:
        return 0
    root = math.isqrt(x)
    if root >= len(_MU):
        _MU.extend(sympy.sieve.mobiusrange(len(_MU), root + 1))
    return sum(_MU[d] * (x // (d * d)) for d in range(1, root + 1) if _MU[d])
