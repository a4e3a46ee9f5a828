"""The outcome of one call of a candidate, whatever kind of target it is."""

from __future__ import annotations

from typing import NamedTuple

__all__ = ["CallResult", "OK", "RAISED", "TIMEOUT", "CRASHED"]

OK, RAISED, TIMEOUT, CRASHED = "ok", "raised", "timeout", "crashed"


class CallResult(NamedTuple):
    """``status`` is ``ok`` (``value`` holds the raw answer), ``raised`` (the candidate
    signalled an error: ``error`` says which), ``timeout`` (no answer within the
    per-call limit) or ``crashed`` (the process died: ``error`` says how)."""

    status: str
    value: object = None
    error: str = ""
    seconds: float = 0.0
