"""The summary of a judged table: verdicts, findings with their lines, one sentence each.

A row is ``confirmed`` (equal to the exact value, or a valid factorisation),
``consistent`` (only bounds and neighbours checked, none refutes it: evidence,
not proof), ``refuted`` (its own check failed) or ``conflicting`` (it and a
neighbour cannot both be right).  Each failed check is a finding whose kind
(:data:`FINDING_KINDS`) says what was wrong, named by the lines of its rows and
worded with the arguments as the table wrote them (``prime_pi(10**40)``).
"""

from __future__ import annotations

import time

from ._judging import DEFAULT_BUDGET_SECONDS, _Judged, judge_table
from ._reading import Row, _shown, read_table

__all__ = ["FINDING_KINDS", "audit_table"]

#: What each failed check means, as the kind of the finding.
FINDING_KINDS = {"exact": "wrong-value", "proven-interval": "outside-proven-interval",
                 "is-prime": "not-prime", "factorization": "wrong-factorization",
                 "monotone": "non-monotone", "short-interval": "wrong-difference"}


def audit_table(path, *, format: str | None = None,
                budget: float | None = DEFAULT_BUDGET_SECONDS, progress=None) -> dict:
    """Read and judge the table in ``path``; the summary as a JSON-ready dict.

    Keys: ``file``, ``format``, ``verdict`` (``passed``: no row refuted and none bad;
    ``failed``: a row refuted or two in conflict; ``incomplete``: none refuted but some
    could not be read or judged; ``no verdict``: the table has no rows), ``passed``,
    ``rows``, ``confirmed``, ``consistent``, ``refuted``, ``conflicting``, ``bad_rows``,
    ``checks``, ``passed_checks``, ``findings`` (``kind``, ``lines``,
    ``function``, ``arguments``, ``claimed``, ``expected``, ``provenance``, ``check``,
    ``detail``), ``bad`` (``line``, ``kind``, ``detail``), ``pairs_too_far_apart``,
    ``results`` (one per judged row: ``line``, ``function``, ``argument``, ``written`` (the
    argument as the table wrote it, when that differs), ``claimed``, ``verdict``, ``note``,
    ``checks``), ``budget_seconds`` and ``timings``.  ``progress`` as for :func:`judge_table`.
    """
    started = time.perf_counter()
    rows, bad, format = read_table(path, format=format)
    judged, not_judged, unchecked = judge_table(rows, budget=budget, progress=progress)
    bad = sorted(bad + not_judged, key=lambda entry: entry.line)
    findings = _findings(judged)
    verdicts = [entry.verdict for entry in judged]
    checks = _distinct_checks(judged)
    if "refuted" in verdicts or "conflicting" in verdicts:
        verdict = "failed"
    elif bad:
        verdict = "incomplete"
    elif not judged:
        verdict = "no verdict"
    else:
        verdict = "passed"
    return {
        "file": str(path), "format": format, "verdict": verdict, "passed": verdict == "passed",
        "rows": len(rows) + sum(1 for entry in bad if entry.kind != "not-judged"),
        "confirmed": verdicts.count("confirmed"), "consistent": verdicts.count("consistent"),
        "refuted": verdicts.count("refuted"), "conflicting": verdicts.count("conflicting"),
        "bad_rows": len(bad),
        "checks": len(checks), "passed_checks": sum(1 for check in checks if check.passed),
        "findings": findings,
        "bad": [{"line": entry.line, "kind": entry.kind, "detail": entry.detail} for entry in bad],
        "pairs_too_far_apart": unchecked,
        "results": [_result(entry) for entry in judged],
        "budget_seconds": budget,
        "timings": {"total_seconds": round(time.perf_counter() - started, 6)},
    }


def _distinct_checks(judged: list[_Judged]) -> list:
    seen, checks = set(), []
    for entry in judged:
        checks.extend(entry.checks)
        for check, _, _ in entry.pairs:
            if id(check) not in seen:
                seen.add(id(check))
                checks.append(check)
    return checks


def _findings(judged: list[_Judged]) -> list[dict]:
    findings, seen = [], set()
    for entry in judged:
        for check in entry.checks:
            if not check.passed:
                findings.append(_finding(check, (entry.row.line,), entry.row.function,
                                         _row_detail(check, entry.row)))
        for check, first, second in entry.pairs:
            if not check.passed and id(check) not in seen:
                seen.add(id(check))
                findings.append(_finding(check, tuple(sorted((first.line, second.line))),
                                         first.function, _pair_detail(check, first, second)))
    return sorted(findings, key=lambda finding: finding["lines"])


def _finding(check, lines: tuple[int, ...], function: str, detail: str) -> dict:
    return {"kind": FINDING_KINDS.get(check.check, check.check), "lines": list(lines),
            "function": function, "arguments": list(check.arguments),
            "claimed": _plain(check.claimed), "expected": _plain(check.expected),
            "provenance": check.provenance, "check": check.check, "detail": detail}


def _row_detail(check, row: Row) -> str:
    """One sentence: what the row claims and what the oracle knows instead."""
    call = row.call
    claimed = (" * ".join(f"{p}^{e}" if e > 1 else f"{p}" for p, e in check.claimed)
               if row.function == "factor" else _shown(check.claimed))
    text = f"{call} claimed {claimed}"
    if check.check == "exact":
        return f"{text}; the exact value is {_shown(check.expected)}"
    if check.check == "proven-interval":
        lower, upper = check.expected
        return (f"{text}: {check.detail}; proven: {'?' if lower is None else _shown(lower)} <= "
                f"{call} <= {'?' if upper is None else _shown(upper)}")
    return f"{text}: {check.detail}"


def _pair_detail(check, first: Row, second: Row) -> str:
    """One sentence on two neighbouring rows that cannot both be right."""
    if check.check == "monotone" and first.argument == second.argument:
        return f"two different values for {first.call}: {_shown(first.claimed)} and " \
               f"{_shown(second.claimed)}"
    if check.check == "monotone":
        return (f"{second.call} = {_shown(second.claimed)} is less than {first.call} = "
                f"{_shown(first.claimed)}, but {first.function} never decreases")
    what = "primes" if first.function == "prime_pi" else "twin pairs (counted by p + 2)"
    return (f"{second.call} - {first.call} = {_shown(check.claimed)}, but the interval between "
            f"them holds {_shown(check.expected)} {what}")


def _result(entry: _Judged) -> dict:
    row = entry.row
    return {"line": row.line, "function": row.function, "argument": row.argument,
            "written": row.written, "claimed": _plain(row.claimed), "verdict": entry.verdict,
            "note": row.note,
            "checks": [{"check": check.check, "passed": check.passed,
                        "expected": _plain(check.expected), "provenance": check.provenance}
                       for check in entry.checks + [pair for pair, _, _ in entry.pairs]]}


def _plain(value):
    """A value as JSON data: tuples become lists."""
    if isinstance(value, tuple):
        return [_plain(item) for item in value]
    return value
