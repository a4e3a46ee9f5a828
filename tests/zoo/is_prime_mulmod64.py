"""Defective is_prime: deterministic Miller--Rabin whose modular product overflows.

The twelve bases 2..37 would be a proof for every n < 2**64 (Sorenson and
Webster 2017, Math. Comp. 86).  DEFECT: emulates C code computing
``(a * b) % n`` in uint64 arithmetic: the product is reduced mod 2**64 before
mod n.  Below 2**32 the product never exceeds 2**64 and all answers are right;
above 2**32 the arithmetic is wrong and primes such as 4294967311 (the first
prime above 2**32) are reported composite.
"""

BASES = (2, 3, 5, 7, 11, 13, 17, 19, 23, 29, 31, 37)
MASK64 = (1 << 64) - 1


def _mulmod(a, b, n):
    return ((a * b) & MASK64) % n                      # bug: the product wraps at 2**64


def _powmod(base, exponent, n):
    result, base = 1, base % n
    while exponent:
        if exponent & 1:
            result = _mulmod(result, base, n)
        base = _mulmod(base, base, n)
        exponent >>= 1
    return result


def _is_strong_probable_prime(n, base):
    d, s = n - 1, 0
    while d % 2 == 0:
        d //= 2
        s += 1
    x = _powmod(base, d, n)
    if x in (1, n - 1):
        return True
    for _ in range(s - 1):
        x = _mulmod(x, x, n)
        if x == n - 1:
            return True
    return False


def is_prime(n):
    if n < 2:
        return False
    for p in BASES:
        if n % p == 0:
            return n == p
    return all(_is_strong_probable_prime(n, a) for a in BASES)
