"""Defective divisor_count: trial division up to sqrt(n) that forgets the last prime.

DEFECT: d(n) is the product of (e + 1) over the primes found with
``while p * p <= n``; the cofactor n > 1 left at the end, the one prime factor
above the square root of what remains, is never counted: divisor_count(2)
returns 1 instead of 2, divisor_count(6) returns 2 instead of 4.  Right when
the largest prime factor of n is repeated (4, 8, 9, 18, 36, ...).
"""


def divisor_count(n):
    count, p = 1, 2
    while p * p <= n:
        exponent = 0
        while n % p == 0:
            n //= p
            exponent += 1
        count *= exponent + 1
        p += 1
    return count                                         # bug: a cofactor n > 1 adds a factor 2
