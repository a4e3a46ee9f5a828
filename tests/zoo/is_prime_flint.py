"""Correct is_prime: python-flint's fmpz.is_prime, a proven primality test.

Honours the convention: 0 and 1 are not prime (flint agrees); n >= 0.
"""

import flint


def is_prime(n):
    if n < 2:
        return False
    return bool(flint.fmpz(n).is_prime())
