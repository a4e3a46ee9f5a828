"""Correct mobius: sympy.mobius, as an int; mobius(1) == 1.

sympy factors n (trial division, Pollard rho and p - 1, ECM), so the answer is
exact wherever sympy finishes.
"""

import sympy


def mobius(n):
    if n < 1:
        raise ValueError(f"mobius(n): n must be >= 1, got {n}")
    return int(sympy.mobius(n))
