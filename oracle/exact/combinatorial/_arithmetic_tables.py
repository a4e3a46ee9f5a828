"""Tables of small arithmetic functions up to a limit ``y`` (``y`` below 2**31).

* least prime factor ``lpf(n)`` and the Moebius function ``mu(n)`` for
  ``0 <= n <= y``, by a sieve of Eratosthenes over the primes up to ``sqrt(y)``;
* the prime-counting table ``pi(n)`` for ``0 <= n <= y``.

Time ``O(y log log y)``, memory ``O(y)`` bytes (``int32``/``int8``).  These are
the ``n <= y`` tables of every Meissel-Lehmer method (Lagarias, Miller and
Odlyzko 1985, Math. Comp. 44, section 3).

Convention: ``lpf(1)`` is ``y + 1``, larger than every prime in range, because
1 has no prime factor and must pass every test "lpf(n) > p".
"""

from __future__ import annotations

from math import isqrt

import numpy as np


def least_prime_factor_and_moebius(limit: int, primes: np.ndarray) -> tuple[np.ndarray, np.ndarray]:
    """Return ``(lpf, mu)`` for ``0 <= n <= limit``; ``primes`` must hold all primes <= limit."""
    root = isqrt(limit)
    small = primes[primes <= root]
    lpf = np.zeros(limit + 1, dtype=np.int32)
    for p in small[::-1].tolist():          # descending: the smallest prime writes last
        lpf[p::p] = p
    unassigned = np.flatnonzero(lpf == 0)   # 0, 1 and the primes above sqrt(limit)
    lpf[unassigned] = unassigned
    lpf[1] = limit + 1
    lpf[0] = 0

    mu = np.ones(limit + 1, dtype=np.int8)
    # After dividing every n by each prime <= sqrt(limit) that divides it, a
    # squarefree n is left with 1 or a single prime > sqrt(limit).
    rest = np.arange(limit + 1, dtype=np.int32)
    for p in small.tolist():
        mu[p::p] *= -1
        rest[p::p] //= p
        mu[p * p::p * p] = 0
    mu[rest > 1] *= -1
    mu[0] = 0
    return lpf, mu


def prime_count_table(limit: int, primes: np.ndarray) -> np.ndarray:
    """``pi[n]`` = number of primes ``<= n`` for ``0 <= n <= limit`` (``int32``)."""
    marks = np.zeros(limit + 1, dtype=np.int32)
    marks[primes[primes <= limit]] = 1
    return np.cumsum(marks, dtype=np.int32)
