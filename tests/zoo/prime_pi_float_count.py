"""Defective prime_pi: returns a float.

DEFECT (wrong type): the sieve is built with ``numpy.ones`` whose default dtype is
float64, so the sum is a ``numpy.float64`` such as 25.0 -- numerically right
(below 2**53), but a float where a count (an int) is required.  For x < 2 it
returns the int 0, so the type depends on the input.
"""

import math

import numpy as np


def prime_pi(x):
    if x < 2:
        return 0
    flags = np.ones(x + 1)                             # bug: float64 by default
    flags[:2] = 0
    for p in range(2, math.isqrt(x) + 1):
        if flags[p]:
            flags[p * p::p] = 0
    return flags.sum()
