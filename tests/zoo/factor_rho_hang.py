"""Defective factor: Pollard's rho without trial division, retrying forever.

DEFECT (hang): the rho iteration x -> x**2 + 1 from x = 2 is the only method,
and when it fails (the gcd comes out as n itself) it simply starts again with
the same parameters, so it never terminates.  That happens for n = 4 and for
other small composites such as 8, 16, 25; most inputs are factored correctly.
To keep the emulated hang cheap on a shared machine, each retry first sleeps.
"""

import math
import time

import sympy

RETRY_PAUSE_SECONDS = 0.05


def _pollard_rho(n):
    while True:
        x = y = 2
        d = 1
        while d == 1:
            x = (x * x + 1) % n
            y = (y * y + 1) % n
            y = (y * y + 1) % n
            d = math.gcd(x - y, n)
        if d != n:
            return d
        time.sleep(RETRY_PAUSE_SECONDS)                # bug: retries with the same parameters


def factor(n):
    factors = {}
    stack = [n] if n > 1 else []
    while stack:
        m = stack.pop()
        if sympy.isprime(m):
            factors[m] = factors.get(m, 0) + 1
        else:
            d = _pollard_rho(m)
            stack += [d, m // d]
    return factors
