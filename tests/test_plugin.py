"""The pytest plugin, run through pytest itself (the ``pytester`` fixture).

References outside the project: python-flint's ``fmpz.is_prime`` (a proven
primality test) as the correct candidate; Korselt's criterion (1899) for the
defective Fermat candidate, fooled by the Carmichael number 29341 = 13 * 37 * 61
(OEIS A002997).
"""

from __future__ import annotations

import importlib.metadata
import json
import shlex
import sys
import tomllib
import xml.etree.ElementTree as ElementTree
from pathlib import Path

import pytest

from oracle import roles, sampling
from oracle.pytest_support import _settings
from oracle.pytest_support._nodes import bundled_suite_paths
from oracle.pytest_support._suites import SuiteError, groups_of, load_suite, parse_suite

pytest_plugins = ["pytester"]

REPOSITORY = Path(__file__).resolve().parent.parent

CORRECT_IS_PRIME = '''
import sympy

def is_prime(n):
    return bool(sympy.isprime(n))       # sympy: deterministic below 2**64, BPSW above
'''

# Fermat's test to the bases 2, 3, 5, 7: every Carmichael number without a factor <= 7 passes
# (Korselt 1899); the smallest is 29341 = 13 * 37 * 61, then 46657 = 13 * 37 * 97 (OEIS A002997).
# The sampler lists 29341 among the pseudoprimes, so the carmichael case starts at 46657.
FERMAT_IS_PRIME = '''
def is_prime(n):
    if n < 2:
        return False
    for p in (2, 3, 5, 7):
        if n % p == 0:
            return n == p
    return all(pow(a, n - 1, n) == 1 for a in (2, 3, 5, 7))
'''


def _entry_point_installed() -> bool:
    return any(ep.name == "ntoracle" and ep.value == "oracle.plugin"
               for ep in importlib.metadata.entry_points(group="pytest11"))


#: Load the plugin explicitly until the ``pytest11`` entry point is installed (twice would clash).
PLUGIN = [] if _entry_point_installed() else ["-p", "oracle.plugin"]


@pytest.fixture
def project(pytester):
    pytester.makeini("[pytest]\npythonpath = .\n")
    pytester.makepyfile(good_prime=CORRECT_IS_PRIME, fermat_prime=FERMAT_IS_PRIME)
    return pytester


def _outcomes_by_id(junit: Path) -> dict[str, str]:
    outcomes = {}
    for case in ElementTree.parse(junit).getroot().iter("testcase"):
        kinds = {child.tag for child in case}
        outcome = ("failed" if "failure" in kinds else "error" if "error" in kinds
                   else "skipped" if "skipped" in kinds else "passed")
        outcomes[f"{case.get('classname')}::{case.get('name')}"] = outcome
    return outcomes


# -- the bundled suites against a target ------------------------------------- #

def test_correct_target_passes(project):
    result = project.runpytest(*PLUGIN, "--ntoracle-target", "is_prime=good_prime:is_prime",
                               "--ntoracle-seed", "5")
    outcomes = result.parseoutcomes()
    assert outcomes.get("failed", 0) == 0 and outcomes.get("errors", 0) == 0
    assert outcomes["passed"] >= 10
    result.stdout.fnmatch_lines(["ntoracle: seed 5 (--ntoracle-seed), profile quick",
                                 "*caution: *probable prime is not a proven prime*"])


def test_defective_target_fails_with_input_got_expected_provenance_and_seed(project):
    result = project.runpytest(*PLUGIN, "--ntoracle-target", "is_prime=fermat_prime:is_prime",
                               "--ntoracle-seed", "5", "-k", "carmichael")
    result.assert_outcomes(failed=1, deselected=result.parseoutcomes()["deselected"])
    result.stdout.fnmatch_lines([
        "*ntoracle: fermat_prime:is_prime as is_prime failed * checks in case 'carmichael' "
        "(profile quick, seed 5)",
        "is_prime(46657): wrong (exact)",           # 13 * 37 * 97, OEIS A002997
        "    input:      46657",
        "    got:        true",
        "    expected:   false",
        "    provenance: *",
        "smallest failing input: [[]46657[]]*",
        "reproduce: pytest --ntoracle-item 'ntoracle::is_prime::carmichael[[]*]' "
        "--ntoracle-target is_prime=fermat_prime:is_prime --ntoracle-seed 5 --ntoracle-profile quick",
    ])


def test_ids_select_with_k_and_rerun_with_lf_with_two_targets_of_one_role(project):
    arguments = [*PLUGIN, "--ntoracle-target", "is_prime=fermat_prime:is_prime",
                 "--ntoracle-target", "is_prime=good_prime:is_prime", "--ntoracle-seed", "5"]
    first = project.runpytest(*arguments, "-k", "carmichael or landmarks", "-v")
    first.stdout.fnmatch_lines(["ntoracle::is_prime@fermat_prime_is_prime::carmichael[[]*] FAILED*",
                                "ntoracle::is_prime@good_prime_is_prime::carmichael[[]*] PASSED*"],
                               consecutive=False)
    failed = first.parseoutcomes()["failed"]
    rerun = project.runpytest(*arguments, "--lf", "-q")
    rerun.assert_outcomes(failed=failed, deselected=rerun.parseoutcomes().get("deselected", 0))
    rerun.stdout.fnmatch_lines(["FAILED ntoracle::is_prime@fermat_prime_is_prime::carmichael*"])
    assert "good_prime" not in "".join(line for line in rerun.outlines if line.startswith("FAILED"))


def test_no_target_adds_no_items_and_imports_nothing_heavy(pytester):
    pytester.makepyfile(test_light='''
        import sys

        def test_nothing_heavy_was_imported():
            heavy = [name for name in ("numpy", "gmpy2", "primesieve", "yaml", "oracle.engine",
                                       "oracle.sampling", "oracle.pytest_support._nodes")
                     if name in sys.modules]
            assert heavy == []
    ''')
    result = pytester.runpytest_subprocess(*PLUGIN, "-p", "no:cacheprovider")
    result.assert_outcomes(passed=1)
    result.stdout.fnmatch_lines(["collected 1 item"])
    assert not [line for line in result.outlines           # no header line, no summary section
                if line.startswith("ntoracle") or " ntoracle " in line]


def test_xdist_two_workers_give_the_serial_outcomes(project):
    arguments = [*PLUGIN, "--ntoracle-target", "is_prime=fermat_prime:is_prime",
                 "--ntoracle-seed", "11", "-p", "no:randomly"]
    project.runpytest_subprocess(*arguments, "--junitxml", "serial.xml")
    project.runpytest_subprocess(*arguments, "-n", "2", "--junitxml", "parallel.xml",
                                 "--ntoracle-report", "report")
    serial = _outcomes_by_id(project.path / "serial.xml")
    parallel = _outcomes_by_id(project.path / "parallel.xml")
    assert "failed" in serial.values() and "passed" in serial.values()
    assert parallel == serial
    # the controller's report names the same outcomes, and every item left its records
    summary = json.loads((project.path / "report" / "summary.json").read_text())
    assert summary["seed"] == 11
    assert {node.rsplit("::", 1)[1]: outcome for node, outcome in summary["items"].items()} == {
        name.rsplit("::", 1)[1]: outcome for name, outcome in serial.items()}
    assert len(list((project.path / "report" / "records").glob("*.jsonl"))) == len(serial)


EXEC_IS_PRIME = """
import sys
import sympy

for line in sys.stdin:
    n = int(line)
    print(1 if sympy.isprime(n) else 0, flush=True)
"""


def test_executable_target_speaks_the_line_protocol(project):
    project.makepyfile(line_prime=EXEC_IS_PRIME)
    result = project.runpytest(*PLUGIN, "--ntoracle-exec", f"is_prime={sys.executable} line_prime.py",
                               "--ntoracle-seed", "2", "-k", "carmichael or pseudoprimes or exhaustive")
    outcomes = result.parseoutcomes()
    assert outcomes["passed"] >= 3 and outcomes.get("failed", 0) == 0


def test_ini_and_command_line_forms_agree(project):
    command_line = project.runpytest(*PLUGIN, "--collect-only", "-q",
                                     "--ntoracle-target", "is_prime=good_prime:is_prime",
                                     "--ntoracle-profile", "ci", "--ntoracle-seed", "3")
    project.makeini("[pytest]\npythonpath = .\nntoracle_targets =\n    is_prime = good_prime:is_prime\n"
                    "ntoracle_profile = ci\nntoracle_seed = 3\n")
    from_ini = project.runpytest(*PLUGIN, "--collect-only", "-q")
    ids = [line for line in command_line.outlines if line.startswith("ntoracle::")]
    assert len(ids) > 10
    assert [line for line in from_ini.outlines if line.startswith("ntoracle::")] == ids
    # the command line beats the ini file
    overridden = project.runpytest(*PLUGIN, "--ntoracle-profile", "quick", "--ntoracle-seed", "4",
                                   "--collect-only", "-q")
    header = project.runpytest(*PLUGIN, "--ntoracle-seed", "4", "--co", "-k", "nothing")
    overridden.stdout.fnmatch_lines(["ntoracle::is_prime::exhaustive[[]0..300[]]"])
    assert any(line.startswith("ntoracle::is_prime::exhaustive[0..999]") for line in ids)
    assert "seed 4 (--ntoracle-seed), profile ci" in header.stdout.str()


@pytest.mark.parametrize("arguments, problem", [
    (["--ntoracle-seed", "abc"], "*ntoracle: --ntoracle-seed='abc': *cannot read 'abc'*"),
    (["--ntoracle-profile", "fast"], "*ntoracle: --ntoracle-profile='fast': expected one of quick*"),
    (["--ntoracle-target", "prime_py=good_prime:is_prime"], "*unknown role 'prime_py'*"),
    (["--ntoracle-target", "is_prime=no_such_module:is_prime"], "*cannot import 'no_such_module'*"),
    (["--ntoracle-exec", "is_prime=/no/such/command --flag"], "*--ntoracle-exec=is_prime=/no/such/command --flag: no such command"),
])
def test_bad_settings_are_usage_errors_naming_their_source(project, arguments, problem):
    result = project.runpytest(*PLUGIN, *arguments)
    assert result.ret == pytest.ExitCode.USAGE_ERROR
    result.stderr.fnmatch_lines([problem])


# -- user suite files ---------------------------------------------------------- #

def test_user_suite_runs_its_own_target_and_a_malformed_one_is_one_clear_error(project):
    project.makefile(".ntoracle.yaml", checks='''
        role: is_prime
        target: fermat_prime:is_prime
        cases:
          - name: korselt
            values: [29341, 29339]
          - name: draws
            random: {count: 5, low: 2, high: 10**6}
    ''')
    project.makefile(".ntoracle.yaml", broken='''
        role: is_prime
        cases:
          - name: small
            range: {start: 0, stop: ten}
    ''')
    project.makepyfile(test_other="def test_still_runs():\n    assert True\n")
    result = project.runpytest(*PLUGIN, "-v")
    result.assert_outcomes(passed=3, failed=1, errors=1)
    result.stdout.fnmatch_lines([
        "broken.ntoracle.yaml::suite-error ERROR*",
        "checks.ntoracle.yaml::is_prime::korselt[[]29341[]] FAILED*",
        "checks.ntoracle.yaml::is_prime::korselt[[]29339[]] PASSED*",
        "test_other.py::test_still_runs PASSED*",
        "malformed ntoracle suite: *broken.ntoracle.yaml:4: case 'small': stop: 'ten': cannot read*",
    ])


def test_points_above_the_declared_domain_are_skipped_never_passed(project):
    project.makefile(".ntoracle.yaml", bounded='''
        role: is_prime
        target: good_prime:is_prime
        max: 1000
        cases:
          - name: edge
            range: {start: 995, stop: 1005}
          - name: beyond
            values: [10**6]
    ''')
    result = project.runpytest(*PLUGIN, "-rs")
    result.assert_outcomes(passed=1, skipped=1, warnings=1)
    result.stdout.fnmatch_lines([
        "*bounded.ntoracle.yaml::is_prime::edge[[]995..1005[]]: not run, so not passed: "
        "5 point(s): above the declared domain*",
        "SKIPPED*no point checked (1 point(s): above the declared domain*); skipped, not passed",
    ])


def test_inputs_outside_the_domain_under_the_raise_convention(project):
    project.makefile(".ntoracle.yaml", strict='''
        role: is_prime
        target: good_prime:is_prime
        conventions: {invalid_input: raise}
        cases:
          - name: outside
            invalid: [-1, -7]
    ''')
    result = project.runpytest(*PLUGIN)
    result.assert_outcomes(failed=1)
    result.stdout.fnmatch_lines(["*failed 2 of 2 checks in case 'outside'*",
                                 "is_prime(-7): wrong (invalid-input)",
                                 "*answered an input outside the domain instead of raising*"])


def test_fixtures_in_hand_written_tests(project):
    project.makepyfile(test_hand='''
        import pytest
        from fermat_prime import is_prime as fermat

        def test_facade_and_bounds(ntoracle, ntoracle_bounds):
            assert ntoracle.pi(10**6) == 78498          # OEIS A006880
            assert ntoracle_bounds is not None

        def test_points_follow_the_seed(ntoracle_points, ntoracle_seed):
            assert ntoracle_seed == 9
            points = ntoracle_points("is_prime", family="carmichael")
            assert (561,) in points                    # OEIS A002997

        def test_check_passes(ntoracle_check):
            ntoracle_check("is_prime", fermat, [2, 3, 97, 561])

        def test_check_fails(ntoracle_check):
            ntoracle_check("is_prime", fermat, [29341])

        def test_answer_fails(ntoracle_check):
            ntoracle_check.answer("prime_pi", 10**6, 78499)
    ''')
    result = project.runpytest(*PLUGIN, "--ntoracle-seed", "9")
    result.assert_outcomes(passed=3, failed=2)
    result.stdout.fnmatch_lines([
        "*failed 1 of 1 checks in case 'check' (profile quick, seed 9)",
        "is_prime(29341): wrong (exact)",
        "*failed 1 of 1 checks in case 'answer'*",
        "    expected:   78498",
    ])


def test_hypothesis_profile_loaded_only_when_asked(pytester):
    check = "from hypothesis import settings\n\ndef test_profile():\n    assert settings.get_current_profile_name() == {!r}\n"
    pytester.makepyfile(test_settings=check.format("ntoracle-ci"))
    pytester.runpytest_subprocess(*PLUGIN, "--ntoracle-hypothesis-profile", "ntoracle-ci").assert_outcomes(passed=1)
    pytester.runpytest_subprocess(*PLUGIN, "--hypothesis-profile", "ntoracle-ci").assert_outcomes(passed=1)
    # Not asked: the profile hypothesis itself chooses (its "ci" profile on a CI machine), the
    # same as in this very session, where nothing loads a profile.
    from hypothesis import settings

    pytester.makepyfile(test_settings=check.format(settings.get_current_profile_name()))
    pytester.runpytest_subprocess(*PLUGIN).assert_outcomes(passed=1)


def test_plugin_loads_through_the_entry_point(pytester):
    declared = tomllib.loads((REPOSITORY / "pyproject.toml").read_text())
    entry_points = declared["project"].get("entry-points", {}).get("pytest11", {})
    if entry_points.get("ntoracle") != "oracle.plugin":
        pytest.skip("pyproject.toml does not declare the pytest11 entry point yet")
    assert _entry_point_installed(), "declared but not installed: run pip install -e ."
    result = pytester.runpytest_subprocess("--help")
    result.stdout.fnmatch_lines(["*--ntoracle-target=ROLE=MODULE:FUNCTION*"])


# -- the suite format ------------------------------------------------------------ #

@pytest.mark.parametrize("text, line, problem", [
    ("role: is_prime\ncases: [\n", 3, "not valid YAML"),
    ("role: is_prim\ncases: []\n", 1, "role='is_prim'"),
    ("role: is_prime\ncolour: red\ncases: []\n", 2, "unknown key 'colour'"),
    ("role: is_prime\ncases: []\n", 2, "'cases' must be a non-empty list"),
    ("role: is_prime\ncases:\n  - name: a\n    values: [1.5]\n", 4, "floats are refused"),
    ("role: is_prime\ncases:\n  - name: a\n    family: twins\n", 4, "the is_prime families are"),
    ("role: is_prime\ncases:\n  - name: a\n    values: [1]\n  - name: a\n    values: [2]\n", 5,
     "case name 'a' is used twice"),
    ("role: primes_in\ncases:\n  - name: a\n    values: [3]\n", 4, "expected a pair [a, b]"),
    ("role: is_prime\ncases:\n  - name: a\n    random: {count: 3, low: 9, high: 2}\n", 4,
     "high=2 is below low=9"),
    ("role: is_prime\ntarget: mylib.is_prime\ncases: []\n", 2, "expected package.module:function"),
    ("role: is_prime\nconventions: {colour: red}\ncases:\n  - name: a\n    values: [1]\n", 2,
     "conventions: expected keys among"),
    ("role: is_prime\ntimeout: .inf\ncases:\n  - name: a\n    values: [1]\n", 2,
     "must be a finite number of seconds"),
    ("role: is_prime\ntimeout: .nan\ncases:\n  - name: a\n    values: [1]\n", 2,
     "must be a finite number of seconds"),
    ("role: is_prime\ntimeout: 1.0e+20\ncases:\n  - name: a\n    values: [1]\n", 2,
     "<= 86400"),
    ("role: is_prime\ntimeout: 0\ncases:\n  - name: a\n    values: [1]\n", 2, "> 0"),
])
def test_malformed_suites_name_the_line_and_the_problem(text, line, problem):
    with pytest.raises(SuiteError) as raised:
        parse_suite(text, "s.ntoracle.yaml")
    assert raised.value.line == line
    assert problem in raised.value.problem
    assert str(raised.value).startswith(f"s.ntoracle.yaml:{line}: ")


def test_exhaustive_profile_splits_long_ranges_into_segments_that_tile_the_range():
    suite = parse_suite("role: prime_pi\ncases:\n  - name: all\n    range: {start: 0, stop: profile}\n",
                        "s.yaml")
    profile = sampling.profile("exhaustive")
    groups = groups_of(suite, suite.cases[0], profile=profile, seed=1, sampled=None)
    assert len(groups) == -(-(profile.exhaustive + 1) // 1000)
    covered = [x for group in groups[:3] for (x,) in group.arguments(1)]
    assert covered == list(range(3000))
    assert all(a.segment[1] + 1 == b.segment[0] for a, b in zip(groups, groups[1:]))
    assert groups[-1].segment[1] == profile.exhaustive


def test_bundled_suites_cover_every_family_of_every_role():
    suites = {load_suite(entry).role: load_suite(entry) for entry in bundled_suite_paths()}
    assert set(suites) == set(roles.ROLES)
    for name, suite in suites.items():
        families = {case.spec for case in suite.cases if case.kind == "family"}
        has_range = any(case.kind == "range" for case in suite.cases)
        assert families | ({"exhaustive"} if has_range else set()) == set(roles.get(name).families), name


def test_settings_names_agree_with_the_library():
    assert _settings.PROFILE_NAMES == tuple(sampling.PROFILES)
    assert set(_settings.ROLE_NAMES) == set(roles.ROLES)


# -- suites are read with limits (issue 11) -------------------------------------- #

def alias_bomb(levels: int = 9, width: int = 9) -> str:
    """A "billion laughs" suite: each anchor lists the previous one ``width`` times, so the
    last expands to width**levels scalars (9**9 = 387,420,489) from a few hundred bytes."""
    lines = ["role: is_prime", "l0: &l0 [" + ",".join(["lol"] * width) + "]"]
    for level in range(1, levels):
        lines.append(f"l{level}: &l{level} [" + ",".join([f"*l{level - 1}"] * width) + "]")
    lines.append(f"cases: *l{levels - 1}")
    return "\n".join(lines) + "\n"


def test_an_alias_bomb_suite_is_refused_naming_the_file(tmp_path):
    text = alias_bomb()
    assert len(text.encode()) < 500 and text.count("*l") == 8 * 9 + 1
    path = tmp_path / "bomb.ntoracle.yaml"
    path.write_text(text)
    for call in (lambda: load_suite(path), lambda: parse_suite(text, str(path))):
        with pytest.raises(SuiteError) as raised:
            call()
        assert str(raised.value).startswith(f"{path}:")
        assert "aliases expanded" in raised.value.problem
    deep = "role: is_prime\ncases: " + "[" * 200 + "]" * 200 + "\n"
    with pytest.raises(SuiteError) as raised:
        parse_suite(deep, "deep.ntoracle.yaml")
    assert raised.value.line == 2 and "levels deep" in raised.value.problem


def test_a_huge_suite_is_refused_before_it_is_parsed(tmp_path):
    from oracle.pytest_support._suites import MAX_SUITE_BYTES

    path = tmp_path / "huge.ntoracle.yaml"
    case = "  - {name: c%08d, values: [2]}\n"
    with path.open("w") as handle:
        handle.write("role: is_prime\ncases:\n")
        for index in range(50 * 2**20 // len(case % 0)):
            handle.write(case % index)
    assert path.stat().st_size > 50 * 10**6
    with pytest.raises(SuiteError) as raised:
        load_suite(path)
    assert str(raised.value).startswith(f"{path}: ") and f"limit of {MAX_SUITE_BYTES}" in str(raised.value)
    with pytest.raises(SuiteError):
        parse_suite("role: is_prime\n#" + "x" * MAX_SUITE_BYTES + "\n", "long.ntoracle.yaml")


def test_bomb_and_huge_suites_are_error_items_and_the_session_goes_on(project):
    project.makefile(".ntoracle.yaml", bomb=alias_bomb())
    huge = project.path / "huge.ntoracle.yaml"
    with huge.open("w") as handle:
        handle.write("role: is_prime\ncases:\n")
        handle.write("  - {name: a, values: [2]}\n" * (2 * 2**20 // 26 + 1))
    project.makefile(".ntoracle.yaml", fine="role: is_prime\ntarget: good_prime:is_prime\n"
                                            "cases:\n  - name: a\n    values: [29341]\n")
    project.makepyfile(test_other="def test_still_runs():\n    assert True\n")
    result = project.runpytest(*PLUGIN, "-v")
    result.assert_outcomes(passed=2, errors=2)
    result.stdout.fnmatch_lines_random([
        "bomb.ntoracle.yaml::suite-error ERROR*",
        "huge.ntoracle.yaml::suite-error ERROR*",
        "malformed ntoracle suite: *bomb.ntoracle.yaml:*: more than * nodes with its aliases expanded*",
        "malformed ntoracle suite: *huge.ntoracle.yaml: * bytes, more than the limit of *",
    ])


def test_huge_answers_in_hand_written_checks_fail_with_a_bounded_message(project):
    project.makepyfile(test_huge='''
        def test_huge_integer(ntoracle_check):
            ntoracle_check.answer("prime_pi", 10**6, 10**100000)

        def test_huge_text(ntoracle_check):
            ntoracle_check.answer("is_prime", 7, "y" * (10 * 2**20))

        def test_huge_listing(ntoracle_check):
            ntoracle_check("primes_in", lambda a, b: list(range(10**5)), [(0, 10)])
    ''')
    result = project.runpytest(*PLUGIN, "--ntoracle-seed", "9")
    result.assert_outcomes(failed=3)
    output = result.stdout.str()
    assert "prime_pi(1000000): wrong (size)" in output and "an integer of 100001 digits" in output
    assert "is_prime(7): wrong-type (type)" in output and "(10485760 characters)" in output
    assert "primes_in(0, 10): wrong (listing)" in output and "of 100000 items)" in output
    assert max(len(line) for line in output.splitlines()) < 1000


def test_bundled_suites_follow_pytest_s_own_selection(project):
    project.makepyfile(test_light="def test_alone():\n    assert True\n")
    target = ["--ntoracle-target", "is_prime=good_prime:is_prime", "--ntoracle-seed", "5"]
    named = project.runpytest(*PLUGIN, *target, "test_light.py")
    named.assert_outcomes(passed=1)             # a file named: only its tests run
    asked = project.runpytest(*PLUGIN, *target, "test_light.py", "--ntoracle-bundled", "yes")
    assert asked.parseoutcomes()["passed"] > 10
    everything = project.runpytest(*PLUGIN, *target)
    assert everything.parseoutcomes()["passed"] > 10          # nothing named: the bundled suites too
    refused = project.runpytest(*PLUGIN, *target, "--ntoracle-bundled", "no")
    refused.assert_outcomes(passed=1)


# -- per-target settings (issue 12, item 1) ---------------------------------------- #

# Correct (sympy) up to 1000 and wrong above: every odd number above 1000 is called prime.
WRONG_ABOVE_1000 = '''
import sympy

def is_prime(n):
    if n <= 1000:
        return bool(sympy.isprime(n))
    return n % 2 == 1
'''

# The primes of [a, b) -- the half-open convention -- by sympy.
HALF_OPEN_PRIMES = '''
import sympy

def primes_in(a, b):
    return list(sympy.primerange(a, b))
'''

SLOW_AT_7919 = '''
import time
import sympy

def is_prime(n):
    if n == 7919:                     # the 1000th prime (OEIS A000040)
        time.sleep(30)
    return bool(sympy.isprime(n))
'''

EDGE_SUITE = '''
    role: is_prime
    cases:
      - name: edge
        values: [997, 1001, 1003]
'''


@pytest.fixture
def settings_project(project):
    project.makepyfile(wrong_above=WRONG_ABOVE_1000, half_open=HALF_OPEN_PRIMES, slow_prime=SLOW_AT_7919)
    project.makefile(".ntoracle.yaml", edge=EDGE_SUITE)      # 1001 = 7 * 11 * 13, 1003 = 17 * 59
    return project


def test_a_max_on_the_command_line_keeps_a_candidate_wrong_only_above_it_green(settings_project):
    base = [*PLUGIN, "--ntoracle-bundled", "no", "-rs", "--ntoracle-seed", "1"]
    unbounded = settings_project.runpytest(*base, "--ntoracle-target", "is_prime=wrong_above:is_prime")
    unbounded.assert_outcomes(passed=1, failed=2)
    bounded = settings_project.runpytest(*base, "--ntoracle-target", "is_prime=wrong_above:is_prime  max=1000")
    bounded.assert_outcomes(passed=1, skipped=2)
    bounded.stdout.fnmatch_lines(["ntoracle: targets is_prime=wrong_above:is_prime max=1000",
                                  "SKIPPED*above the declared domain*skipped, not passed*"])


def test_ini_settings_apply_and_the_command_line_beats_them_key_by_key(settings_project):
    settings_project.makeini("[pytest]\npythonpath = .\nntoracle_targets =\n"
                             "    is_prime = wrong_above:is_prime  max=1000  timeout=7\n")
    base = [*PLUGIN, "--ntoracle-bundled", "no", "--ntoracle-seed", "1"]
    from_ini = settings_project.runpytest(*base)
    from_ini.assert_outcomes(passed=1, skipped=2)
    from_ini.stdout.fnmatch_lines(["ntoracle: targets is_prime=wrong_above:is_prime max=1000 timeout=7"])
    # the same target on the command line: its max wins, the ini line's timeout stays
    merged = settings_project.runpytest(*base, "--ntoracle-target", "is_prime=wrong_above:is_prime max=1002")
    merged.assert_outcomes(passed=1, failed=1, skipped=1)          # 1001 checked (wrong), 1003 above
    merged.stdout.fnmatch_lines(["ntoracle: targets is_prime=wrong_above:is_prime max=1002 timeout=7"])


def test_a_target_setting_beats_the_suite_file(settings_project):
    settings_project.makefile(".ntoracle.yaml", edge='''
        role: is_prime
        max: 10**6
        cases:
          - name: edge
            values: [997, 1001, 1003]
    ''')
    base = [*PLUGIN, "--ntoracle-bundled", "no", "--ntoracle-seed", "1"]
    suite_max = settings_project.runpytest(*base, "--ntoracle-target", "is_prime=wrong_above:is_prime")
    suite_max.assert_outcomes(passed=1, failed=2)
    target_max = settings_project.runpytest(*base, "--ntoracle-target",
                                            "is_prime=wrong_above:is_prime max=1000")
    target_max.assert_outcomes(passed=1, skipped=2)


def test_a_convention_setting_judges_a_half_open_listing(settings_project):
    settings_project.makefile(".ntoracle.yaml", windows='''
        role: primes_in
        cases:
          - name: windows
            values: [[0, 101], [89, 97], [1000, 1009]]
    ''')
    base = [*PLUGIN, "--ntoracle-bundled", "no", "--ntoracle-seed", "1", "windows.ntoracle.yaml"]
    closed = settings_project.runpytest(*base, "--ntoracle-target", "primes_in=half_open:primes_in")
    closed.assert_outcomes(failed=3)        # 101, 97 and 1009 are prime (OEIS A000040): left out
    half_open = settings_project.runpytest(*base, "--ntoracle-target",
                                           "primes_in=half_open:primes_in primes_range=half-open")
    half_open.assert_outcomes(passed=3)


def test_a_timeout_setting_bounds_each_call(settings_project):
    settings_project.makefile(".ntoracle.yaml", slow='''
        role: is_prime
        cases:
          - name: thousandth
            values: [7919]
    ''')
    result = settings_project.runpytest(*PLUGIN, "--ntoracle-bundled", "no", "--ntoracle-seed", "1",
                                        "slow.ntoracle.yaml", "--ntoracle-target",
                                        "is_prime=slow_prime:is_prime timeout=0.5")
    result.assert_outcomes(failed=1)
    result.stdout.fnmatch_lines(["is_prime(7919): hung*"])


@pytest.mark.parametrize("value, problem", [
    ("is_prime=good_prime:is_prime maxx=3",
     "*ntoracle: --ntoracle-target='is_prime=good_prime:is_prime maxx=3': unknown setting 'maxx'; "
     "the settings are profile, max, timeout, primes_range, factor_shape, invalid_input"),
    ("is_prime=good_prime:is_prime max=ten", "*--ntoracle-target=*: max='ten': *cannot read 'ten'*"),
    ("is_prime=good_prime:is_prime max=-5", "*--ntoracle-target=*: max='-5': *"),
    ("is_prime=good_prime:is_prime timeout=0", "*--ntoracle-target=*: timeout='0': must be *> 0*"),
    ("is_prime=good_prime:is_prime primes_range=open",
     "*--ntoracle-target=*: primes_range='open': expected one of closed, half-open"),
    ("is_prime=good_prime:is_prime profile=fast", "*profile='fast': expected one of quick*"),
    ("is_prime=good_prime:is_prime max=1 max=2", "*setting 'max' given twice"),
    ("is_prime=good_prime:is_prime 1000", "*'1000' is not KEY=VALUE*"),
])
def test_bad_target_settings_are_usage_errors_naming_the_key(project, value, problem):
    result = project.runpytest(*PLUGIN, "--ntoracle-target", value)
    assert result.ret == pytest.ExitCode.USAGE_ERROR
    result.stderr.fnmatch_lines([problem])
    assert "Traceback" not in result.stderr.str()


def test_a_bad_ini_setting_names_the_ini_line(project):
    project.makeini("[pytest]\npythonpath = .\nntoracle_targets =\n"
                    "    is_prime = good_prime:is_prime  timeout=soon\n")
    result = project.runpytest(*PLUGIN)
    assert result.ret == pytest.ExitCode.USAGE_ERROR
    result.stderr.fnmatch_lines(["*ntoracle: ini ntoracle_targets line 'is_prime = good_prime:is_prime  "
                                 "timeout=soon': timeout='soon': expected a number of seconds"])


def test_executable_targets_take_trailing_settings(project):
    project.makepyfile(line_prime=EXEC_IS_PRIME)
    target = _settings.parse_target(f"is_prime={sys.executable} line_prime.py --fast  max=10**6 timeout=3",
                                    kind="exec", source="--ntoracle-exec")
    assert target.spec == f"{sys.executable} line_prime.py --fast"
    assert (target.maximum, target.timeout) == (10**6, 3.0)
    assert target.written() == f"is_prime={sys.executable} line_prime.py --fast max=1000000 timeout=3"


def test_convention_names_agree_with_the_library():
    import dataclasses

    from oracle.roles import _role

    assert set(_settings.CONVENTION_VALUES) == {f.name for f in dataclasses.fields(roles.Conventions)}
    assert _settings.CONVENTION_VALUES["primes_range"] == _role.RANGE_CONVENTIONS
    assert _settings.CONVENTION_VALUES["factor_shape"] == _role.FACTOR_SHAPES
    assert _settings.CONVENTION_VALUES["invalid_input"] == _role.INVALID_INPUT_POLICIES


# -- the HTML report and the session summary (issue 12, item 4) --------------------- #

GOOD_PRIME_PI = '''
import sympy

def prime_pi(n):
    return int(sympy.primepi(n))
'''


@pytest.fixture
def two_role_project(project):
    project.makepyfile(good_pi=GOOD_PRIME_PI)
    project.makefile(".ntoracle.yaml", korselt='''
        role: is_prime
        target: fermat_prime:is_prime
        cases:
          - name: korselt
            values: [29341, 7919]
    ''', counts='''
        role: prime_pi
        target: good_pi:prime_pi
        cases:
          - name: powers
            values: [10**3, 10**6]
    ''')
    return project


def test_report_option_writes_the_audit_html_report_with_every_role(two_role_project):
    result = two_role_project.runpytest(*PLUGIN, "--ntoracle-seed", "4", "--ntoracle-report", "out")
    result.assert_outcomes(passed=3, failed=1)
    page = (two_role_project.path / "out" / "report.html").read_text(encoding="utf-8")
    assert page.startswith("<!DOCTYPE html>")
    assert '<h2>is_prime: <span class="failed">failed</span></h2>' in page
    assert '<h2>prime_pi: <span class="passed">passed</span></h2>' in page
    assert "29341" in page                   # the Carmichael number 13 * 37 * 61 (OEIS A002997)
    assert "ntoracle audit fermat_prime:is_prime --role is_prime" in page   # the CLI's repeat line
    summary = json.loads((two_role_project.path / "out" / "summary.json").read_text())
    verdicts = {entry["role"]: entry["verdict"] for entry in summary["roles"]}
    assert verdicts == {"is_prime": "failed", "prime_pi": "passed"}


def test_the_html_report_is_the_cli_renderer_s(two_role_project, monkeypatch):
    """The page is oracle.report.render_html of the engine's summary of the same records."""
    two_role_project.runpytest(*PLUGIN, "--ntoracle-seed", "4", "--ntoracle-report", "out",
                               "counts.ntoracle.yaml")
    from oracle import engine
    from oracle.report._html import render_html

    records = []
    for path in sorted((two_role_project.path / "out" / "records").glob("*.jsonl")):
        records += [r for r in engine.read_records(path) if r["type"] != "end"]
    records = [r for i, r in enumerate(records) if r["type"] != "start" or i == 0]
    for record in records:                     # the plugin files each check under its case
        if record["type"] == "check":
            record["family"] = "powers"
    page = (two_role_project.path / "out" / "report.html").read_text(encoding="utf-8")
    summary = engine.summarise(records + [{"type": "end", "elapsed": 0.0}])
    assert summary["checks"] == 2 and summary["verdict"] == "passed"
    expected = render_html([(summary, records)], command="x", title="ntoracle report of the pytest session")

    def without_command_and_time(text: str) -> str:      # the two parts that differ between runs
        text = text.split('id="cautions"', 1)[1]
        before, after = text.split("<dt>time</dt>", 1)
        return before + after.split("</dd>", 1)[1]

    assert "<h3>Reach</h3>" in page and "<figure>" in page
    assert without_command_and_time(page) == without_command_and_time(expected)


def test_session_summary_lists_each_role_s_verdict_and_reach(two_role_project):
    result = two_role_project.runpytest(*PLUGIN, "--ntoracle-seed", "4")
    result.stdout.fnmatch_lines([
        "*= ntoracle =*",
        "is_prime (fermat_prime:is_prime): failed -- 2 item(s) (1 failed, 1 passed), 2 checks, 1 finding(s)",
        "    reach: checked up to 29341 (korselt); 1 case(s) with checked inputs",
        "prime_pi (good_pi:prime_pi): passed -- 2 item(s) (2 passed), 2 checks, 0 finding(s)",
        "    reach: checked up to 10^6 (powers); 1 case(s) with checked inputs",
    ], consecutive=False)


def test_session_summary_counts_points_not_run(settings_project):
    result = settings_project.runpytest(*PLUGIN, "--ntoracle-bundled", "no", "--ntoracle-seed", "1",
                                        "--ntoracle-target", "is_prime=wrong_above:is_prime max=1000")
    result.stdout.fnmatch_lines([
        "is_prime (wrong_above:is_prime): passed -- 3 item(s) (1 passed, 2 skipped), 1 checks, 0 finding(s)",
        "    reach: checked up to 997 (edge)*",
        "    not run: 2 point(s), above the declared domain* (not counted as passed)"])


# -- unique item ids and reproduce lines that reproduce (issue 12, item 3) ----------- #

def _report_lines(result) -> list[str]:
    """The session's output before pytest's short summary: with the CI variable set (as
    on a CI runner) pytest repeats each failure's whole message there."""
    lines = []
    for line in result.outlines:
        if "short test summary info" in line:
            break
        lines.append(line)
    return lines


def _reproduce_lines(result) -> list[str]:
    return [line.removeprefix("reproduce: ") for line in _report_lines(result)
            if line.startswith("reproduce: ")]


def _failure_text(result) -> list[str]:
    """The lines of the failure messages (input, got, expected, provenance), without timings."""
    return [line for line in _report_lines(result)
            if (line.startswith("ntoracle: ") and " failed " in line) or line.startswith(("    input:", "    got:", "    expected:", "    provenance:",
                                "is_prime(", "prime_pi(", "primes_in(", "reproduce: "))]


def _paste(pytester, line: str):
    words = shlex.split(line)
    assert words[0] == "pytest"
    return pytester.runpytest(*PLUGIN, *words[1:])


def test_a_pasted_reproduce_line_reruns_exactly_the_failed_bundled_item(project):
    project.makepyfile(test_unrelated="def test_elsewhere():\n    assert True\n")
    first = project.runpytest(*PLUGIN, "--ntoracle-target", "is_prime=fermat_prime:is_prime max=10**12",
                              "--ntoracle-target", "is_prime=good_prime:is_prime",
                              "--ntoracle-seed", "5", "-k", "carmichael or pseudoprimes")
    lines = _reproduce_lines(first)
    assert len(lines) == first.parseoutcomes()["failed"] >= 2
    for line in lines:
        assert "max=1000000000000" in line and "good_prime:is_prime" in line   # both targets, settings
        again = _paste(project, line)
        again.assert_outcomes(failed=1, deselected=again.parseoutcomes()["deselected"])
        assert "test_elsewhere" not in again.stdout.str()
        nodeid = shlex.split(line)[2]
        assert f"FAILED {nodeid}" in again.stdout.str()
        failed_here = [text for text in _failure_text(first) if nodeid.split("::")[-1] in text]
        assert set(failed_here) <= set(_failure_text(again))


def test_a_reproduce_line_carries_the_ini_targets_and_settings(settings_project):
    settings_project.makeini("[pytest]\npythonpath = .\nntoracle_targets =\n"
                             "    is_prime = wrong_above:is_prime  max=1002\nntoracle_seed = 8\n")
    first = settings_project.runpytest(*PLUGIN, "--ntoracle-bundled", "no")
    first.assert_outcomes(passed=1, failed=1, skipped=1)
    [line] = _reproduce_lines(first)
    assert line == ("pytest --ntoracle-item 'edge.ntoracle.yaml::is_prime::edge[1001]' --ntoracle-target "
                    "'is_prime=wrong_above:is_prime max=1002' --ntoracle-seed 8 --ntoracle-profile quick")
    settings_project.makeini("[pytest]\npythonpath = .\n")        # the line alone, without the ini
    again = _paste(settings_project, line)
    again.assert_outcomes(failed=1, deselected=2)
    assert _failure_text(again) == _failure_text(first)


def test_roles_sharing_a_case_name_and_label_are_told_apart(project):
    project.makepyfile(good_pi=GOOD_PRIME_PI)
    project.makefile(".ntoracle.yaml", both='''
        role: is_prime
        target: fermat_prime:is_prime
        cases:
          - name: random
            random: {count: 3, low: 29341, high: 29341}
          - name: small
            values: [29341, 29341, 97]
    ''', count='''
        role: prime_pi
        target: good_pi:prime_pi
        cases:
          - name: small
            values: [29341, 97]
    ''')
    collected = project.runpytest(*PLUGIN, "--collect-only", "-q")
    ids = [line for line in collected.outlines if "::" in line]
    assert len(ids) == len(set(ids)) == 5, ids        # 29341 given twice runs once
    first = project.runpytest(*PLUGIN, "--ntoracle-seed", "3")
    first.assert_outcomes(failed=2, passed=3)          # 29341 = 13 * 37 * 61 (OEIS A002997)
    for line in _reproduce_lines(first):
        assert "--ntoracle-target" not in line         # the suite names its own target
        again = _paste(project, line)
        again.assert_outcomes(failed=1, deselected=2)     # only both.ntoracle.yaml is collected
        assert "prime_pi" not in "".join(l for l in again.outlines if l.startswith(("FAILED", "PASSED")))


# Wrong at every composite n = 1 (mod 50): called prime.
ONE_MOD_50 = '''
import sympy

def is_prime(n):
    return n % 50 == 1 or bool(sympy.isprime(n))
'''


def test_random_points_reproduce_from_the_printed_seed(project):
    project.makepyfile(one_mod_50=ONE_MOD_50)
    project.makefile(".ntoracle.yaml", draws='''
        role: is_prime
        target: one_mod_50:is_prime
        cases:
          - name: draws
            segment: 1
            random: {count: 400, low: 2, high: 10**6}
    ''')
    first = project.runpytest(*PLUGIN)                # a seed drawn at random
    lines = _reproduce_lines(first)
    assert lines and len(lines) == first.parseoutcomes()["failed"]
    again = _paste(project, lines[0])
    again.assert_outcomes(failed=1, deselected=again.parseoutcomes()["deselected"])
    nodeid = shlex.split(lines[0])[2]
    assert f"FAILED {nodeid}" in again.stdout.str()
    assert "--ntoracle-seed" in lines[0]


def test_hand_written_checks_print_a_line_that_reruns_the_test(project):
    project.makepyfile(test_hand='''
        from fermat_prime import is_prime as fermat

        def test_passes(ntoracle_check):
            ntoracle_check("is_prime", fermat, [2, 3, 97])

        def test_check_fails(ntoracle_check):
            ntoracle_check("is_prime", fermat, [29341])
    ''')
    first = project.runpytest(*PLUGIN, "--ntoracle-seed", "9")
    first.assert_outcomes(passed=1, failed=1)
    [line] = _reproduce_lines(first)
    assert line == "pytest --ntoracle-item test_hand.py::test_check_fails --ntoracle-seed 9 --ntoracle-profile quick"
    again = _paste(project, line)
    again.assert_outcomes(failed=1, deselected=1)
    assert _failure_text(again) == _failure_text(first)


def test_an_item_id_that_names_no_item_is_a_usage_error(project):
    result = project.runpytest(*PLUGIN, "--ntoracle-target", "is_prime=good_prime:is_prime",
                               "--ntoracle-item", "ntoracle::is_prime::carmichael[1..2]")
    assert result.ret == pytest.ExitCode.USAGE_ERROR
    result.stderr.fnmatch_lines(["*--ntoracle-item 'ntoracle::is_prime::carmichael[[]1..2[]]': no such item*"])


def test_bundled_item_ids_are_unique_for_every_role(project):
    project.makepyfile(good_pi=GOOD_PRIME_PI)
    arguments = [f"--ntoracle-target={role}=good_pi:prime_pi" for role in _settings.ROLE_NAMES]
    collected = project.runpytest(*PLUGIN, *arguments, "--collect-only", "-q", "--ntoracle-seed", "2")
    ids = [line for line in collected.outlines if line.startswith("ntoracle::")]
    assert len(ids) > 50 and len(ids) == len(set(ids))
    assert {line.split("::")[1] for line in ids} == set(_settings.ROLE_NAMES)


def test_failure_text_writes_values_with_the_shared_renderer(project):
    # issue 12 item 6: true/false as everywhere else; a long list shown around its first
    # difference, so got and expected never show the same prefix
    project.makepyfile(test_render='''
        import sympy

        PRIMES = [int(p) for p in sympy.primerange(2, 401)]       # sympy, test-only reference

        def test_boolean(ntoracle_check):
            ntoracle_check.answer("is_prime", 561, True)           # OEIS A002997: Carmichael

        def test_listing(ntoracle_check):
            ntoracle_check("primes_in", lambda a, b: PRIMES[:40] + PRIMES[41:], [(2, 400)])
    ''')
    result = project.runpytest(*PLUGIN, "--ntoracle-seed", "3")
    result.assert_outcomes(failed=2)
    result.stdout.fnmatch_lines(["*is_prime(561): wrong (exact)", "    got:        true",
                                 "    expected:   false"])
    output = result.stdout.str()
    assert "True" not in output.replace("assert True", "")
    got = next(line for line in output.splitlines() if line.startswith("    got:        [..."))
    expected = next(line for line in output.splitlines() if line.startswith("    expected:   [..."))
    assert "179" not in got and "179" in expected           # the 41st prime, lost (sympy.prime(41))
    assert ",," not in got + expected and got[16:] != expected[16:]


# Correct and slow where the input is a large prime: trial division by odd d <= isqrt(n).
TRIAL_DIVISION_IS_PRIME = """
from math import isqrt

def is_prime(n):
    if n < 2:
        return False
    if n % 2 == 0:
        return n == 2
    return all(n % d for d in range(3, isqrt(n) + 1, 2))
"""


def test_a_correct_but_slow_candidate_is_skipped_where_too_slow_never_failed(project):
    # Each plugin item is a run of its own; a large prime such as 2^61 - 1 (OEIS A000668) asked
    # in an item of its own must be judged against the calls of the items before it, and
    # trial division's quick answers on large composites must not make it look hung.
    project.makepyfile(trial=TRIAL_DIVISION_IS_PRIME)
    result = project.runpytest(*PLUGIN, "--ntoracle-target", "is_prime=trial:is_prime timeout=0.5",
                               "--ntoracle-seed", "3", "-k", "landmarks or pseudoprimes or carmichael", "-rs")
    outcomes = result.parseoutcomes()
    assert "failed" not in outcomes, result.stdout.str()[-3000:]
    assert outcomes.get("skipped", 0) >= 1            # 2^61 - 1 is beyond trial division in 0.5 s
    assert "too slow" in result.stdout.str() or "too-slow" in result.stdout.str()


def test_a_candidate_s_pytest_outcome_is_a_finding_not_a_skip_or_an_xfail(pytester):
    # ntoracle_check calls the function in the test's own process: pytest.skip, pytest.xfail
    # and SystemExit raised by the candidate (or by its answer's __index__) must fail the
    # check, not turn it into a skip, an expected failure or an error of the session
    pytester.makeini("[pytest]\npythonpath = .\n")
    pytester.makepyfile(test_outcomes='''
        import sys
        import pytest

        def prime_pi(x):                 # π(10) = 4, π(100) = 25, OEIS A000720
            return {10: 4, 100: 25}[x]

        def skips(x):
            pytest.skip("nothing to see") if x == 100 else None
            return prime_pi(x)

        def xfails(x):
            pytest.xfail("expected") if x == 100 else None
            return prime_pi(x)

        def exits(x):
            sys.exit(0) if x == 100 else None
            return prime_pi(x)

        class SkippingIndex:
            def __index__(self):
                pytest.skip("skipped while read")

        @pytest.mark.parametrize("function", [skips, xfails, exits])
        def test_check(ntoracle_check, function):
            ntoracle_check("prime_pi", function, [10, 100])

        def test_answer(ntoracle_check):
            ntoracle_check.answer("prime_pi", 100, SkippingIndex())
    ''')
    result = pytester.runpytest(*PLUGIN, "--ntoracle-seed", "9")
    result.assert_outcomes(failed=4)
    result.stdout.fnmatch_lines(["*Skipped: nothing to see*", "*XFailed: expected*",
                                 "*SystemExit: 0*", "*reading the answer raised Skipped*"])


DOCTORING_PRIME_PI = '''
import glob

import sympy


def prime_pi(n):
    """Wrong at 1000; at 2000 right, but first rewrites the records files of the items before it
    (it runs as the same user as pytest) so that the wrong answer reads as a pass."""
    if n == 2000:
        for path in glob.glob("out/records/*.jsonl"):
            with open(path, "r+b") as handle:
                data = handle.read()
                handle.seek(0)
                handle.write(data.replace(b'"status": "wrong"', b'"status":  "pass"'))
    return int(sympy.primepi(n)) + (n == 1000)
'''


def test_a_records_file_changed_after_its_item_wrote_it_is_left_out_of_the_report(project):
    project.makepyfile(doctor=DOCTORING_PRIME_PI)
    project.makefile(".ntoracle.yaml", doctored='''
        role: prime_pi
        target: doctor:prime_pi
        cases:
          - name: wrong
            values: [1000]
          - name: doctors
            values: [2000]
    ''')
    result = project.runpytest(*PLUGIN, "--ntoracle-seed", "4", "--ntoracle-report", "out",
                               "-p", "no:randomly")
    result.assert_outcomes(passed=1, failed=1)
    (edited,) = [path for path in (project.path / "out" / "records").glob("*.jsonl")
                 if '"status":  "pass"' in path.read_text()]             # it did edit the file
    page = (project.path / "out" / "report.html").read_text(encoding="utf-8")
    assert '<h2>prime_pi: <span class="failed">failed</span></h2>' in page
    assert "was changed after the item wrote it" in page


def test_a_failure_message_shows_a_candidate_s_control_codes_as_text():
    from oracle.pytest_support._messages import failure_message

    forged = "\r\x1b[1A\x1b[2K\x1b[32mpassed\x1b[0m\nPASSED"
    summary = {"checks": 1, "failures": [{"status": "raised", "check": "exception",
                                          "family": "case", "arguments": [504], "got": None,
                                          "expected": None, "provenance": "", "detail": forged}],
               "first_divergence": None, "skipped": {}}
    message = failure_message(summary, role="prime_pi", target="t:f", case="case", seed=1,
                              profile="quick")
    assert not any(code in message for code in ("\x1b", "\r"))
    assert "\\x1b[32mpassed" in message and not any(line.startswith("PASSED")
                                                   for line in message.splitlines())
