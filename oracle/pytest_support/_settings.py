"""The plugin's settings: command-line options and ini keys, resolved once per session.

Precedence (docs/DESIGN.md, "pytest plugin"): the command line beats the ini file
(``[tool.pytest.ini_options]`` of ``pyproject.toml``, ``pytest.ini``, ...),
which beats the default.  Targets are taken as a whole from one place: if the
command line names any target (``--ntoracle-target`` or ``--ntoracle-exec``),
the ini key ``ntoracle_targets`` is ignored.  Every error names where the bad
value came from (``--ntoracle-seed=...`` or ``ini ntoracle_targets line '...'``).

Per-target settings follow the target in one small syntax (the same keys as a
suite file, the conventions written flat)::

    prime_pi = mylib.count:prime_pi  max=10**12  timeout=2  primes_range=half-open

Keys: ``profile``, ``max`` (the largest input the target claims), ``timeout``
(seconds per call), and the conventions ``primes_range``, ``factor_shape`` and
``invalid_input`` (:class:`oracle.roles.Conventions`).  For a Python target every
word after ``module:function`` is a setting; for an executable the trailing words
``KEY=VALUE`` whose ``KEY`` is one of these names are settings, the words before
them the command.  For one key the order is: a setting on ``--ntoracle-target``,
then one on the ini line of the same role and target, then the suite file, then
the session (``--ntoracle-profile``, ini ``ntoracle_profile``), then the defaults
(:func:`effective`).

Only the standard library and :mod:`oracle._integers` are imported here: the
settings are read in every session, also in those with nothing configured.
"""

from __future__ import annotations

import dataclasses
import os
import re
from dataclasses import dataclass, field

import pytest

from .._errors import InvalidInputError
from .._integers import parse_integer, require_int

__all__ = ["TargetSetting", "Settings", "Effective", "resolve", "effective", "DEFAULT_PROFILE",
           "PROFILE_NAMES", "ROLE_NAMES", "CONVENTION_VALUES", "SETTING_KEYS", "SETTINGS", "POOL",
           "TALLY"]

DEFAULT_PROFILE = "quick"
#: The profiles of :mod:`oracle.sampling` (kept as names here so that reading settings imports
#: nothing heavy; :func:`resolve` is tested to agree with ``oracle.sampling.PROFILES``).
PROFILE_NAMES = ("quick", "ci", "deep", "exhaustive")
#: The roles of :mod:`oracle.roles`, by name (same remark).
ROLE_NAMES = ("prime_pi", "twin_pi", "nth_prime", "is_prime", "next_prime", "prev_prime",
              "primes_in", "factor")
ROLE_NAMES += ("mobius", "totient", "divisor_count", "divisor_sum")

#: The conventions of :class:`oracle.roles.Conventions` and their values, first the default
#: (same remark; tested to agree).
CONVENTION_VALUES = {"primes_range": ("closed", "half-open"),
                     "factor_shape": ("any", "mapping", "flat", "pairs"),
                     "invalid_input": ("unchecked", "raise")}
#: The keys of a per-target setting, in the order they are written back.
SETTING_KEYS = ("profile", "max", "timeout", *CONVENTION_VALUES)

PYTHON_SPEC = re.compile(r"^[A-Za-z_][\w.]*:[A-Za-z_][\w.]*$")


#: Where the session's settings and its pool of targets are kept (``config.stash``).
SETTINGS = pytest.StashKey["Settings"]()
POOL = pytest.StashKey[object]()
TALLY = pytest.StashKey[object]()


@dataclass(frozen=True)
class TargetSetting:
    """One configured target: its role, ``python`` or ``exec``, the spec, and where it was set."""

    role: str
    kind: str
    spec: str
    source: str
    profile: str | None = None
    maximum: int | None = None
    timeout: float | None = None
    conventions: tuple[tuple[str, str], ...] = ()      # (name, value) pairs, sorted

    def setting_words(self) -> list[str]:
        """The settings written back in the syntax they were read in (``max=1000``, ...)."""
        words = []
        if self.profile is not None:
            words.append(f"profile={self.profile}")
        if self.maximum is not None:
            words.append(f"max={self.maximum}")
        if self.timeout is not None:
            words.append(f"timeout={self.timeout:g}")
        words += [f"{name}={value}" for name, value in self.conventions]
        return words

    def written(self) -> str:
        """``ROLE=SPEC KEY=VALUE ...``: the value of ``--ntoracle-target`` (or ``-exec``) that
        configures this target with these settings."""
        return " ".join([f"{self.role}={self.spec}", *self.setting_words()])


@dataclass(frozen=True)
class Settings:
    """Everything the plugin was told, validated."""

    targets: tuple[TargetSetting, ...] = ()
    profile: str = DEFAULT_PROFILE
    seed: int = 0
    seed_source: str = "drawn at random"
    report_dir: str | None = None
    hypothesis_profile: str | None = None
    in_process: bool = False        # call Python targets in the pytest process (trusting them)
    errors: tuple[str, ...] = field(default=())

    @property
    def active(self) -> bool:
        """True when at least one target is configured (bundled suites then run)."""
        return bool(self.targets)

    def targets_for(self, role: str) -> list[TargetSetting]:
        return [target for target in self.targets if target.role == role]


def _where(source: str, text: str) -> str:
    """How an error names the value: ``--ntoracle-target='...'`` or ``ini ntoracle_targets line '...'``."""
    return f"{source} line {text.strip()!r}" if source.startswith("ini ") else f"{source}={text!r}"


def parse_target(text: str, *, kind: str, source: str) -> TargetSetting:
    """``ROLE=package.module:function [KEY=VALUE ...]`` (or ``ROLE = ...``; for ``exec``,
    ``ROLE=CMD ARGS [KEY=VALUE ...]``); the settings are described in the module docstring."""
    role, equals, rest = str(text).partition("=")
    role, words = role.strip(), rest.split()
    where = _where(source, str(text))
    form = ("ROLE=package.module:function [KEY=VALUE ...]" if kind == "python"
            else "ROLE=CMD ARGS [KEY=VALUE ...]")
    if not equals or not role or not words:
        raise InvalidInputError(f"{where}: expected {form}")
    if role not in ROLE_NAMES:
        raise InvalidInputError(f"{where}: unknown role {role!r}; "
                                f"expected one of {', '.join(ROLE_NAMES)}")
    if kind == "python":
        spec, setting_words = words[0], words[1:]
        if not PYTHON_SPEC.match(spec):
            raise InvalidInputError(f"{where}: expected {form}")
    else:
        count = len(words)
        while count > 1 and words[count - 1].partition("=")[0] in SETTING_KEYS \
                and "=" in words[count - 1]:
            count -= 1
        setting_words = words[count:]
        spec = rest.strip() if not setting_words else _command_part(rest, count)
    return TargetSetting(role, kind, spec, source, **parse_setting_words(setting_words, where=where))


def _command_part(text: str, count: int) -> str:
    """The first ``count`` whitespace-separated words of ``text``, spacing kept."""
    found = list(re.finditer(r"\S+", text))
    return text[found[0].start():found[count - 1].end()]


def parse_setting_words(words: list[str], *, where: str) -> dict:
    """``["max=10**12", "timeout=2", ...]`` as keyword arguments of :class:`TargetSetting`;
    a bad word is an InvalidInputError naming ``where`` and the key."""
    values: dict = {}
    conventions: dict[str, str] = {}
    seen: set[str] = set()
    for word in words:
        key, equals, value = word.partition("=")
        if not equals or key not in SETTING_KEYS:
            what = f"unknown setting {key!r}" if equals else f"{word!r} is not KEY=VALUE"
            raise InvalidInputError(f"{where}: {what}; the settings are {', '.join(SETTING_KEYS)}")
        if key in seen:
            raise InvalidInputError(f"{where}: setting {key!r} given twice")
        seen.add(key)
        if not value:
            raise InvalidInputError(f"{where}: {key}= has no value")
        if key == "profile":
            values["profile"] = parse_profile(value, source=f"{where}: profile")
        elif key == "max":
            try:
                values["maximum"] = require_int("max", parse_integer(value), minimum=0)
            except InvalidInputError as error:
                raise InvalidInputError(f"{where}: max={value!r}: {error}") from None
        elif key == "timeout":
            from .._options import positive_seconds      # here: this module is read in every session

            try:
                values["timeout"] = positive_seconds(value, "timeout")
            except InvalidInputError as error:
                problem = str(error).partition(": ")[2]
                raise InvalidInputError(f"{where}: timeout={value!r}: {problem}") from None
        else:
            if value not in CONVENTION_VALUES[key]:
                raise InvalidInputError(f"{where}: {key}={value!r}: expected one of "
                                        f"{', '.join(CONVENTION_VALUES[key])}")
            conventions[key] = value
    values["conventions"] = tuple(sorted(conventions.items()))
    return values


def _with_defaults_from(target: TargetSetting, fallback: TargetSetting | None) -> TargetSetting:
    """``target`` with the settings it leaves unset taken from ``fallback`` (the ini line of
    the same role and target), so the command line beats the ini file key by key."""
    if fallback is None:
        return target
    conventions = dict(fallback.conventions)
    conventions.update(target.conventions)
    return dataclasses.replace(
        target, profile=target.profile if target.profile is not None else fallback.profile,
        maximum=target.maximum if target.maximum is not None else fallback.maximum,
        timeout=target.timeout if target.timeout is not None else fallback.timeout,
        conventions=tuple(sorted(conventions.items())))


@dataclass(frozen=True)
class Effective:
    """The settings one suite runs with against one target, after the precedence order."""

    profile: str
    maximum: int | None
    timeout: float | None                   # None: the profile's timeout
    conventions: dict


def effective(suite, target: TargetSetting, settings: "Settings") -> Effective:
    """Per key: the target's setting (command line, then its ini line), the suite file's,
    the session's (profile only), the default.  ``suite`` is a parsed suite."""
    conventions = dict(suite.conventions)
    conventions.update(target.conventions)
    return Effective(
        profile=target.profile or suite.profile or settings.profile,
        maximum=target.maximum if target.maximum is not None else suite.maximum,
        timeout=target.timeout if target.timeout is not None else suite.timeout,
        conventions=conventions)


def parse_profile(text: str, *, source: str) -> str:
    name = str(text).strip()
    if name not in PROFILE_NAMES:
        raise InvalidInputError(f"{source}={text!r}: expected one of {', '.join(PROFILE_NAMES)}")
    return name


def parse_seed(text: object, *, source: str) -> int:
    try:
        value = parse_integer(str(text).strip()) if not isinstance(text, int) else text
        return require_int("seed", value, minimum=0, maximum=2**64 - 1)
    except InvalidInputError as error:
        raise InvalidInputError(f"{source}={text!r}: {error}") from None


def new_seed() -> int:
    """A fresh seed, printed in the report header so the run can be repeated."""
    return int.from_bytes(os.urandom(4), "big")


def _ini(config, name: str):
    value = config.getini(name)
    return value if value not in ("", [], None) else None


def resolve(config, *, inherited_seed: int | None = None) -> Settings:
    """The settings of this session from ``config``; problems are collected in ``errors``.

    ``inherited_seed`` is the seed a pytest-xdist worker receives from the
    controller, so every worker collects the same random points.
    """
    errors: list[str] = []
    targets: list[TargetSetting] = []
    cli_python = config.getoption("ntoracle_target") or []
    cli_exec = config.getoption("ntoracle_exec") or []
    ini_entries = [(line, "python", "ini ntoracle_targets") for line in config.getini("ntoracle_targets")
                   if line.strip() and not line.strip().startswith("#")]
    from_ini: dict[tuple[str, str, str], TargetSetting] = {}
    for text, kind, source in ini_entries:
        try:
            target = parse_target(text, kind=kind, source=source)
        except InvalidInputError as error:
            errors.append(str(error))
            continue
        from_ini.setdefault((target.role, target.kind, target.spec), target)
    if cli_python or cli_exec:
        entries = ([(text, "python", "--ntoracle-target") for text in cli_python]
                   + [(text, "exec", "--ntoracle-exec") for text in cli_exec])
        for text, kind, source in entries:
            try:
                target = parse_target(text, kind=kind, source=source)
            except InvalidInputError as error:
                errors.append(str(error))
                continue
            targets.append(_with_defaults_from(target, from_ini.get((target.role, target.kind,
                                                                     target.spec))))
    else:
        targets = list(from_ini.values())

    profile = DEFAULT_PROFILE
    for value, source in ((config.getoption("ntoracle_profile"), "--ntoracle-profile"),
                          (_ini(config, "ntoracle_profile"), "ini ntoracle_profile")):
        if value is not None:
            try:
                profile = parse_profile(value, source=source)
            except InvalidInputError as error:
                errors.append(str(error))
            break

    seed, seed_source = None, "drawn at random"
    for value, source in ((config.getoption("ntoracle_seed"), "--ntoracle-seed"),
                          (_ini(config, "ntoracle_seed"), "ini ntoracle_seed")):
        if value is not None:
            try:
                seed, seed_source = parse_seed(value, source=source), source
            except InvalidInputError as error:
                errors.append(str(error))
            break
    if inherited_seed is not None:
        seed, seed_source = inherited_seed, "from the pytest-xdist controller"
    if seed is None:
        seed = new_seed()

    hypothesis_profile = (config.getoption("ntoracle_hypothesis_profile")
                          or _ini(config, "ntoracle_hypothesis_profile"))
    in_process = bool(config.getoption("ntoracle_in_process")) or bool(config.getini("ntoracle_in_process"))
    return Settings(targets=tuple(targets), profile=profile, seed=seed, seed_source=seed_source,
                    report_dir=config.getoption("ntoracle_report"),
                    hypothesis_profile=hypothesis_profile, in_process=in_process,
                    errors=tuple(errors))
