"""The primes_in role: primes_in(a, b), all primes a ≤ p ≤ b in ascending order.

The listing must be sorted, without repeats and complete: it is compared with
the oracle's listing -- its sieve, or high up, for a short interval, its
verdict on each number (deterministic Miller–Rabin below the published bound,
Baillie–PSW above) -- and the first missing or extra prime is reported.  With
the ``half-open`` convention the interval is [a, b).
"""

from __future__ import annotations

from .. import facade
from ._role import Conventions, Role, Verdict, as_integer_sequence


def _normalise(raw: object, conventions: Conventions) -> list[int]:
    return as_integer_sequence(raw)


def expected_listing(a: int, b: int, conventions: Conventions) -> tuple[list[int], str]:
    """The primes of the interval and the provenance of the listing."""
    upper = b - 1 if conventions.primes_range == "half-open" else b
    listing = facade.answer("primes", a, upper)
    return listing.value, listing.provenance


def first_difference(got: list[int], expected: list[int]) -> str:
    """Describe the first place where a listing departs from the true one."""
    for index, value in enumerate(got[1:], start=1):
        if value <= got[index - 1]:
            kind = "repeated" if value == got[index - 1] else "out of order"
            return f"{kind} prime at position {index}: {value} after {got[index - 1]}"
    truth = set(expected)
    listed = set(got)
    missing = next((p for p in expected if p not in listed), None)
    extra = next((p for p in got if p not in truth), None)
    if missing is not None and (extra is None or missing < extra):
        return f"first missing prime: {missing}"
    if extra is not None:
        nature = "not prime" if extra < 2 or not facade.is_prime(extra) else "outside the interval"
        return f"first extra number: {extra} ({nature})"
    return "listings differ"


def _judge(arguments: tuple, got: list[int], conventions: Conventions, budget: float | None) -> Verdict:
    a, b = arguments
    expected, provenance = expected_listing(a, b, conventions)
    if got == expected:
        return Verdict("listing", True, expected, provenance)
    return Verdict("listing", False, expected, provenance, first_difference(got, expected))


ROLE = Role(
    name="primes_in", arity=2, minimum=0, counting=False,
    signature="primes_in(a, b) -> iterable of int: all primes a <= p <= b, ascending",
    normalise=_normalise, judge=_judge, invalid_inputs=((-5, 10),),
    families=("exhaustive", "boundaries", "segments", "twins", "gaps", "uniform", "log-uniform",
              "pseudoprimes", "bound-starts", "sieve-seams",
              "sieving-prime-intervals", "squares"),
)


def first_wrong_prime(got: list[int], expected: list[int]) -> tuple[str, int] | None:
    """``("missing", p)`` or ``("extra", n)`` for the smallest number in one listing but not the other."""
    if not isinstance(got, list):
        return None
    missing = sorted(set(expected) - set(got))
    extra = sorted(set(got) - set(expected))
    if not missing and not extra:
        repeated = next((v for i, v in enumerate(got[1:], 1) if v == got[i - 1]), None)
        return ("repeated", repeated) if repeated is not None else None
    if missing and (not extra or missing[0] < extra[0]):
        return "missing", missing[0]
    return "extra", extra[0]
