"""The whole session, per role and target: the verdict, the reach, and the reports.

Every check item reports its role, its target and what its run found in its
``user_properties`` (which pytest-xdist carries from the workers to the
controller).  :class:`SessionTally`, registered on the controller (or the only
process), adds them up per role and target:

* the verdict: ``failed`` when an item failed, ``no verdict`` when no point was
  checked, else ``passed`` -- with the points that were not run counted beside
  it, never as passed;
* the reach: per case of the suites the largest input checked.

:class:`ReportWriter` (``--ntoracle-report DIR``) writes ``DIR/summary.json`` and
``DIR/report.html``: the same self-contained page as ``ntoracle audit --report``
(:func:`oracle.report.write_html`), one section per role and target, its
summary computed by the engine's :func:`oracle.engine.summarise` from the
records that the items wrote to ``DIR/records/`` -- the files are how records travel
from pytest-xdist workers, and they are within reach of the candidate (same user), so
each item reports a digest of what it wrote and a file that no longer matches is left
out, with a ``tampered`` finding in its place.
"""

from __future__ import annotations

import os
import re
from dataclasses import dataclass, field

__all__ = ["RoleTally", "SessionTally", "ReportWriter", "register_tally", "stream_path",
           "item_properties"]

#: Characters kept in file names made from node ids.
_UNSAFE = re.compile(r"[^A-Za-z0-9_.\-]+")


def stream_path(directory: str, nodeid: str) -> str:
    """Where the item ``nodeid`` writes its records under ``--ntoracle-report directory``."""
    import hashlib          # here, not at the top: this module is imported in every session

    digest = hashlib.sha1(nodeid.encode()).hexdigest()[:10]
    name = _UNSAFE.sub("_", nodeid.replace("::", "--"))[-160:]
    return os.path.join(directory, "records", f"{name}-{digest}.jsonl")


def item_properties(summary: dict, case: str) -> list[tuple[str, object]]:
    """What an item's run adds to its report: checks, findings, points not run, and the reach
    (the largest input checked) under the name of the item's case: the engine files points
    it was handed (``only=``) under one family, ``regression``, so the case names them."""
    largest = [entry["largest"] for entry in (summary.get("reach") or {}).values()
               if entry.get("largest") is not None]
    reach = {case: max(largest)} if largest else {}
    return [("ntoracle_checks", summary["checks"]), ("ntoracle_findings", len(summary["failures"])),
            ("ntoracle_skipped", dict(summary.get("skipped") or {})), ("ntoracle_reach", reach)]


@dataclass
class RoleTally:
    """The items of one role against one target, added up."""

    role: str
    target: str
    outcomes: dict = field(default_factory=dict)          # passed / failed / skipped -> items
    checks: int = 0
    findings: int = 0
    skipped: dict = field(default_factory=dict)           # reason -> points
    reach: dict = field(default_factory=dict)             # case -> largest input checked
    nodeids: list = field(default_factory=list)
    cases: dict = field(default_factory=dict)             # nodeid -> case
    digests: dict = field(default_factory=dict)           # nodeid -> digest of the records written

    @property
    def verdict(self) -> str:
        if self.outcomes.get("failed"):
            return "failed"
        return "passed" if self.checks else "no verdict"

    def add(self, nodeid: str, outcome: str, properties: dict) -> None:
        if nodeid not in self.nodeids:
            self.nodeids.append(nodeid)
            self.cases[nodeid] = properties.get("ntoracle_case")
            self.digests[nodeid] = properties.get("ntoracle_records_sha256")
        self.outcomes[outcome] = self.outcomes.get(outcome, 0) + 1
        self.checks += properties.get("ntoracle_checks", 0)
        self.findings += properties.get("ntoracle_findings", 0)
        for reason, count in (properties.get("ntoracle_skipped") or {}).items():
            self.skipped[reason] = self.skipped.get(reason, 0) + count
        for family, largest in (properties.get("ntoracle_reach") or {}).items():
            self.reach[family] = max(largest, self.reach.get(family, largest))

    def lines(self) -> list[str]:
        """The session summary's lines for this role and target."""
        from ..report._terminal import readable_size

        items = sum(self.outcomes.values())
        counted = ", ".join(f"{count} {outcome}" for outcome, count in sorted(self.outcomes.items()))
        lines = [f"{self.role} ({self.target}): {self.verdict} -- {items} item(s) ({counted}), "
                 f"{self.checks} checks, {self.findings} finding(s)"]
        if self.reach:
            family, largest = max(self.reach.items(), key=lambda entry: entry[1])
            lines.append(f"    reach: checked up to {readable_size(largest)} ({family}); "
                         f"{len(self.reach)} case(s) with checked inputs")
        for reason, count in sorted(self.skipped.items()):
            lines.append(f"    not run: {count} point(s), {reason} (not counted as passed)")
        return lines

    def as_json(self) -> dict:
        return {"role": self.role, "target": self.target, "verdict": self.verdict,
                "items": dict(self.outcomes), "checks": self.checks, "findings": self.findings,
                "skipped": dict(self.skipped),
                "reach": {family: str(largest) if largest.bit_length() > 53 else largest
                          for family, largest in self.reach.items()}}


class SessionTally:
    """Registered when targets are configured (on the pytest-xdist controller, or the only
    process): the outcome of every check item, per role and target."""

    def __init__(self):
        self.roles: dict[tuple[str, str], RoleTally] = {}
        self.outcomes: dict[str, str] = {}

    def pytest_runtest_logreport(self, report):
        properties = dict(report.user_properties)
        if "ntoracle_role" not in properties:
            return
        if report.when != "call" and report.outcome == "passed":
            return
        outcome = report.outcome
        self.outcomes[report.nodeid] = outcome
        key = (properties["ntoracle_role"], properties["ntoracle_target"])
        tally = self.roles.setdefault(key, RoleTally(*key))
        tally.add(report.nodeid, outcome, properties)


def register_tally(config) -> None:
    """Register the :class:`SessionTally` (and, with ``--ntoracle-report``, the
    :class:`ReportWriter`) once, on the only process or the pytest-xdist controller: at
    configuration when targets are configured, else when the first suite file is collected
    (a session without either does not pay for this module)."""
    import shlex

    from ._settings import SETTINGS, TALLY

    if hasattr(config, "workerinput") or config.stash.get(TALLY, None) is not None:
        return
    tally = SessionTally()
    config.stash[TALLY] = tally
    config.pluginmanager.register(tally, "ntoracle-tally")
    settings = config.stash[SETTINGS]
    if settings.report_dir:
        command = shlex.join(["pytest", *config.invocation_params.args])
        config.pluginmanager.register(ReportWriter(settings, tally, command), "ntoracle-report")


class ReportWriter:
    """Registered with ``--ntoracle-report DIR``: at the end of the session writes
    ``DIR/summary.json`` (seed, profile, targets, the outcome of every item, the verdict of
    every role) and ``DIR/report.html`` (one section per role and target)."""

    def __init__(self, settings, tally: SessionTally, command: str):
        self.settings, self.tally, self.command = settings, tally, command

    def pytest_sessionfinish(self, session):
        import json

        directory = self.settings.report_dir
        os.makedirs(directory, exist_ok=True)
        data = {"seed": self.settings.seed, "profile": self.settings.profile,
                "targets": [{"role": t.role, "kind": t.kind, "spec": t.spec, "written": t.written()}
                            for t in self.settings.targets],
                "items": self.tally.outcomes,
                "roles": [tally.as_json() for tally in self.tally.roles.values()]}
        with open(os.path.join(directory, "summary.json"), "w", encoding="utf-8") as handle:
            json.dump(data, handle, indent=1)
        runs = [run for run in (self._run(tally) for tally in self.tally.roles.values()) if run]
        if runs:
            from ..report import write_html

            write_html(runs, os.path.join(directory, "report.html"), command=self.command,
                       title="ntoracle report of the pytest session")

    def _run(self, tally: RoleTally):
        """``(summary, records)`` of one role and target: the records of its items in one run
        (the first start record, every other record, one end record timing them all); the
        checks are filed under their case, which the HTML report's reach table then lists."""
        from .._bounded import bounded_text
        from ..engine import read_records, summarise
        from ..engine._records import Records, records_digest

        records, start, elapsed, ended, changed = Records(), None, 0.0, True, []
        for nodeid in tally.nodeids:
            path = stream_path(self.settings.report_dir, nodeid)
            if not os.path.exists(path):
                continue
            run = read_records(path)
            if run.garbled or records_digest(run) != tally.digests.get(nodeid):
                changed.append(nodeid)      # not what the item wrote: the candidate can reach it
                continue
            records.garbled += run.garbled
            end = None
            for record in run:
                kind = record.get("type")
                if kind == "start":
                    if start is None:
                        start = record
                        records.append(record)
                elif kind == "end":
                    end = record
                else:
                    if kind == "check" and record.get("family") == "regression" and tally.cases.get(nodeid):
                        record["family"] = tally.cases[nodeid]
                    records.append(record)
            if end is None:
                ended = False
            else:
                elapsed += float(end.get("elapsed") or 0.0)
        if start is None and not changed:
            return None
        if start is None:
            start = {"type": "start", "role": tally.role, "target": tally.target,
                     "seed": self.settings.seed, "profile": self.settings.profile}
            records.append(start)
        for nodeid in changed:
            records.append({"type": "check", "status": "tampered", "check": "harness",
                            "family": "harness", "arguments": [], "got": None, "expected": None,
                            "provenance": "", "seconds": 0.0, "detail": bounded_text(
                                f"the records file of {nodeid} was changed after the item wrote "
                                "it; its records are left out of this report")})
        if ended:
            records.append({"type": "end", "elapsed": elapsed})
        return summarise(records), list(records)
