"""Results as JSON-lines records, written as they happen, and the summary rebuilt from them.

One record a line: ``start`` (target, kind, role, profile, seed, settings),
``plan`` (how many points are about to be asked), ``check`` (one call judged:
status, check, family, arguments, got, expected, provenance, detail, seconds),
``skipped`` (how many points were not run, and why), ``divergence`` (the
localised first failure), ``interrupted`` (the run was stopped by an exception:
what it was) and ``end``.  Each line is flushed when written, so an interrupted
audit leaves every finished result on disk.

Each audit writes its own file (:func:`new_run_path`: ``.ntoracle/runs/<UTC
time>-<pid>.jsonl``), so two audits in one folder never interleave; the
pointer ``.ntoracle/last-audit.jsonl`` is a symbolic link to the newest run,
replaced atomically (``os.replace`` of a fresh link) when the run ends; where
links are not allowed it is a copy written when the run ends
(:func:`point_to_latest`).

:func:`read_records` skips a torn or garbled line anywhere in the file and
counts it (``garbled_lines`` of the summary); it never stops early.
:func:`summarise` builds the summary of a finished or interrupted run.  Its
``verdict`` is ``failed`` when any check failed, ``no verdict`` when the
stream has no ``end`` record or no check was completed, else ``passed``;
``passed`` is true only for the verdict ``passed``.  ``complete`` is false
whenever points were not run for the time budget, the early stop, crashes,
hangs, an interruption or a missing ``end`` (skips above the declared
domain, out of the oracle's reach and beyond the candidate's speed are
reported, but do not make a run incomplete); ``not_run`` counts the points
that made it so.  ``too_slow`` counts the calls too slow (failures only when
the start record says ``slow_fails``); ``reach`` gives, per family, the
largest input checked and why it went no higher (:func:`reach`).  A ``reach``
record names a family and the reason it stopped.
"""

from __future__ import annotations

import datetime
import json
import os
import shutil
from pathlib import Path

from .._bounded import bounded_value

__all__ = ["FAILURE_STATUSES", "failure_statuses", "RecordStream", "Records", "read_records",
           "records_digest",
           "summarise", "jsonable",
           "new_run_path", "point_to_latest", "VERDICTS", "SKIPS_KEEPING_COMPLETE"]

#: The verdicts of a summary.
VERDICTS = ("passed", "failed", "no verdict")

#: Reasons for skipped points that leave a run complete: the user's declared domain and the
#: oracle's own reach (both reported), and the rest of the invalid inputs after a hang there
#: (a finding already).
SKIPS_KEEPING_COMPLETE = ("above the declared domain (--max)", "out of the oracle's reach",
                           "outside the domain, after a hang there",
                           "beyond the candidate's speed (too slow)")

#: Statuses of a check that count as findings against the candidate.  A call ``too-slow``
#: (:mod:`oracle.engine._timeouts`) is the limit of the candidate's reach, not a finding,
#: unless the run was asked to fail on it (``slow_fails``).
FAILURE_STATUSES = ("wrong", "wrong-type", "raised", "hung", "crashed", "bad-output",
                    "nondeterministic", "tampered")

#: Families of checks that are not inputs of their own (their sizes say nothing of reach).
_NOT_REACH = ("identity", "reask", "bisection", "invalid-input")


def failure_statuses(slow_fails: bool) -> tuple[str, ...]:
    """The statuses counted as failures; ``too-slow`` among them only with ``slow_fails``."""
    return FAILURE_STATUSES + ("too-slow",) if slow_fails else FAILURE_STATUSES


def jsonable(value: object) -> object:
    """A bounded JSON-able form of a value (:func:`oracle._bounded.bounded_value`): tuples become
    lists, floats and unusual objects bounded text, long strings, lists and mappings are cut
    and say so, an integer of more than 4200 digits is described by its number of digits."""
    kind = type(value)
    if kind is bool or value is None or (kind is int and value.bit_length() <= 4096):
        return value
    return bounded_value(value)


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


def records_digest(records) -> str:
    """A SHA-256 digest of ``records`` in their JSON form (the same for the records as written,
    kept in memory, and as read back from their file): what a front end keeps of a run it
    wrote, to tell later whether the file still holds it.  A results file lies within reach of
    the candidate, which runs as the same user."""
    import hashlib

    digest = hashlib.sha256()
    for record in records:
        canonical = json.dumps(json.loads(json.dumps(record)), sort_keys=True)
        digest.update(canonical.encode() + b"\n")
    return digest.hexdigest()


class Records(list):
    """The records of a results file; ``garbled`` counts the lines that were not a record."""

    garbled = 0


def read_records(path: str | os.PathLike) -> Records:
    """The records of a JSON-lines file; a torn or garbled line anywhere is skipped and counted
    (in ``.garbled``), the lines after it are still read."""
    records = Records()
    with open(path, "rb") as handle:
        for line in handle:
            if not line.strip():
                continue
            try:
                record = json.loads(line.decode("utf-8"))
            except (UnicodeDecodeError, json.JSONDecodeError):
                record = None
            if isinstance(record, dict) and isinstance(record.get("type"), str) \
                    and _well_formed(record):
                records.append(record)
            else:
                records.garbled += 1
    return records


def _well_formed(record: dict) -> bool:
    """Whether a record has the fields :func:`summarise` relies on."""
    if record["type"] == "check":
        return isinstance(record.get("status"), str) and isinstance(record.get("arguments"), list)
    if record["type"] == "skipped":
        return isinstance(record.get("reason"), str) and type(record.get("count")) is int
    return True


def new_run_path(folder: str | os.PathLike = ".ntoracle") -> str:
    """A fresh results file for one run: ``folder/runs/<UTC time>-<pid>.jsonl``."""
    now = datetime.datetime.now(datetime.timezone.utc).strftime("%Y%m%dT%H%M%S.%fZ")
    return os.path.join(os.fspath(folder), "runs", f"{now}-{os.getpid()}.jsonl")


def point_to_latest(run_path: str | os.PathLike, pointer: str | os.PathLike, *,
                    copy: bool = False) -> None:
    """Make ``pointer`` the newest run: a symbolic link to ``run_path`` replaced atomically, or,
    with ``copy`` (or where links are refused), an atomic copy of the file as it is now."""
    pointer = Path(pointer)
    pointer.parent.mkdir(parents=True, exist_ok=True)
    temporary = pointer.with_name(f".{pointer.name}.{os.getpid()}.tmp")
    if not copy:
        try:
            target = os.path.relpath(os.path.abspath(run_path), os.path.abspath(pointer.parent))
            if temporary.is_symlink() or temporary.exists():
                temporary.unlink()
            os.symlink(target, temporary)
            os.replace(temporary, pointer)
            return
        except OSError:
            pass
    shutil.copyfile(run_path, temporary)
    os.replace(temporary, pointer)


def summarise(records: list[dict]) -> dict:
    """The audit summary (README, ``audit --json``) computed from the records of a run."""
    start = next((r for r in records if r.get("type") == "start"), {})
    checks = [r for r in records if r.get("type") == "check"]
    failures = [r for r in checks if r["status"] in failure_statuses(bool(start.get("slow_fails")))]
    skipped = {}
    for record in records:
        if record.get("type") == "skipped":
            skipped[record["reason"]] = skipped.get(record["reason"], 0) + record["count"]
    divergence = next((r for r in records if r.get("type") == "divergence"), None)
    end = next((r for r in records if r.get("type") == "end"), None)
    interrupted = next((r for r in records if r.get("type") == "interrupted"), None)
    first_failure = min((r["elapsed"] for r in failures if "elapsed" in r), default=None)
    candidate_seconds = sum(r.get("seconds", 0.0) for r in checks
                            if isinstance(r.get("seconds", 0.0), (int, float)))
    passed_checks = sum(1 for r in checks if r["status"] == "pass")
    not_run = sum(count for reason, count in skipped.items()
                  if reason not in SKIPS_KEEPING_COMPLETE)
    if failures:
        verdict = "failed"
    elif end is None or interrupted is not None or not checks:
        verdict = "no verdict"
    else:
        verdict = "passed"
    return {
        "target": start.get("target"), "role": start.get("role"), "profile": start.get("profile"),
        "seed": start.get("seed"), "passed": verdict == "passed",
        "complete": end is not None and interrupted is None and not_run == 0,
        "checks": len(checks),
        "passed_checks": passed_checks,
        "failures": [{key: r.get(key) for key in ("status", "check", "family", "arguments", "got",
                                                  "expected", "provenance", "detail")}
                     for r in failures],
        "first_divergence": None if divergence is None else {
            key: value for key, value in divergence.items() if key != "type"},
        "skipped": skipped,
        "timings": {"total_seconds": end["elapsed"] if end else
                    max((r.get("elapsed", 0.0) for r in records
                         if isinstance(r.get("elapsed", 0.0), (int, float))), default=0.0),
                    "candidate_seconds": round(candidate_seconds, 6),
                    "first_finding_seconds": first_failure},
        "verdict": verdict,
        "not_run": not_run,
        "ended": end is not None,
        "interrupted": None if interrupted is None else interrupted.get("reason"),
        "garbled_lines": getattr(records, "garbled", 0),
        "too_slow": sum(1 for r in checks if r["status"] == "too-slow"),
        "reach": reach(records),
    }


def reach(records: list[dict]) -> dict:
    """Per family of inputs, the largest input checked and why the family went no higher.

    ``{family: {"largest": m, "stopped": reason}}``: ``m`` is the largest magnitude (largest
    argument) answered and judged, ``null`` when none was; the reason comes from the
    family's ``reach`` record -- the profile's ceiling, a skip reason, or a reason of the
    climb (:mod:`oracle.engine._reach`) -- and is "candidate speed" when a call of the
    family was too slow.
    """
    found: dict[str, dict] = {}
    for record in records:
        if record.get("type") == "reach" and isinstance(record.get("family"), str):
            found.setdefault(record["family"], {"largest": None, "stopped": None})
            found[record["family"]]["stopped"] = record.get("stopped")
    for record in records:
        if record.get("type") != "check" or record.get("family") in _NOT_REACH:
            continue
        entry = found.setdefault(record["family"], {"largest": None, "stopped": None})
        if record["status"] == "too-slow":
            entry["stopped"] = "candidate speed"
        elif record["status"] not in ("hung", "crashed") and record["arguments"] \
                and all(type(a) is int for a in record["arguments"]):
            size = max(record["arguments"])
            entry["largest"] = size if entry["largest"] is None else max(entry["largest"], size)
    return found
