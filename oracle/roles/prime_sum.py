"""The prime_sum role: prime_sum(x) = Σ p over the primes p ≤ x (0 for x < 2).

The sum grows like x² / (2 ln x): it passes 2³¹ at x = 225287 and 2⁵³ at x = 595600673
(:data:`oracle.sampling._families.PRIME_SUM_WORDS`), so a sum kept in a machine word or
a float goes wrong long before a count does.  Exact with Python integers.
"""

from __future__ import annotations

from ._role import Role
from ._sums import normalise_sum, sum_judge, sum_memory, sum_relations

ROLE = Role(
    name="prime_sum", arity=1, minimum=0, counting=True,
    signature="prime_sum(x) -> int: sum of the primes p <= x; 0 for x < 2",
    normalise=normalise_sum, judge=sum_judge("prime_sum"),
    relations=sum_relations("prime_sum", monotone=True), memory=sum_memory("prime_sum"),
    families=("exhaustive", "boundaries", "primes", "segments", "uniform", "log-uniform",
              "sum-words", "prime-powers", "sieve-seams", "product-words"),
)
