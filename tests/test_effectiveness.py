"""Effectiveness: the ``ci`` profile catches every defective zoo member and clears every correct one.

The zoo (``tests/zoo/``, described by ``tests/zoo/catalogue.yaml``) holds
implementations with the bugs real code has, and correct ones built on
sympy, gmpy2, primesieve and python-flint.  Each member is audited as a user
would: Python members in an isolated child process (a zoo member may crash or
exhaust memory on purpose), executable members over the line protocol.

The default run audits every correct member and the first defective member of
each role; the whole zoo runs with the slow ones included::

    python -m pytest -n 2 -m "slow or not slow" tests/test_effectiveness.py

Each member's outcome goes to ``<pytest base temp>/effectiveness/member-<id>.json``
and the run's tally -- caught, cleared, median time to the first finding --
to ``summary.json`` there, printed at the end (without xdist) or by
``python tests/test_effectiveness.py <that directory>``.
"""

import json
import shlex
import statistics
import sys
import time
from pathlib import Path

import pytest
import yaml

from oracle import engine, targets

CATALOGUE = Path(__file__).parent / "zoo" / "catalogue.yaml"
ROOT = Path(__file__).parent.parent
ZOO_TIMEOUT = 10.0


def _members():
    if not CATALOGUE.exists():
        return []
    data = yaml.safe_load(CATALOGUE.read_text())
    members = data.get("members", data) if isinstance(data, dict) else data
    if isinstance(members, dict):
        members = [{"name": name, **entry} for name, entry in members.items()]
    return members


MEMBERS = _members()


def _default_run(members):
    """Members audited in the default run: every correct one (a false alarm anywhere matters)
    and the first defective one of each role; the rest of the zoo is marked slow."""
    chosen, roles_seen = set(), set()
    for member in members:
        if not member.get("defective"):
            chosen.add(_id(member))
        elif member["role"] not in roles_seen:
            roles_seen.add(member["role"])
            chosen.add(_id(member))
    return chosen


def _parameters(members):
    default = _default_run(members)
    return [pytest.param(member, id=_id(member),
                         marks=() if _id(member) in default else pytest.mark.slow)
            for member in members]


def _id(member):
    return member.get("id") or member.get("name") or member.get("target") or member.get("exec")


def _command(command: str) -> str:
    """The member's command with a leading ``python`` replaced by this interpreter (CI runs
    ``.venv/bin/python -m pytest`` without activating the venv), and its paths, relative to the
    repository root, made absolute (pytest may be started elsewhere)."""
    argv = shlex.split(command)
    if argv and argv[0] == "python":
        argv[0] = sys.executable
    argv = [str(ROOT / word) if not Path(word).is_absolute() and (ROOT / word).is_file() else word
            for word in argv]
    return shlex.join(argv)


def _ledger_directory(tmp_path_factory) -> Path:
    """One directory per pytest run, shared by the xdist workers (their base temps are siblings)."""
    base = tmp_path_factory.getbasetemp()
    root = base.parent if base.name.startswith("popen-gw") else base
    directory = root / "effectiveness"
    directory.mkdir(exist_ok=True)
    return directory


def summarise_ledger(directory: Path) -> dict:
    """Caught / cleared counts and the median time to the first finding over the defective members."""
    rows = [json.loads(path.read_text()) for path in sorted(directory.glob("member-*.json"))]
    defective = [row for row in rows if row["defective"]]
    firsts = [row["first_finding_seconds"] for row in defective if row["first_finding_seconds"] is not None]
    return {
        "members": len(rows), "defective": len(defective),
        "caught": sum(1 for row in defective if row["caught"]),
        "correct": len(rows) - len(defective),
        "cleared": sum(1 for row in rows if not row["defective"] and row["cleared"]),
        "median_first_finding_seconds": statistics.median(firsts) if firsts else None,
        "slowest_member_seconds": max((row["total_seconds"] for row in rows), default=None),
        "rows": rows,
    }


def summary_line(summary: dict) -> str:
    median = summary["median_first_finding_seconds"]
    return (f"ntoracle ci effectiveness: caught {summary['caught']}/{summary['defective']} defective, "
            f"cleared {summary['cleared']}/{summary['correct']} correct; median time to the first "
            f"finding {'n/a' if median is None else f'{median:.3f} s'}; slowest member "
            f"{summary['slowest_member_seconds']:.1f} s")


@pytest.fixture(scope="module")
def ledger(tmp_path_factory, request):
    directory = _ledger_directory(tmp_path_factory)
    yield directory
    summary = summarise_ledger(directory)
    (directory / "summary.json").write_text(json.dumps(summary, indent=1))
    reporter = request.config.pluginmanager.get_plugin("terminalreporter")
    if reporter is not None and summary["members"]:
        reporter.write_line("")
        reporter.write_line(summary_line(summary) + f"  [{directory / 'summary.json'}]")


@pytest.mark.skipif(not MEMBERS, reason="tests/zoo/catalogue.yaml not present yet")
@pytest.mark.parametrize("member", _parameters(MEMBERS))
def test_ci_profile_judges_zoo_member(member, tmp_path, ledger):
    role = member["role"]
    if member.get("exec"):
        target = targets.exec_target(_command(member["exec"]), role_name=role, timeout=ZOO_TIMEOUT)
    else:
        target = targets.python_target(member["target"], role_name=role, timeout=ZOO_TIMEOUT,
                                       isolate=True, python_path=[str(Path(__file__).parent)] + sys.path)
    conventions = engine.AuditOptions(role=role).conventions
    if member.get("conventions"):
        from oracle.roles import Conventions
        conventions = Conventions(**member["conventions"])
    started = time.perf_counter()
    try:
        summary = engine.run_audit(target, engine.AuditOptions(
            role=role, profile="ci", seed=int(member.get("seed", 20240601)), conventions=conventions,
            maximum=member.get("max"), stream=str(tmp_path / "results.jsonl")))
    finally:
        target.close()
    elapsed = time.perf_counter() - started
    defective = bool(member.get("defective"))
    (ledger / f"member-{_id(member)}.json").write_text(json.dumps({
        "id": _id(member), "role": role, "defective": defective,
        "caught": defective and not summary["passed"], "cleared": not defective and summary["passed"],
        "first_finding_seconds": summary["timings"]["first_finding_seconds"],
        "total_seconds": round(elapsed, 3), "checks": summary["checks"],
        "findings": len(summary["failures"]), "skipped": summary["skipped"]}))
    shown = [f"{f['status']} {f['check']} at {f['arguments']}: {f['detail']}" for f in summary["failures"][:5]]
    if defective:
        assert not summary["passed"], f"defect not caught: {member.get('defect')}"
        print(f"{_id(member)}: caught after {summary['timings']['first_finding_seconds']:.3f} s "
              f"({elapsed:.1f} s total)")
    else:
        assert summary["passed"], f"false alarm on a correct member: {shown}"


if __name__ == "__main__":
    # python tests/test_effectiveness.py LEDGER_DIRECTORY: the summary of a finished run
    print(summary_line(summarise_ledger(Path(sys.argv[1]))))
