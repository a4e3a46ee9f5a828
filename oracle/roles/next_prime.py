"""The next_prime role: next_prime(n), the smallest prime p > n (n ≥ 0)."""

from __future__ import annotations

from ._neighbours import judge_neighbour, normalise_prime
from ._role import Role

ROLE = Role(
    name="next_prime", arity=1, minimum=0, counting=False,
    signature="next_prime(n) -> int: the smallest prime > n",
    normalise=normalise_prime, judge=judge_neighbour("next_prime"), invalid_inputs=((-1,),),
    families=("exhaustive", "primes", "gaps", "boundaries", "twins", "pseudoprimes",
              "base-divisors", "first-prime-bases",
              "uniform", "log-uniform",
              "prime-powers", "pseudoprime-neighbours", "mersenne-fermat", "bound-starts"),
)
