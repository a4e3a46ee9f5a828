"""The prime_pi_mod role: prime_pi_mod(x, q, a) = π(x; q, a), the number of primes p ≤ x
with p ≡ a (mod q), for q ≥ 1 and gcd(a, q) = 1 (0 for x < 2).

``a`` is any integer coprime to q and is read modulo q (π(x; 4, 5) = π(x; 4, 1)); q = 1
gives π(x).  An input with gcd(a, q) ≠ 1 or q = 0 lies outside the domain (judged by the
invalid-input convention).  The oracle sieves the primes of [0, x] and reduces them
modulo q (:mod:`oracle.exact.prime_sums`); the answer is not monotone in q or a, so a
divergence is localised at the smallest failing input, not by bisection.
"""

from __future__ import annotations

from ._role import Role
from ._sums import normalise_sum, sum_judge, sum_memory, sum_relations

ROLE = Role(
    name="prime_pi_mod", arity=3, minimum=0, counting=False,
    signature="prime_pi_mod(x, q, a) -> int: number of primes p <= x with p = a (mod q), "
              "gcd(a, q) = 1",
    normalise=normalise_sum, judge=sum_judge("prime_pi_mod"),
    invalid_inputs=((100, 0, 1), (100, 4, 2), (100, 6, 3), (100, 10, 0)),
    relations=sum_relations("prime_pi_mod", monotone=True), memory=sum_memory("prime_pi_mod"),
    families=("exhaustive", "boundaries", "primes", "segments", "uniform", "log-uniform",
              "sieve-seams", "moduli"),
    size_argument=0,
)
