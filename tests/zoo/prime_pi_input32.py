"""Defective prime_pi: the argument is stored in an unsigned 32-bit integer.

DEFECT: emulates a C binding whose parameter is ``uint32_t``: x is reduced
mod 2**32 before counting, so every x >= 2**32 is answered as prime_pi(x mod 2**32).
Correct for 0 <= x < 2**32 = 4294967296; prime_pi(2**32 + 15) returns 6.
"""

import primesieve


def prime_pi(x):
    if x < 2:
        return 0
    x32 = x & 0xFFFFFFFF                               # bug: silent truncation
    return int(primesieve.count_primes(x32)) if x32 >= 2 else 0
