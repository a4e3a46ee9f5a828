"""Defective is_prime: one Miller--Rabin round with a random base.

DEFECT (nondeterminism): below 10**6 it is exact (trial division), above that
it draws one random base per call, so on a composite with many strong liars
the answer changes from call to call.  Rabin (1980, J. Number Theory 12): at
most 1/4 of the bases are strong liars, and n = p(2p - 1) with both factors
prime comes close to that bound: for 2741311 = 1171 * 2341 about one call in
four returns True.  The bases come from a generator seeded once at import, so
that every fresh process draws the same sequence (an audit of the member is
reproducible) while repeated calls in one process still disagree.
"""

import math
import random

_BASES = random.Random(19800101)


def _is_strong_probable_prime(n, base):
    d, s = n - 1, 0
    while d % 2 == 0:
        d //= 2
        s += 1
    x = pow(base, d, n)
    if x in (1, n - 1):
        return True
    for _ in range(s - 1):
        x = x * x % n
        if x == n - 1:
            return True
    return False


def is_prime(n):
    if n < 2:
        return False
    if n < 10**6:
        return all(n % d for d in range(2, math.isqrt(n) + 1))
    if n % 2 == 0:
        return False
    return _is_strong_probable_prime(n, _BASES.randrange(2, n - 1))   # bug: random, one round
