"""The divisor_count role: d(n) = σ₀(n) for n ≥ 1 (OEIS A000005).

d(n) is the number of positive divisors of n, so d(1) = 1; from the
factorisation, d(n) = ∏ (e + 1) (Hardy & Wright, §16.7).  The reference is the
oracle's, from the factorisation of n (:mod:`._pointwise`).
"""

from __future__ import annotations

from ._pointwise import pointwise_role

ROLE = pointwise_role(
    "divisor_count", "divisor_count(n) -> int: n >= 1; the number of positive divisors "
                     "(sigma_0); divisor_count(1) = 1")
