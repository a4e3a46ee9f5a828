"""Argument checks shared by every strategy, raising one error type.

Each public strategy function checks its arguments when it is called, before
any example is drawn, so a mistake shows up at the line that builds the
strategy.  The error is :class:`InvalidStrategyArgument`: a
``hypothesis.errors.InvalidArgument`` (what hypothesis users expect from a
strategy) that is also an :class:`oracle.InvalidInputError` (what the rest of
ntoracle raises), with messages in ``name=value`` form.
"""

from __future__ import annotations

from collections.abc import Sequence

from hypothesis.errors import InvalidArgument

from .._errors import InvalidInputError
from .._integers import require_int

__all__ = ["InvalidStrategyArgument", "check_integer", "check_optional_integer", "check_bases"]

#: Largest number of Miller--Rabin bases a strong-pseudoprime strategy accepts.
MAX_BASES = 32


class InvalidStrategyArgument(InvalidArgument, InvalidInputError):
    """A strategy was given a bad argument (both a hypothesis and an ntoracle error)."""


def check_integer(name: str, value: object, *, minimum: int | None = None,
                  maximum: int | None = None) -> int:
    """``value`` as an ``int`` within the bounds, through :func:`oracle._integers.require_int`."""
    try:
        return require_int(name, value, minimum=minimum, maximum=maximum)
    except InvalidInputError as error:
        raise InvalidStrategyArgument(str(error)) from None


def check_optional_integer(name: str, value: object, *, minimum: int | None = None) -> int | None:
    """Like :func:`check_integer`, but ``None`` (no bound) passes through."""
    if value is None:
        return None
    return check_integer(name, value, minimum=minimum)


def check_bases(bases: object) -> tuple[int, ...]:
    """A non-empty sequence of distinct integers ``>= 2``, returned sorted as a tuple."""
    if isinstance(bases, (str, bytes)) or not isinstance(bases, Sequence):
        raise InvalidStrategyArgument(
            f"bases={bases!r}: expected a sequence of integers such as (2, 3)")
    if not 1 <= len(bases) <= MAX_BASES:
        raise InvalidStrategyArgument(
            f"bases={tuple(bases)!r}: give between 1 and {MAX_BASES} bases")
    checked = [check_integer(f"bases[{index}]", base, minimum=2, maximum=2**64)
               for index, base in enumerate(bases)]
    if len(set(checked)) != len(checked):
        raise InvalidStrategyArgument(f"bases={tuple(bases)!r}: the bases must be distinct")
    return tuple(sorted(checked))
