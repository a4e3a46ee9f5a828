"""The outcome of one call of a candidate, whatever kind of target it is."""

from __future__ import annotations

from typing import NamedTuple

__all__ = ["CallResult", "OK", "RAISED", "TIMEOUT", "CRASHED", "BAD_OUTPUT"]

OK, RAISED, TIMEOUT, CRASHED, BAD_OUTPUT = "ok", "raised", "timeout", "crashed", "bad-output"


class CallResult(NamedTuple):
    """``status`` is ``ok`` (``value`` holds the raw answer), ``raised`` (the candidate
    signalled an error: ``error`` says which), ``timeout`` (no answer within the
    per-call limit), ``crashed`` (the process died: ``error`` says how) or ``bad-output``
    (an executable or worker broke the line protocol: a flood, an extra line)."""

    status: str
    value: object = None
    error: str = ""
    seconds: float = 0.0
