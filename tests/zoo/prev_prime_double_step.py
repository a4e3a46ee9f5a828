"""Defective prev_prime: excludes n twice.

DEFECT: calls a library's "largest prime below m" with m = n - 1, so it returns
the largest prime below n - 1: wrong whenever n - 1 is prime
(prev_prime(8) returns 5 instead of 7).  Correct when n - 1 is composite.
"""

import sympy


def prev_prime(n):
    if n <= 3:
        return 2
    return int(sympy.prevprime(n - 1))                 # bug: prevprime is already exclusive
