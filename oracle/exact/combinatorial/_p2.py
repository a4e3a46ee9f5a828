"""The second partial sieve term ``P2(x, a)``.

    P2(x, a) = sum_{y < p <= sqrt(x)} ( pi(x // p) - pi(p) + 1 )
             = sum_{y < p <= sqrt(x)} pi(x // p)  -  sum_{k=a+1}^{b} (k - 1),

with ``a = pi(y)``, ``b = pi(sqrt(x))``: the count of ``n <= x`` with exactly two
prime factors, both above ``y`` (Lehmer 1959, Illinois J. Math. 3; Deleglise
and Rivat 1996, Math. Comp. 65, section 3).  Every ``x // p`` lies in
``[sqrt(x), z]``, so the prime segments supply ``pi`` there.  Time
``O(z log log z)``, memory one segment.
"""

from __future__ import annotations

from math import isqrt

import numpy as np

from ._exact_sum import exact_sum
from ._parameters import LeafTables
from ._prime_segments import PrimeSegment
from ._prime_source import primes_between


class SecondPartialSieveTerm:
    """Accumulates ``sum pi(x // p)`` over the segments, then closes the formula."""

    def __init__(self, tables: LeafTables):
        self.t = tables
        self.root_x = isqrt(tables.x)
        self.sum_pi = 0
        self.prime_count = 0            # primes p seen in (y, sqrt(x)]

    def segment_part(self, segment: PrimeSegment) -> None:
        """Add ``pi(x // p)`` for the primes ``p`` with ``x // p`` in the segment."""
        x = self.t.x
        p_low = max(self.t.y, x // segment.hi) + 1         # x // p < hi  <=>  p > x // hi
        p_high = min(self.root_x, x // segment.lo)          # x // p >= lo <=> p <= x // lo
        p = primes_between(p_low, p_high)
        if p.size:
            self.sum_pi += exact_sum(segment.prime_pi(np.int64(x) // p), self.t.z)
            self.prime_count += int(p.size)

    def value(self) -> int:
        """``P2(x, a)``; call after every segment of ``[y + 1, z]`` was added."""
        a = self.t.a
        b = a + self.prime_count
        return self.sum_pi - (b * (b - 1) // 2 - a * (a - 1) // 2)
