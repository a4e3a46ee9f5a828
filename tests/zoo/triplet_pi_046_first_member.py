"""Defective triplet_pi_046: counts a constellation once its first member is <= x.

DEFECT: the constellations are found in a sieve up to x + 6 and counted by
their smallest member p <= x instead of their largest, so the count is too large
whenever p <= x < p + 6 for some constellation.
"""

import primesieve

OFFSETS = (0, 4, 6)


def triplet_pi_046(x):
    if x < 2:
        return 0
    found = set(primesieve.primes(x + OFFSETS[-1]))
    return sum(1 for p in found if p <= x and all(p + d in found for d in OFFSETS))   # bug: p, not p + 6
