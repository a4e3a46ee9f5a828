"""Defective is_prime: trial division by the primes below 1000, then Miller--Rabin to bases 2 and 3.

Bases 2 and 3 decide every n < 1373653 (OEIS A014233); 1373653 = 829 * 1657
itself is caught by the trial division, so the author saw the routine pass the
published counterexample and used it up to 2**32.  DEFECT: 2284453 = 1069 * 2137,
the least strong pseudoprime to bases 2 and 3 without a prime factor below 1000,
is reported prime, and so are many larger ones.  Right below 2284453.
"""

SMALL_PRIMES = [p for p in range(2, 1000) if all(p % q for q in range(2, int(p ** 0.5) + 1))]


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
    for p in SMALL_PRIMES:
        if n % p == 0:
            return n == p
    return _is_strong_probable_prime(n, 2) and _is_strong_probable_prime(n, 3)
