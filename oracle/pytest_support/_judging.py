"""Ask a target at one group of points and judge the answers with the audit engine.

The judging is the engine's own (:mod:`oracle.engine`): the same
normalisation, the same verdicts, the same first divergence (bisection for
counting roles between the group's largest agreeing and smallest failing
point), the same summary (docs/DESIGN.md, ``audit --json``).  Valid points go
through the public :func:`oracle.engine.run_audit` with ``only=points``, inputs
outside a role's domain through :func:`oracle.engine.audit_invalid_inputs`.
"""

from __future__ import annotations

import time
from typing import Callable

from ..engine import AuditOptions, audit_invalid_inputs, run_audit
from ..roles import Conventions
from ..targets import OK, RAISED, CallResult

__all__ = ["judge_points", "judge_invalid_inputs", "CallableTarget"]


def judge_points(target, *, role: str, profile: str, seed: int, points: list[tuple[int, ...]],
                 timeout: float | None = None, maximum: int | None = None,
                 conventions: dict | None = None, stream: str | None = None,
                 on_record: Callable[[dict], None] | None = None, speed=None) -> dict:
    """The audit summary of ``target`` asked at exactly ``points`` (``on_record`` is called with
    every record written; ``speed``, the target's cost curve from earlier items,
    :class:`oracle.engine.SpeedModel`, judges its timeouts)."""
    options = AuditOptions(role=role, profile=profile, seed=seed, timeout=timeout, maximum=maximum,
                           conventions=Conventions(**(conventions or {})), stream=stream,
                           on_record=on_record)
    return run_audit(target, options, only=points, speed=speed)


def judge_invalid_inputs(target, *, role: str, profile: str, seed: int,
                         points: list[tuple[int, ...]], timeout: float | None = None,
                         conventions: dict | None = None, stream: str | None = None,
                         on_record: Callable[[dict], None] | None = None) -> dict:
    """The summary of ``target`` asked at inputs outside the role's domain: a hang or a crash
    is a finding; an answer is one only under the convention ``invalid_input: raise``
    (:func:`oracle.engine.audit_invalid_inputs`)."""
    options = AuditOptions(role=role, profile=profile, seed=seed, timeout=timeout,
                           conventions=Conventions(**(conventions or {})), stream=stream,
                           on_record=on_record)
    return audit_invalid_inputs(target, options, points)


class CallableTarget:
    """A Python callable as a target, called in this process without a timeout (for
    hand-written tests; a hang is left to pytest's own timeout plugins)."""

    isolated = False

    def __init__(self, function: Callable, description: str | None = None):
        self.function = function
        self.description = description or getattr(function, "__qualname__", repr(function))

    def call_many(self, calls, *, stop_on_fault: bool = False) -> list[CallResult]:
        from ..targets._interrupts import UserInterrupts

        with UserInterrupts() as interrupts:
            return [self._call(arguments, interrupts) for arguments in calls]

    def _call(self, arguments, interrupts) -> CallResult:
        """Any exception of the function is a finding (``raised``): ``pytest.skip``,
        ``pytest.xfail``, ``pytest.exit``, ``SystemExit`` and ``KeyboardInterrupt`` included,
        which would otherwise turn the check into a skip, an expected failure or the end of
        the session; only the user's own Ctrl-C goes through."""
        started = time.perf_counter()
        from ..targets._in_process import materialise
        from ..targets._worker import describe_exception

        try:
            value = materialise(self.function(*arguments))
        except BaseException as error:
            if interrupts.is_users(error):
                raise
            return CallResult(RAISED, error=describe_exception(error),
                              seconds=time.perf_counter() - started)
        return CallResult(OK, value, seconds=time.perf_counter() - started)

    def close(self) -> None:
        pass
