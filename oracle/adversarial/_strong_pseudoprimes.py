"""Strong pseudoprimes: odd composites that pass the Miller--Rabin test to given bases.

Write ``n - 1 = d * 2**s`` with ``d`` odd.  A composite ``n`` is a *strong
pseudoprime to base a* when ``a**d = 1 (mod n)`` or ``a**(d * 2**r) = -1
(mod n)`` for some ``0 <= r < s`` (Pomerance, Selfridge and Wagstaff 1980,
Math. Comp. 35).  They are the inputs on which a Miller--Rabin routine with a
fixed, too small base set answers "prime" for a composite.

Three sources here:

* published tables (each constant names its OEIS entry);
* :func:`strong_pseudoprimes_below` -- exhaustive search with the defining test;
* :func:`constructed_strong_pseudoprimes` -- large ones built for any chosen
  set of prime bases, by the method of F. Arnault (1995, "Constructing
  Carmichael numbers which are strong pseudoprimes to several bases",
  J. Symbolic Comput. 20), in the three-factor form
  ``n = p1 * p2 * p3`` with ``p_i = k_i (p1 - 1) + 1`` and ``k1 = 1``.

The construction rests on Euler's criterion.  If every ``p_i`` is a prime
``= 3 (mod 4)`` with Legendre symbol ``(a/p_i) = -1``, and ``p_i - 1`` divides
``n - 1``, then ``n = 3 (mod 4)``, ``d = (n - 1)/2`` is odd and ``d / ((p_i -
1)/2)`` is odd, so ``a**d = (a**((p_i - 1)/2))**odd = -1 (mod p_i)`` for each
``i``, hence ``a**d = -1 (mod n)``: ``n`` passes the strong test to base
``a``.  The symbol ``(a/p)`` depends only on ``p mod 4a`` (quadratic
reciprocity), so the conditions are congruences on ``p1``; ``p_i - 1 | n - 1``
reduces to ``k2 | 1 + k3 p1`` and ``k3 | 1 + k2 p1``.
"""

from __future__ import annotations

import math

from collections.abc import Sequence

import gmpy2

from .._errors import InvalidInputError
from .._integers import require_int
from ..exact.primality import is_prime, next_prime

__all__ = [
    "STRONG_PSEUDOPRIMES_BASE_2",
    "LEAST_STRONG_PSEUDOPRIMES_FIRST_PRIME_BASES",
    "STRONG_PSEUDOPRIMES_BASES_2_3_5_7",
    "strong_pseudoprimes_below",
    "WIEFERICH_PRIMES",
    "constructed_strong_pseudoprimes",
    "DETERMINISTIC_BASE_SETS",
    "LEAST_STRONG_PSEUDOPRIMES_OF_BASE_SETS",
    "base_divisor_primes",
    "STRONG_PSEUDOPRIMES_WITHOUT_SMALL_FACTORS",
]

#: OEIS A001262, strong pseudoprimes to base 2: every term below 2 * 10**6 (73 terms; the
#: first 12 from memory, all of them re-derived by exhaustive search in the tests).  Among them
#: 1194649 = 1093**2, a square: p**2 is a base-2 pseudoprime exactly when p is a Wieferich
#: prime (OEIS A001220: 1093 and 3511 are the only ones known; from memory).
STRONG_PSEUDOPRIMES_BASE_2 = (2047, 3277, 4033, 4681, 8321, 15841, 29341, 42799, 49141,
                              52633, 65281, 74665, 80581, 85489, 88357, 90751, 104653,
                              130561, 196093, 220729, 233017, 252601, 253241, 256999,
                              271951, 280601, 314821, 357761, 390937, 458989, 476971,
                              486737, 489997, 514447, 580337, 635401, 647089, 741751,
                              800605, 818201, 838861, 873181, 877099, 916327, 976873,
                              983401, 1004653, 1016801, 1023121, 1082401, 1145257,
                              1194649, 1207361, 1251949, 1252697, 1302451, 1325843,
                              1357441, 1373653, 1397419, 1441091, 1493857, 1507963,
                              1509709, 1530787, 1678541, 1730977, 1811573, 1876393,
                              1907851, 1909001, 1969417, 1987021)

#: OEIS A001220, the Wieferich primes known (2**(p-1) = 1 mod p**2); their squares are
#: strong pseudoprimes to base 2 that a Lucas-type test without a square check mishandles.
WIEFERICH_PRIMES = (1093, 3511)

#: OEIS A014233, the least odd composite that is a strong pseudoprime to all
#: of the first k prime bases, k = 1..13 (k = 12, 13: Sorenson and Webster
#: 2017, Math. Comp. 86).
LEAST_STRONG_PSEUDOPRIMES_FIRST_PRIME_BASES = (
    2047, 1373653, 25326001, 3215031751, 2152302898747, 3474749660383,
    341550071728321, 341550071728321, 3825123056546413051,
    3825123056546413051, 3825123056546413051, 318665857834031151167461,
    3317044064679887385961981)

#: OEIS A074773, strong pseudoprimes to bases 2, 3, 5 and 7, first 12 terms
#: (as quoted in public test code; each is re-verified by the strong test in
#: the tests, but completeness between the terms is not re-searched).
STRONG_PSEUDOPRIMES_BASES_2_3_5_7 = (
    3215031751, 118670087467, 307768373641, 315962312077, 354864744877,
    457453568161, 528929554561, 546348519181, 602248359169, 1362242655901,
    1871186716981, 2152302898747)

#: Miller--Rabin base sets published as deterministic below a bound, and copied into many
#: libraries (all from memory): (31, 73), (2, 7, 61) and (2, 13, 23, 1662803) from G. Jaeschke
#: (1993, "On strong pseudoprimes to several bases", Math. Comp. 61); (2, 3, 7, 61, 24251)
#: below 10**16 apart from one exception (Jaeschke's bound as quoted on the Prime Pages); the
#: sets of at most seven large bases found by hashing-free searches (J. Sinclair, S. Worley
#: and others, 2010-2011) for n < 341531, < 1050535501, < 350269456337, < 55245642489451,
#: < 7999252175582851, < 585226005592931977 and < 2**64.  A base a with n | a gives
#: a**d = 0 (mod n), so a routine that does not skip such a base calls the prime n composite:
#: :func:`base_divisor_primes` lists those primes.
DETERMINISTIC_BASE_SETS = (
    ((31, 73), 9080191),
    ((2, 7, 61), 4759123141),
    ((2, 13, 23, 1662803), 1122004669633),
    ((2, 3, 7, 61, 24251), 10**16),
    ((9345883071009581737,), 341531),
    ((336781006125, 9639812373923155), 1050535501),
    ((4230279247111683200, 14694767155120705706, 16641139526367750375), 350269456337),
    ((2, 141889084524735, 1199124725622454117, 11096072698276303650), 55245642489451),
    ((2, 4130806001517, 149795463772692060, 186635894390467037, 3967304179347715805),
     7999252175582851),
    ((2, 123635709730000, 9233062284813009, 43835965440333360, 761179012939631437,
      1263739024124850375), 585226005592931977),
    ((2, 325, 9375, 28178, 450775, 9780504, 1795265022), 2**64),
)

#: The least strong pseudoprime to every base of a set of :data:`DETERMINISTIC_BASE_SETS`
#: (from memory, the sources above): the first input on which the set, used beyond its
#: bound, calls a composite prime.  The tests re-check the defining property and the
#: factorisation, and re-derive the least one for (31, 73) by exhaustive search.
LEAST_STRONG_PSEUDOPRIMES_OF_BASE_SETS = {
    (31, 73): 9080191,                     # 2131 * 4261
    (2, 7, 61): 4759123141,                # 48781 * 97561
    (2, 13, 23, 1662803): 1122004669633,   # 611557 * 1834669
    (2, 3, 7, 61, 24251): 46856248255981,  # 4840261 * 9680521
}


#: The least strong pseudoprime to the first k prime bases with no prime factor below L, where
#: it differs from A014233(k) and from the terms of the tables above (found by exhaustive
#: search with gmpy2's strong test, re-derived in the tests): a routine that trial-divides
#: below L before its Miller--Rabin rounds first errs there.  For bases (2, 3): 1373653 =
#: 829 * 1657 is the least overall, 2284453 = 1069 * 2137 the least without a factor below
#: 1000 (common practice: a table of the primes below 1000).  The other k up to 5 have it in
#: the tables already (42799 and 1093**2 for base 2, 25326001 for 2, 3, 5, 3215031751 and
#: 118670087467 for 2, 3, 5, 7, 2152302898747 for the first five primes).
STRONG_PSEUDOPRIMES_WITHOUT_SMALL_FACTORS = {((2, 3), 1000): 2284453}


def base_divisor_primes() -> list[int]:
    """The primes dividing some base of :data:`DETERMINISTIC_BASE_SETS` (a prime base
    itself included), ascending; the factorisations are computed here, not stored."""
    from ..exact.factorisation import factorise

    found = set()
    for bases, _bound in DETERMINISTIC_BASE_SETS:
        for base in bases:
            found.update(factorise(base, 10.0)[0])
    return sorted(found)


#: The exhaustive search refuses limits above this (a Python loop).
_SEARCH_LIMIT = 10**8


def strong_pseudoprimes_below(limit: int, bases: Sequence[int] = (2,)) -> list[int]:
    """All odd composites ``n < limit`` that are strong pseudoprimes to every base.

    Exhaustive search with the defining test; ``limit <= 10**8``.  A number
    sharing a factor with a base is a pseudoprime to no such base and is
    skipped.
    """
    limit = require_int("limit", limit, minimum=0, maximum=_SEARCH_LIMIT)
    bases = _validated_bases(bases)
    found = []
    for n in range(9, limit, 2):
        if any(math.gcd(n, base) != 1 for base in bases):
            continue
        if all(gmpy2.is_strong_prp(n, base) for base in bases) and not is_prime(n):
            found.append(n)
    return found


def constructed_strong_pseudoprimes(bases: Sequence[int], count: int,
                                    multipliers: tuple[int, int] | None = None) -> list[int]:
    """``count`` composites ``p1 p2 p3`` that are strong pseudoprimes to every prime base.

    Arnault's construction (see the module docstring), ascending in ``p1``.
    ``multipliers`` is ``(k2, k3)``, two distinct odd primes not among the
    bases; by default the first pair of primes above the largest base for
    which every base has an admissible residue class.  Each result is checked
    with the strong test before it is returned.  The factors are Baillie--PSW
    probable primes when they exceed ``primality.DETERMINISTIC_LIMIT``.
    """
    bases = _validated_bases(bases)
    count = require_int("count", count, minimum=0, maximum=1000)
    if any(not is_prime(base) for base in bases):
        raise InvalidInputError(f"bases={bases}: the construction needs prime bases")
    if multipliers is None:
        k2, k3, residues = _first_admissible_multipliers(bases)
    else:
        k2, k3 = (require_int("multipliers[0]", multipliers[0], minimum=3),
                  require_int("multipliers[1]", multipliers[1], minimum=3))
        if k2 == k3 or not (is_prime(k2) and is_prime(k3)) or k2 in bases or k3 in bases:
            raise InvalidInputError(
                f"multipliers={multipliers}: need two distinct odd primes not among the bases")
        residues = _admissible_residues(bases, (1, k2, k3))
        if residues is None:
            raise InvalidInputError(
                f"multipliers={multipliers}: some base has no admissible residue class")
    congruences = residues + [(-pow(k3, -1, k2) % k2, k2), (-pow(k2, -1, k3) % k3, k3)]
    residue, modulus = _chinese_remainder(congruences)
    found = []
    p1 = residue
    while len(found) < count:
        p2, p3 = k2 * (p1 - 1) + 1, k3 * (p1 - 1) + 1
        if p1 > max(bases) and is_prime(p1) and is_prime(p2) and is_prime(p3):
            n = p1 * p2 * p3
            if not all(gmpy2.is_strong_prp(n, base) for base in bases):
                raise AssertionError(f"construction failed for bases {bases}: {p1}, {p2}, {p3}")
            found.append(n)
        p1 += modulus
    return found


def _validated_bases(bases: Sequence[int]) -> tuple[int, ...]:
    checked = tuple(require_int(f"bases[{index}]", base, minimum=2)
                    for index, base in enumerate(bases))
    if not checked:
        raise InvalidInputError("bases=(): give at least one base")
    return checked


def _symbol_modulus(base: int) -> int:
    """A period of ``p -> (base/p)`` over odd primes: 8 for base 2, ``4 * base`` otherwise."""
    return 8 if base == 2 else 4 * base


def _admissible_residues(bases: tuple[int, ...],
                         multipliers: tuple[int, ...]) -> list[tuple[int, int]] | None:
    """For each base, the least class ``r mod 4a`` making every ``k(r-1)+1`` a non-residue.

    ``r`` and each ``k(r - 1) + 1`` must be ``3 (mod 4)``, coprime to the base,
    with Jacobi symbol ``(a / (k(r - 1) + 1)) = -1``.  ``None`` when some base
    has no such class.
    """
    classes = []
    for base in bases:
        modulus = _symbol_modulus(base)
        for r in range(3, modulus, 4):
            values = [(k * (r - 1) + 1) % modulus for k in multipliers]
            if all(value % 4 == 3 and gmpy2.gcd(value, base) == 1
                   and gmpy2.jacobi(base, value) == -1 for value in values):
                classes.append((r, modulus))
                break
        else:
            return None
    return classes


def _first_admissible_multipliers(bases: tuple[int, ...]) -> tuple[int, int, list[tuple[int, int]]]:
    """The first pair of primes ``k2 < k3`` above the bases with admissible classes."""
    k2 = next_prime(max(bases))
    while True:
        k3 = next_prime(k2)
        for _ in range(50):
            residues = _admissible_residues(bases, (1, k2, k3))
            if residues is not None:
                return k2, k3, residues
            k3 = next_prime(k3)
        k2 = next_prime(k2)


def _chinese_remainder(congruences: list[tuple[int, int]]) -> tuple[int, int]:
    """Solve ``x = r_i (mod m_i)`` for moduli not necessarily coprime; ``(x, lcm)``."""
    residue, modulus = 0, 1
    for r, m in congruences:
        common = gmpy2.gcd(modulus, m)
        if (r - residue) % common:
            raise AssertionError(f"incompatible congruences {residue} mod {modulus}, {r} mod {m}")
        step = modulus // common
        lift = (r - residue) // common * pow(step, -1, m // common) % (m // common)
        residue += modulus * lift
        modulus = step * m
        residue %= modulus
    return int(residue), int(modulus)
