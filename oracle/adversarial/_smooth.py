"""B-smooth numbers: integers with no prime factor greater than ``B``.

They are the worst case for factoring code that assumes a large prime
cofactor, and the best case for Pollard's ``p - 1`` method (1974).  Two
generators:

* :func:`smooth_numbers_up_to` -- every ``B``-smooth ``n <= limit``, built as
  products of the primes up to ``B`` (their count grows like ``(log limit)**k /
  (k! prod log p)`` for ``k = pi(B)`` primes, so keep ``B`` small for a large
  limit);
* :func:`smooth_numbers_between` -- the ``B``-smooth numbers of an interval,
  found by dividing out each prime ``p <= B`` from the multiples of ``p``
  (a sieve over the interval, in Python integers).
"""

from __future__ import annotations

from .._errors import InvalidInputError
from .._integers import require_int
from ..exact.primality import next_prime

__all__ = ["smooth_numbers_up_to", "smooth_numbers_between"]

_MAX_BOUND = 10**6
_MAX_INTERVAL = 10**7
_MAX_RESULTS = 10**6


def smooth_numbers_up_to(limit: int, bound: int) -> list[int]:
    """All ``bound``-smooth integers ``1 <= n <= limit``, ascending (1 is smooth)."""
    limit = require_int("limit", limit, minimum=0)
    bound = require_int("bound", bound, minimum=1, maximum=_MAX_BOUND)
    numbers = [1] if limit >= 1 else []
    for p in _primes_up_to(bound):
        extended = []
        for n in numbers:
            multiple = n * p
            while multiple <= limit:
                extended.append(multiple)
                multiple *= p
            if len(numbers) + len(extended) > _MAX_RESULTS:
                raise InvalidInputError(
                    f"limit={limit}, bound={bound}: more than {_MAX_RESULTS} smooth numbers")
        numbers += extended
    return sorted(numbers)


def smooth_numbers_between(low: int, high: int, bound: int) -> list[int]:
    """All ``bound``-smooth ``n`` with ``low <= n <= high`` (``high - low <= 10**7``)."""
    low = require_int("low", low, minimum=1)
    high = require_int("high", high, minimum=low - 1)
    bound = require_int("bound", bound, minimum=1, maximum=_MAX_BOUND)
    if high - low > _MAX_INTERVAL:
        raise InvalidInputError(f"high - low = {high - low}: must be <= {_MAX_INTERVAL}")
    cofactors = list(range(low, high + 1))
    for p in _primes_up_to(bound):
        for index in range(-low % p, len(cofactors), p):
            while cofactors[index] % p == 0:
                cofactors[index] //= p
    return [low + index for index, cofactor in enumerate(cofactors) if cofactor == 1]


def _primes_up_to(bound: int) -> list[int]:
    primes = []
    p = next_prime(1)
    while p <= bound:
        primes.append(p)
        p = next_prime(p)
    return primes
