"""Theorem-backed bounds: proven intervals where no exact value is computed.

Every answer comes from the bound catalogue (``fixtures/bounds.yaml``): each
entry is a published or elementary inequality with its validity range and its
source.  Bounds are evaluated with directed rounding (interval arithmetic), so
no floating-point error can make an interval lie.  Only unconditional entries
whose range contains the argument are used; RH-conditional entries (Schoenfeld
1976) are listed by :func:`catalogue` but used only by :func:`pi_assuming_rh`,
which is explicitly *not* a proof.

A proven interval is evidence about a claimed value, not a certificate that a
value inside it is right.

>>> from oracle import bounds
>>> interval = bounds.pi(10**12)
>>> interval.lower <= 37607912018 <= interval.upper
True
"""

from __future__ import annotations

from ._catalogue import Bound, Catalogue, CatalogueError, ValidityRange, default_catalogue, load_catalogue
from ._proven import (ConditionalInterval, ProvenInterval, RealInterval, applicable, nth_prime, pi,
                      pi_assuming_rh, primes_between, psi, theta, twin_pi)

__all__ = ["ProvenInterval", "RealInterval", "ConditionalInterval", "Bound", "ValidityRange",
           "Catalogue", "CatalogueError", "pi", "nth_prime", "twin_pi", "primes_between", "theta",
           "psi", "pi_assuming_rh", "catalogue", "entry", "errata", "applicable", "load_catalogue"]


def catalogue() -> tuple[Bound, ...]:
    """Every entry of the installed catalogue, RH-conditional ones included (see ``Bound.conditional``)."""
    return default_catalogue().entries


def entry(bound_id: str) -> Bound:
    """The catalogue entry with this id (raises :class:`CatalogueError` if there is none)."""
    return default_catalogue().entry(bound_id)


def errata() -> tuple[Bound, ...]:
    """Readings of published bounds known to be FALSE; kept for tests, never used."""
    return default_catalogue().errata
