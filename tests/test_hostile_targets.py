"""Hostile and clumsy candidates (tests/hostile/): whatever a candidate does ends as a finding
with a true description or as a clean usage error -- never as PASSED, a traceback, a hang or
lost data -- and the judge, in its own process, is out of the candidate's reach.

The expected counts come from the candidates' own sieve, checked here against the oracle's
tables where they appear (π(1000) = 168, OEIS A006880).
"""

import json
import os
import signal
import subprocess
import sys
import time
from pathlib import Path

import pytest

import oracle.engine._audit
import oracle.engine._records
import oracle.facade
from oracle import InvalidInputError, engine, targets
from oracle.engine import AuditOptions
from oracle.targets import _line_process

TESTS = Path(__file__).parent
ROOT = TESTS.parent
SMALL = 3000        # every fault below triggers from 500 on; points above SMALL are skipped


def audit(spec, role="prime_pi", tmp_path=None, *, isolate=True, timeout=1.0, **options):
    target = targets.python_target(spec, role_name=role, timeout=timeout, isolate=isolate,
                                   python_path=[str(TESTS)] + sys.path)
    stream = tmp_path / "records.jsonl"
    try:
        summary = engine.run_audit(target, AuditOptions(role=role, profile="quick", seed=7,
                                                        maximum=options.pop("maximum", SMALL),
                                                        stream=str(stream), **options))
    finally:
        target.close()
    json.dumps(summary)         # a summary is always plain data, whatever the candidate returned
    records = engine.read_records(stream)
    assert records[-1]["type"] == "end", "the record stream must end with its end record"
    return summary


def statuses(summary):
    return {failure["status"] for failure in summary["failures"]}


def details(summary):
    return " | ".join(str(failure["detail"]) for failure in summary["failures"])


def environment():
    env = dict(os.environ, PYTHONPATH=os.pathsep.join([str(TESTS), str(ROOT)]),
               TERM="dumb", NO_COLOR="1")
    env.pop("COLUMNS", None)
    return env


def ntoracle(*argv, cwd, timeout=300):
    return subprocess.run([sys.executable, "-m", "oracle.cli", *argv], cwd=cwd, env=environment(),
                          capture_output=True, text=True, timeout=timeout)


# -- the judge is out of the candidate's reach ---------------------------------------------- #

def test_the_oracle_patching_candidate_fails_isolated_and_the_parent_never_imports_it(tmp_path):
    answer, statuses_before = oracle.facade.answer, oracle.engine._records.FAILURE_STATUSES
    summary = audit("hostile.patcher:prime_pi", tmp_path=tmp_path)
    assert not summary["passed"] and summary["verdict"] == "failed"
    # π(1000) = 168 (OEIS A006880); the candidate says 169 from 1000 on
    assert {"status": "wrong", "arguments": [1000], "got": 169, "expected": 168} \
        .items() <= next(f for f in summary["failures"] if f["arguments"] == [1000]).items()
    assert "hostile.patcher" not in sys.modules
    assert oracle.facade.answer is answer
    assert oracle.engine._records.FAILURE_STATUSES is statuses_before


def test_the_oracle_patching_candidate_fails_on_the_command_line_in_both_modes(tmp_path):
    for mode in ([], ["--in-process"]):
        result = ntoracle("audit", "hostile.patcher:prime_pi", "--role", "prime_pi", "--profile",
                          "quick", "--seed", "7", "--max", str(SMALL), "--json", "s.json", *mode,
                          cwd=tmp_path)
        assert result.returncode == 1, (mode, result.stdout[-2000:], result.stderr[-2000:])
        summary = json.loads((tmp_path / "s.json").read_text())
        assert summary["passed"] is False
        if mode:        # in this process: the tampering itself is the finding
            assert summary.get("tampered") and "FAILURE_STATUSES" in " ".join(summary["tampered"])
        else:
            assert any(f["arguments"] == [1000] and f["got"] == 169 for f in summary["failures"])


def test_the_oracle_patching_candidate_fails_in_the_pytest_plugin(tmp_path):
    (tmp_path / "pytest.ini").write_text("[pytest]\n")
    result = subprocess.run(
        [sys.executable, "-m", "pytest", "-p", "no:cacheprovider", "-q",
         "--ntoracle-target", "prime_pi=hostile.patcher:prime_pi", "--ntoracle-seed", "7",
         "-k", "tables"],
        cwd=tmp_path, env=environment(), capture_output=True, text=True, timeout=600)
    assert result.returncode == 1, result.stdout[-3000:]
    assert " failed" in result.stdout.splitlines()[-1]


# -- every fault is a finding with a true description --------------------------------------- #

FAULTS = [
    ("exits_zero", {"crashed"}, "exited with status 0"),
    ("segfaults", {"crashed"}, "SIGSEGV"),
    ("raises_keyboard_interrupt", {"raised"}, "KeyboardInterrupt"),
    ("raises_base_exception", {"raised"}, "Escape: not an Exception"),
    ("huge_answer", {"wrong"}, "an integer of 100001 digits"),
    ("floods_stdout", {"crashed"}, "SIGXFSZ"),
    ("always_equal", {"wrong-type"}, "AlwaysEqual"),
    ("lying_int", {"wrong"}, "got 0"),
    ("two_faced_int", {"wrong"}, "got 97, expected 96"),     # π(504) = 96, OEIS A000720
    ("raising_index", {"raised"}, "RuntimeError: no integer here"),
    ("interrupting_index", {"raised"}, "KeyboardInterrupt"),
    ("fraction_count", {"wrong-type"}, "a Fraction ("),     # named as the candidate's type
]


@pytest.mark.parametrize("name, kinds, description", FAULTS, ids=[f[0] for f in FAULTS])
def test_a_fault_of_an_isolated_candidate_is_a_finding_and_the_run_goes_on(tmp_path, name, kinds,
                                                                          description):
    summary = audit(f"hostile.faults:{name}", tmp_path=tmp_path)
    assert summary["verdict"] == "failed"
    assert statuses(summary) == kinds
    assert description in details(summary) or description in json.dumps(summary["failures"])
    assert summary["passed_checks"] > 100        # the points below 500 were still judged


def test_a_worker_that_exits_leaving_a_process_holding_its_pipe_crashed_and_the_process_ends(
        tmp_path, monkeypatch):
    # the escaped process keeps the answer pipe open, so its end is never seen: the worker's
    # own exit must be noticed (not a "hung" after the timeout) and the escaped process killed
    pid_file = tmp_path / "escaped.pid"
    monkeypatch.setenv("HOSTILE_PID_FILE", str(pid_file))
    summary = audit("hostile.faults:escapes_and_exits", tmp_path=tmp_path, timeout=5.0)
    assert statuses(summary) == {"crashed"}
    assert "exited with status 0" in details(summary)
    assert "outside its process group were still running and were killed" in details(summary)
    escaped = int(pid_file.read_text())
    deadline = time.monotonic() + 10
    while _alive(escaped) and time.monotonic() < deadline:
        time.sleep(0.05)
    assert not _alive(escaped), "the escaped process outlived the worker"


def test_a_swallowed_timeout_is_still_a_timeout_in_the_worker(tmp_path):
    summary = audit("hostile.faults:swallows_the_timeout", tmp_path=tmp_path, timeout=0.5)
    assert statuses(summary) <= {"too-slow", "hung"} and summary["failures"]
    assert min(f["arguments"][0] for f in summary["failures"]) >= 500


@pytest.mark.parametrize("name, kinds, description", [
    ("raises_keyboard_interrupt", {"raised"}, "KeyboardInterrupt"),
    ("raises_base_exception", {"raised"}, "Escape"),
    ("huge_answer", {"wrong"}, "an integer of 100001 digits"),
    ("lying_int", {"wrong"}, "got 0"),
    # the answer's own methods run inside the call, not later in the judge (which they ended
    # with an internal error, exit 4, or, raising KeyboardInterrupt, as if the user had pressed
    # Ctrl-C)
    ("two_faced_int", {"wrong"}, "got 97, expected 96"),     # π(504) = 96, OEIS A000720
    ("raising_index", {"raised"}, "RuntimeError: no integer here"),
    ("interrupting_index", {"raised"}, "KeyboardInterrupt"),
    ("hangs_in_repr", {"hung"}, "no answer"),        # the repr ran in the judge, untimed: a hang
    ("fraction_count", {"wrong-type"}, "a Fraction ("),
])
def test_in_process_faults_that_the_trusting_mode_still_contains(tmp_path, name, kinds, description):
    summary = audit(f"hostile.faults:{name}", tmp_path=tmp_path, isolate=False)
    assert statuses(summary) == kinds and description in details(summary)


@pytest.mark.parametrize("isolate", [True, False], ids=["isolated", "in-process"])
def test_an_endless_iterator_is_consumed_only_so_far(tmp_path, isolate, monkeypatch):
    from oracle.targets import _worker

    monkeypatch.setattr(_worker, "MAX_ITEMS", 10_000)      # in-process only; the worker's is 2**24
    summary = audit("hostile.faults:endless_listing", "primes_in", tmp_path, isolate=isolate,
                    timeout=5.0)
    assert summary["verdict"] == "failed" and statuses(summary) <= {"wrong", "too-slow"}
    assert "iterator that yielded more than" in details(summary) or "no answer" in details(summary)


def test_a_candidate_that_prints_is_judged_on_its_answers_alone(tmp_path):
    summary = audit("hostile.faults:chatty", tmp_path=tmp_path)
    assert summary["passed"] and summary["checks"] > 300


def test_a_module_that_exits_while_imported_is_a_clean_usage_error(tmp_path):
    with pytest.raises(InvalidInputError, match="ended while importing"):
        targets.python_target("hostile.import_exits:prime_pi", role_name="prime_pi", timeout=1.0,
                              python_path=[str(TESTS)] + sys.path)
    result = ntoracle("audit", "hostile.import_exits:prime_pi", "--role", "prime_pi", cwd=tmp_path)
    assert result.returncode == 2 and "Traceback" not in result.stderr + result.stdout


@pytest.mark.parametrize("timeout", [float("inf"), float("nan"), 1e20, 0.0, -1.0])
def test_timeouts_must_be_finite_and_positive(timeout):
    with pytest.raises(InvalidInputError, match="timeout"):
        targets.python_target("math:isqrt", role_name="prime_pi", timeout=timeout)


def test_the_exit_code_is_the_harness_s_when_the_candidate_exits(tmp_path):
    result = ntoracle("audit", "hostile.faults:exits_zero", "--role", "prime_pi", "--profile",
                      "quick", "--seed", "7", "--max", str(SMALL), "--json", "s.json", cwd=tmp_path)
    assert result.returncode == 1
    summary = json.loads((tmp_path / "s.json").read_text())
    assert summary["verdict"] == "failed" and "exited with status 0" in json.dumps(summary)
    assert "FAILED" in result.stdout


def test_the_html_report_is_drawn_from_the_records_written_not_from_the_file_the_candidate_edits(
        tmp_path):
    result = ntoracle("audit", "hostile.faults:doctors_its_results_file", "--role", "prime_pi",
                      "--profile", "quick", "--seed", "7", "--max", str(SMALL), "--report", "rep",
                      cwd=tmp_path)
    assert result.returncode == 0, result.stdout[-2000:] + result.stderr[-2000:]
    (stream,) = (tmp_path / ".ntoracle" / "runs").glob("*.jsonl")
    assert '"seed": 8,' in stream.read_text()          # the candidate did edit the file
    page = (tmp_path / "rep" / "report.html").read_text()
    assert "--seed 7" in page and "--seed 8" not in page


@pytest.mark.parametrize("name", ["raises_terminal_codes", "prints_terminal_codes_and_exits"])
def test_a_candidate_s_text_cannot_drive_the_terminal_or_forge_a_verdict_line(tmp_path, name):
    result = ntoracle("audit", f"hostile.faults:{name}", "--role", "prime_pi", "--profile", "quick",
                      "--seed", "7", "--max", str(SMALL), "--report", "rep", cwd=tmp_path)
    assert result.returncode == 1
    for text in (result.stdout, (tmp_path / "rep" / "report.txt").read_text()):
        assert "PASSED: 999" in text                        # shown, as text
        assert not any(code in text for code in ("\x1b", "\r", "\x07"))
        assert not any(line.startswith("PASSED") for line in text.splitlines())
        assert any(line.startswith("FAILED: ") for line in text.splitlines())


def test_a_closed_output_pipe_does_not_turn_a_failed_audit_into_exit_0(tmp_path):
    # `ntoracle audit ... | head`: the reader goes away early; the exit code must stay the verdict's
    process = subprocess.Popen([sys.executable, "-m", "oracle.cli", "audit", "hostile.faults:lying_int",
                                "--role", "prime_pi", "--profile", "quick", "--seed", "7",
                                "--max", str(SMALL)], cwd=tmp_path, env=environment(),
                               stdout=subprocess.PIPE, stderr=subprocess.DEVNULL)
    process.stdout.close()
    assert process.wait(timeout=300) == 1
    assert (tmp_path / ".ntoracle" / "regressions.yaml").exists()      # the findings were saved


def test_a_harness_sent_sigterm_saves_its_findings_and_exits_130(tmp_path):
    result = ntoracle("audit", "hostile.faults:terminates_the_harness", "--role", "prime_pi",
                      "--profile", "quick", "--seed", "7", "--max", str(SMALL), cwd=tmp_path)
    assert result.returncode == 130, (result.returncode, result.stderr[-2000:])
    assert "run interrupted" in result.stdout and "findings so far are saved" in result.stderr
    saved = {tuple(entry["arguments"]) for entry in
             engine.load_corpus(tmp_path / ".ntoracle" / "regressions.yaml")}
    # The audit asks 97 first (oracle.engine: a point with a non-trivial answer), then the small
    # exhaustive points from 0: all four answers before the SIGTERM were one too many, and saved
    # (π(97) = 25, π(0) = π(1) = 0, OEIS A000720)
    assert {(97,), (0,), (1,)} <= saved and len(saved) >= 3


# -- executables ----------------------------------------------------------------------------- #

def test_a_command_that_cannot_be_run_is_a_usage_error_not_a_crash_at_every_call(tmp_path):
    script = tmp_path / "pi.sh"
    script.write_text("#!/nonexistent/interpreter\n")       # executable, but exec fails
    script.chmod(0o755)
    with pytest.raises(InvalidInputError, match="cannot run"):
        targets.exec_target(str(script), role_name="prime_pi", timeout=1.0)
    result = ntoracle("audit", "--exec", str(script), "--role", "prime_pi", "--profile", "quick",
                      "--max", "100", cwd=tmp_path)
    assert result.returncode == 2 and "cannot run" in result.stderr
    assert "Traceback" not in result.stdout + result.stderr


@pytest.fixture
def chatty_exec():
    target = targets.exec_target(f"{sys.executable} {TESTS / 'hostile' / 'chatty_exec.py'}",
                                 role_name="prime_pi", timeout=2.0)
    yield target
    target.close()


def test_an_extra_line_is_pinned_on_the_call_that_printed_it(chatty_exec):
    results = chatty_exec.call_many([(10,), (11,), (12,), (13,), (14,), (15,), (16,), (100,)])
    assert [r.status for r in results] == ["ok", "ok", "ok", "bad-output", "ok", "ok", "ok", "ok"]
    # π(10), π(11), π(12), π(14), π(15), π(16), π(100): OEIS A000720
    assert [r.value for r in results if r.status == "ok"] == [4, 5, 5, 6, 6, 6, 25]
    assert "more than one line" in results[3].error


def test_an_executable_exit_is_described_by_its_own_status(chatty_exec):
    results = chatty_exec.call_many([(16,), (17,), (18,)])
    assert [r.status for r in results] == ["ok", "crashed", "ok"]
    assert "exited with status 3" in results[1].error and "signal" not in results[1].error
    assert [results[0].value, results[2].value] == [6, 7]         # OEIS A000720


def test_an_endless_answer_line_is_a_flood(chatty_exec, monkeypatch):
    monkeypatch.setattr(_line_process, "MAX_LINE", 8 * 2**20)     # the line is 20 MiB
    results = chatty_exec.call_many([(19,), (20,)])
    assert [r.status for r in results] == ["bad-output", "ok"]
    assert "flooded" in results[0].error and results[1].value == 8     # π(20) = 8, OEIS A000720


def test_an_isolated_worker_dies_with_the_harness(tmp_path):
    script = tmp_path / "harness.py"
    script.write_text(
        "import sys, time\n"
        "from oracle import targets\n"
        f"t = targets.python_target('hostile.faults:chatty', role_name='prime_pi', timeout=5.0,"
        f" python_path=[{str(TESTS)!r}] + sys.path)\n"
        "print(t.process.pid, flush=True)\n"
        "time.sleep(600)\n")
    harness = subprocess.Popen([sys.executable, str(script)], env=environment(),
                               stdout=subprocess.PIPE, text=True)
    worker = int(harness.stdout.readline())
    assert _alive(worker)
    harness.send_signal(signal.SIGKILL)
    harness.wait()
    deadline = time.monotonic() + 10
    while _alive(worker) and time.monotonic() < deadline:
        time.sleep(0.05)
    assert not _alive(worker), "the worker outlived the harness"


def _alive(pid: int) -> bool:
    try:
        state = Path(f"/proc/{pid}/stat").read_text().rsplit(")", 1)[1].split()[0]
    except (FileNotFoundError, ProcessLookupError, IndexError):
        return False
    return state not in ("Z", "X")       # a zombie has ended; only its parent's wait is missing


# -- the corpus under concurrent audits -------------------------------------------------------- #

AUDITS = [["audit", "hostile.patcher:prime_pi", "--role", "prime_pi", "--profile", "quick",
           "--seed", "7", "--max", "1500"],
          ["audit", "_candidates:nth_prime_zero_based", "--role", "nth_prime", "--profile",
           "quick", "--seed", "1", "--max", "400"]]


def _audits(folders: list[Path]) -> None:
    """The two audits at once, the first in ``folders[0]``, the second in ``folders[-1]``."""
    processes = [subprocess.Popen([sys.executable, "-m", "oracle.cli", *command], cwd=folder,
                                  env=environment(), stdout=subprocess.DEVNULL,
                                  stderr=subprocess.PIPE, text=True)
                 for command, folder in zip(AUDITS, [folders[0], folders[-1]])]
    for process in processes:
        assert process.wait(timeout=300) == 1, process.stderr.read()[-2000:]


def _findings_in_streams(folder: Path) -> list:
    """(role, target, arguments) of every finding in the results streams of ``folder``."""
    found = set()
    for path in (folder / ".ntoracle" / "runs").glob("*.jsonl"):
        records = engine.read_records(path)
        start = next(r for r in records if r.get("type") == "start")
        found.update((start["role"], start["target"], tuple(r["arguments"])) for r in records
                     if r.get("type") == "check" and r["status"] in engine.FAILURE_STATUSES
                     and r["family"] not in ("identity", "harness"))
    return sorted(found)


def _entries(folder: Path) -> list:
    return sorted((e["role"], e["target"], tuple(e["arguments"]))
                  for e in engine.load_corpus(folder / ".ntoracle" / "regressions.yaml"))


@pytest.mark.parametrize("trials", [pytest.param(2, id="2-trials"),
                                    pytest.param(20, id="20-trials", marks=pytest.mark.slow)])
def test_two_concurrent_audits_keep_every_corpus_entry(tmp_path, trials):
    # What each audit found is read from its own results stream (the number of findings
    # may vary with the machine's load, which the time budget follows); the shared corpus
    # must hold every one of them, once, whole.
    for trial in range(trials):
        together = _fresh(tmp_path / f"trial{trial}")
        _audits([together])
        expected = _findings_in_streams(together)
        assert {role for role, _, _ in expected} == {"prime_pi", "nth_prime"}
        assert _entries(together) == expected, f"trial {trial}"


def _fresh(folder: Path) -> Path:
    folder.mkdir()
    return folder
