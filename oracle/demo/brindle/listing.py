"""Listing the primes of an interval with a segmented sieve of Eratosthenes.

The numbers are sieved in segments of SEGMENT = 2**15, aligned on multiples
of SEGMENT, so that one segment's flags fit the 32 KB buffer of the 1994 C
version (and the cache of today's machines).  Sieving primes come from the
prime table, which covers every square root up to 2**32.
"""

import bisect
import itertools
import math

from .table import prime_list

SEGMENT = 2**15
LISTING_LIMIT = 2**32


def sieve_segment(low: int, high: int) -> list:
    """The primes p with low <= p < high."""
    flags = bytearray([1]) * (high - low)
    for n in range(low, min(high, 2)):
        flags[n - low] = 0
    primes = prime_list()
    for p in primes[:bisect.bisect_right(primes, math.isqrt(high - 1))]:
        first = max(p * p, (low + p - 1) // p * p)
        if first < high:
            flags[first - low::p] = bytes(len(range(first, high, p)))
    return list(itertools.compress(range(low, high), flags))


def primes_in(a: int, b: int) -> list:
    """All primes p with a <= p <= b, ascending (empty when b < a)."""
    for name, value in (("a", a), ("b", b)):
        if not isinstance(value, int) or isinstance(value, bool):
            raise TypeError(f"{name} must be an int, got {type(value).__name__}")
        if not 0 <= value <= LISTING_LIMIT:
            raise ValueError(f"{name}={value}: primes_in needs 0 <= a, b <= 2**32")
    found = []
    segment_start = a // SEGMENT * SEGMENT
    while segment_start <= b:
        segment_last = segment_start + SEGMENT - 1          # last number of this segment
        found.extend(sieve_segment(segment_start, segment_last))
        segment_start += SEGMENT
    return [p for p in found if a <= p <= b]
