"""Defective twin_pi: tests the smaller member of the pair against x.

DEFECT: counts pairs (p, p + 2) with p <= x instead of p + 2 <= x, so it is one
too large whenever p <= x < p + 2 for a twin pair, e.g. twin_pi(3) returns 1
(counting (3, 5)) and twin_pi(12) returns 3 (counting (11, 13)).
"""

import primesieve


def twin_pi(x):
    if x < 3:
        return 0
    primes = primesieve.primes(x + 2)
    return sum(1 for p, q in zip(primes, primes[1:]) if q - p == 2 and p <= x)
