"""Correct prime_pi: delegates to primecount (Deleglise--Rivat / Gourdon) via primecountpy.

Honours the convention prime_pi(x) = 0 for x < 2.
"""

import primecountpy


def prime_pi(x):
    if x < 2:
        return 0
    return int(primecountpy.prime_pi(x))
