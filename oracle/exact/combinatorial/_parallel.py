"""pi(x) by the Deleglise-Rivat stages, with the costly sums spread over worker processes.

The two costly stages are sums over segments, and each segment's share is
*linear* in the state carried over from the segments before it:

* easy leaves and ``P2`` (:mod:`._easy_leaves`, :mod:`._p2`) look up
  ``pi(v) = pi(lo - 1) + (primes of [lo, v])`` in the prime segments of
  ``[y + 1, z]``.  A block of segments is computed with ``pi(lo - 1)`` taken
  as 0 and reports how many look-ups it made; the true share adds
  ``pi(lo - 1)`` once per look-up, and ``pi(lo - 1)`` is ``pi(y)`` plus the
  primes the blocks before it found.
* hard special leaves (:mod:`._hard_leaves`) carry ``phi(lo - 1, b)`` from
  segment to segment.  A block starting at ``lo > 0`` takes the inherited
  counts as 0 and reports, per ``b``, the signed number of leaves it met and
  the survivors it sieved; the blocks are then joined in order, each adding
  ``phi(lo - 1, b)`` times its signed leaf count.

So the answer is the single-process sum, regrouped; every term is an exact
Python or bounded ``int64`` integer, and both paths give the same integer.
The blocks run in a pool of processes started by ``forkserver`` (``spawn``
where that is missing), never by plain ``fork``: a forked copy of a process
whose libraries hold threads (primecountpy's pool, for one) can deadlock.
The pool is made on first use and kept for later calls.  As with every use of
``spawn`` or ``forkserver``, a script calling this must keep its top-level
work under ``if __name__ == "__main__":``.

While the workers run, the calling process computes the cheap stages and
calls ``report(fraction, stage)`` a few times per second, so a progress
display keeps moving and a time budget (which raises from ``report``) stops
the run; the workers are then terminated.
"""

from __future__ import annotations

import atexit
import multiprocessing
import os
from functools import lru_cache

from ._deleglise_rivat import (PRIME_SEGMENT_LIMIT, default_alpha, default_segment_size)
from ._easy_leaves import EasyLeaves
from ._hard_leaves import HardLeaves
from ._p2 import SecondPartialSieveTerm
from ._parameters import choose_y, prepare
from ._partial_sieve import SEGMENT_GRANULE, PartialSieve, partial_sieve_type
from ._phi import ordinary_leaves
from ._prime_segments import prime_segments

__all__ = ["MIN_PARALLEL_X", "default_workers", "prime_pi_in_workers"]

#: Below this x one process answers by default: starting workers (about 0.3 s)
#: would cost more than they save (prime_pi(10**13) takes about 0.5 s alone).
MIN_PARALLEL_X = 10**13

#: Blocks per worker and stage: more blocks even out the uneven cost of the segments.
BLOCKS_PER_WORKER = 8

#: The first hard-leaf segment is the usual length divided by this.
_FIRST_SEGMENT_DIVISOR = 64

#: Seconds between two calls of ``report`` while waiting for the workers.
_POLL_SECONDS = 0.2

#: Share of the progress fraction given to the hard leaves (the rest: easy leaves and P2).
_HARD_SHARE = 0.6


def available_cores() -> int:
    """Cores this process may run on."""
    try:
        return len(os.sched_getaffinity(0))
    except (AttributeError, OSError):
        return os.cpu_count() or 1


def may_start_workers() -> bool:
    """Whether this process may start worker processes.

    Not in a multiprocessing child (no pools inside pools), and not while one
    is still starting: a ``spawn`` or ``forkserver`` child re-runs the calling
    script's top level, and a script without the ``__main__`` guard would
    otherwise start workers from each worker, for ever.  multiprocessing marks
    that phase with ``current_process()._inheriting``.
    """
    if multiprocessing.parent_process() is not None:
        return False
    return not getattr(multiprocessing.current_process(), "_inheriting", False)


def default_workers(x: int) -> int:
    """Worker processes used when the caller does not say: all cores from ``MIN_PARALLEL_X`` on."""
    if x < MIN_PARALLEL_X or not may_start_workers():
        return 1
    return available_cores()


# --------------------------------------------------------------------------- #
# What a worker runs
# --------------------------------------------------------------------------- #

@lru_cache(maxsize=1)
def _tables(x: int, y: int):
    """The shared tables, built once per worker process and ``(x, y)``."""
    return prepare(x, y)


def _hard_block(x: int, y: int, segments: tuple[tuple[int, int], ...], first: int, stop: int,
                kernel: str):
    """Hard leaves of ``segments[first:stop]``, with the counts inherited from the earlier ones 0."""
    hard = HardLeaves(_tables(x, y), earlier=segments[:first], kernel=kernel)
    for lo, hi in segments[first:stop]:
        hard.add_segment(lo, hi)
    top = hard.inherited_top
    return hard.total, top, hard.weights[:top + 1], hard.phi_before, hard.active_top


def _table_block(x: int, y: int, first: int, stop: int) -> int:
    """Easy leaves with values ``<= y`` of the primes ``p`` of rows ``[first, stop)``."""
    return EasyLeaves(_tables(x, y)).table_part(first, stop)


def _easy_block(x: int, y: int, size: int, start: int, stop: int):
    """Easy leaves and P2 of the prime segments of ``[start, stop]``, with ``pi(start - 1)`` taken as 0."""
    tables = _tables(x, y)
    easy, p2 = EasyLeaves(tables), SecondPartialSieveTerm(tables)
    easy_sum, primes_found = 0, 0
    for segment in prime_segments(start, stop, 0, size):
        easy_sum += easy.segment_part(segment)
        p2.segment_part(segment)
        primes_found = segment.pi_before + segment.prime_total
    return easy_sum, easy.lookups, p2.sum_pi, p2.prime_count, primes_found


# --------------------------------------------------------------------------- #
# The pool
# --------------------------------------------------------------------------- #

_pool = None            # (workers, multiprocessing pool), made on first use


def _context():
    """``forkserver`` where the platform has it, else ``spawn``; never plain ``fork``."""
    if "forkserver" in multiprocessing.get_all_start_methods():
        context = multiprocessing.get_context("forkserver")
        context.set_forkserver_preload([__name__])      # workers start with numpy imported
        return context
    return multiprocessing.get_context("spawn")


def _get_pool(workers: int):
    global _pool
    if _pool is not None and _pool[0] != workers:
        _discard_pool()
    if _pool is None:
        _pool = (workers, _context().Pool(workers))
    return _pool[1]


def _discard_pool() -> None:
    """Stop the workers now (after a failure or an exceeded budget, or at exit)."""
    global _pool
    if _pool is not None:
        _pool[1].terminate()
        _pool[1].join()
        _pool = None


atexit.register(_discard_pool)


# --------------------------------------------------------------------------- #
# Splitting and joining
# --------------------------------------------------------------------------- #

def _growing_segments(z: int, size: int) -> tuple[tuple[int, int], ...]:
    """Segments ``[lo, hi)`` covering ``[0, z]``: short at first, doubling up to ``size``.

    Most hard leaves have small values, so the first segments are the costly
    ones; short ones there let the work be shared evenly.
    """
    length = max(SEGMENT_GRANULE, size // _FIRST_SEGMENT_DIVISOR // SEGMENT_GRANULE * SEGMENT_GRANULE)
    segments, lo = [], 0
    while lo <= z:
        segments.append((lo, lo + length))
        lo += length
        length = min(size, 2 * length)
    return tuple(segments)


def _easy_runs(y: int, z: int, pieces: int) -> list[tuple[int, int]]:
    """Cut ``[y + 1, z]`` into ``pieces`` closed runs of about equal cost.

    The easy leaves with values near ``v`` thin out like ``1 / v**2`` (for each
    ``p`` the primes ``q`` with ``x // (p q)`` near ``v``); the prime segments
    cost the same everywhere.  Half of the cost is given to each: the run ends
    solve ``(1/y - 1/v) / (1/y - 1/z) + (v - y) / (z - y) = 2 k / pieces``.
    """
    def share(v: float) -> float:
        return (1 / y - 1 / v) / (1 / y - 1 / z) + (v - y) / (z - y)

    ends = []
    for k in range(1, pieces):
        low, high = float(y), float(z)
        for _ in range(100):
            middle = (low + high) / 2
            low, high = (middle, high) if share(middle) < 2 * k / pieces else (low, middle)
        ends.append(int(high))
    bounds = sorted({y} | {v for v in ends if y < v < z} | {z})
    return [(lo + 1, hi) for lo, hi in zip(bounds[:-1], bounds[1:])]


def _split(count: int, pieces: int) -> list[tuple[int, int]]:
    """Cut ``range(count)`` into up to ``pieces`` consecutive runs ``[first, stop)``."""
    pieces = max(1, min(pieces, count))
    bounds = [count * k // pieces for k in range(pieces + 1)]
    return list(zip(bounds[:-1], bounds[1:]))


def _join_hard_blocks(results, c: int) -> int:
    """The hard-leaf sum from the blocks' results, joined in order (see the module docstring)."""
    carried: list[int] = []            # phi(lo - 1, b) at the start of the next block
    total, active_before = 0, c - 1
    for block_total, inherited_top, weights, phi_end, active_top in results:
        if len(carried) < len(phi_end):
            carried += [0] * (len(phi_end) - len(carried))
        if inherited_top != active_before:
            raise AssertionError("hard-leaf blocks disagree on the primes carried over")
        total += block_total + sum(carried[b] * weights[b] for b in range(c, inherited_top + 1))
        for b in range(c, inherited_top + 1):
            carried[b] += phi_end[b]
        for b in range(inherited_top + 1, active_top + 1):
            carried[b] = phi_end[b]
        active_before = active_top
    return total


def prime_pi_in_workers(x: int, workers: int, *, segment_size: int | None = None,
                        report=None, kernel: str | None = None) -> int:
    """``pi(x)`` for ``27 <= x <= 10**18`` with the costly stages in ``workers`` processes.

    The same integer as :func:`._deleglise_rivat.prime_pi_deleglise_rivat`;
    ``segment_size`` and ``kernel`` as there (the kernel is chosen here, in
    the calling process, so ``NTORACLE_JIT`` is read where the user set it).
    ``report(fraction, stage)`` is called a few times per second; if it
    raises, the workers are stopped and the error passes on.
    """
    y = choose_y(x, default_alpha(x))
    tables = prepare(x, y)
    size = default_segment_size(x, y) if segment_size is None else segment_size
    if size <= 0 or size % SEGMENT_GRANULE:
        raise ValueError(f"segment_size must be a positive multiple of {SEGMENT_GRANULE}")
    kernel = "jit" if partial_sieve_type(x, kernel) is not PartialSieve else "numpy"
    z, pieces = tables.z, BLOCKS_PER_WORKER * workers
    prime_size = min(size, PRIME_SEGMENT_LIMIT)
    segments = _growing_segments(z, size) if segment_size is None else tuple(
        (lo, lo + size) for lo in range(0, z + 1, size))
    easy_runs = _easy_runs(y, z, pieces) if z > y else []
    leaves = EasyLeaves(tables)
    pool = _get_pool(workers)
    try:
        if report is not None:
            report(0.0, "tables")
        table = [pool.apply_async(_table_block, (x, y, first, stop))
                 for first, stop in leaves.table_rows_by_cost(pieces)]
        hard = [pool.apply_async(_hard_block, (x, y, segments, first, stop, kernel))
                for first, stop in _split(len(segments), pieces)]
        easy = [pool.apply_async(_easy_block, (x, y, prime_size, start, stop))
                for start, stop in easy_runs]
        phi = ordinary_leaves(x, y, tables.c, tables.lpf, tables.mu) + leaves.trivial
        _wait(hard, table + easy, report)
        phi += sum(result.get() for result in table)
        phi += _join_hard_blocks([result.get() for result in hard], tables.c)
        pi_before, p2_sum, p2_primes = tables.a, 0, 0
        for result in easy:
            easy_sum, lookups, sum_pi, primes_p2, primes_found = result.get()
            phi += easy_sum + pi_before * lookups
            p2_sum += sum_pi + pi_before * primes_p2
            p2_primes += primes_p2
            pi_before += primes_found
    except BaseException:
        _discard_pool()
        raise
    p2 = SecondPartialSieveTerm(tables)
    p2.sum_pi, p2.prime_count = p2_sum, p2_primes
    return phi + tables.a - 1 - p2.value()


def _wait(hard: list, others: list, report) -> None:
    """Wait for every block, calling ``report`` every ``_POLL_SECONDS``.

    The fraction done weights the hard-leaf blocks by ``_HARD_SHARE``.
    """
    pending = hard + others
    while pending:
        pending[0].wait(_POLL_SECONDS)
        pending = [result for result in pending if not result.ready()]
        if report is not None:
            hard_done = sum(result.ready() for result in hard) / max(1, len(hard))
            others_done = sum(result.ready() for result in others) / max(1, len(others))
            stage = "hard special leaves" if hard_done < 1 else "easy leaves and P2"
            report(_HARD_SHARE * hard_done + (1 - _HARD_SHARE) * others_done,
                   f"{stage} in worker processes ({len(pending)} blocks left)")
