"""The prev_prime role: prev_prime(n), the largest prime p < n (n ≥ 3)."""

from __future__ import annotations

from ._neighbours import judge_neighbour, normalise_prime
from ._role import Role

ROLE = Role(
    name="prev_prime", arity=1, minimum=3, counting=False,
    signature="prev_prime(n) -> int: the largest prime < n, n >= 3",
    normalise=normalise_prime, judge=judge_neighbour("prev_prime"),
    invalid_inputs=((2,), (1,), (0,)),
    families=("exhaustive", "primes", "gaps", "boundaries", "twins", "pseudoprimes",
              "base-divisors", "first-prime-bases",
              "uniform", "log-uniform",
              "prime-powers", "pseudoprime-neighbours", "mersenne-fermat"),
)
