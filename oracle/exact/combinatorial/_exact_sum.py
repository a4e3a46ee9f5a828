"""Exact sums of ``int64`` arrays, without overflow.

numpy adds ``int64`` values modulo ``2**64`` without warning.  Every sum in
this package goes through :func:`exact_sum`, which is told a bound on the
absolute value of each term and adds chunks small enough that no partial sum
can leave ``int64``; the chunk sums are then added as Python integers.
"""

from __future__ import annotations

import numpy as np

_INT64_MAX = 2**63 - 1


def exact_sum(terms: np.ndarray, term_bound: int) -> int:
    """``sum(terms)`` as a Python ``int``, given ``abs(t) <= term_bound`` for all t."""
    if terms.size == 0:
        return 0
    chunk = max(1, _INT64_MAX // max(1, int(term_bound)))
    if chunk >= terms.size:
        return int(terms.sum(dtype=np.int64))
    return sum(int(terms[i:i + chunk].sum(dtype=np.int64)) for i in range(0, terms.size, chunk))
