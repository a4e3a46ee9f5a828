"""Defective executable primes_in (line protocol): "a b" per line in, primes on one line out.

DEFECT: treats the interval as half-open [a, b), so b is missing whenever it is
prime ("2 7" is answered "2 3 5").  Correct when b is composite; an empty
interval gives an empty line.
"""

import sys

import primesieve


def primes_in(a, b):
    a = max(a, 0)
    if b - 1 < 2 or a > b - 1:
        return []
    return primesieve.primes(a, b - 1)                 # bug: b is included by convention


def main():
    for line in sys.stdin:
        if line.strip():
            a, b = (int(field) for field in line.split())
            sys.stdout.write(" ".join(str(p) for p in primes_in(a, b)) + "\n")
            sys.stdout.flush()


if __name__ == "__main__":
    main()
