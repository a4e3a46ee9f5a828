"""Correct is_prime: python-flint's fmpz.is_prime, a proven primality test, after its
probable-prime test.

Honours the convention: 0 and 1 are not prime (flint agrees); n >= 0.

The probable-prime test comes first because ntoracle's climb by bit size found that
``fmpz(n).is_prime()`` of python-flint 0.9.0 gives no answer within 40 s at the strong
pseudoprime to the bases 2..37 of 201 bits built by Arnault's construction,
2410463780047269787080824905940822558377657404182958698820283, which
``is_probable_prime()`` rejects at once (measured here, December 2026).
"""

import flint


def is_prime(n):
    if n < 2:
        return False
    candidate = flint.fmpz(n)
    return bool(candidate.is_probable_prime()) and bool(candidate.is_prime())
