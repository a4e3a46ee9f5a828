"""Primes with a primality certificate, and products of them with proven factorisations.

Pocklington's criterion (Pocklington 1914; Lehmer 1928; in this form
Brillhart, Lehmer and Selfridge 1975, Math. Comp. 29, Theorem 4): let
``n - 1 = F * R`` with the prime factorisation of ``F`` known.  If for each
prime ``q | F`` there is an ``a`` with

    ``a**(n-1) = 1 (mod n)``  and  ``gcd(a**((n-1)/q) - 1, n) = 1``,

then every prime factor ``p`` of ``n`` satisfies ``p = 1 (mod F)``.  So if
also ``(F + 1)**2 > n``, then ``n`` is prime (a composite has a prime factor
``p <= sqrt(n)``, but ``p >= F + 1``).

A :class:`PrimeCertificate` records ``n``, the prime powers of ``F``, one
witness ``a`` per prime and, recursively, a certificate for each prime of
``F``; numbers below ``2**24`` are certified by trial division instead.
:func:`verify_certificate` re-checks all of it from scratch with Python
integers, without calling any probabilistic test.

:func:`certified_prime` builds such primes recursively in the manner of
U. Maurer (1995, "Fast generation of prime numbers and secure public-key
cryptographic parameters", J. Cryptology 8): first a certified prime ``q``
with ``q**2 > 2**bits``, then ``n = 2 R q + 1`` for random ``R`` until ``n``
passes, with ``F = q``.
"""

from __future__ import annotations

import math
import random
from collections.abc import Sequence
from dataclasses import dataclass

from .._errors import InvalidInputError
from .._integers import require_int
from ..exact.primality import is_prime, next_prime

__all__ = ["PrimeCertificate", "verify_certificate", "certified_prime",
           "certified_primes", "certified_product"]

#: Below this bound a number is certified by trial division up to its square root.
TRIAL_DIVISION_LIMIT = 2**24

_MAX_BITS = 2048


@dataclass(frozen=True)
class PrimeCertificate:
    """A Pocklington certificate that ``n`` is prime.

    ``factored_part`` lists ``(q, e)``: ``F`` is the product of ``q**e`` and
    divides ``n - 1``.  ``witnesses[i]`` is the ``a`` for the ``i``-th prime,
    ``proofs[i]`` that prime's own certificate.  All three are empty when
    ``n < TRIAL_DIVISION_LIMIT`` (certified by trial division).
    """

    n: int
    factored_part: tuple[tuple[int, int], ...] = ()
    witnesses: tuple[int, ...] = ()
    proofs: tuple[PrimeCertificate, ...] = ()


def verify_certificate(certificate: PrimeCertificate) -> bool:
    """Check a certificate from scratch; ``True`` only if it proves ``certificate.n`` prime."""
    if not isinstance(certificate, PrimeCertificate):
        raise InvalidInputError(
            f"certificate: expected a PrimeCertificate, got {type(certificate).__name__}")
    return _is_valid(certificate)


def certified_prime(bits: int, rng: random.Random) -> PrimeCertificate:
    """A random prime of exactly ``bits`` bits (``2 <= bits <= 2048``) with its certificate."""
    bits = require_int("bits", bits, minimum=2, maximum=_MAX_BITS)
    if not isinstance(rng, random.Random):
        raise InvalidInputError(f"rng={rng!r}: pass a random.Random instance")
    if 2**bits <= TRIAL_DIVISION_LIMIT:
        return PrimeCertificate(_random_prime_by_trial_division(bits, rng))
    factor = certified_prime((bits + 1) // 2 + 1, rng)
    q = factor.n
    smallest_r = -(-(2 ** (bits - 1) - 1) // (2 * q))
    largest_r = (2**bits - 2) // (2 * q)
    while True:
        n = 2 * rng.randint(smallest_r, largest_r) * q + 1
        if not is_prime(n):
            continue
        witness = _pocklington_witness(n, q)
        if witness is not None:
            return PrimeCertificate(n, ((q, 1),), (witness,), (factor,))


def certified_primes(bits: int, count: int, rng: random.Random) -> list[PrimeCertificate]:
    """``count`` certified random primes of ``bits`` bits."""
    count = require_int("count", count, minimum=0, maximum=10**4)
    return [certified_prime(bits, rng) for _ in range(count)]


def certified_product(factor_bits: Sequence[int],
                      rng: random.Random) -> tuple[int, tuple[PrimeCertificate, ...]]:
    """``(n, certificates)``: ``n`` the product of certified primes of the given sizes.

    The factorisation of ``n`` is then proven: a ground truth for factoring code.
    """
    certificates = tuple(certified_prime(bits, rng) for bits in factor_bits)
    if not certificates:
        raise InvalidInputError("factor_bits=(): give at least one factor size")
    return math.prod(certificate.n for certificate in certificates), certificates


def _is_valid(certificate: PrimeCertificate) -> bool:
    n = certificate.n
    if not isinstance(n, int) or isinstance(n, bool) or n < 2:
        return False
    parts = (certificate.factored_part, certificate.witnesses, certificate.proofs)
    if n < TRIAL_DIVISION_LIMIT:
        return not any(parts) and _is_prime_by_trial_division(n)
    if not certificate.factored_part or len({len(part) for part in parts}) != 1:
        return False
    primes = [q for q, _ in certificate.factored_part]
    if len(set(primes)) != len(primes):
        return False
    numbers = [*primes, *certificate.witnesses, *(e for _, e in certificate.factored_part)]
    if any(not isinstance(x, int) or isinstance(x, bool) for x in numbers):
        return False
    if any(q < 2 or e < 1 for q, e in certificate.factored_part):
        return False
    factored = math.prod(q**e for q, e in certificate.factored_part)
    if (n - 1) % factored != 0 or (factored + 1) ** 2 <= n:
        return False
    for (q, _), witness, proof in zip(*parts):
        if not isinstance(proof, PrimeCertificate) or proof.n != q or not _is_valid(proof):
            return False
        if pow(witness, n - 1, n) != 1 or math.gcd(pow(witness, (n - 1) // q, n) - 1, n) != 1:
            return False
    return True


def _pocklington_witness(n: int, q: int) -> int | None:
    """The least ``a`` in ``[2, 100]`` satisfying Pocklington's conditions for ``n`` and ``q``."""
    for a in range(2, 101):
        if pow(a, n - 1, n) == 1 and math.gcd(pow(a, (n - 1) // q, n) - 1, n) == 1:
            return a
    return None


def _is_prime_by_trial_division(n: int) -> bool:
    if n < 2:
        return False
    return all(n % d for d in range(2, math.isqrt(n) + 1))


def _random_prime_by_trial_division(bits: int, rng: random.Random) -> int:
    """A random prime with exactly ``bits`` bits, found and proven by trial division."""
    while True:
        candidate = rng.getrandbits(bits - 1) | (1 << (bits - 1))
        p = next_prime(candidate - 1)
        if p.bit_length() == bits and _is_prime_by_trial_division(p):
            return p
