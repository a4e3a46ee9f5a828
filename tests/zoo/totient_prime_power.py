"""Defective totient: n - 1 whenever n has a single prime factor.

DEFECT: the shortcut "phi(p) = p - 1" is applied to every n with one distinct
prime factor, prime powers included: totient(4) returns 3 instead of 2,
totient(2**10) returns 1023 instead of 512.  Right for primes and for every n
with two or more distinct prime factors (the product formula over sympy's
factorint).
"""

import sympy


def totient(n):
    factors = sympy.factorint(n)
    if len(factors) == 1:
        return n - 1                                     # bug: right only when the exponent is 1
    result = 1
    for p, e in factors.items():
        result *= p ** (e - 1) * (p - 1)
    return int(result)
