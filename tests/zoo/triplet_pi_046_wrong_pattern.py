"""Defective triplet_pi_046: copied from the other triplet count, offsets left at (0, 2, 6).

DEFECT: it counts (p, p + 2, p + 6) instead of (p, p + 4, p + 6): wrong from x = 11 on,
where (5, 7, 11) is counted though no (p, p + 4, p + 6) lies below 13.
"""

import primesieve

OFFSETS = (0, 2, 6)                    # bug: should be (0, 4, 6)


def triplet_pi_046(x):
    found = set(primesieve.primes(x))
    return sum(1 for p in found if p + 6 <= x and all(p + d in found for d in OFFSETS))
