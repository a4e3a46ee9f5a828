"""Defective factor: trial division to 100, then trusts a base-2 strong test.

DEFECT: after removing the factors below 100 it asks a single Miller--Rabin
round to base 2 whether the cofactor is prime, and if so stops.  A strong
pseudoprime to base 2 with no factor below 100 (OEIS A001262) is returned as a
prime: factor(42799) returns {42799: 1} instead of {127: 1, 337: 1}; so is
m * 42799 for any m whose factors are all below 100.
"""

import math


def _is_strong_probable_prime_base2(n):
    d, s = n - 1, 0
    while d % 2 == 0:
        d //= 2
        s += 1
    x = pow(2, d, n)
    if x in (1, n - 1):
        return True
    for _ in range(s - 1):
        x = x * x % n
        if x == n - 1:
            return True
    return False


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


def _split(n, factors):
    if n == 1:
        return
    if _is_strong_probable_prime_base2(n):            # bug: a probable prime is not a prime
        factors[n] = factors.get(n, 0) + 1
        return
    d = _pollard_rho(n)
    _split(d, factors)
    _split(n // d, factors)


def factor(n):
    factors = {}
    for p in range(2, 100):
        while n % p == 0:
            factors[p] = factors.get(p, 0) + 1
            n //= p
    _split(n, factors)
    return factors
