"""Defective prev_prime: returns n itself when n is prime.

DEFECT: the search starts at n instead of n - 1 (largest prime <= n), so
prev_prime(7) returns 7.  Correct at every composite n.
"""

import sympy


def prev_prime(n):
    candidate = n
    while not sympy.isprime(candidate):                # bug: should start at n - 1
        candidate -= 1
    return candidate
