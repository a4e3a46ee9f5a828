"""The README's reference lists equal the code's names, its cheap shell examples run with the
exit codes it states, and its suite example parses (issue 12 item 7).

The README is checked against the code here, not against an outside reference: what is
tested is that the documentation cannot drift from the program.  Profile numbers are the
code's own settings (oracle.sampling), which the README's table must restate.
"""

from __future__ import annotations

import inspect
import re
import shlex
import subprocess
import sys

import pytest

import _readme
from oracle import cli, roles, sampling, strategies


def test_strategy_names_are_the_modules_exports():
    assert sorted(_readme.named_list("strategies")) == sorted(strategies.__all__)


def test_role_aliases_are_the_inference_table():
    assert sorted(_readme.named_list("aliases")) == sorted(roles.ALIASES)
    readme = _readme.text()
    for alias, role in roles.ALIASES.items():       # each alias is listed beside its role
        assert re.search(rf"`{alias}`[^\n]*— {role}$", readme, re.M), alias


def test_setting_keys_are_the_plugins():
    from oracle.pytest_support._settings import SETTING_KEYS

    assert _readme.named_list("setting-keys") == list(SETTING_KEYS)


def test_suite_keys_and_case_kinds_are_the_parsers():
    from oracle.pytest_support import _suites

    assert set(_readme.named_list("suite-keys")) == _suites._SUITE_KEYS
    assert _readme.named_list("case-kinds") == list(_suites._CASE_KINDS)


def test_the_suite_example_parses_with_every_case_kind():
    from oracle.pytest_support._suites import parse_suite

    (example,) = _readme.fenced("yaml")
    suite = parse_suite(example, "example.ntoracle.yaml")
    assert suite.role == "prime_pi" and suite.maximum == 10**12
    assert {case.kind for case in suite.cases} == set(_readme.named_list("case-kinds"))


def test_fixture_names_and_signatures_are_the_plugins():
    from oracle import plugin
    from oracle.pytest_support._fixtures import Checker, PointSampler

    fixtures = {name for name, value in vars(plugin).items()
                if name.startswith("ntoracle") and callable(value)}
    assert set(_readme.named_list("fixtures")) == fixtures
    readme = _readme.text()
    for call, function in (("ntoracle_points", PointSampler.__call__),
                           ("ntoracle_check", Checker.__call__),
                           ("ntoracle_check.answer", Checker.answer)):
        signature = inspect.signature(function)
        parameters = signature.replace(
            parameters=[p.replace(annotation=inspect.Parameter.empty)
                        for name, p in signature.parameters.items() if name != "self"],
            return_annotation=inspect.Signature.empty)
        assert f"`{call}{parameters}`" in readme, (call, parameters)


def test_exit_codes_are_the_clis():
    codes = {value for name, value in vars(cli).items() if name.startswith("EXIT_")}
    assert {int(code) for code in _readme.named_list("exit-codes")} == codes


def test_profile_table_restates_the_profiles():
    table = re.search(r"\| profile \| enough_findings \| time_budget \(s\) \| timeout \(s\) \|\n"
                      r"\|[-|]+\|\n((?:\|.*\|\n)+)", _readme.text()).group(1)
    rows = [[cell.strip() for cell in row.strip("|").split("|")] for row in table.splitlines()]
    assert [row[0] for row in rows] == list(cli.PROFILE_NAMES)
    for name, enough, budget, timeout in rows:
        profile = sampling.profile(name)
        assert enough == ("none" if profile.enough_findings is None else str(profile.enough_findings))
        assert float(budget) == profile.time_budget and float(timeout) == profile.timeout


def test_audit_report_files_are_the_ones_written(tmp_path, monkeypatch, capsys):
    monkeypatch.chdir(tmp_path)
    code = cli.main(["audit", "_candidates:prime_pi", "--profile", "quick", "--seed", "1",
                     "--max", "1000", "--no-corpus", "--report", "rep"])
    assert code == 0
    assert sorted(_readme.named_list("audit-report-files")) == sorted(p.name for p in (tmp_path / "rep").iterdir())


def test_plugin_report_files_are_the_ones_the_session_writes():
    source = inspect.getsource(__import__("oracle.pytest_support._session", fromlist=["x"]))
    for name in _readme.named_list("plugin-report-files"):
        assert f'"{name.rstrip("/")}"' in source, name


_EXIT = re.compile(r"#\s*exit (\d+)\s*$")


@pytest.mark.parametrize("line", _readme.cheap_shell_lines())
def test_cheap_shell_examples_run_with_the_stated_exit_code(line, tmp_path):
    expected = int(_EXIT.search(line).group(1)) if _EXIT.search(line) else 0
    words = shlex.split(line, comments=True)
    assert words[0] == "ntoracle", line
    result = subprocess.run([sys.executable, "-m", "oracle.cli", "--no-store", *words[1:]],
                            cwd=tmp_path, capture_output=True, text=True, timeout=120)
    assert result.returncode == expected, (line, result.stdout[-500:], result.stderr[-500:])
    assert "Traceback" not in result.stderr
