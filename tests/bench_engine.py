"""Benchmark of the harness itself (printed, one run): ``python tests/bench_engine.py``.

1. Overhead per check for a Python candidate, in the default isolated mode (the worker child
   of :mod:`oracle.targets._worker`; goal ≤ 20 µs at the median, CPU time of both processes,
   since the child's work counts) and in the trusting in-process mode: the engine's own
   work per point (call wrapper with its timeout, normalisation, recording),
   measured as (time of the engine's call-and-record loop) − (time of calling
   the candidate bare), with the oracle's verdict precomputed so that only the
   harness is timed.  Goal: ≤ 5 µs at the median.  Times are this process's CPU
   time (``time.process_time``), so that other work on a shared machine does not
   count against the harness.
2. Line-protocol throughput with a trivial executable (``cat``, which echoes
   every request as its answer).  Goal: ≥ 20,000 requests/s.
"""

import os
import statistics
import sys
import time
from pathlib import Path

from oracle import targets
from oracle.engine._audit import _Run, AuditOptions
from oracle.engine._records import RecordStream
from oracle.roles import Verdict

POINTS = [(x,) for x in range(2000)]
REPEATS = 15


def trivial(x):
    return x


def _cpu_seconds(pid: int) -> float:
    """CPU time (user + system) of process ``pid`` so far, from /proc (Linux)."""
    fields = Path(f"/proc/{pid}/stat").read_text().rsplit(")", 1)[1].split()
    return (int(fields[11]) + int(fields[12])) / os.sysconf("SC_CLK_TCK")


def overhead_per_check(isolate: bool = False) -> list[float]:
    """Seconds of harness work per check, one figure per repeat: CPU time, so that other work
    on a shared machine does not count (isolated: this process's and the worker's together,
    minus the bare calls, which the worker makes)."""
    spec = "bench_engine:trivial" if isolate else "__main__:trivial"
    target = targets.python_target(spec, role_name="prime_pi", timeout=5.0, isolate=isolate,
                                   python_path=[str(Path(__file__).parent)] + sys.path)
    run = _Run(target, AuditOptions(role="prime_pi"), RecordStream(None))
    run.time_budget = 1e9
    verdict = Verdict("exact", True, 0, "precomputed")
    role = run.role
    run.role = type(role)(**{**vars(role), "judge": lambda a, v, c, b, **memory: verdict})
    points = POINTS * (10 if isolate else 1)    # the worker's CPU clock ticks at 10 ms
    worker = target.process.pid if isolate else None
    per_check = []
    for _ in range(REPEATS):
        started = time.process_time()
        for x in points:
            trivial(*x)
        bare = time.process_time() - started
        run.stream = RecordStream(None)
        started = time.process_time()
        worker_started = _cpu_seconds(worker) if isolate else 0.0
        run.ask([("bench", x) for x in points])
        harness = time.process_time() - started
        if isolate:
            harness += _cpu_seconds(worker) - worker_started
        per_check.append((harness - bare) / len(points))
    target.close()
    return per_check


def line_protocol_rate(count: int = 200_000) -> float:
    target = targets.exec_target("cat", role_name="prime_pi", timeout=5.0)
    target.call_many([(1,)])
    started = time.perf_counter()
    results = target.call_many([(x,) for x in range(count)])
    elapsed = time.perf_counter() - started
    target.close()
    if any(result.value != x for x, result in enumerate(results)):
        raise SystemExit("the echo executable answered wrongly: the measurement is void")
    return count / elapsed


def main() -> int:
    for isolate, goal in ((True, 20), (False, 5)):
        per_check = overhead_per_check(isolate)
        median = statistics.median(per_check) * 1e6
        mode = "isolated (default)" if isolate else "in-process (--in-process)"
        print(f"{mode} harness overhead per check: median {median:.2f} µs "
              f"(min {min(per_check) * 1e6:.2f}, max {max(per_check) * 1e6:.2f}; {REPEATS} runs of "
              f"{len(POINTS) * (10 if isolate else 1)} checks); goal <= {goal} µs: ratio {median / goal:.2f}")
    rate = line_protocol_rate()
    print(f"line protocol with a trivial executable (cat): {rate:,.0f} requests/s; "
          f"goal >= 20,000: ratio {rate / 20000:.2f}")
    return 0


if __name__ == "__main__":
    sys.exit(main())
