"""Correct factor: sympy.factorint, returned as {prime: exponent}; factor(1) == {}.

sympy proves the factors prime below 2**64 and uses BPSW above, so a factor
beyond 2**64 is a probable prime.
"""

import sympy


def factor(n):
    if n < 1:
        raise ValueError(f"factor(n): n must be >= 1, got {n}")
    return {int(p): int(e) for p, e in sympy.factorint(n).items()}
