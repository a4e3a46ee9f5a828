"""The oracle's Moebius, totient and divisor functions, and the four roles judging with them.

References: OEIS A008683, A000010, A000005, A000203 (first terms from memory, each
cross-checked by sympy below) and sympy itself (test-only).
"""

import random

import pytest
import sympy

from oracle import InvalidInputError, OutOfReachError, facade, roles
from oracle.roles import Conventions

FIRST_TERMS = {  # n = 1..20 (from memory; cross-checked by sympy in the first test)
    "mobius": [1, -1, -1, 0, -1, 1, -1, 0, 0, 1, -1, 0, -1, 1, 1, 0, -1, 0, -1, 0],    # OEIS A008683
    "totient": [1, 1, 2, 2, 4, 2, 6, 4, 6, 4, 10, 4, 12, 6, 8, 8, 16, 6, 18, 8],      # OEIS A000010
    "divisor_count": [1, 2, 2, 3, 2, 4, 2, 4, 3, 4, 2, 6, 2, 4, 4, 5, 2, 6, 2, 6],    # OEIS A000005
    "divisor_sum": [1, 3, 4, 7, 6, 12, 8, 15, 13, 18, 12, 28, 14, 24, 24, 31, 18, 39, 20, 42],  # A000203
}
SYMPY = {"mobius": sympy.mobius, "totient": sympy.totient,
         "divisor_count": sympy.divisor_count, "divisor_sum": lambda n: sympy.divisor_sigma(n, 1)}
NAMES = tuple(SYMPY)


@pytest.mark.parametrize("name", NAMES)
def test_first_terms_agree_with_oeis_and_sympy(name):
    terms = FIRST_TERMS[name]
    assert [int(SYMPY[name](n)) for n in range(1, 21)] == terms
    assert [facade.answer(name, n).value for n in range(1, 21)] == terms


@pytest.mark.parametrize("name", NAMES)
def test_values_agree_with_sympy_small_and_large(name):
    rng = random.Random(name)
    points = list(range(1, 3000)) + [rng.randrange(1, 2**64) for _ in range(40)] + [
        2**64 + 1, 2**63, 3 * 2**62, 1009**2, 2**5 * 3**3 * 5 * 7**2 * 11 * 13, 3**40]
    for n in points:
        answer = facade.answer(name, n)
        assert answer.value == int(SYMPY[name](n)), (name, n)
        assert answer.provenance == "factorised+deterministic"


def test_public_functions_and_factorization():
    assert facade.mobius(30) == -1 and facade.totient(36) == 12
    assert facade.divisor_count(36) == 9 and facade.divisor_sum(36) == 91
    assert facade.factorization(2**32 + 1) == {641: 1, 6700417: 1}      # Euler
    assert facade.answer("factorization", 1).value == []


@pytest.mark.parametrize("name", NAMES + ("factorization",))
@pytest.mark.parametrize("bad", [0, -3, 1.5, True, "10"])
def test_bad_input_is_refused(name, bad):
    with pytest.raises(InvalidInputError):
        facade.answer(name, bad)


def test_beyond_the_budget_is_out_of_reach():
    n = int(sympy.nextprime(2**70)) * int(sympy.nextprime(2**71))
    with pytest.raises(OutOfReachError):
        facade.answer("totient", n, budget=0.05)


def judge(name, n, raw):
    role = roles.get(name)
    return role.judge((n,), role.normalise(raw, Conventions()), Conventions(), 5.0)


@pytest.mark.parametrize("name", NAMES)
def test_role_passes_the_right_value_and_fails_a_wrong_one(name):
    n = 2**5 * 3**3 * 5 * 7**2 * 11 * 13
    right = int(SYMPY[name](n))
    verdict = judge(name, n, right)
    assert verdict.passed and verdict.check == "exact" and verdict.expected == right
    wrong = judge(name, n, right + 1)
    assert not wrong.passed and wrong.expected == right
    assert roles.get(name).minimum == 1 and roles.get(name).families[-1] == "constructed"


def test_roles_are_registered_and_inferred():
    assert {"mobius", "totient", "divisor_count", "divisor_sum"} <= set(roles.ROLES)
    assert roles.infer("totient") == "totient" and roles.infer("divisor_sigma") == "divisor_sum"
    with pytest.raises(InvalidInputError):          # only role names and listed aliases
        roles.infer("my_totient")
    assert roles.infer("moebius") == "mobius" and roles.infer("num_divisors") == "divisor_count"


def test_float_answer_is_a_wrong_type():
    from oracle.roles import WrongType

    with pytest.raises(WrongType):
        roles.get("totient").normalise(4.0, Conventions())


def test_command_line_value_of_the_arithmetic_functions(capsys):
    import json

    from oracle.cli import main

    assert main(["value", "totient", "2**32+1"]) == 0          # (641 - 1)(6700417 - 1), sympy agrees
    assert f"= {int(sympy.totient(2**32 + 1))}" in capsys.readouterr().out
    assert main(["value", "divisor_sum", "360", "--json"]) == 0
    shown = json.loads(capsys.readouterr().out)
    assert shown["value"] == int(sympy.divisor_sigma(360, 1))
    assert shown["provenance"] == "factorised+deterministic"
    assert main(["value", "mobius", "0"]) == 2
    hard = int(sympy.nextprime(2**70)) * int(sympy.nextprime(2**71))
    assert main(["value", "mobius", str(hard), "--budget", "0.05"]) == 3
    assert "out of exact reach" in capsys.readouterr().err
