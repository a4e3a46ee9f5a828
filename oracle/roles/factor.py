"""The factor role: factor(n) for n ≥ 1, as {p: e}, [p, p, q] or [(p, e)]; factor(1) is empty.

The product of the claimed factors must be n and every factor must be prime
(:func:`oracle.facade.verify_factorization`: deterministic below the published
bound, Baillie–PSW ``probable`` above -- a probable prime is not a proven prime).
"""

from __future__ import annotations

from collections import Counter

from .. import facade
from ._role import Conventions, Role, Verdict, WrongType, as_integer


def _normalise(raw: object, conventions: Conventions) -> tuple[tuple[int, int], ...]:
    shape, pairs = _shape_and_pairs(raw)
    if conventions.factor_shape != "any" and shape != conventions.factor_shape and pairs:
        raise WrongType(f"a {shape} factorisation where the target declares {conventions.factor_shape}")
    merged: Counter = Counter()
    for prime, exponent in pairs:
        merged[prime] += exponent
    return tuple(sorted(merged.items()))


def _shape_and_pairs(raw: object) -> tuple[str, list[tuple[int, int]]]:
    if isinstance(raw, dict):
        return "mapping", [(as_integer(p), _exponent(e)) for p, e in raw.items()]
    if raw is None or isinstance(raw, (str, bytes, int, float)):
        raise WrongType(f"{type(raw).__name__} {raw!r:.60} where a factorisation is expected")
    tolist = getattr(raw, "tolist", None)
    items = list(tolist() if callable(tolist) else raw)
    if all(isinstance(item, (tuple, list)) for item in items) and items:
        if any(len(item) != 2 for item in items):
            raise WrongType("a list of sequences that are not (prime, exponent) pairs")
        return "pairs", [(as_integer(p), _exponent(e)) for p, e in items]
    return "flat", [(as_integer(item), 1) for item in items]


def _exponent(raw: object) -> int:
    exponent = as_integer(raw)
    if exponent < 1:
        raise WrongType(f"exponent {exponent} (exponents must be >= 1)")
    return exponent


def _judge(arguments: tuple, got: tuple, conventions: Conventions, budget: float | None) -> Verdict:
    (n,) = arguments
    report = facade.verify_factorization(n, dict(got))
    expected = "a product of primes equal to n"
    return Verdict("factorization", report.ok, expected, report.provenance, "; ".join(report.problems))


ROLE = Role(
    name="factor", arity=1, minimum=1, counting=False,
    signature="factor(n) -> {p: e} | [p, p, q] | [(p, e)]: n >= 1, factor(1) empty",
    normalise=_normalise, judge=_judge, invalid_inputs=((0,), (-6,)),
    families=("exhaustive", "tables", "primes", "squares", "carmichael", "pseudoprimes",
              "semiprimes", "smooth", "certified", "boundaries", "uniform", "log-uniform"),
)
