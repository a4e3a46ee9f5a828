"""Families of integers on which number-theory code tends to fail.

Each family is a function ``(ceiling, profile, rng) -> list[int]`` returning
integers ≥ 0 (callers cut them to the role's domain).  The boundaries are the
usual suspects (common practice): powers of two and ten ± small, primes and
their neighbours, prime squares ± 1 where a float square root goes wrong
(near 2¹⁶·², 2²⁶·⁵·², 2³²·²), multiples of segment sizes 2¹⁵…2²⁰ ± small,
twin pairs straddling powers of two, and both ends of record prime gaps
(OEIS A002386 / A005250, from :mod:`oracle.tables`).

Further families, each with its rationale beside it: answers that cross a word
size (``answer-words``), prime powers and their neighbours (``prime-powers``),
neighbourhoods of published pseudoprimes (``pseudoprime-neighbours``), starts
of the bound catalogue's ranges (``bound-starts``), sieve seams at primes
(``sieve-seams``), Mersenne and Fermat numbers (``mersenne-fermat``),
factorisation shapes by factor size (``factor-shapes``), products of the
primes next to common trial-division limits (``trial-bounds``) and numbers
built from certified primes, whose factorisation the oracle then knows at any
size (``constructed``).
"""

from __future__ import annotations

import functools
import math
import random

from .. import adversarial, tables
from .._errors import OracleError

OFFSETS = (-2, -1, 0, 1, 2)
SEGMENT_EXPONENTS = (15, 16, 17, 18, 19, 20)


def _below(values, ceiling: int) -> list[int]:
    return sorted({int(v) for v in values if 0 <= v <= ceiling})


def exhaustive(ceiling, profile, rng) -> list[int]:
    return list(range(0, min(profile.exhaustive, ceiling) + 1))


def boundaries(ceiling, profile, rng) -> list[int]:
    found = set()
    for k in profile.boundary_exponents:
        found.update(2**k + d for d in OFFSETS)
    for k in range(1, 40):
        found.update(10**k + d for d in OFFSETS)
    return _below(found, ceiling)


def primes(ceiling, profile, rng) -> list[int]:
    """Primes p around each boundary, with p − 1 and p + 1."""
    found = set()
    centres = [2**k for k in profile.boundary_exponents] + [10**k for k in range(1, 20)]
    for centre in centres:
        if centre > ceiling:
            continue
        for p in adversarial.primes_around(centre, 2):
            found.update((p - 1, p, p + 1))
    return _below(found, ceiling)


def squares(ceiling, profile, rng) -> list[int]:
    """p² − 1, p², p² + 1 for primes p near 2¹⁶, 2^26.5, 2³², and float square-root traps."""
    found = set()
    for target in (2**16, 2**32, 2**53, 2**64, 2**106):
        if target <= ceiling * 2:
            found.update(adversarial.near_squares_around(target, 2))
    for target in (2**32, 2**63):
        found.update(adversarial.prime_cubes_around(target, 1))
    found.update(adversarial.float_square_root_traps(4))
    return _below(found, ceiling)


def segments(ceiling, profile, rng) -> list[int]:
    found = set()
    for k in SEGMENT_EXPONENTS:
        for multiple in (1, 2, 3, 5):
            found.update(multiple * 2**k + d for d in (-1, 0, 1))
    return _below(found, ceiling)


def gaps(ceiling, profile, rng) -> list[int]:
    """Both ends of each record prime gap (p, p + g), with their neighbours."""
    found = set()
    for p, (gap, _source) in tables.values("prime_gap_record").items():
        found.update((p - 1, p, p + 1, p + gap - 1, p + gap, p + gap + 1))
    return _below(found, ceiling)


def twins(ceiling, profile, rng) -> list[int]:
    exponents = tuple(k for k in profile.boundary_exponents if 3 <= k and 2**k <= ceiling)
    found = set(adversarial.twin_boundary_points(exponents)) if exponents else set()
    found.update(x for p in (3, 5, 11, 17, 29, 41) for x in (p + 1, p + 2, p + 3))
    return _below(found, ceiling)


def pseudoprimes(ceiling, profile, rng) -> list[int]:
    found = set(adversarial.STRONG_PSEUDOPRIMES_BASE_2)
    found.update(p * p for p in adversarial.WIEFERICH_PRIMES)
    found.update(adversarial.STRONG_PSEUDOPRIMES_BASES_2_3_5_7)
    found.update(adversarial.LEAST_STRONG_PSEUDOPRIMES_FIRST_PRIME_BASES)
    found.update(adversarial.LUCAS_PSEUDOPRIMES)
    found.update(adversarial.STRONG_LUCAS_PSEUDOPRIMES)
    found.update(adversarial.FIBONACCI_PSEUDOPRIMES)
    found.update(adversarial.PERRIN_PSEUDOPRIMES)
    # the first composite each published deterministic base set lets through beyond its bound
    found.update(adversarial.LEAST_STRONG_PSEUDOPRIMES_OF_BASE_SETS.values())
    # ... and the first one a routine trial-dividing below 1000 beforehand lets through
    found.update(adversarial.STRONG_PSEUDOPRIMES_WITHOUT_SMALL_FACTORS.values())
    found.update(adversarial.constructed_strong_pseudoprimes((2, 3, 5, 7, 11, 13, 17, 19, 23, 29, 31, 37), 1))
    return _below(found, ceiling)


#: k for which a Miller–Rabin routine to "the first k primes" is built against: a fixed set
#: of the first 12 ... 50 prime bases, used at every size, is common practice (Maple's isprime
#: fell to Arnault's number for the primes below 100, i.e. k = 25: F. Arnault 1995).
FIRST_PRIME_BASE_COUNTS = (12, 13, 16, 20, 25, 32, 40, 50)


@functools.lru_cache(maxsize=1)
def _first_prime_bases_pseudoprimes() -> tuple[int, ...]:
    """One strong pseudoprime to the first k prime bases for each k of
    :data:`FIRST_PRIME_BASE_COUNTS`, by Arnault's construction
    (:func:`oracle.adversarial.constructed_strong_pseudoprimes`): about 200 bits for
    k = 12, 1000 bits for k = 50 -- above the sampled ceilings, so the climb by bit size
    asks them (:mod:`oracle.engine._reach_bits`); about 1 s to build, once per process."""
    from ..exact.primality import next_prime

    bases = [2]
    while len(bases) < max(FIRST_PRIME_BASE_COUNTS):
        bases.append(next_prime(bases[-1]))
    return tuple(adversarial.constructed_strong_pseudoprimes(tuple(bases[:k]), 1)[0]
                 for k in FIRST_PRIME_BASE_COUNTS)


def first_prime_bases(ceiling, profile, rng) -> list[int]:
    """The pseudoprimes of :func:`_first_prime_bases_pseudoprimes` up to the ceiling (none
    below 2^200: the climb by bit size asks them, for the primality roles only -- a
    factoriser needs tens of seconds for three primes of 70 bits and more, so for ``factor``
    they would measure its speed, not its correctness)."""
    return _below(_first_prime_bases_pseudoprimes(), ceiling)


def base_divisors(ceiling, profile, rng) -> list[int]:
    """p − 2 ... p + 2 for every prime p dividing a base of a published deterministic
    Miller–Rabin base set (:data:`oracle.adversarial.DETERMINISTIC_BASE_SETS`, e.g. 407521
    and 299210837 divide bases of the seven-base set for n < 2^64): at n = p the base is
    0 (mod n), a^d ≡ 0, and a routine that does not skip such a base calls the prime p
    composite (common practice: the published sets come with that proviso)."""
    return _below((p + d for p in adversarial.base_divisor_primes() for d in OFFSETS), ceiling)


def carmichael(ceiling, profile, rng) -> list[int]:
    found = set(adversarial.CARMICHAEL_NUMBERS) | set(adversarial.CHERNICK_CARMICHAEL_NUMBERS)
    found.update(adversarial.chernick_carmichael_numbers(3, start=100))
    return _below(found, ceiling)


def semiprimes(ceiling, profile, rng) -> list[int]:
    found = set()
    for bits in (20, 32, 40, 48, 62, 64):
        if 2**(bits - 1) <= ceiling:
            found.update(adversarial.balanced_semiprimes(bits, 2, rng))
            found.update(adversarial.close_prime_products(bits, 1, rng))
            found.update(adversarial.unbalanced_semiprimes(8, bits, 1, rng))
    return _below(found, ceiling)


def smooth(ceiling, profile, rng) -> list[int]:
    found = set(adversarial.smooth_numbers_between(2**40, 2**40 + 3000, 50)[:10])
    found.update(adversarial.smooth_numbers_between(2**62, 2**62 + 3000, 1000)[:10])
    return _below(found, ceiling)


def certified(ceiling, profile, rng) -> list[int]:
    found = set()
    for bits in (33, 64, 65, 96, 127):
        if 2**(bits - 1) <= ceiling:
            found.update(certificate.n for certificate in adversarial.certified_primes(bits, 2, rng))
            if 2 * bits <= ceiling.bit_length():
                found.add(adversarial.certified_product((bits, bits), rng)[0])
    return _below(found, ceiling)


def tables_points(function: str):
    def points(ceiling, profile, rng) -> list[int]:
        try:
            known = tables.values(function)
        except OracleError:
            return []
        return _below((x + d for x in known for d in (-1, 0, 1)), ceiling)
    return points


def prime_indices(ceiling, profile, rng) -> list[int]:
    """Indices n with p_n on either side of 2^k and 10^k: n = π(2^k) + {0, 1, 2}."""
    found = set()
    for x, (count, _source) in tables.values("pi").items():
        found.update((count - 1, count, count + 1, count + 2))
    return _below(found, ceiling)


#: p_N for N = 2^k, k = 1..40 (the oracle's nth_prime: sieve up to k = 27, the
#: Deleglise-Rivat count above; tests compare next_prime(p_N) with OEIS A051439,
#: prime(2^k + 1), up to k = 27 and every value with primecountpy, a test-only reference).
#: p_N for N = 2^53 and 2^63 (about 3.4e17 and 4.3e20) is beyond the oracle's reach.
PRIME_AT_POWER_OF_TWO = {
    1: 3, 2: 7, 3: 19, 4: 53, 5: 131, 6: 311, 7: 719, 8: 1619, 9: 3671, 10: 8161, 11: 17863,
    12: 38873, 13: 84017, 14: 180503, 15: 386093, 16: 821641, 17: 1742537, 18: 3681131,
    19: 7754077, 20: 16290047, 21: 34136029, 22: 71378569, 23: 148948139, 24: 310248241,
    25: 645155197, 26: 1339484197, 27: 2777105129, 28: 5750079047, 29: 11891268401,
    30: 24563311309, 31: 50685770167, 32: 104484802057, 33: 215187847711, 34: 442795487221,
    35: 910399916939, 36: 1870358526653, 37: 3839726846311, 38: 7877263558621,
    39: 16149760533341, 40: 33089240375501,
}
#: Word sizes an answer (a count) can overflow (common practice: int16/uint16, int32/uint32,
#: the 53-bit double mantissa, int64).
ANSWER_WORDS = (15, 16, 31, 32, 53, 63)


def answer_words(ceiling, profile, rng) -> list[int]:
    """x = p_N − 1 and x = p_N for N = 2^k: π(x) steps from 2^k − 1 to 2^k, where a count
    kept in a k-bit word wraps (for every k the oracle reaches, not only the word sizes)."""
    found = set()
    for p in PRIME_AT_POWER_OF_TWO.values():
        found.update((p - 1, p, p + 1))
    return _below(found, ceiling)


#: Twin counts: x = q − 1, q, where q is the larger member of the 2^k-th twin pair, up to here.
_TWIN_WORD_LIMIT = 2**24


@functools.lru_cache(maxsize=1)
def _twin_word_points() -> tuple[int, ...]:
    from .. import facade

    listed = facade.primes(0, _TWIN_WORD_LIMIT)
    uppers = [q for p, q in zip(listed, listed[1:]) if q - p == 2]
    found = []
    for k in range(1, 40):
        if 2**k <= len(uppers):
            q = uppers[2**k - 1]
            found.extend((q - 1, q, q + 1))
    return tuple(found)


def twin_answer_words(ceiling, profile, rng) -> list[int]:
    """x where π₂(x) steps from 2^k − 1 to 2^k (k ≤ 16 lies below 2^24; beyond, not reached)."""
    return _below(_twin_word_points(), ceiling)


#: The least prime p with p₁ + ... + p ≥ 2^w, for the word sizes w where a sum of primes kept
#: in a machine word or a double goes wrong (computed with the oracle's sieve, and for w = 63,
#: 64 with its combinatorial sum near p and its sieve up to p; tests compare with sympy up to
#: w = 32 and with primesieve for w = 53, 63, 64).  Above the sampled ceilings the climb asks
#: them (:mod:`oracle.engine._reach`).
PRIME_SUM_WORDS = {15: 631, 16: 929, 31: 225287, 32: 323381, 53: 595600673,
                   63: 20706267151, 64: 29505444491}
#: The least x with Q(x) ≥ 2^w (Q the squarefree count; the x is itself squarefree), where a
#: squarefree count kept in an int32 or uint32 wraps (computed by bisection on the oracle's
#: Möbius identity; tests compare with the identity over sympy's μ).
SQUAREFREE_WORDS = {31: 3532469249, 32: 7064938121}
#: Word sizes of the intermediate products of :func:`intermediate_words`.
PRODUCT_WORDS = (63, 64)


def _least_at_least(f, bound: int) -> int:
    """The least x ≥ 1 with f(x) ≥ bound, for a non-decreasing f (by bisection)."""
    low, high = 1, 1
    while f(high) < bound:
        high *= 2
    while low < high:
        middle = (low + high) // 2
        low, high = (low, middle) if f(middle) >= bound else (middle + 1, high)
    return low


def intermediate_words() -> list[int]:
    """The least x where x·x and x·(x + 1)/2 reach 2⁶³ and 2⁶⁴ (3037000500, 4294967296 and
    6074001000): a sum up to x that forms x², or the sum 1 + ... + x = x(x + 1)/2 that
    Legendre- and Lucy-type methods start from, in a signed or unsigned 64-bit word goes
    wrong from there on, although the answer itself fits the word (common practice)."""
    found = set()
    for w in PRODUCT_WORDS:
        found.add(_least_at_least(lambda x: x * x, 2**w))
        found.add(_least_at_least(lambda x: x * (x + 1) // 2, 2**w))
    return sorted(found)


def product_words(ceiling, profile, rng) -> list[int]:
    """x − 1, x, x + 1 for the x of :func:`intermediate_words` (those above the ceiling are
    the climb's, :mod:`oracle.engine._reach`)."""
    return _below((x + d for x in intermediate_words() for d in (-1, 0, 1)), ceiling)


def sum_words(ceiling, profile, rng) -> list[int]:
    """x = p − 1, p, p + 1 for the primes p of :data:`PRIME_SUM_WORDS`: the sum of the
    primes up to x crosses 2^w there (int16, uint16, int32, uint32, the double's 53 bits)."""
    return _below((p + d for p in PRIME_SUM_WORDS.values() for d in (-1, 0, 1)), ceiling)


def square_steps(ceiling, profile, rng) -> list[int]:
    """d² − 1 and d² for d = B − 1, ..., B + 3 around every power B of two and of ten: at
    x = d² the term μ(d)·⌊x/d²⌋ of Q(x) = Σ μ(d)·⌊x/d²⌋ first counts, so a squarefree count
    whose table of μ or whose loop over d stops at a round B goes wrong there (common
    practice: tables sized at round numbers; a float square root that rounds down)."""
    found = set()
    bases = {2**k for k in range(2, 33)} | {10**k for k in range(1, 10)}
    for base in bases:
        for d in range(base - 1, base + 4):
            found.update((d * d - 1, d * d))
    return _below(found, ceiling)


def prime_powers(ceiling, profile, rng) -> list[int]:
    """p^e and p^e ± 1, ± 2 for e = 2..5, p the primes nearest 2^(j/e) for every boundary
    exponent j of the profile, and every power of 2, 3, 5, 7 (common practice: x = p³ breaks a float cube
    root in Meissel-type counters, p^e breaks perfect-power tests and trial division that
    stops after one division by p)."""
    found = set()
    for e in range(2, 6):
        for j in profile.boundary_exponents:
            root = _integer_root(2**j, e)
            if root >= 2 and root**e <= ceiling + 2:
                for p in adversarial.primes_around(root, 1):
                    found.update(p**e + d for d in OFFSETS)
    for p in (2, 3, 5, 7):
        power = p * p
        while power <= ceiling + 2:
            found.update(power + d for d in OFFSETS)
            power *= p
    return _below(found, ceiling)


def _integer_root(n: int, e: int) -> int:
    """⌊n^(1/e)⌋, exactly (a float guess, then corrected)."""
    root = int(round(n ** (1 / e)))
    while root**e > n:
        root -= 1
    while (root + 1)**e <= n:
        root += 1
    return root


def pseudoprime_neighbours(ceiling, profile, rng) -> list[int]:
    """n − 1, n, n + 1, prev_prime(n), next_prime(n) for every published and constructed
    pseudoprime n of :func:`pseudoprimes` and :func:`carmichael` (common practice: a
    next_prime built on a weak test skips to n or stops at it)."""
    from ..exact.primality import next_prime, prev_prime

    found = set()
    for n in set(pseudoprimes(ceiling, profile, rng)) | set(carmichael(ceiling, profile, rng)):
        found.update((n - 1, n, n + 1, prev_prime(n), next_prime(n)))
    return _below(found, ceiling)


def bound_starts(ceiling, profile, rng) -> list[int]:
    """Just below and at the start s of each bound's range, and [s/16, s] densely (8
    geometric points and 4 random ones): a candidate sizing its sieve from a bound
    outside its range gets too small a sieve there (common practice)."""
    from .. import bounds

    found = set()
    starts = {math.floor(b.range.start) for b in bounds.catalogue() if b.range.start is not None}
    for s in sorted(start for start in starts if start >= 16):
        found.update(s + d for d in (-2, -1, 0, 1))
        found.update(int(s / 16 * 16 ** (i / 8)) for i in range(8))
        found.update(rng.randint(s // 16, s) for _ in range(4))
    return _below(found, ceiling)


#: Segment sizes of segmented sieves (common practice: L1/L2 cache sizes, 2^15 ... 2^24).
SEAM_EXPONENTS = tuple(range(15, 25))


#: Segment sizes that are not powers of two (common practice: round decimal sizes 10^4 ...
#: 10^7, and multiples of the primorials 30030 = 2·3·5·7·11·13 and 510510, which let a wheel
#: pattern repeat exactly from one segment to the next).
DECIMAL_AND_WHEEL_SEGMENTS = (10**4, 10**5, 10**6, 10**7, 30030, 30030 * 16, 510510,
                              510510 * 4)


def sieve_seams(ceiling, profile, rng) -> list[int]:
    """The primes nearest m·S (m = 1, 2, 3) for the segment sizes S = 2^k, k in
    :data:`SEAM_EXPONENTS`, and S in :data:`DECIMAL_AND_WHEEL_SEGMENTS`, with their
    neighbours: a segment ending or starting at a prime drops or repeats it."""
    found = set()
    sizes = [2**k for k in SEAM_EXPONENTS] + list(DECIMAL_AND_WHEEL_SEGMENTS)
    for size in sizes:
        for m in (1, 2, 3):
            for p in adversarial.primes_around(m * size, 1):
                found.update((p - 1, p, p + 1))
    return _below(found, ceiling)


def sieving_prime_intervals(ceiling, profile, rng) -> list[tuple[int, int]]:
    """Intervals [q, b] and [q − 1, b] whose start q is a sieving prime, q ≤ √b: a sieve
    that crosses off q itself as a multiple of q loses it (common practice)."""
    found = set()
    longest = 2**20 + 7          # a listing of at most about 82,000 primes
    for q in (2, 3, 5, 7, 11, 13, 31, 97, 251, 1021):
        for b in (q * q, q * q + 1, 10 * q * q, 2**20, longest):
            if q * q <= b <= min(ceiling, longest):
                found.update(((q, b), (q - 1, b)))
    return sorted(found)


def mersenne_fermat(ceiling, profile, rng) -> list[int]:
    """2^k − 1 for k = 2..130 and Fermat numbers 2^(2^j) + 1, j = 0..7, each ± 1, ± 2
    (common practice: all-ones words, the carries of 2^k + 1; 2^31 − 1, 2^61 − 1, 2^127 − 1 are
    Mersenne primes, 2^32 + 1 = 641 · 6700417 is the first composite Fermat number)."""
    found = set()
    for k in range(2, 131):
        found.update(2**k - 1 + d for d in OFFSETS)
    for j in range(8):
        found.update(2**2**j + 1 + d for d in OFFSETS)
    return _below(found, ceiling)


#: Factor sizes of :func:`factor_shapes`, in bits.
FACTOR_BITS = tuple(range(8, 41))


def factor_shapes(ceiling, profile, rng) -> list[int]:
    """For every factor size b of 8..40 bits, three of each: balanced p·q (both b bits),
    unbalanced p·Q (p of b bits, Q as large as the ceiling allows), p², p³ and p⁴ (b bits);
    and numbers of three or more factors: p²·q·r and a smooth part times q·r with q, r
    consecutive primes (common practice: a factoriser drops a repeated prime, or its
    Pollard rho meets gcd = n on equal or close factors and loops)."""
    from ..exact.primality import next_prime

    top = ceiling.bit_length() - 1
    found = set()
    for bits in FACTOR_BITS:
        for _ in range(3):
            p = _random_prime(bits, rng)
            found.update((p * _random_prime(bits, rng), p**2, p**3, p**4))
            if top - bits >= 8:
                found.add(p * _random_prime(top - bits, rng))
            q = _random_prime(max(bits // 2, 4), rng)
            r = next_prime(q)
            found.add(p**2 * q * r)
            found.add(2**5 * 3**3 * 5 * 7**2 * q * r)
            found.add(p * q * q * r)
    return _below(found, ceiling)


#: Limits at which trial division commonly hands over to another method (common practice:
#: powers of ten and two from 10^2 to 2^32 -- a table of small primes, a cache line, a word).
TRIAL_LIMITS = (100, 1000, 2**10, 10**4, 2**16, 10**5, 10**6, 2**20, 10**7, 2**24,
                10**8, 2**32)


def trial_bounds(ceiling, profile, rng) -> list[int]:
    """Products of the least primes p < q < r above each limit L of :data:`TRIAL_LIMITS`,
    and of the greatest prime below it: p², p³, p⁴, p·q, p²·q, p·q·r, 2·p², 6·p·q
    (common practice: trial division up to L leaves the cofactor to a second method -- a
    primality test that takes p² for prime, a rho split taken for two primes, a split that
    stores a repeated prime once; the smallest such failing input is built from the least
    primes above L)."""
    from ..exact.primality import next_prime, prev_prime

    found = set()
    for limit in TRIAL_LIMITS:
        p = next_prime(limit)
        q = next_prime(p)
        r = next_prime(q)
        below = prev_prime(limit + 1)
        found.update((p**2, p**3, p**4, p * q, p**2 * q, p * q * r, 2 * p**2, 6 * p * q,
                      below**2, below * p))
    return _below(found, ceiling)


def _random_prime(bits: int, rng) -> int:
    from ..exact.primality import next_prime

    return next_prime(rng.randrange(2**(bits - 1), 2**bits - 2**(bits - 2)))


#: The primes a highly composite number below 2^128 can be built from (common practice).
_HCN_PRIMES = (2, 3, 5, 7, 11, 13, 17, 19, 23, 29, 31, 37, 41, 43, 47, 53, 59, 61, 67, 71, 73,
               79, 83, 89, 97, 101, 103, 107, 109, 113)


@functools.lru_cache(maxsize=4)
def _highly_composite_up_to(limit: int) -> tuple[int, ...]:
    """The highly composite numbers n ≤ ``limit`` (OEIS A002182: d(n) > d(m) for every
    m < n), by enumerating the products 2^a·3^b·5^c··· with non-increasing exponents (OEIS
    A025487, among which every record of d lies: Ramanujan 1915) and keeping the records."""
    found: list[tuple[int, int]] = []

    def extend(index: int, n: int, divisors: int, most: int) -> None:
        found.append((n, divisors))
        if index == len(_HCN_PRIMES):
            return
        m = n
        for e in range(1, most + 1):
            m *= _HCN_PRIMES[index]
            if m > limit:
                break
            extend(index + 1, m, divisors * (e + 1), e)

    extend(0, 1, 1, limit.bit_length())
    records, best = [], 0
    for n, divisors in sorted(found):
        if divisors > best:
            records.append(n)
            best = divisors
    return tuple(records)


def _primorials_up_to(limit: int) -> list[int]:
    """2, 2·3, 2·3·5, ... up to ``limit`` (OEIS A002110): the most distinct prime factors."""
    found, n = [], 1
    for p in _HCN_PRIMES:
        n *= p
        if n > limit:
            break
        found.append(n)
    return found


def highly_composite(ceiling, profile, rng) -> list[int]:
    """The highly composite numbers up to the ceiling (about 180 below 2^66) and the
    primorials (OEIS A002110; 15 distinct primes below 2^64), with n ± 1: d(n) passes 2^8,
    2^15, 2^16 (first at 2888071057872000: d = 2^15) and σ(n)/n is at its largest there, and
    ω(n) is at its largest at the primorials, so a divisor count or sum kept in a narrow
    word, and an array of the distinct prime factors sized for a few of them, go wrong on
    them first (common practice)."""
    top = min(ceiling, 2**128)
    numbers = set(_highly_composite_up_to(top)) | set(_primorials_up_to(top))
    return _below((n + d for n in numbers for d in (-1, 0, 1)), ceiling)


#: Sizes in bits of the constructed numbers of the sampled family (those up to the ceiling).
CONSTRUCTED_BITS = (40, 48, 56, 64, 66, 80, 100, 128)


def _constructed_shapes(bits: int) -> list[tuple[tuple[int, int], ...]]:
    """(bits, exponent) of each prime of the shapes built at about ``bits`` bits in all."""
    shapes = [((bits, 1),), ((bits // 2, 2),), ((bits // 3, 3),), ((20, 1), (bits - 20, 1)),
              ((2, 5), (2, 3), (3, 1), (bits - 14, 1)),
              ((14, 2), (16, 1), (bits - 44, 1)),
              ((12, 1), (13, 1), (14, 1), (bits - 39, 1))]
    return [shape for shape in shapes if shape[-1][0] >= 8]


def constructed_at(bits: int, rng) -> list[int]:
    """One number of each shape of :func:`constructed` at about ``bits`` bits, registered for
    the oracle (:mod:`oracle.adversarial._constructed`)."""
    return [adversarial.register(adversarial.construct(shape, rng)).n
            for shape in _constructed_shapes(bits)]


def constructed(ceiling, profile, rng) -> list[int]:
    """Numbers built from a chosen factorisation of certified primes, registered for the
    oracle (:mod:`oracle.adversarial._constructed`), at the sizes of
    :data:`CONSTRUCTED_BITS` up to the ceiling; above it the climb by bit size builds them
    up to 2²⁰⁴⁸ (:mod:`oracle.engine._reach_bits`).  Shapes per size: a prime P, p², p³,
    q·P, 2^a·3^b·r·P, q²·r·P and q·r·s·P with q, r, s of 12-20 bits -- at most one large
    prime or prime power, so that a correct candidate with a good factoriser answers in
    milliseconds, while float arithmetic (exact only below 2⁵³) and 64-bit words go wrong
    on them (common practice)."""
    found = set()
    for bits in CONSTRUCTED_BITS:
        if 2**bits <= ceiling:
            found.update(constructed_at(bits, rng))
    return _below(found, ceiling)


#: Moduli of :func:`moduli` (common practice: a modulus kept in a uint16, int32 or uint32
#: word, or in a double): around 2¹⁶, 2³¹ and 2³² (each ± 1, the primes nearest), just above
#: 2³² (read modulo 2³² as 1, 3, 15: a small modulus with many primes in its classes), 2³³,
#: 2⁴⁰, 2⁵³ (a double's mantissa) and 2⁶³, 2⁶⁴ (a signed or unsigned 64-bit word).
LARGE_MODULI = (65521, 65535, 65536, 65537, 2**31 - 1, 2**31, 2**31 + 1, 2147483659,
                2**32 - 5, 2**32 - 1, 2**32, 2**32 + 1, 2**32 + 3, 4294967311, 2**32 + 15,
                2**33 + 1, 2**40 + 15, 2**53 + 1, 2**63 - 1, 2**63 + 1, 2**64 - 59, 2**64 + 1,
                2**64 + 13)
#: x of the moduli triples: a prime (the class of a = x holds exactly one prime up to x when
#: q > x), and the cost of one call stays small (the oracle sieves [0, x] once per class).
MODULI_X = (1000003,)


def moduli(ceiling, profile, rng) -> list[tuple[int, int, int]]:
    """Triples (x, q, a) of prime_pi_mod with the large moduli of :data:`LARGE_MODULI`, for
    each x of :data:`MODULI_X`: a = 1, a = q − 1, a = p (the largest prime ≤ x prime to q),
    a = p + q and a = p + 2q (an a ≥ q is read modulo q), and a = q + 1; with q > x the
    answer is 1 for the classes of p and 0 for the others, so a modulus cut to 16, 31 or 32
    bits (or rounded through a double), or an a not reduced modulo a large q, gives a count
    of many primes instead.  Also q = x + 1 and q = x − 1 with a = x, x + q (q next to x)."""
    from ..exact.primality import prev_prime

    found = set()
    for x in MODULI_X:
        if x > ceiling:
            continue
        moduli_here = list(LARGE_MODULI) + [x - 1, x + 1]
        for q in moduli_here:
            p = prev_prime(x + 1)
            while math.gcd(p, q) != 1:
                p = prev_prime(p)
            for a in (1, q - 1, p, p + q, p + 2 * q, q + 1, x, x + q):
                if a >= 0 and math.gcd(a, q) == 1:
                    found.add((x, q, a))
    return sorted(found)


def uniform(ceiling, profile, rng) -> list[int]:
    return [rng.randrange(0, ceiling + 1) for _ in range(profile.random_points)]


def log_uniform(ceiling, profile, rng) -> list[int]:
    """Points 2^u with u uniform in [1, log2 ceiling]: every size is equally likely."""
    top = math.log2(max(ceiling, 2))
    return _below((int(2 ** rng.uniform(1, top)) for _ in range(profile.random_points)), ceiling)


FAMILIES = {
    "exhaustive": exhaustive, "boundaries": boundaries, "primes": primes, "squares": squares,
    "segments": segments, "gaps": gaps, "twins": twins, "pseudoprimes": pseudoprimes,
    "carmichael": carmichael, "base-divisors": base_divisors,
    "first-prime-bases": first_prime_bases, "highly-composite": highly_composite, "semiprimes": semiprimes, "smooth": smooth,
    "certified": certified, "prime-indices": prime_indices, "uniform": uniform,
    "log-uniform": log_uniform, "answer-words": answer_words,
    "twin-answer-words": twin_answer_words, "prime-powers": prime_powers,
    "pseudoprime-neighbours": pseudoprime_neighbours, "bound-starts": bound_starts,
    "sieve-seams": sieve_seams, "sieving-prime-intervals": sieving_prime_intervals,
    "mersenne-fermat": mersenne_fermat, "factor-shapes": factor_shapes,
    "trial-bounds": trial_bounds,
    "constructed": constructed,
}
FAMILIES["sum-words"] = sum_words
FAMILIES["moduli"] = moduli
FAMILIES["product-words"] = product_words
FAMILIES["square-steps"] = square_steps

TABLE_FUNCTIONS = {"prime_pi": "pi", "twin_pi": "twin_pi", "nth_prime": "nth_prime",
                   "factor": "factorization"}


def family(name: str, role_name: str):
    if name == "tables":
        return tables_points(TABLE_FUNCTIONS[role_name])
    return FAMILIES[name]


def rng_for(seed: int, role_name: str, family_name: str) -> random.Random:
    """One independent stream per (seed, role, family): adding a family changes no other."""
    return random.Random(f"{seed}:{role_name}:{family_name}")
