"""Defective prime_pi: a segmented sieve of Eratosthenes with 2**16-wide segments.

DEFECT: each segment is sieved over [low, low + SEGMENT - 1) instead of
[low, low + SEGMENT), so the last number of every full segment, k * 2**16 - 1,
is never examined.  The count is short by one for every prime of that form
<= x; the first is 131071 = 2**17 - 1, so prime_pi(x) is correct below 131071
and too small from there on.
"""

import math

SEGMENT = 1 << 16


def _small_primes(limit):
    flags = bytearray([1]) * (limit + 1)
    flags[0:2] = b"\x00\x00"
    for p in range(2, math.isqrt(limit) + 1):
        if flags[p]:
            flags[p * p::p] = bytes(len(range(p * p, limit + 1, p)))
    return [p for p in range(limit + 1) if flags[p]]


def prime_pi(x):
    if x < 2:
        return 0
    sieving_primes = _small_primes(math.isqrt(x))
    count = 0
    for low in range(0, x + 1, SEGMENT):
        high = min(low + SEGMENT - 1, x + 1)          # bug: should be low + SEGMENT
        flags = bytearray([1]) * (high - low)
        for p in sieving_primes:
            if p * p >= high:
                break
            start = max(p * p, (low + p - 1) // p * p)
            flags[start - low::p] = bytes(len(range(start - low, high - low, p)))
        if low == 0:
            flags[0:2] = b"\x00\x00"[:high]
        count += flags.count(1)
    return count
