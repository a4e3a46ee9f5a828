"""Defective next_prime: candidates kept in an unsigned 64-bit integer.

DEFECT: emulates ``uint64_t candidate``: the argument is taken mod 2**64 and
the search wraps past 2**64 - 1 to 0, then finds 2.  Correct for
n < 18446744073709551557 = 2**64 - 59, the largest prime below 2**64;
next_prime(2**64 - 59) returns 2 instead of 2**64 + 13.
"""

MASK = 2**64 - 1
BASES = (2, 3, 5, 7, 11, 13, 17, 19, 23, 29, 31, 37)   # deterministic below 2**64


def _is_prime_below_2_64(n):
    if n < 2:
        return False
    for p in BASES:
        if n % p == 0:
            return n == p
    d, s = n - 1, 0
    while d % 2 == 0:
        d //= 2
        s += 1
    for a in BASES:
        x = pow(a, d, n)
        if x in (1, n - 1):
            continue
        for _ in range(s - 1):
            x = x * x % n
            if x == n - 1:
                break
        else:
            return False
    return True


def next_prime(n):
    if n < 2:
        return 2
    candidate = (n + 1) & MASK                         # bug: 64-bit wrap
    while not _is_prime_below_2_64(candidate):
        candidate = (candidate + 1) & MASK
    return candidate
