"""Correct prev_prime: sympy.prevprime, the largest prime < n, for n >= 3."""

import sympy


def prev_prime(n):
    if n < 3:
        raise ValueError(f"prev_prime(n): n must be >= 3, got {n}")
    return int(sympy.prevprime(n))
