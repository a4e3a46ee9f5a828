"""Defective factor: Brent's rho with batched gcds and no backtracking.

DEFECT: Brent's variant multiplies 64 differences |x - y| together before one
gcd.  When the batch holds both prime factors at once the gcd is n itself; the
published algorithm then backtracks over the batch one gcd at a time (Brent
1980).  This routine skips the backtracking and, having seen gcd = n, takes n
for prime.  Trial division below 100 and a deterministic Miller--Rabin test
(bases 2..37, proven below 3.3e24) are right; the defect shows where the two
smallest prime factors of a cofactor fall in one batch, which is common when
they are close or equal (squares of primes above 100, products of primes with
the same rho period).
"""

import math

BASES = (2, 3, 5, 7, 11, 13, 17, 19, 23, 29, 31, 37)


def _is_prime(n):
    if n < 2:
        return False
    for p in BASES:
        if n % p == 0:
            return n == p
    d, s = n - 1, 0
    while d % 2 == 0:
        d //= 2
        s += 1
    for a in BASES:
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


def _brent_without_backtracking(n):
    """A divisor of n, or n itself when the batched gcd collapsed (no backtracking)."""
    y, c, m = 2, 1, 64
    g, r, q = 1, 1, 1
    while g == 1:
        x = y
        for _ in range(r):
            y = (y * y + c) % n
        k = 0
        while k < r and g == 1:
            for _ in range(min(m, r - k)):
                y = (y * y + c) % n
                q = q * abs(x - y) % n
            g = math.gcd(q, n)
            k += m
        r *= 2
    return g                                           # bug: g == n is not retried


def _split(n, found):
    if n == 1:
        return
    if _is_prime(n):
        found[n] = found.get(n, 0) + 1
        return
    d = _brent_without_backtracking(n)
    if d == n:
        found[n] = found.get(n, 0) + 1                 # bug: taken for a prime
        return
    _split(d, found)
    _split(n // d, found)


def factor(n):
    if n < 1:
        raise ValueError("factor(n) needs n >= 1")
    found = {}
    for p in range(2, 100):
        while n % p == 0:
            found[p] = found.get(p, 0) + 1
            n //= p
    _split(n, found)
    return dict(sorted(found.items()))
