"""Defective quadruplet_pi: counts a constellation once its first member is <= x.

DEFECT: the constellations are found in a sieve up to x + 8 and counted by
their smallest member p <= x instead of their largest, so the count is too large
whenever p <= x < p + 8 for some constellation.
"""

import primesieve

OFFSETS = (0, 2, 6, 8)


def quadruplet_pi(x):
    if x < 2:
        return 0
    found = set(primesieve.primes(x + OFFSETS[-1]))
    return sum(1 for p in found if p <= x and all(p + d in found for d in OFFSETS))   # bug: p, not p + 8
