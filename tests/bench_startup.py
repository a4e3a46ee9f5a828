"""Benchmark of start-up: ``ntoracle value pi 1000`` against a bare interpreter.

Run: ``python tests/bench_startup.py`` (from the repository root, with the venv active).

Each round runs, interleaved, ``python -c pass`` (the reference: the interpreter's
own start-up), ``python -m oracle.cli value pi 1000`` and the ``ntoracle`` entry point
of the running interpreter's environment when there is one; the medians are printed
with their difference and ratio (goal: the command <= 0.15 s, issue 14).  The answer
store is off for these runs, so a warm store does not flatter the figure.  Then the
ten slowest imports of one ``python -X importtime`` run of the command are listed.

The figures are printed, never asserted: timings on a shared machine are evidence.
"""

from __future__ import annotations

import os
import re
import shutil
import statistics
import subprocess
import sys
import time
from pathlib import Path

REPOSITORY = Path(__file__).resolve().parent.parent
ROUNDS = 15
_IMPORT_LINE = re.compile(r"^import time:\s+(\d+) \|\s+(\d+) \|( *)(\S+)$")


def _environment() -> dict:
    environment = dict(os.environ, NTORACLE_STORE="off")
    environment["PYTHONPATH"] = os.pathsep.join(
        [str(REPOSITORY)] + [p for p in [os.environ.get("PYTHONPATH")] if p])
    return environment


def _seconds(command: list[str]) -> float:
    started = time.perf_counter()
    subprocess.run(command, check=True, stdout=subprocess.DEVNULL, env=_environment(),
                   cwd=REPOSITORY)
    return time.perf_counter() - started


def main() -> None:
    commands = {"python -c pass": [sys.executable, "-c", "pass"],
                "python -m oracle.cli value pi 1000": [sys.executable, "-m", "oracle.cli",
                                                       "value", "pi", "1000"]}
    entry_point = Path(sys.executable).with_name("ntoracle")
    if entry_point.exists():
        commands["ntoracle value pi 1000"] = [str(entry_point), "value", "pi", "1000"]
    else:
        found = shutil.which("ntoracle")
        if found:
            commands["ntoracle value pi 1000"] = [found, "value", "pi", "1000"]
    timings = {name: [] for name in commands}
    for _ in range(ROUNDS):
        for name, command in commands.items():
            timings[name].append(_seconds(command))
    reference = statistics.median(timings["python -c pass"])
    print(f"start-up, median of {ROUNDS} interleaved rounds (answer store off)")
    for name, values in timings.items():
        median = statistics.median(values)
        print(f"  {name:38s} {median:6.3f} s  (+{median - reference:.3f} s over the "
              f"interpreter, ratio {median / reference:.1f}x)")
    print("  goal: the command <= 0.15 s (issue 14)")
    run = subprocess.run([sys.executable, "-X", "importtime", "-m", "oracle.cli", "value", "pi",
                          "1000"], capture_output=True, text=True, env=_environment(),
                         cwd=REPOSITORY)
    imports = []
    for line in run.stderr.splitlines():
        match = _IMPORT_LINE.match(line)
        if match and len(match.group(3)) == 1:          # top-level imports only
            imports.append((int(match.group(2)), match.group(4)))
    print("slowest top-level imports of one run (cumulative microseconds):")
    for microseconds, module in sorted(imports, reverse=True)[:10]:
        print(f"  {microseconds:8d}  {module}")


if __name__ == "__main__":
    main()
