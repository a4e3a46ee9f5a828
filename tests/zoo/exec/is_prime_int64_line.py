"""Defective executable is_prime (line protocol) that crashes on large inputs.

Deterministic Miller--Rabin with the twelve bases 2..37, a proof for every
n < 2**64 (Sorenson and Webster 2017, Math. Comp. 86).  DEFECT (crash): each
request is parsed with ``numpy.int64``, so n >= 2**63 raises OverflowError and
the process dies without answering (and without answering anything after it).
Correct for 0 <= n < 2**63.
"""

import sys

import numpy as np

BASES = (2, 3, 5, 7, 11, 13, 17, 19, 23, 29, 31, 37)


def _is_strong_probable_prime(n, base):
    d, s = n - 1, 0
    while d % 2 == 0:
        d //= 2
        s += 1
    x = pow(base, d, n)
    if x in (1, n - 1):
        return True
    for _ in range(s - 1):
        x = x * x % n
        if x == n - 1:
            return True
    return False


def is_prime(n):
    if n < 2:
        return False
    for p in BASES:
        if n % p == 0:
            return n == p
    return all(_is_strong_probable_prime(n, a) for a in BASES)


def main():
    for line in sys.stdin:
        if line.strip():
            n = int(np.int64(line.strip()))            # bug: n >= 2**63 overflows and kills the process
            sys.stdout.write("1\n" if is_prime(n) else "0\n")
            sys.stdout.flush()


if __name__ == "__main__":
    main()
