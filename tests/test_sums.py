"""The sums of issue 15: the oracle's exact values against published tables and sympy,
and the roles built on them (prime_sum, mertens, squarefree_count, the triplet and
quadruplet counts)."""

import bisect
import random

import pytest
import sympy

from oracle import InvalidInputError, OutOfReachError, facade, roles
from oracle.exact import mobius_sums, prime_sum_combinatorial, prime_sums
from oracle.roles import Conventions
from oracle.roles._sums import KnownSums
from oracle.sampling import _families

# OEIS A077645, the sum of the primes with n decimal digits, n = 1..12, read on 2026-12-03 with
# the project's search tool (oeis.org/A077645); its partial sums are OEIS A046731, the sum of
# the primes below 10^n (10^n is not prime, so "below" and "up to" agree).
N_DIGIT_PRIME_SUMS = [17, 1043, 75067, 5660269, 448660141, 37096005486, 3165774592333,
                      276006465392920, 24460302301867259, 2196082920489474703,
                      199246255311162951776, 18234121474806961230363]
# OEIS A084237, M(10^n) for n = 0..9, read on 2026-12-03 with the project's search tool.
MERTENS_AT_POWERS_OF_TEN = [1, -1, 1, 2, -23, -48, 212, 1037, 1928, -222]
# OEIS A071172, Q(10^n) for n = 0..21, read on 2026-12-03 with the project's search tool.
SQUAREFREE_AT_POWERS_OF_TEN = [
    1, 7, 61, 608, 6083, 60794, 607926, 6079291, 60792694, 607927124, 6079270942,
    60792710280, 607927102274, 6079271018294, 60792710185947, 607927101854103,
    6079271018540405, 60792710185403794, 607927101854022750, 6079271018540280875,
    60792710185402613302, 607927101854026645617]


def test_prime_sum_at_powers_of_ten_agrees_with_oeis_a077645_partial_sums():
    total = 0
    for n, piece in enumerate(N_DIGIT_PRIME_SUMS[:10], start=1):
        total += piece
        assert facade.prime_sum(10**n) == total, n
        if n >= 6:
            assert prime_sum_combinatorial.prime_sum(10**n) == total, n


@pytest.mark.slow
def test_combinatorial_prime_sum_at_ten_to_the_11_and_12_agrees_with_oeis_a077645():
    for n in (11, 12):                           # about 6 s and 30 s
        assert prime_sum_combinatorial.prime_sum(10**n) == sum(N_DIGIT_PRIME_SUMS[:n]), n


def test_combinatorial_prime_sum_agrees_with_the_sieve():
    rng = random.Random(47)
    points = list(range(0, 400)) + [p * p + d for p in (97, 1009, 9973) for d in (-1, 0, 1)]
    points += [rng.randrange(0, 10**8) for _ in range(6)] + [10**8 + 7]
    for x in points:
        assert prime_sum_combinatorial.prime_sum(x) == prime_sums.prime_sum_between(0, x), x
    with pytest.raises(InvalidInputError):
        prime_sum_combinatorial.prime_sum(2**47 + 1)


def test_prime_sum_agrees_with_sympy_at_random_points():
    rng = random.Random(15)
    listed = list(sympy.primerange(2, 10**6 + 1))
    for x in [0, 1, 2, 3, 4, 5] + [rng.randrange(0, 10**6) for _ in range(40)]:
        assert facade.prime_sum(x) == sum(listed[:bisect.bisect_right(listed, x)]), x


def test_prime_sum_between_near_two_to_the_64_is_exact_beyond_uint64():
    # the sum of a few primes just below 2**64 exceeds 2**64: the half-word sums must carry
    low = 2**64 - 1000
    expected = sum(p for p in range(low, 2**64) if sympy.isprime(p))
    assert prime_sums.prime_sum_between(low, 2**64 - 1) == expected
    assert expected > 2**64


def test_mertens_at_powers_of_ten_agrees_with_oeis_a084237():
    for n, value in enumerate(MERTENS_AT_POWERS_OF_TEN[:8]):
        assert facade.mertens(10**n) == value, n


def test_mobius_sieve_agrees_with_sympy():
    low = 10**9 - 500
    assert list(mobius_sums.mobius_between(low, low + 500)) == [
        int(sympy.mobius(n)) for n in range(low, low + 501)]
    assert list(mobius_sums.mobius_between(1, 2000)) == [int(sympy.mobius(n)) for n in range(1, 2001)]


def test_squarefree_count_at_powers_of_ten_agrees_with_oeis_a071172():
    for n, value in enumerate(SQUAREFREE_AT_POWERS_OF_TEN[:15]):
        assert facade.squarefree_count(10**n) == value, n


@pytest.mark.slow
def test_squarefree_count_up_to_ten_to_the_18_agrees_with_oeis_a071172():
    for n in range(15, 19):                      # 10^18 < 2^63; a Möbius sieve up to 10^9
        assert facade.squarefree_count(10**n) == SQUAREFREE_AT_POWERS_OF_TEN[n], n


def test_squarefree_count_agrees_with_sympy_at_small_points():
    running = 0
    for n in range(1, 3000):
        running += sympy.mobius(n) != 0
        assert facade.squarefree_count(n) == running


def test_squarefree_count_beyond_two_to_the_63_is_out_of_reach():
    with pytest.raises(OutOfReachError):
        facade.squarefree_count(2**63)


@pytest.mark.parametrize("kind, offsets", [("triplets_026", (0, 2, 6)), ("triplets_046", (0, 4, 6)),
                                           ("quadruplets", (0, 2, 6, 8))])
def test_constellation_counts_agree_with_sympy(kind, offsets):
    limit = 2 * 10**5
    flags = [False] * (limit + 9)
    for p in sympy.primerange(2, limit + 9):
        flags[p] = True
    counts, running = [0] * (limit + 1), 0
    for x in range(limit + 1):            # a constellation counts once its last member is <= x
        first = x - offsets[-1]
        running += first >= 0 and all(flags[first + d] for d in offsets)
        counts[x] = running
    rng = random.Random(kind)
    for x in list(range(0, 200)) + [rng.randrange(0, limit) for _ in range(30)]:
        assert facade.tuplet_pi(kind, x) == counts[x], (kind, x)


def test_interval_sums_add_up_to_the_whole():
    for function in ("prime_sum", "mertens"):
        whole = facade.answer(function, 10**6).value
        parts = facade.answer(function, 654321).value + facade.interval_sum(
            function, 654322, 10**6).value
        assert parts == whole


def test_known_sums_walk_from_the_nearest_point_to_the_same_values():
    for function in ("prime_sum", "mertens", "triplets_026", "quadruplets"):
        memory = KnownSums(function)
        for x in (10**6, 10**6 + 17, 999_000, 5, 10**6 - 3):
            assert memory.exact(x, 10)[0] == facade.answer(function, x).value, (function, x)


def test_roles_judge_exact_values_and_refuse_negative_sums():
    judge = roles.get("prime_sum").judge
    assert judge((10,), 17, Conventions(), 10).passed
    assert not judge((10,), 18, Conventions(), 10).passed
    assert not judge((10,), -1, Conventions(), 10).passed
    assert roles.get("mertens").judge((3,), -1, Conventions(), 10).passed
    assert roles.get("quadruplet_pi").judge((13,), 1, Conventions(), 10).passed   # (5, 7, 11, 13)
    assert roles.get("triplet_pi_046").judge((13,), 1, Conventions(), 10).passed  # (7, 11, 13)


def test_sum_relations_find_a_decrease_and_a_wrong_difference_beyond_reach():
    role = roles.get("prime_sum")
    answers = {(100,): 1060, (101,): 1000}
    verdicts = {a: role.judge(a, v, Conventions(), 10) for a, v in answers.items()}
    found = role.relations(answers, verdicts, 10)
    assert [v.check for _, _, v in found] == ["monotone"]
    beyond = roles.Verdict("exact", True, None, "none", "", reach=False)
    answers = {(10**6,): facade.prime_sum(10**6), (10**6 + 10,): facade.prime_sum(10**6) + 5}
    found = role.relations(answers, {a: beyond for a in answers}, 10)
    assert [v.check for _, _, v in found] == ["short-interval"]
    assert found[0][2].expected == 1000003          # the only prime in (10^6, 10^6 + 10]


def test_prime_sum_words_are_where_the_sum_crosses_each_word_size():
    listed = list(sympy.primerange(2, 400_000))
    running = 0
    crossings = {}
    for p in listed:
        running += p
        for w in (15, 16, 31, 32):
            if w not in crossings and running >= 2**w:
                crossings[w] = p
    assert {w: _families.PRIME_SUM_WORDS[w] for w in crossings} == crossings


@pytest.mark.slow
def test_prime_sum_word_53_is_where_the_sum_first_reaches_two_to_the_53():
    import numpy as np
    import primesieve

    p = _families.PRIME_SUM_WORDS[53]
    listed = np.array(primesieve.primes(p), dtype=np.uint64)      # the last one is p itself
    below = int(np.sum(listed[:-1], dtype=np.uint64))              # < 2**64: exact in uint64
    assert int(listed[-1]) == p and below < 2**53 <= below + p


@pytest.mark.slow
@pytest.mark.parametrize("w", [63, 64])
def test_prime_sum_words_63_and_64_are_where_the_sum_first_reaches_the_word(w):
    """The climb's answer-word points of prime_sum against Lucy_Hedgehog's method written in
    the tests (tests/_lucy.py, checked against OEIS A046731) and sympy's primality test."""
    from _lucy import prime_sum_by_lucy

    p = _families.PRIME_SUM_WORDS[w]
    previous = sympy.prevprime(p)
    assert sympy.isprime(p)
    assert prime_sum_by_lucy(previous) < 2**w <= prime_sum_by_lucy(p)
    assert prime_sum_by_lucy(p - 1) == prime_sum_by_lucy(previous)


def test_squarefree_words_are_where_q_first_reaches_the_word():
    """Q(x - 1) = 2^w - 1 and Q(x) = 2^w at the points of SQUAREFREE_WORDS, by the identity
    Q(x) = sum mu(d) * (x // d^2) over sympy's Moebius function (an independent computation)."""
    from math import isqrt

    mu = [0] + list(sympy.sieve.mobiusrange(1, isqrt(max(_families.SQUAREFREE_WORDS.values())) + 1))

    def count(x):
        return sum(mu[d] * (x // (d * d)) for d in range(1, isqrt(x) + 1) if mu[d])

    for w, x in _families.SQUAREFREE_WORDS.items():
        assert (count(x - 1), count(x)) == (2**w - 1, 2**w), w


def test_intermediate_words_are_where_the_products_first_reach_the_word():
    """Brute force around each point: x*x and x*(x+1)/2 reach 2^63 or 2^64 first there."""
    found = _families.intermediate_words()
    expected = set()
    for w in (63, 64):
        for f in (lambda x: x * x, lambda x: x * (x + 1) // 2):
            firsts = [x for x in found if f(x - 1) < 2**w <= f(x)]
            assert len(firsts) == 1, (w, found)
            expected.add(firsts[0])
    assert set(found) == expected == {3037000500, 4294967296, 6074001000}
    assert 3037000499**2 < 2**63 <= 3037000500**2
    assert 6074000999 * 6074001000 // 2 < 2**64 <= 6074001000 * 6074001001 // 2


def test_bad_progression_and_summatory_arguments_are_refused():
    with pytest.raises(InvalidInputError):
        facade.interval_sum("pi", 0, 10)
    with pytest.raises(InvalidInputError):
        facade.interval_sum("prime_sum", 0, 10, 3, 1)


def test_prime_pi_mod_agrees_with_sympy_in_every_small_class():
    listed = list(sympy.primerange(2, 10**5 + 1))
    rng = random.Random(4)
    for q in (1, 2, 3, 4, 5, 8, 12, 30, 65537):
        for a in [a for a in range(q) if sympy.gcd(a, q) == 1][:6]:
            for x in (0, 1, 2, 3, 7, rng.randrange(0, 10**5), 10**5):
                expected = sum(1 for p in listed if p <= x and p % q == a)
                assert facade.prime_pi_mod(x, q, a) == expected, (x, q, a)
                assert facade.prime_pi_mod(x, q, a + q) == expected     # a is read modulo q


def test_prime_pi_mod_chebyshev_bias_at_ten_to_the_6():
    # pi(10^6; 4, 3) = 39322 > pi(10^6; 4, 1) = 39175 (from memory; checked here by sympy)
    listed = list(sympy.primerange(2, 10**6 + 1))
    assert sum(1 for p in listed if p % 4 == 3) == 39322
    assert sum(1 for p in listed if p % 4 == 1) == 39175
    assert facade.prime_pi_mod(10**6, 4, 3) == 39322
    assert facade.prime_pi_mod(10**6, 4, 1) == 39175


def test_prime_pi_mod_refuses_a_class_that_is_not_coprime():
    with pytest.raises(InvalidInputError):
        facade.prime_pi_mod(100, 4, 2)
    with pytest.raises(InvalidInputError):
        facade.prime_pi_mod(100, 0, 1)


def test_progression_count_with_a_modulus_above_the_interval():
    assert prime_sums.progression_count_between(10**12 + 39, 97, 0, 1000) == 1
    assert prime_sums.progression_count_between(10**12 + 39, 98, 0, 1000) == 0


def test_prime_pi_mod_role_samples_triples_in_reduced_classes():
    from math import gcd

    from oracle import sampling

    points = sampling.sample(roles.get("prime_pi_mod"), sampling.profile("quick"), seed=3)
    assert all(len(s.arguments) == 3 and gcd(s.arguments[2], s.arguments[1]) == 1 for s in points)
    assert {(q, a) for _, q, a in (s.arguments for s in points)} >= {(1, 0), (4, 5), (65537, 3)}
    assert max(s.arguments[0] for s in points) > 2**32


def test_prime_pi_mod_moduli_family_holds_large_moduli_and_classes_read_modulo_q():
    from math import gcd

    from oracle import sampling

    points = sampling.sample(roles.get("prime_pi_mod"), sampling.profile("ci"), seed=3)
    moduli = [s.arguments for s in points if s.family == "moduli"]
    assert all(gcd(a, q) == 1 for _, q, a in moduli)
    qs = {q for _, q, _ in moduli}
    assert {2**16, 2**31 - 1, 2**31, 2**32 - 1, 2**32, 2**32 + 1, 2**64 + 13} <= qs
    assert any(a >= q for _, q, a in moduli if q > 2**32)             # a read modulo q
    assert any(a == q - 1 for _, q, a in moduli if q > 2**32)
    assert any(q > x for x, q, _ in moduli)
    # kept whole by the heavy caps: their size is x, not the modulus
    assert roles.get("prime_pi_mod").magnitude((1000003, 2**64 + 13, 1)) == 1000003


def test_prime_pi_mod_moduli_triples_agree_with_sympy():
    """The oracle at a sample of the moduli triples, against a count over sympy's primes."""
    import random as _random

    primes = list(sympy.primerange(2, 1000004))
    triples = _families.moduli(2**40, None, None)
    for x, q, a in _random.Random(5).sample(triples, 25) + [(1000003, 2**32 + 1, 1),
                                                              (1000003, 2**64 + 13, 999983)]:
        expected = sum(1 for p in primes if p <= x and p % q == a % q)
        assert facade.prime_pi_mod(x, q, a) == expected, (x, q, a)
    assert facade.prime_pi_mod(1000003, 2**64 + 13, 999983 + 2**64 + 13) == 1


# OEIS A050258, prime quadruplets with largest member < 10^n, n = 1..10 (8 checked here), read on 2026-12-03 with
# the project's search tool (10^n is not prime, so "< 10^n" and "<= 10^n" agree).
QUADRUPLETS_BELOW_POWERS_OF_TEN = [0, 2, 5, 12, 38, 166, 899, 4768, 28388, 180529]


def test_quadruplet_counts_agree_with_oeis_a050258():
    for n, value in enumerate(QUADRUPLETS_BELOW_POWERS_OF_TEN[:8], start=1):
        assert facade.tuplet_pi("quadruplets", 10**n) == value, n


# OEIS A098424, n = 1..103 (its %S, %T, %U data lines, read on 2026-12-03 with the project's search tool):
# prime triples (p, q, p + 6) of both patterns counted by their smallest member p <= n, so
# A098424(n) = triplet_pi_026(n + 6) + triplet_pi_046(n + 6) in our convention.
A098424 = [int(t) for t in (
    "0,0,0,0,1,1,2,2,2,2,3,3,4,4,4,4,5,5,5,5,5,5,5,5,5,5,5,5,5,5,5,5,5,5,"
    "5,5,6,6,6,6,7,7,7,7,7,7,7,7,7,7,7,7,7,7,7,7,7,7,7,7,7,7,7,7,7,7,8,8,"
    "8,8,8,8,8,8,8,8,8,8,8,8,8,8,8,8,8,8,8,8,8,8,8,8,8,8,8,8,9,9,9,9,10,10,11").split(",")]


def test_triplet_counts_of_both_patterns_agree_with_oeis_a098424():
    for n, value in enumerate(A098424, start=1):
        both = facade.tuplet_pi("triplets_026", n + 6) + facade.tuplet_pi("triplets_046", n + 6)
        assert both == value, n
