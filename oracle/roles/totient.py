"""The totient role: Euler's φ(n) for n ≥ 1 (OEIS A000010).

φ(n) counts the k in [1, n] with gcd(k, n) = 1, so φ(1) = 1; from the
factorisation, φ(n) = ∏ p^(e−1)·(p − 1) (Hardy & Wright, §16.5).  The
reference is the oracle's, from the factorisation of n (:mod:`._pointwise`).
"""

from __future__ import annotations

from ._pointwise import pointwise_role

ROLE = pointwise_role(
    "totient", "totient(n) -> int: n >= 1; the number of 1 <= k <= n with gcd(k, n) = 1; "
               "totient(1) = 1")
