"""Correct nth_prime: delegates to primecount's nth_prime via primecountpy (n >= 1)."""

import primecountpy


def nth_prime(n):
    if n < 1:
        raise ValueError(f"nth_prime(n): n must be >= 1, got {n}")
    return int(primecountpy.nth_prime(n))
