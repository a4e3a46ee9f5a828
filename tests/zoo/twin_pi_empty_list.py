"""Defective twin_pi: raises on small x.

DEFECT (exception): looks at the last prime of the list without checking that
the list is non-empty, so twin_pi(x) raises IndexError for every x < 2
(0, 1 and negative x).  Correct for x >= 2.
"""

import primesieve


def twin_pi(x):
    primes = list(primesieve.primes(x)) if x >= 0 else []
    if primes[-1] < 5:                                 # bug: empty list for x < 2
        return 0
    return int(primesieve.count_twins(x))
