"""Correct next_prime: sympy.nextprime, the smallest prime > n (2 for every n < 2).

sympy's primality test is deterministic below 2**64 and BPSW above, so beyond
2**64 the answer is a probable prime (no counterexample to BPSW is known).
"""

import sympy


def next_prime(n):
    return int(sympy.nextprime(n))
