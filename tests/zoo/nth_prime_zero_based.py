"""Defective nth_prime: indexes a list of primes from zero.

DEFECT: returns ``primes[n]`` where the list starts at 2, i.e. the (n + 1)-th
prime: nth_prime(1) returns 3 instead of 2, wrong for every n.
"""

import math

import primesieve


def nth_prime(n):
    # Rosser (1941, Proc. London Math. Soc.): p_n < n (ln n + ln ln n) for n >= 6; 20 % margin.
    limit = 30 if n < 6 else int(1.2 * n * (math.log(n) + math.log(math.log(n))))
    primes = primesieve.primes(limit)
    return int(primes[n])                              # bug: should be primes[n - 1]
