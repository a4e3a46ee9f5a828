"""A Python callable called in this process, with a per-call timeout.

The timeout is a ``SIGALRM`` interval timer (POSIX ``setitimer``), armed only
in the main thread; it interrupts Python code and most blocking calls, but not
a C extension that never returns to the interpreter -- for that, and for
candidates that may crash or exhaust memory, use the isolated target
(:mod:`oracle.targets._line_process` with the worker of :mod:`oracle.targets._worker`).
A call that returns but took longer than the timeout is reported as a timeout too.
"""

from __future__ import annotations

import signal
import threading
import time
from typing import Callable, Sequence

from ._call import OK, RAISED, TIMEOUT, CallResult

__all__ = ["InProcessTarget"]


class _CallTimedOut(BaseException):
    """Raised by the alarm inside a candidate; a BaseException so that ``except Exception`` in
    the candidate does not swallow it."""


def materialise(value: object) -> object:
    """Consume a lazy iterator (a generator) so that its work is timed with the call."""
    if hasattr(value, "__next__"):
        return list(value)
    return value


class InProcessTarget:
    """Calls ``function(*arguments)`` directly.

    Each call arms the timer afresh (which replaces the previous call's timer) and
    the timer is disarmed once, after the last call of a batch; an alarm that goes
    off between two calls finds no call running and is ignored.
    """

    isolated = False

    def __init__(self, function: Callable, *, timeout: float, description: str):
        self.function = function
        self.timeout = timeout
        self.description = description
        self._calling = False

    def _on_alarm(self, signum, frame):
        if self._calling:
            raise _CallTimedOut()

    def call_many(self, calls: Sequence[tuple[int, ...]]) -> list[CallResult]:
        alarm = threading.current_thread() is threading.main_thread()
        previous = signal.signal(signal.SIGALRM, self._on_alarm) if alarm else None
        try:
            return [self._call(arguments, alarm) for arguments in calls]
        finally:
            if alarm:
                signal.setitimer(signal.ITIMER_REAL, 0)
                signal.signal(signal.SIGALRM, previous)

    def _call(self, arguments: tuple[int, ...], alarm: bool) -> CallResult:
        function, timeout = self.function, self.timeout
        started = time.perf_counter()
        try:
            if alarm:
                signal.setitimer(signal.ITIMER_REAL, timeout)
            self._calling = True
            try:
                value = materialise(function(*arguments))
            finally:
                self._calling = False
        except _CallTimedOut:
            return CallResult(TIMEOUT, error=f"no answer within {timeout:g} s",
                              seconds=time.perf_counter() - started)
        except (Exception, SystemExit) as error:
            return CallResult(RAISED, error=f"{type(error).__name__}: {error}"[:300],
                              seconds=time.perf_counter() - started)
        seconds = time.perf_counter() - started
        if seconds > timeout:
            return CallResult(TIMEOUT, error=f"answered after {seconds:.3g} s, over the {timeout:g} s limit",
                              seconds=seconds)
        return CallResult(OK, value, seconds=seconds)

    def close(self) -> None:
        pass
