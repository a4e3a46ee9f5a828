"""A rough running-time model, used to refuse hopeless requests early.

The combinatorial method does about ``x^(2/3) / log x`` elementary steps
(Deleglise and Rivat 1996, Math. Comp. 65, section 5).  The constant
``SECONDS_PER_STEP`` was fitted to the plain numpy path on the development
machine (2 cores shared with other work: about 1.5 s at 10**14 and 20 s at
10**16); the model is an estimate for refusing early, not a promise, and the
run itself still stops when it outgrows the budget.
"""

from __future__ import annotations

from math import exp, log

from ._small_range import SMALL_LIMIT

#: Fitted on the development machine: seconds per ``x^(2/3) / ln x`` step.
SECONDS_PER_STEP = 2.0e-8

#: Fixed start-up cost in seconds (imports, tables) for inputs above the table range.
STARTUP_SECONDS = 0.01


def estimated_seconds(x: int) -> float:
    """Estimated wall time of ``prime_pi(x)`` in seconds (0 below the table limit).

    Computed through logarithms, so any size of ``x`` gives a finite number or ``inf``.
    """
    if x < SMALL_LIMIT:
        return 0.0
    log_x = log(x)
    exponent = 2.0 / 3.0 * log_x - log(log_x) + log(SECONDS_PER_STEP)
    return STARTUP_SECONDS + (exp(exponent) if exponent < 700 else float("inf"))
