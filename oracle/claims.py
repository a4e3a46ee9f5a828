"""Checks of claimed values, including far beyond exact reach.

A candidate's π(x) at x = 10²⁰ cannot be compared with an exact value, but it
can still be caught lying:

* **proven interval** — the claim must lie in the interval that the bounds
  catalogue proves (:mod:`oracle.bounds`);
* **monotonicity** — π and π₂ are non-decreasing, so claims at increasing x
  must be too;
* **short-interval difference** — π(x + h) − π(x) is the number of primes in
  (x, x + h], which a sieve counts exactly for short h at any height (below
  2⁶⁴ by sieving; above, by sieving out small primes and testing survivors
  with Baillie–PSW, provenance ``probable``);
* **n-th prime** — a claimed p_n must be prime and satisfy the p_n bounds.

Where the exact value is within the budget, :func:`check_count` compares with
it instead.  Each check returns a :class:`ClaimCheck` saying what was
compared, with the provenance of the reference.
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Iterable

from ._errors import InvalidInputError, OutOfReachError
from ._integers import require_int

__all__ = ["ClaimCheck", "check_count", "check_monotone", "check_difference", "check_nth_prime",
           "COUNTING_FUNCTIONS"]

#: Counting functions these checks understand, with the sieve kind each counts.
COUNTING_FUNCTIONS = {"pi": "primes", "twin_pi": "twins"}


@dataclass(frozen=True)
class ClaimCheck:
    """The outcome of one check of a claimed value.

    ``expected`` is the exact value, or a ``(lower, upper)`` pair for an
    interval check (``None`` for an unknown side); ``provenance`` is how the
    reference was obtained (``sieve``, ``table:A006880``, ``bounds:<ids>``…).
    """

    check: str
    function: str
    arguments: tuple[int, ...]
    claimed: int
    expected: object
    provenance: str
    passed: bool
    detail: str = ""


def check_count(function: str, x: int, claimed: int, *, budget: float | None = None) -> ClaimCheck:
    """Compare a claimed π(x) or π₂(x) with the exact value, or with the proven interval."""
    _counting(function)
    x = require_int("x", x)
    claimed = require_int("claimed", claimed)
    from . import facade

    try:
        exact = facade.answer(function, x, budget=budget)
    except OutOfReachError:
        return _check_interval(function, x, claimed)
    return ClaimCheck("exact", function, (x,), claimed, exact.value, exact.provenance,
                      claimed == exact.value)


def _check_interval(function: str, x: int, claimed: int) -> ClaimCheck:
    from . import bounds

    interval = getattr(bounds, function)(x)
    above_lower = interval.lower is None or claimed >= interval.lower
    below_upper = interval.upper is None or claimed <= interval.upper
    detail = "" if above_lower and below_upper else (
        "below the proven lower bound" if not above_lower else "above the proven upper bound")
    return ClaimCheck("proven-interval", function, (x,), claimed, (interval.lower, interval.upper),
                      "bounds:" + ",".join(interval.theorems), above_lower and below_upper, detail)


def check_monotone(function: str, claims: Iterable[tuple[int, int]]) -> ClaimCheck:
    """Claims (x, value) sorted by x must be non-decreasing in value.

    Returns the first violation found (the pair of neighbouring points), or a
    passing check over all points.
    """
    _counting(function)
    ordered = sorted((require_int("x", x), require_int("claimed", value)) for x, value in claims)
    for (x0, v0), (x1, v1) in zip(ordered, ordered[1:]):
        if v1 < v0:
            return ClaimCheck("monotone", function, (x0, x1), v1, (v0, None), "definition",
                              False, f"{function}({x1}) = {v1} < {function}({x0}) = {v0}")
        if x0 == x1 and v0 != v1:
            return ClaimCheck("monotone", function, (x0, x1), v1, v0, "definition", False,
                              f"two different answers for {function}({x0}): {v0} and {v1}")
    arguments = tuple(x for x, _ in ordered)
    return ClaimCheck("monotone", function, arguments, ordered[-1][1] if ordered else 0,
                      None, "definition", True)


def check_difference(function: str, x: int, h: int, claimed_at_x: int,
                     claimed_at_x_plus_h: int, *, budget: float | None = None) -> ClaimCheck:
    """f(x + h) − f(x) must equal the exact count over (x, x + h].

    For π that is the number of primes p with x < p ≤ x + h; for π₂ (pairs
    counted by their larger member p + 2 ≤ x) the number of twin pairs with
    x < p + 2 ≤ x + h, i.e. pairs lying wholly in [x − 1, x + h].
    """
    kind = _counting(function)
    x = require_int("x", x, minimum=0)
    h = require_int("h", h, minimum=1)
    first = require_int("claimed_at_x", claimed_at_x)
    second = require_int("claimed_at_x_plus_h", claimed_at_x_plus_h)
    from . import facade

    low = x + 1 if kind == "primes" else max(x - 1, 0)
    exact = facade.answer("count", kind, low, x + h, budget=budget)
    claimed = second - first
    detail = "" if claimed == exact.value else (
        f"{function}({x + h}) - {function}({x}) = {claimed}, but (x, x+h] holds {exact.value}")
    return ClaimCheck("short-interval", function, (x, x + h), claimed, exact.value,
                      exact.provenance, claimed == exact.value, detail)


def check_nth_prime(n: int, claimed: int, *, budget: float | None = None) -> list[ClaimCheck]:
    """A claimed p_n: exact when within the budget; otherwise prime and within the p_n bounds."""
    n = require_int("n", n, minimum=1)
    claimed = require_int("claimed", claimed)
    from . import bounds, facade

    try:
        exact = facade.answer("nth_prime", n, budget=budget)
    except OutOfReachError:
        exact = None
    if exact is not None:
        return [ClaimCheck("exact", "nth_prime", (n,), claimed, exact.value, exact.provenance,
                           claimed == exact.value)]
    checks = []
    if claimed >= 2:
        primality = facade.answer("is_prime", claimed)
        checks.append(ClaimCheck("is-prime", "nth_prime", (n,), claimed, True,
                                 primality.provenance, primality.value,
                                 "" if primality.value else f"{claimed} is composite"))
    else:
        checks.append(ClaimCheck("is-prime", "nth_prime", (n,), claimed, True, "definition",
                                 False, f"{claimed} is not prime"))
    interval = bounds.nth_prime(n)
    inside = ((interval.lower is None or claimed >= interval.lower)
              and (interval.upper is None or claimed <= interval.upper))
    checks.append(ClaimCheck("proven-interval", "nth_prime", (n,), claimed,
                             (interval.lower, interval.upper), "bounds:" + ",".join(interval.theorems),
                             inside, "" if inside else "outside the proven interval for p_n"))
    return checks


def _counting(function: str) -> str:
    if function not in COUNTING_FUNCTIONS:
        raise InvalidInputError(
            f"function={function!r}: expected one of {', '.join(COUNTING_FUNCTIONS)}")
    return COUNTING_FUNCTIONS[function]
