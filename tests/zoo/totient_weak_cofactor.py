"""Defective totient: the cofactor left by trial division is declared prime by Miller--Rabin to bases 2, 7, 61.

Bases 2, 7, 61 decide primality below 4759123141 (G. Jaeschke 1993, Math.
Comp. 61).  DEFECT: the factoriser behind phi trusts them at every size, so the
strong pseudoprime 4759123141 = 48781 * 97561 is taken for a prime and
totient(4759123141) comes back as 4759123140 (right: 48780 * 97560).  Perfect
powers are split first and Pollard rho splits the other composites, so it is
right wherever no cofactor is a strong pseudoprime to the three bases.
"""

import math

SMALL_PRIMES = [p for p in range(2, 1000) if all(p % q for q in range(2, int(p ** 0.5) + 1))]


def _is_strong_probable_prime(n, base):
    d, s = n - 1, 0
    while d % 2 == 0:
        d //= 2
        s += 1
    x = pow(base, d, n)
    if x in (1, n - 1):
        return True
    for _ in range(s - 1):
        x = x * x % n
        if x == n - 1:
            return True
    return False


def _looks_prime(m):
    return all(_is_strong_probable_prime(m, a) for a in (2, 7, 61) if a % m)   # bug: any size


def _root(m):
    """(r, k) with r**k == m and k as large as possible."""
    for k in range(m.bit_length(), 1, -1):
        r = round(m ** (1 / k)) if m < 2**1000 else 2
        for c in (r - 1, r, r + 1):
            if c > 1 and c**k == m:
                return c, k
    return m, 1


def _rho(m):
    for c in range(1, 1000):
        x = y = 2
        d = 1
        while d == 1:
            x = (x * x + c) % m
            y = (y * y + c) % m
            y = (y * y + c) % m
            d = math.gcd(x - y, m)
        if d != m:
            return d
    raise ArithmeticError(f"no factor of {m} found")


def _factor(m, exponent, found):
    if m == 1:
        return
    r, k = _root(m)
    if k > 1:
        _factor(r, exponent * k, found)
    elif _looks_prime(m):
        found[m] = found.get(m, 0) + exponent
    else:
        d = _rho(m)
        _factor(d, exponent, found)
        _factor(m // d, exponent, found)


def totient(n):
    if n < 1:
        raise ValueError(f"totient({n}): n must be positive")
    found = {}
    for p in SMALL_PRIMES:
        while n % p == 0:
            found[p] = found.get(p, 0) + 1
            n //= p
    _factor(n, 1, found)
    result = 1
    for p, e in found.items():
        result *= (p - 1) * p ** (e - 1)
    return result
