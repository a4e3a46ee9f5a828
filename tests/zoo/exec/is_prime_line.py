"""Correct executable is_prime (line protocol): one n per line in, 1 or 0 per line out.

Uses python-flint's proven test fmpz.is_prime, after its probable-prime test (see
tests/zoo/is_prime_flint.py: is_prime alone hangs on a 201-bit strong pseudoprime);
0 and 1 are not prime.
"""

import sys

import flint


def is_prime(n):
    candidate = flint.fmpz(n)
    return n >= 2 and bool(candidate.is_probable_prime()) and bool(candidate.is_prime())


def main():
    for line in sys.stdin:
        if line.strip():
            sys.stdout.write("1\n" if is_prime(int(line)) else "0\n")
            sys.stdout.flush()


if __name__ == "__main__":
    main()
