"""The squarefree_count role: Q(x), the number of squarefree n with 1 ≤ n ≤ x (0 for x < 1).

Q(x) = Σ_{d ≤ √x} μ(d)·⌊x/d²⌋ (OEIS A013928; A071172 at x = 10ⁿ): the oracle sieves μ
up to √x only, so the role reaches far above the sums that need a sieve up to x.
"""

from __future__ import annotations

from ._role import Role
from ._sums import normalise_sum, sum_judge, sum_relations

ROLE = Role(
    name="squarefree_count", arity=1, minimum=0, counting=True,
    signature="squarefree_count(x) -> int: number of squarefree n with 1 <= n <= x; 0 for x < 1",
    normalise=normalise_sum, judge=sum_judge("squarefree_count"),
    relations=sum_relations("squarefree_count", monotone=True),
    families=("exhaustive", "boundaries", "squares", "square-steps", "segments", "uniform",
              "log-uniform", "prime-powers", "product-words"),
)
