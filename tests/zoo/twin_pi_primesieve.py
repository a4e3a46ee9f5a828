"""Correct twin_pi: delegates to primesieve.count_twins.

primesieve counts the pairs (p, p + 2) with both members inside [0, x], which is
exactly the convention p + 2 <= x; x < 5 gives 0.
"""

import primesieve


def twin_pi(x):
    if x < 5:
        return 0
    return int(primesieve.count_twins(x))
