"""The summary of one audit as lines of text: the one summary renderer of every front end.

The command line prints these lines after an audit (and writes them to
``report.txt``); the HTML report shows the same verdict line and the same
finding lines, so that a run reads the same wherever it is looked at.  Values go
through :mod:`oracle.report._values`.
"""

from __future__ import annotations

from .._bounded import bounded_text, printable
from ._values import got_expected, show_value

__all__ = ["summary_lines", "verdict_line", "finding_line", "divergence_line"]

#: Findings listed by default; the rest are counted.
LISTED_FINDINGS = 20


def verdict_line(summary: dict) -> str:
    """``PASSED: 3198 of 3264 checks passed, 0 finding(s)``, with every reservation after it:
    an interruption, points not run (the early stop, the time budget), garbled lines, tampering."""
    from ..engine import SKIPS_KEEPING_COMPLETE

    verdict = {"passed": "PASSED", "failed": "FAILED"}.get(summary["verdict"], "NO VERDICT")
    reservations = []
    if summary.get("interrupted"):
        reservations.append(f"run interrupted ({summary['interrupted']})")
    elif not summary["ended"]:
        reservations.append("the results have no end record")
    if summary["not_run"]:
        reasons = "; ".join(reason for reason in summary["skipped"]
                            if reason not in SKIPS_KEEPING_COMPLETE)
        reservations.append(f"{summary['not_run']} point(s) not run: {reasons}")
    if summary.get("garbled_lines"):
        reservations.append(f"{summary['garbled_lines']} garbled line(s) skipped")
    if summary.get("tampered"):
        reservations.append("the candidate changed the harness it ran in ("
                            + ", ".join(summary["tampered"][:3])
                            + (", ..." if len(summary["tampered"]) > 3 else "")
                            + "): every check of this run is void; audit it isolated (the default)")
    return (f"{verdict}: {summary['passed_checks']} of {summary['checks']} checks passed, "
            f"{len(summary['failures'])} finding(s)" + "".join(f" -- {r}" for r in reservations))


def finding_line(failure: dict, limit: int = 80) -> str:
    """``[wrong] exact at (1048576) [boundaries]: got 16489, expected 82025 [table:...]``."""
    call = ", ".join(show_value(a, 60) for a in failure["arguments"])
    text = f"[{failure['status']}] {failure['check']} at ({call}) [{failure['family']}]"
    if failure["status"] in ("wrong", "nondeterministic"):
        text += f": {got_expected(failure['got'], failure['expected'], limit)} [{failure['provenance']}]"
    if failure.get("detail") and not str(failure["detail"]).startswith("got "):
        text += f" -- {bounded_text(failure['detail'], 160)}"
    return text


def divergence_line(divergence: dict, limit: int = 80) -> str:
    """``first divergence: 1048576 (last agreeing: 1048575); got 16489, expected 82025 [...]``."""
    where = divergence.get("prime", divergence.get("input"))
    return (f"{divergence['kind']}: {show_value(where, limit)}"
            + (f" (last agreeing: {show_value(divergence['last_agreeing'], limit)})"
               if "last_agreeing" in divergence else "")
            + (f"; {got_expected(divergence.get('got'), divergence.get('expected'), limit)}"
               if "got" in divergence else "")
            + (f" [{divergence['provenance']}]" if divergence.get("provenance") else ""))


def summary_lines(summary: dict, listed: int = LISTED_FINDINGS) -> list[str]:
    """The verdict, the first ``listed`` findings, the first divergence, skips, reach, timings."""
    failures = summary["failures"]
    lines = [verdict_line(summary)]
    lines += ["  " + finding_line(failure) for failure in failures[:listed]]
    if len(failures) > listed:
        lines.append(f"  ... and {len(failures) - listed} more (see the results file)")
    if summary["first_divergence"]:
        lines.append(divergence_line(summary["first_divergence"]))
    for reason, count in summary["skipped"].items():
        lines.append(f"skipped {count} point(s): {reason} (not counted as passed)")
    from ._terminal import reach_lines

    lines += reach_lines(summary)[:6]
    timings = summary["timings"]
    first = timings["first_finding_seconds"]
    lines.append(f"time: {timings['total_seconds']:.2f} s"
                 + (f"; first finding after {first:.3f} s" if first is not None else ""))
    return [printable(line) for line in lines]      # for a terminal: no candidate's control codes
