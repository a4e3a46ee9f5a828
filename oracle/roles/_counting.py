"""Checks shared by the counting roles π(x) and π₂(x).

Within exact reach an answer is compared with the oracle's value.  Beyond it
(:mod:`oracle.claims`), an answer must lie in the proven interval, answers at
increasing x must not decrease, and for sampled pairs x < x + h the difference
f(x + h) − f(x) must equal the exact count over (x, x + h], which a sieve
gives at any height.  With h = 1 that is the identity
π(x) − π(x − 1) = [x is prime].
"""

from __future__ import annotations

from .. import claims
from .._errors import OutOfReachError
from ._known_counts import KnownCounts
from ._role import Conventions, Verdict, as_integer

__all__ = ["normalise_count", "judge_count", "count_relations", "count_memory"]

#: Longest gap h between two sampled points for which the short-interval check is made.
SHORT_INTERVAL_LIMIT = 10**7


def normalise_count(raw: object, conventions: Conventions) -> int:
    return as_integer(raw)


def _verdict(result: claims.ClaimCheck) -> Verdict:
    expected = result.expected
    known = not (isinstance(expected, tuple) and expected == (None, None))
    detail = result.detail
    if not result.passed and not detail:
        detail = f"got {result.claimed}, expected {expected}"
    return Verdict(result.check, result.passed, expected, result.provenance, detail, known)


def judge_count(function: str):
    """The judge of one counting answer: exact value, else the proven interval.

    With ``memory`` (a :class:`KnownCounts` of the run) the exact value comes from
    the nearest count already known in this run when that is cheaper.
    """

    def judge(arguments: tuple, got: int, conventions: Conventions, budget: float | None,
              *, memory: KnownCounts | None = None) -> Verdict:
        (x,) = arguments
        if got < 0:
            return Verdict("exact", False, 0 if x < 2 else None, "definition",
                           f"a count cannot be negative (got {got})")
        try:
            if memory is None:
                return _verdict(claims.check_count(function, x, got, budget=budget))
            try:
                expected, provenance = memory.exact(x, budget)
            except OutOfReachError:
                return _verdict(claims.check_count(function, x, got, budget=budget))
            passed = got == expected
            return Verdict("exact", passed, expected, provenance,
                           "" if passed else f"got {got}, expected {expected}")
        except OutOfReachError as error:
            return Verdict("proven-interval", True, None, "none", str(error), reach=False)

    return judge


def count_memory(function: str):
    """The factory of a run's memory of exact counts (:attr:`Role.memory`)."""
    return lambda: KnownCounts(function)


def count_relations(function: str):
    """Identities across answers: monotone, and short-interval differences beyond exact reach."""

    def relations(answers: dict, verdicts: dict, budget: float | None) -> list:
        found = []
        points = sorted((arguments[0], value) for arguments, value in answers.items())
        monotone = claims.check_monotone(function, points)
        if not monotone.passed:
            found.append((monotone.arguments, monotone.claimed,
                          Verdict("monotone", False, monotone.expected, "definition", monotone.detail)))
        for (x0, v0), (x1, v1) in zip(points, points[1:]):
            beyond = any(verdicts.get((x,)) is not None and verdicts[(x,)].check != "exact"
                         for x in (x0, x1))
            if not beyond or x0 < 0 or x1 - x0 > SHORT_INTERVAL_LIMIT:
                continue
            try:
                result = claims.check_difference(function, x0, x1 - x0, v0, v1, budget=budget)
            except OutOfReachError:
                continue
            if not result.passed:
                found.append(((x0, x1), v1 - v0, _verdict(result)))
        return found

    return relations
