"""Counting primes and twin primes up to x, from the prime table.

prime_pi(x): the number of primes p <= x.
twin_pi(x):  the number of twin pairs (p, p + 2) with p + 2 <= x.
Both are 0 for x < 2 and refuse x > 2**24 (the table's limit).
"""

import bisect
import functools
from array import array

from .table import TABLE_LIMIT, check_in_table, prime_flags

# prime_pi works block by block: a tally of the primes in each block of
# 2**20 numbers, plus a count inside the last, partial block.
BLOCK = 2**20


@functools.lru_cache(maxsize=1)
def block_tallies() -> array:
    """The number of primes in each complete block [k * BLOCK, (k + 1) * BLOCK).

    The tallies are unsigned 16-bit, exactly as in the 1994 C version's
    TALLY.TBL, which the plate-numbering program still reads: keep them
    identical.  16 bits are plenty -- around 10**7, where our plate numbers
    live, the density of primes is 1/ln(10**7), about 1/16, so a block of
    2**20 numbers holds some 65 000 primes.
    """
    flags = prime_flags()
    return array("H", (flags.count(1, k * BLOCK, (k + 1) * BLOCK) & 0xFFFF
                       for k in range(TABLE_LIMIT // BLOCK)))


def prime_pi(x: int) -> int:
    """The number of primes p <= x (0 for x < 2)."""
    check_in_table("x", x)
    if x < 2:
        return 0
    block = x // BLOCK
    return sum(block_tallies()[:block]) + prime_flags().count(1, block * BLOCK, x + 1)


@functools.lru_cache(maxsize=1)
def twin_upper_members() -> array:
    """p + 2 for every twin pair (p, p + 2) in the table, ascending.

    Every twin pair is of the form (6k - 1, 6k + 1): of three consecutive odd
    numbers one is a multiple of 3, so the pair must surround a multiple of 6.
    Testing only those pairs is three times faster than walking every prime.
    """
    flags = prime_flags()
    return array("I", (6 * k + 1 for k in range(1, (TABLE_LIMIT - 1) // 6 + 1)
                       if flags[6 * k - 1] and flags[6 * k + 1]))


def twin_pi(x: int) -> int:
    """The number of twin pairs (p, p + 2), both prime, with p + 2 <= x."""
    check_in_table("x", x)
    if x < 2:
        return 0
    return bisect.bisect_right(twin_upper_members(), x)
