"""The mertens role: mertens(x) = M(x) = Σ_{1 ≤ n ≤ x} μ(n) (0 for x < 1).

M takes both signs (M(2) = 0, M(3) = −1, M(10⁴) = −23; OEIS A002321, A084237), so it is
no counting function: a divergence is localised at the smallest failing input.
"""

from __future__ import annotations

from ._role import Role
from ._sums import normalise_sum, sum_judge, sum_memory, sum_relations

ROLE = Role(
    name="mertens", arity=1, minimum=0, counting=False,
    signature="mertens(x) -> int: sum of the Moebius function mu(n) over 1 <= n <= x; 0 for x < 1",
    normalise=normalise_sum, judge=sum_judge("mertens", non_negative=False),
    relations=sum_relations("mertens", monotone=False), memory=sum_memory("mertens"),
    families=("exhaustive", "boundaries", "squares", "segments", "uniform", "log-uniform",
              "prime-powers", "product-words"),
)
