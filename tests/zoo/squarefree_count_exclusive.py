"""Defective squarefree_count: counts the squarefree n < x.

DEFECT: the flags cover 1 .. x - 1 only, so x itself is never counted: one short
exactly when x is squarefree (squarefree_count(1) returns 0).
"""

import numpy as np


def squarefree_count(x):
    if x < 1:
        return 0
    free = np.ones(x, dtype=bool)              # bug: indices 0 .. x-1
    free[0] = False
    d = 2
    while d * d < x:
        free[d * d::d * d] = False
        d += 1
    return int(np.count_nonzero(free))
