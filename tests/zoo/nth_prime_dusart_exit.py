"""Defective nth_prime: sieve sized by a bound outside its proven range; exits when it is short.

DEFECT (crash): the sieve ends at n(ln n + ln ln n - 0.9484), Dusart's upper
bound for p_n, proven for n >= 39017 (Dusart 1999, Math. Comp. 68) but used
for every n >= 2.  Below its range the bound often undershoots p_n (already
at n = 2), and the member's own check then ends the process with
os._exit(3), as a C library calling exit(3) would.  Correct for n = 1 and
n >= 39017.
"""

import math
import os
import sys

import numpy as np


def nth_prime(n):
    if n == 1:
        return 2
    limit = int(n * (math.log(n) + math.log(math.log(n)) - 0.9484))   # bug: proven for n >= 39017
    limit = max(limit, 1)
    flags = np.ones(limit + 1, dtype=bool)
    flags[:2] = False
    for p in range(2, math.isqrt(limit) + 1):
        if flags[p]:
            flags[p * p::p] = False
    primes = np.flatnonzero(flags)
    if len(primes) < n:
        sys.stderr.write(f"nth_prime: sieve to {limit} too short for n = {n}\n")
        sys.stderr.flush()
        os._exit(3)                                    # the process ends here
    return int(primes[n - 1])
