"""The sum of the primes up to x without listing them: a Legendre-type sieve over the values ⌊x/n⌋.

Let S(v, p) be the sum of the integers 2 ≤ m ≤ v that are prime or have no prime
factor ≤ p.  Then S(v, 1) = v(v + 1)/2 − 1, S(v, √v) = Σ_{q prime ≤ v} q, and for
each prime p with p² ≤ v

    S(v, p) = S(v, p − 1) − p · (S(⌊v/p⌋, p − 1) − S(p − 1, p − 1)),

since the m removed at step p are p·k with k ≥ p free of primes < p (the method
Legendre used for π(x), applied to sums; Deléglise & Rivat's and Lagarias–Miller–
Odlyzko's counts refine it).  Only the values v = ⌊x/n⌋ occur -- about 2√x of them --
so the cost is about x^(3/4) / log x operations, done in numpy over all v at once
for each prime p ≤ √x.

The sums grow to about x²/(2 ln x), beyond any machine word, so the recurrence is run
twice in uint64: once modulo 2⁶⁴ (wrapping arithmetic is exact modulo 2⁶⁴) and once
modulo the prime :data:`MODULUS` < 2³¹; the Chinese remainder theorem gives the sum
modulo 2⁶⁴·MODULUS > 2⁹⁴, which exceeds x² and so the sum itself, for x < 2⁴⁷.
Exact: no floating point is involved.
"""

from __future__ import annotations

import math

from .._errors import InvalidInputError
from .._integers import require_int

__all__ = ["prime_sum", "estimated_seconds", "MAX_X", "MODULUS"]

#: A prime below 2³¹ (2³¹ − 1, a Mersenne prime): products p·r with p ≤ √x < 2²⁴ and
#: r < 2³¹ stay below 2⁶³.
MODULUS = 2**31 - 1
#: Largest x: x² < 2⁹⁴ ≤ 2⁶⁴ · MODULUS, and √x < 2²⁴ keeps p · r below 2⁶³.
MAX_X = 2**47


def _initial(values, modulus: int | None):
    """v(v + 1)/2 − 1 for each v, modulo 2⁶⁴ (``modulus`` None) or modulo ``modulus``."""
    import numpy as np

    v = values.astype(np.uint64)
    even = v % np.uint64(2) == 0
    half = np.where(even, v // np.uint64(2), v)
    other = np.where(even, v + np.uint64(1), (v + np.uint64(1)) // np.uint64(2))
    if modulus is None:
        with np.errstate(over="ignore"):
            return half * other - np.uint64(1)
    m = np.uint64(modulus)
    return ((half % m) * (other % m) + m - np.uint64(1)) % m


def _sieve(x: int, modulus: int | None) -> int:
    """Σ_{q prime ≤ x} q modulo 2⁶⁴ (``modulus`` None) or modulo ``modulus``."""
    import numpy as np

    r = math.isqrt(x)
    small_v = np.arange(r + 1, dtype=np.int64)                       # v = 0 .. r
    large_v = np.array([x // i if i else 0 for i in range(r + 1)], dtype=np.uint64)   # x // i
    small = _initial(small_v, modulus)
    large = _initial(large_v, modulus)
    small[0] = 0
    if r >= 1:
        small[1] = 0
    m = np.uint64(modulus) if modulus is not None else None
    with np.errstate(over="ignore"):
        for p in range(2, r + 1):
            if small[p] == small[p - 1]:
                continue                               # p is composite: nothing changes
            before = small[p - 1]
            square = p * p
            up = np.uint64(p)
            # large[i] = S(x // i) for 1 <= i <= min(r, x // p²)
            top = min(r, x // square)
            if top >= 1:
                i = np.arange(1, top + 1, dtype=np.int64)
                ip = i * p
                inner = np.where(ip <= r, large[np.minimum(ip, r)],
                                 small[np.minimum(x // np.maximum(ip, 1), r)])
                if m is None:
                    large[1:top + 1] -= up * (inner - before)
                else:
                    large[1:top + 1] = (large[1:top + 1] + m
                                        - (up * ((inner + m - before) % m)) % m) % m
            # small[v] = S(v) for p² <= v <= r (right-hand sides read before the update)
            if square <= r:
                v = np.arange(square, r + 1, dtype=np.int64)
                inner = small[v // p]
                if m is None:
                    small[square:] -= up * (inner - before)
                else:
                    small[square:] = (small[square:] + m - (up * ((inner + m - before) % m)) % m) % m
    return int(large[1]) if r >= 1 else 0


def prime_sum(x: int) -> int:
    """Σ p over the primes p ≤ x, exact, for 0 ≤ x ≤ :data:`MAX_X`."""
    x = require_int("x", x)
    if x > MAX_X:
        raise InvalidInputError(f"x={x}: the combinatorial prime sum is exact up to 2**47 only")
    if x < 2:
        return 0
    wrapped = _sieve(x, None)                      # the sum modulo 2**64
    residue = _sieve(x, MODULUS)                   # the sum modulo MODULUS
    # The sum s = wrapped + 2**64 * k with 0 <= k < MODULUS and s = residue (mod MODULUS).
    k = ((residue - wrapped) * pow(2**64, -1, MODULUS)) % MODULUS
    return wrapped + 2**64 * k


def estimated_seconds(x: int) -> float:
    """Rough cost on this machine: 1.2 s at 10¹⁰, 6.2 s at 10¹¹ (both moduli)."""
    return 1e-6 * x ** 0.75 / max(math.log(max(x, 3)), 1.0) + 1e-6 * math.isqrt(x)
