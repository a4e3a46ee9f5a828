"""oracle.exact.factoring and facade.answer("factor"): against sympy.factorint (test-only reference)."""

from __future__ import annotations

import random
import time

import pytest
import sympy

from oracle import facade
from oracle._errors import InvalidInputError, OutOfReachError
from oracle.exact import factoring


def _random_composites(count: int, seed: int) -> list[int]:
    rng = random.Random(seed)
    numbers = []
    for _ in range(count):
        n = 1
        for _ in range(rng.randint(1, 5)):
            n *= int(sympy.randprime(2, 2 ** rng.randint(2, 40))) ** rng.randint(1, 3)
        numbers.append(n)
    return numbers


@pytest.mark.parametrize("n", [1, 2, 4, 97 ** 2, 2 ** 64 + 1, 3215031751, 1194649,
                               2 ** 32 - 1, 10 ** 18 + 9, *_random_composites(30, 12)])
def test_factorise_agrees_with_sympy(n):
    assert dict(factoring.factorise(n, time.monotonic() + 30)) == sympy.factorint(n)   # sympy


def test_factor_answer_is_sorted_pairs_with_its_provenance():
    answer = facade.answer("factor", 2 ** 64 + 1)
    assert answer.value == [(274177, 1), (67280421310721, 1)]     # sympy.factorint agrees above
    assert answer.provenance.endswith("factors deterministic")
    big = facade.answer("factor", 3 * (2 ** 127 - 1))              # a Mersenne prime factor
    assert big.value == [(3, 1), (2 ** 127 - 1, 1)] and big.provenance.endswith("factors probable")
    assert sympy.isprime(2 ** 127 - 1)


def test_factor_out_of_budget_raises_out_of_reach():
    hard = int(sympy.nextprime(10 ** 25)) * int(sympy.nextprime(10 ** 26))
    with pytest.raises(OutOfReachError, match="not split"):
        facade.answer("factor", hard, budget=0.2)


@pytest.mark.parametrize("n", [0, -6, 2.0, True])
def test_factor_refuses_bad_input(n):
    with pytest.raises(InvalidInputError):
        facade.answer("factor", n)
