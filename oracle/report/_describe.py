"""Short human-readable texts for the values of a summary: inputs, answers, divergences."""

from __future__ import annotations

from ._values import VALUE_LIMIT, got_expected, show_value

__all__ = ["show_value", "show_arguments", "describe_divergence", "verdict_of", "VERDICT_CLASSES",
           "VALUE_LIMIT"]


def show_arguments(arguments: object) -> str:
    """The arguments of a call, as they would be written in the call: ``(2, 10)``."""
    if isinstance(arguments, (list, tuple)):
        return "(" + ", ".join(show_value(argument) for argument in arguments) + ")"
    return show_value(arguments)


def _where(arguments: object) -> str:
    if isinstance(arguments, list) and len(arguments) == 1:
        return show_value(arguments[0])
    return show_arguments(arguments)


def describe_divergence(divergence: dict | None, limit: int = 40) -> str:
    """One line for the first divergence of a summary (answers cut to ``limit`` characters);
    empty when there is none.  ``first divergence 1048576, last agreeing 1048575; got 16489,
    expected 82025``, ``first missing prime 131071 in (131071, 131071)``."""
    if not divergence:
        return ""
    text = str(divergence.get("kind", "divergence"))
    if "prime" in divergence:
        text += f" {show_value(divergence['prime'])}"
        if divergence.get("input") is not None:
            text += f" in {show_arguments(divergence['input'])}"
        return text
    text += f" {_where(divergence.get('input'))}"
    if divergence.get("last_agreeing") is not None:
        text += f", last agreeing {show_value(divergence['last_agreeing'])}"
    if "got" in divergence:
        text += f"; {got_expected(divergence.get('got'), divergence.get('expected'), limit)}"
    return text


def verdict_of(summary: dict) -> str:
    """``passed``, ``failed`` (a check found a defect), ``no verdict`` (no check completed, or
    the run has no end record: nothing was found, so nothing is said to have failed), or
    ``incomplete`` for a run that passed the checks it made but left points not run.

    The summary's own ``verdict`` (:func:`oracle.engine.summarise`) decides; a summary of an
    older version without it is judged by its failures."""
    verdict = summary.get("verdict")
    if verdict not in ("passed", "failed", "no verdict"):
        verdict = ("failed" if summary.get("failures") else
                   "passed" if summary.get("passed") else "no verdict")
    if verdict == "passed" and not summary.get("complete", True):
        return "incomplete"
    return verdict


#: The CSS class (HTML) of each verdict of :func:`verdict_of`.
VERDICT_CLASSES = {"passed": "passed", "failed": "failed", "incomplete": "incomplete",
                   "no verdict": "no-verdict"}
