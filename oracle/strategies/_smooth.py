"""A strategy for ``B``-smooth numbers: integers with no prime factor greater than ``B``.

They are the worst case for factoring code that expects a large prime
cofactor.  An example is a list of prime powers ``p**e`` with ``p <= B``,
multiplied together, skipping any factor that would pass ``max_value``;
the empty list gives 1 (smooth by convention), and examples shrink towards
few, small prime factors.
"""

from __future__ import annotations

import functools

from hypothesis import strategies as st

from ._validation import check_integer

__all__ = ["smooth_numbers"]

#: Largest smoothness bound accepted (the primes up to it are listed once).
MAX_BOUND = 10**6


def smooth_numbers(bound: int, max_value: int) -> st.SearchStrategy[int]:
    """``bound``-smooth integers ``1 <= n <= max_value``; shrinks towards 1."""
    bound = check_integer("bound", bound, minimum=2, maximum=MAX_BOUND)
    max_value = check_integer("max_value", max_value, minimum=1)
    return _smooth_numbers(bound, max_value)


@st.composite
def _smooth_numbers(draw, bound: int, max_value: int) -> int:
    most_factors = max_value.bit_length()
    prime_powers = draw(st.lists(
        st.tuples(_primes_up_to(bound), st.integers(1, max(most_factors, 1))),
        max_size=most_factors))
    n = 1
    for prime, exponent in prime_powers:
        exponent = min(exponent, most_factors // max(prime.bit_length() - 1, 1))
        if n * prime**exponent <= max_value:
            n *= prime**exponent
    return n


@functools.lru_cache(maxsize=64)
def _primes_up_to(bound: int) -> st.SearchStrategy[int]:
    from ..exact.sieve import primes

    return st.sampled_from([int(p) for p in primes(2, bound)])
