"""The one renderer of values (oracle.report._values) and the one text summary
(oracle.report._summary_text), and that the CLI, the plugin and the HTML report use them.

References outside the project: sympy (primerange, a test-only reference) for the lists of
primes; Python's own limit of 4300 digits for int -> str (sys.get_int_max_str_digits).
"""

from __future__ import annotations

import re
import sys

import pytest
import sympy

from oracle import report
from oracle.report import got_expected, show_pair, show_value, summary_lines
from oracle.report._html import render_html

PRIMES = [int(p) for p in sympy.primerange(2, 400)]           # sympy, test-only reference


def test_booleans_are_written_true_and_false_everywhere():
    assert show_value(True) == "true" and show_value(False) == "false"
    assert got_expected(True, False) == "got true, expected false"
    assert show_value([True, False]) == "[true, false]"


def test_long_lists_are_shown_around_their_first_difference():
    missing = PRIMES[:40] + PRIMES[41:]                        # drops the 41st prime
    got, expected = show_pair(missing, PRIMES, 80)
    assert got != expected
    assert str(PRIMES[40]) in expected and str(PRIMES[40]) not in got
    assert not got.startswith("[2,") and not expected.startswith("[2,")   # not the shared prefix
    assert f"of {len(PRIMES)})" in expected and f"of {len(missing)})" in got
    assert str(PRIMES[39]) in got and str(PRIMES[39]) in expected        # context before it


def test_a_list_cut_short_is_shown_where_it_ends():
    got, expected = show_pair(PRIMES[:30], PRIMES, 60)
    assert got.endswith("of 30)")
    assert str(PRIMES[30]) in expected and str(PRIMES[30]) not in got


@pytest.mark.parametrize("value", [PRIMES, PRIMES[:5], [[2, 3], [3, 1]], {"2": 3}])
def test_no_doubled_commas_and_one_separator(value):
    for text in (show_value(value, 50), *show_pair(value, PRIMES[::-1], 50),
                 got_expected(value, PRIMES, 50)):
        assert ",," not in text and ", ," not in text and ",]" not in text


def test_short_lists_are_shown_whole():
    assert show_pair([2, 3, 5], [2, 3, 7]) == ("[2, 3, 5]", "[2, 3, 7]")


def test_huge_integers_beyond_pythons_limit_are_counted_not_written():
    limit = getattr(sys, "get_int_max_str_digits", lambda: 4300)()
    huge = 10 ** (limit + 700)
    assert show_value(huge) == f"an integer of {limit + 701} digits"
    assert got_expected(huge, 5) == f"got an integer of {limit + 701} digits, expected 5"
    long = 7 ** 800                                            # 677 digits, below the limit
    text = show_value(long, 60)
    assert text.endswith("... (677 digits)") and len(text) < 90
    assert len(str(long)) == 677


def test_a_timeout_is_no_answer_not_none():
    assert got_expected(None, None) == "no answer"
    assert got_expected(None, 82025) == "no answer, expected 82025"
    assert show_pair(None, None)[0] == "no answer"
    assert "None" not in got_expected(None, None)


def _summary(**changes) -> dict:
    summary = {"verdict": "failed", "passed_checks": 9, "checks": 10, "not_run": 0, "ended": True,
               "skipped": {}, "timings": {"total_seconds": 1.0, "first_finding_seconds": 0.5},
               "role": "primes_in", "reach": {}, "first_divergence": None,
               "failures": [{"status": "wrong", "check": "listing", "family": "uniform",
                             "arguments": [2, 400], "got": PRIMES[:40] + PRIMES[41:],
                             "expected": PRIMES, "provenance": "sieve", "detail": ""}]}
    summary.update(changes)
    return summary


def test_the_summary_lines_use_the_renderer():
    lines = summary_lines(_summary(first_divergence={"kind": "smallest failing input", "input": [7],
                                                     "got": None, "expected": None}))
    assert lines[0] == "FAILED: 9 of 10 checks passed, 1 finding(s)"
    assert str(PRIMES[40]) in lines[1] and ",," not in lines[1]
    assert lines[2] == "smallest failing input: [7]; no answer"


def test_cli_summary_is_the_shared_renderer(capsys):
    from oracle import cli

    summary = _summary(failures=[{"status": "wrong", "check": "exact", "family": "tables",
                                  "arguments": [561], "got": True, "expected": False,
                                  "provenance": "deterministic", "detail": ""}],
                       first_divergence={"kind": "smallest failing input", "input": [561],
                                         "got": True, "expected": False})
    cli._print_summary(summary)
    out = capsys.readouterr().out
    assert out.splitlines()[:-1] == summary_lines(summary)
    assert "got true, expected false" in out and "True" not in out


def test_html_failure_table_uses_the_renderer():
    records = [{"type": "start", "target": "t:f", "role": "primes_in", "profile": "quick",
                "seed": 1, "timeout": 1.0}]
    summary = _summary(profile="quick", seed=1, target="t:f", complete=True, passed=False)
    page = render_html([(summary, records)])
    got, expected = show_pair(PRIMES[:40] + PRIMES[41:], PRIMES)
    import html

    assert html.escape(got) in page and html.escape(expected) in page
    assert html.escape(report.verdict_line(summary)) in page


def test_plugin_failure_text_uses_the_renderer():
    from oracle.pytest_support._messages import failure_message

    summary = _summary(failures=[{"status": "wrong", "check": "exact", "family": "answer",
                                  "arguments": [561], "got": True, "expected": False,
                                  "provenance": "deterministic", "detail": ""},
                                 *_summary()["failures"]],
                       first_divergence={"kind": "smallest failing input", "input": [561],
                                         "got": None, "expected": None})
    text = failure_message(summary, role="is_prime", target="t", case="c", seed=1, profile="quick")
    assert re.search(r"got: +true$", text, re.M) and re.search(r"expected: +false$", text, re.M)
    assert "True" not in text and "None" not in text and "no answer" in text
    got_line = next(line for line in text.splitlines() if str(PRIMES[39]) in line and "got" in line)
    assert str(PRIMES[40]) not in got_line


# --- the public per-point judgement the plugin uses (oracle.engine.judge_point) ---------------

def test_judge_point_judges_one_answer_like_an_audit():
    from oracle import engine

    assert engine.judge_point("prime_pi", (10**6,), 78498).passed           # OEIS A006880
    wrong = engine.judge_point("prime_pi", 10**6, 78497)
    assert not wrong.passed and wrong.expected == 78498 and wrong.check == "exact"
    assert not engine.judge_point("is_prime", 561, True).passed            # OEIS A002997
    typed = engine.judge_point("prime_pi", 10**6, 78498.0)
    assert not typed.passed and typed.check == "type" and "float" in typed.detail
    absurd = engine.judge_point("prime_pi", 10**6, 10**20000)
    assert not absurd.passed and absurd.check == "size"
    listing = engine.judge_point("primes_in", (2, 400), PRIMES[:-1])
    assert not listing.passed
    half_open = engine.judge_point("primes_in", (2, 397), PRIMES[:-1],
                                   conventions={"primes_range": "half-open"})
    assert half_open.passed and PRIMES[-1] == 397                           # sympy


def test_the_plugin_uses_no_private_part_of_the_engine():
    import pathlib

    import oracle.pytest_support as support

    for path in pathlib.Path(support.__file__).parent.glob("*.py"):
        text = path.read_text(encoding="utf-8")
        assert "_Run" not in text and "engine._audit" not in text and "from ..engine import _audit" not in text, path
