"""Benchmark of the sieve engines: run as ``python tests/bench_sieve.py``.

Prints, from one run on this machine, the best of several alternating timings of

* our numpy segmented sieve against ``primesieve.count_primes`` for pi(10**9)
  (goal: within 10x), with primesieve on its default threads and on one thread;
* ``sieve.count("primes", 0, 10**10)`` against ``primesieve.count_primes(10**10)``,
  the overhead of our dispatch (goal: at most 1.2x);
* ``oracle.primes(2**64 - 10**6, 2**64 - 1)`` with the numpy engine (small primes
  sieve, the strong test proves the survivors) against ``primesieve.primes`` on
  the same interval (goal: at most 1 s for ours).

No assertion: the figures are ratios against a reference timed in the same run.
"""

from __future__ import annotations

import argparse
import time

import os

import primesieve

import oracle
from oracle.exact import sieve


def elapsed(function) -> float:
    """Wall-clock seconds of one call ``function()``."""
    start = time.perf_counter()
    function()
    return time.perf_counter() - start


def compare_seconds(label: str, ours, reference, repeats: int, goal_seconds: float) -> None:
    """Like :func:`compare`, with the goal a wall time for ``ours``."""
    ours_seconds, reference_seconds = float("inf"), float("inf")
    for _ in range(repeats):
        ours_seconds = min(ours_seconds, elapsed(ours))
        reference_seconds = min(reference_seconds, elapsed(reference))
    print(f"{label}: ours {ours_seconds:.3f} s (goal <= {goal_seconds} s), "
          f"reference {reference_seconds:.3f} s, ratio {ours_seconds / reference_seconds:.2f}")


def numpy_engine_primes_near_2_to_64():
    """``oracle.primes`` near the top of uint64 with the numpy engine forced."""
    previous = os.environ.get("NTORACLE_SIEVE_ENGINE")
    os.environ["NTORACLE_SIEVE_ENGINE"] = "numpy"
    try:
        return oracle.primes(2**64 - 10**6, 2**64 - 1)
    finally:
        if previous is None:
            del os.environ["NTORACLE_SIEVE_ENGINE"]
        else:
            os.environ["NTORACLE_SIEVE_ENGINE"] = previous


def compare(label: str, ours, reference, repeats: int, goal: float) -> None:
    """Time ``ours`` and ``reference`` alternately, ``repeats`` times each; print the best of each.

    Alternating keeps the load of a shared machine from favouring either side.
    """
    ours_seconds, reference_seconds = float("inf"), float("inf")
    for _ in range(repeats):
        ours_seconds = min(ours_seconds, elapsed(ours))
        reference_seconds = min(reference_seconds, elapsed(reference))
    ratio = ours_seconds / reference_seconds
    print(f"{label}: ours {ours_seconds:.3f} s, reference {reference_seconds:.3f} s, "
          f"ratio {ratio:.2f} (goal <= {goal})")


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--repeats", type=int, default=5)
    repeats = parser.parse_args().repeats
    os.environ["NTORACLE_STORE"] = "off"      # time the computation, not the answer store
    numpy_engine = sieve._engines()["numpy"]
    default_threads = primesieve.get_num_threads()
    print(f"active engine: {sieve.active_engine()}; primesieve threads: {default_threads}")

    compare(f"pi(10**9), numpy engine vs primesieve ({default_threads} threads)",
            lambda: numpy_engine.count("primes", 0, 10**9),
            lambda: primesieve.count_primes(10**9), repeats, goal=10)
    primesieve.set_num_threads(1)
    compare("pi(10**9), numpy engine vs primesieve (1 thread)",
            lambda: numpy_engine.count("primes", 0, 10**9),
            lambda: primesieve.count_primes(10**9), repeats, goal=10)
    primesieve.set_num_threads(default_threads)

    compare("count('primes', 0, 10**10) vs primesieve.count_primes(10**10)",
            lambda: sieve.count("primes", 0, 10**10),
            lambda: primesieve.count_primes(10**10), repeats, goal=1.2)

    ours = numpy_engine_primes_near_2_to_64()
    if ours != list(primesieve.primes(2**64 - 10**6, 2**64 - 1)):
        raise SystemExit("primes near 2**64: the numpy engine and primesieve disagree")
    compare_seconds("primes(2**64 - 10**6, 2**64 - 1), numpy engine vs primesieve",
                    numpy_engine_primes_near_2_to_64,
                    lambda: primesieve.primes(2**64 - 10**6, 2**64 - 1), repeats, goal_seconds=1)


if __name__ == "__main__":
    main()
