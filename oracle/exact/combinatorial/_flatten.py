"""Expanding many index ranges into one flat index array (a numpy idiom).

``flat_ranges([3, 10], [2, 3])`` is ``[3, 4, 10, 11, 12]``, with the owner of
each entry ``[0, 0, 1, 1, 1]``.  It lets one vectorised pass visit the pairs
``(p, q)`` of many primes ``p`` at once.
"""

from __future__ import annotations

import numpy as np


def flat_ranges(starts: np.ndarray, counts: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """Indices ``starts[j] + k`` for ``0 <= k < counts[j]``, and the ``j`` of each."""
    counts = np.asarray(counts, dtype=np.int64)
    owner = np.repeat(np.arange(counts.size, dtype=np.int64), counts)
    offsets = np.cumsum(counts) - counts              # exclusive prefix sums
    index = np.arange(owner.size, dtype=np.int64) - offsets[owner] + np.asarray(starts, np.int64)[owner]
    return index, owner


def chunks_by_total(counts: np.ndarray, limit: int) -> list[tuple[int, int]]:
    """Split ``range(len(counts))`` into consecutive pieces with ``sum(counts) <= limit``
    each (a single entry above ``limit`` forms its own piece)."""
    pieces: list[tuple[int, int]] = []
    cumulative = np.cumsum(counts, dtype=np.int64)
    start, done = 0, 0
    n = len(counts)
    while start < n:
        stop = int(np.searchsorted(cumulative, done + limit, side="right"))
        stop = max(stop, start + 1)
        pieces.append((start, stop))
        done = int(cumulative[stop - 1])
        start = stop
    return pieces
