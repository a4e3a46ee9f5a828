"""Defective next_prime: a fixed search window, left by a BaseException.

DEFECT (exception): candidates are looked for in n + 1 .. n + 64 only; when
the window holds no prime the member raises SearchAborted, a BaseException
subclass (so that callers' ``except Exception`` cannot swallow it).  The
first prime gap above 64 is 72, from 31397 to 31469 (OEIS A002386 /
A005250), so next_prime(31397) raises.  Right wherever the gap after n fits
the window.
"""

import sympy

WINDOW = 64


class SearchAborted(BaseException):
    """No prime in the search window."""


def next_prime(n):
    if n < 2:
        return 2
    for candidate in range(n + 1, n + 1 + WINDOW):     # bug: gaps can exceed the window
        if sympy.isprime(candidate):
            return candidate
    raise SearchAborted(f"no prime in ({n}, {n + WINDOW}]")
