"""Defective mobius: trial division below 1000, then the cofactor is taken for a prime.

DEFECT: after dividing out the primes below 1000 (squares among them are
noticed), a cofactor m > 1 is counted as one more prime factor without being
tested: mobius(1009**2) = mobius(1018081) returns -1 instead of 0 (a square-full
number), mobius(1009 * 1013) returns -1 instead of 1.  Right whenever the part
of n above 1000 is 1 or a prime.
"""


def mobius(n):
    result = 1
    for p in range(2, 1000):
        if n % p == 0:
            n //= p
            if n % p == 0:
                return 0
            result = -result
    if n > 1:
        result = -result                                 # bug: n may be p**2 or p*q here
    return result
