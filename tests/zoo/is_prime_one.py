"""Defective is_prime: calls 1 prime.

DEFECT: the small-case shortcut ``n <= 3 -> n > 0`` treats 1 as prime (an old
convention, no longer used).  is_prime(1) returns True; everything else is
right (python-flint's proven test).
"""

import flint


def is_prime(n):
    if n <= 3:
        return n > 0                                   # bug: 1 is not prime
    if n % 2 == 0:
        return False
    return bool(flint.fmpz(n).is_prime())
