"""Defective primes_in: a segmented sieve with segments of 10**6 that never looks at a segment's last number.

DEFECT: segments are [k * 10**6, (k + 1) * 10**6) but each is sieved up to its
last number exclusive, so every prime of the form k * 10**6 - 1 is lost: the
first is 2999999, then 5999999, 8999999, ...  Ranges containing no such prime
come out right.  Sieving primes are kept up to 10**6, so it claims b <= 10**12.
"""

import itertools
import math

SEGMENT = 10**6
_LIMIT = 10**6


def _small_primes(limit):
    flags = bytearray([1]) * (limit + 1)
    flags[0:2] = b"\x00\x00"
    for p in range(2, math.isqrt(limit) + 1):
        if flags[p]:
            flags[p * p::p] = bytes(len(range(p * p, limit + 1, p)))
    return [p for p in range(limit + 1) if flags[p]]


_SIEVING = _small_primes(_LIMIT)


def _sieve(low, high):
    """The primes of [low, high] (high - low < 10**6, high <= 10**12)."""
    flags = bytearray([1]) * (high - low + 1)
    for p in _SIEVING:
        if p * p > high:
            break
        start = max(p * p, (low + p - 1) // p * p)
        flags[start - low::p] = bytes(len(range(start - low, high - low + 1, p)))
    if low < 2:
        flags[:2 - low] = bytes(min(2 - low, len(flags)))
    return list(itertools.compress(range(low, high + 1), flags))


def primes_in(a, b):
    a = max(a, 0)
    found = []
    low = a
    while low <= b:
        end = (low // SEGMENT + 1) * SEGMENT - 1      # the segment's last number
        high = min(end, b)
        top = high - 1 if high == end else high      # bug: the last number is never examined
        if top >= low:
            found.extend(_sieve(low, top))
        low = high + 1
    return found
