"""Defective is_prime: trial division with range(2, isqrt(n)), the +1 forgotten.

DEFECT: the divisor isqrt(n) itself is never tried, so a composite whose
smallest prime factor is isqrt(n) is called prime: the squares of primes (4,
9, 25, 49, ...) and the products p*q of primes with p = isqrt(p*q) (6, 8, 15,
35, ...).  Every other composite has a divisor below isqrt(n).
"""

import math


def is_prime(n):
    if n < 2:
        return False
    for d in range(2, math.isqrt(n)):                  # bug: range end should be isqrt(n) + 1
        if n % d == 0:
            return False
    return True
