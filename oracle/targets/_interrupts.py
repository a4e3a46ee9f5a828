"""Telling the user's Ctrl-C from a ``KeyboardInterrupt`` that a candidate raises.

A candidate called in this process may raise ``KeyboardInterrupt`` itself (or any other
``BaseException``: ``SystemExit``, pytest's skip, xfail and exit outcomes); that is a fault of
the candidate, to be reported as ``raised``, not a reason to stop the run.  The user's Ctrl-C
arrives as ``SIGINT``: while :class:`UserInterrupts` is active (in the main thread, the only
one that receives signals in Python) its handler notes the keypress before raising, so
:meth:`UserInterrupts.is_users` can tell the two apart.  Outside the main thread nothing is
installed and every ``KeyboardInterrupt`` counts as the candidate's.
"""

from __future__ import annotations

import signal
import threading

__all__ = ["UserInterrupts"]


class UserInterrupts:
    """``with UserInterrupts() as interrupts: ...``; ``interrupts.is_users(error)``."""

    def __init__(self):
        self.pressed = False
        self._previous = None
        self._armed = False

    def __enter__(self) -> "UserInterrupts":
        self.pressed = False
        self._armed = threading.current_thread() is threading.main_thread()
        if self._armed:
            self._previous = signal.signal(signal.SIGINT, self._on_interrupt)
        return self

    def __exit__(self, *exc) -> None:
        if self._armed:
            # None: the previous handler was not installed from Python; the default then
            signal.signal(signal.SIGINT, self._previous if self._previous is not None
                          else signal.default_int_handler)
            self._armed = False

    def _on_interrupt(self, signum, frame):
        self.pressed = True
        raise KeyboardInterrupt

    def is_users(self, error: BaseException) -> bool:
        """Whether ``error`` is the user's Ctrl-C (to be re-raised), not the candidate's doing."""
        return isinstance(error, KeyboardInterrupt) and self.pressed
