"""Tests of oracle.claims_table and ``ntoracle judge-table``: tables with planted errors of every kind.

References outside the project: OEIS A006880 (pi(10^n)), sympy (primepi, prime, nextprime,
prevprime, isprime, factorint) and mpmath (x / log x and li(x) beyond exact reach).
"""

import json
import os
import subprocess
import sys
from pathlib import Path

import pytest

from oracle import InvalidInputError, claims_table
from oracle.cli import main

sympy = pytest.importorskip("sympy")
mpmath = pytest.importorskip("mpmath")

ROOT = Path(__file__).resolve().parent.parent
PI_10_6 = 78498                                  # OEIS A006880
PI_10_12 = 37607912018                           # OEIS A006880
PI_10_27 = 16352460426841680446427399            # OEIS A006880
X40 = 10**40


def _write(tmp_path, name, text):
    path = tmp_path / name
    path.write_bytes(text if isinstance(text, bytes) else text.encode("utf-8"))
    return path


def _li(x: int) -> int:
    """floor(li(x)) with mpmath, a value near pi(x) far inside its proven interval."""
    mpmath.mp.dps = 60
    return int(mpmath.floor(mpmath.li(x)))


def _primes_between(a: int, b: int) -> int:
    """#{p prime : a < p <= b}, by sympy (BPSW above its proven range)."""
    return sum(1 for n in range(a + 1, b + 1) if sympy.isprime(n))


def _kinds(summary):
    """{line: kind} of every finding (keyed by each of its lines) and bad row."""
    kinds = {}
    for finding in summary["findings"]:
        for line in finding["lines"]:
            kinds.setdefault(line, set()).add(finding["kind"])
    for bad in summary["bad"]:
        kinds.setdefault(bad["line"], set()).add(bad["kind"])
    return kinds


def _verdicts(summary):
    return {result["line"]: result["verdict"] for result in summary["results"]}


def test_correct_rows_are_confirmed(tmp_path):
    twins = sum(1 for p in sympy.primerange(3, 10**5 - 1) if sympy.isprime(p + 2))
    path = _write(tmp_path, "good.csv", "\n".join([
        "function,argument,claimed,note",
        f"prime_pi,10**6,{PI_10_6},OEIS A006880",
        f"prime_pi,10**27,{PI_10_27},OEIS A006880",
        f"twin_pi,10**5,{twins},sympy",
        f"nth_prime,10**4,{sympy.prime(10**4)},sympy",
        f"is_prime,2**61-1,true,sympy says {sympy.isprime(2**61 - 1)}",
        f"is_prime,3215031751,{str(sympy.isprime(3215031751)).lower()},sympy",
        f"next_prime,2**32,{sympy.nextprime(2**32)},sympy",
        f"prev_prime,10**12,{sympy.prevprime(10**12)},sympy",
        "factor,2**32+1," + " * ".join(f"{p}^{e}" for p, e in sympy.factorint(2**32 + 1).items()),
        f'factor,360,2^3 * 3**2 * 5,"sympy: {sympy.factorint(360)}"',
    ]) + "\n")
    summary = claims_table.audit_table(path)
    assert summary["verdict"] == "passed" and summary["passed"]
    assert summary["findings"] == [] and summary["bad"] == []
    assert set(_verdicts(summary).values()) == {"confirmed"}
    assert summary["confirmed"] == summary["rows"] == 10


def test_wrong_exact_value_is_refuted_with_its_line(tmp_path):
    path = _write(tmp_path, "t.csv", "function,argument,claimed\n"
                  f"prime_pi,10**6,{sympy.primepi(10**6) + 1}\n"
                  f"nth_prime,100,{sympy.prime(100) + 2}\n"
                  f"prime_pi,10**12,{PI_10_12}\n")            # OEIS A006880
    summary = claims_table.audit_table(path)
    assert _kinds(summary) == {2: {"wrong-value"}, 3: {"wrong-value"}}
    assert _verdicts(summary) == {2: "refuted", 3: "refuted", 4: "confirmed"}
    finding = summary["findings"][0]
    assert finding["expected"] == int(sympy.primepi(10**6)) and finding["claimed"] == PI_10_6 + 1


def test_claims_beyond_exact_reach_are_judged_by_the_proven_interval(tmp_path):
    mpmath.mp.dps = 60
    far_below = 10**38
    # A claim below x / log x is false (Rosser-Schoenfeld 1962: pi(x) > x / log x for x >= 17).
    assert far_below < mpmath.mpf(X40) / mpmath.log(X40)
    path = _write(tmp_path, "t.jsonl", "\n".join([
        json.dumps({"function": "prime_pi", "argument": "10**40", "claimed": str(far_below)}),
        json.dumps({"function": "prime_pi", "argument": "10**50", "claimed": str(_li(10**50))}),
    ]) + "\n")
    summary = claims_table.audit_table(path)
    assert _kinds(summary) == {1: {"outside-proven-interval"}}
    assert _verdicts(summary) == {1: "refuted", 2: "consistent"}
    finding = summary["findings"][0]
    lower, upper = finding["expected"]
    assert lower > far_below and finding["provenance"].startswith("bounds:")


def test_a_non_monotone_pair_is_reported_on_both_lines(tmp_path):
    value = _li(X40)
    path = _write(tmp_path, "t.yaml", "\n".join([
        "claims:",
        f"  - {{function: prime_pi, argument: '10**40', claimed: {value}}}",
        f"  - {{function: prime_pi, argument: '10**40 + 10**12', claimed: {value - 1000}}}",
    ]) + "\n")
    summary = claims_table.audit_table(path)
    assert [f["kind"] for f in summary["findings"]] == ["non-monotone"]
    assert summary["findings"][0]["lines"] == [2, 3]
    assert _verdicts(summary) == {2: "conflicting", 3: "conflicting"}
    assert summary["pairs_too_far_apart"] == 1          # 10**12 apart: no exact difference
    assert summary["verdict"] == "failed"


def test_a_wrong_difference_between_neighbours_is_reported(tmp_path):
    value = _li(X40)
    between = _primes_between(X40, X40 + 1000)          # sympy
    twins_between = sum(1 for p in range(X40 + 2000 - 1, X40 + 3000 - 1)
                        if sympy.isprime(p) and sympy.isprime(p + 2))
    path = _write(tmp_path, "t.csv", "\n".join([
        "function,argument,claimed",
        f"prime_pi,10**40,{value}",
        f"prime_pi,10**40+1000,{value + between + 2}",
        f"prime_pi,10**40+2000,{value + between + 2 + _primes_between(X40 + 1000, X40 + 2000)}",
        f"twin_pi,10**40+2000,{10**36}",
        f"twin_pi,10**40+3000,{10**36 + twins_between}",
    ]) + "\n")
    summary = claims_table.audit_table(path)
    assert [(f["kind"], f["lines"]) for f in summary["findings"]] == [("wrong-difference", [2, 3])]
    finding = summary["findings"][0]
    assert finding["expected"] == between and finding["claimed"] == between + 2
    assert _verdicts(summary) == {2: "conflicting", 3: "conflicting", 4: "consistent",
                                  5: "consistent", 6: "consistent"}


def test_bad_rows_are_reported_and_the_rest_judged(tmp_path):
    path = _write(tmp_path, "t.csv", "\n".join([
        "# a comment line, skipped",
        "function,argument,claimed",
        f"prime_pi,10**6,{PI_10_6}",                        # OEIS A006880
        "prime_pi,10**6",                                    # malformed: two fields
        f"mertens,10**6,{PI_10_6}",                          # unknown function
        "primepi,10**6,78498",                               # unknown, with a hint
        "prime_pi,2.5,1",                                    # bad argument
        "prime_pi,-5,0",                                     # below the domain
        "nth_prime,10,twenty-nine",                          # bad claimed value
        "is_prime,7,maybe",                                  # bad claimed value
        '"unclosed,1,2',                                     # malformed CSV
    ]) + "\n")
    summary = claims_table.audit_table(path)
    assert _kinds(summary) == {4: {"malformed"}, 5: {"unknown-function"}, 6: {"unknown-function"},
                               7: {"bad-argument"}, 8: {"bad-argument"}, 9: {"bad-claimed-value"},
                               10: {"bad-claimed-value"}, 11: {"malformed"}}
    assert "did you mean prime_pi" in next(b["detail"] for b in summary["bad"] if b["line"] == 6)
    assert _verdicts(summary) == {3: "confirmed"}
    assert summary["verdict"] == "incomplete" and summary["rows"] == 9


def test_malformed_json_lines_and_yaml_rows(tmp_path):
    huge = "1" * 5000
    jsonl = _write(tmp_path, "t.jsonl", "\n".join([
        "{not json",
        "[1, 2, 3]",
        '{"function": "prime_pi", "argument": ' + huge + ', "claimed": 1}',
        '{"function": "prime_pi", "argument": 1e27, "claimed": ' + str(PI_10_27) + "}",   # OEIS A006880
        '{"function": "prime_pi", "argument": 10, "claimed": 4, "claim": 4}',
    ]) + "\n")
    summary = claims_table.audit_table(jsonl)
    assert _kinds(summary) == {1: {"malformed"}, 2: {"malformed"}, 3: {"malformed"}, 5: {"malformed"}}
    assert _verdicts(summary) == {4: "confirmed"}         # 1e27 read exactly, never as a float
    yaml_file = _write(tmp_path, "t.yaml", "\n".join([
        "- just a string",
        "- {function: prime_pi, argument: 010, claimed: 4}",   # decimal 10, not YAML 1.1 octal 8
        "- {function: is_prime, argument: 97, claimed: yes}",
    ]) + "\n")
    summary = claims_table.audit_table(yaml_file)
    assert _kinds(summary) == {1: {"malformed"}}
    assert int(sympy.primepi(10)) == 4 and sympy.isprime(97)
    assert _verdicts(summary) == {2: "confirmed", 3: "confirmed"}


def test_a_line_that_is_not_utf8_is_a_bad_row_and_a_yaml_file_is_refused(tmp_path):
    data = (b"function,argument,claimed\n"
            b"prime_pi,10**6,78498\n"                           # OEIS A006880
            b"prime_pi,10**6,78498 \xff\xfe\n")
    summary = claims_table.audit_table(_write(tmp_path, "t.csv", data))
    assert _kinds(summary) == {3: {"not-utf-8"}}
    assert _verdicts(summary) == {2: "confirmed"}
    with pytest.raises(InvalidInputError, match=r"t\.yaml.*not UTF-8"):
        claims_table.audit_table(_write(tmp_path, "t.yaml", b"- {function: \xff}\n"))


def test_file_level_problems_are_one_line_errors(tmp_path):
    with pytest.raises(InvalidInputError, match="cannot tell the format"):
        claims_table.audit_table(_write(tmp_path, "t.txt", "x"))
    with pytest.raises(InvalidInputError, match="format='xml'"):
        claims_table.audit_table(_write(tmp_path, "t.csv", "x"), format="xml")
    with pytest.raises(InvalidInputError, match="header"):
        claims_table.audit_table(_write(tmp_path, "t.csv", "function,x,value\nprime_pi,1,0\n"))
    with pytest.raises(InvalidInputError, match="cannot read"):
        claims_table.audit_table(tmp_path / "missing.csv")
    with pytest.raises(InvalidInputError, match="more than the limit"):
        claims_table.read_table(_write(tmp_path, "big.csv", "function,argument,claimed\n" * 10),
                                max_bytes=100)


def test_the_example_table_finds_exactly_its_planted_errors(tmp_path):
    example = ROOT / "oracle" / "demo" / "claims-table.csv"
    lines = example.read_text(encoding="utf-8").splitlines()
    planted = {number for number, line in enumerate(lines, start=1) if "planted:" in line}
    summary = claims_table.audit_table(example)
    flagged = set(_kinds(summary))
    assert planted <= flagged
    for finding in summary["findings"]:          # a pair names both rows, one of them planted
        assert planted & set(finding["lines"]), finding
    assert all(bad["line"] in planted for bad in summary["bad"])
    kinds = set().union(*_kinds(summary).values())
    assert {"wrong-value", "outside-proven-interval", "non-monotone", "wrong-difference",
            "wrong-factorization", "unknown-function", "bad-argument"} <= kinds
    assert "INVENTED" in lines[0]
    # Its sound rows, checked outside the project:
    assert int(sympy.primepi(10**6)) == PI_10_6 and sympy.prime(10**6) == 15485863
    assert sympy.nextprime(2**32) == 4294967311 and sympy.factorint(2**32 + 1) == {641: 1, 6700417: 1}


def _run(*arguments, cwd):
    environment = dict(os.environ, PYTHONPATH=str(ROOT), TERM="dumb", NO_COLOR="1")
    return subprocess.run([sys.executable, "-m", "oracle.cli", "judge-table", *arguments],
                          capture_output=True, text=True, cwd=cwd, env=environment, timeout=300)


def test_exit_codes_through_the_command_line(tmp_path):
    good = _write(tmp_path, "good.csv", f"function,argument,claimed\nprime_pi,10**12,{PI_10_12}\n")
    wrong = _write(tmp_path, "wrong.csv", f"function,argument,claimed\nprime_pi,10**12,{PI_10_12 - 1}\n"
                                          "nonsense,1,2\n")
    bad_only = _write(tmp_path, "bad.csv", f"function,argument,claimed\nprime_pi,10**12,{PI_10_12}\n"
                                           "nonsense,1,2\n")
    empty = _write(tmp_path, "empty.jsonl", "\n")
    latin1 = _write(tmp_path, "latin1.yaml", "- {function: prime_pi, note: caf\xe9}\n".encode("latin-1"))
    cases = [(good, 0), (wrong, 1), (bad_only, 2), (empty, 5), (latin1, 2),
             (tmp_path / "missing.csv", 2)]
    for path, code in cases:
        run = _run(str(path), cwd=tmp_path)
        assert run.returncode == code, (path, run.stdout, run.stderr)
        assert "Traceback" not in run.stderr
    run = _run(str(latin1), cwd=tmp_path)
    assert "latin1.yaml" in run.stderr and "not UTF-8" in run.stderr
    run = _run(str(wrong), cwd=tmp_path)
    assert "line 2: wrong-value" in run.stdout and "line 3: unknown-function" in run.stdout
    with pytest.raises(SystemExit) as exit_:
        main(["judge-table", str(good), "--format", "nope"])
    assert exit_.value.code == 2


def test_json_and_html_report(tmp_path, capsys):
    path = _write(tmp_path, "t.csv", "function,argument,claimed,note\n"
                  f"prime_pi,10**6,{PI_10_6 + 1},<script>alert(1)</script>\n"
                  "<b>bold</b>,1,2,\n")
    code = main(["judge-table", str(path), "--json", str(tmp_path / "out" / "s.json"),
                 "--report", str(tmp_path / "report")])
    assert code == 1
    summary = json.loads((tmp_path / "out" / "s.json").read_text(encoding="utf-8"))
    assert summary["verdict"] == "failed" and summary["findings"][0]["lines"] == [2]
    assert summary["bad"] == [{"line": 3, "kind": "unknown-function",
                               "detail": summary["bad"][0]["detail"]}]
    page = (tmp_path / "report" / "report.html").read_text(encoding="utf-8")
    assert "<script>" not in page and "&lt;script&gt;" in page and "&lt;b&gt;" in page
    assert "wrong-value" in page and "not a proven prime" in page
    assert (tmp_path / "report" / "summary.json").exists()
    assert "line 2: wrong-value" in (tmp_path / "report" / "report.txt").read_text(encoding="utf-8")
    assert "line 2: wrong-value" in capsys.readouterr().out


def test_hostile_tables_are_refused_or_reported_without_a_traceback(tmp_path):
    bomb = 'a: &a ["x","x","x","x","x","x","x","x","x"]\n' + "".join(
        f"{chr(98 + i)}: &{chr(98 + i)} [" + ",".join([f"*{chr(97 + i)}"] * 9) + "]\n" for i in range(8))
    deep = "\n".join(["[" * 6000 + "]" * 6000,
                      '{"function": "prime_pi", "argument": "10**10**9", "claimed": 1}',
                      '{"function": "prime_pi", "argument": "' + "9" * 4500 + '", "claimed": 1}',
                      '{"function": "prime_pi", "argument": 10, "claimed": 4}'])   # sympy: pi(10) = 4
    tagged = ("- {function: prime_pi, argument: !!python/object/apply:os.system ['echo hi'], claimed: 1}\n"
              "- {function: prime_pi, argument: 1:30, claimed: 24}\n")      # not sexagesimal 90
    cases = {"bomb.yaml": (bomb, "aliases expanded"), "deep.jsonl": (deep, None),
             "tagged.yaml": (tagged, None), "nested.yaml": ("- " + "[" * 200 + "]" * 200, "nested")}
    for name, (text, message) in cases.items():
        run = _run(str(_write(tmp_path, name, text)), "--json", str(tmp_path / f"{name}.json"),
                   cwd=tmp_path)
        assert run.returncode == 2, (name, run.stdout, run.stderr)     # refused, or bad rows
        assert "Traceback" not in run.stderr and "Traceback" not in run.stdout
        if message:
            assert name in run.stderr and message in run.stderr
    summary = json.loads((tmp_path / "deep.jsonl.json").read_text(encoding="utf-8"))
    assert summary["verdict"] == "incomplete"
    assert _kinds(summary) == {1: {"malformed"}, 2: {"bad-argument"}, 3: {"bad-argument"}}
    assert _verdicts(summary) == {4: "confirmed"}
    summary = json.loads((tmp_path / "tagged.yaml.json").read_text(encoding="utf-8"))
    assert _kinds(summary) == {1: {"bad-argument"}, 2: {"bad-argument"}}
    assert summary["results"] == [] and summary["verdict"] == "incomplete"


def test_too_many_rows_is_refused(tmp_path):
    path = _write(tmp_path, "t.csv", "function,argument,claimed\n" + "prime_pi,10,4\n" * 4)
    assert len(claims_table.read_table(path, max_rows=4)[0]) == 4
    with pytest.raises(InvalidInputError, match="more than 3 rows"):
        claims_table.read_table(path, max_rows=3)


def test_nth_prime_beyond_exact_reach_must_be_prime_and_inside_its_bounds(tmp_path):
    from oracle import bounds

    interval = bounds.nth_prime(10**30)
    middle = (interval.lower + interval.upper) // 2
    prime = sympy.nextprime(middle)                     # sympy: a prime inside the interval
    composite = prime + 1
    assert not sympy.isprime(composite) and not sympy.isprime(10**29 + 7)
    path = _write(tmp_path, "t.csv", "function,argument,claimed\n"
                  f"nth_prime,10**30,{prime}\n"
                  f"nth_prime,10**30,{composite}\n"
                  f"nth_prime,10**30,{10**29 + 7}\n")
    summary = claims_table.audit_table(path, budget=2)
    assert _kinds(summary) == {3: {"not-prime"}, 4: {"not-prime", "outside-proven-interval"}}
    assert _verdicts(summary) == {2: "consistent", 3: "refuted", 4: "refuted"}


def test_the_readme_example_is_what_the_command_prints(tmp_path):
    readme = (ROOT / "README.md").read_text(encoding="utf-8")
    command = "ntoracle judge-table oracle/demo/claims-table.csv --quiet"
    block = readme.split("$ " + command + "\n", 1)[1].split("```", 1)[0].splitlines()
    whole = [line for number, line in enumerate(block)
             if line.startswith("  line ") and "..." not in line
             and not (number + 1 < len(block) and block[number + 1].startswith("      "))]
    assert len(whole) >= 3
    run = _run(*command.split()[2:], cwd=ROOT)
    assert run.returncode == 1
    printed = run.stdout.splitlines()
    for line in whole:
        assert line in printed, line
