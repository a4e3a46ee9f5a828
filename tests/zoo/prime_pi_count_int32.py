"""Defective prime_pi: the count is kept in a signed 32-bit integer.

DEFECT: emulates a C counter declared ``int32_t count``: the count wraps once it
passes 2**31 - 1.  Correct while pi(x) < 2**31, that is for x < p_(2**31) =
50685770167 (primecountpy: nth_prime(2**31)); prime_pi(50685770167) returns
-2**31 instead of 2**31.  The argument itself is handled in full width.
"""

import primecountpy


def prime_pi(x):
    if x < 2:
        return 0
    count = int(primecountpy.prime_pi(x))
    return (count + 2**31) % 2**32 - 2**31              # bug: int32 wrap-around
