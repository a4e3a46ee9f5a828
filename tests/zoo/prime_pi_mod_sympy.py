"""Correct prime_pi_mod: counts the primes of sympy's cached sieve in the class a mod q."""

import bisect
import math

import sympy


def prime_pi_mod(x, q, a):
    if q < 1 or math.gcd(a, q) != 1:
        raise ValueError(f"prime_pi_mod: need q >= 1 and gcd(a, q) = 1, got q={q}, a={a}")
    if x < 2:
        return 0
    sympy.sieve.extend(x)
    listed = sympy.sieve._list
    r = a % q
    return sum(1 for p in listed[:bisect.bisect_right(listed, x)] if p % q == r)
