"""Self-validation: does a catalogue entry hold at every exact value we can compute?

Used by the tests (and usable by anyone holding exact data).  Checking many
points is done in two passes (common practice for validating floating-point screens):

1. *Screen* with float64 (numpy): points whose margin is comfortably positive
   are accepted.
2. *Decide* every other point with interval arithmetic at the working
   precision (and once more at four times that precision): the entry either
   provably holds there, provably fails, or -- if the enclosures still overlap --
   is reported as undecided, which also counts as a failure.

Only arguments inside the entry's stated range are checked; that is part of
what is being validated.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from fractions import Fraction
from typing import Callable

import numpy as np

from ._catalogue import Bound, ValidityRange
from ._enclosures import endpoints, exact_interval, integer_upper, working_precision
from ._expressions import Unenclosable, enclose, evaluate_float

__all__ = ["Violation", "integer_mask", "check_values", "check_prime_in_interval"]

#: Relative float64 margin below which a point is decided with intervals.
SCREEN_TOLERANCE = 1e-9


@dataclass(frozen=True)
class Violation:
    """A point inside an entry's range where it fails (``proven``) or cannot be decided."""

    bound_id: str
    side: str
    argument: int
    exact: object
    bound_value: float
    proven: bool


def integer_mask(arguments: np.ndarray, validity: ValidityRange) -> np.ndarray:
    """Which integer ``arguments`` lie in ``validity`` (exact, through integer thresholds)."""
    mask = np.ones(arguments.shape, dtype=bool)
    if validity.start is not None:
        first = math.ceil(validity.start) if validity.start_inclusive else math.floor(validity.start) + 1
        mask &= arguments >= first
    if validity.end is not None:
        last = math.floor(validity.end) if validity.end_inclusive else math.ceil(validity.end) - 1
        mask &= arguments <= min(last, np.iinfo(np.int64).max)
    return mask


def _exact_integer(argument: int, value) -> object:
    return exact_interval(int(value))


def check_values(bound: Bound, arguments: np.ndarray, exact: np.ndarray, *,
                 exact_enclosure: Callable[[int, object], object] | None = None,
                 float_error: float = 0.0, cache: dict | None = None,
                 limit: int = 20) -> list[Violation]:
    """Points among ``arguments`` (in range) where a side of ``bound`` fails for ``exact``.

    ``exact[i]`` is the true value at ``arguments[i]``.  An upper side too large to
    enclose (``2**(2**(n-1))`` for large n) makes no claim and is not counted.  For integer functions it
    is exact; for real ones (theta, psi) it is a float with absolute error at most
    ``float_error`` and ``exact_enclosure(argument, value)`` must return an
    interval containing the true value.  ``cache`` may hold float sub-results
    shared between entries for the same ``arguments`` array.  At most ``limit``
    doubtful points per side are decided with intervals (enough to report a
    failure; a passing entry has few doubtful points).
    """
    exact_enclosure = exact_enclosure or _exact_integer
    mask = integer_mask(arguments, bound.range)
    if not mask.any():
        return []
    cache = {} if cache is None else cache
    if "arguments" not in cache:
        cache["arguments"] = arguments.astype(np.float64)
    points = arguments[mask]
    values = exact[mask]
    violations: list[Violation] = []
    for side in bound.sides:
        estimate = evaluate_float(side.formula, cache["arguments"], cache)[mask]
        margin = (values - estimate) if side.direction == "lower" else (estimate - values)
        slack = SCREEN_TOLERANCE * np.maximum(np.abs(estimate), 1.0) + float_error
        with np.errstate(invalid="ignore"):
            doubtful = np.flatnonzero(~(margin > slack))
        for index in doubtful[:limit]:
            argument = int(points[index])
            verdict = _decide(side, argument, exact_enclosure(argument, values[index]))
            if verdict is not True:
                violations.append(Violation(bound.id, side.direction, argument, values[index],
                                            float(estimate[index]), proven=verdict is False))
    return violations


def _decide(side, argument: int, truth) -> bool | None:
    """True: the side provably holds at ``argument``; False: provably fails; None: undecided."""
    for factor in (1, 4):
        try:
            enclosure = enclose(side.formula, argument, factor * working_precision(argument))
        except Unenclosable:
            return True if side.direction == "upper" else None   # the oracle skips it: no claim
        bound_low, bound_high = endpoints(enclosure)
        true_low, true_high = endpoints(truth)
        if side.direction == "lower":
            holds = bound_high is not None and (true_low > bound_high if side.strict else true_low >= bound_high)
            fails = bound_low is not None and (true_high <= bound_low if side.strict else true_high < bound_low)
        else:
            holds = bound_low is not None and (true_high < bound_low if side.strict else true_high <= bound_low)
            fails = bound_high is not None and (true_low >= bound_high if side.strict else true_low > bound_high)
        if holds:
            return True
        if fails:
            return False
    return None


def check_prime_in_interval(bound: Bound, arguments: np.ndarray, primes: np.ndarray, *,
                            limit: int = 20) -> list[Violation]:
    """Points where the promised prime is missing, given all ``primes`` beyond the arguments.

    For 'a prime in (x, R(x)]' the first prime after ``x`` (at or after it when
    the left end is closed) must be <= R(x) (< R(x) if open); for 'a prime in
    (L(x), x]' the last prime <= x must be > L(x).
    """
    mask = integer_mask(arguments, bound.range)
    points = arguments[mask]
    if points.size == 0:
        return []
    violations: list[Violation] = []
    if bound.left.text == "x":
        side_formula, closed = bound.right, bound.right_closed
        chosen = primes[np.searchsorted(primes, points, side="left" if bound.left_closed else "right")]
        estimate = evaluate_float(side_formula, points.astype(np.float64))
        margin = estimate - chosen
        doubtful = np.flatnonzero(~(margin > SCREEN_TOLERANCE * np.abs(estimate)))
        for index in doubtful[:limit]:
            argument, prime = int(points[index]), int(chosen[index])
            try:
                enclosure = enclose(side_formula, argument, working_precision(argument))
                largest = integer_upper(enclosure, strict=not closed)
            except Unenclosable:
                largest = None
            if largest is None or prime > largest:
                violations.append(Violation(bound.id, "right", argument, prime,
                                            float(estimate[index]), proven=largest is not None))
    else:
        side_formula = bound.left
        chosen = primes[np.searchsorted(primes, points, side="right") - 1]
        estimate = evaluate_float(side_formula, points.astype(np.float64))
        margin = chosen - estimate
        doubtful = np.flatnonzero(~(margin > SCREEN_TOLERANCE * np.abs(estimate)))
        for index in doubtful[:limit]:
            argument, prime = int(points[index]), int(chosen[index])
            try:
                low, high = endpoints(enclose(side_formula, argument, working_precision(argument)))
            except Unenclosable:
                low = high = None
            if high is None or not Fraction(prime) > high:
                violations.append(Violation(bound.id, "left", argument, prime, float(estimate[index]),
                                            proven=low is not None and Fraction(prime) <= low))
    return violations
