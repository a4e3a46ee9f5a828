"""Defective nth_prime: a sieve sized by a bound used below the start of its range.

DEFECT: the sieve limit is Dusart's p_n <= n (ln n + ln ln n - 0.9484), proven
for n >= 39017 (Dusart 1999), but the routine switches to it already at
n >= 10000; below that it uses Rosser's p_n < n (ln n + ln ln n), n >= 6.
Where Dusart's bound undershoots p_n the sieve is too short and the routine
returns the largest prime it found: nth_prime(10239) returns 107581, the
10238th prime, instead of 107599 (sympy).  1412 indices in [10000, 39017)
are answered wrongly; all others are right.
"""

import math


def _primes_up_to(limit):
    flags = bytearray([1]) * (limit + 1)
    flags[0:2] = b"\x00\x00"
    for p in range(2, math.isqrt(limit) + 1):
        if flags[p]:
            flags[p * p::p] = bytearray(len(range(p * p, limit + 1, p)))
    return [i for i, flag in enumerate(flags) if flag]


def nth_prime(n):
    if n < 6:
        return (2, 3, 5, 7, 11)[n - 1]
    log_n = math.log(n)
    if n >= 10000:                                     # bug: proven only from 39017 on
        limit = n * (log_n + math.log(log_n) - 0.9484)
    else:
        limit = n * (log_n + math.log(log_n))
    primes = _primes_up_to(int(limit))
    return primes[n - 1] if len(primes) >= n else primes[-1]
