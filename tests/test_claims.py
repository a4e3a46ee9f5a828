"""Checks of claimed values, including beyond exact reach (issue: bounds and checks)."""

import mpmath
import pytest
import sympy

from oracle import InvalidInputError
from oracle.claims import check_count, check_difference, check_monotone, check_nth_prime


def test_exact_comparison_where_reachable():
    good = check_count("pi", 10**6, 78498)            # OEIS A006880
    assert good.passed and good.check == "exact" and good.provenance.startswith("table:")
    bad = check_count("pi", 10**6, 78497)
    assert not bad.passed and bad.expected == 78498


def test_a_32_bit_wrapped_count_is_caught_beyond_exact_reach():
    x = 10**30
    approximation = int(mpmath.li(x))                 # mpmath, test-only: li(x) is near pi(x)
    plausible = check_count("pi", x, approximation)
    assert plausible.check == "proven-interval"
    assert plausible.passed, plausible
    wrapped = check_count("pi", x, approximation % 2**32)
    assert not wrapped.passed and "below" in wrapped.detail
    doubled = check_count("pi", x, 2 * approximation)
    assert not doubled.passed and "above" in doubled.detail
    assert plausible.provenance.startswith("bounds:")


def test_twin_count_beyond_reach_must_respect_the_upper_bound():
    x = 10**25
    hardy_littlewood = int(2 * 0.6601618158 * mpmath.quad(lambda t: 1 / mpmath.log(t)**2, [2, x]))
    # twin prime constant C2 = 0.6601618158... (OEIS A005597); the conjectured
    # asymptotic is only a plausible claim here, not a reference value.
    assert check_count("twin_pi", x, hardy_littlewood, budget=1).passed
    assert not check_count("twin_pi", x, 10 * hardy_littlewood, budget=1).passed


def test_monotonicity_violation_is_reported_with_both_points():
    result = check_monotone("pi", [(100, 25), (10, 4), (1000, 168), (2000, 167)])
    assert not result.passed and result.arguments == (1000, 2000)
    assert check_monotone("pi", [(10, 4), (100, 25), (1000, 168)]).passed
    assert not check_monotone("pi", [(10, 4), (10, 5)]).passed


@pytest.mark.parametrize("x", [10**12, 2**64 - 5000, 10**20])
def test_short_interval_difference_is_exact(x):
    h = 5000
    truth = sum(1 for _ in sympy.primerange(x + 1, x + h + 1))   # sympy, test-only reference
    base = 123456789                                             # any claim at x; only differences matter
    good = check_difference("pi", x, h, base, base + truth)
    assert good.passed and good.expected == truth
    assert good.provenance == ("probable" if x + h >= 2**64 else "sieve")
    off_by_one = check_difference("pi", x, h, base, base + truth + 1)
    assert not off_by_one.passed and "holds" in off_by_one.detail


def test_twin_difference_counts_pairs_by_their_larger_member():
    # (3, 5), (5, 7), (11, 13), (17, 19): pi_2(19) - pi_2(12) counts only (11, 13) and (17, 19)
    assert check_difference("twin_pi", 12, 7, 2, 4).passed
    assert not check_difference("twin_pi", 12, 7, 2, 5).passed


def test_nth_prime_exact_and_beyond_reach():
    assert check_nth_prime(10**6, 15485863)[0].passed           # OEIS A006988
    assert not check_nth_prime(10**6, 15485867)[0].passed       # a prime, but the wrong one
    from oracle import bounds

    n = 3 * 10**22          # not a table point (OEIS A006988 holds p at 10^k only)
    interval = bounds.nth_prime(n)
    middle = (interval.lower + interval.upper) // 2
    prime = sympy.nextprime(middle)
    checks = check_nth_prime(n, prime, budget=1)
    assert [c.check for c in checks] == ["is-prime", "proven-interval"]
    assert all(c.passed for c in checks)
    composite = check_nth_prime(n, prime + 1, budget=1)
    assert not composite[0].passed and composite[1].passed
    outside = check_nth_prime(n, sympy.nextprime(interval.upper), budget=1)
    assert outside[0].passed and not outside[1].passed


def test_claims_reject_bad_input():
    with pytest.raises(InvalidInputError):
        check_count("sigma", 10, 4)
    with pytest.raises(InvalidInputError):
        check_count("pi", 10, 4.0)
    with pytest.raises(InvalidInputError):
        check_difference("pi", 10, 0, 4, 4)
