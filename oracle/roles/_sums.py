"""Checks shared by the roles that are sums of a term over n ≤ x.

The sum of the primes, π(x; q, a), the Mertens function, the squarefree count and the
counts of prime triplets and quadruplets are all f(x) = Σ_{n ≤ x} t(n) for a term t
that a sieve gives over any interval, so

    f(x) = f(y) + Σ_{y < n ≤ x} t(n)   for y < x

(for a constellation of span s counted wholly inside [0, x], the term of n is the
number of constellations whose last member is n, i.e. those lying wholly in
[y − s + 1, x]).  An answer is compared with the oracle's exact value; during one
audit the value at x comes from the nearest point already known when that sieves
less (:class:`KnownSums`, as :mod:`oracle.roles._known_counts` does for π and π₂).
Across answers: a non-decreasing f must not decrease, and for two neighbouring
points of which one is beyond exact reach, f(x₁) − f(x₀) must equal the exact sum
over (x₀, x₁] (a short sieve at any height below 2⁶⁴).
"""

from __future__ import annotations

import bisect

from .. import facade
from .._errors import OutOfReachError
from ._known_counts import join_provenance
from ._role import Conventions, Verdict, as_integer

__all__ = ["KnownSums", "sum_judge", "sum_memory", "sum_relations", "normalise_sum"]

#: Longest distance from a remembered value worth sieving instead of asking afresh (the sum
#: of the primes has a combinatorial route: 2³² costs it about as much as sieving 2²⁸).
NEAR = 2**30
NEAR_BY_FUNCTION = {"prime_sum": 2**27}
#: Longest gap between two points for which the difference is checked.
DIFFERENCE_LIMIT = 10**7


def normalise_sum(raw: object, conventions: Conventions) -> int:
    return as_integer(raw)


def _between(function: str, parameters: tuple, low: int, high: int, budget) -> facade.Answer:
    """The sum of the terms of n in [low, high] (low ≥ 1)."""
    if function in facade.TUPLET_KINDS:
        span = facade._span(function)
        return facade.answer("count", function, max(low - span, 0), high, budget=budget)
    return facade.interval_sum(function, low, high, *parameters, budget=budget)


class KnownSums:
    """Exact values f(x) of one summatory function (with fixed parameters) for one run."""

    def __init__(self, function: str, parameters: tuple = ()):
        self.function = function
        self.parameters = parameters
        self._points: list[int] = []
        self._values: dict[int, tuple[int, str]] = {}

    def exact(self, x: int, budget: float | None) -> tuple[int, str]:
        """``(f(x), provenance)``; raises :class:`OutOfReachError` beyond every exact route."""
        known = self._values.get(x)
        if known is not None:
            return known
        anchor = self._nearest(x)
        near = NEAR_BY_FUNCTION.get(self.function, NEAR)
        if anchor is not None and x >= 1 and abs(x - anchor) <= min(near, x):
            found = self._from_anchor(anchor, x, budget)
        else:
            reference = facade.answer(self.function, x, *self.parameters, budget=budget)
            found = (reference.value, reference.provenance)
        bisect.insort(self._points, x)
        self._values[x] = found
        return found

    def _from_anchor(self, anchor: int, x: int, budget) -> tuple[int, str]:
        base, provenance = self._values[anchor]
        low, high, sign = (anchor + 1, x, 1) if anchor < x else (x + 1, anchor, -1)
        between = _between(self.function, self.parameters, max(low, 1), high, budget)
        return base + sign * between.value, join_provenance(provenance, between.provenance)

    def _nearest(self, x: int) -> int | None:
        index = bisect.bisect_left(self._points, x)
        around = self._points[max(index - 1, 0):index + 1]
        return min(around, key=lambda point: abs(point - x)) if around else None


class _Memory:
    """One :class:`KnownSums` per parameter set (the (q, a) of π(x; q, a))."""

    def __init__(self, function: str):
        self.function = function
        self.by_parameters: dict[tuple, KnownSums] = {}

    def exact(self, arguments: tuple, budget) -> tuple[int, str]:
        x, parameters = arguments[0], tuple(arguments[1:])
        if parameters not in self.by_parameters:
            self.by_parameters[parameters] = KnownSums(self.function, parameters)
        return self.by_parameters[parameters].exact(x, budget)


def sum_memory(function: str):
    """The factory of a run's memory (:attr:`Role.memory`)."""
    return lambda: _Memory(function)


def sum_judge(function: str, *, non_negative: bool = True):
    """The judge of one answer: the oracle's exact value (from the run's memory when given)."""

    def judge(arguments: tuple, got: int, conventions: Conventions, budget: float | None,
              *, memory: _Memory | None = None) -> Verdict:
        if non_negative and got < 0:
            return Verdict("exact", False, None, "definition",
                           f"{function} cannot be negative (got {got})")
        try:
            if memory is None:
                reference = facade.answer(function, *arguments, budget=budget)
                expected, provenance = reference.value, reference.provenance
            else:
                expected, provenance = memory.exact(arguments, budget)
        except OutOfReachError as error:
            return Verdict("exact", True, None, "none", str(error), reach=False)
        passed = got == expected
        return Verdict("exact", passed, expected, provenance,
                       "" if passed else f"got {got}, expected {expected}")

    return judge


def sum_relations(function: str, *, monotone: bool):
    """Identities across answers: non-decreasing (when ``monotone``), and exact differences
    between neighbouring points where one of them lies beyond exact reach."""

    def relations(answers: dict, verdicts: dict, budget: float | None) -> list:
        found = []
        classes: dict[tuple, list] = {}
        for arguments, value in answers.items():
            classes.setdefault(tuple(arguments[1:]), []).append((arguments[0], value, arguments))
        for parameters, points in classes.items():
            points.sort()
            for (x0, v0, a0), (x1, v1, a1) in zip(points, points[1:]):
                if monotone and v1 < v0:
                    detail = f"{function}{a1} = {v1} < {function}{a0} = {v0}"
                    found.append((a1, v1, Verdict("monotone", False, (v0, None), "definition",
                                                  detail)))
                    continue
                beyond = any(not verdicts[a].reach for a in (a0, a1) if a in verdicts)
                if not beyond or x1 - x0 > DIFFERENCE_LIMIT or x0 < 0:
                    continue
                try:
                    exact = _between(function, parameters, x0 + 1, x1, budget)
                except OutOfReachError:
                    continue
                if v1 - v0 != exact.value:
                    found.append(((x0, x1), v1 - v0, Verdict(
                        "short-interval", False, exact.value, exact.provenance,
                        f"{function} at {x1} minus at {x0} is {v1 - v0}, but ({x0}, {x1}] "
                        f"gives {exact.value}")))
        return found

    return relations
