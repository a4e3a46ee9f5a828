"""Defective prime_pi_mod: counts only the primes p > q.

DEFECT: the classes are walked as a + kq from k = 1 (the sieve of the class starts
above q), so a prime p = a < q is forgotten: prime_pi_mod(3, 4, 3) returns 0
instead of 1.  Correct whenever a is not itself a prime below q.
"""

import primesieve


def prime_pi_mod(x, q, a):
    if x < 2:
        return 0
    found = set(primesieve.primes(x))
    r = a % q
    return sum(1 for n in range(r + q, x + 1, q) if n in found)      # bug: from r, not r + q
