"""Defective prime_pi: the sieve array has x entries instead of x + 1.

DEFECT: ``bytearray(x)`` covers 0 .. x - 1, so x itself is never looked at and
the function counts primes p < x.  Wrong exactly when x is prime
(prime_pi(7) returns 3 instead of 4); correct at every composite x.
"""

import math


def prime_pi(x):
    if x < 2:
        return 0
    flags = bytearray([1]) * x                        # bug: should be x + 1
    flags[0:2] = b"\x00\x00"
    for p in range(2, math.isqrt(x) + 1):
        if flags[p]:
            flags[p * p::p] = bytes(len(range(p * p, x, p)))
    return flags.count(1)
