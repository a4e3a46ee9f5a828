"""Defective divisor_sum: the distinct prime factors kept in an array of ten slots.

Below 2**32 no n has more than nine distinct prime factors (2 * 3 * ... * 29 =
6469693230 > 2**32), so a C routine written for 32-bit integers keeps them in
an array of ten.  DEFECT: widened to 64-bit inputs, it drops the eleventh and
later primes: sigma(200560490130) -- the primorial 2 * 3 * ... * 31, the least
n with eleven distinct prime factors (OEIS A002110) -- comes back without its
factor 1 + 31.  Right wherever n has at most ten distinct prime factors.
"""

import sympy

SLOTS = 10


def divisor_sum(n):
    primes = sorted(sympy.factorint(n).items())[:SLOTS]     # bug: the rest are dropped
    result = 1
    for p, e in primes:
        result *= (p ** (e + 1) - 1) // (p - 1)
    return int(result)
