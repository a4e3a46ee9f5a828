"""Defective nth_prime: Cipolla's asymptotic estimate without correction.

Cipolla (1902, Ann. Mat. Pura Appl.): p_n = n (ln n + ln ln n - 1
+ (ln ln n - 2)/ln n + O((ln ln n / ln n)^2)).

DEFECT: takes the prime next to the float estimate and never corrects it by
counting, so the answer is a prime near p_n but almost never p_n itself
(nth_prime(1000) returns 7933, the true value is 7919).  n <= 10 comes from a
small table and is right.
"""

import math

import sympy

_SMALL = [2, 3, 5, 7, 11, 13, 17, 19, 23, 29]


def nth_prime(n):
    if n <= len(_SMALL):
        return _SMALL[n - 1]
    ln = math.log(n)
    lnln = math.log(ln)
    estimate = n * (ln + lnln - 1 + (lnln - 2) / ln)
    return int(sympy.nextprime(int(estimate)))         # bug: an estimate, not p_n
