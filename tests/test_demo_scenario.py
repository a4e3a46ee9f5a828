"""The demo scenario (oracle.demo): its defects are real, its sound roles are sound.

References are outside the project: sympy, primecountpy and gmpy2 as test-only
libraries, and published OEIS values named beside each check.
"""

from __future__ import annotations

import ast
import math
import pathlib
import random
import sys

import gmpy2
import pytest
import sympy
from sympy.ntheory.primetest import mr as sympy_strong_test

from oracle import roles
from oracle.demo import SCENARIO, Defect, SoundRole
from oracle.demo.brindle import (counting, factoring, listing, primality, sequence,
                                 table)
from oracle.targets import load_callable
from _references import primecountpy

LIBRARY_DIRECTORY = pathlib.Path(table.__file__).parent


def call(entry, arguments):
    return load_callable(entry.target)(*arguments)


# -- the scenario as a document --------------------------------------------------- #

def test_at_least_five_defective_roles_and_one_sound_role():
    defective = {defect.role for defect in SCENARIO.defects}
    sound = {entry.role for entry in SCENARIO.sound}
    assert len(defective) >= 5 and len(sound) >= 1
    assert not defective & sound
    assert defective | sound <= set(roles.ROLES)


@pytest.mark.parametrize("entry", [*SCENARIO.defects, *SCENARIO.sound], ids=lambda e: e.role)
def test_every_target_loads_and_is_named_after_its_role(entry):
    module, _, function = entry.target.partition(":")
    assert module.startswith("oracle.demo.brindle.")
    assert callable(load_callable(entry.target))
    assert roles.infer(function) == entry.role


@pytest.mark.parametrize("defect", SCENARIO.defects, ids=lambda d: d.role)
def test_witness_and_ordinary_input_lie_inside_the_declared_domain(defect):
    if defect.maximum is not None:
        assert max(defect.witness) <= defect.maximum
        assert max(defect.ordinary) <= defect.maximum
        assert defect.first_wrong <= defect.maximum


def test_the_story_is_the_invented_one():
    # A light check: the organisation is the invented Brindlewick observatory, and
    # every piece of scenario text speaks of it or of the brindle library only.
    assert SCENARIO.organisation.startswith("Brindlewick Municipal Observatory")
    assert "invented" in SCENARIO.organisation and "invented" in SCENARIO.history
    assert SCENARIO.library == "brindle" and "brindle" in SCENARIO.history
    capitalised = {word.strip(".,'()") for word in SCENARIO.history.split() if word[:1].isupper()}
    assert capitalised <= {"The", "Brindlewick", "Municipal", "Observatory", "It", "FORTRAN",
                           "C", "Python", "PC", "In"}


def test_the_library_uses_only_the_standard_library():
    for path in LIBRARY_DIRECTORY.glob("*.py"):
        tree = ast.parse(path.read_text())
        for node in ast.walk(tree):
            if isinstance(node, ast.Import):
                names = [alias.name for alias in node.names]
            elif isinstance(node, ast.ImportFrom) and node.level == 0:
                names = [node.module]
            else:
                continue
            for name in names:
                assert name.split(".")[0] in sys.stdlib_module_names, f"{path.name} imports {name}"


def test_discrepancies_name_what_the_scenario_does_not_document():
    documented = {role: isinstance(SCENARIO.entry(role), SoundRole) for role in SCENARIO.roles()}
    assert SCENARIO.discrepancies(documented) == []
    flipped = {**documented, "factor": True, "next_prime": False}
    assert SCENARIO.discrepancies(flipped) == [
        "factor: the documented defect was not found",
        "next_prime: documented as correct, but the audit failed"]
    missing = {role: value for role, value in documented.items() if role != "twin_pi"}
    assert SCENARIO.discrepancies(missing) == ["twin_pi: not audited"]


# -- every documented defect is real ------------------------------------------------ #

def reference(role: str, arguments: tuple):
    """The true answer, from a test-only reference library."""
    if role == "prime_pi":
        (x,) = arguments
        return int(primecountpy.prime_pi(x)) if x >= 2 else 0
    if role == "twin_pi":
        (x,) = arguments
        return sum(1 for p in sympy.primerange(2, x - 1) if sympy.isprime(p + 2))
    if role == "is_prime":
        return bool(sympy.isprime(arguments[0]))
    if role == "primes_in":
        a, b = arguments
        return list(sympy.primerange(a, b + 1))
    if role == "factor":
        return {int(p): e for p, e in sympy.factorint(arguments[0]).items()}
    if role == "nth_prime":
        return int(primecountpy.nth_prime(arguments[0]))
    if role == "next_prime":
        return int(sympy.nextprime(arguments[0]))
    raise AssertionError(role)


@pytest.mark.parametrize("defect", SCENARIO.defects, ids=lambda d: d.role)
def test_defect_is_wrong_at_its_witness(defect):
    assert call(defect, defect.witness) != reference(defect.role, defect.witness)


@pytest.mark.parametrize("defect", SCENARIO.defects, ids=lambda d: d.role)
def test_defect_is_right_at_its_ordinary_input(defect):
    assert call(defect, defect.ordinary) == reference(defect.role, defect.ordinary)


def test_prime_pi_block_tally_wrap_against_published_values():
    # OEIS A007053: pi(2^20) = 82025 (from memory; primecountpy agrees below).
    assert primecountpy.prime_pi(2**20) == 82025
    assert counting.prime_pi(2**20) == 82025 - 65536
    # OEIS A006880: pi(10^6) = 78498, below the first block boundary, is right.
    assert counting.prime_pi(10**6) == 78498
    # pi(10^7) = 664579 (OEIS A006880): the wrapped tallies of the low blocks show there too.
    assert counting.prime_pi(10**7) != 664579
    assert (664579 - counting.prime_pi(10**7)) % 65536 == 0


def test_prime_pi_first_goes_wrong_at_its_first_wrong_point():
    first = SCENARIO.entry("prime_pi").first_wrong
    below = [first - 1, first - 2] + random.Random(20).sample(range(first - 1), 200)
    for x in below:
        assert counting.prime_pi(x) == (primecountpy.prime_pi(x) if x >= 2 else 0), x
    assert counting.prime_pi(first) != primecountpy.prime_pi(first)


def test_twin_pi_forgets_three_and_five_against_published_values():
    # OEIS A007508: pi_2(10) = 2, pi_2(10^3) = 35, pi_2(10^6) = 8169 (from memory;
    # the independent sympy count in reference() agrees for the first two).
    for x, published in ((10, 2), (10**3, 35), (10**6, 8169)):
        assert counting.twin_pi(x) == published - 1
    assert reference("twin_pi", (10**3,)) == 35
    for x in range(0, 5):
        assert counting.twin_pi(x) == 0 == reference("twin_pi", (x,))
    assert SCENARIO.entry("twin_pi").first_wrong == 5


def test_is_prime_fooled_by_the_smallest_strong_pseudoprime_to_bases_2_3_5_7():
    witness = SCENARIO.entry("is_prime").first_wrong
    # OEIS A014233: 3215031751 is the smallest strong pseudoprime to bases 2, 3, 5, 7
    # (from memory; its defining property is checked here with sympy).
    assert witness == 3215031751 < 2**32
    assert sympy.factorint(witness) == {151: 1, 751: 1, 28351: 1}
    assert sympy_strong_test(witness, [2, 3, 5, 7]) and not sympy_strong_test(witness, [11])
    assert primality.is_prime(witness) is True
    # OEIS A014233: 2047 (base 2) and 1373653 (bases 2, 3) are caught by the extra bases.
    assert primality.is_prime(2047) is False and primality.is_prime(1373653) is False


def test_is_prime_is_right_on_small_and_random_inputs_below_the_witness():
    rng = random.Random(21)
    points = list(range(0, 3000)) + [rng.randrange(3000, 3215031751) for _ in range(300)]
    for n in points:
        assert primality.is_prime(n) == sympy.isprime(n), n


def test_primes_in_loses_every_prime_just_below_a_segment_boundary():
    first = SCENARIO.entry("primes_in").first_wrong
    # The smallest prime of the form m * 2^15 - 1, computed independently.
    lost = next(m * 2**15 - 1 for m in range(1, 100) if sympy.isprime(m * 2**15 - 1))
    assert first == lost == 2**17 - 1
    assert listing.primes_in(0, first - 1) == list(sympy.primerange(0, first))
    truth = list(sympy.primerange(0, 2**20 + 1))
    got = listing.primes_in(0, 2**20)
    assert sorted(set(truth) - set(got)) == [p for p in truth if p % 2**15 == 2**15 - 1]
    assert set(got) <= set(truth)
    assert listing.primes_in(2**19 - 1, 2**19 - 1) == []          # 2^19 - 1 is prime (M19)


def test_factor_trusts_the_square_of_a_wieferich_prime():
    witness = SCENARIO.entry("factor").first_wrong
    assert witness == 1093**2
    assert sympy_strong_test(witness, [2]) and not sympy.isprime(witness)
    assert factoring.factor(witness) == {witness: 1}
    assert factoring.factor(30 * witness) == {2: 1, 3: 1, 5: 1, witness: 1}
    # 25326001 = 2251 * 11251, a strong pseudoprime to bases 2, 3, 5 (OEIS A014233, from memory).
    assert factoring.factor(25326001) == {25326001: 1}
    assert sympy.factorint(25326001) == {2251: 1, 11251: 1}


def test_factor_first_wrong_is_the_smallest_base_2_strong_pseudoprime_free_of_small_primes():
    # A composite cofactor with no prime factor below 1000 is at least 1009^2; the
    # smallest strong pseudoprime to base 2 of that kind is where factor first fails.
    first = SCENARIO.entry("factor").first_wrong
    small = math.prod(factoring.TRIAL_PRIMES)
    fooling = next(n for n in range(1009**2, first + 1, 2)
                   if math.gcd(n, small) == 1 and sympy_strong_test(n, [2]) and not sympy.isprime(n))
    assert fooling == first


def test_factor_right_on_euler_example_and_random_inputs():
    # Euler (1732): 2^32 + 1 = 641 * 6700417.
    assert factoring.factor(2**32 + 1) == {641: 1, 6700417: 1}
    assert factoring.factor(1) == {}
    rng = random.Random(22)
    for n in [rng.randrange(1, 10**6) for _ in range(200)] + [rng.randrange(1, 2**40) for _ in range(20)]:
        assert factoring.factor(n) == reference("factor", (n,)), n


# -- the sound roles are sound -------------------------------------------------------- #

def sound_points(maximum: int, seed: int) -> list[int]:
    rng = random.Random(seed)
    fixed = [0, 1, 2, 3, 4, 5, 10, 100, 2**16 - 1, 2**16, 2**16 + 1, 2**24 - 3, 2**24 - 1,
             2**24, 2**32 - 1, 2**32, 2**32 + 1, 2**64 - 1, 2**64]
    uniform = [rng.randrange(0, maximum + 1) for _ in range(100)]
    log_uniform = [int(2 ** rng.uniform(1, math.log2(maximum))) for _ in range(200)]
    return sorted({x for x in fixed + uniform + log_uniform if x <= maximum})


def test_nth_prime_agrees_with_primecountpy():
    entry = SCENARIO.entry("nth_prime")
    # OEIS A007053: pi(2^24) = 1077871 (from memory), the table's last index.
    assert entry.maximum == primecountpy.prime_pi(2**24) == 1077871
    points = [n for n in sound_points(entry.maximum, 23) if n >= 1] + [entry.maximum]
    assert len(points) > 250
    for n in points:
        assert sequence.nth_prime(n) == primecountpy.nth_prime(n), n


def test_next_prime_agrees_with_sympy_and_gmpy2():
    entry = SCENARIO.entry("next_prime")
    points = sound_points(entry.maximum, 24)
    assert len(points) > 250 and points[-1] == 2**64
    for n in points:
        got = primality.next_prime(n)
        assert got == sympy.nextprime(n) == gmpy2.next_prime(n), n
    assert primality.next_prime(2**64) == 2**64 + 13           # sympy and gmpy2 agree above


def test_next_prime_at_strong_pseudoprimes_to_its_bases_and_table_edge():
    # Pseudoprimes that fool shorter base sets (OEIS A014233, from memory) must be stepped over.
    for n in (3215031751, 2152302898747, 3474749660383, 341550071728321, 3825123056546413051):
        assert primality.next_prime(n - 1) == sympy.nextprime(n - 1)
    assert primality.next_prime(2**24 - 3) == sympy.nextprime(2**24 - 3)


@pytest.mark.parametrize("function, arguments", [
    (counting.prime_pi, (2**24 + 1,)), (counting.twin_pi, (2**24 + 1,)),
    (sequence.nth_prime, (1077872,)), (sequence.nth_prime, (0,)),
    (primality.next_prime, (2**64 + 1,)), (primality.next_prime, (-1,)),
    (listing.primes_in, (0, 2**32 + 1)), (listing.primes_in, (-5, 10)),
    (factoring.factor, (0,)),
])
def test_outside_its_domain_the_library_refuses_instead_of_guessing(function, arguments):
    with pytest.raises(ValueError):
        function(*arguments)


@pytest.mark.parametrize("function", [counting.prime_pi, primality.is_prime, factoring.factor])
def test_non_integers_are_refused(function):
    with pytest.raises(TypeError):
        function(10.0)


# -- the audit finds exactly the documented defects ------------------------------------ #

@pytest.mark.slow
def test_ci_audit_finds_exactly_the_documented_defects(tmp_path):
    from oracle import engine, targets

    passed = {}
    for role in SCENARIO.roles():
        entry = SCENARIO.entry(role)
        target = targets.python_target(entry.target, role_name=role, timeout=10.0)
        try:
            summary = engine.run_audit(target, engine.AuditOptions(
                role=role, profile="ci", seed=11, maximum=entry.maximum))
        finally:
            target.close()
        passed[role] = summary["passed"]
        divergence = summary["first_divergence"]
        if isinstance(entry, Defect) and role in ("prime_pi", "twin_pi"):
            assert divergence["input"] == [entry.first_wrong]
        if isinstance(entry, Defect) and role == "primes_in":
            assert divergence["prime"] == entry.first_wrong
        if isinstance(entry, Defect) and role in ("is_prime", "factor"):
            assert divergence["input"][0] >= entry.first_wrong
    assert SCENARIO.discrepancies(passed) == []
