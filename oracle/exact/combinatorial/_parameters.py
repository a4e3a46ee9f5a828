"""The tables shared by every stage: ``y``, ``z``, ``c``, primes, pi, lpf, mu.

Deleglise and Rivat (1996, Math. Comp. 65) choose ``y = alpha x^(1/3)`` with
``x^(1/3) <= y <= x^(1/2)``; then ``a = pi(y)``, ``z = x // y`` (every leaf
value is ``<= z``) and

    pi(x) = phi(x, a) + a - 1 - P2(x, a).

``y >= floor(x^(1/3))`` makes ``p_(a+1)^3 > x``, so the ``P3`` term of
Meissel-Lehmer vanishes.  ``c`` is the number of tiny primes handled by the
primorial table of :mod:`._phi`.  Memory ``O(y)``.
"""

from __future__ import annotations

from dataclasses import dataclass
from math import isqrt

import numpy as np

from ._arithmetic_tables import least_prime_factor_and_moebius, prime_count_table
from ._phi import FIRST_PRIMES
from ._prime_source import primes_between


def integer_cube_root(n: int) -> int:
    """``floor(n^(1/3))`` for ``n >= 0``, exact for Python ints of any size."""
    root = int(round(n ** (1.0 / 3.0))) if n < 2**1000 else 1 << ((n.bit_length() + 2) // 3)
    while root**3 > n:
        root -= 1
    while (root + 1) ** 3 <= n:
        root += 1
    return root


def integer_fourth_root(n: int) -> int:
    """``floor(n^(1/4))``."""
    return isqrt(isqrt(n))


@dataclass(frozen=True)
class LeafTables:
    """Everything the stages read; built once per ``x`` by :func:`prepare`."""

    x: int
    y: int
    z: int
    c: int
    a: int                  # pi(y)
    primes: np.ndarray      # all primes <= y, int64, primes[k - 1] = p_k
    prime_count: np.ndarray  # prime_count[n] = pi(n), 0 <= n <= y
    lpf: np.ndarray         # least prime factor, lpf[1] = y + 1
    mu: np.ndarray          # Moebius function


def choose_y(x: int, alpha: float) -> int:
    """``y = alpha x^(1/3)`` clamped to ``[floor(x^(1/3)), floor(x^(1/2))]``."""
    cube_root = integer_cube_root(x)
    return max(cube_root, min(isqrt(x), int(alpha * cube_root)))


def prepare(x: int, y: int, c_max: int = len(FIRST_PRIMES)) -> LeafTables:
    """Sieve the tables up to ``y``; ``c = min(c_max, pi(y))`` (needs ``y >= 2``)."""
    primes = primes_between(2, y)
    prime_count = prime_count_table(y, primes)
    lpf, mu = least_prime_factor_and_moebius(y, primes)
    a = int(primes.size)
    c = min(c_max, a)
    return LeafTables(x=x, y=y, z=x // y, c=c, a=a, primes=primes,
                      prime_count=prime_count, lpf=lpf, mu=mu)
