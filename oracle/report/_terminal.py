"""The terminal front of a report: a live progress line and the end-of-run summary table.

Both draw with ``rich`` but take plain arguments, so the engine and the command
line drive them without knowing it.  Colour and live drawing happen only on a
terminal: on a pipe or a CI log (a stream that is not a TTY) the progress line
stays silent and the table is plain text; ``NO_COLOR`` (https://no-color.org,
common practice) turns colour off everywhere.  ``quiet=True`` silences the
progress line, so that a CI log holds nothing but the summary.
"""

from __future__ import annotations

import math
import os
import sys
import time
from typing import TextIO

from .._errors import InvalidInputError
from .._integers import require_int
from ._cautions import CAUTIONS
from ._describe import describe_divergence, verdict_of

__all__ = ["Progress", "summary_table", "reach_lines", "readable_size"]

#: "checked up to" lines printed per role under the table (the largest first).
REACH_LINES_SHOWN = 3
#: Width of the table when the stream is not a terminal (a log has no width of its own).
LOG_WIDTH = 120

_VERDICT_STYLES = {"passed": "bold green", "failed": "bold red", "incomplete": "bold yellow",
                   "no verdict": "bold yellow"}


def _is_terminal(stream: TextIO) -> bool:
    isatty = getattr(stream, "isatty", None)
    return bool(isatty and isatty())


def _colour_wanted(stream: TextIO, colour: bool | None) -> bool:
    if colour is not None:
        return bool(colour)
    return _is_terminal(stream) and not os.environ.get("NO_COLOR")


def _console(stream: TextIO, colour: bool, live: bool = False):
    """A rich console on ``stream``; ``live`` lets it redraw in place (a progress line)."""
    from rich.console import Console

    return Console(file=stream, force_terminal=colour or live, no_color=not colour,
                   color_system="auto" if colour else None, markup=False, highlight=False,
                   emoji=False, width=None if _is_terminal(stream) else LOG_WIDTH)


class Progress:
    """A progress line for one audit: checks done of the total, rate, time elapsed and remaining.

    Use it as a context manager and call :meth:`advance` after each check (or pass
    each record of the run to :meth:`observe`).  The line appears only once the run
    has lasted ``delay`` seconds, only when ``live`` (by default: when ``stream`` is
    a terminal), never when ``quiet``; it is erased when the run ends, so that the
    summary follows on a clean screen.  ``total`` may be ``None`` until it is known
    (:meth:`set_total`).
    """

    def __init__(self, total: int | None = None, description: str = "checks", *,
                 quiet: bool = False, stream: TextIO | None = None, delay: float = 1.0,
                 live: bool | None = None):
        self.total = None if total is None else require_int("total", total, minimum=0)
        if isinstance(delay, bool) or not isinstance(delay, (int, float)) or not delay >= 0:
            raise InvalidInputError(f"delay={delay!r}: must be a number of seconds >= 0")
        self.description = str(description)
        self.stream = sys.stderr if stream is None else stream
        self.delay = float(delay)
        self.shown = not quiet and (_is_terminal(self.stream) if live is None else bool(live))
        self.completed = 0
        self._started_at: float | None = None
        self._display = None
        self._task = None

    def __enter__(self) -> "Progress":
        self._started_at = time.monotonic()
        if self.delay == 0:
            self._show()
        return self

    def __exit__(self, *exc_info) -> None:
        if self._display is not None:
            self._display.stop()
            self._display = None

    def set_total(self, total: int | None) -> None:
        """The number of checks expected in all (``None``: not known)."""
        self.total = None if total is None else require_int("total", total, minimum=0)
        if self._display is not None:
            self._display.update(self._task, total=self.total)

    def advance(self, n: int = 1) -> None:
        """Count ``n`` more checks as done."""
        self.completed += require_int("n", n, minimum=0)
        if self.shown and self._display is None and self._started_at is not None \
                and time.monotonic() - self._started_at >= self.delay:
            self._show()
        if self._display is not None:
            self._display.update(self._task, completed=self.completed)

    def observe(self, record: dict) -> None:
        """Follow a run's records: a ``plan`` sets the total, each ``check`` advances by one."""
        if record.get("type") == "check":
            self.advance()
        elif record.get("type") == "plan":
            self.set_total(max(int(record["points"]), self.completed))

    def _show(self) -> None:
        if not self.shown:
            return
        from rich.progress import (BarColumn, MofNCompleteColumn, TextColumn, TimeElapsedColumn,
                                   TimeRemainingColumn)
        from rich.progress import Progress as RichProgress

        console = _console(self.stream, _colour_wanted(self.stream, None), live=True)
        self._display = RichProgress(TextColumn("{task.description}", markup=False), BarColumn(),
                                     MofNCompleteColumn(), _rate_column(), TimeElapsedColumn(),
                                     TextColumn("remaining"), TimeRemainingColumn(),
                                     console=console, transient=True)
        self._task = self._display.add_task(self.description, total=self.total,
                                            completed=self.completed)
        self._display.start()


def _rate_column():
    from rich.progress import ProgressColumn
    from rich.text import Text

    class RateColumn(ProgressColumn):
        """Checks per second, measured by rich over the last few updates."""

        def render(self, task) -> Text:
            speed = task.finished_speed or task.speed
            return Text("" if speed is None else f"{speed:,.0f} checks/s")

    return RateColumn()


def summary_table(summaries: dict | list[dict], stream: TextIO | None = None, *,
                  colour: bool | None = None, cautions: bool = True) -> None:
    """Print one row per audit: role, seed, checks, passed, failed, skipped, first
    divergence and verdict; then the cautions (unless ``cautions=False``).

    ``colour=None`` colours the verdicts only on a terminal without ``NO_COLOR``.
    """
    from rich import box
    from rich.table import Table
    from rich.text import Text

    if isinstance(summaries, dict):
        summaries = [summaries]
    stream = sys.stdout if stream is None else stream
    wanted = _colour_wanted(stream, colour)
    console = _console(stream, wanted)
    table = Table(title="ntoracle audit summary", box=box.SIMPLE_HEAD, title_justify="left")
    table.add_column("role")
    table.add_column("seed", overflow="fold")
    for heading in ("checks", "passed", "failed", "skipped"):
        table.add_column(heading, justify="right")
    table.add_column("first divergence", overflow="fold")
    table.add_column("verdict")
    for summary in summaries:
        verdict = verdict_of(summary)
        table.add_row(Text(str(summary["role"])), Text(str(summary["seed"])), Text(str(summary["checks"])),
                      Text(str(summary["passed_checks"])), Text(str(len(summary["failures"]))),
                      Text(str(sum(summary["skipped"].values()))),
                      Text(describe_divergence(summary["first_divergence"], limit=24)),
                      Text(verdict.upper(), style=_VERDICT_STYLES[verdict] if wanted else ""))
    console.print(table)
    for summary in summaries:
        lines = reach_lines(summary)
        for line in lines[:REACH_LINES_SHOWN]:
            console.print(Text(line))
        if len(lines) > REACH_LINES_SHOWN:
            console.print(Text(f"{summary.get('role')}: ... and {len(lines) - REACH_LINES_SHOWN} "
                               "more families (all of them in the JSON summary and the HTML report)"))
    if cautions:
        for caution in CAUTIONS:
            console.print(Text(f"Caution: {caution}"))


def readable_size(n: int) -> str:
    """An input size as people read it: ``10^17 + 1``, ``2^64 - 1``, else the digits (≈ e-notation)."""
    if n >= 8:
        for base in (10, 2):
            k = round(math.log(n, base))
            for exponent in (k - 1, k, k + 1):
                offset = n - base ** exponent
                if exponent > 1 and abs(offset) <= 2:
                    return f"{base}^{exponent}" + ("" if offset == 0 else
                                                   f" {'+' if offset > 0 else '-'} {abs(offset)}")
    if n.bit_length() > 1000:                # no float for it; int -> str refused above 4300 digits
        return f"about 2^{n.bit_length() - 1}"
    return str(n) if n < 10**6 else f"{n} (≈ {n:.2e})"


def reach_lines(summary: dict) -> list[str]:
    """One line per family of inputs, largest first: how far it was checked and why no further."""
    reach = summary.get("reach") or {}
    ordered = sorted(((entry.get("largest"), family, entry.get("stopped"))
                      for family, entry in reach.items() if entry.get("largest") is not None),
                     key=lambda item: -item[0])
    return [f"{summary.get('role')}: checked up to {readable_size(largest)} ({family}"
            + (f"; stopped: {stopped})" if stopped else ")")
            for largest, family, stopped in ordered]
