"""Semiprimes ``n = p * q`` that stress factoring code in different ways.

* close primes (``q`` the next prime after ``p``): Fermat's method (1643)
  factors them at once, since ``n = ((p+q)/2)**2 - ((q-p)/2)**2`` with a
  small second square; code that only tries trial division or Pollard rho
  must still get them right;
* balanced (``p`` and ``q`` of equal bit length): the hardest case for
  Pollard's rho (1975), whose running time grows like ``sqrt(p)``;
* unbalanced (a small ``p`` times a large ``q``): exposes loops that stop at
  ``sqrt(n)`` too early or assume the cofactor is prime without checking.

Every factor is a prime by :mod:`oracle.exact.primality` (deterministic below
its limit, Baillie--PSW probable above).  Results are deterministic given the
``random.Random`` passed in.
"""

from __future__ import annotations

import random

from .._errors import InvalidInputError
from .._integers import require_int
from ..exact.primality import next_prime

__all__ = ["close_prime_products", "balanced_semiprimes", "unbalanced_semiprimes"]

_MAX_BITS = 4096
_MAX_COUNT = 10**4


def close_prime_products(bits: int, count: int, rng: random.Random) -> list[int]:
    """``count`` products ``p * next_prime(p)`` with ``p`` a random prime of ``bits // 2`` bits."""
    bits, count = _checked_size(bits, count, minimum_bits=6)
    products = []
    for _ in range(count):
        p = _random_prime(bits // 2, rng)
        products.append(p * next_prime(p))
    return products


def balanced_semiprimes(bits: int, count: int, rng: random.Random) -> list[int]:
    """``count`` products of two independent random primes of ``bits // 2`` bits each."""
    bits, count = _checked_size(bits, count, minimum_bits=6)
    return [_random_prime(bits // 2, rng) * _random_prime(bits - bits // 2, rng)
            for _ in range(count)]


def unbalanced_semiprimes(small_bits: int, bits: int, count: int, rng: random.Random) -> list[int]:
    """``count`` products of a random prime of ``small_bits`` bits and one of ``bits - small_bits``."""
    bits, count = _checked_size(bits, count, minimum_bits=6)
    small_bits = require_int("small_bits", small_bits, minimum=2, maximum=bits // 2)
    return [_random_prime(small_bits, rng) * _random_prime(bits - small_bits, rng)
            for _ in range(count)]


def _checked_size(bits: int, count: int, *, minimum_bits: int) -> tuple[int, int]:
    bits = require_int("bits", bits, minimum=minimum_bits, maximum=_MAX_BITS)
    count = require_int("count", count, minimum=0, maximum=_MAX_COUNT)
    return bits, count


def _random_prime(bits: int, rng: random.Random) -> int:
    """A random prime with exactly ``bits`` bits (``bits >= 2``): next prime after a random start."""
    if not isinstance(rng, random.Random):
        raise InvalidInputError(f"rng={rng!r}: pass a random.Random instance")
    while True:
        start = rng.getrandbits(bits - 1) | (1 << (bits - 1))
        p = next_prime(start - 1)
        if p.bit_length() == bits:
            return p
