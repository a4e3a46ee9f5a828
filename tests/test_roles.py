"""The roles judge answers correctly: against published values and sympy (test-only reference)."""

import numpy as np
import pytest
import sympy

from oracle import InvalidInputError, roles
from oracle.roles import Conventions, WrongType

CONVENTIONS = Conventions()


def judge(role_name, arguments, raw, conventions=CONVENTIONS):
    role = roles.get(role_name)
    return role.judge(arguments, role.normalise(raw, conventions), conventions, 5.0)


def test_registry_has_the_eight_roles_of_the_design():
    assert set(roles.ROLES) >= {"prime_pi", "twin_pi", "nth_prime", "is_prime", "next_prime",
                                "prev_prime", "primes_in", "factor"}
    assert set(roles.ROLES) >= {"mobius", "totient", "divisor_count", "divisor_sum"}   # issue 15


def test_registry_has_the_sums_of_issue_15():
    assert set(roles.ROLES) >= {"prime_sum", "mertens", "squarefree_count", "triplet_pi_026",
                                "triplet_pi_046", "quadruplet_pi"}


@pytest.mark.parametrize("name, role", [("prime_pi", "prime_pi"), ("twin_pi", "twin_pi"),
                                        ("primepi", "prime_pi"), ("factorint", "factor"),
                                        ("nextprime", "next_prime"), ("primerange", "primes_in")])
def test_role_inferred_from_a_role_name_or_a_listed_alias(name, role):
    assert roles.infer(name) == role


@pytest.mark.parametrize("name", ["frobnicate", "sum_of_squares", "my_prime_pi", "fast_is_prime",
                                  "_small_primes", "prime", "primes", "pi", "Prime_Pi"])
def test_role_not_inferred_from_other_names(name):
    with pytest.raises(InvalidInputError, match="--role"):
        roles.infer(name)


def test_every_alias_names_a_role():
    assert set(roles.ALIASES.values()) <= set(roles.ROLES)
    assert not set(roles.ALIASES) & set(roles.ROLES)


def test_prime_pi_exact_at_published_value():
    assert judge("prime_pi", (10**9,), 50847534).passed          # OEIS A006880
    wrong = judge("prime_pi", (10**9,), 50847533)
    assert not wrong.passed and wrong.expected == 50847534 and wrong.provenance.startswith("table:")


def test_prime_pi_beyond_reach_uses_the_proven_interval():
    verdict = judge("prime_pi", (10**30,), 10**20)
    assert verdict.check == "proven-interval" and not verdict.passed
    assert verdict.provenance.startswith("bounds:")


def test_counts_accept_numpy_and_gmpy_integers_but_not_floats():
    import gmpy2

    assert judge("prime_pi", (100,), np.int64(25)).passed        # OEIS A006880: pi(100) = 25
    assert judge("prime_pi", (100,), gmpy2.mpz(25)).passed
    for raw in (25.0, None, "25", True):
        with pytest.raises(WrongType):
            roles.get("prime_pi").normalise(raw, CONVENTIONS)


def test_twin_pi_counts_pairs_by_their_larger_member():
    # pairs (3,5), (5,7): at x = 6 only (3,5) has p + 2 <= x  (definition; OEIS A007508 for 10**3 = 35)
    assert judge("twin_pi", (6,), 1).passed
    assert not judge("twin_pi", (6,), 2).passed
    assert judge("twin_pi", (1000,), 35).passed


def test_nth_prime_against_sympy():
    for n in (1, 2, 100, 10**5):
        assert judge("nth_prime", (n,), sympy.prime(n)).passed
    assert not judge("nth_prime", (100,), 547).passed


@pytest.mark.parametrize("n", [561, 2047, 3215031751, 2**61 - 1, 2**89 - 1])
def test_is_prime_against_sympy(n):
    assert judge("is_prime", (n,), sympy.isprime(n)).passed
    assert not judge("is_prime", (n,), not sympy.isprime(n)).passed


def test_is_prime_accepts_zero_and_one_but_not_two():
    assert judge("is_prime", (7,), 1).passed
    with pytest.raises(WrongType):
        roles.get("is_prime").normalise(2, CONVENTIONS)


def test_next_and_prev_prime_explain_returning_n_itself():
    assert judge("next_prime", (13,), 17).passed
    inclusive = judge("next_prime", (13,), 13)
    assert not inclusive.passed and "n itself" in inclusive.detail
    assert judge("prev_prime", (3,), 2).passed
    assert not judge("prev_prime", (2**31,), 2**31 - 2).passed      # 2**31 - 1 is prime (Euler)


def test_primes_in_reports_first_missing_and_repeated_prime():
    truth = list(sympy.primerange(100, 201))
    assert judge("primes_in", (100, 200), truth).passed
    missing = judge("primes_in", (100, 200), [p for p in truth if p != 113])
    assert "first missing prime: 113" in missing.detail
    repeated = judge("primes_in", (100, 200), truth[:3] + truth[2:])
    assert "repeated" in repeated.detail


def test_primes_in_half_open_convention():
    half_open = Conventions(primes_range="half-open")
    assert judge("primes_in", (2, 7), [2, 3, 5], half_open).passed
    assert not judge("primes_in", (2, 7), [2, 3, 5]).passed


@pytest.mark.parametrize("raw", [{2: 2, 3: 1}, [2, 2, 3], [(2, 2), (3, 1)], np.array([2, 2, 3])])
def test_factor_accepts_the_three_shapes(raw):
    assert judge("factor", (12,), raw).passed


def test_factor_rejects_wrong_product_composite_factor_and_declared_shape():
    assert not judge("factor", (12,), [2, 3]).passed
    composite = judge("factor", (2047,), [2047])                 # 2047 = 23 * 89 (Mersenne 2**11 - 1)
    assert not composite.passed and "composite" in composite.detail
    assert judge("factor", (1,), {}).passed
    with pytest.raises(WrongType):
        roles.get("factor").normalise([2, 2, 3], Conventions(factor_shape="mapping"))


def test_bad_conventions_are_refused():
    with pytest.raises(InvalidInputError, match="primes_range"):
        Conventions(primes_range="open")


def test_counts_from_the_nearest_known_count_agree_with_primecount_and_primesieve():
    # primecountpy and primesieve are test-only references; the points walk up and down
    # so that each count is derived from a neighbour (both directions of the identity)
    from _references import primecount, primesieve
    from oracle.roles._known_counts import KnownCounts

    points = [2**20 + 7, 2**20 - 5, 2**20 + 1, 3 * 2**20, 3 * 2**20 - 1, 5, 2, 3, 10**6 + 3]
    primes_memory, twins_memory = KnownCounts("pi"), KnownCounts("twin_pi")
    for x in points:
        assert primes_memory.exact(x, 5.0)[0] == primecount.prime_pi(x)
        assert twins_memory.exact(x, 5.0)[0] == (primesieve.count_twins(x) if x >= 5 else 0)
    value, provenance = twins_memory.exact(2**20 + 3, 5.0)
    assert "sieve" in provenance


def test_counting_judge_with_a_run_memory_reports_the_exact_value():
    from oracle.roles._known_counts import KnownCounts

    role, memory = roles.get("prime_pi"), KnownCounts("pi")
    assert role.judge((10**9,), 50847534, CONVENTIONS, 5.0, memory=memory).passed   # OEIS A006880
    wrong = role.judge((10**9 + 7,), 50847534, CONVENTIONS, 5.0, memory=memory)
    # 10**9 + 7 is prime (sympy.isprime), and the only prime in (10**9, 10**9 + 7]
    assert sympy.isprime(10**9 + 7) and list(sympy.primerange(10**9 + 1, 10**9 + 8)) == [10**9 + 7]
    assert not wrong.passed and wrong.expected == 50847535


@pytest.mark.parametrize("n", [664580, 10**6 + 1, 3 * 10**6])
def test_nth_prime_beyond_the_kept_sieve_against_sympy(n):
    # pi(10**7) = 664579 (OEIS A006880): these n are judged by counting, not by the kept sieve
    right = sympy.prime(n)
    assert judge("nth_prime", (n,), right).passed
    next_one = sympy.nextprime(right)
    wrong = judge("nth_prime", (n,), next_one)
    assert not wrong.passed and wrong.expected == right and f"p_{n + 1}" in wrong.detail
    far = judge("nth_prime", (n,), 15)                    # a 32-bit wrap gives tiny primes
    assert not far.passed and far.expected == right


def test_primes_in_far_up_is_listed_by_testing_each_number():
    a, b = 2**64 - 3000, 2**64 - 1
    listing = judge("primes_in", (a, b), list(sympy.primerange(a, b + 1)))
    assert listing.passed and listing.provenance == "deterministic"
    # 2**64 - 59 is the largest prime below 2**64 (sympy.prevprime)
    assert sympy.prevprime(2**64) == 2**64 - 59
    short = judge("primes_in", (a, b), list(sympy.primerange(a, b + 1))[:-1])
    assert not short.passed and "first missing prime: 18446744073709551557" in short.detail


# Non-canonical factorisations of 360 = 2^3 * 3^2 * 5 (checked by the product below).
NON_CANONICAL_360 = {
    "the prime 2 listed twice": [(2, 1), (3, 2), (2, 2), (5, 1)],
    "factors not in ascending order": [(5, 1), (3, 2), (2, 3)],
    "an exponent 0": [(2, 3), (3, 2), (5, 1), (7, 0)],
}


@pytest.mark.parametrize("shape", ["any", "flat"])
def test_a_factor_1_is_wrong_under_every_shape(shape):
    # 1 is not prime, so [1, 2, 2, 2, 3, 3, 5] is not a factorisation into primes (and the
    # zoo member factor_one, factor(1) = {1: 1}, must stay caught)
    assert not judge("factor", (360,), [1, 2, 2, 2, 3, 3, 5], Conventions(factor_shape=shape)).passed
    assert not judge("factor", (1,), {1: 1}).passed


@pytest.mark.parametrize("irregularity", sorted(NON_CANONICAL_360))
def test_non_canonical_factorisation_warns_under_any_shape(irregularity):
    raw = NON_CANONICAL_360[irregularity]
    assert sympy.factorint(360) == {2: 3, 3: 2, 5: 1}
    verdict = judge("factor", (360,), raw)
    assert verdict.passed
    assert "warning: non-canonical" in verdict.detail and irregularity in verdict.detail


@pytest.mark.parametrize("irregularity", sorted(NON_CANONICAL_360))
def test_non_canonical_factorisation_fails_under_its_strict_shape(irregularity):
    raw = NON_CANONICAL_360[irregularity]
    shape = "flat" if isinstance(raw[0], int) else "pairs"
    with pytest.raises(WrongType, match="non-canonical"):
        roles.get("factor").normalise(raw, Conventions(factor_shape=shape))


def test_mapping_with_zero_exponent_and_canonical_answers_carry_no_warning():
    with pytest.raises(WrongType, match="exponent 0"):
        roles.get("factor").normalise({2: 3, 3: 2, 5: 1, 7: 0}, Conventions(factor_shape="mapping"))
    assert judge("factor", (360,), {5: 1, 2: 3, 3: 2}).detail == ""    # a mapping has no order
    assert judge("factor", (360,), [(2, 3), (3, 2), (5, 1)]).detail == ""
    assert not judge("factor", (1,), [1]).passed                      # factor(1) is empty, not [1]
    with pytest.raises(WrongType):
        roles.get("factor").normalise([(2, -1)], CONVENTIONS)
