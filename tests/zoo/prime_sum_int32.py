"""Defective prime_sum: the running sum is kept in a numpy int32.

DEFECT: np.cumsum(..., dtype=np.int32), chosen to save memory, wraps silently
once the sum reaches 2**31: prime_sum(x) is off by 2**32 from x = 225287 on
(2 + 3 + ... + 225287 is the first sum of primes above 2**31 - 1).  Correct below.
"""

import numpy as np
import primesieve


def prime_sum(x):
    if x < 2:
        return 0
    primes = np.array(primesieve.primes(x), dtype=np.int64)
    return int(np.cumsum(primes, dtype=np.int32)[-1])     # bug: 32-bit signed wrap
