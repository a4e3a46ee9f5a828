"""A Python callable called in this process, with a per-call timeout: the mode that trusts
the candidate (``ntoracle audit --in-process``).

The candidate then shares the harness's memory: it can patch the oracle, exit the process
or crash it, and the verdict is only as good as the candidate's manners.  Use it for speed
on code you trust; the default is the isolated worker.

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
from ._interrupts import UserInterrupts
from ._protocol import decode_json_value
from ._tamper import changes, fingerprint
from ._worker import bounded_answer, describe_exception, encode_value

__all__ = ["InProcessTarget"]


class _CallTimedOut(BaseException):
    """Raised by the alarm inside a candidate; a BaseException so that ``except Exception`` in
    the candidate does not swallow it."""


def materialise(value: object) -> object:
    """The answer as plain data, exactly as the isolated worker would send it: a lazy iterator
    consumed (so that its work is timed with the call), the answer bounded
    (:func:`oracle.targets._worker.bounded_answer`), then encoded and decoded as on the
    worker's pipe.  Every method of the candidate's objects (``__index__``, ``__iter__``,
    ``__repr__``, ``tolist``...) thus runs here, inside the call's timer and its exception
    handler, never later in the judge, where a raising or hanging method would end the run."""
    bounded = bounded_answer(value)
    kind = type(bounded)
    if kind is int or kind is bool:                         # the common cases, as the pipe
        return bounded                                      # would give them, without it
    if (kind is list or kind is tuple) and all(type(item) is int for item in bounded):
        return list(bounded)
    if kind is dict and all(type(key) is int and type(item) is int for key, item in bounded.items()):
        return bounded
    return decode_json_value(encode_value(bounded))


class InProcessTarget:
    """Calls ``function(*arguments)`` directly.

    Each call arms the timer afresh (which replaces the previous call's timer) and
    the timer is disarmed once, after the last call of a batch; an alarm that goes
    off between two calls finds no call running and is ignored.
    """

    isolated = False

    def __init__(self, function: Callable, *, timeout: float, description: str,
                 fingerprint: dict | None = None):
        self.function = function
        self._fingerprint = fingerprint
        self.timeout = timeout
        self.description = description
        self._calling = False
        self._interrupts = UserInterrupts()

    def _on_alarm(self, signum, frame):
        if self._calling:
            raise _CallTimedOut()

    def call_many(self, calls: Sequence[tuple[int, ...]], *, stop_on_fault: bool = False) -> list[CallResult]:
        """The results in order; with ``stop_on_fault`` the list ends at the first timeout."""
        alarm = threading.current_thread() is threading.main_thread()
        if alarm:
            previous = signal.signal(signal.SIGALRM, self._on_alarm)
        try:
            with self._interrupts:
                results = []
                for arguments in calls:
                    results.append(self._call(arguments, alarm))
                    if stop_on_fault and results[-1].status == TIMEOUT:
                        break
                return results
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
        except BaseException as error:
            if self._interrupts.is_users(error):
                raise                   # the user's Ctrl-C, not the candidate's exception
            return CallResult(RAISED, error=describe_exception(error),
                              seconds=time.perf_counter() - started)
        seconds = time.perf_counter() - started
        if seconds > timeout:
            return CallResult(TIMEOUT, error=f"answered after {seconds:.3g} s, over the {timeout:g} s limit",
                              seconds=seconds)
        return CallResult(OK, value, seconds=seconds)

    def tampered(self) -> list[str]:
        """What of the oracle and the builtins changed since before the candidate was imported
        (:mod:`oracle.targets._tamper`); empty when nothing did or no fingerprint was taken."""
        if self._fingerprint is None:
            return []
        return changes(self._fingerprint, fingerprint())

    def close(self) -> None:
        pass
