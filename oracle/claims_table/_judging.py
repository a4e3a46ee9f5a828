"""Judging the rows of a table of claims: each row alone, then neighbours against each other.

Each row is compared with the oracle (:mod:`oracle.facade`) exactly where it
reaches within the budget, and beyond it with the checks of
:mod:`oracle.claims` (the proven interval; for ``nth_prime`` also primality of
the claim).  Neighbouring ``prime_pi`` or ``twin_pi`` rows, sorted by argument,
are compared when at least one of the two was not judged exactly: the counts
never decrease (:func:`oracle.claims.check_monotone`), and their difference is
the exact count of the interval between them when it is short enough to sieve
(:func:`oracle.claims.check_difference`).
"""

from __future__ import annotations

from dataclasses import dataclass, field

from .._bounded import bounded_text
from .._errors import OracleError, OutOfReachError
from ._reading import BadRow, Row

__all__ = ["DEFAULT_BUDGET_SECONDS", "judge_table"]

#: Seconds of computation the oracle may spend on one exact answer of a table.
DEFAULT_BUDGET_SECONDS = 20.0

# Role name -> the name oracle.claims uses for that counting function.
_COUNTING = {"prime_pi": "pi", "twin_pi": "twin_pi"}


@dataclass
class _Judged:
    row: Row
    checks: list = field(default_factory=list)      # ClaimCheck, this row's own
    pairs: list = field(default_factory=list)       # (ClaimCheck, lower row, upper row)

    @property
    def exact(self) -> bool:
        return any(check.check in ("exact", "factorization") for check in self.checks)

    @property
    def verdict(self) -> str:
        if any(not check.passed for check in self.checks):
            return "refuted"
        if any(not check.passed for check, _, _ in self.pairs):
            return "conflicting"            # this row or its neighbour is wrong: not which
        return "confirmed" if self.exact else "consistent"


def judge_table(rows: list[Row], *, budget: float | None = DEFAULT_BUDGET_SECONDS,
                progress=None):
    """Judge each row, then each pair of neighbouring counting rows; returns
    ``(judged rows, rows that could not be judged, pairs left unchecked)``.
    ``progress``, if given, is called as ``progress(rows_done, rows_in_all)`` after each row."""
    judged: list[_Judged] = []
    not_judged: list[BadRow] = []
    for done, row in enumerate(rows, start=1):
        try:
            judged.append(_Judged(row, _judge_row(row, budget)))
        except OracleError as error:
            not_judged.append(BadRow(row.line, "not-judged", bounded_text(str(error), 300)))
        if progress is not None:
            progress(done, len(rows))
    unchecked = _judge_neighbours(judged, budget)
    return judged, not_judged, unchecked


def _judge_row(row: Row, budget):
    from .. import claims, facade
    from ..claims import ClaimCheck

    if row.function in _COUNTING:
        return [claims.check_count(_COUNTING[row.function], row.argument, row.claimed,
                                   budget=budget)]
    if row.function == "nth_prime":
        return claims.check_nth_prime(row.argument, row.claimed, budget=budget)
    if row.function == "factor":
        report = facade.verify_factorization(row.argument, row.claimed)
        return [ClaimCheck("factorization", "factor", (row.argument,), row.claimed,
                           "a product equal to n of primes", report.provenance, report.ok,
                           "; ".join(report.problems))]
    answer = facade.answer(row.function, row.argument, budget=budget)
    return [ClaimCheck("exact", row.function, (row.argument,), row.claimed, answer.value,
                       answer.provenance, row.claimed == answer.value)]


def _judge_neighbours(judged: list[_Judged], budget) -> int:
    """Monotonicity and short-interval differences between neighbours of each counting
    function, where at least one of the two was not judged exactly; returns how many such
    pairs were too far apart for an exact difference."""
    from .. import claims

    unchecked = 0
    for function, name in _COUNTING.items():
        ordered = sorted((entry for entry in judged if entry.row.function == function),
                         key=lambda entry: (entry.row.argument, entry.row.line))
        for first, second in zip(ordered, ordered[1:]):
            if first.exact and second.exact:
                continue                  # both exact: each row's own verdict says it all
            a, b = first.row, second.row
            monotone = claims.check_monotone(name, [(a.argument, a.claimed),
                                                    (b.argument, b.claimed)])
            first.pairs.append((monotone, a, b))
            second.pairs.append((monotone, a, b))
            if a.argument == b.argument:
                continue
            try:
                difference = claims.check_difference(name, a.argument, b.argument - a.argument,
                                                     a.claimed, b.claimed, budget=budget)
            except OutOfReachError:
                unchecked += 1
                continue
            first.pairs.append((difference, a, b))
            second.pairs.append((difference, a, b))
    return unchecked
