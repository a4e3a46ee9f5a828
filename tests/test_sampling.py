"""Sampling: reproducible from the seed, and covering the boundaries where real code fails."""

import pytest

from oracle import InvalidInputError, roles, sampling


def points(role_name, profile="ci", seed=11):
    return sampling.sample(roles.get(role_name), sampling.profile(profile), seed)


def arguments(role_name, profile="ci", seed=11):
    return {s.arguments for s in points(role_name, profile, seed)}


def test_same_seed_same_points_other_seed_other_random_points():
    assert points("prime_pi", seed=5) == points("prime_pi", seed=5)
    first = {s.arguments for s in points("prime_pi", seed=5) if s.family == "uniform"}
    second = {s.arguments for s in points("prime_pi", seed=6) if s.family == "uniform"}
    assert first != second


def test_points_respect_domain_minimum_and_profile_ceiling():
    for name, role in roles.ROLES.items():
        ceiling = sampling.profile("quick").ceilings[name]
        for s in points(name, "quick"):
            # the ceiling bounds the size of a call (x for prime_pi_mod, whose moduli go above)
            assert all(role.minimum <= a for a in s.arguments), (name, s)
            assert role.magnitude(s.arguments) <= ceiling, (name, s)


def test_counting_points_straddle_the_32_bit_boundary():
    found = arguments("prime_pi")
    assert any(a[0] > 2**32 for a in found)
    assert any(2**31 < a[0] <= 2**32 for a in found)


def test_prime_pi_includes_published_table_points():
    assert (10**9,) in arguments("prime_pi")          # OEIS A006880 lists pi(10**9)


def test_is_prime_includes_pseudoprimes_and_carmichael_numbers():
    found = arguments("is_prime")
    assert (2047,) in found                           # least strong pseudoprime to base 2 (OEIS A014233)
    assert (561,) in found and (3215031751,) in found  # Carmichael 561 (OEIS A002997); A014233 k = 4


def test_next_prime_includes_both_ends_of_a_record_gap():
    found = arguments("next_prime")
    # maximal gap 112 after the prime 370261 (OEIS A002386 / A005250)
    assert (370261,) in found and (370261 + 112,) in found


def test_factor_includes_squares_of_primes_near_two_to_the_32():
    found = arguments("factor")
    assert (65521**2,) in found                       # 65521 = largest prime below 2**16 (sympy.prevprime)
    import sympy
    assert sympy.prevprime(2**16) == 65521


def test_primes_in_samples_intervals_and_segment_prefixes():
    found = arguments("primes_in")
    assert all(len(a) == 2 for a in found)
    assert (0, 2**16) in found and (0, 2**15 - 1) in found


def test_heavy_points_are_capped_in_number_and_in_cost():
    ci = sampling.profile("ci")
    for name in ("prime_pi", "twin_pi", "nth_prime", "primes_in"):
        heavy = [s for s in points(name) if max(s.arguments) > sampling.HEAVY[name]]
        assert 0 < len(heavy) <= ci.heavy_points
        assert sum(sampling.heavy_cost(name, max(s.arguments)) for s in heavy) <= ci.heavy_budget[name]


def test_heavy_cost_is_the_argument_or_its_square_root():
    assert sampling.heavy_cost("twin_pi", 2**32) == 2**32            # a sieve up to x
    assert sampling.heavy_cost("primes_in", 2**64 - 1) == 2**32 - 1  # sieving primes up to sqrt(b)


def test_primes_in_samples_long_listings_across_segment_seams():
    found = arguments("primes_in")
    # segments laid from a = 1 put a seam on 1 + 2**16 = 65537, a Fermat prime (OEIS A019434)
    assert any(a == 1 and b > 65537 for a, b in found)
    assert any(b - a > 2**17 for a, b in found if b < 2**32)


def test_unknown_profile_refused():
    with pytest.raises(InvalidInputError, match="profile"):
        sampling.profile("fast")


# --- families of classic failure modes (checked by sympy, a test-only reference) ---------- #

import random

import sympy

from oracle.sampling import _families

from sympy.ntheory.primetest import mr as sympy_mr

from _references import reference

#: OEIS A051439, prime(2^k + 1) for k = 0..28 (data section, read with the search tool).
A051439 = (3, 5, 11, 23, 59, 137, 313, 727, 1621, 3673, 8167, 17881, 38891, 84047, 180511,
           386117, 821647, 1742539, 3681149, 7754081, 16290073, 34136059, 71378603, 148948141,
           310248251, 645155227, 1339484207, 2777105131, 5750079077)
CI = sampling.profile("ci")


def _family(name, ceiling=2**64, chosen=CI, seed=1):
    return _families.family(name, "x")(ceiling, chosen, random.Random(seed))


def test_prime_at_power_of_two_agrees_with_oeis_a051439_and_sympy():
    for k, p in _families.PRIME_AT_POWER_OF_TWO.items():
        if k <= 27:
            assert sympy.nextprime(p) == A051439[k], k            # p_N and p_(N+1) are consecutive
        if k <= 17:
            assert sympy.prime(2**k) == p
    points = _family("answer-words", ceiling=2**20)
    assert {sympy.primepi(x) for x in points if x in (820640, 821640, 821641)} <= {2**16 - 1, 2**16}
    assert 821640 in points and 821641 in points and sympy.primepi(821640) == 2**16 - 1


def test_prime_at_power_of_two_agrees_with_primecountpy():
    primecount = reference("primecountpy", "primecountpy")
    for k, p in _families.PRIME_AT_POWER_OF_TWO.items():
        assert primecount.nth_prime(2**k) == p, k


def test_twin_answer_words_step_the_twin_count_across_two_to_the_k():
    points = set(_family("twin-answer-words", ceiling=2**16))
    twins = [p + 2 for p in sympy.primerange(3, 2**16) if sympy.isprime(p + 2)]
    for k in range(1, 10):
        q = twins[2**k - 1]
        assert {q - 1, q, q + 1} <= points


def test_prime_powers_are_prime_powers_and_neighbours():
    points = _family("prime-powers", ceiling=2**40)
    powers = [x for x in points if sympy.perfect_power(x) and len(sympy.factorint(x)) == 1]
    assert len(powers) >= 50 and 3**25 in points and 2**40 in points
    assert all(any(abs(x - y) <= 2 for y in powers) for x in points)
    assert any(sympy.factorint(x) and max(sympy.factorint(x).values()) == 3
               and min(sympy.factorint(x)) > 2**10 for x in powers)    # p³ with p above 2^10


def test_pseudoprime_neighbours_hold_each_pseudoprime_and_its_neighbouring_primes():
    points = set(_family("pseudoprime-neighbours", ceiling=2**32))
    for n in (2047, 561, 3215031751, 5459):                 # A001262, A002997, A014233, A005845
        assert {n - 1, n, n + 1, sympy.prevprime(n), sympy.nextprime(n)} <= points


def test_bound_starts_surround_every_catalogue_range_start():
    from oracle import bounds

    points = set(_family("bound-starts", ceiling=2**40))
    for bound in bounds.catalogue():
        start = bound.range.start
        if start is not None and 16 <= start <= 2**40:
            s = int(start)
            assert {s - 1, s} <= points and any(s // 16 <= x < s // 2 for x in points)


def test_sieve_seams_are_primes_at_segment_multiples_and_sieving_prime_starts():
    points = set(_family("sieve-seams"))
    for k in (15, 20, 24):
        assert {sympy.prevprime(2**k), sympy.nextprime(2**k)} <= points
    intervals = _family("sieving-prime-intervals", ceiling=2**33)
    starts = [(a, b) for a, b in intervals if sympy.isprime(a)]
    assert len(starts) >= 40 and all(a * a <= b or a + 1 in (3,) for a, b in starts)
    assert {(1021, 2**20), (1020, 2**20), (1021, 1021**2)} <= set(intervals)


def test_base_divisors_hold_the_primes_dividing_published_miller_rabin_bases():
    points = set(_family("base-divisors", ceiling=2**64))
    # 9780504 = 2**3 * 3 * 407521 and 1795265022 = 2 * 3 * 299210837 (sympy), bases of the
    # seven-base set for n < 2**64
    for base, p in ((9780504, 407521), (1795265022, 299210837)):
        assert sympy.factorint(base)[p] == 1 and sympy.isprime(p)
        assert {p - 1, p, p + 1} <= points
    for role_name in ("is_prime", "next_prime", "prev_prime", "factor"):
        assert "base-divisors" in roles.get(role_name).families


def test_pseudoprimes_hold_the_least_pseudoprimes_of_deterministic_base_sets():
    points = set(_family("pseudoprimes", ceiling=2**64))
    for n, bases in ((9080191, (31, 73)), (4759123141, (2, 7, 61)),
                     (1122004669633, (2, 13, 23, 1662803))):    # Jaeschke 1993, from memory
        assert n in points and not sympy.isprime(n)
        assert all(sympy_mr(n, [a]) for a in bases)


def test_pseudoprimes_fool_the_first_k_prime_bases_above_the_ceilings():
    built = _families._first_prime_bases_pseudoprimes()
    assert len(built) == len(_families.FIRST_PRIME_BASE_COUNTS)
    for k, n in zip(_families.FIRST_PRIME_BASE_COUNTS, built):
        bases = list(sympy.primerange(2, sympy.prime(k) + 1))
        assert len(bases) == k and not sympy.isprime(n)
        assert sympy_mr(n, bases)                       # sympy's strong test to every base
    assert set(_family("first-prime-bases", ceiling=2**2048)) == set(built)
    assert not _family("first-prime-bases", ceiling=2**128)
    from oracle.engine import _reach_bits
    assert set(built) <= set(_reach_bits._pseudoprimes_above(2**128, "is_prime"))
    assert not set(built) & set(_reach_bits._pseudoprimes_above(2**66, "factor")) - {built[0]}


def test_pseudoprimes_include_perrin_pseudoprimes():
    points = set(_family("pseudoprimes", ceiling=2**64))
    assert {271441, 904631} <= points and sympy.factorint(271441) == {521: 2}   # OEIS A013998


#: OEIS A002182, highly composite numbers, first 38 terms (from memory).
A002182 = (1, 2, 4, 6, 12, 24, 36, 48, 60, 120, 180, 240, 360, 720, 840, 1260, 1680, 2520, 5040,
           7560, 10080, 15120, 20160, 25200, 27720, 45360, 50400, 55440, 83160, 110880, 166320,
           221760, 277200, 332640, 498960, 554400, 665280, 720720)


def test_highly_composite_numbers_are_the_records_of_the_divisor_count():
    found = _families._highly_composite_up_to(2**66)
    assert found[:len(A002182)] == A002182
    # every record of d(n) up to 10**5 by brute force with sympy
    records, best = [], 0
    for n in range(1, 10**5 + 1):
        d = sympy.divisor_count(n)
        if d > best:
            records.append(n)
            best = d
    assert [n for n in found if n <= 10**5] == records
    counts = [sympy.divisor_count(n) for n in found]
    assert counts == sorted(set(counts))               # strictly increasing
    first_wide = next(n for n, d in zip(found, counts) if d >= 2**16)
    assert sympy.divisor_count(first_wide) >= 2**16 and sympy.divisor_count(first_wide - 1) < 2**16
    points = set(_family("highly-composite", ceiling=2**66))
    assert {first_wide - 1, first_wide, first_wide + 1} <= points
    # primorials, OEIS A002110: 2 * 3 * ... * 47 = 614889782588491410 has 15 prime factors
    assert 614889782588491410 in points and len(sympy.factorint(614889782588491410)) == 15
    for role_name in ("mobius", "totient", "divisor_count", "divisor_sum", "factor"):
        assert "highly-composite" in roles.get(role_name).families


def test_sieve_seams_include_decimal_and_primorial_segment_sizes():
    points = set(_family("sieve-seams", ceiling=2**33))
    for size in (10**6, 3 * 10**6, 30030, 510510):          # common practice: round sizes
        assert {sympy.prevprime(size), sympy.nextprime(size)} <= points
    assert 2999999 in points and sympy.isprime(2999999)


def test_mersenne_and_fermat_numbers():
    points = set(_family("mersenne-fermat", ceiling=2**130))
    assert {2**61 - 1, 2**127 - 1, 2**32 + 1, 2**64 + 1, 2**128 + 2} <= points
    assert sympy.factorint(2**32 + 1) == {641: 1, 6700417: 1}


def test_factor_shapes_cover_every_factor_size_with_repeated_and_close_factors():
    points = _family("factor-shapes", ceiling=2**100)
    sizes = set()
    shapes = set()
    for n in points[::7]:
        f = sympy.factorint(n)
        sizes.add(max(f).bit_length())
        if max(f.values()) >= 2 and len(f) >= 3:
            shapes.add("repeated among three or more")
        if len(f) == 1:
            shapes.add("prime power")
    assert shapes == {"repeated among three or more", "prime power"}
    assert len(sizes) > 15


def test_trial_bounds_are_products_of_the_least_primes_above_each_limit():
    points = set(_family("trial-bounds", ceiling=2**100))
    for limit in _families.TRIAL_LIMITS:
        p = sympy.nextprime(limit)
        q = sympy.nextprime(p)
        r = sympy.nextprime(q)
        assert {p**2, p**3, p * q, p * q * r, p**2 * q} <= points
    # 1009 is the least prime above 1000 (sympy): the witnesses of the zoo's factorisers
    # that mishandle a cofactor left by trial division up to 1000
    assert {1009**2, 1009 * 1013 * 1019} <= points
    for n in list(points)[::5]:
        assert sum(sympy.factorint(n).values()) >= 2


@pytest.mark.parametrize("name", ["quick", "ci"])
def test_new_families_respect_ceilings_and_heavy_caps(name):
    chosen = sampling.profile(name)
    for role in roles.ROLES.values():
        points = sampling.sample(role, chosen, seed=3)
        assert all(role.magnitude(s.arguments) <= chosen.ceilings[role.name] for s in points)
        if role.name in sampling.HEAVY:
            heavy = [s for s in points if role.magnitude(s.arguments) > sampling.HEAVY[role.name]]
            assert len(heavy) <= chosen.heavy_points
            budget = chosen.heavy_budget[role.name]
            assert sum(sampling.heavy_cost(role.name, role.magnitude(s.arguments))
                       for s in heavy) <= budget
