"""The sieve operations through the ``primesieve`` binding (Kim Walisch's library).

primesieve is a segmented sieve of Eratosthenes with wheel factorisation and
bucket sieving for large primes (Oliveira e Silva, Herzog and Pardi 2014,
"Empirical verification of the even Goldbach conjecture ...", Math. Comp. 83,
describe the bucket method; citation from memory).  Its counters count a tuple
only when the whole tuple lies in ``[start, stop]``, as we do, but its
"triplets" are both patterns ``(0, 2, 6)`` and ``(0, 4, 6)`` together.  So
primes, twins and quadruplets come from its counters, while each triplet
pattern is counted here from its prime lists, window by window.

Counting one pattern from a sorted list of primes: ``p + d`` (``d`` even) is
prime exactly when it is one of the next ``d/2`` primes after ``p``, because
``(p, p + d)`` holds fewer than ``d/2`` odd numbers.
Valid range: ``0 <= a <= b < 2**64``.
"""

from __future__ import annotations

import numpy as np

from ._constellations import KINDS, PATTERNS

try:
    import primesieve as _primesieve
except ImportError:                          # the optional extra "fast" is not installed
    _primesieve = None

__all__ = ["AVAILABLE", "PrimesieveEngine"]

#: True when the binding imports.
AVAILABLE = _primesieve is not None

#: Width of the windows in which triplets are counted from prime lists
#: (about a million primes, 8 MB, per window; each window near 2**64 costs primesieve
#: a fixed second or so, so windows must not be much smaller).
_WINDOW = 2**24

_TRIPLET_KINDS = ("triplets_026", "triplets_046")


def _library_version() -> str:
    version = _primesieve.primesieve_version()
    return version.decode() if isinstance(version, bytes) else str(version)


def _prime_array(a: int, b: int) -> np.ndarray:
    """The primes of ``[a, b]`` from primesieve, viewed as ``uint64`` without copying."""
    return np.frombuffer(_primesieve.primes(a, b), dtype=np.uint64)


def _count_in_list(primes: np.ndarray, starts: int, offsets: tuple[int, ...]) -> int:
    """Tuples with offsets ``offsets`` whose first entry is one of ``primes[:starts]``.

    ``primes`` must hold every prime from ``primes[0]`` up to at least
    ``primes[starts - 1] + offsets[-1]`` (or up to the end of the interval).
    """
    first = primes[:starts]
    complete = np.ones(starts, dtype=bool)
    for d in offsets[1:]:
        found = np.zeros(starts, dtype=bool)
        for j in range(1, d // 2 + 1):
            ahead = primes[j:j + starts]
            found[:len(ahead)] |= (ahead - first[:len(ahead)]) == d
        complete &= found
    return int(np.count_nonzero(complete))


class PrimesieveEngine:
    """Counts and lists over ``[a, b]``, ``0 <= a``, ``b < 2**64``, through primesieve."""

    def __init__(self) -> None:
        if not AVAILABLE:
            raise ImportError("primesieve is not installed (pip install 'ntoracle[fast]')")
        self.name = f"primesieve {_library_version()}"

    def count(self, kind: str, a: int, b: int) -> int:
        """Number of tuples of ``kind`` lying wholly in ``[a, b]``."""
        if b < a:
            return 0
        if kind == "primes":
            return _primesieve.count_primes(a, b)
        if kind == "twins":
            return _primesieve.count_twins(a, b)
        if kind == "quadruplets":
            return _primesieve.count_quadruplets(a, b)
        return self._count_triplets(a, b)[kind]

    def count_all(self, a: int, b: int) -> dict[str, int]:
        """Counts of every kind in :data:`KINDS` over ``[a, b]``."""
        triplets = self._count_triplets(a, b) if b >= a else dict.fromkeys(_TRIPLET_KINDS, 0)
        return {kind: triplets[kind] if kind in triplets else self.count(kind, a, b)
                for kind in KINDS}

    def primes(self, a: int, b: int) -> np.ndarray:
        """The primes of ``[a, b]``, ascending, as ``uint64``."""
        if b < a:
            return np.zeros(0, dtype=np.uint64)
        return _prime_array(a, b)

    @staticmethod
    def _count_triplets(a: int, b: int) -> dict[str, int]:
        """Both triplet patterns, counted from primesieve's prime lists window by window."""
        reach = max(PATTERNS[kind][-1] for kind in _TRIPLET_KINDS)
        totals = dict.fromkeys(_TRIPLET_KINDS, 0)
        for lo in range(a, b + 1, _WINDOW):
            hi = min(lo + _WINDOW - 1, b)                  # this window owns starts in [lo, hi]
            primes = _prime_array(lo, min(hi + reach, b))
            starts = int(np.searchsorted(primes, np.uint64(hi), side="right"))
            for kind in _TRIPLET_KINDS:
                totals[kind] += _count_in_list(primes, starts, PATTERNS[kind])
        return totals
