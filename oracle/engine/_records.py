"""Results as JSON-lines records, written as they happen, and the summary rebuilt from them.

One record a line: ``start`` (target, role, profile, seed, settings), ``plan``
(how many points are about to be asked), ``check``
(one call judged: status, check, family, arguments, got, expected, provenance,
detail, seconds), ``skipped`` (how many points were not run, and why),
``divergence`` (the localised first failure) and ``end``.  Each line is flushed
when written, so an interrupted audit leaves every finished result on disk;
:func:`summarise` builds the same summary from the records of a finished run
and from those of an interrupted one (a torn last line is ignored).
"""

from __future__ import annotations

import json
import os
from pathlib import Path

__all__ = ["FAILURE_STATUSES", "RecordStream", "read_records", "summarise", "jsonable"]

#: Statuses of a check that count as findings against the candidate.
FAILURE_STATUSES = ("wrong", "wrong-type", "raised", "too-slow", "crashed", "nondeterministic")


def jsonable(value: object) -> object:
    """A JSON-able form of a value: tuples become lists, anything unusual its repr."""
    kind = type(value)
    if kind is int or kind is bool or kind is str:
        return value
    if value is None or isinstance(value, (bool, int, str)):
        return value
    if isinstance(value, float):
        return repr(value)
    if isinstance(value, (list, tuple)):
        return [jsonable(item) for item in value]
    if isinstance(value, dict):
        return {str(key): jsonable(item) for key, item in value.items()}
    return repr(value)


class RecordStream:
    """Appends records to a JSON-lines file (or only keeps them, with ``path=None``).

    ``on_record``, when given, is called with each record after it is written
    (a progress display, for instance).
    """

    def __init__(self, path: str | os.PathLike | None, on_record=None):
        self.records: list[dict] = []
        self._on_record = on_record
        self._file = None
        if path is not None:
            Path(path).parent.mkdir(parents=True, exist_ok=True)
            self._file = open(path, "w", encoding="utf-8")

    def write(self, record: dict) -> None:
        self.records.append(record)
        if self._file is not None:
            self._file.write(json.dumps(record) + "\n")
            self._file.flush()
        if self._on_record is not None:
            self._on_record(record)

    def close(self) -> None:
        if self._file is not None:
            self._file.close()
            self._file = None


def read_records(path: str | os.PathLike) -> list[dict]:
    """The records of a JSON-lines file; an incomplete last line (an interrupted write) is dropped."""
    records = []
    with open(path, encoding="utf-8") as handle:
        for line in handle:
            try:
                records.append(json.loads(line))
            except json.JSONDecodeError:
                break
    return records


def summarise(records: list[dict]) -> dict:
    """The audit summary (docs/DESIGN.md, ``audit --json``) computed from the records of a run."""
    start = next((r for r in records if r.get("type") == "start"), {})
    checks = [r for r in records if r.get("type") == "check"]
    failures = [r for r in checks if r["status"] in FAILURE_STATUSES]
    skipped = {}
    for record in records:
        if record.get("type") == "skipped":
            skipped[record["reason"]] = skipped.get(record["reason"], 0) + record["count"]
    divergence = next((r for r in records if r.get("type") == "divergence"), None)
    end = next((r for r in records if r.get("type") == "end"), None)
    first_failure = min((r["elapsed"] for r in failures), default=None)
    candidate_seconds = sum(r.get("seconds", 0.0) for r in checks)
    return {
        "target": start.get("target"), "role": start.get("role"), "profile": start.get("profile"),
        "seed": start.get("seed"), "passed": not failures,
        "complete": end is not None,
        "checks": len(checks),
        "passed_checks": sum(1 for r in checks if r["status"] == "pass"),
        "failures": [{key: r.get(key) for key in ("status", "check", "family", "arguments", "got",
                                                  "expected", "provenance", "detail")}
                     for r in failures],
        "first_divergence": None if divergence is None else {
            key: value for key, value in divergence.items() if key != "type"},
        "skipped": skipped,
        "timings": {"total_seconds": end["elapsed"] if end else
                    max((r.get("elapsed", 0.0) for r in records), default=0.0),
                    "candidate_seconds": round(candidate_seconds, 6),
                    "first_finding_seconds": first_failure},
    }
