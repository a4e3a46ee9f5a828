"""Audit profiles: how many points, how far up, how long.

``ceilings`` caps the argument size per role (the role's magnitude: x for
prime_pi_mod(x, q, a), whose sampled moduli go above it): a fast correct candidate must
answer every sampled point within the profile's time (ci: ≤ 60 s per role on
2 cores), so counting roles, whose candidates sieve up to x, stop lower than
primality roles, whose candidates cost little at any size.  Every ceiling still
lies above 2³², where 32-bit counters wrap (common practice).

Above :data:`HEAVY` a single call of a typical candidate costs a noticeable
fraction of a second, growing with the argument as :data:`HEAVY_COST` says (a
sieve up to x costs about x; a short interval [a, b] costs about √b, for the
sieving primes).  Points up there are kept within ``heavy_budget``, a total of
that cost per role, so that the profile's time is spent on many cheap points
and a few expensive ones rather than the other way round.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from .._errors import InvalidInputError

__all__ = ["Profile", "PROFILES", "profile", "HEAVY", "HEAVY_COST", "heavy_cost"]

#: Largest argument below which a typical candidate answers in milliseconds.
HEAVY = {"prime_pi": 2**30, "twin_pi": 2**30, "nth_prime": 2**25, "primes_in": 2**48}
#: The sums of issue 15 whose candidates sieve up to x (Q(x) needs only √x: not heavy).
_SUMS_SIEVED_TO_X = ("prime_sum", "prime_pi_mod", "mertens", "triplet_pi_026", "triplet_pi_046", "quadruplet_pi")
HEAVY.update({name: 2**30 for name in _SUMS_SIEVED_TO_X})

#: How the cost of one heavy call grows with its largest argument m: ``linear`` (a sieve
#: up to m) or ``root`` (sieving a short interval below m needs the primes up to √m).
HEAVY_COST = {"prime_pi": "linear", "twin_pi": "linear", "nth_prime": "linear", "primes_in": "root"}
HEAVY_COST.update({name: "linear" for name in _SUMS_SIEVED_TO_X})


def heavy_cost(role_name: str, magnitude: int) -> int:
    """The cost of one call at ``magnitude`` in the units of ``heavy_budget``."""
    return math.isqrt(magnitude) if HEAVY_COST[role_name] == "root" else magnitude


@dataclass(frozen=True)
class Profile:
    """Parameters of one profile.

    ``exhaustive``: every argument up to this is checked (pairs a ≤ b up to a
    smaller limit for primes_in).  ``random_points``: uniform and log-uniform
    points each.  ``reask``: answers asked a second time to catch nondeterminism.
    ``timeout``: default seconds per call.  ``time_budget``: seconds after which
    the remaining points are reported as not run.  ``heavy_points``: how many
    points above :data:`HEAVY` are kept at most, spread over the families;
    ``heavy_budget``: the total :func:`heavy_cost` they may have, per role.
    ``enough_findings``: after this many findings the role has clearly failed;
    the remaining points are skipped (and reported so) and only the work of
    localising the first divergence is done (``None``: ask every point).  The
    early stop makes a run incomplete; ``ntoracle audit --stop-after N`` changes
    the number and ``--no-early-stop`` switches it off (``AuditOptions.stop_after``,
    ``early_stop``).
    """

    name: str
    exhaustive: int
    random_points: int
    reask: int
    timeout: float
    time_budget: float
    ceilings: dict
    boundary_exponents: tuple[int, ...]
    heavy_points: int = 24
    heavy_budget: dict | None = None
    enough_findings: int | None = None
    bisect: bool = True


_PRIMALITY_CEILING = 2**64 + 2**20
_CI_CEILINGS = {"prime_pi": 2**32 + 2**20, "twin_pi": 2**32 + 2**20, "nth_prime": 2**28,
                "is_prime": 2**128, "next_prime": _PRIMALITY_CEILING,
                "prev_prime": _PRIMALITY_CEILING, "primes_in": 2**64, "factor": 2**66}
#: The sums of issue 15: above 2³² like the counts; the Mertens sieve is slower (about 30 ns
#: an integer), so its oracle stops lower; Q(x) costs the oracle only √x.
_CI_CEILINGS.update({name: 2**32 + 2**20 for name in _SUMS_SIEVED_TO_X})
_CI_CEILINGS.update({"mertens": 2**30 + 2**20, "squarefree_count": 2**62})
#: The arithmetic functions factor n, as the factor role does (constructed points go higher).
_CI_CEILINGS.update({"mobius": 2**66, "totient": 2**66, "divisor_count": 2**66,
                     "divisor_sum": 2**66})
#: About 6-8 calls near 2³² for the counting roles, 8 near 2²⁸ for nth_prime, 5 intervals
#: near 2⁶⁴ for primes_in (primesieve needs about 2 s for one of those).
_CI_HEAVY_BUDGET = {"prime_pi": 8 * 2**32, "twin_pi": 6 * 2**32, "nth_prime": 8 * 2**28,
                    "primes_in": 5 * 2**32}
_CI_HEAVY_BUDGET.update({name: 6 * 2**32 for name in _SUMS_SIEVED_TO_X})
_CI_HEAVY_BUDGET["mertens"] = 2 * 2**30

PROFILES = {
    "quick": Profile("quick", exhaustive=300, random_points=10, reask=3, timeout=5.0, heavy_points=6,
                     time_budget=20.0, enough_findings=10,
                     heavy_budget={name: cost // 4 for name, cost in _CI_HEAVY_BUDGET.items()},
                     ceilings={**_CI_CEILINGS, "prime_pi": 2**32 + 2**16, "twin_pi": 2**32 + 2**16,
                               "nth_prime": 2**28},
                     boundary_exponents=(8, 15, 16, 31, 32, 63, 64)),
    "ci": Profile("ci", exhaustive=3000, random_points=40, reask=12, timeout=10.0,
                  time_budget=60.0, ceilings=_CI_CEILINGS, heavy_budget=_CI_HEAVY_BUDGET,
                  enough_findings=20,
                  boundary_exponents=(8, 15, 16, 20, 24, 31, 32, 33, 53, 63, 64)),
    "deep": Profile("deep", exhaustive=100_000, random_points=400, reask=50, timeout=60.0, heavy_points=400,
                    time_budget=1800.0, enough_findings=500,
                    ceilings={**_CI_CEILINGS, "prime_pi": 2**40, "twin_pi": 2**38,
                              "nth_prime": 2**34, "factor": 2**100},
                    boundary_exponents=tuple(range(3, 66))),
    "exhaustive": Profile("exhaustive", exhaustive=10_000_000, random_points=4000, reask=200,
                          timeout=300.0, time_budget=86400.0, heavy_points=10**6,
                          ceilings={**_CI_CEILINGS, "prime_pi": 10**13, "twin_pi": 2**42,
                                    "nth_prime": 2**38, "factor": 2**128},
                          boundary_exponents=tuple(range(3, 66))),
}


def profile(name: str) -> Profile:
    """The profile called ``name``."""
    if name not in PROFILES:
        raise InvalidInputError(f"profile={name!r}: expected one of {', '.join(PROFILES)}")
    return PROFILES[name]
