"""Benchmark of the answer store: a repeated derandomised ci audit, cold store then warm.

Run: ``python tests/bench_store.py [--max N]`` (from the repository root, with the venv active).

The same command is run twice in a fresh, empty store folder (``NTORACLE_STORE``)::

    python -m oracle.cli audit zoo.prime_pi_primecount:prime_pi --profile ci --seed 1
        --max 10**15 --quiet --no-corpus --in-process --stream FILE

The first run computes every oracle answer and keeps the slow ones; the second reads
them back.  ``--max`` keeps the climb inside a declared domain, so neither run stops on
the wall-clock time budget: with the seed fixed, both runs ask the same points and must
record the same reach, and every check that two runs both asked must be the same (status,
arguments, value, expected value, provenance); the script says whether they were.  The
sets of points may differ by a few: above 0.05 s per call the climb thins its steps by the
candidate's measured speed (oracle.engine._reach.THIN_ABOVE), which a loaded machine
changes; the script counts the points asked in one run only.  Printed: both wall times and their ratio
(goal: the second run >= 5x faster, issue 14), the store's entries, and the ratio of a
third run with the store switched off (``--no-store``) to the warm run.

What the store cannot remove stays in the warm run: the candidate's own calls
(primecount at up to 10**15), the engine, and oracle answers faster than the
store's 50 ms threshold.  The figures are printed, never asserted.
"""

from __future__ import annotations

import argparse
import json
import os
import subprocess
import sys
import tempfile
import time
from pathlib import Path

REPOSITORY = Path(__file__).resolve().parent.parent
TARGET = "zoo.prime_pi_primecount:prime_pi"
_CHECK_FIELDS = ("status", "check", "family", "arguments", "got", "expected", "provenance", "detail")
_REACH_FIELDS = ("family", "stopped", "largest", "next")


def _audit(folder: Path, stream: Path, maximum: str, *extra: str) -> float:
    environment = dict(os.environ, NTORACLE_STORE=str(folder / "store"))
    environment["PYTHONPATH"] = os.pathsep.join(
        [str(REPOSITORY), str(REPOSITORY / "tests")]
        + [p for p in [os.environ.get("PYTHONPATH")] if p])
    command = [sys.executable, "-m", "oracle.cli", "audit", TARGET, "--profile", "ci",
               "--seed", "1", "--max", maximum, "--quiet", "--no-corpus", "--in-process",
               "--stream", str(stream), *extra]
    started = time.perf_counter()
    subprocess.run(command, cwd=folder, env=environment, stdout=subprocess.DEVNULL, check=False)
    return time.perf_counter() - started


def _outcome(stream: Path) -> tuple[list, list]:
    checks, reach = [], []
    for line in stream.read_text().splitlines():
        record = json.loads(line)
        if record.get("type") == "check":
            checks.append(tuple(json.dumps(record.get(k)) for k in _CHECK_FIELDS))
        elif record.get("type") == "reach":
            reach.append(tuple(json.dumps(record.get(k)) for k in _REACH_FIELDS))
    return sorted(checks), sorted(reach)


def _points(checks: list) -> set:
    return {check[1:4] for check in checks}          # (check kind, family, arguments)


def _agree(first: list, second: list) -> bool:
    """Every (check kind, family, arguments) present in both runs has the same record in both."""
    by_point = {check[1:4]: check for check in first}
    return all(by_point[c[1:4]] == c for c in second if c[1:4] in by_point)


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--max", default="10**15", help="the audit's --max (default 10**15)")
    maximum = parser.parse_args().max
    with tempfile.TemporaryDirectory(prefix="ntoracle-bench-store-") as name:
        folder = Path(name)
        cold = _audit(folder, folder / "cold.jsonl", maximum)
        warm = _audit(folder, folder / "warm.jsonl", maximum)
        off = _audit(folder, folder / "off.jsonl", maximum, "--no-store")
        outcomes = [_outcome(folder / f"{run}.jsonl") for run in ("cold", "warm", "off")]
        environment = dict(os.environ, NTORACLE_STORE=str(folder / "store"),
                           PYTHONPATH=str(REPOSITORY))
        shown = subprocess.run([sys.executable, "-m", "oracle.cli", "store", "show", "--json"],
                               env=environment, capture_output=True, text=True)
        summary = json.loads(shown.stdout)
    print(f"repeated ci audit of {TARGET}, seed 1, --max {maximum}")
    print(f"  first run (empty store)   {cold:7.2f} s")
    print(f"  second run (warm store)   {warm:7.2f} s   ratio first/second {cold / warm:5.2f}x "
          f"(goal >= 5x)")
    print(f"  third run (--no-store)    {off:7.2f} s   ratio third/second {off / warm:5.2f}x")
    (cold_checks, cold_reach), *others = outcomes
    print(f"  checks recorded: {', '.join(str(len(checks)) for checks, _ in outcomes)} (cold, warm, off)")
    print(f"  same reach in all three runs: {all(reach == cold_reach for _, reach in others)}")
    print(f"  checks asked by two runs agree: {all(_agree(cold_checks, checks) for checks, _ in others)}")
    for name, (checks, _) in zip(("warm", "off"), others):
        print(f"  points asked only in the cold run or only in the {name} run (timing-thinned climb steps): "
              f"{len(_points(cold_checks) ^ _points(checks))}")
    print(f"  store: {summary['entries']} answer(s), {summary['bytes']} bytes, "
          f"{summary['seconds_saved_per_reuse']:g} s of oracle time saved per reuse")


if __name__ == "__main__":
    main()
