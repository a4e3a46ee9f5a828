"""Correct totient: sympy.totient, as an int; totient(1) == 1."""

import sympy


def totient(n):
    if n < 1:
        raise ValueError(f"totient(n): n must be >= 1, got {n}")
    return int(sympy.totient(n))
