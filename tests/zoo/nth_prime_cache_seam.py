"""Defective nth_prime: a table of the first 10**5 primes, then an incremental search.

DEFECT: ``primesieve.nth_prime(k, start)`` counts the primes greater than
start; beyond the table the author passes ``table[-1] - 1``, so the table's
last prime is counted again and every n > 10**5 gets p_(n-1).  Correct for 1 <= n <= 100000;
nth_prime(100001) returns 1299709 instead of 1299721.
"""

import primesieve

CACHE_SIZE = 10**5
_TABLE = [int(p) for p in primesieve.n_primes(CACHE_SIZE)]


def nth_prime(n):
    if n <= CACHE_SIZE:
        return _TABLE[n - 1]
    return int(primesieve.nth_prime(n - CACHE_SIZE, _TABLE[-1] - 1))   # bug: should start at _TABLE[-1]
