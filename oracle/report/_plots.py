"""The plots of a report, drawn with matplotlib's Agg renderer into PNG bytes.

Figures are made with :class:`matplotlib.figure.Figure` on an Agg canvas, never
through pyplot: nothing needs a display, and a user's own pyplot state (in a
notebook, say) is left as it was.  matplotlib is imported only when a plot is
drawn.  No text that comes from a candidate is drawn into a figure (the HTML
captions carry it, escaped); the figures hold role names and numbers only.
"""

from __future__ import annotations

import io
import math

from ._plot_data import Difference, EnvelopePoint, Status, as_float

__all__ = ["difference_plot", "envelope_plot", "status_strip"]

DPI = 100
WIDTH_INCHES = 9.0
#: Where the axes end, as a fraction of the width; the legend stands to the right of it.
AXES_RIGHT = 0.74
AGREES, DIFFERS, DIVERGENCE = "#2e7d32", "#c62828", "#37474f"
ENVELOPE, ORACLE = "#90caf9", "#1565c0"
STATUS_COLOURS = {"pass": AGREES, "wrong": DIFFERS, "wrong-type": "#ef6c00", "raised": "#6a1b9a",
                  "too-slow": "#795548", "crashed": "#000000", "bad-output": "#37474f", "tampered": "#b71c1c", "nondeterministic": "#ad1457"}


def _figure(height: float, left: float = 0.11):
    """A figure of fixed margins (``left``, as a fraction of the width, leaves room for
    the y labels): laid out once, so drawn once."""
    from matplotlib.backends.backend_agg import FigureCanvasAgg
    from matplotlib.figure import Figure

    figure = Figure(figsize=(WIDTH_INCHES, height), dpi=DPI)
    FigureCanvasAgg(figure)
    figure.subplots_adjust(left=left, right=AXES_RIGHT, bottom=0.5 / height,
                           top=1 - 0.35 / height)
    return figure, figure.add_subplot()


def _png(figure) -> bytes:
    buffer = io.BytesIO()
    figure.savefig(buffer, format="png", dpi=DPI, bbox_inches="tight")
    return buffer.getvalue()


def _legend(axes) -> None:
    axes.legend(loc="upper left", bbox_to_anchor=(1.02, 1.0), fontsize=8, frameon=False)


def _symmetric_log_threshold(values: list[float]) -> float:
    """The power of ten at or below the smallest non-zero magnitude: the linear part of a
    symmetric log axis around 0 (at least 1e-12)."""
    smallest = min((abs(value) for value in values if value != 0), default=1.0)
    return max(10.0 ** math.floor(math.log10(smallest)), 1e-12)


def _mark_divergence(axes, divergence_x: int | None, what: str = "x") -> bool:
    """Draw the first divergence as a dashed vertical line; False when there is none to draw."""
    if divergence_x is None or divergence_x < 1:
        return False
    where = f"= {divergence_x}" if divergence_x < 10**9 else f"~ {float(divergence_x):.3g}"
    axes.axvline(as_float(divergence_x), color=DIVERGENCE, linestyle="--", linewidth=1.2,
                 label=f"first divergence, {what} {where}")
    return True


def _xs(points) -> list[float]:
    return [as_float(point.x) for point in points]


def difference_plot(role: str, points: list[Difference], divergence_x: int | None) -> bytes:
    """Candidate minus oracle against x, both axes logarithmic (the y axis on both sides of
    zero, linear between -1 and 1), the first divergence marked."""
    figure, axes = _figure(3.4)
    agreeing = [point for point in points if not point.failed]
    differing = [point for point in points if point.failed]
    axes.axhline(0, color="#9e9e9e", linewidth=0.8)
    axes.scatter(_xs(agreeing), [as_float(p.difference) for p in agreeing], s=8, color=AGREES,
                 label=f"agrees with the oracle ({len(agreeing)} shown)")
    axes.scatter(_xs(differing), [as_float(p.difference) for p in differing], s=22, marker="x",
                 color=DIFFERS, label=f"differs ({len(differing)} shown)")
    _mark_divergence(axes, divergence_x)
    axes.set_xscale("log")
    axes.set_yscale("symlog", linthresh=1)
    axes.set_xlabel("x (log scale)")
    axes.set_ylabel("candidate - oracle")
    axes.set_title(f"{role}: candidate minus oracle")
    _legend(axes)
    return _png(figure)


def envelope_plot(role: str, points: list[EnvelopePoint], divergence_x: int | None) -> bytes:
    """The proven interval as a band and the candidate's answers, both relative to the
    oracle's value, (value - oracle) / oracle, on a symmetric log axis."""
    variable = "n" if role == "nth_prime" else "x"
    figure, axes = _figure(3.6)
    lower = [point.relative(point.lower) for point in points]
    upper = [point.relative(point.upper) for point in points]
    axes.fill_between(_xs(points), lower, upper, color=ENVELOPE, alpha=0.5,
                      label="proven interval (oracle.bounds)")
    axes.plot(_xs(points), lower, color=ORACLE, linewidth=0.8)
    axes.plot(_xs(points), upper, color=ORACLE, linewidth=0.8)
    axes.axhline(0, color=ORACLE, linewidth=1.0, label="oracle value")
    agreeing = [point for point in points if not point.failed]
    differing = [point for point in points if point.failed]
    axes.scatter(_xs(agreeing), [p.relative(p.got) for p in agreeing], s=10, color=AGREES,
                 zorder=3, label="candidate, agrees")
    axes.scatter(_xs(differing), [p.relative(p.got) for p in differing], s=26, marker="x",
                 color=DIFFERS, zorder=3, label="candidate, differs")
    _mark_divergence(axes, divergence_x, variable)
    axes.set_xscale("log")
    axes.set_yscale("symlog", linthresh=_symmetric_log_threshold(lower + upper))
    axes.set_xlabel(f"{variable} (log scale)")
    axes.set_ylabel("(value - oracle) / oracle")
    axes.set_title(f"{role}: the candidate inside the proven bounds")
    _legend(axes)
    return _png(figure)


def status_strip(role: str, points: list[Status], divergence_x: int | None) -> bytes:
    """One row per status (pass, wrong, raised, ...), each check a mark at the size of its input."""
    seen = {point.status for point in points}
    rows = [status for status in STATUS_COLOURS if status in seen] + sorted(seen - STATUS_COLOURS.keys())
    figure, axes = _figure(1.6 + 0.35 * max(len(rows), 1), left=0.17)
    for row, status in enumerate(rows):
        sizes = [as_float(point.size) for point in points if point.status == status]
        axes.scatter(sizes, [row] * len(sizes), s=14, marker="|" if status == "pass" else "x",
                     color=STATUS_COLOURS.get(status, DIVERGENCE))
    axes.set_yticks(range(len(rows)), rows)
    axes.set_ylim(-0.7, len(rows) - 0.3)
    axes.set_xscale("log")
    axes.set_xlabel("size of the input (largest argument, log scale)")
    axes.set_title(f"{role}: verdict of each check")
    if _mark_divergence(axes, divergence_x, "input"):
        _legend(axes)
    return _png(figure)
