"""Benchmark of the pytest plugin: what it costs unused, and how fast the ci suites collect.

Run: ``python tests/bench_plugin.py`` (from the repository root, with the venv active).

1. Import cost in a session with no target: ``python -X importtime -m pytest --collect-only``
   in an empty project with the plugin loaded; the cumulative time of the top-level
   ``oracle*`` imports is the plugin's cost (goal <= 30 ms, minimum <= 100 ms), printed beside
   ``pytest``'s own import in the same run as the reference.
2. Collection of the bundled suites at profile ``ci`` for all eight roles (the correct
   candidates of the zoo as targets): the collection time pytest reports (goal <= 2 s),
   beside the collection of an empty project in the same run as the reference.

The figures are printed, never asserted: timings on a shared machine are evidence, not a test.
"""

from __future__ import annotations

import importlib.metadata
import re
import subprocess
import sys
import tempfile
import time
from pathlib import Path

REPOSITORY = Path(__file__).resolve().parent.parent
CORRECT_TARGETS = {
    "prime_pi": "zoo.prime_pi_primecount:prime_pi",
    "twin_pi": "zoo.twin_pi_primesieve:twin_pi",
    "nth_prime": "zoo.nth_prime_primecount:nth_prime",
    "is_prime": "zoo.is_prime_flint:is_prime",
    "next_prime": "zoo.next_prime_sympy:next_prime",
    "prev_prime": "zoo.prev_prime_sympy:prev_prime",
    "primes_in": "zoo.primes_in_primesieve:primes_in",
    "factor": "zoo.factor_sympy:factor",
}
_IMPORT_LINE = re.compile(r"^import time:\s+(\d+) \|\s+(\d+) \|( *)(\S+)$")
_COLLECTED = re.compile(r"(\d+) tests? collected in ([\d.]+)s")
REPEATS = 5


def _plugin_arguments() -> list[str]:
    installed = any(ep.name == "ntoracle" for ep in importlib.metadata.entry_points(group="pytest11"))
    return [] if installed else ["-p", "oracle.plugin"]


def _top_level_import_ms(stderr: str, predicate) -> float:
    """Sum of cumulative import times (ms) of top-level modules whose name satisfies ``predicate``."""
    lines = [_IMPORT_LINE.match(line) for line in stderr.splitlines()]
    entries = [(int(m.group(2)), len(m.group(3)), m.group(4)) for m in lines if m]
    top = min(depth for _, depth, _ in entries)
    return sum(us for us, depth, name in entries if depth == top and predicate(name)) / 1000


def import_cost() -> tuple[float, float]:
    """(plugin ms, pytest ms): the minimum over :data:`REPEATS` sessions with no target."""
    plugin, reference = [], []
    with tempfile.TemporaryDirectory() as empty:
        for _ in range(REPEATS):
            done = subprocess.run([sys.executable, "-X", "importtime", "-m", "pytest", "--collect-only",
                                   "-q", "-p", "no:cacheprovider", *_plugin_arguments()],
                                  cwd=empty, capture_output=True, text=True)
            plugin.append(_top_level_import_ms(done.stderr, lambda name: name.startswith("oracle")))
            reference.append(_top_level_import_ms(done.stderr, lambda name: name == "pytest"))
    return min(plugin), min(reference)


def collection_seconds(arguments: list[str], cwd) -> tuple[int, float, float]:
    """(items, seconds pytest reports for collection, wall seconds of the whole session)."""
    started = time.perf_counter()
    done = subprocess.run([sys.executable, "-m", "pytest", "--collect-only", "-q", "-p", "no:cacheprovider",
                           *arguments], cwd=cwd, capture_output=True, text=True)
    wall = time.perf_counter() - started
    found = _COLLECTED.search(done.stdout)
    if found is None:
        if "no tests collected" in done.stdout:
            return 0, float(re.search(r"in ([\d.]+)s", done.stdout).group(1)), wall
        raise RuntimeError(f"collection failed:\n{done.stdout[-2000:]}\n{done.stderr[-2000:]}")
    return int(found.group(1)), float(found.group(2)), wall


def main() -> None:
    plugin_ms, pytest_ms = import_cost()
    verdict = "goal met" if plugin_ms <= 30 else "minimum met" if plugin_ms <= 100 else "MISSED"
    print(f"import of the plugin, session with no target: {plugin_ms:.1f} ms "
          f"(pytest itself {pytest_ms:.1f} ms; ratio {plugin_ms / pytest_ms:.3f}) -- "
          f"goal <= 30 ms, minimum <= 100 ms: {verdict}")

    targets = [argument for role, spec in CORRECT_TARGETS.items()
               for argument in ("--ntoracle-target", f"{role}={spec}")]
    with tempfile.TemporaryDirectory() as empty:
        # an empty project whose sys.path reaches tests/zoo: only the bundled suites are collected
        Path(empty, "pytest.ini").write_text(f"[pytest]\npythonpath = {REPOSITORY / 'tests'}\n")
        _, reference_seconds, reference_wall = collection_seconds(_plugin_arguments(), empty)
        suite_arguments = [*_plugin_arguments(), "--ntoracle-profile", "ci", "--ntoracle-seed", "1",
                           *targets]
        best = min((collection_seconds(suite_arguments, empty) for _ in range(3)),
                   key=lambda found: found[1])
    items, seconds, wall = best
    verdict = "goal met" if seconds <= 2 else "MISSED"
    print(f"collection of the ci suites, eight roles: {items} items in {seconds:.2f} s "
          f"(session wall {wall:.2f} s; empty project {reference_seconds:.2f} s, "
          f"wall {reference_wall:.2f} s; ratio of walls {wall / reference_wall:.2f}) -- "
          f"goal <= 2 s: {verdict}")


if __name__ == "__main__":
    main()
