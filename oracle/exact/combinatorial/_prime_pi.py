"""The public prime-counting function: validation, dispatch, budget.

``prime_pi(x)`` answers from a table below ``SMALL_LIMIT`` and by the
Deleglise-Rivat method (:mod:`._deleglise_rivat`) up to ``MAX_X = 10**18``,
from ``MIN_PARALLEL_X`` on with its costly stages spread over the cores
(:mod:`._parallel`; the same integer either way).
Above ``MAX_X`` it raises :class:`~oracle._errors.OutOfReachError` rather
than compute for hours (or overflow); it never returns a guess.
"""

from __future__ import annotations

from typing import Callable

from ..._errors import OutOfReachError
from ..._integers import require_int
from ._cost_model import estimated_seconds
from ._deleglise_rivat import LARGEST_X, prime_pi_deleglise_rivat
from ._parallel import default_workers, prime_pi_in_workers
from ._run_clock import RunClock, check_budget, validate_budget
from ._small_range import SMALL_LIMIT, small_prime_pi

#: The documented upper limit of :func:`prime_pi`.
MAX_X = LARGEST_X


def prime_pi(x: int, *, time_budget: float | None = None,
             progress: Callable[[float, str], object] | None = None,
             workers: int | None = None) -> int:
    """The number of primes ``p <= x`` (0 for ``x < 2``), exactly, for ``x <= MAX_X``.

    ``time_budget`` (seconds): raise :class:`OutOfReachError` if the cost model
    predicts more, or once the run exceeds it.  ``progress(fraction, stage)``
    is called a few times per second on long runs.  ``workers``: processes for
    the costly stages; ``None`` means every core for ``x >= MIN_PARALLEL_X`` and
    one below, ``1`` keeps the whole run in this process.
    """
    x = require_int("x", x)
    budget = validate_budget(time_budget)
    if workers is not None:
        workers = require_int("workers", workers, minimum=1)
    if x < SMALL_LIMIT:
        return small_prime_pi(x)
    if x > MAX_X:
        raise OutOfReachError(f"prime_pi(x): x must be <= 10**18 for the combinatorial "
                              f"method, got x = {x}")
    what = f"prime_pi({x})"
    check_budget(what, estimated_seconds(x), budget)
    clock = RunClock(what, budget, progress)
    workers = default_workers(x) if workers is None else workers
    if workers > 1:
        result = prime_pi_in_workers(x, workers, report=clock.report)
    else:
        result = prime_pi_deleglise_rivat(x, report=clock.report)
    clock.finish()
    return result
