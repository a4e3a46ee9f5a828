"""Benchmark of oracle.exact.combinatorial.prime_pi against reference libraries.

Run as a script (pytest does not collect it):

    python tests/bench_combinatorial.py            # all measurements (several minutes)
    python tests/bench_combinatorial.py --quick    # skip the 10**16 runs
    python tests/bench_combinatorial.py --with-17  # add a generic x near 10**17
    python tests/bench_combinatorial.py --jit-only # only jit vs numpy (--quick: 10**14 only)

Every ratio compares two timings taken in this same run on this machine, so a
busy or slow machine affects both sides.  The targets come from issues 3 and 14:

* against primecountpy's prime_pi (which uses every core) at generic x, far from
  any table point, near 10**14, 10**16 and 10**17, ours on every core too: goal
  within 3x, minimum 5x (issue 14).  Each figure is the median of 3 runs taken
  in turn (ours on all cores, ours on one, primecountpy), so a burst of load
  from elsewhere falls on all three alike;
* against sympy.primepi at 10**11: goal 100x faster, minimum 30x;
* peak resident memory of prime_pi(10**16) at most 1 GiB (the calling process;
  the workers each hold their own tables and one segment);
* the compiled partial sieve (extra ``jit``, numba) against the numpy loops at
  the same generic x, on one core and on all cores (median of 3 interleaved
  runs), and numba's first-call cost in a fresh interpreter: with an empty
  on-disk cache (compilation) and again with that cache filled (loading).
  No target; issue 14 asks for the figures.  ``--no-jit`` skips this part.

The reference libraries are only used here and in the tests, never by the oracle.
"""

from __future__ import annotations

import argparse
import statistics
import subprocess
import sys
import time

GIB = 1 << 30

#: Child that times the first use of every compiled kernel (numba compiles or loads them then).
_FIRST_CALL = """
import time
started = time.perf_counter()
import numba
imported = time.perf_counter()
from oracle.exact.combinatorial._jit import CompiledPartialSieve
import numpy as np
sieve = CompiledPartialSieve(0, 9216, (5, 7))
sieve.remove_multiples(11)
sieve.count_up_to(np.array([100, 5000], dtype=np.int64))
done = time.perf_counter()
print(imported - started, done - imported)
"""


def timed(function, argument, repeats: int) -> tuple[float, int]:
    """Best wall time of ``repeats`` calls, and the value returned."""
    best, value = float("inf"), None
    for _ in range(repeats):
        started = time.perf_counter()
        value = function(argument)
        best = min(best, time.perf_counter() - started)
    return best, value


def peak_memory_of(x_expression: str) -> tuple[int, int]:
    """Peak RSS in bytes of a fresh interpreter computing prime_pi(x), and of one that
    only imports the package (the difference is what the computation itself needs).

    The child reads its own high-water mark (``VmHWM`` in /proc/self/status on
    Linux), which, unlike ``ru_maxrss``, does not inherit the parent's size.
    """
    template = ("import resource, oracle.exact.combinatorial as c\n"
                "{work}\n"
                "try:\n"
                "    line = [l for l in open('/proc/self/status') if l.startswith('VmHWM')][0]\n"
                "    print(int(line.split()[1]))\n"
                "except OSError:\n"
                "    print(resource.getrusage(resource.RUSAGE_SELF).ru_maxrss)\n")
    results = []
    for work in (f"c.prime_pi({x_expression})", "pass"):
        out = subprocess.run([sys.executable, "-c", template.format(work=work)],
                             check=True, capture_output=True, text=True).stdout
        results.append(int(out.split()[-1]) * 1024)    # both are in KiB on Linux
    return results[0], results[1]


def first_call_seconds() -> tuple[tuple[float, float], tuple[float, float]]:
    """(import numba, first kernel calls) in seconds for a fresh interpreter, twice: with an
    empty numba cache folder (the kernels are compiled and written) and with it filled (read)."""
    import os
    import tempfile

    figures = []
    with tempfile.TemporaryDirectory(prefix="ntoracle-numba-cache-") as folder:
        environment = dict(os.environ, NUMBA_CACHE_DIR=folder)
        for _ in ("cold", "warm"):
            out = subprocess.run([sys.executable, "-c", _FIRST_CALL], env=environment,
                                 check=True, capture_output=True, text=True).stdout
            imported, first_calls = (float(t) for t in out.split())
            figures.append((imported, first_calls))
    return figures[0], figures[1]


def jit_rows(points: list[int], repeats: int) -> list[tuple]:
    """jit against numpy loops at each x: one core (whole pi(x)) and all cores, medians."""
    from oracle.exact.combinatorial import _parallel
    from oracle.exact.combinatorial._deleglise_rivat import prime_pi_deleglise_rivat

    cores = _parallel.available_cores()
    rows = []
    for x in points:
        runs = {("one", "numpy"): [], ("one", "jit"): [], ("all", "numpy"): [], ("all", "jit"): []}
        values = set()
        for _ in range(repeats):                          # interleaved: one of each in turn
            for where, kernel in runs:
                if where == "one":
                    call = lambda n, k=kernel: prime_pi_deleglise_rivat(n, kernel=k)
                else:
                    call = lambda n, k=kernel: _parallel.prime_pi_in_workers(n, cores, kernel=k)
                seconds, value = timed(call, x, 1)
                runs[where, kernel].append(seconds)
                values.add(value)
        assert len(values) == 1, f"prime_pi({x}): the kernels disagree: {values}"
        for where, label in (("one", "one core"), ("all", f"{cores} cores")):
            numpy_seconds = statistics.median(runs[where, "numpy"])
            jit_seconds = statistics.median(runs[where, "jit"])
            rows.append((f"prime_pi({x:.2e}) jit vs numpy, {label}", jit_seconds, numpy_seconds,
                         f"{numpy_seconds / jit_seconds:.2f}x faster", "(no target)"))
    return rows


def verdict(ratio: float, goal: float, minimum: float, higher_is_better: bool) -> str:
    if higher_is_better:
        return "goal met" if ratio >= goal else ("minimum met" if ratio >= minimum else "MISSED")
    return "goal met" if ratio <= goal else ("minimum met" if ratio <= minimum else "MISSED")


def main() -> int:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--quick", action="store_true", help="skip the 10**16 measurements")
    parser.add_argument("--with-17", action="store_true", help="add a generic x near 10**17")
    parser.add_argument("--repeats", type=int, default=3, help="runs per point (median)")
    parser.add_argument("--no-jit", action="store_true", help="skip the jit-vs-numpy part")
    parser.add_argument("--jit-only", action="store_true",
                        help="only the jit-vs-numpy part and numba's first-call times")
    arguments = parser.parse_args()
    if arguments.jit_only:
        return jit_report(arguments)

    # Measured first, while this process is still small (see peak_memory_of).
    memory = None if arguments.quick else peak_memory_of("10**16")

    import sympy
    from primecountpy import primecount

    from oracle.exact import combinatorial
    from oracle.exact.combinatorial import _parallel

    combinatorial.prime_pi(10**8)                     # warm the caches and imports
    combinatorial.prime_pi(10**13 + 1)                # start the worker pool once
    print(f"cores: {_parallel.available_cores()}; workers from x >= "
          f"{combinatorial.MIN_PARALLEL_X:.0e} by default")
    rows = []
    points = [123456789012345]
    if not arguments.quick:
        points.append(12345678901234567)
    if arguments.with_17:
        points.append(123456789012345678)
    for x in points:
        all_cores, one_core, reference = [], [], []
        for _ in range(arguments.repeats):                # interleaved: one of each in turn
            seconds, value = timed(combinatorial.prime_pi, x, 1)
            all_cores.append(seconds)
            seconds, single = timed(lambda n: combinatorial.prime_pi(n, workers=1), x, 1)
            one_core.append(seconds)
            seconds, expected = timed(primecount.prime_pi, x, 1)
            reference.append(seconds)
            assert value == single == expected, f"prime_pi({x}): {value}, {single}, {expected}"
        ours, alone, theirs = (statistics.median(t) for t in (all_cores, one_core, reference))
        rows.append((f"prime_pi({x:.2e}) vs primecountpy", ours, theirs,
                     f"{ours / theirs:.1f}x slower", verdict(ours / theirs, 3, 5, False)))
        rows.append((f"  same, ours on one core", alone, theirs,
                     f"{alone / theirs:.1f}x slower", f"cores gain {alone / ours:.2f}x"))

    x = 10**11
    ours, value = timed(combinatorial.prime_pi, x, arguments.repeats)
    reference, expected = timed(lambda n: int(sympy.primepi(n)), x, 1)
    assert value == expected, f"prime_pi(10**11) = {value}, sympy says {expected}"
    speedup = reference / ours
    rows.append(("prime_pi(10**11) vs sympy.primepi", ours, reference,
                 f"{speedup:.0f}x faster", verdict(speedup, 100, 30, higher_is_better=True)))

    print(f"{'measurement':<40} {'ours (s)':>10} {'reference (s)':>14}  {'ratio':<14} result")
    for name, ours, reference, ratio, result in rows:
        print(f"{name:<40} {ours:>10.3f} {reference:>14.3f}  {ratio:<14} {result}")

    if not arguments.no_jit:
        jit_report(arguments)

    if memory is not None:
        peak, baseline = memory
        result = "met" if peak <= GIB else "MISSED"
        print(f"peak RSS of prime_pi(10**16): {peak / 2**20:.0f} MiB "
              f"(interpreter with imports alone: {baseline / 2**20:.0f} MiB); "
              f"target <= 1024 MiB: {result}")
    return 0


def jit_report(arguments) -> int:
    """Print the jit-vs-numpy rows and numba's first-call times (or why they are missing)."""
    from oracle.exact.combinatorial._partial_sieve import jit_available

    if not jit_available():
        print("jit: numba is not installed (extra 'jit') or NTORACLE_JIT=off: comparison skipped")
        return 0
    (cold_import, cold_calls), (warm_import, warm_calls) = first_call_seconds()
    print(f"numba first call in a fresh interpreter: empty cache {cold_calls:.2f} s compiling "
          f"(+{cold_import:.2f} s import numba); filled cache {warm_calls:.2f} s loading "
          f"(+{warm_import:.2f} s import numba)")
    points = [123456789012345] if arguments.quick else [123456789012345, 12345678901234567]
    rows = jit_rows(points, arguments.repeats)
    print(f"{'measurement':<44} {'jit (s)':>9} {'numpy (s)':>10}  ratio")
    for name, jit_seconds, numpy_seconds, ratio, _ in rows:
        print(f"{name:<44} {jit_seconds:>9.3f} {numpy_seconds:>10.3f}  {ratio}")
    return 0


if __name__ == "__main__":
    sys.exit(main())
