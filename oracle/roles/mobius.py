"""The mobius role: μ(n) for n ≥ 1 (OEIS A008683).

μ(n) = 0 when the square of a prime divides n, else (−1)^k for n the product of
k distinct primes; μ(1) = 1 (Möbius 1832; Hardy & Wright, §16.3).  The
reference is the oracle's, from the factorisation of n (:mod:`._pointwise`).
"""

from __future__ import annotations

from ._pointwise import pointwise_role

ROLE = pointwise_role(
    "mobius", "mobius(n) -> int: n >= 1; 0 if p^2 | n for a prime p, else (-1)^(number of "
              "prime factors); mobius(1) = 1")
