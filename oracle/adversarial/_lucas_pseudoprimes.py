"""Lucas, strong Lucas and Fibonacci pseudoprimes: composites that pass a Lucas-sequence test.

For integers ``P, Q`` with ``D = P**2 - 4Q`` the Lucas sequences are
``U_0 = 0, U_1 = 1, V_0 = 2, V_1 = P`` and ``W_{k+1} = P W_k - Q W_{k-1}``.
For a prime ``p`` not dividing ``2QD``, ``p | U_{p - (D/p)}`` (Jacobi symbol).
A composite ``n`` with ``gcd(n, 2QD) = 1`` and ``n | U_{n - (D/n)}`` is a
*Lucas pseudoprime*; with ``n - (D/n) = d * 2**s``, ``d`` odd, it is a *strong
Lucas pseudoprime* when ``U_d = 0`` or ``V_{d 2**r} = 0 (mod n)`` for some
``0 <= r < s`` (Baillie and Wagstaff 1980, Math. Comp. 35).

* Selfridge's parameters (method A): ``D`` the first of 5, -7, 9, -11, ...
  with ``(D/n) = -1``, ``P = 1``, ``Q = (1 - D)/4``.  Lucas pseudoprimes for
  them are OEIS A217120, strong ones OEIS A217255; the strong kind is what the
  Baillie--PSW test relies on.
* ``P = 1, Q = -1`` (``D = 5``): ``U`` is the Fibonacci sequence; the odd
  composites ``n`` not divisible by 5 with ``n | F_{n - (5/n)}`` are the
  Fibonacci pseudoprimes of OEIS A081264.

The searches below use gmpy2's Lucas-sequence tests on every odd composite.
"""

from __future__ import annotations

import gmpy2

from .._integers import require_int
from ..exact.primality import is_prime

__all__ = [
    "LUCAS_PSEUDOPRIMES",
    "STRONG_LUCAS_PSEUDOPRIMES",
    "FIBONACCI_PSEUDOPRIMES",
    "PERRIN_PSEUDOPRIMES",
    "lucas_pseudoprimes_below",
    "strong_lucas_pseudoprimes_below",
    "fibonacci_pseudoprimes_below",
]

#: OEIS A217120, Lucas pseudoprimes with Selfridge's parameters, first 10
#: terms (as quoted in public test code; re-derived in the tests).
LUCAS_PSEUDOPRIMES = (323, 377, 1159, 1829, 3827, 5459, 5777, 9071, 9179, 10877)

#: OEIS A217255, strong Lucas pseudoprimes with Selfridge's parameters, first
#: 34 terms (as quoted in public test code; re-derived in the tests).
STRONG_LUCAS_PSEUDOPRIMES = (
    5459, 5777, 10877, 16109, 18971, 22499, 24569, 25199, 40309, 58519, 75077,
    97439, 100127, 113573, 115639, 130139, 155819, 158399, 161027, 162133,
    176399, 176471, 189419, 192509, 197801, 224369, 230691, 231703, 243629,
    253259, 268349, 288919, 313499, 324899)

#: OEIS A081264, odd Fibonacci pseudoprimes, first 35 terms (as quoted in
#: public test code; re-derived in the tests).
FIBONACCI_PSEUDOPRIMES = (
    323, 377, 1891, 3827, 4181, 5777, 6601, 6721, 8149, 10877, 11663, 13201,
    13981, 15251, 17119, 17711, 18407, 19043, 23407, 25877, 27323, 30889,
    34561, 34943, 35207, 39203, 40501, 50183, 51841, 51983, 52701, 53663,
    60377, 64079, 64681)

#: OEIS A013998, Perrin pseudoprimes: composites n dividing P(n), where P(0) = 3, P(1) = 0,
#: P(2) = 2, P(k + 3) = P(k + 1) + P(k) (a third-order Lucas-type sequence; p | P(p) for
#: every prime p).  Every term below 10**9 (17 terms, from memory; the first, 271441, is
#: 521**2, and 16532714, 27422714 are even); the tests re-check each by the definition.  A
#: primality test on Perrin's criterion alone (common practice in short programs) takes them
#: for primes.
PERRIN_PSEUDOPRIMES = (271441, 904631, 16532714, 24658561, 27422714, 27664033, 46672291,
                       102690901, 130944133, 196075949, 214038533, 517697641, 545670533,
                       801123451, 855073301, 903136901, 970355431)

#: The searches refuse limits above this (a Python loop over odd numbers).
_SEARCH_LIMIT = 10**7


def lucas_pseudoprimes_below(limit: int) -> list[int]:
    """Odd composites ``n < limit`` that pass the Lucas test with Selfridge's parameters."""
    limit = require_int("limit", limit, minimum=0, maximum=_SEARCH_LIMIT)
    return [n for n in _odd_composites_below(limit) if gmpy2.is_selfridge_prp(n)]


def strong_lucas_pseudoprimes_below(limit: int) -> list[int]:
    """Odd composites ``n < limit`` that pass the strong Lucas test with Selfridge's parameters."""
    limit = require_int("limit", limit, minimum=0, maximum=_SEARCH_LIMIT)
    return [n for n in _odd_composites_below(limit) if gmpy2.is_strong_selfridge_prp(n)]


def fibonacci_pseudoprimes_below(limit: int) -> list[int]:
    """Odd composites ``n < limit``, ``5 ∤ n``, with ``n | F_{n - (5/n)}`` (``P = 1, Q = -1``)."""
    limit = require_int("limit", limit, minimum=0, maximum=_SEARCH_LIMIT)
    return [n for n in _odd_composites_below(limit)
            if n % 5 != 0 and gmpy2.is_lucas_prp(n, 1, -1)]


def _odd_composites_below(limit: int) -> list[int]:
    return [n for n in range(9, limit, 2) if not is_prime(n)]
