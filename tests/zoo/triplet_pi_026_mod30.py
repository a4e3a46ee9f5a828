"""Defective triplet_pi_026: looks only at p = 30k + 11 and 30k + 17.

DEFECT: every triplet (p, p + 2, p + 6) with p > 5 has p = 11 or 17 (mod 30), and this
member steps through those residues only -- forgetting the exception (5, 7, 11), so it
is one short for every x >= 11.
"""

import primesieve


def triplet_pi_026(x):
    found = set(primesieve.primes(x))
    return sum(1 for k in range(0, x + 1, 30) for p in (k + 11, k + 17)
               if p + 6 <= x and p in found and p + 2 in found and p + 6 in found)
