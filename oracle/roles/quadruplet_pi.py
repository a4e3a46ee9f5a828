"""The quadruplet_pi role: the number of prime constellations (p, p+2, p+6, p+8), all prime, with p+8 ≤ x.

A constellation counts once it lies wholly in [0, x] (the oracle's ``tuplet_pi("quadruplets", x)``,
a sieve).  The small exceptions are where implementations slip: (5, 7, 11, 13) is the
only quadruplet not of the form (30k + 11, ..., 30k + 19), and (3, 5, 7) is of neither
triplet pattern.
"""

from __future__ import annotations

from ._role import Role
from ._sums import normalise_sum, sum_judge, sum_memory, sum_relations

ROLE = Role(
    name="quadruplet_pi", arity=1, minimum=0, counting=True,
    signature="quadruplet_pi(x) -> int: number of (p, p+2, p+6, p+8), all prime, with p+8 <= x",
    normalise=normalise_sum, judge=sum_judge("quadruplets"),
    relations=sum_relations("quadruplets", monotone=True), memory=sum_memory("quadruplets"),
    families=("exhaustive", "boundaries", "twins", "segments", "uniform", "log-uniform",
              "sieve-seams", "product-words"),
)
