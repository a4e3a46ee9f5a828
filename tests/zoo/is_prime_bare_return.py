"""Defective is_prime: a bare ``return`` on the small-input path.

DEFECT (wrong type): ``if n < 2: return`` gives None, not False, for 0 and 1.
None is falsy, so ``if is_prime(n):`` still works, but the answer is not a
bool (``is_prime(1) is False`` fails).  Correct, and a bool, for n >= 2
(sympy.isprime).
"""

import sympy


def is_prime(n):
    if n < 2:
        return                                         # bug: None instead of False
    return bool(sympy.isprime(n))
