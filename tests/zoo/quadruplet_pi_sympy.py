"""Correct quadruplet_pi: looks the pattern (0, 2, 6, 8) up in sympy's cached sieve.

A constellation p + (0, 2, 6, 8) counts once its last member is <= x.
"""

import bisect

import sympy

OFFSETS = (0, 2, 6, 8)


def quadruplet_pi(x):
    if x < OFFSETS[-1] + 2:
        return 0
    sympy.sieve.extend(x)
    listed = sympy.sieve._list
    primes = listed[:bisect.bisect_right(listed, x)]
    found = set(primes)
    return sum(1 for p in primes if p + OFFSETS[-1] <= x and all(p + d in found for d in OFFSETS))
