"""The n-th prime: an inverse estimate, one exact count, a short sieve.

    p_n = the prime p with pi(p) = n.

Take ``x0 = R^-1(n)`` (:mod:`._riemann_r`), compute ``pi(x0)`` exactly with
:func:`._prime_pi.prime_pi`, then sieve forwards (``pi(x0) < n``) or backwards
(``pi(x0) >= n``) from ``x0`` until the count is ``n``.  The distance
``|p_n - x0|`` is of order ``sqrt(p_n) log p_n`` at worst under the Riemann
hypothesis, and far smaller in practice; the hypothesis is *not* needed for
correctness -- the sieve simply runs until the exact count is reached.
Time: one ``prime_pi`` plus a sieve of a short window.
"""

from __future__ import annotations

from math import log
from typing import Callable

from ..._errors import OutOfReachError
from ..._integers import require_int
from ._cost_model import estimated_seconds
from ._prime_pi import MAX_X, prime_pi
from ._prime_source import primes_between
from ._riemann_r import inverse_riemann_r
from ._run_clock import check_budget, validate_budget
from ._small_range import small_nth_prime, small_prime_count_limit

#: pi(10**18), so that p_n <= MAX_X for every accepted n
#: (OEIS A006880; value from memory, cross-checked in the slow tests).
MAX_N = 24739954287740860


def nth_prime(n: int, *, time_budget: float | None = None,
              progress: Callable[[float, str], object] | None = None) -> int:
    """The ``n``-th prime (``nth_prime(1) == 2``), exactly, for ``1 <= n <= MAX_N``."""
    n = require_int("n", n, minimum=1)
    budget = validate_budget(time_budget)
    if n <= small_prime_count_limit():
        return small_nth_prime(n)
    if n > MAX_N:
        raise OutOfReachError(f"nth_prime(n): n must be <= pi(10**18) = {MAX_N}, got n = {n}")
    start = min(MAX_X, int(inverse_riemann_r(float(n))))
    check_budget(f"nth_prime({n})", estimated_seconds(start), budget)
    count = prime_pi(start, time_budget=budget, progress=progress)
    if count < n:
        return _count_forward(start, n - count)
    return _count_backward(start, count - n)


def _window(x: int, primes_wanted: int) -> int:
    """A window length expected to hold ``primes_wanted`` primes near ``x``, plus slack."""
    return int(1.2 * (primes_wanted + 1) * log(x)) + 1000


def _count_forward(x: int, k: int) -> int:
    """The ``k``-th prime above ``x`` (``k >= 1``)."""
    while True:
        width = _window(x, k)
        found = primes_between(x + 1, x + width)
        if found.size >= k:
            return int(found[k - 1])
        k -= int(found.size)
        x += width


def _count_backward(x: int, k: int) -> int:
    """The largest prime ``<= x`` after skipping ``k`` primes downwards (``k >= 0``)."""
    while True:
        width = min(_window(x, k), x - 1)
        found = primes_between(x - width + 1, x)
        if found.size > k:
            return int(found[found.size - 1 - k])
        k -= int(found.size)
        x -= width
