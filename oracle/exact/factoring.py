"""Integer factorisation: trial division, then Pollard's rho in Brent's variant.

Every n >= 1 is a product of primes in exactly one way (the fundamental
theorem of arithmetic).  Small prime factors are removed by trial division up
to ``TRIAL_LIMIT``; a remaining composite cofactor m is split by Pollard's rho
method (Pollard, BIT 15, 1975) with Brent's cycle finding and batched gcds
(Brent, BIT 20, 1980), whose expected work grows like sqrt(p) for the smallest
prime factor p of m.  A cofactor is declared prime by
:func:`oracle.exact.primality.is_prime` (deterministic below A014233(12),
Baillie-PSW -- a probable prime, not a proof -- above).

The work is bounded by a deadline: a number whose second-largest prime factor
is large (two 40-digit primes, say) is out of reach, and the caller is told
so instead of waiting.
"""

from __future__ import annotations

import math
import time

from .._errors import OutOfReachError

__all__ = ["factorise", "TRIAL_LIMIT"]

#: Trial division removes every prime factor below this bound.
TRIAL_LIMIT = 2**12


def factorise(n: int, deadline: float) -> list[tuple[int, int]]:
    """The sorted (p, e) pairs with n = prod p**e, for n >= 1 (factor(1) is empty).

    ``deadline`` is a :func:`time.monotonic` instant; past it, raises
    :class:`OutOfReachError` naming the cofactor that could not be split.
    """
    found: dict[int, int] = {}
    m = n
    for p in _small_primes(TRIAL_LIMIT):
        if p * p > m:
            break
        while m % p == 0:
            found[p] = found.get(p, 0) + 1
            m //= p
    pending = [m] if m > 1 else []
    from . import primality

    while pending:
        m = pending.pop()
        if primality.is_prime(m):
            found[m] = found.get(m, 0) + 1
            continue
        divisor = _split(m, deadline)
        pending.extend((divisor, m // divisor))
    return sorted(found.items())


def _split(m: int, deadline: float) -> int:
    """A proper divisor of the odd composite m, by Pollard-Brent rho; c = 1, 2, ... until one splits."""
    root = math.isqrt(m)
    if root * root == m:
        return root
    c = 1
    while True:
        divisor = _rho(m, c, deadline)
        if divisor is not None and 1 < divisor < m:
            return divisor
        c += 1


def _rho(m: int, c: int, deadline: float) -> int | None:
    """Brent's variant of rho for x -> x^2 + c (mod m): a divisor of m, or None (rerun with new c)."""
    y, r, q, g, batch = 2, 1, 1, 1, 128
    x = ys = y
    while g == 1:
        if time.monotonic() > deadline:
            digits = len(str(m)) if m.bit_length() < 14000 else None
            size = f"{digits} digits" if digits is not None else f"{m.bit_length()} bits"
            raise OutOfReachError(
                f"a composite cofactor of {size} was not split by Pollard's rho within the budget")
        x = y
        for _ in range(r):
            y = (y * y + c) % m
        k = 0
        while k < r and g == 1:
            ys = y
            for _ in range(min(batch, r - k)):
                y = (y * y + c) % m
                q = q * abs(x - y) % m
            g = math.gcd(q, m)
            k += batch
        r *= 2
    if g == m:
        while True:
            ys = (ys * ys + c) % m
            g = math.gcd(abs(x - ys), m)
            if g > 1:
                break
    return None if g == m else g


def _small_primes(limit: int) -> list[int]:
    """The primes below ``limit`` (sieve of Eratosthenes)."""
    flags = bytearray([1]) * limit
    flags[:2] = b"\x00\x00"
    for p in range(2, math.isqrt(limit - 1) + 1):
        if flags[p]:
            flags[p * p::p] = bytes(len(range(p * p, limit, p)))
    return [p for p in range(limit) if flags[p]]
