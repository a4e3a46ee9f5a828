"""``ntoracle audit`` and ``ntoracle replay``: the DESIGN contract (exit codes, --json, seed)."""

import json
import sys

import pytest

from oracle import cli


def run(capsys, *argv):
    code = cli.main(list(argv))
    out, err = capsys.readouterr()
    return code, out, err


@pytest.fixture
def in_tmp(tmp_path, monkeypatch):
    monkeypatch.chdir(tmp_path)
    return tmp_path


def test_passing_audit_exits_0_and_prints_the_seed(capsys, in_tmp):
    code, out, _ = run(capsys, "audit", "_candidates:prime_pi", "--profile", "quick",
                       "--seed", "42", "--max", "10**4", "--json", "s.json")
    assert code == 0
    assert "seed 42" in out and "evidence, not a certificate" in out
    summary = json.loads((in_tmp / "s.json").read_text())
    assert summary["passed"] and summary["seed"] == 42 and summary["role"] == "prime_pi"
    assert {"target", "profile", "checks", "failures", "first_divergence", "timings"} <= set(summary)
    assert (in_tmp / ".ntoracle" / "last-audit.jsonl").exists()


def test_failing_audit_exits_1_records_and_replays(capsys, in_tmp):
    code, out, _ = run(capsys, "audit", "_candidates:nth_prime_zero_based", "--role", "nth_prime",
                       "--profile", "quick",
                       "--seed", "1", "--max", "5000")
    assert code == 1
    assert "first divergence: [1]" in out                # p_1 = 2, the candidate answers 3
    assert (in_tmp / ".ntoracle" / "regressions.yaml").exists()
    code, out, _ = run(capsys, "replay", ".ntoracle/regressions.yaml")
    assert code == 1 and "still failing" in out
    code, out, _ = run(capsys, "replay", ".ntoracle/regressions.yaml", "_candidates:nth_prime",
                       "--role", "nth_prime")
    assert code == 0 and "0 still failing" in out


def test_exec_target_audit(capsys, in_tmp):
    script = in_tmp / "pi.py"
    script.write_text("import sys, sympy\nfor line in sys.stdin:\n"
                      "    print(sympy.primepi(int(line)), flush=True)\n")
    code, out, _ = run(capsys, "audit", "--exec", f"{sys.executable} {script}", "--role", "prime_pi",
                       "--profile", "quick", "--seed", "2", "--max", "3000", "--no-corpus")
    assert code == 0, out


@pytest.mark.parametrize("argv", [
    ["audit"],                                                     # no target
    ["audit", "_candidates:frobnicate_numbers"],                   # no such function
    ["audit", "_candidates:prime_pi", "--timeout", "0"],
    ["audit", "_candidates:prime_pi", "--seed", "-3"],
    ["audit", "_candidates:prime_pi", "--profile", "fast"],
    ["replay", "no-such-file.yaml"],
])
def test_usage_errors_exit_2(capsys, in_tmp, argv):
    with pytest.raises(SystemExit) as raised:
        raise SystemExit(cli.main(argv))
    assert raised.value.code == 2


def test_role_inferred_from_the_function_name(capsys, in_tmp):
    code, out, _ = run(capsys, "audit", "_candidates:is_prime", "--profile", "quick", "--seed", "1",
                       "--no-corpus", "--max", "10**6")
    assert code == 0 and "as is_prime" in out


def test_quiet_audit_lists_no_findings_but_keeps_verdict_and_divergence(capsys, in_tmp):
    code, out, err = run(capsys, "audit", "_candidates:nth_prime_zero_based", "--role", "nth_prime",
                         "--profile", "quick", "--seed", "1", "--max", "5000", "--quiet",
                         "--no-corpus")
    assert code == 1
    assert "FAILED" in out and "first divergence: [1]" in out
    assert not [line for line in out.splitlines() if line.startswith("  wrong")]
    assert "\x1b[" not in out + err


def test_report_directory_holds_the_html_report(capsys, in_tmp):
    code, out, _ = run(capsys, "audit", "_candidates:nth_prime_zero_based", "--role", "nth_prime",
                       "--profile", "quick", "--seed", "1", "--max", "5000", "--no-corpus",
                       "--report", "rep")
    assert code == 1
    page = (in_tmp / "rep" / "report.html").read_text()
    assert "data:image/png;base64," in page and "nth_prime" in page
    assert json.loads((in_tmp / "rep" / "summary.json").read_text())["passed"] is False


def test_max_below_the_role_minimum_is_a_usage_error(capsys, in_tmp):
    code, _, err = run(capsys, "audit", "_candidates:prime_pi", "--max", "-1", "--no-corpus")
    assert code == 2 and "below the smallest input of prime_pi" in err


def test_summary_of_a_stream_without_end_is_no_verdict(capsys, in_tmp):
    code, _, _ = run(capsys, "audit", "_candidates:prime_pi", "--profile", "quick", "--seed", "1",
                     "--max", "500", "--no-corpus", "--stream", "r.jsonl")
    assert code == 0
    lines = (in_tmp / "r.jsonl").read_text().splitlines()
    (in_tmp / "cut.jsonl").write_text("\n".join(lines[:-1]) + "\n")
    code, out, err = run(capsys, "audit", "--summary-from", "cut.jsonl", "--json", "s.json")
    assert code == cli.EXIT_NO_VERDICT == 5
    assert out.startswith("NO VERDICT") and "no end record" in err
    summary = json.loads((in_tmp / "s.json").read_text())
    assert summary["verdict"] == "no verdict" and not summary["passed"] and not summary["complete"]


def test_early_stop_shown_in_the_verdict_and_switchable(capsys, in_tmp):
    code, out, _ = run(capsys, "audit", "_candidates:prime_pi_float", "--role", "prime_pi",
                       "--profile", "quick", "--seed", "1", "--max", "3000", "--no-corpus",
                       "--stop-after", "2", "--json", "s.json")
    assert code == 1 and "point(s) not run: the candidate had already failed 2 checks" in out
    assert json.loads((in_tmp / "s.json").read_text())["complete"] is False
    code, _, err = run(capsys, "audit", "_candidates:prime_pi", "--stop-after", "2", "--no-early-stop")
    assert code == 2 and "not both" in err


def test_each_run_has_its_own_stream_and_the_pointer_follows(capsys, in_tmp):
    for seed in ("1", "2"):
        code, _, _ = run(capsys, "audit", "_candidates:prime_pi", "--profile", "quick",
                         "--seed", seed, "--max", "500", "--no-corpus")
        assert code == 0
    runs = sorted((in_tmp / ".ntoracle" / "runs").iterdir())
    assert len(runs) == 2
    pointer = in_tmp / ".ntoracle" / "last-audit.jsonl"
    assert pointer.resolve() == runs[-1].resolve()
    assert json.loads(pointer.read_text().splitlines()[0])["seed"] == 2


def test_replay_never_runs_a_recorded_command(capsys, in_tmp):
    script = in_tmp / "pi.py"
    script.write_text("import sys, sympy\nfor line in sys.stdin:\n"
                      "    print(sympy.primepi(int(line)), flush=True)\n")
    (in_tmp / "c.yaml").write_text(
        "regressions:\n"
        "- {role: prime_pi, arguments: [10], target: touch pwned, kind: exec}\n"
        "- {role: nth_prime, arguments: [1], target: '_candidates:nth_prime_zero_based'}\n")
    code, out, _ = run(capsys, "replay", "c.yaml", "--role", "prime_pi")
    assert code == cli.EXIT_NO_VERDICT and "never run" in out
    assert not (in_tmp / "pwned").exists()
    code, out, _ = run(capsys, "replay", "c.yaml", "--role", "prime_pi",
                       "--exec", f"{sys.executable} {script}")
    assert code == 0 and "1 recorded input(s), 0 still failing" in out   # pi(10) = 4 (sympy)
    code, out, _ = run(capsys, "replay", "c.yaml", "--role", "nth_prime")
    assert code == 1 and "never run" not in out and "as nth_prime" in out


# -- option ranges and output paths (issue 11, bounded inputs) ---------------- #

def usage_error(capsys, *argv):
    """The exit code and stderr of a command refused by argparse or by the command itself."""
    try:
        code = cli.main(list(argv))
    except SystemExit as stop:
        code = stop.code
    return code, capsys.readouterr().err


@pytest.mark.parametrize("command", [["audit", "_candidates:prime_pi"], ["replay", "c.yaml"]])
@pytest.mark.parametrize("option, value", [
    ("--timeout", "inf"), ("--timeout", "nan"), ("--timeout", "1e20"), ("--timeout", "0"),
    ("--timeout", "-1"), ("--timeout", "86400.5"), ("--timeout", "soon"),
    ("--memory-limit", "0"), ("--memory-limit", "-5"), ("--memory-limit", "99999999999999"),
])
def test_out_of_range_options_exit_2_with_one_line_naming_the_option(capsys, in_tmp, command,
                                                                       option, value):
    code, err = usage_error(capsys, *command, option, value)
    assert code == 2
    assert len(err.strip().splitlines()) == 1 and option in err and "Traceback" not in err
    assert not (in_tmp / ".ntoracle").exists()


@pytest.mark.parametrize("argv", [
    ["audit", "_candidates:prime_pi", "--seed", "-1"],
    ["audit", "_candidates:prime_pi", "--seed", "2**64"],
    ["audit", "_candidates:prime_pi", "--seed", "10**5000"],
    ["demo", "--seed", "18446744073709551616"],
    ["value", "pi", "10", "--budget", "inf"],
    ["value", "pi", "10", "--budget", "nan"],
    ["value", "pi", "10", "--budget", "-1"],
    ["audit", "_candidates:prime_pi", "--max", "10**10**10"],
])
def test_seed_budget_and_max_are_bounded(capsys, in_tmp, argv):
    code, err = usage_error(capsys, *argv)
    assert code == 2 and len(err.strip().splitlines()) == 1 and "Traceback" not in err


def test_memory_limit_bound_is_this_machines_physical_memory(capsys, in_tmp):
    import os

    physical = os.sysconf("SC_PAGE_SIZE") * os.sysconf("SC_PHYS_PAGES") // 2**20
    code, err = usage_error(capsys, "audit", "_candidates:prime_pi", "--memory-limit",
                            str(physical + 1))
    assert code == 2 and f"<= {physical} MiB" in err
    # at the bound and with a day's timeout the options are accepted (the audit then runs)
    code, out, _ = run(capsys, "audit", "_candidates:prime_pi", "--memory-limit", str(physical),
                       "--timeout", "86400", "--seed", str(2**64 - 1), "--profile", "quick",
                       "--max", "300", "--no-corpus")
    assert code == 0 and f"seed {2**64 - 1}" in out


def _marking_candidate(folder, name):
    """A module whose prime_pi leaves a file 'called' behind when it is called at all."""
    (folder / f"{name}.py").write_text(
        "import pathlib, sympy\n"
        "def prime_pi(x):\n"
        "    pathlib.Path('called').touch()\n"
        "    return int(sympy.primepi(x))\n")
    return f"{name}:prime_pi"


@pytest.mark.parametrize("option, where", [
    ("--json", "afile/out.json"),             # below a regular file: cannot be created
    ("--json", "afile/deeper/out.json"),
    ("--json", "folder"),                     # a folder where a file is expected
    ("--json", "/proc/no-such/out.json"),
    ("--report", "afile/report"),
    ("--corpus", "afile/regressions.yaml"),
    ("--corpus", "folder"),
    ("--stream", "afile/results.jsonl"),
])
def test_unwritable_output_paths_refused_before_the_candidate_is_called(capsys, in_tmp, option,
                                                                         where):
    (in_tmp / "afile").write_text("a regular file\n")
    (in_tmp / "folder").mkdir()
    target = _marking_candidate(in_tmp, f"marking_{abs(hash((option, where)))}")
    before = sorted(p.name for p in in_tmp.iterdir())
    code, err = usage_error(capsys, "audit", target, "--profile", "quick", "--max", "300",
                            option, where)
    assert code == 2 and len(err.strip().splitlines()) == 1 and option in err and where in err
    assert not (in_tmp / "called").exists()                       # the candidate was never called
    after = sorted(p.name for p in in_tmp.iterdir() if not p.name.startswith("__pycache__"))
    assert after == before                                        # and nothing was left behind
    assert (in_tmp / "afile").read_text() == "a regular file\n"


def test_default_results_folder_that_cannot_be_made_is_refused(capsys, in_tmp):
    (in_tmp / ".ntoracle").write_text("not a folder\n")
    target = _marking_candidate(in_tmp, "marking_results_folder")
    code, err = usage_error(capsys, "audit", target, "--profile", "quick", "--max", "300",
                            "--no-corpus")
    assert code == 2 and "results folder" in err and not (in_tmp / "called").exists()


def test_writable_outputs_pass_the_check_and_missing_folders_are_made(capsys, in_tmp):
    code, _, _ = run(capsys, "audit", "_candidates:prime_pi", "--profile", "quick", "--max", "300",
                     "--seed", "3", "--no-corpus", "--json", "new/deeper/s.json",
                     "--report", "rep/inner", "--stream", "streams/r.jsonl")
    assert code == 0
    assert json.loads((in_tmp / "new" / "deeper" / "s.json").read_text())["seed"] == 3
    assert (in_tmp / "rep" / "inner" / "report.html").exists()
    assert (in_tmp / "streams" / "r.jsonl").exists()
    assert not [p for p in in_tmp.rglob(".ntoracle-probe-*")]


def test_output_folder_made_by_a_concurrent_run_in_the_meantime_is_accepted(in_tmp, monkeypatch):
    """Two audits starting at once both find ``.ntoracle/runs`` missing; the second one's
    mkdir then meets the folder the first made, which is fine (the clean-clone CI met this)."""
    import os
    from oracle import _options
    real_mkdir = os.mkdir

    def raced_mkdir(path, *args, **kwargs):       # the other run makes it just before us
        real_mkdir(path, *args, **kwargs)
        raise FileExistsError(17, "File exists", path)

    monkeypatch.setattr(os, "mkdir", raced_mkdir)
    created: list = []
    _options.check_output_folder(in_tmp / "a" / "b", "--report", created)
    _options.check_output_file(in_tmp / "c" / "s.json", "--json", created)
    assert (in_tmp / "a" / "b").is_dir() and (in_tmp / "c").is_dir()
    assert created == []                       # made by the other run: not ours to remove
    assert not (in_tmp / "c" / "s.json").exists()


def test_replay_and_summary_check_the_json_path_and_demo_the_report_folder(capsys, in_tmp):
    (in_tmp / "afile").write_text("x\n")
    (in_tmp / "c.yaml").write_text("regressions:\n- {role: prime_pi, arguments: [10], "
                                   "target: '_candidates:prime_pi'}\n")
    code, err = usage_error(capsys, "replay", "c.yaml", "--json", "afile/s.json")
    assert code == 2 and "--json" in err
    (in_tmp / "r.jsonl").write_text('{"type": "start", "role": "prime_pi"}\n')
    code, err = usage_error(capsys, "audit", "--summary-from", "r.jsonl", "--json", "afile/s.json")
    assert code == 2 and "--json" in err
    code, err = usage_error(capsys, "demo", "--report", "afile/rep")
    assert code == 2 and "--report" in err
    assert sorted(p.name for p in in_tmp.iterdir()) == ["afile", "c.yaml", "r.jsonl"]


HUGE_CANDIDATES = '''
TEXT = "<b>" + "y" * (10 * 2**20)
LISTING = list(range(10**7))

def prime_pi(x):
    return 10**100000 + x

def is_prime(n):
    return TEXT

def primes_in(a, b):
    return LISTING
'''


@pytest.mark.parametrize("function, shown", [
    ("prime_pi", "got an integer of 100001 digits"),       # 10**100000 + x: 100001 digits
    ("is_prime", f"({3 + 10 * 2**20} characters)"),
    ("primes_in", " of 10000000 items)"),
])
def test_huge_answers_are_shown_cut_in_the_terminal_and_stored_bounded(capsys, in_tmp, function,
                                                                        shown):
    (in_tmp / "huge_answers.py").write_text(HUGE_CANDIDATES)
    # a generous --timeout: the isolated worker sends ten million items over its pipe, which
    # takes seconds on a loaded machine, and the answer must be judged, not timed out
    code, out, err = run(capsys, "audit", f"huge_answers:{function}", "--profile", "quick",
                         "--max", "40", "--seed", "1", "--stop-after", "2", "--no-corpus",
                         "--stream", "r.jsonl", "--json", "s.json", "--report", "rep",
                         "--timeout", "60")
    assert code == 1, err
    assert shown in out                                         # the terminal
    page = (in_tmp / "rep" / "report.html").read_text()
    assert shown in page and "<b>" not in page                   # the HTML report, escaped
    assert max(len(line) for line in out.splitlines()) < 1000
    for name in ("r.jsonl", "s.json", "rep/summary.json", "rep/report.txt"):
        assert max(len(line) for line in (in_tmp / name).read_bytes().splitlines()) < 64 * 2**10
    assert (in_tmp / "s.json").stat().st_size < 256 * 2**10


HUGE_FACTORISATIONS = '''
def big_exponent(n):
    return {2: 10**12}                 # 2**(10**12): never to be multiplied out

def big_factor(n):
    return {10**4100 + 1: 1}           # more digits than any input has

def zero_factor(n):
    return {0: 1, 3: 10**12}
'''


@pytest.mark.parametrize("function, detail", [
    ("big_exponent", "the product of the factors has at least"),
    ("big_factor", "is larger than n"),
    ("zero_factor", "the factor 0 makes the product 0"),
])
def test_absurd_factorisations_are_wrong_answers_not_errors(capsys, in_tmp, function, detail):
    (in_tmp / "huge_factors.py").write_text(HUGE_FACTORISATIONS)
    code, out, err = run(capsys, "audit", f"huge_factors:{function}", "--role", "factor",
                         "--profile", "quick", "--max", "40", "--seed", "1", "--stop-after", "3",
                         "--no-corpus", "--stream", "r.jsonl")
    assert code == 1, err
    assert "[wrong] factorization at (2)" in out and detail in out
    assert max(len(line) for line in (in_tmp / "r.jsonl").read_bytes().splitlines()) < 64 * 2**10


# --- role inference only from exact names and the listed aliases (issue 12 item 5) ------------

@pytest.mark.parametrize("target", ["_candidates:prime_pi_exclusive", "_candidates:nth_prime_zero_based",
                                    "sympy:prime", "sympy:primepi_but_not"])
def test_a_name_that_is_no_role_or_alias_is_a_usage_error_asking_for_role(capsys, in_tmp, target):
    code, out, err = run(capsys, "audit", target, "--profile", "quick", "--seed", "1", "--no-corpus")
    assert code == 2 and "--role" in err and "cannot infer" in err
    assert not (in_tmp / ".ntoracle" / "runs").exists() or not list((in_tmp / ".ntoracle" / "runs").iterdir())


def test_an_exec_target_named_after_no_role_needs_role(capsys, in_tmp):
    code, _, err = run(capsys, "audit", "--exec", f"{sys.executable} -c pass", "--profile", "quick")
    assert code == 2 and "--role" in err


def _two_role_corpus(path):
    path.write_text(
        "regressions:\n"
        "- {role: prime_pi, arguments: [1000], target: '_candidates:prime_pi_exclusive', kind: python}\n"
        "- {role: is_prime, arguments: [341], target: '_candidates:is_prime_fermat', kind: python}\n")


def test_replay_role_selects_one_role_of_a_corpus(capsys, in_tmp):
    _two_role_corpus(in_tmp / "corpus.yaml")
    code, out, _ = run(capsys, "replay", "corpus.yaml", "--role", "is_prime")
    assert code == 1 and "as is_prime: 1 recorded input(s), 1 still failing" in out
    assert "prime_pi" not in out.replace("is_prime", "")
    code, out, _ = run(capsys, "replay", "corpus.yaml", "_candidates:is_prime", "--role", "is_prime")
    assert code == 0 and "0 still failing" in out


def test_replay_with_a_target_refuses_a_corpus_of_several_roles(capsys, in_tmp):
    _two_role_corpus(in_tmp / "corpus.yaml")
    code, out, err = run(capsys, "replay", "corpus.yaml", "_candidates:is_prime")
    assert code == 2 and "--role" in err and "prime_pi" in err and "is_prime" in err
