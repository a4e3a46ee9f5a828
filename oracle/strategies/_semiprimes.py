"""Strategies for semiprimes ``n = p * q`` with balanced or unbalanced factors.

* balanced: ``p`` and ``q`` of ``floor(bits/2)`` and ``ceil(bits/2)`` bits --
  the hard case for Pollard's rho (1975), whose work grows like ``sqrt(p)``;
* unbalanced: a ``p`` of at most a quarter of the bits times a large ``q`` --
  it catches loops that stop too early or take the cofactor for a prime.

``p = q`` is allowed (a prime square is a semiprime), so the product of two
primes of ``a`` and ``b`` bits has ``a + b - 1`` or ``a + b`` bits.  Each prime
with exactly ``k >= 2`` bits is drawn from ``[2**(k-1), 2**k - 1]``, which holds
a prime by Bertrand's postulate (Chebyshev 1852), so examples shrink to the
smallest prime of each size.
"""

from __future__ import annotations

from hypothesis import strategies as st

from ._primes import primes_unchecked
from ._validation import check_integer

__all__ = ["balanced_semiprimes", "unbalanced_semiprimes"]

#: Largest product size accepted, in bits (as in :mod:`oracle.adversarial`).
MAX_BITS = 4096


def balanced_semiprimes(min_bits: int = 4, max_bits: int = 64) -> st.SearchStrategy[int]:
    """Products ``p * q`` of primes of ``floor(bits/2)`` and ``ceil(bits/2)`` bits.

    ``bits`` is drawn from ``[min_bits, max_bits]`` (``min_bits >= 4``).
    Shrinks towards the smallest primes of ``min_bits // 2`` and
    ``min_bits - min_bits // 2`` bits (``2 * 2 = 4`` for ``min_bits = 4``).
    """
    min_bits = check_integer("min_bits", min_bits, minimum=4, maximum=MAX_BITS)
    max_bits = check_integer("max_bits", max_bits, minimum=min_bits, maximum=MAX_BITS)
    return _balanced_semiprimes(min_bits, max_bits)


def unbalanced_semiprimes(min_bits: int = 8, max_bits: int = 64) -> st.SearchStrategy[int]:
    """Products ``p * q`` with ``p`` of ``2 .. bits // 4`` bits and ``q`` of the remaining bits.

    ``bits`` is drawn from ``[min_bits, max_bits]`` (``min_bits >= 8``), so
    ``q`` has at least three times the bits of ``p``.  Shrinks towards
    ``2 * q0``, ``q0`` the smallest prime of ``min_bits - 2`` bits (74 for
    ``min_bits = 8``).
    """
    min_bits = check_integer("min_bits", min_bits, minimum=8, maximum=MAX_BITS)
    max_bits = check_integer("max_bits", max_bits, minimum=min_bits, maximum=MAX_BITS)
    return _unbalanced_semiprimes(min_bits, max_bits)


@st.composite
def _balanced_semiprimes(draw, min_bits: int, max_bits: int) -> int:
    bits = draw(st.integers(min_bits, max_bits))
    p = draw(_primes_of_bit_length(bits // 2))
    q = draw(_primes_of_bit_length(bits - bits // 2))
    return p * q


@st.composite
def _unbalanced_semiprimes(draw, min_bits: int, max_bits: int) -> int:
    bits = draw(st.integers(min_bits, max_bits))
    small_bits = draw(st.integers(2, bits // 4))
    p = draw(_primes_of_bit_length(small_bits))
    q = draw(_primes_of_bit_length(bits - small_bits))
    return p * q


def _primes_of_bit_length(bits: int) -> st.SearchStrategy[int]:
    return primes_unchecked(2 ** (bits - 1), 2**bits - 1)
