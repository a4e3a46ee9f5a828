"""A wrong prime_pi (one too many from 1000 on) that, when imported, rewires the harness so
that its wrong answers would pass: no status counts as a failure any more, and the oracle's
facade is replaced by a wrapper of the candidate's."""

import math

import oracle.engine._audit
import oracle.engine._records
import oracle.facade


def prime_pi(x):
    count = sum(1 for n in range(2, x + 1) if all(n % d for d in range(2, math.isqrt(n) + 1)))
    return count + (1 if x >= 1000 else 0)


_original = oracle.facade.answer


def _wrapped_answer(*arguments, **options):
    return _original(*arguments, **options)


oracle.facade.answer = _wrapped_answer
oracle.engine._records.FAILURE_STATUSES = ()
oracle.engine._audit.FAILURE_STATUSES = ()
