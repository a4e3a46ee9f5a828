"""What the four arithmetic-function roles share: one integer n ≥ 1 in, one integer out.

``mobius``, ``totient``, ``divisor_count`` and ``divisor_sum`` are judged the same
way: the answer must equal the oracle's value, computed from the factorisation of
n by the function's product formula (:data:`oracle.facade.MULTIPLICATIVE`).  The
factorisation is the construction's when the sampling family built n from
certified primes (provenance ``constructed: certified factors``), else found by
trial division and Brent's rho within the oracle's budget (``factorised+...``);
beyond that budget the point is out of the oracle's reach and skipped, never
passed.  None of these functions is monotone, so no bisection: the smallest
failing input is reported.
"""

from __future__ import annotations

from .. import facade
from ._role import Conventions, Role, Verdict, as_integer, exact_verdict

#: Families of every arithmetic-function role (the last one builds n from its factors).
#: ``pseudoprimes`` and ``base-divisors``: the factorisation behind μ, φ, d and σ usually
#: hands a cofactor to a Miller–Rabin test, which these fool (common practice).
FAMILIES = ("exhaustive", "primes", "squares", "prime-powers", "semiprimes", "smooth",
            "carmichael", "pseudoprimes", "base-divisors", "highly-composite", "boundaries", "uniform", "log-uniform", "factor-shapes",
            "trial-bounds", "constructed")


def _normalise(raw: object, conventions: Conventions) -> int:
    return as_integer(raw)


def pointwise_role(name: str, signature: str) -> Role:
    """The role ``name``, judged against ``facade.answer(name, n)``."""

    def judge(arguments: tuple, got: int, conventions: Conventions,
              budget: float | None) -> Verdict:
        (n,) = arguments
        reference = facade.answer(name, n, budget=budget)
        return exact_verdict(got, reference.value, reference.provenance)

    return Role(name=name, arity=1, minimum=1, counting=False, signature=signature,
                normalise=_normalise, judge=judge, invalid_inputs=((0,), (-1,)),
                families=FAMILIES)
