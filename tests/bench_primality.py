"""Benchmark: oracle's is_prime_batch against a loop of gmpy2.is_prime.

Run as ``python tests/bench_primality.py`` (not collected by pytest).  Both
methods classify the same seeded batch of 200,000 random odd 64-bit integers
in the same run; the script prints the best of several repetitions and the
ratio oracle / gmpy2 (target: at most 5).  It also checks that both methods
agree on every value, so a fast wrong answer cannot look like a good figure.
"""

from __future__ import annotations

import argparse
import time

import gmpy2
import numpy as np

from oracle.exact import primality

TARGET_RATIO = 5.0


def random_odd_64_bit(count: int, seed: int) -> np.ndarray:
    """``count`` uniform random odd integers in [1, 2**64), as uint64."""
    generator = np.random.default_rng(seed)
    return generator.integers(0, 2**64, size=count, dtype=np.uint64, endpoint=False) | np.uint64(1)


def best_time(function, repetitions: int) -> tuple[float, object]:
    """Smallest wall time over ``repetitions`` calls, and the last result."""
    best = float("inf")
    result = None
    for _ in range(repetitions):
        start = time.perf_counter()
        result = function()
        best = min(best, time.perf_counter() - start)
    return best, result


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument("--count", type=int, default=200_000)
    parser.add_argument("--seed", type=int, default=20261201)
    parser.add_argument("--repetitions", type=int, default=5)
    arguments = parser.parse_args()

    values = random_odd_64_bit(arguments.count, arguments.seed)
    as_ints = values.tolist()

    oracle_seconds, oracle_answer = best_time(
        lambda: primality.is_prime_batch(values), arguments.repetitions)
    gmpy2_seconds, gmpy2_answer = best_time(
        lambda: np.fromiter((gmpy2.is_prime(n) for n in as_ints), dtype=bool, count=len(as_ints)),
        arguments.repetitions)

    if not np.array_equal(oracle_answer, gmpy2_answer):
        disagreements = np.flatnonzero(oracle_answer != gmpy2_answer)
        raise SystemExit(f"disagreement on {len(disagreements)} values, first {as_ints[disagreements[0]]}")

    ratio = oracle_seconds / gmpy2_seconds
    print(f"batch: {arguments.count} random odd 64-bit integers, seed {arguments.seed}, "
          f"{int(oracle_answer.sum())} primes")
    print(f"oracle is_prime_batch : {oracle_seconds * 1e3:8.1f} ms "
          f"({oracle_seconds / arguments.count * 1e9:6.0f} ns per value)")
    print(f"loop of gmpy2.is_prime: {gmpy2_seconds * 1e3:8.1f} ms "
          f"({gmpy2_seconds / arguments.count * 1e9:6.0f} ns per value)")
    print(f"ratio oracle / gmpy2  : {ratio:.2f}x (target <= {TARGET_RATIO:.0f}x: "
          f"{'met' if ratio <= TARGET_RATIO else 'NOT met'})")


if __name__ == "__main__":
    main()
