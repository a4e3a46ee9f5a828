"""Defective is_prime: Miller--Rabin with the bases 2, 7, 61 at every size.

G. Jaeschke (1993, Math. Comp. 61) showed these three bases decide every
n < 4759123141, and the set is widely copied for 32-bit integers.  DEFECT: the
author applied it to all n; 4759123141 = 48781 * 97561, the least strong
pseudoprime to all three bases, is reported prime, as are the larger ones.
Correct below 4759123141.
"""

BASES = (2, 7, 61)


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
    if n < 2:
        return False
    for p in (2, 3, 5, 7, 11, 13, 61):
        if n % p == 0:
            return n == p
    return all(_is_strong_probable_prime(n, a) for a in BASES)   # bug: proven below 4759123141 only
