"""One audit: ask the candidate at every sampled point, judge each answer, localise, record.

The order of work:

1. the regression corpus (read once) -- entries of this role and target as
   ``regression``, of this role and another target as ``regression (other
   target)``, entries outside the role's domain (wrong arity, below
   ``role.minimum``) judged by the invalid-input policy like the role's own
   invalid inputs, entries of other roles ignored -- then the sampled points
   (:func:`oracle.sampling.sample`) from the smallest up -- small inputs are
   cheap, so most defects show within the first second -- in batches, then the
   inputs outside the domain (where a hang costs a whole timeout);
2. each answer is normalised and judged by the role (:mod:`oracle.roles`);
   faults -- an exception, a wrong type, a hang, a dead process, a broken
   protocol, a huge integer or an endless iterator -- are findings, never
   errors of the harness.  A timeout is classified
   (:mod:`oracle.engine._timeouts`, after one retry with a longer limit where
   that can decide): "hung" is a finding; "too slow" at the top of the
   candidate's reach, after calls that grew slower, is not (unless
   ``AuditOptions.slow_fails``, CLI ``--slow-fails``): it ends the reach, and
   larger points are skipped as beyond the candidate's speed;
   then, for counting roles, the climb above the sampled points
   (:mod:`oracle.engine._reach`): table points ± 1 and random points per
   octave, as high as the candidate's speed, the oracle's cost and the time
   budget allow; for primality, next/prev prime, factor and the arithmetic
   functions (on constructed numbers) the climb by bit size
   (:mod:`oracle.engine._reach_bits`) up to 2²⁰⁴⁸; each family's reach
   is recorded (``reach`` records);
3. a sample of the sampled answers is asked again: a different answer is
   "nondeterministic";
4. the role's identities across answers (monotone counts, short-interval
   differences beyond exact reach, p_n increasing);
5. the first divergence: for counting roles, bisection between the largest
   agreeing and the smallest disagreeing point found (a function that starts
   to go wrong at some x is caught at that x; if it goes right again in
   between, bisection still ends at an adjacent agree/disagree pair, but not
   necessarily the smallest); for primes_in the smallest missing or extra
   prime, shown in the narrowest range asked that has it wrong; for the
   others the smallest failing input;
6. failures go to the regression corpus -- also when the run is interrupted
   (any exception, Ctrl-C included): the stream then gets an ``interrupted``
   record and :class:`AuditInterrupted` (a ``KeyboardInterrupt``) carries the
   summary so far; another exception is re-raised after the same saving.

Points above the declared domain (``maximum``), points left when the time
budget is spent, points at least as large as two that hung or one that was too
slow, and -- once
the candidate has clearly failed (the profile's ``enough_findings``) -- the
points not yet asked are skipped and counted as skipped, never as passed.
After enough findings only the localisation (step 5) is still done.  The early
stop is switchable: ``AuditOptions.stop_after`` replaces the profile's number
and ``early_stop=False`` asks every point (CLI ``--stop-after N``,
``--no-early-stop``).

The corpus replay has its own allowance, equal to the time budget; the budget
clock of the sampled points starts after it, so a large corpus never eats the
sampled points' time.  The time budget then covers every later phase, the
localisation included.  A run with points skipped for time, the early stop,
crashes or hangs is reported incomplete (:func:`oracle.engine.summarise`);
points beyond the candidate's speed leave it complete (they are its reach).
"""

from __future__ import annotations

import random
import time
from dataclasses import dataclass, field
from typing import Callable

from .. import roles as roles_module
from .. import sampling
from .._errors import InvalidInputError, OracleError, OutOfReachError
from .._bounded import bounded_text
from ..roles import Conventions, Role, WrongType
from ..targets import BAD_OUTPUT, CRASHED, OK, RAISED, TIMEOUT
from ..targets._worker import Overlong, Oversized, contains_oversized
from . import _reach, _reach_bits, _timeouts
from ._corpus import load_corpus, record_failures
from ._point import SIZE_CHECK, normalise_answer
from ._records import RecordStream, failure_statuses, jsonable, summarise
from ._speed import SpeedModel

__all__ = ["AuditOptions", "AuditInterrupted", "run_audit"]

BATCH = 64
#: Seconds per point (call and verdict) above which points are asked one at a time.
SLOW_CALL = 0.05
#: Hangs after which larger points are skipped.
TIMEOUTS_BEFORE_SKIPPING = 2
#: Why points at least as large as a call too slow are not asked (the limit of reach).
SLOW_SKIP = "beyond the candidate's speed (too slow)"
#: Crashes after which the rest of the run is skipped.
CRASHES_BEFORE_STOPPING = 5
#: Steps of bisection at most (2**64 needs 64).
BISECTION_STEPS = 80
#: Families re-asked first: strong pseudoprimes and Carmichael numbers have many liars.
#: Families of the climbs above the sampled points (not re-asked: they are few and costly).
CLIMBS = _reach.CLIMB_FAMILIES + (_reach_bits.CLIMB_BITS,)
FRAGILE_FAMILIES = ("pseudoprimes", "carmichael", "semiprimes", "squares")
#: Re-asked first: this many of the smallest inputs answered, and of those answered wrongly.
REASK_SMALLEST, REASK_WRONG = 3, 3
#: A passing listing longer than this is recorded abridged (a failing one is kept whole).
LONGEST_RECORDED_LISTING = 16


def _abridged(listing: list) -> str:
    return f"{len(listing)} items: {listing[0]}, {listing[1]}, ..., {listing[-1]}"


#: The opening call's size: 97 is prime, so every role's answer there differs from a
#: default (π(97) = 25, is_prime(97) is true, μ(97) = −1, primes_in(0, 40) lists 12 primes).
OPENING_SIZE = 97


def _opening_first(samples: list, role) -> list:
    """``samples`` (sorted by size) with one small exhaustive point moved to the front: the
    first of those of the largest size up to :data:`OPENING_SIZE`.  Sorted by size, the
    first call would be at 0, where the answer (0, false, []) is also what a candidate
    gives before it has initialised anything; a candidate wrong on its first call in a
    process (a table filled lazily, a race with a loader thread) is seen only if that call
    has a non-trivial answer (common practice)."""
    small = [s for s in samples if s.family == "exhaustive"
             and role.magnitude(s.arguments) <= OPENING_SIZE]
    if not small:
        return samples
    largest = max(role.magnitude(s.arguments) for s in small)
    opening = next(s for s in small if role.magnitude(s.arguments) == largest)
    return [opening] + [s for s in samples if s is not opening]


def _next_probe(low: int, high: int) -> int:
    """The next point to ask between the agreeing ``low`` and the disagreeing ``high``.

    Divergences start at word and table boundaries far more often than anywhere
    else (common practice), so B − 1 and B for the largest power of two or of ten
    B inside (low + 1, high] are tried before halving: a candidate that goes wrong
    at 2³² is then localised in two calls instead of thirty.
    """
    for boundary in sorted(_boundaries_below(high), reverse=True):
        if low < boundary - 1 < high:
            return boundary - 1
        if low < boundary < high:
            return boundary
    return (low + high) // 2


def _boundaries_below(high: int) -> tuple[int, int]:
    power_of_two = 1 << (high.bit_length() - 1) if high > 0 else 0
    power_of_ten = 10 ** (len(str(high)) - 1) if high > 0 else 0
    return power_of_two, power_of_ten


@dataclass
class AuditOptions:
    """Everything that decides one audit apart from the target itself."""

    role: str
    profile: str = "ci"
    seed: int | None = None
    timeout: float | None = None
    maximum: int | None = None
    conventions: Conventions = field(default_factory=Conventions)
    corpus: str | None = None
    stream: str | None = None
    oracle_budget: float = 10.0
    time_budget: float | None = None
    on_record: Callable[[dict], None] | None = None    # called with every record written
    stop_after: int | None = None       # findings before the early stop (None: the profile's)
    early_stop: bool = True             # False: ask every point however many checks fail
    slow_fails: bool = False            # True: a call too slow at the top of its reach is a failure


class AuditInterrupted(KeyboardInterrupt):
    """The audit was interrupted; ``summary`` is the summary of what was done (findings saved)."""

    def __init__(self, summary: dict):
        super().__init__("audit interrupted")
        self.summary = summary


class _Run:
    def __init__(self, target, options: AuditOptions, stream: RecordStream,
                 speed: SpeedModel | None = None):
        self.target = target
        self.options = options
        self.role: Role = roles_module.get(options.role)
        self.profile = sampling.profile(options.profile)
        self.stream = stream
        self.started = time.perf_counter()
        self.budget_started = self.started     # restarted after the corpus replay
        self.answers: dict[tuple, object] = {}
        self.families: dict[tuple, str] = {}
        self.verdicts: dict[tuple, object] = {}
        self.failures: list[dict] = []
        self.timed_out_sizes: list[int] = []      # hung calls inside the domain
        self.slow_sizes: list[int] = []           # calls too slow (the limit of reach)
        self.too_slow: list[dict] = []
        self.crashes = 0
        self.faults = 0             # hangs and crashes
        self.speed = SpeedModel() if speed is None else speed
        self.failing = failure_statuses(options.slow_fails)
        self.skipped: dict[str, list[int]] = {}
        self.family_stops: dict[str, str] = {}     # the first reason a family's point was skipped
        self.time_budget = (options.time_budget if options.time_budget is not None
                            else self.profile.time_budget)
        self.enough_findings = (None if not options.early_stop else options.stop_after
                                if options.stop_after is not None else self.profile.enough_findings)
        #: What the role remembers during this run (exact values found so far), or None.
        self.memory = self.role.memory() if self.role.memory is not None else None
        self.tampered: list[str] = []       # what a candidate in this process changed

    def elapsed(self) -> float:
        return round(time.perf_counter() - self.started, 6)

    def call_timeout(self) -> float:
        """The per-call limit in force: the target's own where it has one."""
        return getattr(self.target, "timeout", None) or self.options.timeout

    def remaining(self) -> float:
        """Seconds left of the time budget."""
        return self.time_budget - (time.perf_counter() - self.budget_started)

    # -- one check --------------------------------------------------------- #

    def record(self, status, check, family, arguments, got=None, expected=None, provenance="",
               detail="", seconds=0.0) -> dict:
        if status == "pass" and type(got) is list and len(got) > LONGEST_RECORDED_LISTING:
            got = expected = _abridged(got)
        record = {"type": "check", "status": status, "check": check, "family": family,
                  "arguments": list(arguments), "got": jsonable(got), "expected": jsonable(expected),
                  "provenance": provenance, "detail": bounded_text(detail) if detail else detail,
                  "seconds": seconds,
                  "elapsed": time.perf_counter() - self.started}
        self.stream.write(record)
        if status in self.failing:
            self.failures.append(record)
        if status == _timeouts.TOO_SLOW:
            self.too_slow.append(record)
        return record

    def timed_out(self, family: str, arguments: tuple, result, invalid: bool):
        """A timeout classified (:mod:`oracle.engine._timeouts`): the record of a hang or of a
        call too slow, or the result of a longer retry that answered (to be judged)."""
        magnitude = self.role.magnitude(arguments)
        timeout = self.call_timeout()
        by_digits = family == _reach_bits.CLIMB_BITS
        reason = None if by_digits else _timeouts.obviously_hung(
            magnitude, self.speed, timeout, invalid=invalid, cost_follows_size=self.role.counting)
        retried = None
        if reason is None and self.slow_sizes and magnitude >= min(self.slow_sizes):
            status = _timeouts.TOO_SLOW           # no retry: a smaller call was too slow already
            reason = f"no answer within {timeout:g} s, like the call at {min(self.slow_sizes)}"
        elif reason is None:
            allowed = min(_timeouts.RETRY_FACTOR * timeout, self.remaining())
            if hasattr(self.target, "timeout") and allowed > timeout:
                retried = allowed
                again = self._retry(arguments, allowed)
                if again.status != TIMEOUT:
                    return again
            if by_digits:
                projected = self.speed.project_by_digits(magnitude, _reach_bits.PROOF_GROWTH,
                                                         smaller_only=True)
            else:
                projected = self.speed.project(magnitude)
            status, reason = _timeouts.after_retry(magnitude, projected, timeout, retried)
        else:
            status = _timeouts.HUNG
        if status == _timeouts.HUNG:
            self.faults += 1
            if not invalid:         # a hang outside the domain says nothing about larger inputs
                self.timed_out_sizes.append(magnitude)
        else:
            self.slow_sizes.append(magnitude)
        return self.record(status, "timeout", family, arguments, detail=reason,
                           seconds=result.seconds)

    def _retry(self, arguments: tuple, seconds: float):
        """One call with the per-call limit raised to ``seconds``."""
        previous = self.target.timeout
        self.target.timeout = seconds
        try:
            (result,) = self.target.call_many([arguments])
        finally:
            self.target.timeout = previous
        return result

    def judge(self, family: str, arguments: tuple, result, *, invalid: bool = False) -> dict:
        role, conventions = self.role, self.options.conventions
        if result.status == TIMEOUT:
            classified = self.timed_out(family, arguments, result, invalid)
            if isinstance(classified, dict):
                return classified
            result = classified             # a longer retry answered: judge its answer
        if result.status == OK and not invalid:
            self.speed.observe(role.magnitude(arguments), result.seconds)
        if result.status in (CRASHED, BAD_OUTPUT):
            self.faults += 1
            self.crashes += 1
            return self.record(result.status, "process" if result.status == CRASHED else "protocol",
                               family, arguments, detail=result.error, seconds=result.seconds)
        if invalid:
            if result.status == OK and conventions.invalid_input == "raise":
                return self.record("wrong", "invalid-input", family, arguments, got=result.value,
                                   expected="an exception", provenance="convention",
                                   detail="answered an input outside the domain instead of raising",
                                   seconds=result.seconds)
            return self.record("pass", "invalid-input", family, arguments,
                               got=result.error or result.value, provenance="convention",
                               seconds=result.seconds)
        if result.status == RAISED:
            return self.record("raised", "exception", family, arguments, detail=result.error,
                               seconds=result.seconds)
        if contains_oversized(result.value):
            shown = (repr(result.value)[1:-1] if isinstance(result.value, (Oversized, Overlong))
                     else bounded_text(result.value, 200))
            return self.record("wrong", "size", family, arguments, got=shown,
                               expected="an answer of ordinary size", provenance="definition",
                               detail=f"returned {shown}", seconds=result.seconds)
        value, refused = normalise_answer(role, result.value, conventions)
        if refused is not None and refused.check == SIZE_CHECK:     # too large to be any answer
            return self.record("wrong", "size", family, arguments, got=bounded_text(result.value, 200),
                               expected=refused.expected, provenance="definition",
                               detail=refused.detail, seconds=result.seconds)
        if refused is not None:
            return self.record("wrong-type", "type", family, arguments,
                               got=bounded_text(result.value, 200), detail=refused.detail,
                               seconds=result.seconds)
        try:
            if self.memory is None:
                verdict = role.judge(arguments, value, conventions, self.options.oracle_budget)
            else:
                verdict = role.judge(arguments, value, conventions, self.options.oracle_budget,
                                     memory=self.memory)
        except OutOfReachError as error:
            self.skipped.setdefault("out of the oracle's reach", []).append(role.magnitude(arguments))
            return {"status": "skipped", "detail": str(error)}
        self.answers[arguments] = value
        self.verdicts[arguments] = verdict
        self.families[arguments] = family
        if not verdict.reach:
            self.skipped.setdefault("out of the oracle's reach", []).append(role.magnitude(arguments))
            return {"status": "skipped"}
        return self.record("pass" if verdict.passed else "wrong", verdict.check, family, arguments,
                           got=value, expected=verdict.expected, provenance=verdict.provenance,
                           detail=verdict.detail, seconds=result.seconds)

    # -- the phases -------------------------------------------------------- #

    def over_budget(self) -> bool:
        return time.perf_counter() - self.budget_started > self.time_budget

    def failed_enough(self) -> bool:
        return self.enough_findings is not None and len(self.failures) >= self.enough_findings

    def runnable(self, arguments: tuple, over_budget: bool = False) -> str | None:
        """Why a point is not to be asked, or None."""
        if over_budget:
            return "time budget spent"
        size = self.role.magnitude(arguments)      # the size a call's cost follows
        if self.options.maximum is not None and max(arguments) > self.options.maximum:
            return "above the declared domain (--max)"
        if len(self.timed_out_sizes) >= TIMEOUTS_BEFORE_SKIPPING and size >= min(self.timed_out_sizes):
            return "at least as large as inputs that timed out"
        if self.slow_sizes and size >= min(self.slow_sizes):
            return SLOW_SKIP
        if self.crashes >= CRASHES_BEFORE_STOPPING:
            return "the candidate crashed too often"
        if self.failed_enough():
            return f"the candidate had already failed {self.enough_findings} checks"
        return None

    def ask(self, points: list[tuple[str, tuple]], *, invalid: bool = False) -> None:
        """Ask the points in batches; batches start at one call and double up to :data:`BATCH`
        while calls are fast, and fall back to one call when calls become slow, time out or
        crash, so that the time budget and the skipping rules act within about one call."""
        points = list(points)
        start, size = 0, 1
        while start < len(points):
            batch = []
            over_budget = self.over_budget()
            for family, arguments in points[start:start + size]:
                reason = self.runnable(arguments, over_budget)
                if reason is None:
                    batch.append((family, arguments))
                else:
                    self.skipped.setdefault(reason, []).append(self.role.magnitude(arguments))
                    self.family_stops.setdefault(family, reason)
            start = min(start + size, len(points))
            began = time.perf_counter()
            results = self.target.call_many([a for _, a in batch], stop_on_fault=True) if batch else []
            if len(results) < len(batch):       # a fault cut the batch short: ask the rest again
                points[start:start] = batch[len(results):]
            faults_before = self.faults
            for (family, arguments), result in zip(batch, results):
                self.judge(family, arguments, result, invalid=invalid)
            slow = batch and (time.perf_counter() - began) / len(batch) > SLOW_CALL
            faulty = self.faults != faults_before
            size = 1 if slow or faulty else min(2 * size, BATCH)
            if self.failed_enough():
                size = len(points)      # the rest is only counted as skipped

    def ask_invalid(self, points: list[tuple[str, tuple]]) -> None:
        """Ask the inputs outside the domain one by one; after one hang the rest are skipped
        (one hang there is finding enough, and each costs a whole timeout)."""
        for index, point in enumerate(points):
            self.ask([point], invalid=True)
            if self.failures and self.failures[-1]["status"] == _timeouts.HUNG \
                    and self.failures[-1]["family"] == "invalid-input":
                for _, arguments in points[index + 1:]:
                    self.skipped.setdefault("outside the domain, after a hang there",
                                            []).append(self.role.magnitude(arguments))
                return

    def reask(self, seed: int) -> None:
        """Ask a sample of points again: the smallest inputs answered (a cache filled wrongly
        shows first there), the smallest answered wrongly (a wrong answer that changes when
        asked again is nondeterminism, which a fix must know of), then the profile's sample,
        half of it, where there are enough, from the families on which a randomised test errs
        most often (its liars are many there)."""
        rng = random.Random(f"{seed}:reask")
        asked = sorted(a for a in self.answers if self.families.get(a) not in CLIMBS)
        by_size = sorted(asked, key=lambda a: (self.role.magnitude(a), a))
        wrong = [a for a in by_size if a in self.verdicts and not self.verdicts[a].passed]
        first = list(dict.fromkeys(by_size[:REASK_SMALLEST] + wrong[:REASK_WRONG]))
        fragile = [arguments for arguments in asked if self.families.get(arguments) in FRAGILE_FAMILIES
                   and arguments not in first]
        chosen = rng.sample(fragile, min(self.profile.reask // 2, len(fragile)))
        others = sorted(set(asked) - set(chosen) - set(first))
        chosen += rng.sample(others, min(self.profile.reask - len(chosen), len(others)))
        over_budget = self.over_budget()
        chosen = [arguments for arguments in chosen if self.runnable(arguments, over_budget) is None]
        if not over_budget:     # these are asked even after the early stop: they are few
            chosen = first + [arguments for arguments in chosen if arguments not in first]
        for arguments, result in zip(chosen, self.target.call_many(chosen, stop_on_fault=True)):
            if result.status != OK:
                self.judge("reask", arguments, result)
                continue
            try:
                again = self.role.normalise(result.value, self.options.conventions)
            except WrongType as error:
                again = f"<{error}>"
            if again != self.answers[arguments]:
                self.record("nondeterministic", "reask", "reask", arguments, got=again,
                            expected=self.answers[arguments], provenance="the candidate itself",
                            detail=f"asked twice: first {bounded_text(self.answers[arguments], 80)}, "
                                   f"then {bounded_text(again, 80)}",
                            seconds=result.seconds)

    def relations(self) -> None:
        if self.role.relations is None or not self.answers or self.failed_enough():
            return
        for arguments, got, verdict in self.role.relations(self.answers, self.verdicts,
                                                           self.options.oracle_budget):
            self.record("wrong", verdict.check, "identity", arguments, got=got,
                        expected=verdict.expected, provenance=verdict.provenance, detail=verdict.detail)

    def divergence(self) -> dict | None:
        wrong = [r for r in self.failures if len(r["arguments"]) == self.role.arity
                 and r["check"] not in ("reask", "invalid-input")]
        if not wrong:
            return None
        if self.role.counting and self.profile.bisect:
            found = self.bisect(wrong)
            if found is not None:
                return found
        if self.role.name == "primes_in":
            return self.first_wrong_prime(wrong)
        smallest = min(wrong, key=lambda r: (self.role.magnitude(r["arguments"]), r["arguments"]))
        return {"kind": "smallest failing input", "input": smallest["arguments"],
                "family": smallest["family"], "status": smallest["status"], "got": smallest["got"],
                "expected": smallest["expected"], "provenance": smallest["provenance"],
                "detail": smallest["detail"]}

    def bisect(self, wrong: list[dict]) -> dict | None:
        exact_wrong = [r for r in wrong if r["status"] == "wrong" and r["check"] == "exact"]
        if not exact_wrong:
            return None
        first = min(exact_wrong, key=lambda r: r["arguments"][0])
        high = first["arguments"][0]
        agreeing = [a[0] for a, v in self.verdicts.items()
                    if v.passed and v.check == "exact" and a[0] < high]
        low = max(agreeing, default=self.role.minimum - 1)
        worst = first
        steps = 0
        while high - low > 1 and steps < BISECTION_STEPS and self.crashes < CRASHES_BEFORE_STOPPING:
            if self.over_budget():
                self.skipped.setdefault("time budget spent (bisection left unfinished)",
                                        []).append((low + high) // 2)
                break
            steps += 1
            middle = _next_probe(low, high)
            (result,) = self.target.call_many([(middle,)])
            record = self.judge("bisection", (middle,), result)
            if record["status"] == "pass":
                low = middle
            elif record["status"] in ("wrong", "wrong-type", "raised"):
                high, worst = middle, record
            else:
                break
        return {"kind": "first divergence", "input": [high], "last_agreeing": low,
                "bisection_steps": steps, "adjacent": high - low == 1, "got": worst["got"],
                "expected": worst["expected"], "provenance": worst["provenance"],
                "detail": worst["detail"]}

    def first_wrong_prime(self, wrong: list[dict]) -> dict:
        from ..roles.primes_in import first_wrong_prime

        best = None
        for record in wrong:
            if record["status"] != "wrong":
                continue
            arguments = tuple(record["arguments"])     # the whole listings, not the records' cut
            verdict = self.verdicts.get(arguments)
            found = first_wrong_prime(self.answers.get(arguments, record["got"]),
                                      verdict.expected if verdict is not None else record["expected"])
            if found is None:
                continue
            low, high = record["arguments"]
            rank = (found[1], high - low, high)     # the smallest prime, shown in the narrowest
            if best is None or rank < best[0]:      # range asked that loses it
                best = (rank, found, record)
        if best is None:
            smallest = min(wrong, key=lambda r: (self.role.magnitude(r["arguments"]), r["arguments"]))
            return {"kind": "smallest failing input", "input": smallest["arguments"],
                    "status": smallest["status"], "detail": smallest["detail"]}
        _, (kind, prime), record = best
        return {"kind": f"first {kind} prime", "prime": prime, "input": record["arguments"],
                "provenance": record["provenance"], "detail": record["detail"]}

    def check_harness(self) -> None:
        """A candidate run in this process that changed the oracle, the engine or the builtins
        voids the verdict: that is a finding of its own (:mod:`oracle.targets._tamper`)."""
        tampered = getattr(self.target, "tampered", None)
        changed = tampered() if callable(tampered) else []
        self.tampered = changed
        if changed:
            self.record("tampered", "harness", "harness", (), detail=(
                f"the candidate changed the harness it runs in: {', '.join(changed[:5])}"
                + (f" and {len(changed) - 5} more" if len(changed) > 5 else "")
                + "; every verdict of this run is void (run it isolated, the default)"))

    def write_reach(self, samples) -> None:
        """A ``reach`` record per sampled family: why its largest point was its largest."""
        ceiling = self.profile.ceilings[self.role.name]
        for family in dict.fromkeys(s.family for s in samples):
            reason = self.family_stops.get(family, f"the profile's ceiling ({ceiling})")
            self.stream.write({"type": "reach", "family": family, "stopped": reason,
                               "elapsed": self.elapsed()})

    def write_skipped(self) -> None:
        for reason, sizes in self.skipped.items():
            self.stream.write({"type": "skipped", "reason": reason, "count": len(sizes),
                               "smallest": min(sizes), "elapsed": self.elapsed()})


def _corpus_points(entries: list[dict], role: Role, target: str) -> tuple[list, list]:
    """The corpus entries of ``role`` as (valid, outside the domain) lists of (family, arguments),
    each input once; entries of other roles are left out."""
    valid, invalid, seen = [], [], set()
    for entry in entries:
        arguments = tuple(entry["arguments"])
        if entry["role"] != role.name or arguments in seen:
            continue
        seen.add(arguments)
        family = "regression" if entry.get("target") == target else "regression (other target)"
        if len(arguments) != role.arity or min(arguments) < role.minimum:
            invalid.append(("invalid-input", arguments))
        else:
            valid.append((family, arguments))
    return valid, invalid


def _check_options(options: AuditOptions, role: Role) -> None:
    if options.maximum is not None and options.maximum < role.minimum:
        raise InvalidInputError(f"maximum={options.maximum}: below the smallest input of "
                                f"{role.name} ({role.minimum})")
    if options.stop_after is not None and (type(options.stop_after) is not int
                                           or options.stop_after < 1):
        raise InvalidInputError(f"stop_after={options.stop_after!r}: must be a positive integer")


def run_audit(target, options: AuditOptions, *, only: list[tuple] | None = None,
              kind: str = "python", speed: SpeedModel | None = None) -> dict:
    """Audit ``target`` (from :mod:`oracle.targets`) and return the summary.

    Results stream to ``options.stream`` (JSON lines) as they are found; failures
    are added to ``options.corpus`` when it is given (``kind`` -- ``python`` or
    ``exec`` -- is recorded with them, so that ``ntoracle replay`` can rebuild the
    target), also when the run is interrupted (then :class:`AuditInterrupted` is
    raised for Ctrl-C, the exception itself otherwise).  With ``only``, just those
    argument tuples are asked (a replay): no sampling, no re-asking; those outside
    the role's domain are judged by the invalid-input policy.  ``speed``: the candidate's
    cost curve so far (:class:`oracle.engine.SpeedModel`), carried over from earlier runs
    of the same target, so that a timeout at a point asked alone is judged against the
    calls before it (the plugin asks each item's points in a run of their own).
    """
    seed = options.seed if options.seed is not None else sampling.new_seed()
    chosen = sampling.profile(options.profile)
    role = roles_module.get(options.role)
    _check_options(options, role)
    if options.timeout is None:
        options.timeout = chosen.timeout
    entries = load_corpus(options.corpus) if options.corpus and only is None else []
    stream = RecordStream(options.stream, on_record=options.on_record)
    run = _Run(target, options, stream, speed)
    stopped: BaseException | None = None
    try:
        stream.write({"type": "start", "target": bounded_text(target.description), "kind": kind,
                      "role": role.name,
                      "profile": chosen.name, "seed": seed, "timeout": options.timeout,
                      "maximum": options.maximum, "isolated": target.isolated,
                      "conventions": vars(options.conventions), "slow_fails": options.slow_fails,
                      "elapsed": 0.0})
        if only is not None:
            run.enough_findings = None          # a replay asks every point it was given
            valid, invalid = _corpus_points([{"role": role.name, "arguments": list(a),
                                              "target": target.description} for a in only],
                                            role, target.description)
            run.ask(valid)
            run.ask_invalid(invalid)
        else:
            corpus_points, corpus_invalid = _corpus_points(entries, role, target.description)
            samples = _opening_first(sorted(sampling.sample(role, chosen, seed),
                                            key=lambda s: role.magnitude(s.arguments)), role)
            replayed = {arguments for _, arguments in corpus_points}
            stream.write({"type": "plan", "points": len(corpus_points) + len(corpus_invalid)
                          + len(samples) + len(role.invalid_inputs), "elapsed": run.elapsed()})
            run.ask(corpus_points)
            run.ask_invalid(corpus_invalid)
            run.budget_started = time.perf_counter()        # the corpus had its own allowance
            run.ask([(s.family, s.arguments) for s in samples if s.arguments not in replayed])
            own_invalid = [a for a in role.invalid_inputs if a not in {p for _, p in corpus_invalid}]
            run.ask_invalid([("invalid-input", arguments) for arguments in own_invalid])
            run.write_reach(samples)
            _reach.climb(run, seed)
            _reach_bits.climb(run, seed)
            run.reask(seed)
            run.relations()
        found = run.divergence()
        if found is not None:
            stream.write({"type": "divergence", **jsonable(found)})
        run.check_harness()
        run.write_skipped()
        stream.write({"type": "end", "elapsed": run.elapsed()})
    except BaseException as error:      # Ctrl-C included: save what was found, then say so
        stopped = error
        try:
            run.write_skipped()
            stream.write({"type": "interrupted", "reason": type(error).__name__,
                          "detail": str(error)[:200], "elapsed": run.elapsed()})
        except Exception:
            pass
    finally:
        stream.close()
    summary = summarise(stream.records)
    if run.tampered:        # even if the candidate also changed how the summary is made
        summary.update(passed=False, verdict="failed", tampered=run.tampered)
    if options.corpus and only is None:
        calls = [r for r in stream.records if r.get("type") == "check"   # all on record, even
                 and r["status"] in run.failing and r["family"] not in ("identity", "harness")]
        summary["corpus_added"] = record_failures(options.corpus, calls, target=target.description,
                                                  role=role.name, seed=seed, profile=chosen.name,
                                                  kind=kind)
    if isinstance(stopped, KeyboardInterrupt):
        raise AuditInterrupted(summary) from stopped
    if stopped is not None:
        raise stopped
    return summary
