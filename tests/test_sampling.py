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
            assert all(role.minimum <= a <= ceiling for a in s.arguments), (name, s)


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
