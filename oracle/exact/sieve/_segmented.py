"""Our own segmented sieve of Eratosthenes over the odd numbers, in numpy.

Method: the sieve of Eratosthenes, run segment by segment over ``[a, b]`` as
described by Bays and Hudson (1977, "The segmented sieve of Eratosthenes and
primes in arithmetic progressions to 10^12", BIT 17; citation from memory).  Each segment
holds one byte per odd number.  It starts as a copy of a pre-sieved pattern in
which the multiples of the wheel primes 3..19 are already struck out (the
pattern repeats every 3*5*7*11*13*17*19 odd numbers); the other odd primes
``p <= isqrt(b)`` then strike their odd multiples from ``max(p*p, a)`` on.
Those sieving primes come from this same sieve, recursively.

Every pattern in :mod:`._constellations` has even offsets and none contains
2, so the constellations are found by AND-ing the segment with itself shifted
by ``d/2`` bytes for each offset ``d``.  Consecutive segments overlap by the
largest such shift, so a tuple that straddles a segment boundary is seen whole
by the segment that owns its first entry; a tuple that runs past ``b`` is
never counted.

Cost: time O((b - a) log log b + sqrt(b)) plus, per segment, O(pi(sqrt(b)))
vectorised work to place the large sieving primes.  Memory: one segment of
:data:`SEGMENT_LENGTH` bytes plus the sieving primes as ``uint32``; at ``b``
near 2**64 these are pi(2**32) = 203,280,221 primes, 813 MB.

Short intervals high up.  When ``[a, b]`` is short beside ``sqrt(b)`` (see
:func:`_sieves_by_small_primes_only`), generating every prime below
``sqrt(b)`` would cost far more than the interval itself.  The segment is then
struck by the odd primes below :data:`SMALL_PRIME_LIMIT` only, and each
survivor ``n >= SMALL_PRIME_LIMIT**2`` -- a number with no prime factor below
the limit, which may still be a product of larger primes, a prime square
included -- is decided by the strong (Miller-Rabin) test to the prime bases
that are proven sufficient below ``psi_12`` = 3.18 * 10**23 (OEIS A014233),
through :func:`oracle.exact.primality.is_prime_batch`.  Every ``n < 2**64``
lies below ``psi_12``, so the answers are proven, exactly as by the full sieve.
Cost: about ``(b - a) * e**-gamma / ln(SMALL_PRIME_LIMIT)`` survivors (Mertens'
third theorem; about 5 % of the interval), each one strong test, the primes
among them twelve; memory one segment.
Valid range: ``0 <= a <= b < 2**64``.  All arithmetic near 2**64 is done with
Python ints or with ``uint64`` quantities proven below 2**64 (``p < 2**32``,
so ``p*p < 2**64``; ``isqrt`` is exact, no floating-point square roots).
"""

from __future__ import annotations

import itertools
from functools import cache
from math import isqrt, prod

import numpy as np

from ..primality import is_prime_batch
from ._constellations import KINDS, PATTERNS

__all__ = ["SegmentedSieveEngine", "SEGMENT_LENGTH", "SMALL_PRIME_LIMIT"]

#: Odd numbers per segment (one byte each), 4 MiB.
SEGMENT_LENGTH = 2**22

_WHEEL_PRIMES = (3, 5, 7, 11, 13, 17, 19)
_WHEEL_PERIOD = prod(_WHEEL_PRIMES)          # in odd numbers

#: Largest shift (in odd numbers) any pattern needs beyond its first entry.
_TUPLE_REACH = max(offsets[-1] for offsets in PATTERNS.values()) // 2

#: Sieving primes up to this bound strike a segment in a Python loop of
#: strided slices; larger ones are placed by vectorised index arithmetic.
_LOOP_PRIME_LIMIT = SEGMENT_LENGTH // 8

#: Below this bound the sieving primes come from a plain (unsegmented) sieve.
_PLAIN_SIEVE_LIMIT = 2**22

#: On a short interval high up only the primes below this bound sieve; the
#: survivors are proven by the strong test.
SMALL_PRIME_LIMIT = 2**16

#: Roughly how many integers up to ``sqrt(b)`` the base sieve (with the placing
#: of its primes in each segment) handles in the time the strong tests cost per
#: integer of the interval: measured here, about 0.3 us per integer of the
#: interval; at b = 10**16 and b - a = 10**6 both routes take 0.19 s, at
#: b = 10**18 and b - a = 10**7 the proof route takes 2.1 s, the full one 5.1 s.
#: The proof route is taken when the interval is shorter than ``sqrt(b)`` / this.
_PROOF_TO_SIEVE_COST = 100


@cache
def _wheel_pattern() -> np.ndarray:
    """Bytes for the odd numbers 1, 3, 5, ...: True when coprime to 3*5*...*19.

    Long enough to copy any segment from any phase of the period.
    """
    pattern = np.ones(_WHEEL_PERIOD + SEGMENT_LENGTH + _TUPLE_REACH, dtype=bool)
    for q in _WHEEL_PRIMES:
        pattern[(q - 1) // 2::q] = False      # odd multiples q, 3q, 5q, ...
    return pattern


def _plain_odd_primes(limit: int) -> np.ndarray:
    """Odd primes ``3 <= p <= limit`` by an unsegmented sieve (``uint32``)."""
    if limit < 3:
        return np.zeros(0, dtype=np.uint32)
    is_prime = np.ones((limit - 1) // 2 + 1, dtype=bool)   # index i <-> 2i + 1
    is_prime[0] = False
    for i in range(1, (isqrt(limit) - 1) // 2 + 1):
        if is_prime[i]:
            p = 2 * i + 1
            is_prime[(p * p) // 2::p] = False
    return (2 * np.flatnonzero(is_prime) + 1).astype(np.uint32)


def _sieving_prime_chunks(limit: int):
    """Yield the odd primes ``3 <= p <= limit`` (``limit < 2**32``) as ascending ``uint32`` chunks.

    The first chunk holds every prime up to ``min(limit, _PLAIN_SIEVE_LIMIT)``.
    """
    yield _plain_odd_primes(min(limit, _PLAIN_SIEVE_LIMIT))
    if limit > _PLAIN_SIEVE_LIMIT:
        for lo, flags, owned in _sieved_segments(_PLAIN_SIEVE_LIMIT + 1, limit):
            offsets = np.flatnonzero(flags[:owned]).astype(np.uint32)
            yield np.uint32(lo) + np.uint32(2) * offsets


def _first_indices(lo: int, primes: np.ndarray) -> np.ndarray:
    """For each odd prime p, the index j of the first odd multiple lo + 2j >= max(lo, p*p).

    ``lo`` is odd and below 2**64, every ``p`` below 2**32 (so ``p*p`` fits ``uint64``).
    """
    p = primes.astype(np.uint64)
    lo_u = np.uint64(lo)
    offset = (p - lo_u % p) % p                 # lo + offset is the first multiple >= lo
    offset = np.where(offset & np.uint64(1), offset + p, offset)   # make it an odd multiple
    index = offset >> np.uint64(1)
    if len(p) and p[-1] * p[-1] > lo_u:         # some p*p lie beyond lo (primes ascend)
        square = p * p
        late = square > lo_u
        index[late] = (square[late] - lo_u) >> np.uint64(1)
    return index.astype(np.int64)


def _sieves_by_small_primes_only(first_odd: int, last: int) -> bool:
    """Whether ``[first_odd, last]`` is short enough beside ``sqrt(last)`` for the proof route.

    The base sieve costs about ``sqrt(last)`` steps, the strong tests about
    ``_PROOF_TO_SIEVE_COST`` steps per integer of the interval.
    """
    root = isqrt(last)
    return root > SMALL_PRIME_LIMIT and (last - first_odd + 1) * _PROOF_TO_SIEVE_COST < root


def _sieved_segments(first_odd: int, last: int):
    """Yield ``(lo, flags, owned)`` covering the odd numbers of ``[first_odd, last]``.

    ``flags[j]`` is True exactly when ``lo + 2j`` is prime.  The segment *owns*
    the entries ``j < owned``; the up to ``_TUPLE_REACH`` entries after them
    belong to the next segment and are there so tuples can be read across the
    boundary.  Entries never go past ``last``.
    """
    if last < first_odd:
        return
    remaining = (last - first_odd) // 2 + 1         # odd numbers still to cover
    small_primes_only = _sieves_by_small_primes_only(first_odd, last)
    chunks = _sieving_prime_chunks(SMALL_PRIME_LIMIT - 1 if small_primes_only else isqrt(last))
    first_chunk = next(chunks)
    first_chunk = first_chunk[first_chunk > _WHEEL_PRIMES[-1]]
    split = int(np.searchsorted(first_chunk, _LOOP_PRIME_LIMIT, side="right"))
    loop_primes = first_chunk[:split]
    loop_prime_list = loop_primes.tolist()
    large_chunks = itertools.chain([first_chunk[split:]], chunks)
    if remaining > SEGMENT_LENGTH:
        large_chunks = list(large_chunks)   # several segments reuse them; one needs them once
    pattern = _wheel_pattern()
    lo = first_odd
    while remaining > 0:
        owned = min(SEGMENT_LENGTH, remaining)
        length = min(SEGMENT_LENGTH + _TUPLE_REACH, remaining)
        phase = ((lo - 1) // 2) % _WHEEL_PERIOD
        flags = pattern[phase:phase + length].copy()
        for p, start in zip(loop_prime_list, _first_indices(lo, loop_primes).tolist()):
            flags[start::p] = False
        for chunk in large_chunks:
            _strike_large(flags, lo, chunk)
        _repair_small_numbers(flags, lo)
        if small_primes_only:
            _prove_survivors(flags, lo)
        yield lo, flags, owned
        lo += 2 * owned
        remaining -= owned


def _strike_large(flags: np.ndarray, lo: int, primes: np.ndarray) -> None:
    """Strike the odd multiples of ``primes`` (each > ``_LOOP_PRIME_LIMIT``) from ``flags``."""
    index = _first_indices(lo, primes)
    step = primes.astype(np.int64)
    while True:
        inside = index < len(flags)
        if not inside.any():
            return
        index, step = index[inside], step[inside]
        flags[index] = False
        index += step


def _prove_survivors(flags: np.ndarray, lo: int) -> None:
    """Strike the composites left in ``flags`` after sieving by the primes below the limit.

    A survivor below ``SMALL_PRIME_LIMIT**2`` is prime (a composite has a prime
    factor at most its square root); one at or above it is kept only if the
    deterministic strong test proves it prime (``lo + 2j < 2**64 < psi_12``).
    """
    survivors = np.flatnonzero(flags)
    numbers = np.uint64(lo) + np.uint64(2) * survivors.astype(np.uint64)
    unproven = numbers >= np.uint64(SMALL_PRIME_LIMIT**2)
    survivors, numbers = survivors[unproven], numbers[unproven]
    flags[survivors[~is_prime_batch(numbers)]] = False


def _repair_small_numbers(flags: np.ndarray, lo: int) -> None:
    """Put back the wheel primes the pattern struck out, and strike 1."""
    top = lo + 2 * (len(flags) - 1)
    for q in _WHEEL_PRIMES:
        if lo <= q <= top:
            flags[(q - lo) // 2] = True
    if lo == 1:
        flags[0] = False


def _count_starts(flags: np.ndarray, owned: int, shifts: tuple[int, ...]) -> int:
    """Number of owned j with ``flags[j + s]`` True for every shift s."""
    starts = min(owned, len(flags) - shifts[-1])
    if starts <= 0:
        return 0
    hits = flags[:starts]
    for s in shifts[1:]:
        hits = hits & flags[s:s + starts]
    return int(np.count_nonzero(hits))


def _first_odd_at_least(a: int) -> int:
    return a + 1 if a % 2 == 0 else a


class SegmentedSieveEngine:
    """Counts and lists over ``[a, b]``, ``0 <= a``, ``b < 2**64``, with our numpy sieve."""

    name = "numpy segmented sieve"

    def count_all(self, a: int, b: int) -> dict[str, int]:
        """Counts of every kind in :data:`KINDS` over ``[a, b]``, in one pass."""
        shifts = {kind: tuple(d // 2 for d in PATTERNS[kind]) for kind in KINDS}
        totals = dict.fromkeys(KINDS, 0)
        if b < a:
            return totals
        if a <= 2 <= b:
            totals["primes"] = 1              # 2 is in no other pattern
        for _lo, flags, owned in _sieved_segments(_first_odd_at_least(a), b):
            for kind in KINDS:
                totals[kind] += _count_starts(flags, owned, shifts[kind])
        return totals

    def count(self, kind: str, a: int, b: int) -> int:
        """Number of tuples of ``kind`` lying wholly in ``[a, b]``."""
        shifts = tuple(d // 2 for d in PATTERNS[kind])
        if b < a:
            return 0
        total = 1 if kind == "primes" and a <= 2 <= b else 0
        for _lo, flags, owned in _sieved_segments(_first_odd_at_least(a), b):
            total += _count_starts(flags, owned, shifts)
        return total

    def primes(self, a: int, b: int) -> np.ndarray:
        """The primes of ``[a, b]``, ascending, as ``uint64``."""
        pieces = [np.array([2], dtype=np.uint64)] if a <= 2 <= b else []
        if b >= a:
            for lo, flags, owned in _sieved_segments(_first_odd_at_least(a), b):
                offsets = np.flatnonzero(flags[:owned]).astype(np.uint64)
                pieces.append(np.uint64(lo) + np.uint64(2) * offsets)
        if not pieces:
            return np.zeros(0, dtype=np.uint64)
        return np.concatenate(pieces)
