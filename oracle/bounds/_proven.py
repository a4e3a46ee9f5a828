"""Proven intervals: the tightest bounds the catalogue gives at one argument.

For an integer-valued function f and an entry ``f(x) >= L(x)`` valid at ``x``,
``L(x)`` is enclosed in an interval ``[a, b]`` with directed rounding; then
``f(x) >= ceil(a)`` (or ``floor(a) + 1`` when the inequality is strict) is a
proven integer bound, whatever the width of ``[a, b]``.  Upper bounds use ``b``
the same way.  Over all applicable entries the largest lower and the smallest
upper bound win, and the ids of every entry reaching the winning value are
reported.  Only unconditional entries whose stated range contains the argument
are used; RH-conditional entries appear only in :func:`pi_assuming_rh`, whose
answer is explicitly *not* a proof.

An empty interval (lower > upper) would mean that an entry of the catalogue is
false; it raises :class:`oracle._errors.OracleError` instead of answering.
"""

from __future__ import annotations

from dataclasses import dataclass
from fractions import Fraction

from .._errors import OracleError
from .._integers import require_int
from ._catalogue import Bound, Catalogue, default_catalogue
from ._enclosures import endpoints, integer_lower, integer_upper, working_precision
from ._expressions import Formula, Unenclosable, enclose

__all__ = ["ProvenInterval", "RealInterval", "ConditionalInterval", "pi", "nth_prime", "twin_pi",
           "primes_between", "theta", "psi", "pi_assuming_rh", "applicable", "MAX_CHAIN_STEPS"]

#: How many short-interval steps :func:`primes_between` chains at most.
MAX_CHAIN_STEPS = 100


@dataclass(frozen=True)
class ProvenInterval:
    """Proven integer bounds ``lower <= f(argument) <= upper`` (None: side unknown)."""

    function: str
    argument: int | tuple[int, int]
    lower: int | None
    upper: int | None
    lower_ids: tuple[str, ...]
    upper_ids: tuple[str, ...]

    @property
    def theorems(self) -> tuple[str, ...]:
        """Ids of the catalogue entries that prove the two sides (lower first, no repeats)."""
        return tuple(dict.fromkeys(self.lower_ids + self.upper_ids))

    def contains(self, value: int) -> bool:
        """True when ``value`` is consistent with both proven sides."""
        return ((self.lower is None or value >= self.lower)
                and (self.upper is None or value <= self.upper))


@dataclass(frozen=True)
class RealInterval:
    """Proven real bounds ``lower <= f(argument) <= upper`` with exact rational endpoints."""

    function: str
    argument: int
    lower: Fraction | None
    upper: Fraction | None
    lower_ids: tuple[str, ...]
    upper_ids: tuple[str, ...]

    @property
    def theorems(self) -> tuple[str, ...]:
        return tuple(dict.fromkeys(self.lower_ids + self.upper_ids))

    def contains(self, value: Fraction | int) -> bool:
        return ((self.lower is None or value >= self.lower)
                and (self.upper is None or value <= self.upper))


@dataclass(frozen=True)
class ConditionalInterval:
    """Integer bounds that hold IF the stated hypothesis is true.  Not a proof."""

    function: str
    argument: int
    lower: int | None
    upper: int | None
    lower_ids: tuple[str, ...]
    upper_ids: tuple[str, ...]
    assumption: str

    @property
    def theorems(self) -> tuple[str, ...]:
        return tuple(dict.fromkeys(self.lower_ids + self.upper_ids))


class _Best:
    """Running best value of one side, with the ids that reach it."""

    def __init__(self, direction: str):
        self.direction = direction
        self.value = None
        self.ids: list[str] = []

    def offer(self, value, *bound_ids: str) -> None:
        if value is None:
            return
        better = (self.value is None
                  or (value > self.value if self.direction == "lower" else value < self.value))
        if better:
            self.value, self.ids = value, list(dict.fromkeys(bound_ids))
        elif value == self.value:
            self.ids.extend(bound_id for bound_id in bound_ids if bound_id not in self.ids)


def applicable(function: str, value: int, *, catalogue: Catalogue | None = None,
               assume_rh: bool = False) -> tuple[Bound, ...]:
    """Entries for ``function`` whose stated range contains ``value`` (unconditional only, by default)."""
    catalogue = catalogue or default_catalogue()
    return tuple(bound for bound in catalogue.for_function(function)
                 if bound.range.contains(value) and (assume_rh or not bound.conditional))


def _integer_sides(function: str, value: int, catalogue: Catalogue | None,
                   assume_rh: bool = False) -> tuple[_Best, _Best]:
    lower, upper = _Best("lower"), _Best("upper")
    precision = working_precision(value)
    for bound in applicable(function, value, catalogue=catalogue, assume_rh=assume_rh):
        for side in bound.sides:
            enclosure = _try_enclose(side.formula, value, precision)
            if enclosure is None:
                continue
            if side.direction == "lower":
                lower.offer(integer_lower(enclosure, side.strict), bound.id)
            else:
                upper.offer(integer_upper(enclosure, side.strict), bound.id)
    _require_consistent(function, value, lower, upper)
    return lower, upper


def _try_enclose(formula: Formula, value, precision: int):
    try:
        return enclose(formula, value, precision)
    except (Unenclosable, ZeroDivisionError):
        return None


def _require_consistent(function: str, value, lower: _Best, upper: _Best) -> None:
    if lower.value is not None and upper.value is not None and lower.value > upper.value:
        raise OracleError(
            f"{function}({value}): the catalogue contradicts itself (lower {lower.value} from "
            f"{lower.ids} > upper {upper.value} from {upper.ids}); an entry must be wrong")


def _integer_interval(function: str, value: int, catalogue: Catalogue | None) -> ProvenInterval:
    lower, upper = _integer_sides(function, value, catalogue)
    return ProvenInterval(function, value, lower.value, upper.value, tuple(lower.ids), tuple(upper.ids))


def pi(x: int, *, catalogue: Catalogue | None = None) -> ProvenInterval:
    """Proven bounds for pi(x), the number of primes p <= x (x >= 0)."""
    x = require_int("x", x, minimum=0)
    return _integer_interval("pi", x, catalogue)


def nth_prime(n: int, *, catalogue: Catalogue | None = None) -> ProvenInterval:
    """Proven bounds for p_n, the n-th prime (n >= 1, p_1 = 2)."""
    n = require_int("n", n, minimum=1)
    return _integer_interval("nth_prime", n, catalogue)


def twin_pi(x: int, *, catalogue: Catalogue | None = None) -> ProvenInterval:
    """Proven bounds for pi_2(x), the number of pairs (p, p + 2) of primes with p + 2 <= x."""
    x = require_int("x", x, minimum=0)
    return _integer_interval("twin_pi", x, catalogue)


def _real_interval(function: str, x: int, catalogue: Catalogue | None) -> RealInterval:
    lower, upper = _Best("lower"), _Best("upper")
    precision = working_precision(x)
    for bound in applicable(function, x, catalogue=catalogue):
        for side in bound.sides:
            enclosure = _try_enclose(side.formula, x, precision)
            if enclosure is None:
                continue
            low, high = endpoints(enclosure)
            if side.direction == "lower":
                lower.offer(low, bound.id)
            else:
                upper.offer(high, bound.id)
    _require_consistent(function, x, lower, upper)
    return RealInterval(function, x, lower.value, upper.value, tuple(lower.ids), tuple(upper.ids))


def theta(x: int, *, catalogue: Catalogue | None = None) -> RealInterval:
    """Proven bounds for Chebyshev's theta(x) = sum of ln p over primes p <= x."""
    x = require_int("x", x, minimum=0)
    return _real_interval("theta", x, catalogue)


def psi(x: int, *, catalogue: Catalogue | None = None) -> RealInterval:
    """Proven bounds for Chebyshev's psi(x) = sum of ln p over prime powers p^k <= x."""
    x = require_int("x", x, minimum=0)
    return _real_interval("psi", x, catalogue)


def primes_between(a: int, b: int, *, catalogue: Catalogue | None = None) -> ProvenInterval:
    """Proven bounds for the number of primes in (a, b], 0 <= a <= b.

    Sources of each side, all of which are tried:

    * entries on ``pi(a + h) - pi(a)`` in the length ``h = b - a`` (Brun-Titchmarsh, sieve counts);
    * entries on ``pi(2x) - pi(x)`` at ``x = a`` when ``(a, b]`` contains or is inside ``(a, 2a]``;
    * the difference of the proven intervals for ``pi(b)`` and ``pi(a)``;
    * short-interval theorems, chained: a prime in ``(a, V1]``, then one in ``(V1, V2]`` with the
      theorem applied at ``V1``, and so on, at most :data:`MAX_CHAIN_STEPS` times.
    """
    a = require_int("a", a, minimum=0)
    b = require_int("b", b, minimum=a)
    h = b - a
    lower, upper = _integer_sides("primes_between", h, catalogue)
    if a >= 1:
        dyadic_lower, dyadic_upper = _integer_sides("primes_in_dyadic", a, catalogue)
        if b >= 2 * a:
            lower.offer(dyadic_lower.value, *dyadic_lower.ids)
        if b <= 2 * a:
            upper.offer(dyadic_upper.value, *dyadic_upper.ids)
    at_b, at_a = pi(b, catalogue=catalogue), pi(a, catalogue=catalogue)
    if at_b.lower is not None and at_a.upper is not None:
        lower.offer(at_b.lower - at_a.upper, *at_b.lower_ids, *at_a.upper_ids)
    if at_b.upper is not None and at_a.lower is not None:
        upper.offer(at_b.upper - at_a.lower, *at_b.upper_ids, *at_a.lower_ids)
    for bound in (catalogue or default_catalogue()).for_function("prime_in_interval"):
        if not bound.conditional:
            count = _chained_count(bound, a, b)
            if count:
                lower.offer(count, bound.id)
    _require_consistent("primes_between", (a, b), lower, upper)
    return ProvenInterval("primes_between", (a, b), lower.value, upper.value,
                          tuple(lower.ids), tuple(upper.ids))


def _chained_count(bound: Bound, a: int, b: int) -> int | None:
    """Primes in (a, b] guaranteed by applying one short-interval theorem repeatedly."""
    if bound.left.text == "x":
        return _chain_rightwards(bound, a, b)
    if bound.right.text == "x" and bound.right_closed:
        return _chain_leftwards(bound, a, b)
    return None


def _chain_rightwards(bound: Bound, a: int, b: int) -> int | None:
    """Theorem 'a prime in (x, R(x)]' (or '[x, R(x)]'): step from a towards b."""
    count, position = 0, a
    while count < MAX_CHAIN_STEPS:
        x = position + 1 if bound.left_closed else position
        if not bound.range.contains(x):
            break
        enclosure = _try_enclose(bound.right, x, working_precision(x))
        if enclosure is None:
            break
        largest = integer_upper(enclosure, strict=not bound.right_closed)
        if largest is None or largest > b:
            break
        count, position = count + 1, largest
    return count


def _chain_leftwards(bound: Bound, a: int, b: int) -> int | None:
    """Theorem 'a prime in (L(x), x]': step from b down towards a."""
    count, position = 0, b
    while count < MAX_CHAIN_STEPS:
        if not bound.range.contains(position):
            break
        enclosure = _try_enclose(bound.left, position, working_precision(position))
        if enclosure is None:
            break
        low, _ = endpoints(enclosure)
        if low is None:
            break
        floor_low = low.numerator // low.denominator   # the prime is > L >= low, so >= floor_low + 1
        if floor_low < a:
            break
        count, position = count + 1, floor_low
    return count


def pi_assuming_rh(x: int, *, catalogue: Catalogue | None = None) -> ConditionalInterval:
    """Bounds for pi(x) that hold IF the Riemann hypothesis is true.  NOT a proof.

    Uses the RH-conditional entries (Schoenfeld 1976) together with the
    unconditional ones; the result is labelled with its assumption.
    """
    x = require_int("x", x, minimum=0)
    lower, upper = _integer_sides("pi", x, catalogue, assume_rh=True)
    return ConditionalInterval("pi", x, lower.value, upper.value, tuple(lower.ids),
                               tuple(upper.ids), assumption="RH")
