"""The partial sieve function for the first few primes, and the ordinary leaves.

``phi(v, c)`` counts the integers ``1 <= n <= v`` divisible by none of the first
``c`` primes.  With ``Q = p_1 p_2 ... p_c`` (a primorial) it is periodic:

    phi(v, c) = (v // Q) * phi(Q, c) + phi(v mod Q, c)        (Legendre 1808)

so one table of ``Q`` entries answers it in constant time.  ``c <= 7`` keeps the
table at ``Q = 510510`` entries (2 MB).

The *ordinary leaves* of the Meissel-Lehmer tree are

    S0 = sum over squarefree n <= y with lpf(n) > p_c of  mu(n) * phi(x // n, c)

(Deleglise and Rivat 1996, Math. Comp. 65, eq. (4); Oliveira e Silva 2006,
"Computing pi(x): the combinatorial method", Revista do DETUA 4, section 2).
Time ``O(y)``, memory ``O(y)``.  Valid for ``x <= 10**18`` (all values ``int64``).
"""

from __future__ import annotations

from functools import lru_cache

import numpy as np

from ._exact_sum import exact_sum

#: The first primes; ``c`` may be at most ``len(FIRST_PRIMES)``.
FIRST_PRIMES = (2, 3, 5, 7, 11, 13, 17)


@lru_cache(maxsize=None)
def _wheel_table(c: int) -> tuple[int, int, np.ndarray]:
    """``(Q, phi(Q, c), table)`` with ``table[r] = phi(r, c)`` for ``0 <= r < Q``."""
    modulus = 1
    for p in FIRST_PRIMES[:c]:
        modulus *= p
    coprime = np.ones(modulus, dtype=np.int32)
    coprime[0] = 0
    for p in FIRST_PRIMES[:c]:
        coprime[::p] = 0
    table = np.cumsum(coprime, dtype=np.int32)
    return modulus, int(table[-1]), table


def phi_small(values: np.ndarray, c: int) -> np.ndarray:
    """``phi(v, c)`` for every ``v`` of a non-negative ``int64`` array."""
    modulus, period_count, table = _wheel_table(c)
    quotient, remainder = np.divmod(values, modulus)
    return quotient * period_count + table[remainder]


def ordinary_leaves(x: int, y: int, c: int, lpf: np.ndarray, mu: np.ndarray) -> int:
    """``S0 = sum_{n <= y, mu(n) != 0, lpf(n) > p_c} mu(n) phi(x // n, c)``."""
    pc = FIRST_PRIMES[c - 1] if c > 0 else 1
    total = 0
    start = 1
    while start <= y:                       # n in [start, 2 start): each chunk sums to <= x
        stop = min(2 * start - 1, y)
        n = np.arange(start, stop + 1, dtype=np.int64)
        keep = (mu[start:stop + 1] != 0) & (lpf[start:stop + 1] > pc)
        n = n[keep]
        terms = phi_small(np.int64(x) // n, c) * mu[start:stop + 1][keep]
        total += exact_sum(terms, x // start + 1)
        start = stop + 1
    return total
