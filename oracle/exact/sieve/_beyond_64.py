"""Prime and constellation counts on short intervals above 2**64.

Method: the interval is sieved, window by window, by the primes below
:data:`SMALL_PRIME_LIMIT` (every number here exceeds them, so each multiple
struck is composite); a tuple start whose entries all survive is kept only if
every entry passes :func:`oracle.exact.primality.is_prime`.  That test is the
strong (Miller-Rabin) test to proven prime bases below
``primality.DETERMINISTIC_LIMIT`` (about 3.2 * 10**23), and Baillie-PSW above
it (Baillie and Wagstaff 1980, "Lucas pseudoprimes", Math. Comp. 35; citation
from memory).

Caution: above ``DETERMINISTIC_LIMIT`` a Baillie-PSW "prime" is a *probable*
prime.  No composite passing the test is known, but none is proven impossible,
so counts there are evidence, not proof.  Cost: about
``(b - a) / ln(SMALL_PRIME_LIMIT)`` tests; the interval is capped at
:data:`MAX_SPAN` integers.
"""

from __future__ import annotations

import numpy as np

from ..._errors import InvalidInputError, OutOfReachError
from ..._integers import require_int
from ..primality import is_prime
from ._constellations import offsets_of
from ._segmented import SegmentedSieveEngine

__all__ = ["ENGINE_LIMIT", "MAX_SPAN", "SMALL_PRIME_LIMIT", "count_beyond_64"]

#: Intervals ending below this bound are counted by the sieve engines.
ENGINE_LIMIT = 2**64

#: Longest interval (number of integers) counted above 2**64.
MAX_SPAN = 10**8

#: The interval is sieved by the primes below this bound before any test.
SMALL_PRIME_LIMIT = 2**17

_WINDOW = 2**22


def _small_primes() -> list[int]:
    return SegmentedSieveEngine().primes(0, SMALL_PRIME_LIMIT - 1).tolist()


def count_beyond_64(kind: str, a: int, b: int) -> int:
    """Number of tuples of ``kind`` lying wholly in ``[a, b]``, for ``b >= 2**64``.

    ``b - a + 1`` may be at most :data:`MAX_SPAN`; longer intervals raise
    :class:`OutOfReachError`.  Primality of the survivors is decided by ``is_prime``
    (proven below ``primality.DETERMINISTIC_LIMIT``, probable above it).
    """
    offsets = offsets_of(kind)
    a = require_int("a", a, minimum=0)
    b = require_int("b", b)
    if b < ENGINE_LIMIT:
        raise InvalidInputError(f"b={b}: count_beyond_64 is for b >= 2**64; use count() below it")
    if b < a:
        return 0
    if b - a + 1 > MAX_SPAN:
        raise OutOfReachError(
            f"count_beyond_64({kind!r}, a, b): the interval holds {b - a + 1} integers; "
            f"above 2**64 the limit is {MAX_SPAN} (10**8)")
    small_primes = _small_primes()
    reach = offsets[-1]
    total = 0
    for lo in range(a, b + 1, _WINDOW):
        owned = min(_WINDOW, b - lo + 1)
        survives = np.ones(min(_WINDOW + reach, b - lo + 1), dtype=bool)
        for p in small_primes:
            survives[(-lo) % p::p] = False
        starts = min(owned, len(survives) - reach)
        if starts <= 0:
            continue
        candidates = survives[:starts].copy()
        for d in offsets[1:]:
            candidates &= survives[d:d + starts]
        for j in np.flatnonzero(candidates).tolist():
            if all(is_prime(lo + j + d) for d in offsets):
                total += 1
    return total
