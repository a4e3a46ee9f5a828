"""The roles a candidate can play, and what is checked for each.

>>> from oracle import roles
>>> roles.get("prime_pi").signature
'prime_pi(x) -> int: number of primes p <= x; 0 for x < 2'
>>> roles.infer("my_prime_pi")
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

__all__ = ["AbsurdAnswer", "Conventions", "Role", "Verdict", "WrongType", "ROLES", "get", "infer"]

#: Every role by name.
ROLES: dict[str, Role] = {module.ROLE.name: module.ROLE for module in (
    prime_pi, twin_pi, nth_prime, is_prime, next_prime, prev_prime, primes_in, factor)}
# The sums over n <= x of issue 15.
ROLES.update({module.ROLE.name: module.ROLE for module in (
    prime_sum, prime_pi_mod, mertens, squarefree_count, triplet_pi_026, triplet_pi_046,
    quadruplet_pi)})
ROLES.update({module.ROLE.name: module.ROLE for module in (
    mobius, totient, divisor_count, divisor_sum)})

# Other names real libraries give the same function (used only to infer a role).
_ALIASES = {
    "primepi": "prime_pi", "pi": "prime_pi", "count_primes": "prime_pi", "prime_count": "prime_pi",
    "twin_primes_count": "twin_pi", "count_twins": "twin_pi", "twinpi": "twin_pi",
    "prime": "nth_prime", "nthprime": "nth_prime",
    "isprime": "is_prime", "is_probable_prime": "is_prime", "primality": "is_prime",
    "nextprime": "next_prime", "prevprime": "prev_prime", "previous_prime": "prev_prime",
    "primes": "primes_in", "primerange": "primes_in", "primes_between": "primes_in",
    "sieve": "primes_in", "factorint": "factor", "factorize": "factor",
    "factorise": "factor", "factorization": "factor",
    "sum_primes": "prime_sum", "primesum": "prime_sum", "sum_of_primes": "prime_sum",
    "mertens_function": "mertens", "count_squarefree": "squarefree_count",
    "squarefree_pi": "squarefree_count", "primepi_mod": "prime_pi_mod",
    "primes_in_progression": "prime_pi_mod", "count_primes_mod": "prime_pi_mod",
    "moebius": "mobius", "mu": "mobius", "phi": "totient", "euler_phi": "totient",
    "divisors_count": "divisor_count", "num_divisors": "divisor_count", "tau": "divisor_count",
    "sigma": "divisor_sum", "divisor_sigma": "divisor_sum", "sum_of_divisors": "divisor_sum",
}


def get(name: str) -> Role:
    """The role called ``name``."""
    if name not in ROLES:
        raise InvalidInputError(f"role={name!r}: expected one of {', '.join(ROLES)}")
    return ROLES[name]


def infer(function_name: str) -> str:
    """The role a function name points to, when exactly one fits.

    The name matches a role if it equals the role or an alias, or ends with
    one after an underscore (``my_prime_pi``; the longest such ending decides);
    raises when none or several fit.
    """
    name = function_name.lower()
    names = {**{role: role for role in ROLES}, **_ALIASES}
    if name in names:
        return names[name]
    suffixes = [alias for alias in names if name.endswith("_" + alias)]
    longest = max((len(alias) for alias in suffixes), default=0)
    matches = {names[alias] for alias in suffixes if len(alias) == longest}
    if len(matches) == 1:
        return matches.pop()
    raise InvalidInputError(
        f"cannot infer the role of {function_name!r}"
        + (f" (it could be {', '.join(sorted(matches))})" if matches else "")
        + f"; pass --role, one of {', '.join(ROLES)}")
