"""The triplet_pi_026 role: the number of prime constellations (p, p+2, p+6), all prime, with p+6 ≤ x.

A constellation counts once it lies wholly in [0, x] (the oracle's ``tuplet_pi("triplets_026", x)``,
a sieve).  The small exceptions are where implementations slip: (5, 7, 11, 13) is the
only quadruplet not of the form (30k + 11, ..., 30k + 19), and (3, 5, 7) is of neither
triplet pattern.
"""

from __future__ import annotations

from ._role import Role
from ._sums import normalise_sum, sum_judge, sum_memory, sum_relations

ROLE = Role(
    name="triplet_pi_026", arity=1, minimum=0, counting=True,
    signature="triplet_pi_026(x) -> int: number of (p, p+2, p+6), all prime, with p+6 <= x",
    normalise=normalise_sum, judge=sum_judge("triplets_026"),
    relations=sum_relations("triplets_026", monotone=True), memory=sum_memory("triplets_026"),
    families=("exhaustive", "boundaries", "twins", "segments", "uniform", "log-uniform",
              "sieve-seams", "product-words"),
)
