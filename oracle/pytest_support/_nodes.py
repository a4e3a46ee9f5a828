"""The pytest nodes: suite collectors and check items.

The tree of one configured run::

    ntoracle                                  (bundled suites, when targets are configured)
      prime_pi                                (one collector per suite and target; the
        exhaustive[0..999]                     target's spec is added when a role has several)
        boundaries[255..65538]                (one item per group of points)
    tests/pi.ntoracle.yaml                    (a user suite file)
      prime_pi
        small[10]

Each item asks its target at its points and judges the answers with the audit
engine (:mod:`._judging`); items share nothing but the per-process pool of
targets, so pytest-xdist may run them in any order on any worker.
"""

from __future__ import annotations

import re
import warnings
from importlib import resources

import pytest

from ._settings import POOL, SETTINGS, Effective, TargetSetting, effective
from ._suites import Suite, SuiteError, groups_of, load_suite, small_exhaustive

__all__ = ["SETTINGS", "POOL", "TargetPool", "BundledSuites", "SuiteFile", "CheckItem",
           "SuiteErrorItem", "bundled_suite_paths"]

_SAMPLES = pytest.StashKey[dict]()
#: Characters kept in names made from a target's spec.
_UNSAFE = re.compile(r"[^A-Za-z0-9_.\-]+")


def bundled_suite_paths() -> list:
    """The suites shipped in ``oracle.suites``, sorted by name."""
    folder = resources.files("oracle.suites")
    return sorted((entry for entry in folder.iterdir() if entry.name.endswith(".yaml")),
                  key=lambda entry: entry.name)


class TargetPool:
    """The targets of this process, made on first use and closed at the end of the session."""

    def __init__(self, *, in_process: bool = False):
        self._targets: dict[tuple, object] = {}
        self._speeds: dict[tuple, object] = {}
        self.in_process = in_process

    def speed(self, kind: str, spec: str, role: str):
        """The cost curve of one target in one role, shared by its items in this process, so
        that a timeout in one item is judged against the calls of the items before it."""
        from ..engine import SpeedModel

        return self._speeds.setdefault((kind, spec, role), SpeedModel())

    def get(self, kind: str, spec: str, role: str, timeout: float):
        from .. import targets

        key = (kind, spec, role, timeout)
        if key not in self._targets:
            if kind == "python":
                self._targets[key] = targets.python_target(spec, role_name=role, timeout=timeout,
                                                           isolate=not self.in_process)
            else:
                self._targets[key] = targets.exec_target(spec, role_name=role, timeout=timeout)
        return self._targets[key]

    def close(self) -> None:
        for target in self._targets.values():
            target.close()
        self._targets.clear()


def _sampled(config, role: str, profile, seed: int):
    """``family -> points`` of the sampler for ``role`` (drawn once per process)."""
    from .. import roles, sampling

    cache = config.stash.setdefault(_SAMPLES, {})
    key = (role, profile.name, seed)
    if key not in cache:
        by_family: dict[str, list] = {}
        for sample in sampling.sample(roles.get(role), small_exhaustive(profile), seed):
            by_family.setdefault(sample.family, []).append(sample.arguments)
        cache[key] = by_family
    return lambda family: cache[key].get(family, [])


class _TargetCollector(pytest.Collector):
    """The items of one suite against one target."""

    def __init__(self, *, suite: Suite, target: TargetSetting, **kwargs):
        super().__init__(**kwargs)
        self.suite, self.target = suite, target
        self.effective: Effective = effective(suite, target, self.config.stash[SETTINGS])

    def collect(self):
        from .. import sampling

        settings = self.config.stash[SETTINGS]
        profile = sampling.profile(self.effective.profile)
        sampled = _sampled(self.config, self.suite.role, profile, settings.seed)
        names: set[str] = set()
        for case in self.suite.cases:
            for group in groups_of(self.suite, case, profile=profile, seed=settings.seed,
                                   sampled=sampled):
                name = _unique(f"{group.case}[{group.label}]", names)
                yield CheckItem.from_parent(self, name=name, group=group, nodeid=f"{self.nodeid}::{name}")

    def reportinfo(self):
        return self.suite.path, self.suite.line - 1, f"{self.suite.name} ({self.target.spec})"


def _unique(name: str, names: set[str]) -> str:
    """``case[label]``, or ``case[label#2]`` for the second group with that label, so that
    every item of a collector has its own id.  The node id is written out (parent ``::``
    name) so that pytest reads the label as the item's parameters, as for its own
    parametrised tests, and ``--lf`` and ``--ntoracle-item`` recognise the ids."""
    chosen, count = name, 1
    while chosen in names:
        count += 1
        chosen = f"{name[:-1]}#{count}]"
    names.add(chosen)
    return chosen


def _target_children(parent, suite: Suite, targets: list[TargetSetting]):
    """One collector per target: named after the role, and after the target too when the role
    has several (``prime_pi@mylib.count_prime_pi``; no brackets, which would end a node id)."""
    names: set[str] = set()
    for index, target in enumerate(targets, start=1):
        name = suite.role
        if len(targets) > 1:
            name = f"{suite.role}@{_UNSAFE.sub('_', target.spec)}"
            name = name if name not in names else f"{name}-{index}"
        names.add(name)
        yield _TargetCollector.from_parent(parent, name=name, suite=suite, target=target)


class BundledSuites(pytest.Collector):
    """The suites shipped with ntoracle, run against every configured target of their role."""

    def collect(self):
        settings = self.config.stash[SETTINGS]
        for entry in bundled_suite_paths():
            suite = load_suite(entry)
            yield from _target_children(self, suite, settings.targets_for(suite.role))

    def reportinfo(self):
        return self.path, None, "ntoracle bundled suites"


class SuiteFile(pytest.File):
    """A user suite file (``*.ntoracle.yaml``)."""

    def collect(self):
        from ._session import register_tally

        register_tally(self.config)
        try:
            suite = load_suite(self.path)
        except SuiteError as error:
            yield SuiteErrorItem.from_parent(self, name="suite-error", error=error)
            return
        if suite.target is not None:
            kind, spec = suite.target
            targets = [TargetSetting(suite.role, kind, spec, f"{self.path.name}: target")]
        else:
            targets = self.config.stash[SETTINGS].targets_for(suite.role)
        if not targets:
            yield SuiteErrorItem.from_parent(
                self, name="no-target", error=None,
                skip_reason=f"{self.path.name}: no target for role {suite.role}: name one in the suite "
                            f"('target:' or 'exec:') or with --ntoracle-target {suite.role}=...")
            return
        yield from _target_children(self, suite, targets)


class SuiteErrorItem(pytest.Item):
    """Stands for a suite that cannot be collected: one clear error, the other tests still run
    (a pytest collection error would interrupt the whole session)."""

    def __init__(self, *, error: SuiteError | None, skip_reason: str | None = None, **kwargs):
        super().__init__(**kwargs)
        self.error, self.skip_reason = error, skip_reason

    def setup(self):
        if self.skip_reason:
            pytest.skip(self.skip_reason)
        pytest.fail(f"malformed ntoracle suite: {self.error}", pytrace=False)

    def runtest(self):                                   # never reached: setup fails
        pytest.fail(f"malformed ntoracle suite: {self.error}", pytrace=False)

    def reportinfo(self):
        line = self.error.line - 1 if self.error and self.error.line else None
        return self.path, line, f"suite {self.path.name}"


class PointsNotRun(UserWarning):
    """Some points of a passing item were not run (above ``max``, out of the oracle's reach,
    time budget spent): the item passed on the others only."""


class CheckFailed(Exception):
    """A check item found the target wrong; the summary is attached."""

    def __init__(self, summary: dict):
        super().__init__("ntoracle check failed")
        self.summary = summary


class CheckItem(pytest.Item):
    """One group of points of a suite, asked of one target and judged by the oracle."""

    def __init__(self, *, group, **kwargs):
        super().__init__(**kwargs)
        self.group = group
        self.add_marker("ntoracle")

    @property
    def suite(self) -> Suite:
        return self.parent.suite

    @property
    def target_setting(self) -> TargetSetting:
        return self.parent.target

    def runtest(self):
        from .. import roles, sampling
        from .._errors import InvalidInputError
        from ._judging import judge_invalid_inputs, judge_points

        settings = self.config.stash[SETTINGS]
        suite, setting, chosen = self.suite, self.target_setting, self.parent.effective
        self.user_properties += [("ntoracle_role", suite.role), ("ntoracle_target", setting.spec),
                                 ("ntoracle_case", self.group.case)]
        profile = sampling.profile(chosen.profile)
        timeout = chosen.timeout or profile.timeout
        try:
            pool = self.config.stash.setdefault(POOL, TargetPool(in_process=settings.in_process))
            target = pool.get(setting.kind, setting.spec, suite.role, timeout)
        except InvalidInputError as error:
            pytest.fail(f"ntoracle: {setting.source}: {error}", pytrace=False)
        points = self.group.arguments(roles.get(suite.role).arity)
        stream = self._stream_path()
        written: list[dict] = []        # to tell later whether the file still holds them
        common = dict(role=suite.role, profile=profile.name, seed=settings.seed, points=points,
                      timeout=timeout, conventions=chosen.conventions, stream=stream,
                      on_record=written.append if stream else None)
        try:
            if self.group.kind == "invalid":
                summary = judge_invalid_inputs(target, **common)
            else:
                summary = judge_points(target, maximum=chosen.maximum,
                                       speed=pool.speed(setting.kind, setting.spec, suite.role), **common)
        except OSError as error:                          # an executable that cannot be started
            pytest.fail(f"ntoracle: {setting.source}: cannot run {setting.spec!r}: {error}", pytrace=False)
        from ._session import item_properties

        self.user_properties += [("ntoracle_seed", settings.seed), *item_properties(summary, self.group.case)]
        if stream:
            from ..engine._records import records_digest

            self.user_properties.append(("ntoracle_records_sha256", records_digest(written)))
        if summary["failures"]:
            raise CheckFailed(summary)
        reasons = "; ".join(f"{count} point(s): {reason}" for reason, count in summary["skipped"].items())
        if summary["checks"] == 0:
            pytest.skip(f"no point checked ({reasons or 'no points'}); skipped, not passed")
        if summary.get("too_slow"):                # the limit of the target's reach, not a defect
            pytest.skip(f"{summary['too_slow']} call(s) too slow (no answer within {timeout} s, "
                        f"after calls at smaller sizes grew slower); skipped, not passed")
        if reasons:
            warnings.warn(PointsNotRun(f"{self.nodeid}: not run, so not passed: {reasons}"))

    def _stream_path(self) -> str | None:
        from ._session import stream_path

        directory = self.config.stash[SETTINGS].report_dir
        return stream_path(directory, self.nodeid) if directory else None

    def repr_failure(self, excinfo, style=None):
        if isinstance(excinfo.value, CheckFailed):
            from ._messages import failure_message

            settings = self.config.stash[SETTINGS]
            profile = self.parent.effective.profile
            return failure_message(excinfo.value.summary, role=self.suite.role,
                                   target=self.target_setting.spec, case=self.group.case,
                                   seed=settings.seed, profile=profile, reproduce=self.reproduce_line())
        return super().repr_failure(excinfo, style)

    def reproduce_line(self) -> str:
        """The command that re-runs exactly this item: its id, the targets of its role as
        configured (a suite that names its own target needs none), the seed and profile."""
        from ._reproduce import reproduce_line

        own = isinstance(self.parent.parent, SuiteFile) and self.suite.target is not None
        return reproduce_line(self.config, self.nodeid, role=None if own else self.suite.role)

    def reportinfo(self):
        return self.path, self.group.line - 1, f"{self.suite.role}: {self.name} ({self.target_setting.spec})"
