"""Defective factor: returns the two halves of a Pollard-rho split without testing them.

DEFECT: after trial division below 1000 the cofactor is split once by
Pollard's rho and both parts are reported as primes, with no recursion, so a
cofactor with three or more prime factors yields a composite "prime":
factor(1009 * 1013 * 1019) returns a pair containing a product of two of them.
Correct when the part above 1000 is 1, a prime, or a product of two primes.
Returns a list of (prime, exponent) pairs.
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
    counts = {}
    for p in range(2, 1000):
        while n % p == 0:
            counts[p] = counts.get(p, 0) + 1
            n //= p
    if n > 1:
        if sympy.isprime(n):
            counts[n] = counts.get(n, 0) + 1
        else:
            d = _pollard_rho(n)
            for part in (d, n // d):                   # bug: the parts may be composite
                counts[part] = counts.get(part, 0) + 1
    return sorted(counts.items())
