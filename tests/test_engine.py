"""The engine catches our small defective candidates, localises them, streams and records."""

import json

import pytest

from _auditing import SMALL, audit
from oracle import InvalidInputError, engine, sampling, targets
from oracle.engine import AuditOptions
from oracle.engine._audit import BATCH

def test_correct_candidate_passes_and_skips_above_its_domain(tmp_path):
    summary = audit("_candidates:prime_pi", "prime_pi", tmp_path)
    assert summary["passed"] and summary["checks"] > 300
    assert summary["skipped"]["above the declared domain (--max)"] > 0
    assert not (tmp_path / "regressions.yaml").exists()


def test_first_divergence_by_bisection(tmp_path):
    summary = audit("_candidates:prime_pi_from_1000", "prime_pi", tmp_path, maximum=10**6)
    assert not summary["passed"]
    divergence = summary["first_divergence"]
    assert divergence["kind"] == "first divergence"
    assert divergence["input"] == [1000] and divergence["last_agreeing"] == 999
    assert divergence["expected"] == 168                   # OEIS A006880: pi(1000) = 168


def test_off_by_one_at_primes_found_at_two(tmp_path):
    summary = audit("_candidates:prime_pi_exclusive", "prime_pi", tmp_path)
    assert summary["first_divergence"]["input"] == [2]


def test_wrong_type_is_a_finding(tmp_path):
    summary = audit("_candidates:prime_pi_none", "prime_pi", tmp_path)
    statuses = {(f["status"], tuple(f["arguments"])) for f in summary["failures"]}
    assert ("wrong-type", (50,)) in statuses


def test_a_hang_at_a_small_input_is_hung_not_wrong(tmp_path):
    # prime_pi_slow never answers above 5000: a small input, cheap for any method
    summary = audit("_candidates:prime_pi_slow", "prime_pi", tmp_path, timeout=0.3)
    kinds = {f["status"] for f in summary["failures"]}
    assert kinds == {"hung"} and not summary["passed"]
    assert all(f["arguments"][0] > 5000 for f in summary["failures"])
    assert summary["skipped"].get("at least as large as inputs that timed out", 0) > 0


def test_nondeterminism_is_caught_by_reasking(tmp_path):
    # zoo member prime_pi_cached_odd: right on its first call at every x, prime_pi(x) - 1 when
    # asked again at x >= 2 (its cache forgets the prime 2); reloaded so that its cache is empty.
    import importlib

    import sympy
    import zoo.prime_pi_cached_odd
    importlib.reload(zoo.prime_pi_cached_odd)
    summary = audit("zoo.prime_pi_cached_odd:prime_pi", "prime_pi", tmp_path, maximum=2000, seed=4)
    statuses = {f["status"] for f in summary["failures"]}
    assert statuses == {"nondeterministic"}, summary["failures"][:3]
    for finding in summary["failures"]:
        (x,) = finding["arguments"]
        assert finding["expected"] == int(sympy.primepi(x))     # the first answer was right
        assert finding["got"] == finding["expected"] - 1
    assert not summary["passed"]


def test_crash_in_isolated_candidate_is_a_finding(tmp_path):
    summary = audit("_candidates:prime_pi_crash", "prime_pi", tmp_path, isolate=True, maximum=500)
    crashed = [f for f in summary["failures"] if f["status"] == "crashed"]
    assert [f["arguments"] for f in crashed] == [[77]]


def test_fermat_test_caught_at_the_smallest_pseudoprime(tmp_path):
    summary = audit("_candidates:is_prime_fermat", "is_prime", tmp_path, profile="ci", maximum=10**5)
    divergence = summary["first_divergence"]
    assert divergence["input"] == [341]          # 341 = 11 * 31, least base-2 Fermat pseudoprime (OEIS A001567)


def test_primes_in_first_missing_prime(tmp_path):
    summary = audit("_candidates:primes_in_drops_first", "primes_in", tmp_path, maximum=10**6)
    divergence = summary["first_divergence"]
    assert divergence["kind"] == "first missing prime" and divergence["prime"] == 2


def test_primes_in_first_missing_prime_shown_in_the_narrowest_range_that_loses_it(tmp_path):
    summary = audit("_candidates:primes_in_odd_only", "primes_in", tmp_path, maximum=10**6)
    divergence = summary["first_divergence"]
    losing_two = [f["arguments"] for f in summary["failures"] if f["status"] == "wrong"]
    assert divergence["prime"] == 2 and len(losing_two) > 1
    assert divergence["input"] == min(losing_two, key=lambda a: (a[1] - a[0], a[1]))


def test_factor_losing_multiplicity(tmp_path):
    summary = audit("_candidates:factor_set", "factor", tmp_path, maximum=10**6)
    assert summary["first_divergence"]["input"] == [4]


def test_failures_recorded_and_replayed_first(tmp_path):
    audit("_candidates:next_prime_inclusive", "next_prime", tmp_path, maximum=10**4)
    corpus = engine.load_corpus(tmp_path / "regressions.yaml")
    assert [2] in [entry["arguments"] for entry in corpus]
    again = audit("_candidates:next_prime_inclusive", "next_prime", tmp_path, maximum=10**4)
    first = next(r for r in engine.read_records(tmp_path / "r.jsonl") if r["type"] == "check")
    assert first["family"] == "regression"
    assert again["corpus_added"] == 0


def test_interrupted_stream_rebuilds_the_summary(tmp_path):
    summary = audit("_candidates:prime_pi_from_1000", "prime_pi", tmp_path, maximum=3000)
    path = tmp_path / "r.jsonl"
    assert engine.rebuild_summary(path)["failures"] == summary["failures"]
    lines = path.read_text().splitlines()
    records = [json.loads(line) for line in lines]
    first_failure = next(i for i, r in enumerate(records) if r.get("status") in engine.FAILURE_STATUSES)
    cut_at = first_failure + 1
    cut = tmp_path / "cut.jsonl"
    cut.write_text("\n".join(lines[:cut_at]) + "\n" + lines[cut_at][:17])   # killed mid-write
    partial = engine.rebuild_summary(cut)
    # line 0 is the start record, line 1 the plan, then checks up to the first failure;
    # the next line is torn
    assert records[1]["type"] == "plan" and records[1]["points"] > 100
    assert cut_at > 100 and all(r["type"] == "check" for r in records[2:cut_at])
    assert not partial["complete"] and partial["checks"] == cut_at - 2
    assert partial["seed"] == 3 and not partial["passed"]
    assert partial["failures"] == summary["failures"][:1]
    json.dumps(partial)


def test_a_candidate_wrong_everywhere_stops_after_enough_findings(tmp_path):
    summary = audit("_candidates:prime_pi_float", "prime_pi", tmp_path, profile="ci", maximum=10**6)
    enough = sampling.profile("ci").enough_findings
    # the batch in which the enough-th finding arrives is judged to its end
    assert enough <= len(summary["failures"]) < enough + BATCH
    assert summary["skipped"][f"the candidate had already failed {enough} checks"] > 1000


def test_a_hang_outside_the_domain_is_a_finding_but_skips_nothing_inside(tmp_path):
    summary = audit("_candidates:nth_prime_hangs_at_zero", "nth_prime", tmp_path, timeout=0.3,
                    maximum=3000)
    assert [f["arguments"] for f in summary["failures"]] == [[0]]
    assert summary["failures"][0]["status"] == "hung"           # outside the domain: never slow
    assert summary["skipped"].get("outside the domain, after a hang there") == 1      # nth_prime(-1)
    assert "at least as large as inputs that timed out" not in summary["skipped"]
    assert summary["passed_checks"] > 300          # the quick profile checks 1 ... 300 and more


def test_replay_asks_every_point_even_after_many_findings(tmp_path):
    target = targets.python_target("_candidates:prime_pi_float", role_name="prime_pi", timeout=2.0)
    try:
        summary = engine.run_audit(target, AuditOptions(role="prime_pi", profile="quick", seed=1),
                                   only=[(x,) for x in range(100)])
    finally:
        target.close()
    assert len(summary["failures"]) == 100


def test_every_record_reaches_the_on_record_callback(tmp_path):
    seen = []
    audit("_candidates:prime_pi_from_1000", "prime_pi", tmp_path, maximum=3000,
          on_record=seen.append)
    assert seen == engine.read_records(tmp_path / "r.jsonl")
    from oracle.report import Progress

    progress = Progress(description="replayed", quiet=True)
    for record in seen:
        progress.observe(record)
    assert progress.completed == sum(1 for r in seen if r["type"] == "check")
    assert progress.total == max(seen[1]["points"], progress.completed)


def test_no_completed_check_is_no_verdict(tmp_path):
    summary = audit("_candidates:prime_pi", "prime_pi", tmp_path, time_budget=0.0)
    assert summary["checks"] == 0 and summary["verdict"] == "no verdict"
    assert not summary["passed"] and not summary["complete"]
    assert summary["skipped"]["time budget spent"] == summary["not_run"] > 300


def test_maximum_below_the_role_minimum_is_refused(tmp_path):
    with pytest.raises(InvalidInputError, match="below the smallest input of nth_prime"):
        audit("_candidates:nth_prime", "nth_prime", tmp_path, maximum=0)


def test_early_stop_is_switchable_and_makes_the_run_incomplete(tmp_path):
    stopped = audit("_candidates:prime_pi_float", "prime_pi", tmp_path, maximum=3000, stop_after=3)
    assert 3 <= len(stopped["failures"]) < 3 + BATCH
    assert not stopped["complete"] and stopped["skipped"]["the candidate had already failed 3 checks"]
    every = audit("_candidates:prime_pi_float", "prime_pi", tmp_path, maximum=3000, early_stop=False)
    assert not any(reason.startswith("the candidate had already failed") for reason in every["skipped"])
    assert len(every["failures"]) > 300 and every["complete"]


def test_findings_of_an_interrupted_run_are_saved(tmp_path):
    def interrupt_at_the_first_finding(record):
        if record.get("status") == "wrong":
            raise KeyboardInterrupt

    with pytest.raises(engine.AuditInterrupted) as stopped:
        audit("_candidates:prime_pi_from_1000", "prime_pi", tmp_path,
              on_record=interrupt_at_the_first_finding)
    summary = stopped.value.summary
    assert summary["verdict"] == "failed" and not summary["complete"]
    assert summary["interrupted"] == "KeyboardInterrupt" and summary["corpus_added"] == 1
    assert [e["arguments"] for e in engine.load_corpus(tmp_path / "regressions.yaml")] == [[1000]]
    last = engine.read_records(tmp_path / "r.jsonl")[-1]
    assert last["type"] == "interrupted"        # pi(1000) = 168 (OEIS A006880) was the finding


def test_the_first_call_has_an_answer_unlike_a_default():
    # a candidate wrong on its first call in a process answers 0, false or [] there, which is
    # right at 0: the opening call is 97 (prime) or the interval [0, 40] instead
    from oracle import roles, sampling
    from oracle.engine._audit import _opening_first

    for name, opening in (("is_prime", (97,)), ("prime_pi", (97,)), ("primes_in", (0, 40)),
                          ("mobius", (97,))):
        role = roles.get(name)
        ordered = _opening_first(sorted(sampling.sample(role, sampling.profile("quick"), 1),
                                        key=lambda s: role.magnitude(s.arguments)), role)
        assert ordered[0].arguments == opening
        assert sorted(s.arguments for s in ordered) == sorted(
            s.arguments for s in sampling.sample(role, sampling.profile("quick"), 1))

