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
