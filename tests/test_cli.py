"""The ntoracle command line: contract of docs/DESIGN.md (output, JSON keys, exit codes)."""

import json
import subprocess
import sys

import pytest

from oracle.cli import main


def run(capsys, *argv):
    code = main(list(argv))
    captured = capsys.readouterr()
    return code, captured.out, captured.err


def test_value_prints_the_value_and_its_provenance(capsys):
    code, out, _ = run(capsys, "value", "pi", "10**6")
    assert code == 0
    assert out.startswith("pi(1000000) = 78498")        # OEIS A006880
    assert "[table:" in out


def test_value_json_has_the_documented_keys(capsys):
    code, out, _ = run(capsys, "value", "next_prime", "2**64", "--json")
    assert code == 0
    data = json.loads(out)
    assert set(data) == {"function", "n", "value", "provenance"}
    assert data["n"] == 2**64
    assert data["value"] == 2**64 + 13        # from memory; checked independently below
    import sympy
    assert sympy.nextprime(2**64) == data["value"]   # sympy, test-only reference
    assert data["provenance"] == "deterministic"


def test_value_json_booleans_are_json_booleans(capsys):
    code, out, _ = run(capsys, "value", "is_prime", "3215031751", "--json")
    assert code == 0
    assert json.loads(out)["value"] is False     # OEIS A014233: strong psp to bases 2, 3, 5, 7


@pytest.mark.parametrize("argv", [
    ("value", "pi", "2.5"),
    ("value", "pi", "abc"),
    ("value", "pi", "__import__('os').system('true')"),
    ("value", "nth_prime", "0"),
    ("value", "prev_prime", "2"),
    ("value", "is_prime", "-7"),
    ("value", "pi", "10**10**10"),
])                      # --budget -1 is an option range error now: tests/test_audit_cli.py
def test_bad_input_is_one_line_and_exit_2(capsys, argv):
    code, out, err = run(capsys, *argv)
    assert code == 2
    assert out == ""
    assert err.count("\n") == 1 and err.startswith("ntoracle: error:")


@pytest.mark.parametrize("argv", [("value", "nosuch", "3"), ("value",), ("frobnicate",)])
def test_usage_errors_exit_2_without_traceback(argv):
    result = subprocess.run([sys.executable, "-m", "oracle.cli", *argv],
                            capture_output=True, text=True, timeout=60)
    assert result.returncode == 2
    assert "Traceback" not in result.stderr and "error:" in result.stderr


def test_out_of_reach_exits_3_and_says_what_is_proven(capsys):
    code, out, err = run(capsys, "value", "pi", "10**40")
    assert code == 3
    assert "out of exact reach" in err and "pi(" in err


def test_budget_refusal_exits_3(capsys):
    code, _, err = run(capsys, "value", "twin_pi", "5*10**13", "--budget", "0.5")
    assert code == 3
    assert "budget" in err
