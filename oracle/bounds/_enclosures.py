"""Rigorous enclosures: intervals with directed rounding, and their exact endpoints.

Everything the oracle proves goes through here.  The arithmetic is
``mpmath.iv`` (Johansson, mpmath 1.3): ``+ - * /`` and integer powers round the
lower endpoint down and the upper endpoint up, and ``log``, ``exp`` and ``sqrt``
call the library's elementary functions with ``round_floor`` / ``round_ceiling``
(``mpmath/libmp/libmpi.py``).  As a second line of defence every elementary
function value (and every built-in constant) is widened outward by a relative
``2**-(precision - 8)``, so a last-place error inside the library cannot make
an enclosure lie.

The logarithmic integral is enclosed here from its series (Abramowitz & Stegun
1964, 5.1.10 with li(x) = Ei(ln x))::

    li(x) = gamma + ln u + sum_{k>=1} u^k / (k * k!),   u = ln x > 0,

whose terms are positive; once ``k + 1 >= 2u`` each term is less than half the
previous one, so the tail after the last term kept is at most twice the next
term.  That tail bound is added to the upper endpoint.
"""

from __future__ import annotations

import contextlib
import math
from fractions import Fraction

import numpy as np
from mpmath import iv, libmp

__all__ = ["working_precision", "precision", "exact_interval", "constant", "function",
           "power", "li_enclosure", "li_float", "endpoints", "integer_lower",
           "integer_upper"]

#: Largest size (in bits) of a power we are willing to enclose; beyond it a
#: bound is skipped (a skipped bound can never make an interval wrong).
MAX_POWER_BITS = 1 << 22

#: Digits of the twin prime constant C2 = prod_{p>2} p(p-2)/(p-1)^2
#: (OEIS A005597, digits due to Wrench 1961); enclosed as digits +- 1e-50.
C2_DIGITS = "0.66016181584686957392781211001455577843262336028473"


def working_precision(value: int | Fraction) -> int:
    """Bits of working precision for arguments of the size of ``value``.

    The argument itself must be exact and an integer-valued bound near ``x``
    needs absolute accuracy well below 1, hence ``bits(x)`` plus a margin.
    """
    value = Fraction(value)
    size = max(abs(value.numerator).bit_length(), value.denominator.bit_length(), 1)
    return size + 96


@contextlib.contextmanager
def precision(bits: int):
    """Temporarily set the working precision of ``mpmath.iv``."""
    saved = iv.prec
    iv.prec = bits
    try:
        yield
    finally:
        iv.prec = saved


def exact_interval(value: int | Fraction):
    """The tightest interval around an exact rational (a point for most integers)."""
    value = Fraction(value)
    numerator = iv.mpf(value.numerator)
    if value.denominator == 1:
        return numerator
    return numerator / iv.mpf(value.denominator)


def _widen(interval, bits: int):
    slack = iv.mpf(2) ** (-(bits - 8))
    return interval * iv.mpf([1 - slack.a, 1 + slack.b])


def constant(name: str):
    """Enclosure of a named constant at the current precision."""
    if name == "C2":
        digits = Fraction(C2_DIGITS)
        ulp = Fraction(1, 10 ** 50)
        return iv.mpf([exact_interval(digits - ulp).a, exact_interval(digits + ulp).b])
    builtin = {"pi": iv.pi, "e": iv.e, "gamma": iv.euler}[name]
    return _widen(+builtin, iv.prec)


def function(name: str, argument, bits: int):
    """Enclosure of ``ln``, ``sqrt``, ``exp`` or ``li`` over an interval argument."""
    from ._expressions import Unenclosable
    if name == "li":
        return li_enclosure(argument, bits)
    if name in ("ln", "sqrt") and argument.a <= 0:
        if name == "ln" or argument.a < 0:
            raise Unenclosable(f"{name} of an interval reaching {argument.a}")
    if name == "exp" and argument.b > MAX_POWER_BITS * math.log(2):
        raise Unenclosable("exp of a huge argument")
    value = {"ln": iv.log, "sqrt": iv.sqrt, "exp": iv.exp}[name](argument)
    return _widen(value, bits)


def power(base, exponent, bits: int):
    """Enclosure of ``base ** exponent`` (integer exponents exactly, others via exp/ln)."""
    from ._expressions import Unenclosable
    if exponent.a == exponent.b and exponent.a == int(exponent.a):
        k = int(exponent.a)
        low, high = endpoints(base)
        if low is None or high is None:
            raise Unenclosable("power of an unbounded base")
        largest = max(abs(low), abs(high))
        size_bits = largest.numerator.bit_length() - largest.denominator.bit_length()
        if abs(k) * max(size_bits, 1) > MAX_POWER_BITS:
            raise Unenclosable("power too large to enclose")
        return base ** k
    if base.a <= 0:
        raise Unenclosable("non-integer power of a base reaching 0")
    log_base = function("ln", base, bits)
    return function("exp", exponent * log_base, bits)


def li_enclosure(argument, bits: int):
    """Enclosure of li over an interval of arguments > 1 (li is increasing there)."""
    from ._expressions import Unenclosable
    if argument.a <= 1:
        raise Unenclosable("li is only enclosed for arguments > 1")
    u = function("ln", argument, bits)
    total = constant("gamma") + function("ln", u, bits)
    term = u                                   # k = 1: u^1 / (1 * 1!)
    series = term
    k = 1
    while True:
        following = term * u * k / ((k + 1) * (k + 1))
        small = following.b * 2 < series.a * iv.mpf(2) ** (-(bits + 8))
        if k + 1 >= 2 * u.b and small:
            tail = iv.mpf([0, (following * 2).b])
            return total + series + tail
        term = following
        series = series + term
        k += 1


def li_float(values: np.ndarray) -> np.ndarray:
    """li by the same series in float64 (screening only; not an enclosure)."""
    u = np.log(np.asarray(values, dtype=np.float64))
    with np.errstate(all="ignore"):
        upper = float(np.nanmax(u)) if u.size else 0.0
        terms = int(2 * max(upper, 1.0) + 60)
        term = u.copy()
        series = u.copy()
        for k in range(1, terms):
            term = term * u * k / ((k + 1) * (k + 1))
            series += term
        return 0.5772156649015329 + np.log(u) + series


def endpoints(interval) -> tuple[Fraction | None, Fraction | None]:
    """The exact endpoints of an interval as Fractions (None for an infinite end)."""
    low, high = interval._mpi_
    return _fraction(low), _fraction(high)


def _fraction(value) -> Fraction | None:
    if value in (libmp.finf, libmp.fninf):
        return None
    if value == libmp.fnan:
        raise ArithmeticError("an enclosure endpoint is NaN")
    numerator, denominator = libmp.to_rational(value)
    return Fraction(int(numerator), int(denominator))


def integer_lower(interval, strict: bool) -> int | None:
    """Largest integer provably <= an integer quantity that is >= (or >) the interval's value.

    ``value >= L`` and ``L >= a`` give ``value >= ceil(a)``; ``value > L`` gives
    ``value >= floor(a) + 1``.  Only the lower endpoint ``a`` is used.
    """
    low, _ = endpoints(interval)
    if low is None:
        return None
    return int(math.floor(low) + 1 if strict else math.ceil(low))


def integer_upper(interval, strict: bool) -> int | None:
    """Smallest integer provably >= an integer quantity that is <= (or <) the interval's value."""
    _, high = endpoints(interval)
    if high is None:
        return None
    return int(math.ceil(high) - 1 if strict else math.floor(high))
