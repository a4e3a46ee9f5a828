"""Correct executable is_prime (line protocol): one n per line in, 1 or 0 per line out.

Uses python-flint's proven test fmpz.is_prime; 0 and 1 are not prime.
"""

import sys

import flint


def is_prime(n):
    return n >= 2 and bool(flint.fmpz(n).is_prime())


def main():
    for line in sys.stdin:
        if line.strip():
            sys.stdout.write("1\n" if is_prime(int(line)) else "0\n")
            sys.stdout.flush()


if __name__ == "__main__":
    main()
