"""Checks shared by next_prime and prev_prime: the neighbouring prime of n."""

from __future__ import annotations

from .. import facade
from ._role import Conventions, Verdict, as_integer


def normalise_prime(raw: object, conventions: Conventions) -> int:
    return as_integer(raw)


def judge_neighbour(function: str):
    """The judge: equality with the oracle's neighbour, with a hint at what went wrong."""

    def judge(arguments: tuple, got: int, conventions: Conventions, budget: float | None) -> Verdict:
        (n,) = arguments
        reference = facade.answer(function, n)
        if got == reference.value:
            return Verdict("exact", True, got, reference.provenance)
        if got == n:
            hint = f"returned n itself; {function} must be strictly {'above' if function == 'next_prime' else 'below'} n"
        elif got < 2 or not facade.is_prime(got):
            hint = f"{got} is not prime"
        else:
            hint = f"{got} is prime but not the nearest {'above' if function == 'next_prime' else 'below'} {n}"
        return Verdict("exact", False, reference.value, reference.provenance,
                       f"got {got}, expected {reference.value}: {hint}")

    return judge
