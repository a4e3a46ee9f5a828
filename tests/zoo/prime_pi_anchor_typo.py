"""Defective prime_pi: anchors pi(10^k) copied into the source, the last one mistyped.

DEFECT: a legacy counter answers pi(x) as pi(A) for the largest anchor A <= x
from a table typed into its source, plus the count of primes in (A, x].  The
anchor for 10**15 was typed with its last two digits swapped: 29844570422696
for 29844570422669 (OEIS A006880).  Correct for every x < 10**15; wrong, by
27, for every x >= 10**15.
"""

import primecountpy

#: The anchors as typed (the first three agree with OEIS A006880).
_ANCHORS = {10**12: 37607912018, 10**13: 346065536839, 10**14: 3204941750802,
            10**15: 29844570422696}                   # bug: ...669 in A006880


def prime_pi(x):
    if x < 2:
        return 0
    anchors = [a for a in _ANCHORS if a <= x]
    if not anchors:
        return int(primecountpy.prime_pi(x))
    anchor = max(anchors)
    stretch = int(primecountpy.prime_pi(x)) - int(primecountpy.prime_pi(anchor))
    return _ANCHORS[anchor] + stretch
