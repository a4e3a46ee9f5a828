"""Small candidate implementations, correct and defective, used by the engine's own tests.

The correct ones stand on sympy and primesieve (test-only references).  Each
defective one carries one bug of a kind real code has (common practice).
"""

import math
import os
import random
import time

import primesieve
import sympy


def prime_pi(x):
    return primesieve.count_primes(x) if x >= 2 else 0


def prime_pi_exclusive(x):            # counts p < x instead of p <= x
    return primesieve.count_primes(x - 1) if x >= 3 else 0


def prime_pi_wraps(x):                # x kept in an unsigned 32-bit word
    return prime_pi(x % 2**32)


def prime_pi_float(x):
    return float(prime_pi(x))


def prime_pi_from_1000(x):            # wrong from x = 1000 on: the table ends too early
    return prime_pi(x) if x < 1000 else prime_pi(x) - 1


def prime_pi_random(x):               # nondeterministic
    return prime_pi(x) + (1 if x > 100 and random.random() < 0.5 else 0)


def prime_pi_slow(x):
    if x > 5000:
        while True:
            pass
    return prime_pi(x)


def prime_pi_crash(x):                # dies like a segfaulting extension
    if x == 77:
        os._exit(139)
    return prime_pi(x)


def prime_pi_none(x):
    return None if x == 50 else prime_pi(x)


def is_prime(n):
    return sympy.isprime(n)


def is_prime_fermat(n):               # Fermat test to base 2: fooled by 341, 561, ...
    return n == 2 or (n > 2 and pow(2, n - 1, n) == 1)


def is_prime_float_root(n):           # trial division to int(sqrt(n)): misses p*p when sqrt rounds down
    if n < 2:
        return False
    limit = int(math.sqrt(n)) - (1 if n > 2**50 else 0)
    return all(n % d for d in range(2, min(limit, 10**6) + 1))


def is_prime_sleeps(n):
    time.sleep(0.0)
    return sympy.isprime(n)


def next_prime(n):
    return sympy.nextprime(n)


def next_prime_inclusive(n):          # returns n itself when n is prime
    return n if sympy.isprime(n) else sympy.nextprime(n)


def prev_prime(n):
    return sympy.prevprime(n)


def primes_in(a, b):
    return primesieve.primes(a, b) if b >= a else []


def primes_in_drops_first(a, b):      # loses a when a is prime (exclusive lower end)
    return [p for p in primesieve.primes(a, b) if p != a] if b >= a else []


def primes_in_odd_only(a, b):         # an odd-only sieve without the special case: 2 is lost
    return [p for p in primesieve.primes(a, b) if p != 2] if b >= a else []


def primes_in_duplicates(a, b):       # repeats the prime at a segment join
    found = list(primesieve.primes(a, b)) if b >= a else []
    return found + [p for p in found if p == 65537]


def factor(n):
    return sympy.factorint(n)


def factor_set(n):                    # loses multiplicity
    return sorted(sympy.factorint(n))


def nth_prime(n):
    return primesieve.nth_prime(n)


def nth_prime_zero_based(n):
    return primesieve.nth_prime(n + 1)


def twin_pi(x):
    return primesieve.count_twins(0, x) if x >= 5 else 0


def twin_pi_lower_member(x):          # counts pairs with p <= x instead of p + 2 <= x
    return primesieve.count_twins(0, x + 2) if x >= 3 else 0


def nth_prime_hangs_at_zero(n):       # no guard for n < 1: the search never ends
    while n < 1:
        time.sleep(0.01)
    return primesieve.nth_prime(n)


def next_prime_mpz(n):                 # correct, answers as gmpy2 integers (which have a len())
    import gmpy2
    return gmpy2.next_prime(n)


def factor_mpz_pairs(n):               # correct, (mpz, int) pairs
    import gmpy2
    return [(gmpy2.mpz(p), e) for p, e in sorted(sympy.factorint(n).items())]
