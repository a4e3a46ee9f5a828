"""Integer factorisation within a time limit: trial division, perfect powers, Brent's rho.

Method for ``n ≥ 1``:

1. trial division by the primes below :data:`TRIAL_LIMIT` (2¹⁶);
2. the cofactor ``m``: if it is prime (:mod:`oracle.exact.primality`) it is a
   factor; if it is a perfect power ``r^k`` (exact integer roots), ``r`` is
   split instead; otherwise Pollard's rho in Brent's variant (Pollard, BIT 15,
   1975; Brent, BIT 20, 1980) with ``x ↦ x² + c`` finds a proper divisor ``d``,
   and ``d`` and ``m / d`` are split in turn.

Cost: rho finds a prime factor ``p`` in about ``√p`` steps, so a product of two
primes of 32 bits takes milliseconds and of two primes of 50 bits minutes; the
time limit is checked every :data:`_CHECK_EVERY` steps and :class:`TooSlow` is
raised when it is spent.  Each prime factor is as certain as the primality test
says (:func:`oracle.exact.primality.verdict`: proven below A014233(12),
Baillie–PSW *probable* above), which :func:`factorise` reports as the weakest
verdict over the factors.
"""

from __future__ import annotations

import math
import time

import gmpy2

from .._errors import OracleError
from .._integers import require_int
from . import primality

__all__ = ["TooSlow", "factorise", "TRIAL_LIMIT"]

#: Trial division covers the primes below this bound.
TRIAL_LIMIT = 2**16
#: Steps of rho between two looks at the clock (and between two gcds: Brent's batching).
_CHECK_EVERY = 128


class TooSlow(OracleError):
    """The factorisation did not finish within the time allowed."""


def _small_primes() -> list[int]:
    flags = bytearray([1]) * TRIAL_LIMIT
    flags[0:2] = b"\x00\x00"
    for p in range(2, math.isqrt(TRIAL_LIMIT - 1) + 1):
        if flags[p]:
            flags[p * p::p] = bytearray(len(flags[p * p::p]))
    return [p for p in range(TRIAL_LIMIT) if flags[p]]


_SMALL_PRIMES: list[int] | None = None


def factorise(n: int, seconds: float) -> tuple[dict[int, int], str]:
    """``({p: e}, verdict)`` for ``n ≥ 1`` (``({}, "deterministic")`` for 1).

    ``verdict`` is ``"probable"`` when some prime factor lies above the
    deterministic primality bound, else ``"deterministic"``.  Raises
    :class:`TooSlow` when ``seconds`` are spent before the end.
    """
    global _SMALL_PRIMES
    n = require_int("n", n, minimum=1)
    deadline = time.perf_counter() + seconds
    if _SMALL_PRIMES is None:
        _SMALL_PRIMES = _small_primes()
    found: dict[int, int] = {}
    m = n
    for p in _SMALL_PRIMES:
        if p * p > m:
            break
        if m % p == 0:
            exponent = 0
            while m % p == 0:
                m //= p
                exponent += 1
            found[p] = exponent
    if m > 1:
        _split(m, 1, found, deadline)
    weakest = "probable" if any(primality.verdict(p) == "probable" for p in found) else "deterministic"
    return dict(sorted(found.items())), weakest


def _split(m: int, multiplicity: int, found: dict[int, int], deadline: float) -> None:
    """Add the factorisation of ``m`` (no prime factor below the trial limit, or prime)
    raised to ``multiplicity`` to ``found``."""
    if primality.is_prime(m):
        found[m] = found.get(m, 0) + multiplicity
        return
    root, power = _perfect_power(m)
    if power > 1:
        _split(root, multiplicity * power, found, deadline)
        return
    divisor = _brent_rho(m, deadline)
    _split(divisor, multiplicity, found, deadline)
    _split(m // divisor, multiplicity, found, deadline)


def _perfect_power(m: int) -> tuple[int, int]:
    """``(r, k)`` with ``m = r^k`` and ``k`` largest (``(m, 1)`` when m is no perfect power).

    ``m`` has no prime factor below :data:`TRIAL_LIMIT` = 2¹⁶, so r > 2¹⁶ and
    k < log₂(m) / 16: only those exponents are tried."""
    for k in range((m.bit_length() - 1) // 16, 1, -1):
        root, exact = gmpy2.iroot(m, k)
        if exact:
            return int(root), k
    return m, 1


def _brent_rho(m: int, deadline: float) -> int:
    """A proper divisor of the odd composite ``m`` (not a perfect power), by Brent's rho."""
    mz = gmpy2.mpz(m)
    for c in range(1, 10**6):
        y, r, q, g = gmpy2.mpz(2), 1, gmpy2.mpz(1), 1
        x = ys = y
        while g == 1:
            x = y
            for _ in range(r):
                y = (y * y + c) % mz
            k = 0
            while k < r and g == 1:
                ys = y
                for _ in range(min(_CHECK_EVERY, r - k)):
                    y = (y * y + c) % mz
                    q = q * abs(x - y) % mz
                g = gmpy2.gcd(q, mz)
                k += _CHECK_EVERY
                if time.perf_counter() > deadline:
                    raise TooSlow(f"factorising a {m.bit_length()}-bit cofactor took longer "
                                  f"than allowed")
            r *= 2
        if g == mz:               # the batch overshot: step back one at a time
            g = 1
            while g == 1:
                ys = (ys * ys + c) % mz
                g = gmpy2.gcd(abs(x - ys), mz)
        if g != mz:
            return int(g)
    raise AssertionError("unreachable: some c gives a proper divisor")
