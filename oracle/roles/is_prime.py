"""The is_prime role: is_prime(n) for n ≥ 0; 0 and 1 are not prime.

The reference is the oracle's verdict: deterministic Miller–Rabin below the
published bound of its base set, Baillie–PSW (``probable``: not a proof) above.
A composite verdict is always proven.
"""

from __future__ import annotations

from .. import facade
from ._role import Conventions, Role, Verdict, as_boolean


def _normalise(raw: object, conventions: Conventions) -> bool:
    return as_boolean(raw)


def _judge(arguments: tuple, got: bool, conventions: Conventions, budget: float | None) -> Verdict:
    (n,) = arguments
    reference = facade.answer("is_prime", n)
    passed = got == reference.value
    detail = "" if passed else (f"{n} is composite, the candidate says prime" if got
                                else f"{n} is prime, the candidate says composite")
    return Verdict("exact", passed, reference.value, reference.provenance, detail)


ROLE = Role(
    name="is_prime", arity=1, minimum=0, counting=False,
    signature="is_prime(n) -> bool: n >= 0; 0 and 1 are not prime",
    normalise=_normalise, judge=_judge, invalid_inputs=((-1,),),
    families=("exhaustive", "primes", "squares", "pseudoprimes", "base-divisors",
              "first-prime-bases", "carmichael", "semiprimes",
              "certified", "boundaries", "uniform", "log-uniform",
              "prime-powers", "mersenne-fermat", "trial-bounds"),
)
