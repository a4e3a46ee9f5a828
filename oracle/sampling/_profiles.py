"""Audit profiles: how many points, how far up, how long.

``ceilings`` caps the argument size per role: a fast correct candidate must
answer every sampled point within the profile's time (ci: ≤ 60 s per role on
2 cores), so counting roles, whose candidates sieve up to x, stop lower than
primality roles, whose candidates cost little at any size.  Every ceiling still
lies above 2³², where 32-bit counters wrap (common practice).
"""

from __future__ import annotations

from dataclasses import dataclass

from .._errors import InvalidInputError

__all__ = ["Profile", "PROFILES", "profile", "HEAVY"]

#: Arguments above which a counting candidate typically needs a second or more.
HEAVY = {"prime_pi": 2**30, "twin_pi": 2**30, "nth_prime": 2**25}


@dataclass(frozen=True)
class Profile:
    """Parameters of one profile.

    ``exhaustive``: every argument up to this is checked (pairs a ≤ b up to a
    smaller limit for primes_in).  ``random_points``: uniform and log-uniform
    points each.  ``reask``: answers asked a second time to catch nondeterminism.
    ``timeout``: default seconds per call.  ``time_budget``: seconds after which
    the remaining points are reported as not run.  ``heavy_points``: for the
    counting roles, how many points above :data:`HEAVY` (where a candidate's
    sieve takes about a second) are kept, spread over the families.
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
    bisect: bool = True


_PRIMALITY_CEILING = 2**64 + 2**20
_CI_CEILINGS = {"prime_pi": 2**33 + 2**20, "twin_pi": 2**33 + 2**20, "nth_prime": 2**28,
                "is_prime": 2**128, "next_prime": _PRIMALITY_CEILING,
                "prev_prime": _PRIMALITY_CEILING, "primes_in": 2**64, "factor": 2**66}

PROFILES = {
    "quick": Profile("quick", exhaustive=300, random_points=10, reask=3, timeout=5.0, heavy_points=6,
                     time_budget=20.0,
                     ceilings={**_CI_CEILINGS, "prime_pi": 2**32 + 2**16, "twin_pi": 2**32 + 2**16,
                               "nth_prime": 2**28},
                     boundary_exponents=(8, 15, 16, 31, 32, 63, 64)),
    "ci": Profile("ci", exhaustive=3000, random_points=40, reask=12, timeout=10.0,
                  time_budget=60.0, ceilings=_CI_CEILINGS,
                  boundary_exponents=(8, 15, 16, 20, 24, 31, 32, 33, 53, 63, 64)),
    "deep": Profile("deep", exhaustive=100_000, random_points=400, reask=50, timeout=60.0, heavy_points=400,
                    time_budget=1800.0,
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
