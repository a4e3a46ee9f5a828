"""Twin prime pairs ``(p, p + 2)`` on both sides of powers of two.

A twin-prime counter ``twin_pi(x)`` (pairs with ``p + 2 <= x``) is most likely
to be off by one where a pair straddles a segment or word boundary, and at
``x = p + 1`` (the pair not yet counted) versus ``x = p + 2`` (counted).
For each ``2**k`` this module finds the largest pair with ``p + 2 < 2**k`` and
the smallest with ``p > 2**k``, by stepping with :mod:`oracle.exact.primality`.
"""

from __future__ import annotations

from .._integers import require_int
from ..exact.primality import next_prime, prev_prime

__all__ = ["twin_pairs_around_power_of_two", "twin_boundary_points"]


def twin_pairs_around_power_of_two(exponent: int) -> tuple[tuple[int, int], tuple[int, int]]:
    """``((p, p+2), (q, q+2))``: the last twin pair below ``2**exponent`` and the first above.

    ``exponent >= 3`` (the pair (5, 7) lies below 8).
    """
    exponent = require_int("exponent", exponent, minimum=3, maximum=4096)
    power = 2**exponent
    upper = prev_prime(power)
    lower = prev_prime(upper)
    while upper - lower != 2:
        upper, lower = lower, prev_prime(lower)
    first = next_prime(power)
    second = next_prime(first)
    while second - first != 2:
        first, second = second, next_prime(second)
    return (lower, upper), (first, second)


def twin_boundary_points(exponents: tuple[int, ...] = (8, 16, 31, 32, 53, 63, 64)) -> list[int]:
    """Inputs ``x`` for ``twin_pi``: ``p + 1``, ``p + 2``, ``p + 3`` for the pairs around each ``2**k``,
    and ``2**k`` itself; sorted, without repeats."""
    points = set()
    for index, exponent in enumerate(exponents):
        exponent = require_int(f"exponents[{index}]", exponent, minimum=3, maximum=4096)
        points.add(2**exponent)
        for p, _ in twin_pairs_around_power_of_two(exponent):
            points.update((p + 1, p + 2, p + 3))
    return sorted(points)
