"""Defective factor: trial division that forgets the final cofactor.

DEFECT: the loop ``while d * d <= n`` ends with n > 1 holding the largest prime
factor, and the author never appends it: factor(14) returns [2] and
factor(13) returns [].  It is right only when n = 1 or the largest prime factor
of n is repeated (factor(9) == [3, 3], factor(18) == [2, 3, 3]).  Returns a
list of primes with repetition.
"""


def factor(n):
    primes = []
    d = 2
    while d * d <= n:
        while n % d == 0:
            primes.append(d)
            n //= d
        d += 1
    return primes                                      # bug: the cofactor n > 1 is lost
