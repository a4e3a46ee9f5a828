"""Defective is_prime: the seven-base Miller--Rabin set for n < 2**64 without its proviso.

The bases 2, 325, 9375, 28178, 450775, 9780504, 1795265022 decide every
n < 2**64 provided a base divisible by n is skipped (a**d is then 0 mod n,
which proves nothing).  The author trial-divides by the primes below 1000 (so
every n < 10**6 is settled there, 407521, a divisor of 9780504, included) and then
tests every base as it is.  DEFECT: 299210837, the prime factor of 1795265022 =
2 * 3 * 299210837, is called composite.  Right everywhere else below 2**64; above
it the first 40 prime bases (the wrong prime is the point here, not that tail).
"""

SMALL_PRIMES = [p for p in range(2, 1000) if all(p % q for q in range(2, int(p ** 0.5) + 1))]
BASES_64 = (2, 325, 9375, 28178, 450775, 9780504, 1795265022)
BASES_ABOVE = tuple(SMALL_PRIMES[:40])


def _is_strong_probable_prime(n, base):
    d, s = n - 1, 0
    while d % 2 == 0:
        d //= 2
        s += 1
    x = pow(base, d, n)            # bug: base % n == 0 gives x == 0, "composite"
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
    for p in SMALL_PRIMES:
        if n % p == 0:
            return n == p
    if n < 1000 * 1000:
        return True
    bases = BASES_64 if n < 2**64 else BASES_ABOVE
    return all(_is_strong_probable_prime(n, a) for a in bases)
