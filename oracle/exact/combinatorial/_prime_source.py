"""Where the combinatorial method gets its primes: one place, one dependency.

Every prime list and every segment count used by this package comes through
the two functions below, from the project's sieve engine
(:mod:`oracle.exact.sieve`: primesieve when installed, else our numpy sieve).

Both work over the closed interval ``[start, stop]``.  Arrays are ``uint64``
converted to ``int64``: every value here is at most ``10**18 < 2**63``.
"""

from __future__ import annotations

import numpy as np

from .. import sieve


def primes_between(start: int, stop: int) -> np.ndarray:
    """All primes ``p`` with ``start <= p <= stop``, ascending, as ``int64``."""
    if stop < max(start, 2):
        return np.zeros(0, dtype=np.int64)
    return sieve.primes(max(start, 0), stop).astype(np.int64)


def count_primes_between(start: int, stop: int) -> int:
    """The number of primes ``p`` with ``start <= p <= stop``."""
    if stop < max(start, 2):
        return 0
    return sieve.count("primes", max(start, 0), stop)
