"""The prime_pi role: prime_pi(x) = π(x), the number of primes p ≤ x (0 for x < 2)."""

from __future__ import annotations

from ._counting import count_memory, count_relations, judge_count, normalise_count
from ._role import Role

ROLE = Role(
    name="prime_pi", arity=1, minimum=0, counting=True,
    signature="prime_pi(x) -> int: number of primes p <= x; 0 for x < 2",
    normalise=normalise_count, judge=judge_count("pi"), relations=count_relations("pi"),
    memory=count_memory("pi"),
    families=("exhaustive", "tables", "boundaries", "primes", "squares", "segments",
              "gaps", "uniform", "log-uniform",
              "answer-words", "prime-powers", "bound-starts", "sieve-seams"),
)
