"""The prime constellations the sieve counts, as offset patterns.

A pattern ``(0, d_2, ..., d_k)`` describes the k-tuple ``(p, p + d_2, ..., p + d_k)``.
It is *admissible* when, for every prime ``q``, the offsets miss at least one
residue class modulo ``q``.  Only an admissible pattern can be all prime for
infinitely many ``p``; Hardy and Littlewood (1923, "Some problems of
'Partitio numerorum' III", Acta Mathematica 44; citation from memory)
conjectured that every admissible one is.  Only the primes ``q <= k`` need
checking, since ``k`` offsets cannot cover more than ``k`` classes.

The patterns below are the admissible ones of smallest diameter for k = 1..4
(there are two for k = 3).  A tuple is counted in ``[a, b]`` only when the
whole tuple lies there: ``a <= p`` and ``p + d_k <= b``.
"""

from __future__ import annotations

from types import MappingProxyType

from ..._errors import InvalidInputError

__all__ = ["PATTERNS", "KINDS", "offsets_of", "is_admissible"]

#: kind name -> offsets; read-only so no caller can change what a kind means.
PATTERNS = MappingProxyType({
    "primes": (0,),
    "twins": (0, 2),
    "triplets_026": (0, 2, 6),
    "triplets_046": (0, 4, 6),
    "quadruplets": (0, 2, 6, 8),
})

#: The kind names, in order of increasing length.
KINDS = tuple(PATTERNS)


def offsets_of(kind: object) -> tuple[int, ...]:
    """Return the offsets of ``kind`` or raise :class:`InvalidInputError`."""
    if not isinstance(kind, str) or kind not in PATTERNS:
        raise InvalidInputError(f"kind={kind!r}: must be one of {', '.join(KINDS)}")
    return PATTERNS[kind]


def is_admissible(offsets: tuple[int, ...]) -> bool:
    """True when ``offsets`` leave a residue class free modulo every prime ``q <= k``."""
    k = len(offsets)
    for q in range(2, k + 1):
        if all(q % r for r in range(2, q)):          # q is prime
            if len({d % q for d in offsets}) == q:
                return False
    return True
