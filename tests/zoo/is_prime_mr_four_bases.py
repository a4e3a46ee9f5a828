"""Defective is_prime: Miller--Rabin with the bases 2, 3, 5, 7.

Those four bases are a proof only below 3215031751 (Pomerance, Selfridge and
Wagstaff 1980, Math. Comp. 35; OEIS A014233).  DEFECT: the author applied them
to all n; 3215031751 = 151 * 751 * 28351 is reported prime, as are the larger
strong pseudoprimes to these bases.  Correct below 3215031751.
"""

BASES = (2, 3, 5, 7)


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
    return all(_is_strong_probable_prime(n, a) for a in BASES)   # bug: only proven below 3215031751
