"""The nth_prime role: nth_prime(n) = p_n, the n-th prime, with nth_prime(1) = 2.

Within reach the answer is compared with the oracle's p_n (equivalently:
the answer is prime and π(answer) = n).  Beyond reach it must be prime and lie
within the proven bounds for p_n (:func:`oracle.claims.check_nth_prime`).
Across answers, p_n is strictly increasing in n.
"""

from __future__ import annotations

import bisect
import functools

from .. import claims, facade
from .._errors import OutOfReachError
from ._role import Conventions, Role, Verdict, as_integer


def _normalise(raw: object, conventions: Conventions) -> int:
    return as_integer(raw)


#: p_n for n up to π(SMALL_LIMIT) comes from one sieve, kept for the run.
SMALL_LIMIT = 10**7


@functools.lru_cache(maxsize=1)
def _small_primes() -> list[int]:
    return facade.primes(0, SMALL_LIMIT)


def _judge(arguments: tuple, got: int, conventions: Conventions, budget: float | None) -> Verdict:
    (n,) = arguments
    small = _small_primes()
    if n <= len(small):
        expected = small[n - 1]
        passed = got == expected
        return Verdict("exact", passed, expected, "sieve", "" if passed else (
            f"got {got}, expected {expected}"
            + ("" if got < 2 or not facade.is_prime(got) else
               f" (the candidate's answer is p_{bisect.bisect_right(small, got)})"
               if got <= small[-1] else "")))
    try:
        results = claims.check_nth_prime(n, got, budget=budget)
    except OutOfReachError as error:
        return Verdict("proven-interval", True, None, "none", str(error), reach=False)
    failing = [result for result in results if not result.passed]
    result = failing[0] if failing else results[0]
    detail = result.detail or ("" if result.passed else f"got {got}, expected {result.expected}")
    return Verdict(result.check, result.passed, result.expected, result.provenance, detail)


def _relations(answers: dict, verdicts: dict, budget: float | None) -> list:
    points = sorted((arguments[0], value) for arguments, value in answers.items())
    for (n0, p0), (n1, p1) in zip(points, points[1:]):
        if p1 <= p0:
            return [((n0, n1), p1, Verdict("increasing", False, f"> {p0}", "definition",
                                           f"nth_prime({n1}) = {p1} <= nth_prime({n0}) = {p0}"))]
    return []


ROLE = Role(
    name="nth_prime", arity=1, minimum=1, counting=True,
    signature="nth_prime(n) -> int: the n-th prime, n >= 1, nth_prime(1) = 2",
    normalise=_normalise, judge=_judge, relations=_relations,
    invalid_inputs=((0,), (-1,)),
    families=("exhaustive", "tables", "prime-indices", "boundaries", "uniform", "log-uniform"),
)
