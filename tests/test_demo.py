"""`ntoracle demo` finds exactly the documented defects, and the quickstart stays true."""

import json
import re
import subprocess
import sys
from pathlib import Path

from oracle.demo import SCENARIO

REPOSITORY = Path(__file__).resolve().parents[1]


def test_demo_finds_exactly_the_documented_defects_and_writes_the_reports(tmp_path):
    result = subprocess.run([sys.executable, "-m", "oracle.cli", "demo", "--report", "out"],
                            cwd=tmp_path, capture_output=True, text=True, timeout=600)
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
