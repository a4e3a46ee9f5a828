"""Hypothesis strategies for fuzzing number-theory code against the oracle.

>>> from hypothesis import given
>>> from oracle import strategies as nts
>>> @given(nts.primes(2, 10**12))
... def test_my_is_prime(p):
...     assert my_is_prime(p)

Numbers: :func:`primes`, :func:`composites` (in a range), :func:`prime_powers`,
:func:`balanced_semiprimes`, :func:`unbalanced_semiprimes`,
:func:`smooth_numbers`.  Adversarial families (deterministic lists, smallest
first): :func:`strong_pseudoprimes`, :func:`lucas_pseudoprimes`,
:func:`strong_lucas_pseudoprimes`, :func:`fibonacci_pseudoprimes`,
:func:`carmichael_numbers`, :func:`primes_near`, :func:`squares_near`.
Arguments for counting code: :func:`counting_points`, :func:`sieve_intervals`.
Settings: :func:`register_profiles` (``ntoracle-ci``, ``ntoracle-dev``).

Every strategy checks its arguments when built and raises
:class:`InvalidStrategyArgument` (a ``hypothesis.errors.InvalidArgument`` and
an :class:`oracle.InvalidInputError`).  Importing this module imports neither
numpy nor gmpy2; the oracle's mathematics loads on the first draw.

Cautions: above about ``3.2 * 10**23`` "prime" means a Baillie--PSW
*probable* prime, not a proven one; code that passes on these examples has
evidence in its favour, not a certificate; for cryptographic use defer to
the published standards and a vetted library.
"""

from ._families import (carmichael_numbers, fibonacci_pseudoprimes, lucas_pseudoprimes,
                        primes_near, squares_near, strong_lucas_pseudoprimes,
                        strong_pseudoprimes)
from ._points import counting_points, sieve_intervals
from ._primes import composites, prime_powers, primes
from ._profiles import CI_PROFILE, DEV_PROFILE, register_profiles
from ._semiprimes import balanced_semiprimes, unbalanced_semiprimes
from ._smooth import smooth_numbers
from ._validation import InvalidStrategyArgument

__all__ = [
    "InvalidStrategyArgument",
    "primes",
    "composites",
    "prime_powers",
    "balanced_semiprimes",
    "unbalanced_semiprimes",
    "smooth_numbers",
    "strong_pseudoprimes",
    "lucas_pseudoprimes",
    "strong_lucas_pseudoprimes",
    "fibonacci_pseudoprimes",
    "carmichael_numbers",
    "primes_near",
    "squares_near",
    "counting_points",
    "sieve_intervals",
    "CI_PROFILE",
    "DEV_PROFILE",
    "register_profiles",
]

register_profiles()
