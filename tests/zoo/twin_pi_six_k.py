"""Defective twin_pi: counts the pairs (6k - 1, 6k + 1) only.

DEFECT: every twin pair except (3, 5) has the form (6k - 1, 6k + 1); this
member relies on that shortcut and forgets the exception, so it is one short
for every x >= 5 (twin_pi(5) returns 0 instead of 1).
"""

import primesieve


def twin_pi(x):
    if x < 7:
        return 0
    primes = set(primesieve.primes(x))
    return sum(1 for m in range(6, x, 6) if m - 1 in primes and m + 1 in primes)
