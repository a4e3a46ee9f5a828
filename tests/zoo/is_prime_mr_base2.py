"""Defective is_prime: a strong (Miller--Rabin) test to the single base 2.

Miller (1976), Rabin (1980).  One base is a probable-prime test only.
DEFECT: fooled by every strong pseudoprime to base 2 (OEIS A001262): 2047 =
23 * 89 is reported prime, and so are 3277, 4033, 4681, ...  Correct on primes
and on all other composites.
"""


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
    if n in (2, 3):
        return True
    if n % 2 == 0:
        return False
    return _is_strong_probable_prime(n, 2)             # bug: one base is not a proof
