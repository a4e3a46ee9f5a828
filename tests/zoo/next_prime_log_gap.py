"""Defective next_prime: sizes its search window with math.log(n).

DEFECT (exception): the window ``2 * log(n)**2 + 2`` (after Cramer's
conjecture) calls math.log(0) for n = 0 and raises ValueError ("math domain
error"); negative n raise too.  Correct for n >= 1.
"""

import math

import sympy


def next_prime(n):
    window = int(2 * math.log(n) ** 2) + 2             # bug: log(0) raises
    while True:
        for candidate in range(n + 1, n + 1 + window):
            if sympy.isprime(candidate):
                return candidate
        n += window
