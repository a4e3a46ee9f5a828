"""Defective quadruplet_pi: looks only at p = 30k + 11.

DEFECT: every prime quadruplet (p, p + 2, p + 6, p + 8) except (5, 7, 11, 13) has
p = 11 (mod 30); this member steps through that residue only and forgets the
exception, so it is one short for every x >= 13.
"""

import primesieve


def quadruplet_pi(x):
    found = set(primesieve.primes(x))
    return sum(1 for p in range(11, x + 1, 30)
               if p + 8 <= x and all(p + d in found for d in (0, 2, 6, 8)))
