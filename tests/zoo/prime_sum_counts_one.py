"""Defective prime_sum: takes 1 for a prime.

DEFECT: the sieve marks only 0 as not prime, so 1 is added to every sum from
x = 1 on (prime_sum(1) returns 1 instead of 0).
"""

import primesieve


def prime_sum(x):
    if x < 1:
        return 0
    return 1 + sum(primesieve.primes(x))             # bug: 1 is not a prime
