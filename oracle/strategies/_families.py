"""Strategies over the adversarial families of :mod:`oracle.adversarial`.

Each strategy samples a deterministic list of members, sorted ascending, so an
example shrinks to the smallest member.  The list is built on the first draw
(``st.deferred``) and cached per argument set; building it imports
:mod:`oracle.adversarial` and may take a fraction of a second.  An optional
``max_value`` keeps members ``<= max_value`` (for code that declares a
domain); if none is left, the first draw raises
:class:`~oracle.strategies.InvalidStrategyArgument`.

Caution: these lists show that a test *can* be fooled.  Passing on them is
evidence, not proof that a primality routine is correct; for cryptographic
use defer to the published standards (e.g. FIPS 186-5) and a vetted library.
"""

from __future__ import annotations

import functools
import math
from collections.abc import Callable

from hypothesis import strategies as st

from ._validation import (InvalidStrategyArgument, check_bases, check_integer,
                          check_optional_integer)

__all__ = ["strong_pseudoprimes", "lucas_pseudoprimes", "strong_lucas_pseudoprimes",
           "fibonacci_pseudoprimes", "carmichael_numbers", "primes_near", "squares_near"]

#: Strong pseudoprimes are also searched exhaustively below this bound.
_SEARCH_LIMIT = 10**5
#: How many Arnault-constructed strong pseudoprimes join the list (prime bases only).
_CONSTRUCTED_COUNT = 3
#: Chernick's (6k+1)(12k+1)(18k+1) from k = this start are about 2**63.
_CHERNICK_NEAR_2_63 = 200_000
_MAX_COUNT = 100


def strong_pseudoprimes(bases=(2,), *, max_value: int | None = None) -> st.SearchStrategy[int]:
    """Odd composites that pass the strong (Miller--Rabin) test to every base in ``bases``.

    Members: the published terms of OEIS A001262, A074773 and A014233 and the
    Carmichael numbers of OEIS A002997 that pass every base; and, when every
    base is prime, an exhaustive search below ``10**5`` and three numbers
    built by Arnault's construction (1995, J. Symbolic Comput. 20).  Shrinks to the
    smallest (2047 for base 2).  A base set with no known pseudoprime (one
    proven deterministic far out) is refused on the first draw.
    """
    bases = check_bases(bases)
    max_value = check_optional_integer("max_value", max_value, minimum=0)
    return _sampled_family(f"strong pseudoprime to bases {bases}",
                           functools.partial(_strong_pseudoprime_members, bases), max_value)


def lucas_pseudoprimes(*, max_value: int | None = None) -> st.SearchStrategy[int]:
    """Lucas pseudoprimes with Selfridge's parameters (OEIS A217120); shrinks to 323."""
    max_value = check_optional_integer("max_value", max_value, minimum=0)
    return _sampled_family("Lucas pseudoprime", functools.partial(_published, "LUCAS_PSEUDOPRIMES"),
                           max_value)


def strong_lucas_pseudoprimes(*, max_value: int | None = None) -> st.SearchStrategy[int]:
    """Strong Lucas pseudoprimes with Selfridge's parameters (OEIS A217255); shrinks to 5459."""
    max_value = check_optional_integer("max_value", max_value, minimum=0)
    return _sampled_family("strong Lucas pseudoprime",
                           functools.partial(_published, "STRONG_LUCAS_PSEUDOPRIMES"), max_value)


def fibonacci_pseudoprimes(*, max_value: int | None = None) -> st.SearchStrategy[int]:
    """Odd Fibonacci pseudoprimes, ``n | F_{n - (5/n)}`` (OEIS A081264); shrinks to 323."""
    max_value = check_optional_integer("max_value", max_value, minimum=0)
    return _sampled_family("Fibonacci pseudoprime",
                           functools.partial(_published, "FIBONACCI_PSEUDOPRIMES"), max_value)


def carmichael_numbers(*, max_value: int | None = None) -> st.SearchStrategy[int]:
    """Carmichael numbers (Korselt 1899): OEIS A002997 below 520,000 and Chernick's products.

    Chernick's ``(6k+1)(12k+1)(18k+1)`` (1939, Bull. Amer. Math. Soc. 45) add
    the first terms of OEIS A033502 and three near ``2**63``.  Shrinks to 561.
    """
    max_value = check_optional_integer("max_value", max_value, minimum=0)
    return _sampled_family("Carmichael number", _carmichael_members, max_value)


def primes_near(value: int = 2**32, *, count: int = 3) -> st.SearchStrategy[int]:
    """The ``count`` largest primes ``<= value`` and the ``count`` smallest above it.

    Shrinks to the smallest of them.  Word boundaries (``2**16``, ``2**32``,
    ``2**64``) are where fixed-width modular arithmetic overflows.
    """
    value = check_integer("value", value, minimum=0)
    count = check_integer("count", count, minimum=1, maximum=_MAX_COUNT)
    return _sampled_family("prime", functools.partial(_primes_near_members, value, count), None)


def squares_near(value: int = 2**32, *, count: int = 3) -> st.SearchStrategy[int]:
    """``p**2 - 1``, ``p**2`` and ``p**2 + 1`` for the ``count`` primes ``p`` on each side of ``sqrt(value)``.

    Near ``2**32`` and ``2**53`` these expose an integer square root computed
    through a double, and a missed square factor ``p**2``.  Shrinks to the
    smallest ``p**2 - 1``.
    """
    value = check_integer("value", value, minimum=0)
    count = check_integer("count", count, minimum=1, maximum=_MAX_COUNT)
    return _sampled_family("square", functools.partial(_squares_near_members, value, count), None)


def _sampled_family(description: str, members: Callable[[], tuple[int, ...]],
                    max_value: int | None) -> st.SearchStrategy[int]:
    """``sampled_from`` the members ``<= max_value``, built on the first draw."""

    def build() -> st.SearchStrategy[int]:
        everything = members()
        chosen = [n for n in everything if max_value is None or n <= max_value]
        if not chosen:
            smallest = f" (the smallest is {everything[0]})" if everything else ""
            raise InvalidStrategyArgument(
                f"max_value={max_value}: no {description} in this strategy's list "
                f"is <= max_value{smallest}")
        return st.sampled_from(chosen)

    return st.deferred(build)


@functools.lru_cache(maxsize=64)
def _strong_pseudoprime_members(bases: tuple[int, ...]) -> tuple[int, ...]:
    import gmpy2

    from .. import adversarial
    from ..exact.primality import is_prime

    prime_bases = all(is_prime(base) for base in bases)
    found = set()
    if prime_bases:
        found.update(adversarial.strong_pseudoprimes_below(_SEARCH_LIMIT, bases))
        found.update(adversarial.constructed_strong_pseudoprimes(bases, _CONSTRUCTED_COUNT))
    published = (adversarial.STRONG_PSEUDOPRIMES_BASE_2
                 + adversarial.STRONG_PSEUDOPRIMES_BASES_2_3_5_7
                 + adversarial.LEAST_STRONG_PSEUDOPRIMES_FIRST_PRIME_BASES
                 + adversarial.CARMICHAEL_NUMBERS)
    found.update(n for n in published
                 if all(math.gcd(n, base) == 1 and gmpy2.is_strong_prp(n, base) for base in bases)
                 and not is_prime(n))
    if not found:
        raise InvalidStrategyArgument(
            f"bases={bases}: no strong pseudoprime to all of these bases is known here "
            f"(the search below {_SEARCH_LIMIT} and the construction need prime bases, "
            f"and none of the published terms passes)")
    return tuple(sorted(found))


@functools.lru_cache(maxsize=None)
def _carmichael_members() -> tuple[int, ...]:
    from .. import adversarial

    found = set(adversarial.CARMICHAEL_NUMBERS) | set(adversarial.CHERNICK_CARMICHAEL_NUMBERS)
    found.update(adversarial.chernick_carmichael_numbers(3, start=_CHERNICK_NEAR_2_63))
    return tuple(sorted(found))


def _published(name: str) -> tuple[int, ...]:
    from .. import adversarial

    return tuple(sorted(getattr(adversarial, name)))


@functools.lru_cache(maxsize=64)
def _primes_near_members(value: int, count: int) -> tuple[int, ...]:
    from .. import adversarial

    return tuple(adversarial.primes_around(value, count))


@functools.lru_cache(maxsize=64)
def _squares_near_members(value: int, count: int) -> tuple[int, ...]:
    from .. import adversarial

    return tuple(sorted(set(adversarial.near_squares_around(value, count))))
