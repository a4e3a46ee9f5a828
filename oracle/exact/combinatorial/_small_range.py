"""Prime counts and the n-th prime below ``SMALL_LIMIT`` by table look-up.

A table of all primes below ``SMALL_LIMIT`` (sieved once, cached, about 0.6 MB)
answers ``pi(x)`` by binary search and ``p_n`` by indexing.  Below this
limit the combinatorial method would spend more time on set-up than a
look-up costs.  Time ``O(log x)`` per call after a one-off ``O(SMALL_LIMIT)``.
"""

from __future__ import annotations

from functools import lru_cache

import numpy as np

from ._prime_source import primes_between

#: Inputs ``x < SMALL_LIMIT`` are answered from the table.
SMALL_LIMIT = 1 << 20


@lru_cache(maxsize=1)
def _primes() -> np.ndarray:
    return primes_between(2, SMALL_LIMIT - 1)


def small_prime_pi(x: int) -> int:
    """``pi(x)`` for ``x < SMALL_LIMIT`` (0 for ``x < 2``)."""
    if x < 2:
        return 0
    return int(np.searchsorted(_primes(), x, side="right"))


def small_prime_count_limit() -> int:
    """``pi(SMALL_LIMIT - 1)``: the largest ``n`` that :func:`small_nth_prime` answers."""
    return int(_primes().size)


def small_nth_prime(n: int) -> int:
    """``p_n`` for ``1 <= n <= small_prime_count_limit()``."""
    return int(_primes()[n - 1])
