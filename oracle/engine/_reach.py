"""Reach that follows the candidate: after the sampled points, climb as high as it is fast.

The sampled points of a counting role stop near 2³² (:mod:`oracle.sampling`),
however fast the candidate is.  The climb goes on from the largest point asked,
in increasing size, with two families:

``climb-tables``
    at each point B of the oracle's published tables above it (2^k and 10^k for
    π, 10^k for π₂ and for p_n, :mod:`oracle.tables`), the inputs B − 1, B, B + 1:
    the oracle answers them with the tabulated value and a sieve of a few
    integers (π(B ± 1) = π(B) ± [B ± 1 prime]);
``climb-random``
    one seeded random point in each octave [2^j, 2^(j+1)), where the oracle's
    combinatorial method (or its sieve) answers within its budget;
``climb-answer-words``
    the points where the *answer* steps from 2^k − 1 to 2^k, so that a count or
    a prime kept in a k-bit word wraps there: for π, x = p_N − 1 and p_N with
    N = 2^k (:data:`oracle.sampling._families.PRIME_AT_POWER_OF_TWO`, up to
    k = 40); for p_n, n = π(2^k) and π(2^k) + 1 (π(2^k) from OEIS A007053, so
    p_n steps over 2^k).  Twin counts cross 2^k beyond 2^16 only above the
    oracle's cheap sieve, so π₂ has no such steps here (the sampled
    ``twin-answer-words`` go up to 2^16).

The sums up to x (``prime_sum``, ``mertens``, ``squarefree_count``,
``triplet_pi_026``, ``triplet_pi_046``, ``quadruplet_pi``; :data:`SUM_ROLES`) climb
the same way, with no published table: ``climb-tables`` asks the round points
10^k ± 1 and 2^k ± 1 (the oracle answers the middle one by its cheapest route
-- the combinatorial sum of the primes up to 2⁴⁷, the Möbius identity for Q(x),
primesieve's constellation count -- and its neighbours from it by a sieve of a few
integers, :class:`oracle.roles._sums.KnownSums`); ``climb-answer-words`` asks
x − 1 and x where the answer steps over a word (the sum of the primes passes
2^w at the primes of :data:`oracle.sampling._families.PRIME_SUM_WORDS`, w up to 64;
Q(x) passes 2^31 and 2^32 at :data:`oracle.sampling._families.SQUAREFREE_WORDS`),
and, for every sum role, the least x where x·x or x·(x + 1)/2 passes 2⁶³ or 2⁶⁴
(:func:`oracle.sampling._families.intermediate_words`), where a candidate that
forms such a product in a 64-bit word goes wrong although its answer fits.
``prime_pi_mod`` does not climb: its oracle sieves [0, x] (about 5 ns an integer),
so its sampled ceiling near 2³² is already the end of the oracle's budget.

Before each step the cost is estimated, never just tried: the candidate's time
per call is projected from the calls already made (:mod:`oracle.engine._speed`)
and must stay within :data:`CALL_SHARE` of the per-call timeout; the oracle's
time comes from the cost model of its cheapest exact route (the same estimate
:mod:`oracle.facade` uses to pick a route) and must stay within the oracle's
budget; both together must fit the time left (less :data:`RESERVE` of the time
budget, kept for re-asking and localising; a random step may take only
:data:`RANDOM_SHARE` of it, so that the table points, far cheaper to judge, go
higher).  A family stops for good at the
first step that does not fit, and the reason is recorded (a ``reach`` record):
"candidate speed", "oracle budget", "declared domain (--max)", "time budget",
"after failures", or "end of the oracle's tables".  Where a call costs more than
:data:`THIN_ABOVE`, the table steps thin out to powers of ten and a few word
sizes (± 1, and above :data:`SINGLE_ABOVE` the point alone), so that the time
goes to larger sizes.  A step that finds a defect
ends the climb: the localisation (bisection) takes it from there.
"""

from __future__ import annotations

import math
import random

from .. import facade, tables
from ..sampling._families import (PRIME_AT_POWER_OF_TWO, PRIME_SUM_WORDS, SQUAREFREE_WORDS,
                                  intermediate_words)

__all__ = ["climb", "CLIMB_FAMILIES", "STOP_REASONS", "oracle_seconds", "CALL_SHARE", "stop_reason"]

CLIMB_TABLES, CLIMB_RANDOM, CLIMB_ANSWERS = "climb-tables", "climb-random", "climb-answer-words"
CLIMB_FAMILIES = (CLIMB_TABLES, CLIMB_RANDOM, CLIMB_ANSWERS)

CANDIDATE_SPEED, ORACLE_BUDGET, DECLARED_DOMAIN = ("candidate speed", "oracle budget",
                                                   "declared domain (--max)")
TIME_BUDGET, AFTER_FAILURES, TABLES_END = "time budget", "after failures", "end of the oracle's tables"
STOP_REASONS = (CANDIDATE_SPEED, ORACLE_BUDGET, DECLARED_DOMAIN, TIME_BUDGET, AFTER_FAILURES,
                TABLES_END)

#: Reasons that hold for every larger step of either family (sizes only grow).
_FOR_EVERY_LARGER_STEP = (CANDIDATE_SPEED, DECLARED_DOMAIN, AFTER_FAILURES)
#: The oracle's function of each role that climbs, as named by :mod:`oracle.tables`.
TABLE_FUNCTIONS = {"prime_pi": "pi", "twin_pi": "twin_pi", "nth_prime": "nth_prime"}
#: The sums up to x that climb (at round points instead of table points), with the kind of
#: constellation the oracle counts for the tuplet roles.
SUM_ROLES = {"prime_sum": None, "mertens": None, "squarefree_count": None,
             "triplet_pi_026": "triplets_026", "triplet_pi_046": "triplets_046",
             "quadruplet_pi": "quadruplets"}
#: Largest round point of the sums' climb (their oracle works below 2⁶⁴).
SUM_TOP = 2**64
#: Largest share of the per-call timeout a projected call may take (a call that then
#: times out on a loaded machine is asked again with a longer limit, see
#: :mod:`oracle.engine._timeouts`).
CALL_SHARE = 0.75
#: Above this projected time per call, the climb thins out: table steps only at powers of
#: ten and at the word sizes of :data:`THIN_POWERS_OF_TWO`, so that the time left goes
#: to larger sizes.
THIN_ABOVE = 0.05
THIN_POWERS_OF_TWO = (53, 63, 64, 96, 128)
#: Above this projected time per call, a thinned step asks the table point alone.
SINGLE_ABOVE = 1.0
#: Share of the time budget kept for the phases after the climb.
RESERVE = 0.1
#: Share of the time left that one random step may take: the table points, whose reference
#: costs a short sieve, come first; a random point's reference is a whole prime count.
RANDOM_SHARE = 1 / 3
#: Offsets asked around each table point.
OFFSETS = (-1, 0, 1)


def oracle_seconds(role_name: str, x: int, budget: float) -> float:
    """The oracle's estimated seconds for the exact reference at ``x`` (inf: no route)."""
    if role_name in SUM_ROLES:
        return _sum_oracle_seconds(role_name, x, budget)
    if role_name == "nth_prime":
        x = facade._nth_prime_upper_bound(x)      # p_n is judged through π(p_n) = n
    if role_name in ("prime_pi", "nth_prime"):
        routes = [facade._route_by_table("pi", "primes", x, budget),
                  facade._route_by_combinatorial(x, budget),
                  facade._route_by_sieve("primes", x, budget)]
    else:
        routes = [facade._route_by_table("twin_pi", "twins", x, budget),
                  facade._route_by_sieve("twins", x, budget)]
    return min((route.seconds for route in routes if route is not None), default=float("inf"))


def _sum_oracle_seconds(role_name: str, x: int, budget: float) -> float:
    """The oracle's estimated seconds for a sum up to ``x`` by its cheapest exact route (the
    same estimates :mod:`oracle.facade` uses to choose or refuse a route)."""
    if x >= SUM_TOP:
        return float("inf")
    if role_name == "squarefree_count":
        if x >= facade._SQUAREFREE_LIMIT:
            return float("inf")
        return (math.isqrt(x) + 1) * facade._MOBIUS_SECONDS_PER_INTEGER
    kind = SUM_ROLES[role_name]
    if kind is not None:
        route = facade._route_by_sieve(kind, x, budget)
        return float("inf") if route is None else route.seconds
    seconds = facade._summatory_seconds(role_name, 0, x)
    seconds = float("inf") if seconds is None else seconds
    if role_name == "prime_sum":
        from ..exact import prime_sum_combinatorial as combinatorial

        if x <= combinatorial.MAX_X:
            seconds = min(seconds, combinatorial.estimated_seconds(x))
    return seconds


def _round_points() -> list[int]:
    """10^k and 2^k below :data:`SUM_TOP`: the sums' table steps."""
    return sorted({10**k for k in range(1, 20)} | {2**k for k in range(4, 64)})


def _steps(role_name: str, start: int, rng: random.Random) -> list[tuple[int, str, list[int]]]:
    """(size, family, inputs) above ``start``, in increasing size."""
    if role_name in SUM_ROLES:
        points = [x for x in _round_points() if x > start + 1]
    else:
        points = sorted(x for x in tables.values(TABLE_FUNCTIONS[role_name]) if x > start + 1)
    steps = [(b + 1, CLIMB_TABLES, [b + d for d in OFFSETS]) for b in points]
    top = points[-1] if points else start
    for j in range(max(start, 1).bit_length() - 1, top.bit_length() - 1):
        low = max(1 << j, start + 1)
        if low < 1 << (j + 1):
            x = rng.randrange(low, 1 << (j + 1))
            steps.append((x, CLIMB_RANDOM, [x]))
    steps.extend(_answer_word_steps(role_name, start))
    return sorted(steps, key=lambda step: (step[0], step[1]))


def _answer_word_steps(role_name: str, start: int) -> list[tuple[int, str, list[int]]]:
    """The ``climb-answer-words`` steps above ``start`` (see the module's docstring)."""
    if role_name == "prime_pi":
        crossings = [[p - 1, p] for p in PRIME_AT_POWER_OF_TWO.values()]
    elif role_name == "nth_prime":
        counts = [count for x, (count, _source) in tables.values("pi").items()
                  if x & (x - 1) == 0]
        crossings = [[count, count + 1] for count in counts]
    elif role_name in SUM_ROLES:
        words = {"prime_sum": PRIME_SUM_WORDS, "squarefree_count": SQUAREFREE_WORDS}
        crossings = [[x - 1, x] for x in words.get(role_name, {}).values()]
        crossings += [[x - 1, x] for x in intermediate_words()]
    else:
        return []
    return [(max(inputs), CLIMB_ANSWERS, inputs) for inputs in sorted(crossings)
            if min(inputs) > start]


def climb(run, seed: int) -> None:
    """Ask the climbing points of a counting role (``run`` is the engine's :class:`_Run`)."""
    role = run.role
    if role.name not in TABLE_FUNCTIONS and role.name not in SUM_ROLES:
        return
    start = run.speed.largest()
    if start is None:
        return
    stopped: dict[str, tuple[str, int | None]] = {}
    largest: dict[str, int] = {}
    timeout = run.call_timeout()
    budget = run.options.oracle_budget
    steps = _steps(role.name, start, random.Random(f"{seed}:climb"))
    for index, (size, family, inputs) in enumerate(steps):
        if family in stopped:
            continue
        ahead = {family} | {name for _, name, _ in steps[index + 1:]}    # families with steps left
        maximum = run.options.maximum
        inputs = [x for x in inputs if x >= role.minimum and (maximum is None or x <= maximum)]
        if not inputs:
            for name in ahead:
                stopped.setdefault(name, (DECLARED_DOMAIN, size))
            break
        projected = _projected(run, inputs) if family == CLIMB_TABLES else 0.0
        if projected > THIN_ABOVE:
            inputs = _thin(inputs, single=projected > SINGLE_ABOVE)
            if not inputs:
                continue
        size = max(inputs)
        share = RANDOM_SHARE if family == CLIMB_RANDOM else 1.0
        reason = _why_not(run, size, inputs, timeout, budget, share)
        if reason is not None:
            for name in (ahead if reason in _FOR_EVERY_LARGER_STEP else (family,)):
                stopped.setdefault(name, (reason, size))
            if ahead <= set(stopped):
                break
            continue
        before = (len(run.too_slow), len(run.failures), run.faults)
        run.ask([(family, (x,)) for x in inputs])
        largest[family] = size
        if len(run.too_slow) > before[0]:
            reason = CANDIDATE_SPEED
        elif (len(run.failures), run.faults) != before[1:]:
            reason = AFTER_FAILURES
        if reason is not None:
            for name in ahead:
                stopped.setdefault(name, (reason, None))
            break
    for family in CLIMB_FAMILIES:
        reason, following = stopped.get(family, (TABLES_END, None))
        run.stream.write({"type": "reach", "family": family, "stopped": reason,
                          "largest": largest.get(family), "next": following,
                          "elapsed": run.elapsed()})


def stop_reason(blocked: str) -> str:
    """The climb's stop reason for a point the run would not ask (its skip reason)."""
    if "declared domain" in blocked:
        return DECLARED_DOMAIN
    return CANDIDATE_SPEED if "timed out" in blocked or "speed" in blocked else AFTER_FAILURES


def _projected(run, inputs: list[int]) -> float:
    """The candidate's projected seconds per call at the largest input (0 before any call)."""
    return run.speed.project(max(inputs)) or 0.0


def _thin(inputs: list[int], single: bool) -> list[int]:
    """A table step of the expensive part of the climb: kept only at a power of ten or one
    of :data:`THIN_POWERS_OF_TWO`, with its neighbours unless ``single``."""
    point = inputs[len(inputs) // 2]
    power_of_two = point & (point - 1) == 0 and point.bit_length() - 1 in THIN_POWERS_OF_TWO
    power_of_ten = len(str(point)) <= 40 and str(point).rstrip("0") == "1"
    if not (power_of_two or power_of_ten):
        return []
    return [point] if single else inputs


def _why_not(run, size: int, inputs: list[int], timeout: float, budget: float,
             share: float) -> str | None:
    """Why one climbing step is not to be asked, or None."""
    if run.failures or run.failed_enough():
        return AFTER_FAILURES
    blocked = run.runnable((max(inputs),))
    if blocked is not None:
        return stop_reason(blocked)
    projected = run.speed.project(size)
    if projected is None or projected > CALL_SHARE * timeout:
        return CANDIDATE_SPEED
    oracle = max(oracle_seconds(run.role.name, x, budget) for x in inputs)
    if oracle > budget:
        return ORACLE_BUDGET
    if len(inputs) * projected + oracle > share * (run.remaining() - RESERVE * run.time_budget):
        return TIME_BUDGET
    return None
