"""Defective next_prime: Miller--Rabin to the first twelve prime bases at every size.

DEFECT: the strong test to the bases 2, 3, ..., 37 is deterministic only below
A014233(12) = 318665857834031151167461 (OEIS A014233), the least strong
pseudoprime to all twelve bases; the routine uses it above that bound too.  So
next_prime(318665857834031151167460) returns the pseudoprime
318665857834031151167461 = 399165290221 * 798330580441.  Right wherever no
strong pseudoprime to those bases lies between n and the next prime: below the
bound always, above it almost everywhere.
"""

BASES = (2, 3, 5, 7, 11, 13, 17, 19, 23, 29, 31, 37)


def _passes_strong_tests(n):
    if n < 2:
        return False
    for p in BASES:
        if n % p == 0:
            return n == p
    d, s = n - 1, 0
    while d % 2 == 0:
        d //= 2
        s += 1
    for a in BASES:                                   # bug: deterministic only below 3.18e23
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
    candidate = n + 1
    while not _passes_strong_tests(candidate):
        candidate += 1
    return candidate
