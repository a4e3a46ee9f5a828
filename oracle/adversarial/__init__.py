"""Adversarial inputs: number families on which real number-theory code goes wrong.

Each family lives in its own private module and is built from its defining
mathematics (the tests re-check every family by that definition and against
published OEIS terms):

* strong pseudoprimes to chosen bases, published and constructed (Arnault 1995);
* Carmichael numbers, published and Chernick's (6k+1)(12k+1)(18k+1);
* Lucas, strong Lucas and Fibonacci pseudoprimes;
* primes, prime squares and cubes near word-size boundaries, float square-root traps;
* semiprimes: close (Fermat-factorable), balanced and unbalanced;
* B-smooth numbers;
* twin prime pairs around powers of two;
* primes with Pocklington certificates, and products with proven factorisations;
* numbers built from a chosen factorisation, registered for the oracle (constructed truth).

All generators are plain functions returning lists of Python ints (or
certificates), deterministic given their arguments; randomness comes only
from a ``random.Random`` passed in.  Caution: a pseudoprime list shows that a
test *can* be fooled; passing on these inputs is evidence, not a proof of
correctness.
"""

from ._carmichael import (CARMICHAEL_NUMBERS, CHERNICK_CARMICHAEL_NUMBERS,
                          carmichael_numbers_below, chernick_carmichael_numbers)
from ._constructed import ConstructedNumber, construct, known, register
from ._certified import (PrimeCertificate, certified_prime, certified_primes,
                         certified_product, verify_certificate)
from ._lucas_pseudoprimes import (FIBONACCI_PSEUDOPRIMES, LUCAS_PSEUDOPRIMES, PERRIN_PSEUDOPRIMES,
                                  STRONG_LUCAS_PSEUDOPRIMES, fibonacci_pseudoprimes_below,
                                  lucas_pseudoprimes_below, strong_lucas_pseudoprimes_below)
from ._near_powers import (WORD_BOUNDARIES, float_square_root_traps, near_squares_around,
                           prime_cubes_around, prime_squares_around, primes_around)
from ._semiprimes import balanced_semiprimes, close_prime_products, unbalanced_semiprimes
from ._smooth import smooth_numbers_between, smooth_numbers_up_to
from ._strong_pseudoprimes import (LEAST_STRONG_PSEUDOPRIMES_FIRST_PRIME_BASES,
                                   STRONG_PSEUDOPRIMES_BASE_2, WIEFERICH_PRIMES,
                                   STRONG_PSEUDOPRIMES_BASES_2_3_5_7,
                                   constructed_strong_pseudoprimes, strong_pseudoprimes_below,
                                   DETERMINISTIC_BASE_SETS, LEAST_STRONG_PSEUDOPRIMES_OF_BASE_SETS,
                                   base_divisor_primes, STRONG_PSEUDOPRIMES_WITHOUT_SMALL_FACTORS)
from ._twins import twin_boundary_points, twin_pairs_around_power_of_two

__all__ = [
    "CARMICHAEL_NUMBERS",
    "CHERNICK_CARMICHAEL_NUMBERS",
    "carmichael_numbers_below",
    "chernick_carmichael_numbers",
    "PrimeCertificate",
    "ConstructedNumber",
    "construct",
    "known",
    "register",
    "certified_prime",
    "certified_primes",
    "certified_product",
    "verify_certificate",
    "FIBONACCI_PSEUDOPRIMES",
    "PERRIN_PSEUDOPRIMES",
    "LUCAS_PSEUDOPRIMES",
    "STRONG_LUCAS_PSEUDOPRIMES",
    "fibonacci_pseudoprimes_below",
    "lucas_pseudoprimes_below",
    "strong_lucas_pseudoprimes_below",
    "WORD_BOUNDARIES",
    "float_square_root_traps",
    "near_squares_around",
    "prime_cubes_around",
    "prime_squares_around",
    "primes_around",
    "balanced_semiprimes",
    "close_prime_products",
    "unbalanced_semiprimes",
    "smooth_numbers_between",
    "smooth_numbers_up_to",
    "LEAST_STRONG_PSEUDOPRIMES_FIRST_PRIME_BASES",
    "STRONG_PSEUDOPRIMES_BASE_2",
    "WIEFERICH_PRIMES",
    "STRONG_PSEUDOPRIMES_BASES_2_3_5_7",
    "constructed_strong_pseudoprimes",
    "DETERMINISTIC_BASE_SETS",
    "LEAST_STRONG_PSEUDOPRIMES_OF_BASE_SETS",
    "base_divisor_primes",
    "STRONG_PSEUDOPRIMES_WITHOUT_SMALL_FACTORS",
    "strong_pseudoprimes_below",
    "twin_boundary_points",
    "twin_pairs_around_power_of_two",
]
