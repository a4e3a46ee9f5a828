"""The nth_prime role: nth_prime(n) = p_n, the n-th prime, with nth_prime(1) = 2.

Within reach the answer is compared with the oracle's p_n.  Up to
π(10⁷) the reference is one sieve, kept for the process.  Above it an answer
g is right exactly when g is prime and π(g) = n; π(g) comes from the run's
memory of exact counts (:mod:`oracle.roles._known_counts`), so that one short
sieve from the previous point replaces a sieve from 0.  When π(g) = c ≠ n, g
is p_c, and p_n is found by listing the primes between: from g itself when c
is near n, otherwise from a point q near p_n (Cipolla's 1902 asymptotic
expansion, Math. Ann. 56, as a first guess only) whose count π(q) is exact.
Beyond reach the answer must be prime and lie within the proven bounds for
p_n (:func:`oracle.claims.check_nth_prime`).  Across answers, p_n is strictly
increasing in n.
"""

from __future__ import annotations

import bisect
import functools
import math

from .. import claims, facade
from .._errors import OutOfReachError
from ._known_counts import KnownCounts, join_provenance
from ._role import Conventions, Role, Verdict, as_integer


def _normalise(raw: object, conventions: Conventions) -> int:
    return as_integer(raw)


#: p_n for n up to π(SMALL_LIMIT) comes from one sieve, kept for the run.
SMALL_LIMIT = 10**7
#: Index distances |c − n| up to which p_n is found by listing primes from p_c itself.
LISTING_REACH = 10**5


@functools.lru_cache(maxsize=1)
def _small_primes() -> list[int]:
    return facade.primes(0, SMALL_LIMIT)


def _memory() -> KnownCounts:
    return KnownCounts("pi")


def _judge(arguments: tuple, got: int, conventions: Conventions, budget: float | None,
           *, memory: KnownCounts | None = None) -> Verdict:
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
        return _judge_by_count(n, got, memory if memory is not None else _memory(), budget)
    except OutOfReachError:
        pass
    try:
        results = claims.check_nth_prime(n, got, budget=budget)
    except OutOfReachError as error:
        return Verdict("proven-interval", True, None, "none", str(error), reach=False)
    failing = [result for result in results if not result.passed]
    result = failing[0] if failing else results[0]
    detail = result.detail or ("" if result.passed else f"got {got}, expected {result.expected}")
    return Verdict(result.check, result.passed, result.expected, result.provenance, detail)


def _judge_by_count(n: int, got: int, memory: KnownCounts, budget: float | None) -> Verdict:
    """g = p_n exactly when g is prime and π(g) = n."""
    from .. import bounds

    interval = bounds.nth_prime(n)
    inside = ((interval.lower is None or got >= interval.lower)
              and (interval.upper is None or got <= interval.upper))
    primality = facade.answer("is_prime", got) if got >= 2 else None
    prime = primality is not None and primality.value
    if inside and prime:
        count, provenance = memory.exact(got, budget)
        provenance = join_provenance(provenance, primality.provenance)
        if count == n:
            return Verdict("exact", True, got, provenance)
        expected, provenance = _locate(n, (got, count, provenance), memory, budget)
        return Verdict("exact", False, expected, provenance,
                       f"got {got}, expected {expected} (the candidate's answer is p_{count})")
    expected, provenance = _locate(n, None, memory, budget)
    reason = "not prime" if not prime else "outside the proven interval for p_n"
    return Verdict("exact", False, expected, provenance, f"got {got} ({reason}), expected {expected}")


def _locate(n: int, known: tuple[int, int, str] | None, memory: KnownCounts,
            budget: float | None) -> tuple[int, str]:
    """p_n from a prime count known nearby: ``known`` = (q, π(q), provenance) or a fresh guess."""
    if known is None or abs(known[1] - n) > LISTING_REACH:
        guess = _cipolla_guess(n)
        count, provenance = memory.exact(guess, budget)
        known = (guess, count, provenance)
    q, count, provenance = known
    log_q = max(math.log(q), 1.0)
    wanted = abs(count - n) + 1
    width = int(2 * wanted * log_q) + 1000
    while True:
        if count >= n:
            # p_n is the (count - n + 1)-th prime <= q, counted downwards.
            listed = facade.primes(max(q - width, 0), q)
            if len(listed) >= wanted or q - width <= 0:
                return listed[len(listed) - wanted], join_provenance(provenance, "sieve")
        else:
            # p_n is the (n - count)-th prime > q.
            listed = facade.primes(q + 1, q + width)
            if len(listed) >= n - count:
                return listed[n - count - 1], join_provenance(provenance, "sieve")
        width *= 2


def _cipolla_guess(n: int) -> int:
    """p_n ≈ n (ln n + ln ln n − 1 + (ln ln n − 2)/ln n) (Cipolla 1902), for n ≥ 6."""
    log_n = math.log(n)
    log_log_n = math.log(log_n)
    return int(n * (log_n + log_log_n - 1 + (log_log_n - 2) / log_n))


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
    invalid_inputs=((0,), (-1,)), memory=_memory,
    families=("exhaustive", "tables", "prime-indices", "boundaries", "uniform", "log-uniform",
              "bound-starts"),
)
