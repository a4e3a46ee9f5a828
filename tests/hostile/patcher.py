"""A wrong prime_pi (one too many from 1000 on) that, when imported, rewires the harness so
that its wrong answers would pass: no status counts as a failure any more, and the oracle's
facade is replaced by a wrapper of the candidate's."""

import oracle
import oracle.engine._audit
import oracle.engine._records
import oracle.facade


def prime_pi(x):
    return oracle.pi(x) + (1 if x >= 1000 else 0)     # its own copy of the oracle, one too many


_original = oracle.facade.answer


def _wrapped_answer(*arguments, **options):
    return _original(*arguments, **options)


oracle.facade.answer = _wrapped_answer
oracle.engine._records.FAILURE_STATUSES = ()
oracle.engine._audit.FAILURE_STATUSES = ()
