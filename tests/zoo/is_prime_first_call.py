"""Defective is_prime: a table of the primes below 2**16, built lazily, read before it is built.

Below 2**16 the member answers from a sieve table, above it by Miller--Rabin to
the first twelve prime bases (deterministic below 3.18e23, OEIS A014233) and a
Baillie--PSW-free tail it never reaches here.  DEFECT: the table is built on the
first call, but that call looks its n up *before* building it, in the empty
table: the first answer of a process below 2**16 is False, whatever n is
(is_prime(97) is False once, then True).  Every later call is right.
"""

import math

LIMIT = 2**16
BASES = (2, 3, 5, 7, 11, 13, 17, 19, 23, 29, 31, 37)
_table = bytearray()


def _build():
    flags = bytearray([1]) * LIMIT
    flags[0:2] = b"\x00\x00"
    for p in range(2, math.isqrt(LIMIT - 1) + 1):
        if flags[p]:
            flags[p * p::p] = bytes(len(range(p * p, LIMIT, p)))
    _table.extend(flags)


def _is_strong_probable_prime(n, base):
    d, s = n - 1, 0
    while d % 2 == 0:
        d //= 2
        s += 1
    x = pow(base, d, n)
    if x in (1, n - 1):
        return True
    for _ in range(s - 1):
        x = x * x % n
        if x == n - 1:
            return True
    return False


def is_prime(n):
    if n < LIMIT:
        answer = n < len(_table) and bool(_table[n])     # bug: looked up first ...
        if not _table:
            _build()                                     # ... built afterwards
        return answer
    for p in BASES:
        if n % p == 0:
            return False
    return all(_is_strong_probable_prime(n, a) for a in BASES)
