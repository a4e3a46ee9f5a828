"""Strategies for the arguments of counting functions and sieves, biased to boundaries.

Counting code (``prime_pi(x)``, ``twin_pi(x)``, a sieve over ``[a, b]``) is
most often wrong one step from a boundary (common practice):

* ``2**k`` and ``10**k`` plus or minus 2 -- word sizes, table points, loop ends;
* the primes next to ``2**16``, ``2**26.5`` and ``2**32``, and the primes next
  to each ``2**k``, with their neighbours ``p - 1``, ``p + 1`` -- where a count
  steps;
* ``p**2 - 1``, ``p**2``, ``p**2 + 1`` for those primes near ``2**16``,
  ``2**26.5`` and ``2**32`` -- squares near ``2**32``, ``2**53`` (the double's
  significand) and ``2**64``, where a square root computed in floating point
  or a sieve bound ``p**2 <= x`` goes wrong;
* ``m * 2**j`` plus or minus 2, ``15 <= j <= 20`` -- segment ends of
  segmented sieves.

:func:`counting_points` mixes those with uniform and log-uniform integers;
:func:`sieve_intervals` draws ``(a, b)`` pairs: single points, tiny and wide
intervals, and intervals straddling a boundary.  The list of exact boundary
points is computed on the first draw (it needs :mod:`oracle.exact.primality`).
"""

from __future__ import annotations

import functools
import math

from hypothesis import strategies as st

from ._validation import check_integer

__all__ = ["counting_points", "sieve_intervals", "boundary_points"]

#: Segment lengths ``2**j`` of segmented sieves whose multiples are boundaries.
SEGMENT_EXPONENTS = range(15, 21)
#: Where products of residues and square roots overflow: ``2**16``, ``2**26.5`` and ``2**32``.
SQUARE_ROOT_CENTRES = (2**16, math.isqrt(2**53), 2**32)
#: Largest distance from a power of two, a power of ten or a segment end.
NEAR = 2
#: Intervals up to this many integers count as tiny.
TINY_LENGTH = 16


def counting_points(max_value: int, *, min_value: int = 0) -> st.SearchStrategy[int]:
    """Integers ``min_value <= x <= max_value``, a large share of them at boundaries.

    Shrinks towards ``min_value``: the smallest failing ``x`` is the first
    place a counting function diverges.
    """
    min_value = check_integer("min_value", min_value, minimum=0)
    max_value = check_integer("max_value", max_value, minimum=min_value)
    return st.one_of(
        st.integers(min_value, max_value),
        _log_uniform(min_value, max_value),
        st.deferred(lambda: st.sampled_from(boundary_points(min_value, max_value))),
        _segment_ends(min_value, max_value),
    )


def sieve_intervals(max_value: int, max_length: int = 2**16, *,
                    min_value: int = 0) -> st.SearchStrategy[tuple[int, int]]:
    """Pairs ``(a, b)``, ``min_value <= a <= b <= max_value``, of at most ``max_length`` integers.

    ``b - a + 1 <= max_length``.  Single points ``a = b``, tiny intervals, wide
    ones, and ones that contain both ``c - 1`` and ``c`` for a boundary ``c``
    (a power of two or ten, or a segment end ``m * 2**j``).  Shrinks towards
    ``(min_value, min_value)``.
    """
    min_value = check_integer("min_value", min_value, minimum=0)
    max_value = check_integer("max_value", max_value, minimum=min_value)
    max_length = check_integer("max_length", max_length, minimum=1)
    starts = counting_points(max_value, min_value=min_value)
    intervals = [_intervals_from(starts, max_value, max_length)]
    centres = _boundary_centres(min_value, max_value)
    if max_length >= 2 and centres is not None:
        intervals.append(_straddling_intervals(centres, min_value, max_value, max_length))
    return st.one_of(intervals)


@functools.lru_cache(maxsize=64)
def boundary_points(min_value: int, max_value: int) -> tuple[int, ...]:
    """The exact boundary points (module docstring) within ``[min_value, max_value]``, ascending."""
    from ..exact.primality import next_prime, prev_prime

    points = set()
    for centre in _powers(2, max_value) + _powers(10, max_value):
        points.update(range(centre - NEAR, centre + NEAR + 1))
    primes = set()
    for centre in _powers(2, max_value):
        primes.add(next_prime(centre))
        if centre >= 3:
            primes.add(prev_prime(centre))
    for centre in SQUARE_ROOT_CENTRES:
        near = [prev_prime(centre), next_prime(centre)]
        primes.update(near)
        points.update(p * p + offset for p in near for offset in (-1, 0, 1))
    points.update(p + offset for p in primes for offset in (-1, 0, 1))
    return tuple(sorted(x for x in points if min_value <= x <= max_value))


def _powers(base: int, max_value: int) -> list[int]:
    """``base**k`` for ``k >= 0`` up to the first power above ``max_value``."""
    powers = [1]
    while powers[-1] <= max_value:
        powers.append(powers[-1] * base)
    return powers


@st.composite
def _log_uniform(draw, min_value: int, max_value: int) -> int:
    """Bit length uniform in range, then the value uniform among numbers of that length."""
    bits = draw(st.integers(min_value.bit_length(), max_value.bit_length()))
    low = max(min_value, 1 << (bits - 1) if bits else 0)
    high = min(max_value, (1 << bits) - 1)
    return draw(st.integers(low, high))


def _segment_ends(min_value: int, max_value: int) -> st.SearchStrategy[int]:
    """``m * 2**j + d`` with ``|d| <= 2``, clamped into range; nothing if ``max_value < 2**15``."""
    exponents = [j for j in SEGMENT_EXPONENTS if 2**j <= max_value]
    if not exponents:
        return st.nothing()
    return _multiples_of_powers_of_two(exponents, min_value, max_value)


@st.composite
def _multiples_of_powers_of_two(draw, exponents: list[int], min_value: int,
                                max_value: int) -> int:
    j = draw(st.sampled_from(exponents))
    m = draw(st.integers(max(1, min_value >> j), max_value >> j))
    offset = draw(st.integers(-NEAR, NEAR))
    return min(max(m * 2**j + offset, min_value), max_value)


@st.composite
def _intervals_from(draw, starts: st.SearchStrategy[int], max_value: int,
                    max_length: int) -> tuple[int, int]:
    a = draw(starts)
    length = draw(st.one_of(st.integers(1, min(TINY_LENGTH, max_length)),
                            st.integers(1, max_length)))
    return a, min(a + length - 1, max_value)


@st.composite
def _straddling_intervals(draw, centres: st.SearchStrategy[int], min_value: int,
                          max_value: int, max_length: int) -> tuple[int, int]:
    """An interval holding ``c - 1`` and ``c`` for a boundary ``c`` drawn from ``centres``."""
    c = draw(centres)
    before = draw(st.integers(1, max_length - 1))
    after = draw(st.integers(0, max_length - 1 - before))
    return max(c - before, min_value), min(c + after, max_value)


def _boundary_centres(min_value: int, max_value: int) -> st.SearchStrategy[int] | None:
    """Boundaries ``c`` with ``min_value < c <= max_value``, or ``None`` if there is none.

    Powers of two and ten (a short list of integers, made at once) and segment
    ends ``m * 2**j`` (drawn).
    """
    powers = sorted(c for c in set(_powers(2, max_value) + _powers(10, max_value))
                    if min_value < c <= max_value)
    branches = []
    if powers:
        branches.append(st.sampled_from(powers))
    exponents = [j for j in SEGMENT_EXPONENTS if max_value >> j > min_value >> j]
    if exponents:
        branches.append(_exact_segment_ends(exponents, min_value, max_value))
    return st.one_of(branches) if branches else None


@st.composite
def _exact_segment_ends(draw, exponents: list[int], min_value: int, max_value: int) -> int:
    """``m * 2**j`` in ``(min_value, max_value]`` for ``j`` among ``exponents`` (each has one)."""
    j = draw(st.sampled_from(exponents))
    return draw(st.integers((min_value >> j) + 1, max_value >> j)) << j
