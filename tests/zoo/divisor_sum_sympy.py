"""Correct divisor_sum: sympy.divisor_sigma(n, 1) (sigma_1), as an int; divisor_sum(1) == 1."""

import sympy


def divisor_sum(n):
    if n < 1:
        raise ValueError(f"divisor_sum(n): n must be >= 1, got {n}")
    return int(sympy.divisor_sigma(n, 1))
