"""Defective primes_in: closed segments that share their end points.

DEFECT: the range is cut into segments [a + k*2**16, a + (k+1)*2**16], closed on
both sides, so a prime sitting exactly on a seam is reported twice.  With a = 1
the first seam is 65537 (a Fermat prime): primes_in(1, 70000) lists it twice.
Ranges shorter than 2**16 are right.
"""

import primesieve

SEGMENT = 1 << 16


def primes_in(a, b):
    a = max(a, 0)
    found = []
    for low in range(a, b + 1, SEGMENT):
        high = min(low + SEGMENT, b)                   # bug: the seam belongs to both segments
        found.extend(int(p) for p in primesieve.primes(low, high))
    return found
