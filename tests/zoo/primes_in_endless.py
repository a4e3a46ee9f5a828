"""Defective primes_in: a generator that stops on equality, not on passing b.

DEFECT (hang): m runs up from a through a set of sieved primes and the loop
ends when m == b + 1.
For a > b + 1 (an empty interval such as [10, 2]) m starts beyond that end,
never meets it, and the generator is endless.  Right for every a <= b + 1.
"""

import primesieve


def primes_in(a, b):
    primes = set(primesieve.primes(max(a, 0), b)) if a <= b else set()
    m = max(a, 0) if a <= b else a
    while m != b + 1:                                  # bug: should be m <= b
        if m in primes:
            yield m
        m += 1
