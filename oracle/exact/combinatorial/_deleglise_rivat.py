"""pi(x) by the combinatorial method of Deleglise and Rivat.

    pi(x) = phi(x, a) + a - 1 - P2(x, a),          a = pi(y),  y = alpha x^(1/3)
    phi(x, a) = S0 + S_hard + S_easy + S_trivial

(Meissel 1870; Lehmer 1959; Lagarias, Miller and Odlyzko 1985, Math. Comp. 44;
Deleglise and Rivat 1996, "Computing pi(x): the Meissel, Lehmer, Lagarias,
Miller, Odlyzko method", Math. Comp. 65, 235-245; the notation follows
Oliveira e Silva 2006, "Computing pi(x): the combinatorial method", Revista
do DETUA 4(6)).  The stages:

* ``S0``, the ordinary leaves -- :mod:`._phi`;
* ``S_hard``, special leaves needing the partial sieve -- :mod:`._hard_leaves`;
* ``S_easy``, ``S_trivial``, special leaves that are prime counts -- :mod:`._easy_leaves`;
* ``P2`` -- :mod:`._p2`.

Time ``O(x^(2/3) / log^2 x)`` leaves plus a sieve of ``[0, x / y]``; memory
``O(y + segment)``, far below ``x^(1/2)``.  Valid for ``27 <= x <= 10**18``:
every array value stays below ``2**63`` and all sums are exact Python ints.
"""

from __future__ import annotations

from math import log

from ._easy_leaves import EasyLeaves
from ._hard_leaves import HardLeaves
from ._p2 import SecondPartialSieveTerm
from ._parameters import choose_y, prepare
from ._partial_sieve import SEGMENT_GRANULE
from ._phi import ordinary_leaves
from ._prime_segments import prime_segments

#: Largest x the method accepts (products of two values <= x//y and y stay in int64).
LARGEST_X = 10**18


def default_alpha(x: int) -> float:
    """The tuning factor ``alpha`` of ``y = alpha x^(1/3)``.

    Larger ``alpha`` means more (cheap) easy leaves and a shorter sieve; the
    line below was fitted by timing this code for ``10**10 <= x <= 10**16``.
    """
    return min(25.0, max(1.0, 1.5 * (log(x) / log(10) - 4)))


#: Longest sieve segment of the hard leaves (2 MB of bits) and of the prime
#: segments (8 MB of flags): long enough to amortise the per-prime work,
#: short enough for the caches.
HARD_SEGMENT_LIMIT = 3 << 24
PRIME_SEGMENT_LIMIT = 1 << 23


def default_segment_size(x: int, y: int) -> int:
    """Sieve segment length: all of ``[0, z]`` when small, else ``HARD_SEGMENT_LIMIT``."""
    z = x // y
    whole = -(-(z + 1) // SEGMENT_GRANULE) * SEGMENT_GRANULE
    return min(whole, HARD_SEGMENT_LIMIT)


def prime_pi_deleglise_rivat(x: int, *, alpha: float | None = None,
                             segment_size: int | None = None, report=None,
                             kernel: str | None = None) -> int:
    """``pi(x)`` for ``27 <= x <= 10**18`` (``y >= 3``, so the sieve may skip 2 and 3).

    ``report(fraction, stage)``, if given, is called after each segment; it
    may raise to abandon the run (the time budget does so).  ``kernel``
    (``None``, ``"numpy"`` or ``"jit"``) picks the partial sieve's loops, see
    :func:`._partial_sieve.partial_sieve_type`; the answer is the same.
    """
    if not 27 <= x <= LARGEST_X:
        raise ValueError(f"prime_pi_deleglise_rivat needs 27 <= x <= 10**18, got {x}")
    y = choose_y(x, default_alpha(x) if alpha is None else alpha)
    tables = prepare(x, y)
    size = default_segment_size(x, y) if segment_size is None else segment_size
    if size <= 0 or size % SEGMENT_GRANULE:
        raise ValueError(f"segment_size must be a positive multiple of {SEGMENT_GRANULE}")
    z = tables.z

    phi = ordinary_leaves(x, y, tables.c, tables.lpf, tables.mu)

    hard = HardLeaves(tables, kernel=kernel)
    for lo in range(0, z + 1, size):
        hard.add_segment(lo, lo + size)
        if report is not None:
            report(0.7 * min(1.0, (lo + size) / (z + 1)), "hard special leaves")
    phi += hard.total

    easy = EasyLeaves(tables)
    phi += easy.trivial + easy.table_part()
    p2 = SecondPartialSieveTerm(tables)
    for segment in prime_segments(y + 1, z, tables.a, min(size, PRIME_SEGMENT_LIMIT)):
        phi += easy.segment_part(segment)
        p2.segment_part(segment)
        if report is not None:
            report(0.7 + 0.3 * (segment.hi - y) / max(1, z - y), "easy leaves and P2")

    return phi + tables.a - 1 - p2.value()
