"""Effectiveness: the ``ci`` profile catches every defective zoo member and clears every correct one.

The zoo (``tests/zoo/``, described by ``tests/zoo/catalogue.yaml``) holds
implementations with the bugs real code has, and correct ones built on
sympy, gmpy2, primesieve and python-flint.  Each member is audited as a user
would: Python members in an isolated child process (a zoo member may crash or
exhaust memory on purpose), executable members over the line protocol.
"""

import os
import sys
import time
from pathlib import Path

import pytest
import yaml

from oracle import engine, targets

# Auditing the whole zoo takes longer than the default run allows: slow marker
# until the ci profile is fast enough (see the note on issue 5).
pytestmark = pytest.mark.slow

CATALOGUE = Path(__file__).parent / "zoo" / "catalogue.yaml"
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


def _id(member):
    return member.get("name") or member.get("target") or member.get("exec")


@pytest.mark.skipif(not MEMBERS, reason="tests/zoo/catalogue.yaml not present yet")
@pytest.mark.parametrize("member", MEMBERS, ids=_id)
def test_ci_profile_judges_zoo_member(member, tmp_path):
    role = member["role"]
    if member.get("exec"):
        command = member["exec"]
        target = targets.exec_target(command, role_name=role, timeout=ZOO_TIMEOUT)
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
    shown = [f"{f['status']} {f['check']} at {f['arguments']}: {f['detail']}" for f in summary["failures"][:5]]
    if member.get("defective"):
        assert not summary["passed"], f"defect not caught: {member.get('defect')}"
        print(f"{_id(member)}: caught after {summary['timings']['first_finding_seconds']:.3f} s "
              f"({elapsed:.1f} s total)")
    else:
        assert summary["passed"], f"false alarm on a correct member: {shown}"
