"""Correct mertens: running sums of sympy's Moebius sieve, extended as x grows.

sympy.sieve.mobiusrange(a, b) gives mu(n) for a <= n < b; the prefix sums are kept
so a later call costs one lookup.
"""

import sympy

_PREFIX = [0]          # _PREFIX[x] = M(x)


def mertens(x):
    if x < 1:
        return 0
    if x >= len(_PREFIX):
        running = _PREFIX[-1]
        for mu in sympy.sieve.mobiusrange(len(_PREFIX), x + 1):
            running += mu
            _PREFIX.append(running)
    return _PREFIX[x]
