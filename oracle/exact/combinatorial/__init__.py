"""Exact prime counts far beyond sieving: the combinatorial method.

``prime_pi(x)`` computes pi(x) exactly for ``x <= MAX_X = 10**18`` by our own
implementation of the Lagarias-Miller-Odlyzko method with the Deleglise-Rivat
improvements (Math. Comp. 44 (1985) and 65 (1996)); ``nth_prime(n)`` inverts
it with Riemann's R function, one exact count and a short sieve.  Both are
exact or raise :class:`oracle._errors.OracleError`; they never estimate.

``estimated_seconds(x)`` is the rough cost model behind ``time_budget``.
From ``MIN_PARALLEL_X`` on, ``prime_pi`` spreads its costly stages over the
cores (``workers=1`` keeps one process); the answer is the same integer.
"""

from ._cost_model import estimated_seconds
from ._nth_prime import MAX_N, nth_prime
from ._parallel import MIN_PARALLEL_X
from ._prime_pi import MAX_X, prime_pi

__all__ = ["prime_pi", "nth_prime", "estimated_seconds", "MAX_X", "MAX_N", "MIN_PARALLEL_X"]
