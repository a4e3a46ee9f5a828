"""Defective next_prime: returns n itself when n is prime.

DEFECT: the search starts at n instead of n + 1 (smallest prime >= n), so
next_prime(7) returns 7.  Correct at every composite n.
"""

import sympy


def next_prime(n):
    candidate = max(n, 2)
    while not sympy.isprime(candidate):                # bug: should start at n + 1
        candidate += 1
    return candidate
