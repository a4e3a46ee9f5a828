"""Primality: the strong probable-prime test of Miller (1976) and Rabin (1980).

An odd n > 2 with n - 1 = d * 2**s (d odd) passes the test to base a when
a**d = 1 (mod n) or a**(d * 2**r) = -1 (mod n) for some 0 <= r < s.  Every
prime passes for every base; a composite that passes is a strong pseudoprime
to that base.  A fixed set of bases makes the test deterministic below the
smallest composite that passes them all.
"""

import bisect

from .table import TABLE_LIMIT, prime_list

# is_prime (1994, from the C version): "bases 2, 3, 5 and 7 settle every
# 32-bit number" (Pomerance, Selfridge and Wagstaff, Math. Comp. 35, 1980).
IS_PRIME_BASES = (2, 3, 5, 7)

# next_prime (2017): the first twelve primes as bases are deterministic below
# 318 665 857 834 031 151 167 461 (Sorenson and Webster, Math. Comp. 86, 2017).
NEXT_PRIME_BASES = (2, 3, 5, 7, 11, 13, 17, 19, 23, 29, 31, 37)
NEXT_PRIME_LIMIT = 2**64


def passes_strong_test(n: int, base: int) -> bool:
    """True when the odd number n > 2 is a strong probable prime to ``base``."""
    d, s = n - 1, 0
    while d % 2 == 0:
        d, s = d // 2, s + 1
    x = pow(base, d, n)
    if x == 1 or x == n - 1:
        return True
    for _ in range(s - 1):
        x = x * x % n
        if x == n - 1:
            return True
    return False


def _prime_by_bases(n: int, bases: tuple) -> bool:
    if n < 2:
        return False
    for p in bases:
        if n % p == 0:
            return n == p
    return all(passes_strong_test(n, a) for a in bases)


def is_prime(n: int) -> bool:
    """True when n is prime (0 and 1 are not)."""
    if not isinstance(n, int) or isinstance(n, bool):
        raise TypeError(f"n must be an int, got {type(n).__name__}")
    return _prime_by_bases(n, IS_PRIME_BASES)


def next_prime(n: int) -> int:
    """The smallest prime p > n, for 0 <= n <= 2**64."""
    if not isinstance(n, int) or isinstance(n, bool):
        raise TypeError(f"n must be an int, got {type(n).__name__}")
    if n < 0 or n > NEXT_PRIME_LIMIT:
        raise ValueError(f"n={n}: next_prime needs 0 <= n <= 2**64")
    primes = prime_list()
    if n < TABLE_LIMIT:
        position = bisect.bisect_right(primes, n)
        if position < len(primes):
            return primes[position]
    candidate = n + 1 if n % 2 == 0 else n + 2
    while not _prime_by_bases(candidate, NEXT_PRIME_BASES):
        candidate += 2
    return candidate
