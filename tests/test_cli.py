"""The ntoracle command line: contract of docs/DESIGN.md (output, JSON keys, exit codes)."""

import json
import os
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


# --- value under the role names, and factor (issue 12 item 5) ---------------------------------

@pytest.mark.parametrize("function, n, expected", [
    ("prime_pi", "10**6", "78498"),          # OEIS A006880
    ("pi", "10**6", "78498"),                # OEIS A006880 (the short name kept)
    ("nth_prime", "10**6", "15485863"),      # OEIS A006988
    ("is_prime", "3215031751", "false"),     # OEIS A014233: strong psp to bases 2, 3, 5, 7
])
def test_value_accepts_the_role_names(capsys, function, n, expected):
    code, out, _ = run(capsys, "value", function, n)
    assert code == 0 and f" = {expected} " in out and out.startswith(f"{function}(")


def test_value_primes_in_lists_the_primes_of_the_closed_interval(capsys):
    import sympy

    code, out, _ = run(capsys, "value", "primes_in", "10**6", "10**6+100", "--json")
    assert code == 0
    data = json.loads(out)
    assert data["function"] == "primes_in"
    assert data["value"] == list(sympy.primerange(10**6, 10**6 + 101))     # sympy, test-only


@pytest.mark.parametrize("n", ["1", "360", "2**64+1", "2**67-1", "(2**61-1)*(2**31-1)",
                               "10**30", "3**40*(10**12+39)"])
def test_value_factor_agrees_with_sympy(capsys, n):
    import sympy

    from oracle._integers import parse_integer

    code, out, _ = run(capsys, "value", "factor", n, "--json")
    assert code == 0
    value = parse_integer(n)
    assert {p: e for p, e in json.loads(out)["value"]} == sympy.factorint(value)   # sympy


def test_value_factor_text_and_probable_note(capsys):
    code, out, _ = run(capsys, "value", "factor", "2**64+1")
    assert code == 0 and out.startswith("factor(18446744073709551617) = 274177 * 67280421310721 ")
    # F_6 = 274177 * 67280421310721 (Landry 1880; from memory, checked by sympy above)
    code, out, _ = run(capsys, "value", "factor", "2**89-1")       # a Mersenne prime
    assert code == 0 and "factorised+probable" in out and "not a proof of primality" in out


def test_value_factor_out_of_reach_within_the_budget_exits_3(capsys):
    import sympy

    hard = sympy.nextprime(10**30) * sympy.nextprime(10**31)    # two 31-digit primes
    code, out, err = run(capsys, "value", "factor", str(hard), "--budget", "0.3")
    assert code == 3 and out == ""
    assert err.count("\n") == 1 and "longer than allowed" in err and "--budget" in err


@pytest.mark.parametrize("argv", [("value", "factor", "0"), ("value", "primes_in", "5"),
                                  ("value", "prime_pi", "1", "2")])
def test_value_wrong_argument_count_or_domain_exits_2(capsys, argv):
    code, out, err = run(capsys, *argv)
    assert code == 2 and out == "" and err.startswith("ntoracle: error:")


def test_value_of_a_tabulated_point_imports_neither_numpy_nor_mpmath():
    # Start-up (issue 14): a value read from a table needs no array or interval arithmetic;
    # the HTML report's bound envelopes (mpmath, numpy) are loaded only by the report writers.
    probe = ("import sys; from oracle.cli import main; main(['value', 'prime_pi', '1000']); "
             "print(sorted({'numpy', 'mpmath', 'rich'} & set(sys.modules)))")
    done = subprocess.run([sys.executable, "-c", probe], capture_output=True, text=True,
                          env={**os.environ, "NTORACLE_STORE": "off"}, timeout=60)
    assert done.returncode == 0, done.stderr
    assert done.stdout.splitlines() == ["prime_pi(1000) = 168    [table:oeis-a006880]", "[]"]
