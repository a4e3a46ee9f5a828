"""The plugin's settings: command-line options and ini keys, resolved once per session.

Precedence (docs/DESIGN.md, "pytest plugin"): the command line beats the ini file
(``[tool.pytest.ini_options]`` of ``pyproject.toml``, ``pytest.ini``, ...),
which beats the default.  Targets are taken as a whole from one place: if the
command line names any target (``--ntoracle-target`` or ``--ntoracle-exec``),
the ini key ``ntoracle_targets`` is ignored.  Every error names where the bad
value came from (``--ntoracle-seed=...`` or ``ini ntoracle_seed=...``).

Only the standard library and :mod:`oracle._integers` are imported here: the
settings are read in every session, also in those with nothing configured.
"""

from __future__ import annotations

import os
import re
from dataclasses import dataclass, field

import pytest

from .._errors import InvalidInputError
from .._integers import parse_integer, require_int

__all__ = ["TargetSetting", "Settings", "resolve", "DEFAULT_PROFILE", "PROFILE_NAMES", "ROLE_NAMES",
           "SETTINGS", "POOL"]

DEFAULT_PROFILE = "quick"
#: The profiles of :mod:`oracle.sampling` (kept as names here so that reading settings imports
#: nothing heavy; :func:`resolve` is tested to agree with ``oracle.sampling.PROFILES``).
PROFILE_NAMES = ("quick", "ci", "deep", "exhaustive")
#: The roles of :mod:`oracle.roles`, by name (same remark).
ROLE_NAMES = ("prime_pi", "twin_pi", "nth_prime", "is_prime", "next_prime", "prev_prime",
              "primes_in", "factor")

PYTHON_SPEC = re.compile(r"^[A-Za-z_][\w.]*:[A-Za-z_][\w.]*$")


#: Where the session's settings and its pool of targets are kept (``config.stash``).
SETTINGS = pytest.StashKey["Settings"]()
POOL = pytest.StashKey[object]()


@dataclass(frozen=True)
class TargetSetting:
    """One configured target: its role, ``python`` or ``exec``, the spec, and where it was set."""

    role: str
    kind: str
    spec: str
    source: str


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


def parse_target(text: str, *, kind: str, source: str) -> TargetSetting:
    """``ROLE=package.module:function`` (or ``ROLE = ...``; for ``exec``, ``ROLE=CMD ARGS``)."""
    role, equals, spec = str(text).partition("=")
    role, spec = role.strip(), spec.strip()
    form = "ROLE=package.module:function" if kind == "python" else "ROLE=CMD ARGS"
    if not equals or not role or not spec:
        raise InvalidInputError(f"{source}={text!r}: expected {form}")
    if role not in ROLE_NAMES:
        raise InvalidInputError(f"{source}={text!r}: unknown role {role!r}; "
                                f"expected one of {', '.join(ROLE_NAMES)}")
    if kind == "python" and not PYTHON_SPEC.match(spec):
        raise InvalidInputError(f"{source}={text!r}: expected {form}")
    return TargetSetting(role, kind, spec, source)


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
    if cli_python or cli_exec:
        entries = ([(text, "python", "--ntoracle-target") for text in cli_python]
                   + [(text, "exec", "--ntoracle-exec") for text in cli_exec])
    else:
        entries = [(line, "python", "ini ntoracle_targets") for line in config.getini("ntoracle_targets")
                   if line.strip() and not line.strip().startswith("#")]
    for text, kind, source in entries:
        try:
            targets.append(parse_target(text, kind=kind, source=source))
        except InvalidInputError as error:
            errors.append(str(error))

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
