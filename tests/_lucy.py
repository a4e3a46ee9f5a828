"""The sum of the primes up to x for x far above a sieve: Lucy_Hedgehog's method, written
here as a test-only reference (independent of the oracle's combinatorial sum)."""

from __future__ import annotations

import math

import numpy as np

__all__ = ["prime_sum_by_lucy"]


#: The second modulus of :func:`prime_sum_by_lucy` (a prime below 2^31, so that p times a
#: residue fits an int64).
_LUCY_MODULUS = 2**31 - 1


def _lucy_residue(x: int, modulus: int | None) -> int:
    """The sum of the primes p <= x modulo 2^64 (``modulus`` None: uint64 arithmetic, which
    wraps exactly so) or modulo ``modulus``, by Lucy_Hedgehog's method: S(v) = 2 + ... + v
    over every v = x // n, then for each prime p <= sqrt(x) S(v) -= p * (S(v // p) - S(p - 1))
    for v >= p^2."""
    root = math.isqrt(x)
    large = [x // n for n in range(1, root + 1)]
    top_small = large[-1] - 1 if large[-1] == root else large[-1]
    values = np.array(large + list(range(top_small, 0, -1)), dtype=np.int64)
    start = [v * (v + 1) // 2 - 1 for v in values.tolist()]
    if modulus is None:
        sums = np.array([s % 2**64 for s in start], dtype=np.uint64)
    else:
        sums = np.array([s % modulus for s in start], dtype=np.int64)
    count_large = len(large)

    def position(v):
        return np.where(v > top_small, x // np.maximum(v, 1) - 1, count_large + (top_small - v))

    def at(v: int) -> int:
        return count_large + (top_small - v) if v <= top_small else x // v - 1

    with np.errstate(over="ignore"):
        for p in range(2, root + 1):
            if sums[at(p)] == sums[at(p - 1)]:
                continue                                   # p is composite
            reach = int(np.searchsorted(-values, -p * p, side="right"))
            if reach == 0:
                break
            difference = sums[position(values[:reach] // p)] - sums[at(p - 1)]
            if modulus is None:
                sums[:reach] -= np.uint64(p) * difference
            else:
                sums[:reach] = (sums[:reach] - p * (difference % modulus)) % modulus
    return int(sums[0])


def prime_sum_by_lucy(x: int) -> int:
    """The sum of the primes p <= x, exact below 2^64 * (2^31 - 1): Lucy_Hedgehog's method run
    modulo 2^64 and modulo 2^31 - 1, joined by the Chinese remainder theorem (written here, an
    independent computation; about 3 s at 10^10).  Checked against OEIS A046731 in
    test_prime_sum_by_lucy_agrees_with_oeis_a046731."""
    low, other = _lucy_residue(x, None), _lucy_residue(x, _LUCY_MODULUS)
    k = (other - low) * pow(2**64, -1, _LUCY_MODULUS) % _LUCY_MODULUS
    return low + 2**64 * k
