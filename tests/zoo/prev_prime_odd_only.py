"""Defective prev_prime: only ever tries odd candidates, so it never returns 2.

DEFECT: steps down through odd numbers and stops above 1; for n = 3 there is
no odd candidate left and it returns None instead of 2.  Correct for n >= 4.
"""

import sympy


def prev_prime(n):
    start = n - 1 if n % 2 == 0 else n - 2
    for candidate in range(start, 1, -2):              # bug: 2 is even
        if sympy.isprime(candidate):
            return candidate
    return None
