"""``ntoracle demo``: audit the Brindlewick library with the ``ci`` profile and report.

Every role of :data:`~oracle.demo.SCENARIO` is audited in turn, exactly as
``ntoracle audit`` would do it; the findings and first divergences are printed,
the JSON and HTML reports and the JSON-lines results are written to the report
folder, and the outcome is compared with what the scenario documents.  The
exit code is 0 when the audit found exactly the documented defects (each
defective role failed, each sound role passed), 1 otherwise.
"""

from __future__ import annotations

import sys
import time
from pathlib import Path
from typing import TextIO

from ._scenario import SCENARIO

__all__ = ["run_demo", "DEMO_SEED"]

#: The seed of the demo's audits; ``ntoracle demo --seed N`` changes it.
DEMO_SEED = 1987


def run_demo(report_dir: str | Path = "ntoracle-report", *, seed: int = DEMO_SEED,
             quiet: bool = False, stream: TextIO | None = None) -> int:
    """Audit every scenario role, write the reports, and return the exit code."""
    from .. import engine, report, sampling, targets

    out = stream if stream is not None else sys.stdout
    folder = Path(report_dir)
    folder.mkdir(parents=True, exist_ok=True)
    profile = sampling.profile("ci")
    if not quiet:
        print(f"ntoracle demo: {SCENARIO.organisation}", file=out)
        print(_wrap(SCENARIO.history) + "\n", file=out)
    print(f"Auditing {len(SCENARIO.roles())} routines of '{SCENARIO.library}' with the ci profile, "
          f"seed {seed} (repeat with: ntoracle demo --seed {seed}).\n", file=out, flush=True)
    runs = []
    started = time.perf_counter()
    for role in SCENARIO.roles():
        entry = SCENARIO.entry(role)
        results = folder / f"{role}.jsonl"
        target = targets.python_target(entry.target, role_name=role, timeout=profile.timeout)
        options = engine.AuditOptions(role=role, profile=profile.name, seed=seed,
                                      timeout=profile.timeout, maximum=entry.maximum,
                                      stream=str(results))
        try:
            with report.Progress(description=f"{role} checks", quiet=quiet) as progress:
                options.on_record = progress.observe
                summary = engine.run_audit(target, options)
        finally:
            target.close()
        runs.append((summary, engine.read_records(results)))
        if not quiet:
            _print_role(out, role, entry, summary)
    summaries = [summary for summary, _ in runs]
    report.summary_table(summaries, out)
    report.write_json(summaries, folder / "audit.json")
    report.write_html(runs, folder / "report.html", command=f"ntoracle demo --seed {seed}",
                      title=f"ntoracle demo: {SCENARIO.library}")
    print(f"\nreports: {folder / 'report.html'}, {folder / 'audit.json'} "
          f"(results as JSON lines: {folder}/<role>.jsonl); {time.perf_counter() - started:.1f} s",
          file=out)
    problems = SCENARIO.discrepancies({s["role"]: s["passed"] for s in summaries},
                                      {s["role"]: first_wrong_input(s) for s in summaries})
    if problems:
        print("\nThe audit did NOT match the scenario:", file=out)
        for problem in problems:
            print(f"  - {problem}", file=out)
        return 1
    defects = sum(1 for s in summaries if not s["passed"])
    print(f"\nThe audit found exactly the {defects} documented defects and passed the "
          f"{len(summaries) - defects} sound routines.", file=out)
    return 0


def first_wrong_input(summary: dict) -> int | None:
    """The first wrong input the audit localised: the first divergence's input (its first
    argument), or for primes_in the first prime missing or extra."""
    divergence = summary.get("first_divergence") or {}
    if "prime" in divergence:
        return divergence["prime"]
    where = divergence.get("input")
    return where[0] if where else None


def _print_role(out: TextIO, role: str, entry, summary: dict) -> None:
    from ..report import describe_divergence

    verdict = {"passed": "PASSED", "failed": "FAILED"}.get(summary.get("verdict"), "NO VERDICT")
    print(f"{role:<11} {verdict}  {summary['passed_checks']}/{summary['checks']} checks, "
          f"{len(summary['failures'])} finding(s), {summary['timings']['total_seconds']:.1f} s",
          file=out)
    if summary["first_divergence"]:
        print(f"            first divergence: {describe_divergence(summary['first_divergence'])}",
              file=out)
    documented = getattr(entry, "title", None)
    if documented:
        print(f"            documented defect: {documented}", file=out)
    print(file=out, flush=True)


def _wrap(text: str, width: int = 96) -> str:
    import textwrap

    return textwrap.fill(text, width)
