"""The ntoracle pytest plugin (entry point group ``pytest11``, name ``ntoracle``).

Configure one or more targets and the bundled suites run as test items::

    pytest --ntoracle-target prime_pi=mylib.count:prime_pi --ntoracle-profile ci

(with files or folders named, ``pytest tests/test_fast.py ...``, the bundled suites run only
with ``--ntoracle-bundled yes``; ``--ntoracle-bundled no`` leaves them out always)

or, in ``pyproject.toml``::

    [tool.pytest.ini_options]
    ntoracle_targets = '''
        prime_pi = mylib.count:prime_pi
        is_prime = mylib.primality:is_prime
    '''
    ntoracle_profile = "ci"

The command line beats the ini file, which beats the default (profile
``quick``, a random seed printed in the report header).  A target may carry its own
settings, ``prime_pi=mylib.count:prime_pi max=10**12 timeout=2 primes_range=half-open``
(the keys of a suite file; precedence in :mod:`oracle.pytest_support._settings`).  User suite files
named ``*.ntoracle.yaml`` are collected wherever pytest looks for tests
(format: :mod:`oracle.pytest_support._suites`).  Fixtures: ``ntoracle`` (the
oracle facade), ``ntoracle_bounds``, ``ntoracle_seed``, ``ntoracle_points``
(the sampler at the session seed) and ``ntoracle_check`` (an assertion helper
with the messages of the check items).  ``--ntoracle-hypothesis-profile
ntoracle-ci`` (or the ini key of that name) loads the hypothesis settings
profile of :mod:`oracle.strategies`; without it no hypothesis profile is loaded.

Every failure prints one line that re-runs exactly that item, ``pytest --ntoracle-item ID``
with the targets of its role, their settings, the seed and the profile
(:mod:`oracle.pytest_support._reproduce`).  ``--ntoracle-report DIR`` writes the HTML
report of ``ntoracle audit --report`` for the session; the terminal summary lists each
role's verdict and reach (:mod:`oracle.pytest_support._session`).

Python targets are imported and called only in isolated worker processes (the pytest
process, which judges, never imports them); ``--ntoracle-in-process`` (or the ini key
``ntoracle_in_process = true``) calls them in the pytest process instead, trusting them.

With no target and no suite file the plugin adds nothing and imports nothing
of the library: every hook below imports what it needs when it runs.

Passing these checks is evidence, not a certificate; a probable prime is not a
proven prime; for cryptographic use defer to the published standards and a
vetted library.
"""

from __future__ import annotations

import pytest

#: User suite files are the files whose names end so (``pi.ntoracle.yaml``).
SUITE_SUFFIX = ".ntoracle.yaml"
#: The node ids of the bundled suites' items start so.
BUNDLED_PREFIX = "ntoracle::"

_HELP_TARGET = ("ROLE=package.module:function [KEY=VALUE ...]: a Python target to check "
                "(repeatable); settings: profile, max, timeout, primes_range, factor_shape, "
                "invalid_input (quote the whole value when it has settings)")
_HELP_EXEC = ("ROLE=CMD ARGS [KEY=VALUE ...]: an executable speaking the line protocol (repeatable); "
              "the trailing KEY=VALUE words with a setting's name are settings")
_HELP_PROFILE = "profile of the checks: quick, ci, deep or exhaustive (default quick)"
_HELP_SEED = "seed of the sampled points (default: drawn at random and printed in the header)"
_HELP_REPORT = ("write report.html (the HTML report of 'ntoracle audit --report'), summary.json and "
                "the records of every check item into DIR")
_HELP_HYPOTHESIS = "load this hypothesis settings profile of oracle.strategies (ntoracle-ci, ntoracle-dev)"
_HELP_BUNDLED = ("whether the bundled suites run: 'auto' (default) runs them unless files or "
                 "folders are named on the command line, 'yes' always, 'no' never")
_HELP_ITEM = ("run only the item with exactly this node id (repeatable); the failures of ntoracle "
              "checks print the whole command line")
_HELP_IN_PROCESS = ("call Python targets in the pytest process instead of an isolated worker: "
                    "faster, but the target can then change the verdict; only for code you trust")
_HELP_TARGETS_INI = ("targets to check, one 'ROLE = package.module:function [KEY=VALUE ...]' a line "
                     "(settings as for --ntoracle-target)")


def pytest_addoption(parser):
    group = parser.getgroup("ntoracle", "checks against the ntoracle reference oracle")
    group.addoption("--ntoracle-target", action="append", metavar="ROLE=MODULE:FUNCTION",
                    dest="ntoracle_target", help=_HELP_TARGET)
    group.addoption("--ntoracle-exec", action="append", metavar="ROLE=CMD ARGS",
                    dest="ntoracle_exec", help=_HELP_EXEC)
    group.addoption("--ntoracle-profile", metavar="P", dest="ntoracle_profile", help=_HELP_PROFILE)
    group.addoption("--ntoracle-seed", metavar="N", dest="ntoracle_seed", help=_HELP_SEED)
    group.addoption("--ntoracle-report", metavar="DIR", dest="ntoracle_report", help=_HELP_REPORT)
    group.addoption("--ntoracle-hypothesis-profile", metavar="NAME",
                    dest="ntoracle_hypothesis_profile", help=_HELP_HYPOTHESIS)
    group.addoption("--ntoracle-bundled", choices=("auto", "yes", "no"), default="auto",
                    dest="ntoracle_bundled", help=_HELP_BUNDLED)
    group.addoption("--ntoracle-in-process", action="store_true", dest="ntoracle_in_process",
                    help=_HELP_IN_PROCESS)
    group.addoption("--ntoracle-item", action="append", metavar="NODEID", dest="ntoracle_item",
                    help=_HELP_ITEM)
    parser.addini("ntoracle_targets", _HELP_TARGETS_INI, type="linelist", default=[])
    parser.addini("ntoracle_in_process", _HELP_IN_PROCESS, type="bool", default=False)
    parser.addini("ntoracle_profile", _HELP_PROFILE, default="")
    parser.addini("ntoracle_seed", _HELP_SEED, default="")
    parser.addini("ntoracle_hypothesis_profile", _HELP_HYPOTHESIS, default="")


@pytest.hookimpl(tryfirst=True)
def pytest_configure(config):
    from .pytest_support import _settings

    inherited = getattr(config, "workerinput", {}).get("ntoracle_seed")
    settings = _settings.resolve(config, inherited_seed=inherited)
    if settings.errors:
        raise pytest.UsageError("ntoracle: " + "\nntoracle: ".join(settings.errors))
    config.stash[_settings.SETTINGS] = settings
    config.addinivalue_line("markers", "ntoracle: a check of a target against the ntoracle oracle")
    if settings.active:
        _check_targets(settings)
        from .pytest_support._nodes import TargetPool

        config.stash[_settings.POOL] = TargetPool(in_process=settings.in_process)
    if settings.active or settings.report_dir:      # else registered by the first suite file
        from .pytest_support._session import register_tally

        register_tally(config)
    _hypothesis_profiles(config, settings)


def _check_targets(settings) -> None:
    """A Python target that cannot be imported, or a command that cannot be found, is a usage
    error, reported before any test.  A Python target is imported only in a worker process
    (the pytest process, which holds the oracle and the judge, never imports candidate code):
    the worker is started once here to read its handshake."""
    import shlex
    import shutil

    from . import targets
    from ._errors import InvalidInputError

    for target in settings.targets:
        if target.kind == "exec":
            argv = shlex.split(target.spec)
            if not argv or shutil.which(argv[0]) is None:
                raise pytest.UsageError(f"ntoracle: {target.source}={target.role}={target.spec}: "
                                        "no such command")
            continue
        try:
            targets.python_target(target.spec, role_name=target.role, timeout=1.0).close()
        except InvalidInputError as error:
            raise pytest.UsageError(f"ntoracle: {target.source}: {error} (is its folder on "
                                    "sys.path? pytest's 'pythonpath' ini key adds it)") from None


def _hypothesis_profiles(config, settings) -> None:
    asked = config.getoption("hypothesis_profile", None)
    if settings.hypothesis_profile or (asked and str(asked).startswith("ntoracle-")):
        from .strategies import register_profiles

        register_profiles()
    if settings.hypothesis_profile:
        from hypothesis import settings as hypothesis_settings
        from hypothesis.errors import InvalidArgument

        try:
            hypothesis_settings.load_profile(settings.hypothesis_profile)
        except InvalidArgument as error:
            raise pytest.UsageError(f"ntoracle: hypothesis profile {settings.hypothesis_profile!r}: "
                                    f"{error}") from None


@pytest.hookimpl(optionalhook=True)
def pytest_configure_node(node):
    """pytest-xdist: every worker draws its points from the controller's seed."""
    from .pytest_support._settings import SETTINGS

    node.workerinput["ntoracle_seed"] = node.config.stash[SETTINGS].seed


def pytest_report_header(config):
    from .pytest_support._settings import SETTINGS

    settings = config.stash.get(SETTINGS, None)
    if settings is None or not settings.active:
        return None
    targets = ", ".join(target.written() for target in settings.targets)
    return [f"ntoracle: seed {settings.seed} ({settings.seed_source}), profile {settings.profile}",
            f"ntoracle: targets {targets}"]


def pytest_collect_file(file_path, parent):
    if file_path.name.endswith(SUITE_SUFFIX):
        from .pytest_support._nodes import SuiteFile

        return SuiteFile.from_parent(parent, path=file_path)
    return None


@pytest.hookimpl(tryfirst=True)
def pytest_collection_modifyitems(session, config, items):
    """With targets configured, the bundled suites join the collected items (before ``-k``,
    ``-m``, ``--lf`` and ``--deselect`` choose among them), unless files or folders were named
    on the command line (:func:`_bundled_wanted`).  With ``--ntoracle-item`` only the items of
    exactly those ids are kept; an id that names no item is a usage error."""
    from .pytest_support._settings import SETTINGS

    settings = config.stash.get(SETTINGS, None)
    if settings is not None and settings.active and _bundled_wanted(config):
        from .pytest_support._nodes import BundledSuites

        root = BundledSuites.from_parent(session, name="ntoracle", nodeid="ntoracle")
        items.extend(_items_of(root, session))
    wanted = set(config.getoption("ntoracle_item", None) or ())
    if wanted:
        kept = [item for item in items if item.nodeid in wanted]
        missing = sorted(wanted - {item.nodeid for item in kept})
        if missing:
            raise pytest.UsageError(f"ntoracle: --ntoracle-item {missing[0]!r}: no such item (the ids "
                                    "of sampled points depend on the seed, the profile and the targets)")
        config.hook.pytest_deselected(items=[item for item in items if item.nodeid not in wanted])
        items[:] = kept


def _bundled_wanted(config) -> bool:
    """The bundled suites follow pytest's own selection: with files or folders named on the
    command line (``pytest tests/test_fast.py``) they run only when asked for with
    ``--ntoracle-bundled yes``; with none named (the ini's testpaths or the current folder)
    they run unless ``--ntoracle-bundled no``.  With ``--ntoracle-item`` they run when one of
    the ids is theirs."""
    choice = config.getoption("ntoracle_bundled", "auto")
    if choice != "auto":
        return choice == "yes"
    wanted = config.getoption("ntoracle_item", None)
    if wanted:
        return any(nodeid.startswith(BUNDLED_PREFIX) for nodeid in wanted)
    return config.args_source != pytest.Config.ArgsSource.ARGS


def pytest_ignore_collect(collection_path, config):
    """With ``--ntoracle-item``, only the files of the ids given (and the folders holding
    them) are collected: re-running one item does not import the rest of the test suite."""
    wanted = config.getoption("ntoracle_item", None)
    if not wanted:
        return None
    files = {config.rootpath / nodeid.split("::", 1)[0] for nodeid in wanted
             if not nodeid.startswith(BUNDLED_PREFIX)}
    if collection_path in files or any(collection_path in path.parents for path in files):
        return None
    return True


def _items_of(collector, session):
    report = collector.ihook.pytest_make_collect_report(collector=collector)
    session.ihook.pytest_collectreport(report=report)
    for node in report.result:
        if isinstance(node, pytest.Item):
            yield node
        else:
            yield from _items_of(node, session)


def pytest_sessionfinish(session):
    from .pytest_support._settings import POOL

    pool = session.config.stash.get(POOL, None)
    if pool is not None:
        pool.close()


def pytest_terminal_summary(terminalreporter, config):
    """Per role and target, the verdict and the reach (:mod:`oracle.pytest_support._session`),
    then the seed and the cautions."""
    from .pytest_support._settings import SETTINGS, TALLY

    settings = config.stash.get(SETTINGS, None)
    tally = config.stash.get(TALLY, None)
    if settings is None or not (settings.active or (tally is not None and tally.roles)):
        return
    from .report import CAUTIONS

    terminalreporter.section("ntoracle")
    for role in (sorted(tally.roles.values(), key=lambda r: (r.role, r.target)) if tally else ()):
        for line in role.lines():
            terminalreporter.write_line(line)
    if settings.report_dir:
        terminalreporter.write_line(f"report: {settings.report_dir}/report.html and summary.json")
    terminalreporter.write_line(f"seed {settings.seed}, profile {settings.profile}: repeat with "
                                f"--ntoracle-seed {settings.seed} --ntoracle-profile {settings.profile}")
    for caution in CAUTIONS:
        terminalreporter.write_line(f"caution: {caution}")


@pytest.fixture(scope="session")
def ntoracle():
    """The oracle facade (``import oracle``): exact values with provenance."""
    import oracle

    return oracle


@pytest.fixture(scope="session")
def ntoracle_bounds():
    """The proven bounds (:mod:`oracle.bounds`)."""
    from oracle import bounds

    return bounds


@pytest.fixture(scope="session")
def ntoracle_seed(pytestconfig):
    """The session seed (``--ntoracle-seed``, ini ``ntoracle_seed``, or drawn and printed)."""
    from .pytest_support._settings import SETTINGS

    return pytestconfig.stash[SETTINGS].seed


@pytest.fixture(scope="session")
def ntoracle_points(pytestconfig):
    """``ntoracle_points(role, family=None, profile=None)``: the sampler's points at the session seed."""
    from .pytest_support._fixtures import PointSampler
    from .pytest_support._settings import SETTINGS

    settings = pytestconfig.stash[SETTINGS]
    return PointSampler(settings.seed, settings.profile)


@pytest.fixture
def ntoracle_check(request):
    """``ntoracle_check(role, function, points)`` and ``ntoracle_check.answer(role, arguments, got)``:
    fail the test with input, got, expected, provenance, seed and the command that re-runs the
    test when the oracle disagrees."""
    from .pytest_support._fixtures import Checker
    from .pytest_support._reproduce import reproduce_line
    from .pytest_support._settings import SETTINGS

    settings = request.config.stash[SETTINGS]
    return Checker(settings.seed, settings.profile,
                   reproduce=reproduce_line(request.config, request.node.nodeid))
