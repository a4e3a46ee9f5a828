"""`ntoracle demo` finds exactly the documented defects, and the quickstart stays true."""

import json
import re
import subprocess
import sys
from pathlib import Path

import pytest

from oracle.demo import SCENARIO

REPOSITORY = Path(__file__).resolve().parents[1]


@pytest.fixture(scope="module")
def demo_run(tmp_path_factory):
    """One real ``ntoracle demo`` run (about a minute): its folder and its process result."""
    folder = tmp_path_factory.mktemp("demo")
    result = subprocess.run([sys.executable, "-m", "oracle.cli", "demo", "--report", "out"],
                            cwd=folder, capture_output=True, text=True, timeout=600)
    return folder, result


def test_demo_finds_exactly_the_documented_defects_and_writes_the_reports(demo_run):
    tmp_path, result = demo_run
    assert result.returncode == 0, result.stdout[-3000:] + result.stderr[-3000:]
    assert "found exactly the 5 documented defects" in result.stdout
    summaries = json.loads((tmp_path / "out" / "audit.json").read_text())
    verdicts = {s["role"]: s["passed"] for s in summaries}
    assert SCENARIO.discrepancies(verdicts) == []
    assert sorted(verdicts) == sorted(SCENARIO.roles())
    # the first divergences the scenario documents (smallest inputs where brindle goes wrong)
    divergence = {s["role"]: s["first_divergence"] for s in summaries}
    assert divergence["prime_pi"]["input"] == [2**20]        # pi(2^20) = 82025, OEIS A007053
    assert divergence["twin_pi"]["input"] == [5]
    assert divergence["is_prime"]["input"] == [3215031751]   # OEIS A014233: spsp to bases 2, 3, 5, 7
    assert divergence["factor"]["input"] == [1194649]        # 1093**2, OEIS A001262 and A001220
    assert divergence["primes_in"]["prime"] == 131071        # 2**17 - 1, the first prime lost
    page = (tmp_path / "out" / "report.html").read_text()
    assert page.count("data:image/png;base64,") >= 7
    assert "http://" not in page and "https://" not in page and "<script" not in page
    for role in SCENARIO.roles():
        assert (tmp_path / "out" / f"{role}.jsonl").stat().st_size > 0


def test_readme_quickstart_has_two_commands_and_ci_runs_both():
    readme = (REPOSITORY / "README.md").read_text()
    block = re.search(r"## Quickstart.*?```sh\n(.*?)```", readme, re.S).group(1)
    commands = [line.split("#")[0].strip() for line in block.splitlines() if line.strip()]
    assert len(commands) == 2
    assert commands[0].endswith("ntoracle demo") and "pytest" in commands[1]
    ci = (REPOSITORY / ".ci" / "run").read_text()
    for command in commands:
        assert command in ci, f"{command!r} is not run by .ci/run"


def _blocks(lines: list[str]) -> dict[str, list[str]]:
    """The demo's blocks by role: the role's line, then its indented lines."""
    blocks: dict[str, list[str]] = {}
    role = None
    for line in lines:
        if re.match(r"^[a-z_]+ +(PASSED|FAILED|NO VERDICT|INCOMPLETE)\b", line):
            role = line.split()[0]
            blocks[role] = [line]
        elif role is not None and line.startswith("            "):
            blocks[role].append(line)
        elif not line.strip():
            role = None
    return blocks


def _deterministic(block: list[str]) -> list[str]:
    """The role and verdict, then the first divergence and the documented defect; the
    numbers of checks and the times depend on the machine (the climbs follow the speed)."""
    head = block[0].split()
    return [" ".join(head[:2])] + [line.strip() for line in block[1:]]


def test_readme_demo_transcript_matches_a_real_run(demo_run):
    _, result = demo_run
    readme = (REPOSITORY / "README.md").read_text()
    shown = re.search(r"<!-- transcript: ntoracle demo -->\n```\n(.*?)```", readme, re.S).group(1)
    documented, printed = _blocks(shown.splitlines()), _blocks(result.stdout.splitlines())
    assert list(documented) == list(printed) == list(SCENARIO.roles())
    for role, block in documented.items():
        assert _deterministic(block) == _deterministic(printed[role]), role
        assert re.match(r"^\S+ +\S+  \d+/\d+ checks, \d+ finding\(s\), [\d.]+ s$", block[0]), block[0]


def test_readme_names_the_files_the_demo_writes(demo_run):
    folder, _ = demo_run
    import _readme

    written = {path.name for path in (folder / "out").iterdir()}
    named = set()
    for name in _readme.named_list("demo-files"):
        named |= ({name.replace("<role>", role) for role in SCENARIO.roles()} if "<role>" in name
                  else {name})
    assert named == written
