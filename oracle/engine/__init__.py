"""The audit engine: run the checks, contain the faults, localise, record.

>>> from oracle import engine, targets
>>> target = targets.python_target("sympy:primepi", role_name="prime_pi", timeout=10)
>>> summary = engine.run_audit(target, engine.AuditOptions(role="prime_pi", profile="quick", seed=1))
>>> summary["passed"]                                         # doctest: +SKIP
True

>>> engine.judge_point("prime_pi", (10**6,), 78498).passed      # OEIS A006880
True

Passing these checks is evidence, not a certificate of correctness.
"""

from ._audit import AuditInterrupted, AuditOptions, run_audit
from ._point import audit_invalid_inputs, judge_point
from ._corpus import DEFAULT_CORPUS, load_corpus, record_failures
from ._speed import SpeedModel
from ._records import FAILURE_STATUSES, SKIPS_KEEPING_COMPLETE, failure_statuses, new_run_path, point_to_latest, read_records, summarise

__all__ = ["AuditOptions", "AuditInterrupted", "run_audit", "SpeedModel", "judge_point", "audit_invalid_inputs", "new_run_path", "point_to_latest", "DEFAULT_CORPUS", "load_corpus", "record_failures",
           "FAILURE_STATUSES", "failure_statuses", "SKIPS_KEEPING_COMPLETE", "read_records", "summarise", "rebuild_summary"]


def rebuild_summary(path) -> dict:
    """The summary of the audit whose records are in the JSON-lines file ``path``."""
    return summarise(read_records(path))
