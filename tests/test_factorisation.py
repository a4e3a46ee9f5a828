"""oracle.exact.factorisation against sympy.factorint (a test-only reference)."""

import random

import pytest
import sympy

from oracle import InvalidInputError
from oracle.exact import factorisation


def reference(n):
    return {int(p): int(e) for p, e in sympy.factorint(n).items()}


def test_every_n_below_five_thousand():
    for n in range(1, 5000):
        assert factorisation.factorise(n, 10)[0] == reference(n), n


def test_random_numbers_up_to_2_to_the_66_and_hard_shapes():
    rng = random.Random(15)
    shapes = [2**64 + 1, 2**64 - 1, 1009**2, 1018081 * 1013, (2**31 - 1) ** 2, 3**40,
              int(sympy.nextprime(2**32)) * int(sympy.nextprime(2**33)),
              int(sympy.nextprime(2**20)) ** 3 * int(sympy.nextprime(2**30))]
    for n in [rng.randrange(1, 2**66) for _ in range(200)] + shapes:
        found, verdict = factorisation.factorise(n, 30)
        assert found == reference(n), n
        assert verdict == "deterministic"


def test_a_factor_above_the_deterministic_bound_is_probable():
    p = int(sympy.nextprime(2**90))
    found, verdict = factorisation.factorise(6 * p, 10)
    assert found == {2: 1, 3: 1, p: 1} and verdict == "probable"


def test_spent_time_raises_too_slow():
    p, q = int(sympy.nextprime(2**59)), int(sympy.nextprime(2**60))
    with pytest.raises(factorisation.TooSlow):
        factorisation.factorise(p * q, 0.05)


@pytest.mark.parametrize("bad", [0, -5, 2.0, True, "12"])
def test_bad_input_is_refused(bad):
    with pytest.raises(InvalidInputError):
        factorisation.factorise(bad, 1)
