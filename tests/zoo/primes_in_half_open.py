"""Defective primes_in: the interval is treated as half-open, [a, b).

DEFECT: follows the ``range`` habit and leaves b out, so b is missing whenever
b is prime (primes_in(2, 7) returns [2, 3, 5]).  Correct when b is composite.
"""

import primesieve


def primes_in(a, b):
    a = max(a, 0)
    if b - 1 < 2 or a > b - 1:
        return []
    return [int(p) for p in primesieve.primes(a, b - 1)]   # bug: b is included by convention
