"""Prime counts at many points of ``[start, stop]``, one segment at a time.

The easy leaves and ``P2`` need ``pi(v)`` for millions of values ``v`` between
``y`` and ``z = x // y``: too far for one table, too many for one count each.
The interval is cut into segments ``[lo, hi)``; each keeps its primes as a
bitmap of the odd numbers in 64-bit words, with the count of primes before
each word, so that

    pi(v) = pi(lo - 1) + primes_before[word] + popcount(bits[word] below v)

costs two look-ups per value.  Time
``O((z - y) log log z)`` for the primes, ``O(1)`` per value; memory
``segment / 8`` bytes.  Needs ``start >= 3`` (the bitmap has no place for 2).
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Iterator

import numpy as np

from ._prime_source import primes_between

_WORD = np.dtype("<u8")                                  # little-endian: bit i is 2**i
_BELOW = (np.uint64(1) << np.arange(64, dtype=np.uint64)) - np.uint64(1)   # bits < r


@dataclass(frozen=True)
class PrimeSegment:
    lo: int
    hi: int
    pi_before: int          # pi(lo - 1)
    base: int               # lo rounded down to even; bit i is the odd number base + 2 i + 1
    words: np.ndarray       # the bitmap, little-endian uint64, one guard word at the end
    primes_before: np.ndarray  # primes in the words before each word (int32: < segment size)

    @classmethod
    def build(cls, lo: int, hi: int, pi_before: int) -> "PrimeSegment":
        if lo < 3:
            raise ValueError("prime segments start at 3 or later")
        base = lo - lo % 2
        primes = primes_between(lo, hi - 1)
        word_total = -(-(hi - base) // 128)
        flags = np.zeros(64 * (word_total + 1), dtype=bool)
        flags[(primes - base - 1) >> 1] = True
        words = np.packbits(flags, bitorder="little").view(_WORD)
        primes_before = np.zeros(word_total + 1, dtype=np.int32)
        np.cumsum(np.bitwise_count(words[:word_total]), out=primes_before[1:])
        return cls(lo, hi, pi_before, base, words, primes_before)

    @property
    def prime_total(self) -> int:
        return int(self.primes_before[-1])

    def prime_pi(self, values: np.ndarray) -> np.ndarray:
        """``pi(v)`` for every ``v`` in ``[lo, hi)``."""
        odd_count = (values - self.base + 1) >> 1        # odd numbers in [base, v]
        word = odd_count >> 6
        inside = np.bitwise_count(self.words[word] & _BELOW[odd_count & 63])
        return self.primes_before[word].astype(np.int64) + inside + np.int64(self.pi_before)


def prime_segments(start: int, stop: int, pi_before_start: int,
                   segment_size: int) -> Iterator[PrimeSegment]:
    """Segments covering ``[start, stop]``; ``pi_before_start`` is ``pi(start - 1)``."""
    lo, pi_before = start, pi_before_start
    while lo <= stop:
        hi = min(lo + segment_size, stop + 1)
        segment = PrimeSegment.build(lo, hi, pi_before)
        yield segment
        pi_before += segment.prime_total
        lo = hi
