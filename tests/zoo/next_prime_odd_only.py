"""Defective next_prime: only ever tries odd candidates, so it skips 2.

DEFECT: the first candidate is the odd number above n, ``(n + 1) | 1``; for
n <= 1 that is 1 or 3 and 2 is never tried: next_prime(1) and next_prime(0)
return 3 instead of 2.  Correct for n >= 2.
"""

import sympy


def next_prime(n):
    candidate = (n + 1) | 1                            # bug: 2 is even
    while candidate < 3 or not sympy.isprime(candidate):
        candidate += 2
    return candidate
