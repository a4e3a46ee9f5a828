"""Riemann's prime-counting function R(x) and its inverse, in floating point.

    R(x) = sum_{k>=1} mu(k)/k li(x^(1/k)) = 1 + sum_{k>=1} (ln x)^k / (k k! zeta(k+1))

(the second form is Gram's series, Gram 1893; see Riesel 1994, "Prime Numbers
and Computer Methods for Factorization", 2nd ed., ch. 2).  ``R^-1(n)`` is a
very good guess for the n-th prime; :mod:`._nth_prime` only uses it as a
starting point and corrects it exactly, so float rounding cannot make an
answer wrong -- at worst a little slower.  Time ``O(log x)`` per value.
"""

from __future__ import annotations

from functools import lru_cache
from math import log


@lru_cache(maxsize=None)
def _zeta(s: int) -> float:
    """``zeta(s)`` for an integer ``s >= 2`` by Euler-Maclaurin summation (N = 12)."""
    n = 12
    head = sum(k ** -s for k in range(1, n))
    tail = n ** (1 - s) / (s - 1) + 0.5 * n ** -s
    # Bernoulli corrections B_2, B_4, B_6 (common practice; error far below 1e-15 here).
    tail += s * n ** (-s - 1) / 12
    tail -= s * (s + 1) * (s + 2) * n ** (-s - 3) / 720
    tail += s * (s + 1) * (s + 2) * (s + 3) * (s + 4) * n ** (-s - 5) / 30240
    return head + tail


def riemann_r(x: float) -> float:
    """``R(x)`` for ``x >= 2`` by Gram's series."""
    ln_x = log(x)
    total, term, k = 1.0, 1.0, 1
    while True:
        term *= ln_x / k                       # (ln x)^k / k!
        increment = term / (k * _zeta(k + 1))
        total += increment
        if increment < 1e-17 * total and k > ln_x:
            return total
        k += 1


def inverse_riemann_r(n: float) -> float:
    """``x`` with ``R(x) = n`` (``n >= 2``), by Newton's method (``R'(x) ~ 1 / ln x``)."""
    x = max(3.0, n * log(n + 2.0))
    for _ in range(100):
        step = (riemann_r(x) - n) * log(x)
        x = max(2.5, x - step)
        if abs(step) < 0.5:
            break
    return x
