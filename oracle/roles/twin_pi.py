"""The twin_pi role: twin_pi(x) = π₂(x), the number of pairs (p, p + 2) of primes with p + 2 ≤ x."""

from __future__ import annotations

from ._counting import count_memory, count_relations, judge_count, normalise_count
from ._role import Role

ROLE = Role(
    name="twin_pi", arity=1, minimum=0, counting=True,
    signature="twin_pi(x) -> int: number of pairs (p, p+2), both prime, with p+2 <= x",
    normalise=normalise_count, judge=judge_count("twin_pi"), relations=count_relations("twin_pi"),
    memory=count_memory("twin_pi"),
    families=("exhaustive", "tables", "boundaries", "twins", "segments", "uniform",
              "log-uniform",
              "twin-answer-words", "prime-powers", "sieve-seams"),
)
