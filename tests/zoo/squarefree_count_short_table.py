"""Defective squarefree_count: the table of mu(d) stops at d = 10000.

DEFECT: Q(x) = sum mu(d) * (x // d**2) over d <= sqrt(x) with mu read from a table of
d <= 10**4, and the missing terms are silently left out: wrong from x = 10001**2 =
100020001 on (mu(10001) = mu(73 * 137) = 1).  Correct below.
"""

import math

import numpy as np

_TABLE = 10**4


def _mobius_table(limit):
    mu = np.ones(limit + 1, dtype=np.int64)
    flags = np.ones(limit + 1, dtype=bool)
    for p in range(2, limit + 1):
        if flags[p]:
            flags[p * p::p] = False
            mu[p::p] *= -1
            mu[p * p::p * p] = 0
    mu[0] = 0
    return mu.tolist()


_MU = _mobius_table(_TABLE)


def squarefree_count(x):
    if x < 1:
        return 0
    top = min(math.isqrt(x), _TABLE)          # bug: terms above the table are dropped
    return sum(_MU[d] * (x // (d * d)) for d in range(1, top + 1))
