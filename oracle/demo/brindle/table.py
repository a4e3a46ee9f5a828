"""The prime table: a sieve of Eratosthenes up to TABLE_LIMIT = 2**24.

Built on first use (about a second) and kept for the life of the process.
``prime_flags()[n]`` is 1 when n is prime; ``prime_list()`` holds the primes
in ascending order as unsigned 32-bit integers.

History: the 1994 C version read this table from PRIMES.TBL on the plate
room's PC; since 2009 we simply sieve it at start-up.
"""

import functools
import itertools
import math
from array import array

TABLE_LIMIT = 2**24


@functools.lru_cache(maxsize=1)
def prime_flags() -> bytearray:
    """flags[n] == 1 exactly when n is prime, for 0 <= n <= TABLE_LIMIT."""
    flags = bytearray([1]) * (TABLE_LIMIT + 1)
    flags[0] = flags[1] = 0
    for p in range(2, math.isqrt(TABLE_LIMIT) + 1):
        if flags[p]:
            multiples = range(p * p, TABLE_LIMIT + 1, p)
            flags[p * p::p] = bytes(len(multiples))
    return flags


@functools.lru_cache(maxsize=1)
def prime_list() -> array:
    """All primes up to TABLE_LIMIT, ascending."""
    return array("I", itertools.compress(range(TABLE_LIMIT + 1), prime_flags()))


def check_in_table(name: str, value: int) -> None:
    """Refuse arguments the table cannot answer (ValueError)."""
    if not isinstance(value, int) or isinstance(value, bool):
        raise TypeError(f"{name} must be an int, got {type(value).__name__}")
    if value > TABLE_LIMIT:
        raise ValueError(f"{name}={value} is beyond the prime table (limit 2**24)")
