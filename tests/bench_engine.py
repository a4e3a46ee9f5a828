"""Benchmark of the harness itself (printed, one run): ``python tests/bench_engine.py``.

1. Overhead per check for an in-process Python candidate: the engine's own
   work per point (call wrapper with its timeout, normalisation, recording),
   measured as (time of the engine's call-and-record loop) − (time of calling
   the candidate bare), with the oracle's verdict precomputed so that only the
   harness is timed.  Goal: ≤ 5 µs at the median.  Times are this process's CPU
   time (``time.process_time``), so that other work on a shared machine does not
   count against the harness.
2. Line-protocol throughput with a trivial executable (``cat``, which echoes
   every request as its answer).  Goal: ≥ 20,000 requests/s.
"""

import statistics
import sys
import time

from oracle import targets
from oracle.engine._audit import _Run, AuditOptions
from oracle.engine._records import RecordStream
from oracle.roles import Verdict

POINTS = [(x,) for x in range(2000)]
REPEATS = 15


def trivial(x):
    return x


def overhead_per_check() -> list[float]:
    target = targets.python_target("__main__:trivial", role_name="prime_pi", timeout=5.0)
    run = _Run(target, AuditOptions(role="prime_pi"), RecordStream(None))
    run.time_budget = 1e9
    verdict = Verdict("exact", True, 0, "precomputed")
    role = run.role
    run.role = type(role)(**{**vars(role), "judge": lambda a, v, c, b, **memory: verdict})
    per_check = []
    for _ in range(REPEATS):
        started = time.process_time()
        for x in POINTS:
            trivial(*x)
        bare = time.process_time() - started
        run.stream = RecordStream(None)
        started = time.process_time()
        run.ask([("bench", x) for x in POINTS])
        harness = time.process_time() - started
        per_check.append((harness - bare) / len(POINTS))
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
    per_check = overhead_per_check()
    median = statistics.median(per_check) * 1e6
    print(f"in-process harness overhead per check: median {median:.2f} µs "
          f"(min {min(per_check) * 1e6:.2f}, max {max(per_check) * 1e6:.2f}; {REPEATS} runs of "
          f"{len(POINTS)} checks); goal <= 5 µs: ratio {median / 5:.2f}")
    rate = line_protocol_rate()
    print(f"line protocol with a trivial executable (cat): {rate:,.0f} requests/s; "
          f"goal >= 20,000: ratio {rate / 20000:.2f}")
    return 0


if __name__ == "__main__":
    sys.exit(main())
