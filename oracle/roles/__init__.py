"""The roles a candidate can play, and what is checked for each.

>>> from oracle import roles
>>> roles.get("prime_pi").signature
'prime_pi(x) -> int: number of primes p <= x; 0 for x < 2'
>>> roles.infer("primepi")
'prime_pi'

One module per role (docs/DESIGN.md, "Candidate conventions"); :class:`Conventions`
holds what a target may declare differently (half-open ranges, factor shape,
behaviour on invalid input).
"""

from __future__ import annotations

from .._errors import InvalidInputError
from ._role import AbsurdAnswer, Conventions, Role, Verdict, WrongType
from . import (factor, is_prime, next_prime, nth_prime, prev_prime, prime_pi, primes_in,
               twin_pi)
from . import (mertens, prime_pi_mod, prime_sum, quadruplet_pi, squarefree_count,
               triplet_pi_026, triplet_pi_046)
from . import divisor_count, divisor_sum, mobius, totient

__all__ = ["AbsurdAnswer", "Conventions", "Role", "Verdict", "WrongType", "ROLES", "ALIASES", "get", "infer"]

#: Every role by name.
ROLES: dict[str, Role] = {module.ROLE.name: module.ROLE for module in (
    prime_pi, twin_pi, nth_prime, is_prime, next_prime, prev_prime, primes_in, factor)}
# The sums over n <= x of issue 15.
ROLES.update({module.ROLE.name: module.ROLE for module in (
    prime_sum, prime_pi_mod, mertens, squarefree_count, triplet_pi_026, triplet_pi_046,
    quadruplet_pi)})
ROLES.update({module.ROLE.name: module.ROLE for module in (
    mobius, totient, divisor_count, divisor_sum)})

#: The other names a function may have for its role to be inferred (README, "Role names"):
#: the role names written without underscores, and a few common spellings.  Nothing else is
#: guessed -- ``prime`` or ``primes`` could mean several roles -- so any other name needs --role.
ALIASES = {
    "primepi": "prime_pi", "count_primes": "prime_pi", "prime_count": "prime_pi",
    "twinpi": "twin_pi",
    "nthprime": "nth_prime",
    "isprime": "is_prime",
    "nextprime": "next_prime",
    "prevprime": "prev_prime", "previous_prime": "prev_prime",
    "primesin": "primes_in", "primerange": "primes_in",
    "factorint": "factor", "factorize": "factor", "factorise": "factor",
    "moebius": "mobius", "euler_phi": "totient", "num_divisors": "divisor_count",
    "divisors_count": "divisor_count", "divisor_sigma": "divisor_sum", "sum_of_divisors": "divisor_sum",
    "sum_primes": "prime_sum", "primesum": "prime_sum", "sum_of_primes": "prime_sum",
    "mertens_function": "mertens", "count_squarefree": "squarefree_count",
    "primepi_mod": "prime_pi_mod", "count_primes_mod": "prime_pi_mod",
}


def get(name: str) -> Role:
    """The role called ``name``."""
    if name not in ROLES:
        raise InvalidInputError(f"role={name!r}: expected one of {', '.join(ROLES)}")
    return ROLES[name]


def infer(function_name: str) -> str:
    """The role of a function named exactly like a role or one of :data:`ALIASES`.

    No other name is guessed (``my_prime_pi``, ``prime``, ``_small_primes`` are refused):
    a wrong guess would audit the function against the wrong mathematics.
    """
    if function_name in ROLES:
        return function_name
    if function_name in ALIASES:
        return ALIASES[function_name]
    raise InvalidInputError(
        f"cannot infer the role of {function_name!r}: only a role name or a listed alias is "
        f"recognised; pass --role, one of {', '.join(ROLES)}")
