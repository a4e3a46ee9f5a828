"""The divisor_sum role: σ(n) = σ₁(n) for n ≥ 1 (OEIS A000203).

σ(n) is the sum of the positive divisors of n, n itself included, so σ(1) = 1;
from the factorisation, σ(n) = ∏ (p^(e+1) − 1)/(p − 1) (Hardy & Wright, §16.7).
It exceeds n (σ(n) < e^γ n ln ln n + 0.6483 n / ln ln n for n ≥ 3, Robin 1984),
so it overflows a 64-bit word for n somewhat below 2⁶⁴.  The reference is the
oracle's, from the factorisation of n (:mod:`._pointwise`).
"""

from __future__ import annotations

from ._pointwise import pointwise_role

ROLE = pointwise_role(
    "divisor_sum", "divisor_sum(n) -> int: n >= 1; the sum of the positive divisors, n "
                   "included (sigma_1); divisor_sum(1) = 1")
