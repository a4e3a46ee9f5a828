"""Exact counts remembered during one audit, and new ones from the nearest of them.

For a count N of constellations of span s (s = 0 for primes; s = 2 for twin
pairs, counted by their larger member p + 2 ≤ x):

    N(x) = N(a) + C(a − s + 1, x)   for a ≤ x,
    N(x) = N(a) − C(x − s + 1, a)   for a > x,

where C(l, h) is the number of constellations lying wholly in [l, h] -- the
oracle's ``answer("count", kind, l, h)``, a sieve of h − l integers.  The
published tables use the same identity from their entries (see
:func:`oracle.facade.answer`).  An audit asks for counts at many points close
together (2³² ± 2, the members of twin pairs near 2³², consecutive sampled
points in increasing order), so starting from the count already known
nearest to x replaces one long sieve per point by a short sieve per gap
between neighbouring points -- a cumulative count over the sampled range.

Every remembered value is an exact answer of the oracle with its provenance;
a derived count carries the provenance of its starting point joined with the
sieve's.  What is remembered lives as long as one run (one
:class:`KnownCounts` per audit), so a run's answers depend only on its seed.
"""

from __future__ import annotations

import bisect

from .. import claims, facade, tables
from .._errors import OutOfReachError

__all__ = ["KnownCounts", "join_provenance"]

#: Span s of each constellation kind (its last member minus its first).
SPANS = {"primes": 0, "twins": 2}
#: Longest distance from a remembered count worth sieving instead of asking the oracle afresh.
NEAR = 2**30


def join_provenance(*provenances: str) -> str:
    """Labels such as ``table:oeis-a007508+sieve`` and ``sieve`` combined, each label once."""
    labels: list[str] = []
    for provenance in provenances:
        for label in provenance.split("+"):
            if label and label not in labels:
                labels.append(label)
    return "+".join(labels)


class KnownCounts:
    """Exact values of the counting function ``function`` (``pi`` or ``twin_pi``) for one run."""

    def __init__(self, function: str):
        self.function = function
        self.kind = claims.COUNTING_FUNCTIONS[function]
        self.span = SPANS[self.kind]
        self._points: list[int] = []                       # sorted arguments remembered
        self._values: dict[int, tuple[int, str]] = {}      # x -> (N(x), provenance)
        self._table_points = sorted(tables.values(function))

    def exact(self, x: int, budget: float | None) -> tuple[int, str]:
        """``(N(x), provenance)``; raises :class:`OutOfReachError` when no exact route fits ``budget``."""
        known = self._values.get(x)
        if known is not None:
            return known
        anchor = self._nearest_remembered(x)
        if x >= 2 and anchor is not None and abs(x - anchor) <= min(NEAR, self._table_distance(x)):
            found = self._from_anchor(anchor, x, budget)
        else:
            try:
                reference = facade.answer(self.function, x, budget=budget)
                found = (reference.value, reference.provenance)
            except OutOfReachError:
                if anchor is None or x < 2:
                    raise
                found = self._from_anchor(anchor, x, budget)
        self._remember(x, found)
        return found

    def _from_anchor(self, anchor: int, x: int, budget: float | None) -> tuple[int, str]:
        base, base_provenance = self._values[anchor]
        if anchor <= x:
            low, high, sign = anchor - self.span + 1, x, 1
        else:
            low, high, sign = x - self.span + 1, anchor, -1
        between = facade.answer("count", self.kind, max(low, 0), high, budget=budget)
        return base + sign * between.value, join_provenance(base_provenance, between.provenance)

    def _nearest_remembered(self, x: int) -> int | None:
        return _nearest(self._points, x)

    def _table_distance(self, x: int) -> float:
        nearest = _nearest(self._table_points, x)
        return float("inf") if nearest is None else abs(x - nearest)

    def _remember(self, x: int, found: tuple[int, str]) -> None:
        bisect.insort(self._points, x)
        self._values[x] = found


def _nearest(points: list[int], x: int) -> int | None:
    """The element of the sorted list ``points`` nearest to ``x`` (None for an empty list)."""
    index = bisect.bisect_left(points, x)
    around = points[max(index - 1, 0):index + 1]
    return min(around, key=lambda point: abs(point - x)) if around else None
