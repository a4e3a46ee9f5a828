"""Easy and trivial special leaves: the ones that are prime counts.

For ``p = p_(b+1) > sqrt(y)`` the special leaves are ``n = p q`` with ``q``
prime, ``max(p, y // p) < q <= y``, each contributing ``+phi(x // (p q), b)``
(Deleglise and Rivat 1996, Math. Comp. 65, section 4).  With ``v = x // (p q)``:

* ``v < p``   (``q > x // p^2``):  ``phi(v, b) = 1`` -- a *trivial* leaf,
  counted per ``p`` as a difference of two values of ``pi``;
* ``p <= v < p^2`` (``x // p^3 < q <= x // p^2``):  the survivors ``<= v``
  are 1 and the primes in ``(p_b, v]``, so ``phi(v, b) = pi(v) - b + 1`` --
  an *easy* leaf.  ``pi(v)`` comes from the table when ``v <= y`` and from
  the prime segments of :mod:`._prime_segments` when ``y < v <= z``;
* ``v >= p^2``: hard, see :mod:`._hard_leaves`.

Time ``O(1)`` per easy leaf (a table or segment look-up), vectorised over the
``(p, q)`` pairs, and fewer look-ups than leaves where the hyperbola method
applies (:meth:`EasyLeaves.table_part`); memory bounded by ``PAIRS_PER_BATCH``.
Valid for ``x <= 10**18``: every product below stays under ``2**63``.
"""

from __future__ import annotations

from math import isqrt

import numpy as np

from ._exact_sum import exact_sum
from ._flatten import chunks_by_total, flat_ranges
from ._parameters import LeafTables
from ._prime_segments import PrimeSegment
from ._quotients import FLOAT_EXACT_LIMIT, floor_quotients

#: Upper limit of (p, q) pairs expanded at once (memory ~ 50 bytes per pair).
PAIRS_PER_BATCH = 1 << 22

#: A prime ``p`` with at least this many easy leaves is handled on its own.
LONG_ROW = 256


class EasyLeaves:
    """Trivial and easy special leaves of the primes ``p > sqrt(y)``."""

    def __init__(self, tables: LeafTables):
        t = self.t = tables
        x, y = t.x, t.y
        first_b = max(t.c, int(t.prime_count[isqrt(y)]))
        b = np.arange(first_b, t.a, dtype=np.int64)
        p = t.primes[first_b:t.a]
        self.b, self.p = b, p
        self.primes_float = t.primes.astype(np.float64)
        pi = t.prime_count
        x64 = np.int64(x)
        x_over_p2 = x64 // p // p
        q_floor = np.maximum(p, y // p)                       # q > q_floor
        lower = np.minimum(np.maximum(q_floor, x_over_p2 // p), y)
        upper = np.minimum(x_over_p2, y)
        trivial_floor = np.minimum(np.maximum(q_floor, x_over_p2), y)
        self.trivial = int(t.a * b.size - pi[trivial_floor].astype(np.int64).sum())
        self.low = pi[lower].astype(np.int64)                 # easy q = primes[low:high]
        self.high = np.maximum(pi[upper].astype(np.int64), self.low)
        split = x64 // (y + 1) // p                           # q <= split  <=>  v > y
        self.split = np.clip(pi[np.minimum(split, y)].astype(np.int64), self.low, self.high)
        self.segmented = np.flatnonzero(self.split > self.low)
        self.lookups = 0                    # values v looked up in prime segments so far

    def table_rows_by_cost(self, pieces: int) -> list[tuple[int, int]]:
        """Runs ``[first, stop)`` of the primes ``p`` whose table parts cost about the same.

        A row of ``k`` leaves costs about ``min(k, sqrt(x / p))`` look-ups
        (the hyperbola method of :meth:`table_part`).
        """
        counts = (self.high - self.split).astype(np.float64)
        cost = np.minimum(counts, np.sqrt(float(self.t.x) / self.p.astype(np.float64)))
        cumulative = np.cumsum(cost)
        if cost.size == 0 or cumulative[-1] <= 0:
            return [(0, cost.size)]
        targets = cumulative[-1] * np.arange(1, pieces) / pieces
        ends = sorted({int(e) for e in np.searchsorted(cumulative, targets) + 1} - {0, cost.size})
        bounds = [0] + ends + [cost.size]
        return list(zip(bounds[:-1], bounds[1:]))

    def table_part(self, first: int = 0, stop: int | None = None) -> int:
        """Easy leaves with ``v <= y``: ``sum (pi(v) - b + 1)`` from the pi table.

        Only the primes ``p = self.p[first:stop]`` when given (a worker's share).

        For one ``p`` put ``N = x // p``; the leaves are ``pi(N // q)`` over a run of
        primes ``q``.  Below ``sqrt(N)`` they are summed directly; above, the
        hyperbola method counts the same pairs ``(q, r)`` of primes with
        ``q r <= N`` by ``r`` instead, and the ``r`` are far fewer
        (Dirichlet 1849; the idea behind the clustered easy leaves of
        Deleglise and Rivat 1996, section 4).
        """
        t = self.t
        counts = self.high - self.split
        if first or stop is not None:
            share = np.zeros(counts.size, dtype=bool)
            share[first:stop] = True
            counts = np.where(share, counts, 0)
        total = exact_sum((1 - self.b) * counts, t.a * t.y)
        rows = np.flatnonzero(counts > 0)
        quotient = np.int64(t.x) // self.p[rows]                   # N = x // p
        start, stop = self.split[rows], self.high[rows]             # q = primes[start:stop]
        root = np.floor(np.sqrt(quotient.astype(np.float64))).astype(np.int64)
        middle = np.clip(t.prime_count[np.minimum(root, t.y)], start, stop)
        total += self._sum_prime_count_of_quotients(quotient, start, middle)
        dual = middle < stop
        quotient, middle, stop = quotient[dual], middle[dual], stop[dual]
        # r <= N // q_last: every q of the run pairs with r;  r <= N // q_first: some do.
        r_full = t.prime_count[np.minimum(quotient // t.primes[stop - 1], t.y)].astype(np.int64)
        r_some = t.prime_count[np.minimum(quotient // t.primes[middle], t.y)].astype(np.int64)
        total += exact_sum(r_full * (stop - middle), t.a * t.a)
        total -= exact_sum((r_some - r_full) * middle, t.a * t.a)
        total += self._sum_prime_count_of_quotients(quotient, r_full, r_some)
        return total

    def _sum_prime_count_of_quotients(self, quotient: np.ndarray, start: np.ndarray,
                                      stop: np.ndarray) -> int:
        """``sum_j sum_{start_j <= k < stop_j} pi(quotient_j // primes[k])``, all values <= y."""
        t = self.t
        counts = np.maximum(stop - start, 0)
        total = 0
        long_rows = counts >= LONG_ROW
        for j in np.flatnonzero(long_rows).tolist():
            # One quotient, a contiguous run of primes: no index expansion needed.
            run = slice(start[j], stop[j])
            values = floor_quotients(int(quotient[j]), t.primes[run], self.primes_float[run])
            total += exact_sum(t.prime_count[values], t.y)
        short = np.flatnonzero(~long_rows & (counts > 0))
        for first, last in chunks_by_total(counts[short], PAIRS_PER_BATCH):
            rows = short[first:last]
            index, owner = flat_ranges(start[rows], counts[rows])
            numerators = quotient[rows][owner]
            if int(quotient[rows].max()) < FLOAT_EXACT_LIMIT:      # exact, see _quotients
                values = (numerators.astype(np.float64) / self.primes_float[index]).astype(np.int64)
            else:
                values = numerators // t.primes[index]
            total += exact_sum(t.prime_count[values], t.y)
        return total

    def segment_part(self, segment: PrimeSegment) -> int:
        """Easy leaves with ``v`` in the segment: ``sum (pi(v) - b + 1)``."""
        t = self.t
        chosen = self.segmented
        if chosen.size == 0:
            return 0
        p = self.p[chosen]
        x64 = np.int64(t.x)
        pi = t.prime_count
        first = np.maximum(self.low[chosen], pi[np.minimum(x64 // segment.hi // p, t.y)])
        last = np.minimum(self.split[chosen], pi[np.minimum(x64 // segment.lo // p, t.y)])
        counts = np.maximum(last - first, 0)
        total = exact_sum((1 - self.b[chosen]) * counts, t.a * t.y)
        self.lookups += int(counts.sum())
        for start, stop in chunks_by_total(counts, PAIRS_PER_BATCH):
            if not counts[start:stop].any():
                continue
            index, owner = flat_ranges(first[start:stop], counts[start:stop])
            values = x64 // (p[start:stop][owner] * t.primes[index])
            total += exact_sum(segment.prime_pi(values), t.z)
        return total
