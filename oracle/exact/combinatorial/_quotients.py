"""Floor quotients ``n // d`` of one integer by many, fast where that is exact.

numpy's ``int64`` division is several times slower than ``float64``
division.  For ``0 <= n < 2**52`` and ``1 <= d <= n`` the float quotient
truncated to an integer is exactly ``n // d``: with ``k = n // d`` one has
``n / d <= (k + 1) - 1/d``, and the rounding error of one division is at most
``(k + 1) 2**-53 < 1/d`` because ``d (k + 1) <= 2n < 2**53``; and the rounded
value cannot drop below the representable ``k``.  (IEEE 754 division is
correctly rounded; Goldberg 1991, ACM Computing Surveys 23.)  Larger ``n``
take the exact ``int64`` path.
"""

from __future__ import annotations

import numpy as np

#: Below this numerator the float64 quotient is exact (see the module docstring).
FLOAT_EXACT_LIMIT = 1 << 52


def floor_quotients(n: int, divisors: np.ndarray, divisors_float: np.ndarray | None = None) -> np.ndarray:
    """``n // d`` for each ``d`` (``int64``, ``1 <= d``; ``0 <= n < 2**63``) as ``int64``.

    ``divisors_float`` may pass ``divisors`` already converted to ``float64``.
    """
    if n < FLOAT_EXACT_LIMIT:
        if divisors_float is None:
            divisors_float = divisors.astype(np.float64)
        return (np.float64(n) / divisors_float).astype(np.int64)
    return np.int64(n) // divisors
