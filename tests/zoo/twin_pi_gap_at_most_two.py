"""Defective twin_pi: counts consecutive primes whose gap is at most 2.

DEFECT: the test ``q - p <= 2`` also accepts (2, 3), so the count is one too
large for every x >= 3 (twin_pi(3) returns 1, twin_pi(5) returns 2).
"""

import primesieve


def twin_pi(x):
    primes = primesieve.primes(x) if x >= 2 else []
    return sum(1 for p, q in zip(primes, primes[1:]) if q - p <= 2)
