"""Hard special leaves: the ones that need the partial sieve.

A special leaf is ``n = m p_(b+1)`` with ``m <= y < n``, ``mu(m) != 0`` and
``lpf(m) > p_(b+1)``; it contributes ``-mu(m) phi(x // n, b)`` to
``phi(x, a)`` (Deleglise and Rivat 1996, Math. Comp. 65, eq. (5)).  Its value
``v = x // n`` is at most ``z = x // y``.  A leaf is *hard* when
``phi(v, b)`` is not a plain prime count, i.e. when ``v >= p_(b+1)^2``
(otherwise :mod:`._easy_leaves` handles it).  This module takes

* every leaf of a prime ``p <= sqrt(y)`` (``m`` may be composite), and
* the leaves ``m = q`` prime, ``p > sqrt(y)``, with ``q <= x // p^3``,

and evaluates them with the segmented partial sieve of Lagarias, Miller and
Odlyzko (1985, Math. Comp. 44, section 4): the segments of ``[0, z]`` are
sieved in order, prime after prime, and ``phi(v, b)`` is the count carried
over from earlier segments plus a prefix count in the current one.

Time ``O(z log log z)`` for the sieving, ``O(segment / 768)`` per prime and
segment for the counts, ``O(1)`` (vectorised) per leaf; memory ``O(y + segment)``.
Valid for ``x <= 10**18``.

A run may start at a later segment (``start > 0``, for a worker process, see
:mod:`._parallel`).  The counts ``phi(start - 1, b)`` carried over from the
segments before are then unknown, and each enters the sum linearly: such a run
starts them at 0 and records in ``weights[b]`` the signed number of leaves of
``b`` it saw, so that the true sum is ``total + sum_b phi(start - 1, b) weights[b]``.
"""

from __future__ import annotations

from math import isqrt

import numpy as np

from ._exact_sum import exact_sum
from ._parameters import LeafTables
from ._partial_sieve import partial_sieve_type
from ._prime_source import count_primes_between
from ._quotients import floor_quotients


def _last_hard_index(tables: LeafTables) -> int:
    """The largest ``b`` that has hard leaves (``c - 1`` if there are none).

    For ``p = p_(b+1) <= sqrt(y)`` every leaf counts as hard; above, hard
    leaves need a prime ``q`` with ``max(p, y // p) < q <= x // p^3``.  Both
    conditions fail from some ``b`` on, so the hard ``b`` form an interval.
    """
    x, y = tables.x, tables.y
    root_y = isqrt(y)
    last = tables.c - 1
    for b in range(tables.c, tables.a):
        p = int(tables.primes[b])
        if p > root_y and x // p**3 <= max(p, y // p):
            break
        last = b
    return last


class HardLeaves:
    """Sum of the hard special leaves, computed one sieve segment at a time."""

    def __init__(self, tables: LeafTables, earlier: tuple[tuple[int, int], ...] = (),
                 kernel: str | None = None):
        """Sum the leaves of the segments after ``earlier``, the ``(lo, hi)`` that cover ``[0, start)``.

        ``kernel`` chooses the partial sieve's loops (see
        :func:`._partial_sieve.partial_sieve_type`): ``None`` (the default
        choice), ``"numpy"`` or ``"jit"``.
        """
        self.t = tables
        self.sieve_type = partial_sieve_type(tables.x, kernel)
        self.compiled = hasattr(self.sieve_type, "quotient_count_sum")
        self.last_b = _last_hard_index(tables)
        self.root_y = isqrt(tables.y)
        # The m that can ever appear with a prime above p_c: squarefree, lpf(m) > p_c.
        pc = int(tables.primes[tables.c - 1])
        # They are kept in two lists by the sign -mu(m) of their leaves.
        self.m_by_sign = []
        for mu in (-1, 1):
            candidates = np.flatnonzero((tables.mu == mu) & (tables.lpf > pc))
            self.m_by_sign.append((candidates.astype(np.int64), candidates.astype(np.float64),
                                   tables.lpf[candidates]))
        self.primes_float = tables.primes.astype(np.float64)
        if tables.c < 2:
            raise ValueError("the partial sieve needs c >= 2 (it skips multiples of 2 and 3)")
        self.initial_primes = tuple(int(p) for p in tables.primes[2:tables.c])
        count = max(0, self.last_b + 1)
        self.phi_before = [0] * count          # phi(lo - 1, b) for the active b
        self.active_top = tables.c - 1         # the active b form [c, active_top]
        self.pi_before = 0                     # pi(lo - 1), kept while activations remain
        self.total = 0
        if earlier:
            # The b activated by the segments before start: their counts are carried in.
            for lo, hi in earlier:
                self.active_top = max(self.active_top, self._top_for_segment(lo, hi))
            if self.active_top < self.last_b:
                self.pi_before = count_primes_between(0, earlier[-1][1] - 1)
        self.inherited_top = self.active_top   # phi(start - 1, b) unknown for b <= this
        self.weights = [0] * count             # signed leaf counts of those b

    def _top_for_segment(self, lo: int, hi: int) -> int:
        """The largest ``b`` whose hard leaves can lie in ``[lo, hi)`` or later."""
        t = self.t
        top = t.c - 1
        for b in range(t.c, self.last_b + 1):
            p = int(t.primes[b])
            if p > self.root_y and (p * p > hi - 1 or t.x // (p * p) < lo):
                break
            top = b
        return top

    def _leaf_runs(self, b: int, lo: int, hi: int) -> tuple[int, list[tuple]]:
        """The ``m`` of the hard leaves of ``b`` with values ``v = n // m`` in ``[lo, hi)``, ``n = x // p``.

        Returns ``(n, runs)``; each run ``(sign, m, m_float, m_lpf, first, last)``
        stands for the ``m[i]``, ``first <= i < last``, with ``m_lpf[i] > p``,
        whose leaves have ``-mu(m) = sign``.
        """
        t = self.t
        x, y, p = t.x, t.y, int(t.primes[b])
        m_low = max(y // p, x // (hi * p))               # m > m_low
        m_high = min(y, x // (max(lo, 1) * p))           # m <= m_high
        if p <= self.root_y:
            if m_high <= m_low:
                return x // p, []
            runs = []
            for sign, (m, m_float, m_lpf) in zip((1, -1), self.m_by_sign):
                first, last = np.searchsorted(m, (m_low, m_high), side="right")
                runs.append((sign, m, m_float, m_lpf, int(first), int(last)))
            return x // p, runs
        m_low = max(m_low, p)
        m_high = min(m_high, x // p**3)
        if m_high <= m_low:
            return x // p, []
        # m = q prime, -mu(q) = +1; lpf(q) = q > m_low >= p, so the primes serve as their own lpf.
        first, last = int(t.prime_count[m_low]), int(t.prime_count[m_high])
        return x // p, [(1, t.primes, self.primes_float, t.primes, first, last)]

    def _leaf_values(self, b: int, lo: int, hi: int) -> tuple[np.ndarray, int]:
        """Values ``v = x // (m p)`` in ``[lo, hi)`` of the hard leaves of ``b``.

        Returns ``(values, k)``: the first ``k`` leaves have ``-mu(m) = +1``, the
        others ``-mu(m) = -1``.
        """
        n, runs = self._leaf_runs(b, lo, hi)
        p = int(self.t.primes[b])
        parts = []
        for sign, m, m_float, m_lpf, first, last in runs:
            keep = m_lpf[first:last] > p
            parts.append(floor_quotients(n, m[first:last][keep], m_float[first:last][keep]))
        if not parts:
            return np.zeros(0, np.int64), 0
        plus = int(parts[0].size) if runs[0][0] == 1 else 0
        return np.concatenate(parts), plus

    def _signed_leaf_sum(self, sieve, b: int, lo: int, hi: int) -> tuple[int, int]:
        """``(sum of -mu(m) phi_segment(v), sum of -mu(m))`` over the hard leaves of ``b`` in ``[lo, hi)``."""
        if self.compiled:
            n, runs = self._leaf_runs(b, lo, hi)
            p = int(self.t.primes[b])
            total, signed_leaves = 0, 0
            for sign, m, _, m_lpf, first, last in runs:
                count_sum, number = sieve.quotient_count_sum(n, m, m_lpf, p, first, last)
                total += sign * count_sum
                signed_leaves += sign * number
            return total, signed_leaves
        values, plus = self._leaf_values(b, lo, hi)
        if not values.size:
            return 0, 0
        counts = sieve.count_up_to(values)              # each <= hi - lo
        return (exact_sum(counts[:plus], hi - lo) - exact_sum(counts[plus:], hi - lo),
                2 * plus - values.size)

    def add_segment(self, lo: int, hi: int) -> None:
        """Evaluate the hard leaves with values in ``[lo, hi)``."""
        t = self.t
        top = self._top_for_segment(lo, hi)
        if top < t.c:
            self._advance_prime_count(lo, hi)
            return
        for b in range(self.active_top + 1, top + 1):     # first segment of these b
            if lo == 0:
                self.phi_before[b] = 0
            else:                                         # lo - 1 < p_(b+1)^2 here
                self.phi_before[b] = max(1, 1 + self.pi_before - b)
        self.active_top = max(self.active_top, top)
        sieve = self.sieve_type(lo, hi, self.initial_primes)
        for b in range(t.c, top + 1):
            leaf_sum, signed_leaves = self._signed_leaf_sum(sieve, b, lo, hi)
            self.total += leaf_sum + self.phi_before[b] * signed_leaves
            if b <= self.inherited_top:
                self.weights[b] += signed_leaves
            self.phi_before[b] += sieve.survivors()
            if b < top:
                sieve.remove_multiples(int(t.primes[b]))
        self._advance_prime_count(lo, hi)

    def _advance_prime_count(self, lo: int, hi: int) -> None:
        if self.active_top < self.last_b:                 # activations still to come
            self.pi_before += count_primes_between(lo, hi - 1)
