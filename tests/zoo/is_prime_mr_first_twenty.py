"""Defective is_prime: Miller--Rabin to the first twenty prime bases, 2 ... 71, at every size.

Twenty fixed bases are far more than the twelve that decide every n < 2**64
(OEIS A014233), so the author trusted them everywhere.  DEFECT: for any fixed
set of prime bases F. Arnault's construction (1995, J. Symbolic Comput. 20)
gives composites p1 * p2 * p3 passing all of them; the one for these twenty bases
has 108 digits and is reported prime.  Right below 2**64 and on every number
that is not built against this base set.
"""

BASES = (2, 3, 5, 7, 11, 13, 17, 19, 23, 29, 31, 37, 41, 43, 47, 53, 59, 61, 67, 71)


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
    for p in BASES:
        if n % p == 0:
            return n == p
    return all(_is_strong_probable_prime(n, a) for a in BASES)   # bug: no fixed set is enough
