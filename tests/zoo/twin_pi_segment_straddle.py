"""Defective twin_pi: a segmented count that loses pairs straddling a segment edge.

DEFECT: primes are generated in 2**16-wide segments [k * 2**16, (k + 1) * 2**16)
and pairs are looked for only inside one segment, so a pair
(k * 2**16 - 1, k * 2**16 + 1) is never counted.  The first such pair is
(786431, 786433), k = 12, so twin_pi is right below 786433 and one short from
there on (then short again after 7667713, 32440321, ...).
"""

import primesieve

SEGMENT = 1 << 16


def twin_pi(x):
    count = 0
    for low in range(0, x + 1, SEGMENT):
        high = min(low + SEGMENT - 1, x)
        primes = primesieve.primes(low, high)
        count += sum(1 for p, q in zip(primes, primes[1:]) if q - p == 2)
    return count
