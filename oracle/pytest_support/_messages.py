"""The failure message of a check: input, got, expected, provenance, divergence, seed.

One finding a line, the first divergence when the engine localised one, the
points that were not run (never counted as passed), and the two ways to
repeat the run: the pytest options and the ``ntoracle audit`` command.
"""

from __future__ import annotations

__all__ = ["failure_message", "SHOWN_FINDINGS"]

#: Findings listed in one message; the rest are counted.
SHOWN_FINDINGS = 8
_WIDTH = 120


def _short(value: object) -> str:
    """``value`` in at most about :data:`_WIDTH` characters, saying how large a cut one was."""
    from ..report._describe import show_value

    if value is None:
        return "None"
    return show_value(value, _WIDTH - 3)


def _call(role: str, arguments) -> str:
    return f"{role}({', '.join(str(a) for a in arguments)})"


def _finding(role: str, failure: dict) -> list[str]:
    lines = [f"{_call(role, failure['arguments'])}: {failure['status']} ({failure['check']})"]
    if failure["status"] in ("wrong", "nondeterministic"):
        lines.append(f"    input:      {', '.join(str(a) for a in failure['arguments'])}")
        lines.append(f"    got:        {_short(failure['got'])}")
        lines.append(f"    expected:   {_short(failure['expected'])}")
        lines.append(f"    provenance: {failure['provenance'] or 'n/a'}")
    if failure.get("detail") and not str(failure["detail"]).startswith("got "):
        lines.append(f"    detail:     {_short(failure['detail'])}")
    return lines


def _divergence(divergence: dict) -> str:
    where = divergence.get("prime", divergence.get("input"))
    text = f"{divergence['kind']}: {where}"
    if "last_agreeing" in divergence:
        text += f" (last agreeing: {divergence['last_agreeing']})"
    if "got" in divergence:
        text += f"; got {_short(divergence.get('got'))}, expected {_short(divergence.get('expected'))}"
    if divergence.get("provenance"):
        text += f" [{divergence['provenance']}]"
    return text


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
        lines.append(_divergence(summary["first_divergence"]))
    for reason, count in (summary.get("skipped") or {}).items():
        lines.append(f"not run: {count} point(s), {reason} (not counted as passed)")
    lines.append("reproduce: " + (reproduce or f"pytest --ntoracle-seed {seed} --ntoracle-profile {profile}"))
    return "\n".join(lines)
