"""The regression corpus and the record stream: bounded, keyed by role and target, locked,
kept when a run is interrupted; and no verdict without evidence."""

import json
import threading

import pytest
import yaml

import _auditing
from oracle import InvalidInputError, engine
from oracle.engine import _corpus


def audit(spec, role, tmp_path, *, maximum=3000, **options):
    return _auditing.audit(spec, role, tmp_path, maximum=maximum, **options)


def write_corpus(path, entries):
    path.write_text(yaml.safe_dump({"regressions": entries}), encoding="utf-8")


def failure(x):
    return {"arguments": [x], "check": "exact", "status": "wrong", "detail": ""}


# -- writing: locked read-merge-write ------------------------------------------------------ #

def test_concurrent_recordings_lose_no_entry(tmp_path):
    for trial in range(20):
        path = tmp_path / f"c{trial}.yaml"
        barrier = threading.Barrier(2)

        def record(x):
            barrier.wait()
            engine.record_failures(path, [failure(x)], target=f"t{x}", role="prime_pi",
                                   seed=1, profile="quick")

        threads = [threading.Thread(target=record, args=(x,)) for x in (11, 22)]
        for thread in threads:
            thread.start()
        for thread in threads:
            thread.join()
        kept = sorted(entry["arguments"][0] for entry in engine.load_corpus(path))
        assert kept == [11, 22], f"trial {trial}"
    assert not list(tmp_path.glob("*.tmp")) and not list(tmp_path.glob(".*.tmp"))


def test_an_input_is_recorded_once_per_role_and_target(tmp_path):
    path = tmp_path / "c.yaml"
    assert engine.record_failures(path, [failure(5)], target="a", role="prime_pi", seed=1,
                                  profile="quick") == 1
    assert engine.record_failures(path, [failure(5)], target="a", role="prime_pi", seed=1,
                                  profile="quick") == 0
    assert engine.record_failures(path, [failure(5)], target="b", role="prime_pi", seed=1,
                                  profile="quick") == 1
    assert len(engine.load_corpus(path)) == 2


# -- reading: bounded and schema-checked ---------------------------------------------------- #

def test_a_bad_entry_is_named_with_its_file_and_line(tmp_path):
    path = tmp_path / "c.yaml"
    path.write_text("regressions:\n- role: prime_pi\n  arguments: [5]\n- role: prime_pi\n"
                    "  arguments: [five]\n", encoding="utf-8")
    with pytest.raises(InvalidInputError, match=r"c\.yaml: line 4: entry 1: .*integer arguments"):
        engine.load_corpus(path)


def test_too_many_entries_or_bytes_are_refused(tmp_path, monkeypatch):
    path = tmp_path / "c.yaml"
    write_corpus(path, [{"role": "prime_pi", "arguments": [x]} for x in range(6)])
    monkeypatch.setattr(_corpus, "MAX_ENTRIES", 5)
    with pytest.raises(InvalidInputError, match="6 entries, more than the limit of 5"):
        engine.load_corpus(path)
    monkeypatch.setattr(_corpus, "MAX_CORPUS_BYTES", 20)
    with pytest.raises(InvalidInputError, match="more than the limit of 20"):
        engine.load_corpus(path)


def test_an_alias_bomb_is_refused(tmp_path):
    path = tmp_path / "c.yaml"
    lines = ["a0: &a0 [x, x, x, x, x, x, x, x, x, x]"]
    lines += [f"a{i}: &a{i} [" + ", ".join([f"*a{i - 1}"] * 10) + "]" for i in range(1, 8)]
    path.write_text("\n".join(lines) + "\nregressions: []\n", encoding="utf-8")
    with pytest.raises(InvalidInputError, match="nodes with its aliases expanded"):
        engine.load_corpus(path)


def test_the_corpus_is_read_once_per_audit(tmp_path, monkeypatch):
    write_corpus(tmp_path / "regressions.yaml", [{"role": "prime_pi", "arguments": [7]}])
    reads = []
    real = _corpus.load_corpus
    monkeypatch.setattr("oracle.engine._audit.load_corpus", lambda p: reads.append(p) or real(p))
    audit("_candidates:prime_pi", "prime_pi", tmp_path, maximum=500)
    assert len(reads) == 1


# -- replaying: keyed by role and target, the domain respected ------------------------------ #

def test_entries_of_other_roles_targets_and_outside_the_domain(tmp_path):
    write_corpus(tmp_path / "regressions.yaml", [
        {"role": "factor", "arguments": [0], "target": "elsewhere:factor"},       # outside the domain
        {"role": "factor", "arguments": [5, 7], "target": "elsewhere:factor"},    # wrong arity
        {"role": "factor", "arguments": [360], "target": "elsewhere:factor"},     # another target
        {"role": "prime_pi", "arguments": [12345], "target": "_candidates:factor"},  # another role
    ])
    summary = audit("_candidates:factor", "factor", tmp_path, maximum=10**4)
    assert summary["verdict"] == "passed" and summary["complete"], summary["failures"]
    checks = [r for r in engine.read_records(tmp_path / "r.jsonl") if r["type"] == "check"]
    first = {tuple(r["arguments"]): r for r in checks[:3]}
    assert first[(360,)]["family"] == "regression (other target)"
    assert first[(360,)]["status"] == "pass"
    assert first[(360,)]["got"] == [[2, 3], [3, 2], [5, 1]]          # 360 = 2^3 * 3^2 * 5
    assert first[(0,)]["check"] == first[(5, 7)]["check"] == "invalid-input"
    assert (12345,) not in {tuple(r["arguments"]) for r in checks}


# -- the record stream ------------------------------------------------------------------ #

def test_garbled_lines_anywhere_are_skipped_and_counted(tmp_path):
    audit("_candidates:prime_pi_from_1000", "prime_pi", tmp_path)
    lines = (tmp_path / "r.jsonl").read_text().splitlines()
    whole = engine.rebuild_summary(tmp_path / "r.jsonl")
    damaged = tmp_path / "d.jsonl"
    damaged.write_text("\n".join(lines[:5] + [lines[5][:9], "\x00garbage", '{"type": "check"}']
                                 + lines[6:]) + "\n")
    summary = engine.rebuild_summary(damaged)
    assert summary["garbled_lines"] == 3
    assert summary["ended"] and summary["checks"] == whole["checks"] - 1
    assert summary["failures"] == whole["failures"] and summary["verdict"] == "failed"


def test_a_stream_without_end_has_no_verdict(tmp_path):
    audit("_candidates:prime_pi", "prime_pi", tmp_path, maximum=500)
    lines = (tmp_path / "r.jsonl").read_text().splitlines()
    assert json.loads(lines[-1])["type"] == "end"
    (tmp_path / "cut.jsonl").write_text("\n".join(lines[:-1]) + "\n")
    summary = engine.rebuild_summary(tmp_path / "cut.jsonl")
    assert summary["checks"] > 100 and not summary["failures"]
    assert summary["verdict"] == "no verdict" and not summary["passed"] and not summary["complete"]


def test_latest_pointer_is_a_link_replaced_atomically_or_a_copy(tmp_path):
    first, second = tmp_path / "runs" / "a.jsonl", tmp_path / "runs" / "b.jsonl"
    first.parent.mkdir()
    first.write_text('{"type": "start"}\n')
    second.write_text('{"type": "end"}\n')
    pointer = tmp_path / "last-audit.jsonl"
    engine.point_to_latest(first, pointer)
    engine.point_to_latest(second, pointer)
    assert pointer.is_symlink() and pointer.read_text() == '{"type": "end"}\n'
    engine.point_to_latest(first, pointer, copy=True)
    assert not pointer.is_symlink() and pointer.read_text() == '{"type": "start"}\n'


def test_run_paths_are_distinct(tmp_path):
    assert engine.new_run_path(tmp_path) != engine.new_run_path(tmp_path)


def test_recording_never_writes_a_corpus_too_large_to_read(tmp_path, monkeypatch):
    monkeypatch.setattr(_corpus, "MAX_CORPUS_BYTES", 2000)
    path = tmp_path / "c.yaml"
    added = engine.record_failures(path, [failure(x) for x in range(100)], target="t",
                                   role="prime_pi", seed=1, profile="quick")
    assert 0 < added < 100 and path.stat().st_size <= 2000
    assert len(engine.load_corpus(path)) == added
