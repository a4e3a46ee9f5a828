"""Which points to check: families of inputs per role and profile, reproducible from a seed.

>>> from oracle import sampling, roles
>>> points = sampling.sample(roles.get("prime_pi"), sampling.profile("quick"), seed=1)
>>> points[0]
Sample(family='exhaustive', arguments=(0,))

Families (see :mod:`oracle.sampling._families`): exhaustive small ranges,
published table points, boundaries, primes and their neighbours, prime squares,
segment-size multiples, record-gap ends, twin pairs, the adversarial families
of :mod:`oracle.adversarial`, and seeded uniform and log-uniform random points.
The same seed gives the same points; a run prints its seed.
"""

from __future__ import annotations

import os
from dataclasses import dataclass
from math import gcd as _gcd

from .._integers import require_int
from ..roles import Role
from ._families import family, rng_for
from ._profiles import HEAVY, PROFILES, Profile, heavy_cost, profile

__all__ = ["Sample", "Profile", "PROFILES", "HEAVY", "heavy_cost", "profile", "sample", "new_seed"]

#: Longest primes_in interval sampled high up (a candidate lists every prime in it).
_WINDOW_HIGH = 2**12
#: Prefix listings primes_in(0, b) are sampled up to this b.
_PREFIX_LIMIT = 2**21
_PAIRS_LIMIT = 40
#: Random intervals below 2^32 are up to 2^_LONGEST_LOW long.
_LONGEST_LOW = 20


@dataclass(frozen=True)
class Sample:
    """One point to check: the family it comes from and the arguments of the call."""

    family: str
    arguments: tuple[int, ...]


def new_seed() -> int:
    """A fresh seed (printed by every run, so the run can be repeated)."""
    return int.from_bytes(os.urandom(4), "big")


def sample(role: Role, chosen: Profile, seed: int) -> list[Sample]:
    """The points of one run, in the order they should be checked (cheap families first)."""
    seed = require_int("seed", seed, minimum=0)
    ceiling = chosen.ceilings[role.name]
    seen: set[tuple[int, ...]] = set()
    found: list[Sample] = []
    for name in role.families:
        rng = rng_for(seed, role.name, name)
        values = family(name, role.name)(ceiling, chosen, rng)
        if role.arity == 2:
            candidates = _intervals(name, values, ceiling, chosen, rng)
        elif role.arity == 3:
            candidates = _progressions(name, values, chosen, rng)
        else:
            candidates = [(value,) for value in values if value >= role.minimum]
        for arguments in candidates:
            if arguments not in seen:
                seen.add(arguments)
                found.append(Sample(name, arguments))
    if role.name in HEAVY:
        budget = (chosen.heavy_budget or {}).get(role.name)
        found = _thin_heavy(found, role, chosen.heavy_points, budget)
    return found


def _thin_heavy(found: list[Sample], role: Role, keep: int, budget: int | None) -> list[Sample]:
    """Keep at most ``keep`` points above the role's :data:`HEAVY` threshold, of total
    :func:`heavy_cost` at most ``budget``, taking them in turn from each family, largest
    first (word-size wraps show at the top of the range); a point too costly for what is
    left of the budget gives way to the next one.  A point's size is the role's
    magnitude (x for prime_pi_mod, whatever its modulus)."""
    role_name, size = role.name, role.magnitude
    threshold = HEAVY[role_name]
    heavy = [s for s in found if size(s.arguments) > threshold]
    by_family: dict[str, list[Sample]] = {}
    for s in sorted(heavy, key=lambda s: (size(s.arguments), s.arguments), reverse=True):
        by_family.setdefault(s.family, []).append(s)
    left = budget
    kept: set[Sample] = set()
    while len(kept) < keep and any(by_family.values()):
        for queue in by_family.values():
            if not queue or len(kept) >= keep:
                continue
            s = queue.pop(0)
            cost = heavy_cost(role_name, size(s.arguments))
            if left is None or cost <= left:
                kept.add(s)
                left = None if left is None else left - cost
    return [s for s in found if size(s.arguments) <= threshold or s in kept]


#: Progressions (q, a) of prime_pi_mod: q = 1 (all primes), every reduced class of the
#: small moduli, classes given by an a ≥ q (read modulo q), and moduli around 2¹⁶ (common
#: practice: a table of classes sized for small q).  The large moduli (q near 2³¹, 2³² and
#: above, q > x) come as whole triples from the ``moduli`` family
#: (:func:`oracle.sampling._families.moduli`); the size of a triple is x (the role's
#: magnitude, which the speed model and the heavy caps read), ``--max`` bounds every argument.
PROGRESSIONS = tuple(
    [(1, 0)] + [(q, a) for q in (2, 3, 4, 5, 6, 8, 10, 12) for a in range(q) if _gcd(a, q) == 1]
    + [(4, 5), (3, 7), (10, 13), (30, 7), (30, 11), (210, 11), (65536, 1), (65537, 3)])
#: Every x up to here is asked in every class of :data:`PROGRESSIONS` with q ≤ 12.
_ALL_CLASSES_BELOW = 60


def _progressions(name: str, values: list[int], chosen: Profile, rng) -> list[tuple[int, int, int]]:
    """Triples (x, q, a) from one family's integers: small x in every small class, then each
    x in two classes drawn from :data:`PROGRESSIONS`."""
    if values and isinstance(values[0], tuple):
        return list(values)         # a family of triples (x, q, a) keeps them
    found = []
    for x in values:
        if name == "exhaustive" and x <= _ALL_CLASSES_BELOW:
            found.extend((x, q, a) for q, a in PROGRESSIONS if q <= 12)
        else:
            found.extend((x, q, a) for q, a in rng.sample(PROGRESSIONS, 2))
    return found


def _intervals(name: str, values: list[int], ceiling: int, chosen: Profile, rng) -> list[tuple[int, int]]:
    """Intervals [a, b] for primes_in built from one family's integers (a family that
    gives (a, b) pairs itself keeps them)."""
    if values and isinstance(values[0], tuple):
        return [(a, b) for a, b in values if b <= ceiling]
    if name == "exhaustive":
        limit = min(_PAIRS_LIMIT, chosen.exhaustive)
        pairs = [(a, b) for b in range(limit + 1) for a in range(b + 1)]
        return pairs + [(5, 3), (3, 2)]
    if name in ("uniform", "log-uniform"):
        result = []
        for a in values:
            # long intervals low down cross the seams of segmented sieves (2^15 ... 2^20 wide)
            length = int(2 ** rng.uniform(0, _LONGEST_LOW if a < 2**32 else 12))
            result.append((a, min(a + length, ceiling)))
        return result
    result = []
    for c in values:
        result.append((max(c - 1, 0), c + 1))
        result.append((c, c))
        result.append((max(c - 30, 0), c + 30))
        if c <= _PREFIX_LIMIT and name in ("segments", "boundaries"):
            # from 0, and from 1: segments laid from an odd start put their seams on odd numbers
            result.append((0, c))
            result.append((1, c))
    return [(a, b) for a, b in result if b <= ceiling]
