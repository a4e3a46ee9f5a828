"""Correct executable prime_pi (line protocol): one x per line in, pi(x) per line out.

Counts with primesieve.count_primes; 0 for x < 2.  Exits at end of input.
"""

import sys

import primesieve


def prime_pi(x):
    return int(primesieve.count_primes(x)) if x >= 2 else 0


def main():
    for line in sys.stdin:
        if line.strip():
            sys.stdout.write(f"{prime_pi(int(line))}\n")
            sys.stdout.flush()


if __name__ == "__main__":
    main()
