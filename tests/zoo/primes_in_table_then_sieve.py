"""Defective primes_in: a table of the primes below 1000, then a sieve, concatenated backwards.

DEFECT: when the range straddles 1000 the sieved part (primes >= 1000) is put
before the table part, so the output is not ascending:
primes_in(990, 1020) returns [1009, 1013, 1019, 991, 997].  Ranges entirely
below or entirely above 1000 are right.
"""

import primesieve

TABLE_LIMIT = 1000
_TABLE = [int(p) for p in primesieve.primes(TABLE_LIMIT - 1)]


def primes_in(a, b):
    small = [p for p in _TABLE if a <= p <= b]
    low = max(a, TABLE_LIMIT)
    large = [int(p) for p in primesieve.primes(low, b)] if b >= low else []
    return large + small                               # bug: should be small + large
