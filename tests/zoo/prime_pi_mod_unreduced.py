"""Defective prime_pi_mod: compares p % q with a as given.

DEFECT: a is not reduced modulo q, so a class named by an a >= q is never met:
prime_pi_mod(10, 4, 5) returns 0 instead of 1 (the prime 5 is 1 mod 4).  Correct
whenever 0 <= a < q.
"""

import primesieve


def prime_pi_mod(x, q, a):
    if x < 2:
        return 0
    return sum(1 for p in primesieve.primes(x) if p % q == a)      # bug: a % q
