"""Constructed ground truth: numbers built from certified primes, registered for the oracle.

Each construction is re-checked here from its definition (the product equals n, every
certificate verifies) and the oracle's values are compared with sympy applied to each
prime power separately (multiplicativity; sympy factors p**e by its perfect-power test).
"""

import math
import random

import pytest
import sympy

from oracle import InvalidInputError, adversarial, facade, roles, sampling
from oracle.adversarial import _constructed
from oracle.roles import Conventions
from oracle.sampling import _families

SYMPY = {"mobius": sympy.mobius, "totient": sympy.totient,
         "divisor_count": sympy.divisor_count, "divisor_sum": lambda n: sympy.divisor_sigma(n, 1)}


def by_prime_powers(name, factorisation):
    return math.prod(int(SYMPY[name](p**e)) for p, e in factorisation.items())


@pytest.mark.parametrize("shape", [((128, 1), (130, 1)), ((256, 1),), ((100, 2), (90, 1), (2, 3)),
                                   ((300, 1), (280, 1), (500, 1)), ((20, 3), (520, 1))])
def test_constructed_number_verifies_and_the_oracle_answers_from_it(shape):
    built = adversarial.register(adversarial.construct(shape, random.Random(str(shape))))
    assert built.n.bit_length() >= 256 - 2
    assert math.prod(p**e for p, e in built.factorisation.items()) == built.n
    assert all(adversarial.verify_certificate(c) for c, _ in built.factors)
    assert all(sympy.isprime(p) for p in built.factorisation)       # an independent test
    for name in SYMPY:
        answer = facade.answer(name, built.n)
        assert answer.provenance == "constructed: certified factors"
        assert answer.value == by_prime_powers(name, built.factorisation), name
    assert facade.factorization(built.n) == built.factorisation


def test_a_forged_construction_is_refused():
    good = adversarial.construct(((64, 1), (64, 1)), random.Random(1))
    forged = _constructed.ConstructedNumber(good.n + 2, good.factors)
    with pytest.raises(InvalidInputError):
        adversarial.register(forged)
    assert adversarial.known(good.n + 2) is None
    false_prime = adversarial.PrimeCertificate(2**64 + 1, good.factors[0][0].factored_part,
                                               good.factors[0][0].witnesses, good.factors[0][0].proofs)
    with pytest.raises(InvalidInputError):
        adversarial.register(_constructed.ConstructedNumber(2**64 + 1, ((false_prime, 1),)))


def test_the_register_keeps_the_newest():
    first = adversarial.register(adversarial.construct(((30, 1),), random.Random(2)))
    rng = random.Random(3)
    for _ in range(_constructed.REGISTER_SIZE):
        adversarial.register(adversarial.construct(((40, 1), (12, 1)), rng))
    assert adversarial.known(first.n) is None


def test_factor_role_compares_with_the_certified_factorisation():
    built = adversarial.register(adversarial.construct(((200, 1), (24, 2)), random.Random(4)))
    role = roles.get("factor")
    right = role.judge((built.n,), role.normalise(built.factorisation, Conventions()),
                       Conventions(), 5.0)
    assert right.passed and right.provenance == "constructed: certified factors"
    (q, _), (p, _) = sorted(built.factorisation.items())
    wrong = role.judge((built.n,), role.normalise({q * q * p: 1}, Conventions()), Conventions(), 5.0)
    assert not wrong.passed and "composite" in wrong.detail


def test_sampled_family_registers_its_points_within_the_ceiling():
    points = _families.constructed(2**66, sampling.profile("ci"), random.Random(5))
    assert points and max(points) <= 2**66
    for n in points:
        built = adversarial.known(n)
        assert built is not None and built.verify()
        assert built.factorisation == {int(p): int(e) for p, e in sympy.factorint(n).items()}


def test_climb_builds_registered_numbers_far_above_any_factoriser():
    from oracle.engine import _reach_bits

    for role_name in ("totient", "factor"):
        inputs = _reach_bits._step_inputs(role_name, 1024, random.Random(6))
        for n in inputs:
            assert 2**1000 < n < 2**1025
            built = adversarial.known(n)
            assert built is not None and built.verify()


@pytest.mark.slow
def test_audit_of_a_fast_candidate_climbs_on_constructed_numbers_to_the_top(tmp_path):
    """A mobius built on python-flint (a test-only reference) answers the quick profile's climb
    up to 2^512; every climbing point is judged from its construction."""
    import json

    from _references import flint
    from oracle import engine, targets

    flint.fmpz(1)                                   # skips the test without python-flint
    (tmp_path / "flint_mobius.py").write_text(
        "import flint\n\ndef mobius(n):\n    return int(flint.fmpz(n).moebius_mu())\n")
    target = targets.python_target("flint_mobius:mobius", role_name="mobius", timeout=10,
                                   isolate=True, python_path=[str(tmp_path)])
    stream = tmp_path / "run.jsonl"
    try:
        summary = engine.run_audit(target, engine.AuditOptions(role="mobius", profile="quick",
                                                               seed=1, stream=str(stream)))
    finally:
        target.close()
    assert summary["passed"]
    records = [json.loads(line) for line in stream.read_text().splitlines()]
    climbed = [r for r in records if r.get("type") == "check" and r["family"] == "climb-bits"]
    assert max(r["arguments"][0] for r in climbed) > 2**500
    assert {r["provenance"] for r in climbed} == {"constructed: certified factors"}
