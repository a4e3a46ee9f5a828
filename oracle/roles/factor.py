"""The factor role: factor(n) for n ≥ 1, as {p: e}, [p, p, q] or [(p, e)]; factor(1) is empty.

The product of the claimed factors must be n and every factor must be prime
(:func:`oracle.facade.verify_factorization`: deterministic below the published
bound, Baillie–PSW ``probable`` above -- a probable prime is not a proven prime).

The canonical form (fundamental theorem of arithmetic) lists each prime once, in
ascending order, with an exponent ≥ 1.  Non-canonical answers -- a prime listed
twice in (p, e) pairs, pairs or a flat list out of order, entries with e = 0 --
describe the same number, and code downstream that assumes the canonical form
breaks on them (common practice).  Under a strict declared shape (``pairs``,
``flat``, ``mapping``) they are a failure; under ``any`` the answer is judged on
its merged form and the verdict's detail carries a warning.

For n built from certified primes by the ``constructed`` family
(:mod:`oracle.adversarial._constructed`) the answer must equal the construction's
factorisation, which is proven at any size (provenance ``constructed: certified
factors``): a composite factor that passes Baillie–PSW is caught there too.  A factor 1 is not
an irregular form but a wrong answer (1 is not prime), under every shape.
"""

from __future__ import annotations

from collections import Counter

from .. import adversarial, facade
from .._bounded import bounded_text
from ._role import Conventions, Role, Verdict, WrongType, _shown, as_integer


class Factorisation(tuple):
    """The merged, sorted (p, e) pairs of an answer; ``irregularities`` says how the
    raw answer departed from the canonical form (empty when it did not)."""

    irregularities: tuple[str, ...]

    def __new__(cls, pairs, irregularities=()):
        made = super().__new__(cls, pairs)
        made.irregularities = tuple(irregularities)
        return made


def _normalise(raw: object, conventions: Conventions) -> Factorisation:
    shape, pairs = _shape_and_pairs(raw)
    if conventions.factor_shape != "any" and shape != conventions.factor_shape and pairs:
        raise WrongType(f"a {shape} factorisation where the target declares {conventions.factor_shape}")
    irregularities = non_canonical(shape, pairs)
    if irregularities and conventions.factor_shape != "any":
        raise WrongType(f"a non-canonical {shape} factorisation: {'; '.join(irregularities)}")
    merged: Counter = Counter()
    for prime, exponent in pairs:
        if exponent != 0:
            merged[prime] += exponent
    return Factorisation(sorted(merged.items()), irregularities)


def non_canonical(shape: str, pairs: list[tuple[int, int]]) -> tuple[str, ...]:
    """How (p, e) pairs of the given shape depart from the canonical factorisation."""
    found = []
    primes = [p for p, _ in pairs]
    if any(e == 0 for _, e in pairs):
        found.append("an exponent 0")
    if shape == "pairs" and len(set(primes)) < len(primes):
        repeated = next(p for i, p in enumerate(primes) if p in primes[:i])
        found.append(f"the prime {repeated} listed twice")
    if shape != "mapping" and primes != sorted(primes):
        found.append("factors not in ascending order")
    return tuple(found)


def _shape_and_pairs(raw: object) -> tuple[str, list[tuple[int, int]]]:
    if isinstance(raw, dict):
        return "mapping", [(as_integer(p), _exponent(e)) for p, e in raw.items()]
    if raw is None or isinstance(raw, (str, bytes, int, float)):
        raise WrongType(f"{type(raw).__name__} {_shown(raw)} where a factorisation is expected")
    tolist = getattr(raw, "tolist", None)
    items = list(tolist() if callable(tolist) else raw)
    if all(isinstance(item, (tuple, list)) for item in items) and items:
        if any(len(item) != 2 for item in items):
            raise WrongType("a list of sequences that are not (prime, exponent) pairs")
        return "pairs", [(as_integer(p), _exponent(e)) for p, e in items]
    return "flat", [(as_integer(item), 1) for item in items]


def _exponent(raw: object) -> int:
    exponent = as_integer(raw)
    if exponent < 0:
        raise WrongType(f"exponent {exponent} (exponents must be >= 0)")
    return exponent


def _too_large(n: int, pairs) -> str:
    """Why the product of ``pairs`` cannot be n, judged from bit lengths alone (a factor above
    n, or exponents that make the product longer than n), or ``""``.  A candidate's
    {2: 10**12} is refused here instead of being multiplied out."""
    for prime, exponent in pairs:
        if prime == 0 and exponent > 0:
            return f"the factor 0 makes the product 0, not n = {n}"
        if abs(prime) > n:
            return f"the factor {bounded_text(prime, 60)} is larger than n = {n}"
    if abs(n) > 1 and any(abs(p) > 1 for p, _ in pairs):
        shortest = sum(e * (abs(p).bit_length() - 1) for p, e in pairs if abs(p) > 1 and e > 0)
        if shortest >= n.bit_length():
            return f"the product of the factors has at least {shortest + 1} bits; n = {n} has {n.bit_length()}"
    return ""


def _judge(arguments: tuple, got: tuple, conventions: Conventions, budget: float | None) -> Verdict:
    (n,) = arguments
    expected = "a product of primes equal to n"
    too_large = _too_large(n, got)
    if too_large:                   # decided from bit lengths: the product is never computed
        return Verdict("factorization", False, expected, "definition", too_large)
    report = facade.verify_factorization(n, dict(got))
    details = list(report.problems)
    built = adversarial.known(n)
    if built is not None:       # n was built from certified primes: the truth is proven
        passed = dict(got) == built.factorisation
        if not passed and not details:
            details.append("differs from the certified factorisation of the construction")
        details.extend(_warning(got))
        return Verdict("factorization", passed, expected, facade.CONSTRUCTED, "; ".join(details))
    details.extend(_warning(got))
    return Verdict("factorization", report.ok, expected, report.provenance, "; ".join(details))


def _warning(got) -> list[str]:
    irregularities = getattr(got, "irregularities", ())
    if irregularities:
        return ["warning: non-canonical factorisation (" + "; ".join(irregularities) + ")"]
    return []


ROLE = Role(
    name="factor", arity=1, minimum=1, counting=False,
    signature="factor(n) -> {p: e} | [p, p, q] | [(p, e)]: n >= 1, factor(1) empty",
    normalise=_normalise, judge=_judge, invalid_inputs=((0,), (-6,)),
    families=("exhaustive", "tables", "primes", "squares", "carmichael", "pseudoprimes",
              "base-divisors", "highly-composite",
              "semiprimes", "smooth", "certified", "boundaries", "uniform", "log-uniform",
              "prime-powers", "mersenne-fermat", "factor-shapes", "trial-bounds", "constructed"),
)
