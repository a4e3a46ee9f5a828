"""Minimal fast executable is_prime (line protocol), for measuring the engine's throughput.

Correct for 0 <= n < 2**64: a table for n < 2**16, then the strong test to the
twelve bases 2..37, a proof below 2**64 (Sorenson and Webster 2017, Math. Comp. 86).
Imports nothing beyond sys so that start-up is fast.
"""

import sys

TABLE_LIMIT = 1 << 16
BASES = (2, 3, 5, 7, 11, 13, 17, 19, 23, 29, 31, 37)


def _table(limit):
    flags = bytearray([1]) * limit
    flags[0] = flags[1] = 0
    for p in range(2, int(limit ** 0.5) + 1):
        if flags[p]:
            flags[p * p::p] = bytes(len(range(p * p, limit, p)))
    return flags


_IS_SMALL_PRIME = _table(TABLE_LIMIT)


def _is_strong_probable_prime(n, base):
    d, s = n - 1, 0
    while not d & 1:
        d >>= 1
        s += 1
    x = pow(base, d, n)
    if x == 1 or x == n - 1:
        return True
    for _ in range(s - 1):
        x = x * x % n
        if x == n - 1:
            return True
    return False


def is_prime(n):
    if n < TABLE_LIMIT:
        return n >= 0 and _IS_SMALL_PRIME[n] == 1
    for p in BASES:
        if n % p == 0:
            return False
    return all(_is_strong_probable_prime(n, a) for a in BASES)


def main():
    readline, write, flush = sys.stdin.readline, sys.stdout.write, sys.stdout.flush
    while True:
        line = readline()
        if not line:
            break
        if line.strip():
            write("1\n" if is_prime(int(line)) else "0\n")
            flush()


if __name__ == "__main__":
    main()
