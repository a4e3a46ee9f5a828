"""Defective next_prime: steps through candidates with a base-2 strong test.

DEFECT: the primality test is a single Miller--Rabin round to base 2, so a
strong pseudoprime to base 2 (OEIS A001262) is returned as the next prime:
next_prime(2040) returns 2047 = 23 * 89 instead of 2053.  Wrong only for n just
below such a pseudoprime.
"""


def _is_strong_probable_prime_base2(n):
    d, s = n - 1, 0
    while d % 2 == 0:
        d //= 2
        s += 1
    x = pow(2, d, n)
    if x in (1, n - 1):
        return True
    for _ in range(s - 1):
        x = x * x % n
        if x == n - 1:
            return True
    return False


def next_prime(n):
    if n < 2:
        return 2
    if n == 2:
        return 3
    candidate = n + 1 if n % 2 == 0 else n + 2
    while not _is_strong_probable_prime_base2(candidate):   # bug: one base
        candidate += 2
    return candidate
