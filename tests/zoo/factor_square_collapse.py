"""Defective factor: records both halves of a Pollard-rho split with exponent 1.

DEFECT: after trial division below 1000, a composite cofactor m is split by
Pollard's rho (Pollard 1975, BIT 15) as d * (m // d) and stored as
``{d: 1, m // d: 1}``.  When m = p**2 the two keys coincide and the exponent
collapses to 1: factor(1009**2) returns {1009: 1}.  Also wrong when m has more
than two prime factors, but correct for every n whose part above 1000 is 1, a
prime, or a product of two distinct primes.
"""

import math

import sympy


def _pollard_rho(n):
    for c in range(1, 100):
        x = y = 2
        d = 1
        while d == 1:
            x = (x * x + c) % n
            y = (y * y + c) % n
            y = (y * y + c) % n
            d = math.gcd(x - y, n)
        if d != n:
            return d
    raise ArithmeticError(f"no factor of {n} found")


def factor(n):
    factors = {}
    for p in range(2, 1000):
        while n % p == 0:
            factors[p] = factors.get(p, 0) + 1
            n //= p
    if n == 1:
        return factors
    if sympy.isprime(n):
        factors[n] = 1
        return factors
    d = _pollard_rho(n)
    factors[d] = 1                                     # bug: d == n // d overwrites
    factors[n // d] = 1
    return factors
