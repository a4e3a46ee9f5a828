"""Ask a target at one group of points and judge the answers with the audit engine.

The judging is the engine's own (:mod:`oracle.engine._audit`): the same
normalisation, the same verdicts, the same first divergence (bisection for
counting roles between the group's largest agreeing and smallest failing
point), the same summary (docs/DESIGN.md, ``audit --json``).  Valid points go
through the public :func:`oracle.engine.run_audit` with ``only=points``.
Inputs outside a role's domain are judged by the engine's run object
(``_Run.ask_invalid``) -- a private helper, used read-only because the engine
has no public entry for it yet.
"""

from __future__ import annotations

import time
from typing import Callable

from ..engine import AuditOptions, run_audit
from ..roles import Conventions
from ..targets import OK, RAISED, CallResult

__all__ = ["judge_points", "judge_invalid_inputs", "CallableTarget"]


def judge_points(target, *, role: str, profile: str, seed: int, points: list[tuple[int, ...]],
                 timeout: float | None = None, maximum: int | None = None,
                 conventions: dict | None = None, stream: str | None = None) -> dict:
    """The audit summary of ``target`` asked at exactly ``points``."""
    options = AuditOptions(role=role, profile=profile, seed=seed, timeout=timeout, maximum=maximum,
                           conventions=Conventions(**(conventions or {})), stream=stream)
    return run_audit(target, options, only=points)


def judge_invalid_inputs(target, *, role: str, profile: str, seed: int,
                         points: list[tuple[int, ...]], timeout: float | None = None,
                         conventions: dict | None = None, stream: str | None = None) -> dict:
    """The summary of ``target`` asked at inputs outside the role's domain: a hang or a crash
    is a finding; an answer is one only under the convention ``invalid_input: raise``."""
    from .. import sampling
    from ..engine import _audit
    from ..engine._records import RecordStream, summarise

    chosen = sampling.profile(profile)
    options = AuditOptions(role=role, profile=profile, seed=seed,
                           timeout=timeout if timeout is not None else chosen.timeout,
                           conventions=Conventions(**(conventions or {})), stream=stream)
    records = RecordStream(stream)
    run = _audit._Run(target, options, records)
    try:
        records.write({"type": "start", "target": target.description, "role": role,
                       "profile": chosen.name, "seed": seed, "timeout": options.timeout,
                       "maximum": None, "isolated": target.isolated,
                       "conventions": vars(options.conventions), "elapsed": 0.0})
        run.ask_invalid([("invalid-input", tuple(point)) for point in points])
        run.write_skipped()
        records.write({"type": "end", "elapsed": run.elapsed()})
    finally:
        records.close()
    return summarise(records.records)


class CallableTarget:
    """A Python callable as a target, called in this process without a timeout (for
    hand-written tests; a hang is left to pytest's own timeout plugins)."""

    isolated = False

    def __init__(self, function: Callable, description: str | None = None):
        self.function = function
        self.description = description or getattr(function, "__qualname__", repr(function))

    def call_many(self, calls, *, stop_on_fault: bool = False) -> list[CallResult]:
        return [self._call(arguments) for arguments in calls]

    def _call(self, arguments) -> CallResult:
        started = time.perf_counter()
        from ..targets._worker import bounded_answer, describe_exception

        try:
            value = bounded_answer(self.function(*arguments))
        except Exception as error:
            return CallResult(RAISED, error=describe_exception(error),
                              seconds=time.perf_counter() - started)
        return CallResult(OK, value, seconds=time.perf_counter() - started)

    def close(self) -> None:
        pass
