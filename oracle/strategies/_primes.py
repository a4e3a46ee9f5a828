"""Strategies for primes, composites and prime powers in a range.

Each draws an integer ``v`` with ``st.integers`` and moves it to the nearest
member at or above ``v`` (the largest member in range when it would overshoot),
so an example shrinks as ``v`` does: towards the smallest member of the range.
Primality is decided by :mod:`oracle.exact.primality` -- proven below its
``DETERMINISTIC_LIMIT`` (about ``3.2 * 10**23``), a Baillie--PSW *probable*
prime above.  That module (and with it gmpy2 and numpy) is imported only when
an example is drawn, never when this module is imported.
"""

from __future__ import annotations

import functools

from hypothesis import strategies as st

from ._validation import InvalidStrategyArgument, check_integer, check_optional_integer

__all__ = ["primes", "composites", "prime_powers", "primes_unchecked"]


def primes(min_value: int = 2, max_value: int | None = None) -> st.SearchStrategy[int]:
    """Primes ``p`` with ``min_value <= p <= max_value`` (no upper limit for ``None``).

    Shrinks towards the smallest prime ``>= min_value``.  Wide ranges are
    accepted without computation by Bertrand's postulate (Chebyshev 1852: for
    ``n >= 2`` there is a prime ``n < p < 2n``); a narrower range is searched
    once, here, and refused when it holds no prime.
    """
    min_value = check_integer("min_value", min_value, minimum=0)
    max_value = check_optional_integer("max_value", max_value, minimum=min_value)
    lowest = max(min_value, 2)
    if max_value is not None and not _range_holds_a_prime(lowest, max_value):
        raise InvalidStrategyArgument(
            f"min_value={min_value}, max_value={max_value}: there is no prime in this range")
    return primes_unchecked(lowest, max_value)


def composites(min_value: int = 4, max_value: int | None = None) -> st.SearchStrategy[int]:
    """Composite numbers ``n`` (``n >= 4``, not prime) with ``min_value <= n <= max_value``.

    Shrinks towards the smallest composite ``>= min_value``.  Of two
    consecutive integers ``>= 4`` one is even, hence composite, so only a
    one-point range needs a primality test here.
    """
    min_value = check_integer("min_value", min_value, minimum=0)
    max_value = check_optional_integer("max_value", max_value, minimum=min_value)
    lowest = max(min_value, 4)
    if max_value is not None and (max_value < lowest or
                                  (max_value == lowest and _primality().is_prime(lowest))):
        raise InvalidStrategyArgument(
            f"min_value={min_value}, max_value={max_value}: there is no composite in this range")
    return st.integers(lowest, max_value).map(
        functools.partial(_composite_at_or_above, max_value=max_value))


def prime_powers(max_value: int, *, min_exponent: int = 2) -> st.SearchStrategy[int]:
    """Prime powers ``p**k <= max_value`` with ``k >= min_exponent`` (proper powers by default).

    The exponent is drawn first, then the prime below ``max_value**(1/k)``;
    examples shrink towards ``2**min_exponent``.
    """
    min_exponent = check_integer("min_exponent", min_exponent, minimum=1, maximum=4096)
    max_value = check_integer("max_value", max_value, minimum=2**min_exponent)
    return _prime_powers(max_value, min_exponent)


@st.composite
def _prime_powers(draw, max_value: int, min_exponent: int) -> int:
    exponent = draw(st.integers(min_exponent, max_value.bit_length() - 1))
    root = _integer_root(max_value, exponent)
    return draw(primes_unchecked(2, root)) ** exponent


def primes_unchecked(lowest: int, max_value: int | None) -> st.SearchStrategy[int]:
    """Primes in ``[lowest, max_value]``, ``lowest >= 2``, for a range known to hold one."""
    return st.integers(lowest, max_value).map(
        functools.partial(_prime_at_or_above, max_value=max_value))


def _prime_at_or_above(value: int, max_value: int | None) -> int:
    """The least prime ``>= value``, or the largest prime ``<= max_value`` if that is smaller."""
    prime = _primality().next_prime(value - 1)
    if max_value is not None and prime > max_value:
        return _largest_prime_up_to(max_value)
    return prime


def _composite_at_or_above(value: int, max_value: int | None) -> int:
    """The least composite ``>= value``, or the largest composite ``<= max_value`` if smaller."""
    is_prime = _primality().is_prime
    composite = value if not is_prime(value) else value + 1
    if max_value is not None and composite > max_value:
        return max_value if not is_prime(max_value) else max_value - 1
    return composite


def _range_holds_a_prime(lowest: int, highest: int) -> bool:
    """Whether ``[lowest, highest]`` (``lowest >= 2``) contains a prime."""
    if highest < lowest:
        return False
    if lowest <= 3 or highest >= 2 * lowest - 3:  # Bertrand with n = lowest - 1
        return True
    return _largest_prime_up_to(highest) >= lowest


@functools.lru_cache(maxsize=256)
def _largest_prime_up_to(value: int) -> int:
    """The largest prime ``<= value`` (``value >= 2``)."""
    return _primality().prev_prime(value + 1)


def _integer_root(value: int, exponent: int) -> int:
    """``floor(value ** (1 / exponent))`` exactly."""
    import gmpy2

    return int(gmpy2.iroot(value, exponent)[0])


def _primality():
    from ..exact import primality

    return primality
