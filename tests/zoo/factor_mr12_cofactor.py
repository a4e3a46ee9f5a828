"""Defective factor: trial division, Pollard--Brent rho, and a primality test used
beyond the range where it is proven.

DEFECT: a cofactor is taken for prime when it passes the strong test to the
first twelve prime bases, deterministic only below A014233(12) =
318665857834031151167461 (OEIS A014233).  factor(318665857834031151167461)
returns {318665857834031151167461: 1} instead of {399165290221: 1,
798330580441: 1}.  Right for every n below that bound.
"""

import math
import random

BASES = (2, 3, 5, 7, 11, 13, 17, 19, 23, 29, 31, 37)


def _passes_strong_tests(n):
    for p in BASES:
        if n % p == 0:
            return n == p
    d, s = n - 1, 0
    while d % 2 == 0:
        d //= 2
        s += 1
    for a in BASES:                                   # bug: deterministic only below 3.18e23
        x = pow(a, d, n)
        if x in (1, n - 1):
            continue
        for _ in range(s - 1):
            x = x * x % n
            if x == n - 1:
                break
        else:
            return False
    return True


def _brent(n, rng):
    """A non-trivial divisor of the odd composite n (Brent's variant of Pollard's rho)."""
    while True:
        y, c, m = rng.randrange(1, n), rng.randrange(1, n), 128
        g, r, q = 1, 1, 1
        while g == 1:
            x = y
            for _ in range(r):
                y = (y * y + c) % n
            k = 0
            while k < r and g == 1:
                ys = y
                for _ in range(min(m, r - k)):
                    y = (y * y + c) % n
                    q = q * abs(x - y) % n
                g = math.gcd(q, n)
                k += m
            r *= 2
        if g == n:
            g = 1
            while g == 1:
                ys = (ys * ys + c) % n
                g = math.gcd(abs(x - ys), n)
        if g != n:
            return g


def _split(n, found, rng):
    if n == 1:
        return
    if _passes_strong_tests(n):
        found[n] = found.get(n, 0) + 1
        return
    d = _brent(n, rng)
    _split(d, found, rng)
    _split(n // d, found, rng)


def factor(n):
    if n < 1:
        raise ValueError("factor(n) needs n >= 1")
    found = {}
    for p in range(2, 1000):
        while n % p == 0:
            found[p] = found.get(p, 0) + 1
            n //= p
    _split(n, found, random.Random(n))
    return dict(sorted(found.items()))
