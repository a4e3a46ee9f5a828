"""Judging one answer at one point, and asking a target at inputs outside the domain.

:func:`judge_point` is the engine's judgement of a single answer, for front ends
that obtained the answer themselves (the plugin's ``ntoracle_check.answer``):
the same normalisation and the same checks as an audit, without a run around
them.  :func:`audit_invalid_inputs` asks a target at inputs outside its role's
domain with the audit's fault containment (a hang or a crash is a finding; an
answer is one only under the convention ``invalid_input: raise``) and returns
the summary of an audit.
"""

from __future__ import annotations

from .. import roles as roles_module
from .._bounded import bounded_text
from .._errors import OutOfReachError
from ..roles import AbsurdAnswer, Conventions, Role, Verdict, WrongType

__all__ = ["judge_point", "judge_value", "normalise_answer", "audit_invalid_inputs",
           "WRONG_TYPE_CHECK", "SIZE_CHECK"]

#: The ``check`` of a verdict on an answer of a type the role does not accept (status wrong-type).
WRONG_TYPE_CHECK = "type"
#: The ``check`` of a verdict on an integer too large to be any answer (status wrong).
SIZE_CHECK = "size"


def judge_point(role: str, arguments, got, *, conventions: Conventions | dict | None = None,
                budget: float = 10.0) -> Verdict:
    """The verdict on the answer ``got`` of ``role`` at ``arguments`` (a tuple, or one integer).

    ``conventions`` as for an audit (a :class:`oracle.roles.Conventions` or its keys);
    ``budget`` bounds the oracle's own computation, in seconds.  An answer of the wrong
    type fails with check ``"type"``, an absurdly large integer with check ``"size"``;
    when no reference is within the oracle's reach the verdict has ``reach=False``
    (nothing was checked: not a pass) and its detail says why.
    """
    chosen = roles_module.get(role)
    rules = conventions if isinstance(conventions, Conventions) else Conventions(**(conventions or {}))
    arguments = tuple(arguments) if isinstance(arguments, (tuple, list)) else (arguments,)
    value, refused = normalise_answer(chosen, got, rules)
    if refused is not None:
        return refused
    return judge_value(chosen, arguments, value, rules, budget)


def judge_value(role: Role, arguments: tuple, value: object, conventions: Conventions,
                budget: float = 10.0) -> Verdict:
    """The verdict on ``value``, an answer already in the role's normal form (from
    :func:`normalise_answer`): :func:`judge_point` without the normalisation, for a front end
    that normalises the answer itself to contain what its methods do."""
    try:
        return role.judge(arguments, value, conventions, budget)
    except OutOfReachError as error:
        return Verdict("exact", False, None, "", bounded_text(str(error)), reach=False)


def normalise_answer(role: Role, raw, conventions: Conventions) -> tuple[object, Verdict | None]:
    """``(value, None)``: the raw answer in the role's normal form; or ``(None, verdict)``, the
    failed verdict on an answer of a type the role does not accept (check ``"type"``) or an
    integer too large to be any answer (check ``"size"``).  The audit uses it too."""
    try:
        return role.normalise(raw, conventions), None
    except AbsurdAnswer as error:
        return None, Verdict(SIZE_CHECK, False, "an integer of at most about 4010 digits",
                             "definition", bounded_text(str(error)))
    except WrongType as error:
        return None, Verdict(WRONG_TYPE_CHECK, False, role.signature, "definition",
                             bounded_text(str(error)))


def audit_invalid_inputs(target, options, points: list[tuple[int, ...]]) -> dict:
    """The audit summary of ``target`` asked at ``points``, inputs outside the role's domain
    (``options``: an :class:`oracle.engine.AuditOptions`; its timeout, or the profile's)."""
    import dataclasses

    from .. import sampling
    from . import _audit
    from ._records import RecordStream, summarise

    chosen = sampling.profile(options.profile)
    if options.timeout is None:
        options = dataclasses.replace(options, timeout=chosen.timeout)
    records = RecordStream(options.stream, on_record=options.on_record)
    run = _audit._Run(target, options, records)
    try:
        records.write({"type": "start", "target": target.description, "role": options.role,
                       "profile": chosen.name, "seed": options.seed, "timeout": options.timeout,
                       "maximum": None, "isolated": target.isolated,
                       "conventions": vars(options.conventions), "elapsed": 0.0})
        run.ask_invalid([("invalid-input", tuple(point)) for point in points])
        run.write_skipped()
        records.write({"type": "end", "elapsed": run.elapsed()})
    finally:
        records.close()
    return summarise(records.records)
