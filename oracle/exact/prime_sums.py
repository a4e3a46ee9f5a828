"""Sums over the primes of an interval: their sum, and their number in one residue class.

* ``prime_sum_between(a, b)`` is Σ p over the primes a ≤ p ≤ b, so the sum of the
  primes up to x is ``prime_sum_between(0, x)`` (OEIS A046731 at x = 10ⁿ);
* ``progression_count_between(q, r, a, b)`` is #{p prime : a ≤ p ≤ b, p ≡ r (mod q)},
  so π(x; q, r) = ``progression_count_between(q, r, 0, x)``.

Both walk the interval in pieces of :data:`PIECE` integers, list the primes of each
piece with the segmented sieve (:mod:`oracle.exact.sieve`, below 2⁶⁴) and reduce the
piece in numpy; the pieces' results are added as Python integers, so the sum is
exact at any size (a piece of 2²⁶ integers below 2⁶⁴ holds fewer than 2²⁶ primes,
whose sum would overflow uint64 -- so each piece is summed in halves of its primes'
high and low 32 bits).  Cost: that of listing the primes, about 4 ns per integer with
primesieve on this machine.
"""

from __future__ import annotations

from .._errors import InvalidInputError
from .._integers import require_int

__all__ = ["prime_sum_between", "progression_count_between", "PIECE", "LIMIT"]

#: Integers listed per piece (the list of a piece takes at most 8 · 2²⁶ / ln 2²⁶ bytes).
PIECE = 2**26
#: The sieve lists primes below 2⁶⁴ only.
LIMIT = 2**64


def _pieces(a: int, b: int):
    low = max(a, 0)
    while low <= b:
        high = min(low + PIECE - 1, b)
        yield low, high
        low = high + 1


def _check_interval(a, b) -> tuple[int, int]:
    a = require_int("a", a, minimum=0)
    b = require_int("b", b)
    if b >= LIMIT:
        raise InvalidInputError(f"b={b}: sums over primes are sieved below 2**64 only")
    return a, b


def prime_sum_between(a: int, b: int) -> int:
    """Σ p over the primes p with a ≤ p ≤ b (0 when b < a), exact."""
    import numpy as np

    from . import sieve

    a, b = _check_interval(a, b)
    total = 0
    for low, high in _pieces(a, b):
        found = sieve.primes(low, high)
        if found.size == 0:
            continue
        # Exact in uint64: each half-word sum is below 2**32 · 2**26.
        high_words = int(np.sum(found >> np.uint64(32), dtype=np.uint64))
        low_words = int(np.sum(found & np.uint64(0xFFFFFFFF), dtype=np.uint64))
        total += (high_words << 32) + low_words
    return total


def progression_count_between(q: int, r: int, a: int, b: int) -> int:
    """#{p prime : a ≤ p ≤ b, p ≡ r (mod q)} for q ≥ 1 (0 when b < a)."""
    import numpy as np

    from . import sieve

    q = require_int("q", q, minimum=1)
    r = require_int("r", r) % q
    a, b = _check_interval(a, b)
    if q > b:                       # only p = r itself can lie in the class below q
        return int(a <= r <= b and sieve.count("primes", r, r) == 1)
    total = 0
    for low, high in _pieces(a, b):
        found = sieve.primes(low, high)
        if found.size:
            total += int(np.count_nonzero(found % np.uint64(q) == np.uint64(r)))
    return total
