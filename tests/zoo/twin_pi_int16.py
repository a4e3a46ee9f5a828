"""Defective twin_pi: the count is summed in a numpy int16.

DEFECT: np.sum(..., dtype=np.int16), chosen to save memory, wraps silently
past 32767: twin_pi(x) is off by 65536 once the count reaches 2**15, i.e.
from x = 5060173 on (the 32768th twin pair is (5060171, 5060173)).  Correct
below that.
"""

import numpy as np
import primesieve


def twin_pi(x):
    if x < 5:
        return 0
    primes = np.array(primesieve.primes(x), dtype=np.int64)
    pairs = (primes[1:] - primes[:-1]) == 2
    return int(np.sum(pairs, dtype=np.int16))          # bug: 16-bit signed wrap
