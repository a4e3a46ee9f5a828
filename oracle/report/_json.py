"""The JSON report: the summary of each audit, with stable keys (docs/DESIGN.md, ``audit --json``).

One audit is written as one JSON object; several as a JSON list of such
objects, in the order given.  The keys of an audit, always in this order:

``target``
    the audited target: ``package.module:function``, or the command of an executable.
``role``
    what the target computes: ``prime_pi``, ``twin_pi``, ``nth_prime``, ``is_prime``,
    ``next_prime``, ``prev_prime``, ``primes_in`` or ``factor``.
``profile``
    ``quick``, ``ci``, ``deep`` or ``exhaustive``.
``seed``
    the seed of the sampled points; the same seed repeats the same run.
``passed``
    ``true`` only when the verdict is ``passed``: no check found a defect, at least one
    check was completed and the run reached its end.
``complete``
    ``false`` when points were not run for the time budget, the early stop, crashes or
    timeouts, or the run was interrupted or has no end record (results then partial).
``checks``
    the number of checks made.
``passed_checks``
    how many of them passed.
``failures``
    a list, one object per failed check: ``status`` (``wrong``, ``wrong-type``,
    ``raised``, ``hung``, ``crashed``, ``bad-output``, ``nondeterministic``, ``tampered``, or
    ``too-slow`` when the run was asked to fail on it with ``--slow-fails``), ``check`` (the
    comparison: ``exact``, ``proven-interval``, ``monotone``, ``listing``,
    ``factorization``, ...), ``family`` (where the input came from: ``tables``,
    ``boundaries``, ``pseudoprimes``, ``identity``, ...), ``arguments`` (a list of
    integers), ``got`` (the candidate's answer), ``expected`` (the oracle's value, a
    ``[lower, upper]`` proven interval, or a description), ``provenance`` (how the
    oracle knows: ``table:<source id>``, ``sieve``, ``combinatorial``,
    ``deterministic``, ``probable``, ``bounds:<theorem ids>``, ``definition``, ...)
    and ``detail`` (one sentence).
``first_divergence``
    ``null``, or an object whose ``kind`` says what it is: ``first divergence``
    (counting roles, found by bisection: ``input``, ``last_agreeing``,
    ``bisection_steps``, ``got``, ``expected``, ``provenance``, ``detail``),
    ``first missing prime`` / ``first extra prime`` (``primes_in``: ``prime``,
    ``input``, ``provenance``, ``detail``) or ``smallest failing input`` (``input``,
    ``status`` and, where known, ``family``, ``got``, ``expected``, ``provenance``,
    ``detail``).
``skipped``
    an object mapping each reason why points were not run (above the declared
    domain, time budget spent, out of the oracle's reach, ...) to how many; skipped
    points are never counted as passed.
``timings``
    ``total_seconds`` (the whole run), ``candidate_seconds`` (time spent inside the
    candidate) and ``first_finding_seconds`` (when the first defect was found, or
    ``null``).
``verdict``
    ``passed``, ``failed`` (a check found a defect) or ``no verdict`` (no check
    completed, or no end record: interrupted or torn); the CLI exits 0, 1 or 5.
``not_run``
    how many points were not run for reasons that make the run incomplete.
``ended``
    whether the results have their ``end`` record.
``interrupted``
    ``null``, or the name of what interrupted the run (``KeyboardInterrupt``, ...).
``garbled_lines``
    torn or garbled lines of the results file that were skipped.
``too_slow``
    how many calls were too slow: no answer within the timeout (nor a 4 times longer
    retry) at the top of the candidate's reach, after calls at smaller sizes grew
    slower.  Not failures unless ``--slow-fails``; a hang is status ``hung``, a failure.
``reach``
    an object mapping each family of inputs (``tables``, ``boundaries``, ...,
    ``climb-tables``, ``climb-random``) to ``{"largest": N, "stopped": reason}``: the
    largest input checked (``null`` when none was answered) and why the family went no
    higher (the profile's ceiling, a skip reason, or for the climb ``candidate speed``,
    ``oracle budget``, ``declared domain (--max)``, ``time budget``, ``after failures``,
    ``end of the oracle's tables``).
``corpus_added``
    present only when a regression corpus was used: how many failures were added to it.

Integers are JSON integers of any size (never floats), so large inputs and
answers survive a round trip exactly.  The file is laid out one key a line and
one failure a line (answers such as long prime lists stay on their line).  Keys may be added in later versions,
after these; readers should ignore keys they do not know.
"""

from __future__ import annotations

import json
import os
from pathlib import Path

from .._errors import InvalidInputError

__all__ = ["SUMMARY_KEYS", "OPTIONAL_KEYS", "ordered_summary", "write_json"]

#: The keys of every audit summary, in the order they are written.
SUMMARY_KEYS = ("target", "role", "profile", "seed", "passed", "complete", "checks",
                "passed_checks", "failures", "first_divergence", "skipped", "timings")

#: Keys written after those when a summary has them.
OPTIONAL_KEYS = ("verdict", "not_run", "ended", "interrupted", "garbled_lines", "too_slow", "reach",
                 "corpus_added")


def ordered_summary(summary: dict) -> dict:
    """The summary with its documented keys first, in order; a missing key is an error."""
    if not isinstance(summary, dict):
        raise InvalidInputError(f"summary={type(summary).__name__}: expected the dict of an audit summary")
    missing = [key for key in SUMMARY_KEYS if key not in summary]
    if missing:
        raise InvalidInputError(f"summary: not an audit summary, missing {', '.join(missing)}")
    ordered = {key: summary[key] for key in SUMMARY_KEYS}
    ordered.update({key: summary[key] for key in OPTIONAL_KEYS if key in summary})
    ordered.update({key: value for key, value in summary.items() if key not in ordered})
    return ordered


def write_json(summaries: dict | list[dict], path: str | os.PathLike) -> None:
    """Write one summary (a dict) as a JSON object, or several (a list) as a JSON list."""
    if isinstance(summaries, dict):
        text = _summary_text(ordered_summary(summaries), "")
    elif isinstance(summaries, (list, tuple)):
        items = [_summary_text(ordered_summary(summary), "  ") for summary in summaries]
        text = "[\n" + ",\n".join("  " + item for item in items) + "\n]" if items else "[]"
    else:
        raise InvalidInputError(f"summaries={type(summaries).__name__}: expected a summary or a list of them")
    path = Path(path)
    path.parent.mkdir(parents=True, exist_ok=True)
    path.write_text(text + "\n", encoding="utf-8")


def _summary_text(summary: dict, margin: str) -> str:
    """One summary as a JSON object: a key a line, and in ``failures`` a failure a line."""
    lines = []
    for key, value in summary.items():
        if key == "failures" and value:
            failures = ",\n".join(f"{margin}    {json.dumps(failure)}" for failure in value)
            text = f"[\n{failures}\n{margin}  ]"
        else:
            text = json.dumps(value)
        lines.append(f"{margin}  {json.dumps(key)}: {text}")
    return "{\n" + ",\n".join(lines) + f"\n{margin}}}"
