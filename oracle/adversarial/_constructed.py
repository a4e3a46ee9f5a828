"""Constructed ground truth: integers built from a chosen factorisation, kept where the oracle looks.

Factoring is hard, multiplying is easy: choose primes of given sizes and
exponents first, each with a Pocklington certificate
(:mod:`oracle.adversarial._certified`; below 2²⁴ trial division), and their
product ``n`` has a *proven* factorisation at any size -- 2²⁵⁶, 2¹⁰²⁴, far
beyond any factoriser here.  From it follow exactly, by their definitions
(multiplicative functions of the prime powers):

    μ(n) = 0 if some e ≥ 2, else (−1)^k;   φ(n) = ∏ p^(e−1) (p − 1);
    d(n) = ∏ (e + 1);                      σ(n) = ∏ (p^(e+1) − 1) / (p − 1).

How the judge learns the truth (the design, chosen to leave the engine alone):
the engine asks a role's judge with the arguments only, and the judge asks the
facade (:func:`oracle.facade.answer`).  So the sampling family that builds a
number *registers* it here (:func:`register`, which re-checks the product and
every certificate first), and the facade's factorisation route looks ``n`` up
(:func:`known`) before it tries to factor; a hit is answered with provenance
``constructed: certified factors``.  The register lives in the judging process
only (the candidate runs in a child and never sees it) and holds at most
:data:`REGISTER_SIZE` numbers, the oldest dropped first.  A constructed input
replayed later from the regression corpus, in a process that has not built it,
is judged by the ordinary route (factoring within the budget, else out of
reach).
"""

from __future__ import annotations

import math
import random
from collections import OrderedDict
from collections.abc import Sequence
from dataclasses import dataclass

from .._errors import InvalidInputError
from .._integers import require_int
from ._certified import PrimeCertificate, certified_prime, verify_certificate

__all__ = ["ConstructedNumber", "construct", "register", "known", "REGISTER_SIZE"]

#: Most constructed numbers kept at once.
REGISTER_SIZE = 4096
_REGISTER: OrderedDict[int, "ConstructedNumber"] = OrderedDict()


@dataclass(frozen=True)
class ConstructedNumber:
    """``n`` with its prime powers: ``factors`` lists ``(certificate, exponent)``, ascending."""

    n: int
    factors: tuple[tuple[PrimeCertificate, int], ...]

    @property
    def factorisation(self) -> dict[int, int]:
        return {certificate.n: exponent for certificate, exponent in self.factors}

    def verify(self) -> bool:
        """Whether the primes are distinct, the certificates prove them and the product is n."""
        primes = [certificate.n for certificate, _ in self.factors]
        return (len(set(primes)) == len(primes)
                and all(isinstance(e, int) and e >= 1 for _, e in self.factors)
                and all(verify_certificate(certificate) for certificate, _ in self.factors)
                and math.prod(p**e for p, e in self.factorisation.items()) == self.n)


def construct(shape: Sequence[tuple[int, int]], rng: random.Random) -> ConstructedNumber:
    """A number with one certified prime of ``bits`` bits to the power ``exponent`` for
    each ``(bits, exponent)`` of ``shape`` (the primes distinct; ``bits`` ≥ 2)."""
    if not shape:
        raise InvalidInputError("shape=(): give at least one (bits, exponent)")
    chosen: dict[int, tuple[PrimeCertificate, int]] = {}
    for bits, exponent in shape:
        require_int("bits", bits, minimum=2, maximum=2048)
        require_int("exponent", exponent, minimum=1, maximum=64)
        for _ in range(1000):
            certificate = certified_prime(bits, rng)
            if certificate.n not in chosen:
                break
        else:
            raise InvalidInputError(f"shape asks for more distinct primes of {bits} bits than exist")
        chosen[certificate.n] = (certificate, exponent)
    factors = tuple(chosen[p] for p in sorted(chosen))
    return ConstructedNumber(math.prod(c.n**e for c, e in factors), factors)


def register(number: ConstructedNumber) -> ConstructedNumber:
    """Keep ``number`` for the oracle, after checking it from scratch; returns it."""
    if not isinstance(number, ConstructedNumber) or not number.verify():
        raise InvalidInputError("refused to register a constructed number whose factors do "
                                "not verify")
    _REGISTER[number.n] = number
    _REGISTER.move_to_end(number.n)
    while len(_REGISTER) > REGISTER_SIZE:
        _REGISTER.popitem(last=False)
    return number


def known(n: int) -> ConstructedNumber | None:
    """The registered construction of ``n``, or None."""
    return _REGISTER.get(n) if type(n) is int else None
