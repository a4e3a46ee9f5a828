"""Families of integers on which number-theory code tends to fail.

Each family is a function ``(ceiling, profile, rng) -> list[int]`` returning
integers ≥ 0 (callers cut them to the role's domain).  The boundaries are the
usual suspects (common practice): powers of two and ten ± small, primes and
their neighbours, prime squares ± 1 where a float square root goes wrong
(near 2¹⁶·², 2²⁶·⁵·², 2³²·²), multiples of segment sizes 2¹⁵…2²⁰ ± small,
twin pairs straddling powers of two, and both ends of record prime gaps
(OEIS A002386 / A005250, from :mod:`oracle.tables`).
"""

from __future__ import annotations

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
    found.update(adversarial.STRONG_PSEUDOPRIMES_BASES_2_3_5_7)
    found.update(adversarial.LEAST_STRONG_PSEUDOPRIMES_FIRST_PRIME_BASES)
    found.update(adversarial.LUCAS_PSEUDOPRIMES)
    found.update(adversarial.STRONG_LUCAS_PSEUDOPRIMES)
    found.update(adversarial.FIBONACCI_PSEUDOPRIMES)
    found.update(adversarial.constructed_strong_pseudoprimes((2, 3, 5, 7, 11, 13, 17, 19, 23, 29, 31, 37), 1))
    return _below(found, ceiling)


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


def uniform(ceiling, profile, rng) -> list[int]:
    return [rng.randrange(0, ceiling + 1) for _ in range(profile.random_points)]


def log_uniform(ceiling, profile, rng) -> list[int]:
    """Points 2^u with u uniform in [1, log2 ceiling]: every size is equally likely."""
    top = math.log2(max(ceiling, 2))
    return _below((int(2 ** rng.uniform(1, top)) for _ in range(profile.random_points)), ceiling)


FAMILIES = {
    "exhaustive": exhaustive, "boundaries": boundaries, "primes": primes, "squares": squares,
    "segments": segments, "gaps": gaps, "twins": twins, "pseudoprimes": pseudoprimes,
    "carmichael": carmichael, "semiprimes": semiprimes, "smooth": smooth,
    "certified": certified, "prime-indices": prime_indices, "uniform": uniform,
    "log-uniform": log_uniform,
}

TABLE_FUNCTIONS = {"prime_pi": "pi", "twin_pi": "twin_pi", "nth_prime": "nth_prime",
                   "factor": "factorization"}


def family(name: str, role_name: str):
    if name == "tables":
        return tables_points(TABLE_FUNCTIONS[role_name])
    return FAMILIES[name]


def rng_for(seed: int, role_name: str, family_name: str) -> random.Random:
    """One independent stream per (seed, role, family): adding a family changes no other."""
    return random.Random(f"{seed}:{role_name}:{family_name}")
