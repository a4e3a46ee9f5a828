"""The exceptions of ntoracle.

Every error the oracle raises on purpose is an :class:`OracleError`, itself a
:class:`ValueError`, so callers can catch one type.  Two kinds matter to users:

* :class:`InvalidInputError` -- the question is malformed (a float, a bool, a
  negative count, a string, an absurd size).  The command line exits with 2.
* :class:`OutOfReachError` -- the question is well formed but no exact method
  answers it within the oracle's limits.  It carries what *can* be proven (an
  interval, possibly open on one side) instead of a guess.  Exit code 3.
"""

from __future__ import annotations

__all__ = ["OracleError", "InvalidInputError", "OutOfReachError"]


class OracleError(ValueError):
    """Base class of every error ntoracle raises deliberately."""


class InvalidInputError(OracleError):
    """The input is not a valid argument for the function asked."""


class OutOfReachError(OracleError):
    """No exact answer within the oracle's limits.

    ``lower`` and ``upper`` are proven integer bounds for the true value when
    known (``None`` where a side is unknown); ``theorems`` names the bound ids
    that prove them.
    """

    def __init__(self, message: str, *, lower: int | None = None,
                 upper: int | None = None, theorems: tuple[str, ...] = ()):
        super().__init__(message)
        self.lower = lower
        self.upper = upper
        self.theorems = tuple(theorems)
