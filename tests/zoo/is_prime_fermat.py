"""Defective is_prime: Fermat's little theorem to the bases 2, 3, 5, 7.

DEFECT: a Carmichael number n satisfies a^(n-1) = 1 (mod n) for every base a
prime to n (Korselt 1899; OEIS A002997), so any Carmichael number without a
factor <= 7 is reported prime -- the smallest is 29341 = 13 * 37 * 61.  Fermat
pseudoprimes to all four bases are fooled too.  Correct on every prime.
"""

BASES = (2, 3, 5, 7)


def is_prime(n):
    if n < 2:
        return False
    for p in BASES:
        if n % p == 0:
            return n == p
    return all(pow(a, n - 1, n) == 1 for a in BASES)   # bug: Carmichael numbers pass
