"""What the plots of a report show, taken from the records of a run (no drawing here).

Three views of one audit:

* *differences* -- candidate minus oracle, ``got - expected``, for every check
  whose answer and reference are both integers (the counts, p_n, next and
  previous primes);
* *statuses* -- the verdict of every check against the size of its input, for
  roles whose answers are not integers (is_prime, primes_in, factor);
* *envelope* -- for pi(x), pi_2(x) and p_n, the candidate's answer beside the
  proven interval of :mod:`oracle.bounds` (Dusart and the other catalogue
  theorems), both relative to the oracle's value, so that a count drifting out
  of what is provable shows at a glance.

A run may hold millions of checks; each view keeps at most a few thousand
points, spread evenly over the sorted inputs, failures first.  Inputs below 1
are left out: the x axis is logarithmic.
"""

from __future__ import annotations

import bisect
import math
from dataclasses import dataclass

from .. import bounds
from .._errors import OracleError

__all__ = ["Difference", "Status", "EnvelopePoint", "differences", "statuses", "envelope",
           "divergence_input", "as_float", "ENVELOPE_FUNCTIONS", "MAX_POINTS", "ENVELOPE_POINTS"]

#: Points kept per view and kind (passes, failures).
MAX_POINTS = 2000
#: Inputs at which the proven interval is evaluated (each takes some milliseconds).
ENVELOPE_POINTS = 30
#: The proven intervals of the roles that have them.
ENVELOPE_FUNCTIONS = {"prime_pi": bounds.pi, "twin_pi": bounds.twin_pi, "nth_prime": bounds.nth_prime}

_PASS = "pass"


@dataclass(frozen=True)
class Difference:
    x: int
    difference: int
    failed: bool


@dataclass(frozen=True)
class Status:
    size: int
    status: str


@dataclass(frozen=True)
class EnvelopePoint:
    """At ``x``: the candidate's answer, the reference it is measured against and the proven
    interval.  ``reference`` is the oracle's exact value, or -- beyond exact reach -- the
    middle of the proven interval (``exact`` says which)."""

    x: int
    got: int
    reference: int
    lower: int
    upper: int
    exact: bool
    failed: bool

    def relative(self, value: int) -> float:
        return as_float(value - self.reference) / self.reference


#: The largest magnitude drawn; a larger value (a wildly wrong answer) is drawn at this height.
PLOT_LIMIT = 1e300


def as_float(value: int) -> float:
    """``value`` as a float for drawing, held within +-:data:`PLOT_LIMIT`."""
    if abs(value) >= PLOT_LIMIT:
        return PLOT_LIMIT if value > 0 else -PLOT_LIMIT
    return float(value)


def _is_integer(value: object) -> bool:
    return type(value) is int


def _checks(records: list[dict]) -> list[dict]:
    return [record for record in records if record.get("type") == "check"]


def _single_argument_answers(records: list[dict]) -> list[dict]:
    """Checks of one call ``f(x)``, x >= 1, whose answer is an integer."""
    return [record for record in _checks(records)
            if len(record["arguments"]) == 1 and record["family"] != "identity"
            and _is_integer(record["arguments"][0]) and record["arguments"][0] >= 1
            and _is_integer(record["got"])]


def spread(items: list, limit: int) -> list:
    """At most ``limit`` of ``items``, evenly spaced, the first and the last included."""
    if len(items) <= limit:
        return list(items)
    if limit <= 0:
        return []
    if limit == 1:
        return [items[0]]
    step = (len(items) - 1) / (limit - 1)
    return [items[round(index * step)] for index in range(limit)]


def spread_logarithmically(records: list[dict], limit: int) -> list[dict]:
    """At most ``limit`` of the single-argument ``records`` (sorted by x >= 1), those nearest
    to points evenly spaced on a log scale between the smallest and the largest x."""
    if len(records) <= limit:
        return list(records)
    if limit <= 0:
        return []
    logs = [math.log(record["arguments"][0]) for record in records]
    chosen = {}
    for index in range(limit):
        target = logs[0] + (logs[-1] - logs[0]) * index / max(limit - 1, 1)
        nearest = bisect.bisect_left(logs, target)
        if nearest == len(logs) or (nearest > 0 and target - logs[nearest - 1] < logs[nearest] - target):
            nearest -= 1
        chosen[nearest] = records[nearest]
    return [chosen[index] for index in sorted(chosen)]


def differences(records: list[dict]) -> list[Difference]:
    """``got - expected`` at each checked x where both are integers, sorted by x."""
    found = sorted((Difference(r["arguments"][0], r["got"] - r["expected"], r["status"] != _PASS)
                    for r in _single_argument_answers(records) if _is_integer(r["expected"])),
                   key=lambda point: point.x)
    passed = spread([point for point in found if not point.failed], MAX_POINTS)
    failed = spread([point for point in found if point.failed], MAX_POINTS)
    return sorted(passed + failed, key=lambda point: point.x)


def statuses(records: list[dict]) -> list[Status]:
    """The status of each check against the size of its input (its largest argument)."""
    found = sorted((Status(max(r["arguments"]), r["status"]) for r in _checks(records)
                    if r["arguments"] and all(_is_integer(a) for a in r["arguments"])
                    and max(r["arguments"]) >= 1), key=lambda point: point.size)
    kept = []
    for status in dict.fromkeys(point.status for point in found):
        kept += spread([point for point in found if point.status == status], MAX_POINTS)
    return sorted(kept, key=lambda point: point.size)


def envelope(role: str, records: list[dict]) -> list[EnvelopePoint]:
    """The candidate's answers beside the proven intervals, at up to :data:`ENVELOPE_POINTS`
    inputs spread over a log scale (a third of them failures, where there are any), sorted by x."""
    proven_interval = ENVELOPE_FUNCTIONS.get(role)
    if proven_interval is None:
        return []
    by_input = {}
    for record in _single_argument_answers(records):
        by_input.setdefault(record["arguments"][0], record)
    ordered = [by_input[x] for x in sorted(by_input)]
    failed = spread_logarithmically([r for r in ordered if r["status"] != _PASS], ENVELOPE_POINTS // 3)
    chosen = {id(record) for record in failed}
    rest = spread_logarithmically([r for r in ordered if id(r) not in chosen],
                                  ENVELOPE_POINTS - len(failed))
    points = []
    for record in sorted(failed + rest, key=lambda r: r["arguments"][0]):
        point = _envelope_point(proven_interval, record)
        if point is not None:
            points.append(point)
    return points


def _envelope_point(proven_interval, record: dict) -> EnvelopePoint | None:
    (x,) = record["arguments"]
    expected = record["expected"]
    if isinstance(expected, list) and len(expected) == 2 and all(map(_is_integer, expected)):
        lower, upper = expected                    # a proven-interval check carries its interval
    else:
        try:
            interval = proven_interval(x)
        except (OracleError, ArithmeticError):     # no enclosure of a bound at this x: no point
            return None
        lower, upper = interval.lower, interval.upper
    if lower is None or upper is None:
        return None
    exact = _is_integer(expected)
    reference = expected if exact else (lower + upper) // 2
    if reference <= 0:
        return None
    return EnvelopePoint(x, record["got"], reference, lower, upper, exact,
                         record["status"] != _PASS)


def divergence_input(summary: dict) -> int | None:
    """The input where the first divergence lies (for primes_in: the prime it concerns)."""
    divergence = summary.get("first_divergence")
    if not divergence:
        return None
    if _is_integer(divergence.get("prime")):
        return divergence["prime"]
    where = divergence.get("input")
    if isinstance(where, list) and where and all(map(_is_integer, where)):
        return max(where)
    return None
