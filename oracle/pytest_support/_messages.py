"""The failure message of a check: input, got, expected, provenance, divergence, seed.

Values and the first divergence are written by the one renderer of every front end
(:mod:`oracle.report._values`, :func:`oracle.report.divergence_line`).  One finding a line, the first divergence when the engine localised one, the
points that were not run (never counted as passed), and the two ways to
repeat the run: the pytest options and the ``ntoracle audit`` command.
"""

from __future__ import annotations

__all__ = ["failure_message", "SHOWN_FINDINGS"]

#: Findings listed in one message; the rest are counted.
SHOWN_FINDINGS = 8
_WIDTH = 120


def _call(role: str, arguments) -> str:
    from ..report import show_value

    return f"{role}({', '.join(show_value(a, 60) for a in arguments)})"


def _finding(role: str, failure: dict) -> list[str]:
    from ..report import show_pair, show_value

    lines = [f"{_call(role, failure['arguments'])}: {failure['status']} ({failure['check']})"]
    if failure["status"] in ("wrong", "nondeterministic"):
        got, expected = show_pair(failure["got"], failure["expected"], _WIDTH - 3)
        lines.append(f"    input:      {', '.join(show_value(a, 60) for a in failure['arguments'])}")
        lines.append(f"    got:        {got}")
        lines.append(f"    expected:   {expected}")
        lines.append(f"    provenance: {failure['provenance'] or 'n/a'}")
    if failure.get("detail") and not str(failure["detail"]).startswith("got "):
        lines.append(f"    detail:     {show_value(failure['detail'], _WIDTH - 3)}")
    return lines


def failure_message(summary: dict, *, role: str, target: str, case: str, seed: int, profile: str,
                    reproduce: str | None = None) -> str:
    """The text shown for a failed check item."""
    failures = summary["failures"]
    lines = [f"ntoracle: {target} as {role} failed {len(failures)} of {summary['checks']} checks "
             f"in case {case!r} (profile {profile}, seed {seed})"]
    for failure in failures[:SHOWN_FINDINGS]:
        lines += _finding(role, failure)
    if len(failures) > SHOWN_FINDINGS:
        lines.append(f"... and {len(failures) - SHOWN_FINDINGS} more finding(s)")
    if summary.get("first_divergence"):
        from ..report import divergence_line

        lines.append(divergence_line(summary["first_divergence"], _WIDTH - 3))
    for reason, count in (summary.get("skipped") or {}).items():
        lines.append(f"not run: {count} point(s), {reason} (not counted as passed)")
    lines.append("reproduce: " + (reproduce or f"pytest --ntoracle-seed {seed} --ntoracle-profile {profile}"))
    from .._bounded import printable

    return "\n".join(printable(line) for line in lines)    # no candidate's control codes
