"""Correct divisor_count: sympy.divisor_count (sigma_0), as an int; divisor_count(1) == 1."""

import sympy


def divisor_count(n):
    if n < 1:
        raise ValueError(f"divisor_count(n): n must be >= 1, got {n}")
    return int(sympy.divisor_count(n))
