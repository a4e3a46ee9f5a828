"""Correct primes_in: primesieve.primes over the closed interval [a, b].

Honours the convention for every integer pair: an empty list when b < 2 or a > b,
and a start below 0 is treated as 0 (there are no negative primes).
"""

import primesieve


def primes_in(a, b):
    a = max(a, 0)
    if b < 2 or a > b:
        return []
    return [int(p) for p in primesieve.primes(a, b)]
