"""One audit: ask the candidate at every sampled point, judge each answer, localise, record.

The order of work:

1. the regression corpus of this role, then the invalid inputs, then the
   sampled points (:func:`oracle.sampling.sample`) from the smallest up -- small
   inputs are cheap, so most defects show within the first second -- in batches;
2. each answer is normalised and judged by the role (:mod:`oracle.roles`);
   faults -- an exception, a wrong type, a timeout ("too slow"), a dead
   process -- are findings, never errors of the harness;
3. a sample of answers is asked again: a different answer is "nondeterministic";
4. the role's identities across answers (monotone counts, short-interval
   differences beyond exact reach, p_n increasing);
5. the first divergence: for counting roles, bisection between the largest
   agreeing and the smallest disagreeing point found (a function that starts
   to go wrong at some x is caught at that x; if it goes right again in
   between, bisection still ends at an adjacent agree/disagree pair, but not
   necessarily the smallest); for primes_in the smallest missing or extra
   prime; for the others the smallest failing input;
6. failures go to the regression corpus.

Points above the declared domain (``maximum``), points left when the time
budget is spent, and points at least as large as two that timed out are
skipped and counted as skipped -- never as passed.
"""

from __future__ import annotations

import random
import time
from dataclasses import dataclass, field

from .. import roles as roles_module
from .. import sampling
from .._errors import OracleError, OutOfReachError
from ..roles import Conventions, Role, WrongType
from ..targets import CRASHED, OK, RAISED, TIMEOUT
from ._corpus import load_corpus, record_failures
from ._records import FAILURE_STATUSES, RecordStream, jsonable, summarise

__all__ = ["AuditOptions", "run_audit"]

BATCH = 64
#: Seconds per call above which points are asked one at a time.
SLOW_CALL = 0.05
#: Timeouts after which larger points are skipped.
TIMEOUTS_BEFORE_SKIPPING = 2
#: Crashes after which the rest of the run is skipped.
CRASHES_BEFORE_STOPPING = 5
#: Steps of bisection at most (2**64 needs 64).
BISECTION_STEPS = 80


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


class _Run:
    def __init__(self, target, options: AuditOptions, stream: RecordStream):
        self.target = target
        self.options = options
        self.role: Role = roles_module.get(options.role)
        self.profile = sampling.profile(options.profile)
        self.stream = stream
        self.started = time.perf_counter()
        self.answers: dict[tuple, object] = {}
        self.verdicts: dict[tuple, object] = {}
        self.failures: list[dict] = []
        self.timed_out_sizes: list[int] = []
        self.crashes = 0
        self.skipped: dict[str, list[int]] = {}

    def elapsed(self) -> float:
        return round(time.perf_counter() - self.started, 6)

    # -- one check --------------------------------------------------------- #

    def record(self, status, check, family, arguments, got=None, expected=None, provenance="",
               detail="", seconds=0.0) -> dict:
        record = {"type": "check", "status": status, "check": check, "family": family,
                  "arguments": list(arguments), "got": jsonable(got), "expected": jsonable(expected),
                  "provenance": provenance, "detail": detail, "seconds": seconds,
                  "elapsed": time.perf_counter() - self.started}
        self.stream.write(record)
        if status in FAILURE_STATUSES:
            self.failures.append(record)
        return record

    def judge(self, family: str, arguments: tuple, result, *, invalid: bool = False) -> dict:
        role, conventions = self.role, self.options.conventions
        if result.status == TIMEOUT:
            self.timed_out_sizes.append(role.magnitude(arguments))
            return self.record("too-slow", "timeout", family, arguments, detail=result.error,
                               seconds=result.seconds)
        if result.status == CRASHED:
            self.crashes += 1
            return self.record("crashed", "process", family, arguments, detail=result.error,
                               seconds=result.seconds)
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
        try:
            value = role.normalise(result.value, conventions)
        except WrongType as error:
            return self.record("wrong-type", "type", family, arguments, got=repr(result.value)[:200],
                               detail=str(error), seconds=result.seconds)
        try:
            verdict = role.judge(arguments, value, conventions, self.options.oracle_budget)
        except OutOfReachError as error:
            self.skipped.setdefault("out of the oracle's reach", []).append(role.magnitude(arguments))
            return {"status": "skipped", "detail": str(error)}
        self.answers[arguments] = value
        self.verdicts[arguments] = verdict
        if not verdict.reach:
            self.skipped.setdefault("out of the oracle's reach", []).append(role.magnitude(arguments))
            return {"status": "skipped"}
        return self.record("pass" if verdict.passed else "wrong", verdict.check, family, arguments,
                           got=value, expected=verdict.expected, provenance=verdict.provenance,
                           detail=verdict.detail, seconds=result.seconds)

    # -- the phases -------------------------------------------------------- #

    def runnable(self, arguments: tuple, over_budget: bool = False) -> str | None:
        """Why a point is not to be asked, or None."""
        if over_budget:
            return "time budget spent"
        size = max(arguments)
        if self.options.maximum is not None and size > self.options.maximum:
            return "above the declared domain (--max)"
        if len(self.timed_out_sizes) >= TIMEOUTS_BEFORE_SKIPPING and size >= min(self.timed_out_sizes):
            return "at least as large as inputs that timed out"
        if self.crashes >= CRASHES_BEFORE_STOPPING:
            return "the candidate crashed too often"
        return None

    def ask(self, points: list[tuple[str, tuple]], *, invalid: bool = False) -> None:
        """Ask the points in batches; batches shrink to one call when calls become slow, so that
        the time budget is kept to within about one call."""
        start, size = 0, BATCH
        while start < len(points):
            batch = []
            over_budget = self.elapsed() > self.time_budget
            for family, arguments in points[start:start + size]:
                reason = self.runnable(arguments, over_budget)
                if reason is None:
                    batch.append((family, arguments))
                else:
                    self.skipped.setdefault(reason, []).append(self.role.magnitude(arguments))
            start += size
            began = time.perf_counter()
            for (family, arguments), result in zip(batch, self.target.call_many([a for _, a in batch])):
                self.judge(family, arguments, result, invalid=invalid)
            slow = batch and (time.perf_counter() - began) / len(batch) > SLOW_CALL
            size = 1 if slow else BATCH

    def reask(self, seed: int) -> None:
        rng = random.Random(f"{seed}:reask")
        asked = sorted(self.answers)
        chosen = rng.sample(asked, min(self.profile.reask, len(asked)))
        over_budget = self.elapsed() > self.time_budget
        chosen = [arguments for arguments in chosen if self.runnable(arguments, over_budget) is None]
        for arguments, result in zip(chosen, self.target.call_many(chosen)):
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
                            detail=f"asked twice: first {self.answers[arguments]!r:.80}, then {again!r:.80}",
                            seconds=result.seconds)

    def relations(self) -> None:
        if self.role.relations is None or not self.answers:
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
            steps += 1
            middle = (low + high) // 2
            (result,) = self.target.call_many([(middle,)])
            record = self.judge("bisection", (middle,), result)
            if record["status"] == "pass":
                low = middle
            elif record["status"] in ("wrong", "wrong-type", "raised"):
                high, worst = middle, record
            else:
                break
        return {"kind": "first divergence", "input": [high], "last_agreeing": low,
                "bisection_steps": steps, "got": worst["got"], "expected": worst["expected"],
                "provenance": worst["provenance"], "detail": worst["detail"]}

    def first_wrong_prime(self, wrong: list[dict]) -> dict:
        from ..roles.primes_in import first_wrong_prime

        best = None
        for record in wrong:
            if record["status"] != "wrong":
                continue
            found = first_wrong_prime(record["got"], record["expected"])
            if found is not None and (best is None or found[1] < best[0][1]):
                best = (found, record)
        if best is None:
            smallest = min(wrong, key=lambda r: r["arguments"])
            return {"kind": "smallest failing input", "input": smallest["arguments"],
                    "status": smallest["status"], "detail": smallest["detail"]}
        (kind, prime), record = best
        return {"kind": f"first {kind} prime", "prime": prime, "input": record["arguments"],
                "provenance": record["provenance"], "detail": record["detail"]}

    def write_skipped(self) -> None:
        for reason, sizes in self.skipped.items():
            self.stream.write({"type": "skipped", "reason": reason, "count": len(sizes),
                               "smallest": min(sizes), "elapsed": self.elapsed()})


def run_audit(target, options: AuditOptions, *, only: list[tuple] | None = None,
              kind: str = "python") -> dict:
    """Audit ``target`` (from :mod:`oracle.targets`) and return the summary.

    Results stream to ``options.stream`` (JSON lines) as they are found; failures
    are appended to ``options.corpus`` when it is given (``kind`` -- ``python`` or
    ``exec`` -- is recorded with them, so that ``ntoracle replay`` can rebuild the
    target).  With ``only``, just those argument tuples are asked (a replay): no
    sampling, no re-asking.
    """
    seed = options.seed if options.seed is not None else sampling.new_seed()
    chosen = sampling.profile(options.profile)
    role = roles_module.get(options.role)
    if options.timeout is None:
        options.timeout = chosen.timeout
    stream = RecordStream(options.stream)
    run = _Run(target, options, stream)
    run.time_budget = options.time_budget if options.time_budget is not None else chosen.time_budget
    try:
        stream.write({"type": "start", "target": target.description, "role": role.name,
                      "profile": chosen.name, "seed": seed, "timeout": options.timeout,
                      "maximum": options.maximum, "isolated": target.isolated,
                      "conventions": vars(options.conventions), "elapsed": 0.0})
        corpus_points = []
        if options.corpus:
            corpus_points = [("regression", tuple(entry["arguments"]))
                             for entry in load_corpus(options.corpus)
                             if entry["role"] == role.name and len(entry["arguments"]) == role.arity]
        if only is not None:
            run.ask([("regression", tuple(arguments)) for arguments in only])
        else:
            run.ask(corpus_points)
            run.ask([("invalid-input", arguments) for arguments in role.invalid_inputs], invalid=True)
            samples = sorted(sampling.sample(role, chosen, seed),
                             key=lambda s: role.magnitude(s.arguments))
            replayed = {arguments for _, arguments in corpus_points}
            run.ask([(s.family, s.arguments) for s in samples if s.arguments not in replayed])
            run.reask(seed)
            run.relations()
        found = run.divergence()
        if found is not None:
            stream.write({"type": "divergence", **jsonable(found)})
        run.write_skipped()
        stream.write({"type": "end", "elapsed": run.elapsed()})
    finally:
        stream.close()
    summary = summarise(stream.records)
    if options.corpus and only is None:
        calls = [r for r in run.failures if len(r["arguments"]) == role.arity
                 and r["family"] not in ("identity",)]
        summary["corpus_added"] = record_failures(options.corpus, calls, target=target.description,
                                                  role=role.name, seed=seed, profile=chosen.name,
                                                  kind=kind)
    return summary
