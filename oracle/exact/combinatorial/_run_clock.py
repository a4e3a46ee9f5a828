"""Time budget and progress reports for long runs.

``RunClock.report(fraction, stage)`` is handed to the algorithm, which calls it
after each segment.  It forwards at most ``REPORTS_PER_SECOND`` calls to the
user's ``progress(fraction_done, stage)`` and raises
:class:`~oracle._errors.OutOfReachError` once the elapsed time exceeds the
budget, so a run that outgrows its estimate stops instead of running on.
"""

from __future__ import annotations

import time
from typing import Callable

from ..._errors import InvalidInputError, OutOfReachError

REPORTS_PER_SECOND = 4


class RunClock:
    """Watches one computation: elapsed time against a budget, throttled progress."""

    def __init__(self, what: str, time_budget: float | None,
                 progress: Callable[[float, str], object] | None):
        self.what = what
        self.budget = time_budget
        self.progress = progress
        self.started = time.monotonic()
        self._last_report = float("-inf")

    def report(self, fraction: float, stage: str) -> None:
        now = time.monotonic()
        elapsed = now - self.started
        if self.budget is not None and elapsed > self.budget:
            raise OutOfReachError(
                f"{self.what}: stopped after {elapsed:.1f} s, over the time budget of "
                f"{self.budget:g} s ({100 * fraction:.0f}% done)")
        if self.progress is not None and now - self._last_report >= 1.0 / REPORTS_PER_SECOND:
            self._last_report = now
            self.progress(min(1.0, max(0.0, fraction)), stage)

    def finish(self) -> None:
        """Send the final ``progress(1.0, "done")``."""
        if self.progress is not None:
            self.progress(1.0, "done")


def check_budget(what: str, estimate: float, time_budget: float | None) -> None:
    """Refuse before starting when the cost model already exceeds the budget."""
    if time_budget is not None and estimate > time_budget:
        raise OutOfReachError(
            f"{what}: estimated {estimate:.1f} s exceeds the time budget of {time_budget:g} s")


def validate_budget(time_budget: object) -> float | None:
    """``None`` or a positive real number of seconds."""
    if time_budget is None:
        return None
    if isinstance(time_budget, bool) or not isinstance(time_budget, (int, float)):
        raise InvalidInputError(f"time_budget={time_budget!r}: expected a number of seconds or None")
    if not time_budget > 0:
        raise InvalidInputError(f"time_budget={time_budget!r}: must be > 0")
    return float(time_budget)
