"""Defective primes_in: an assertion of the native kind on one-point intervals.

DEFECT (crash): emulates a C extension whose segment code asserts a < b and,
like C's assert, aborts the whole process (os.abort, SIGABRT) when it fails:
any one-point interval [a, a] kills it.  Right for every a < b (and for
a > b, the empty interval).
"""

import os
import sys

import primesieve


def primes_in(a, b):
    if a > b:
        return []
    if a == b:
        sys.stderr.write("primes_in: assertion 'low < high' failed\n")
        sys.stderr.flush()
        os.abort()                                     # bug: [a, a] is a valid interval
    return [int(p) for p in primesieve.primes(max(a, 0), b)]
