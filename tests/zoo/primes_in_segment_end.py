"""Defective primes_in: a segmented sieve that never looks at a segment's last number.

DEFECT: segments are aligned to multiples of 2**16 and sieved over
[low, low + 2**16 - 1) instead of [low, low + 2**16), so every prime of the form
k * 2**16 - 1 is lost: the first is 131071 = 2**17 - 1 (then 524287, 786431,
...).  Ranges that contain no such number come out right.
"""

import math

SEGMENT = 1 << 16


def _small_primes(limit):
    flags = bytearray([1]) * (limit + 1)
    flags[0:2] = b"\x00\x00"[: limit + 1]
    for p in range(2, math.isqrt(limit) + 1):
        if flags[p]:
            flags[p * p::p] = bytes(len(range(p * p, limit + 1, p)))
    return [p for p in range(limit + 1) if flags[p]]


def primes_in(a, b):
    a = max(a, 0)
    if b < 2 or a > b:
        return []
    sieving_primes = _small_primes(math.isqrt(b))
    found = []
    for low in range(a - a % SEGMENT, b + 1, SEGMENT):
        high = min(low + SEGMENT - 1, b + 1)           # bug: should be low + SEGMENT
        flags = bytearray([1]) * (high - low)
        for p in sieving_primes:
            if p * p >= high:
                break
            start = max(p * p, (low + p - 1) // p * p)
            flags[start - low::p] = bytes(len(range(start - low, high - low, p)))
        for offset in range(high - low):
            n = low + offset
            if flags[offset] and n >= max(a, 2):
                found.append(n)
    return found
