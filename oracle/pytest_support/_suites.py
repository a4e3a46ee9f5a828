"""The YAML suite format: which role, which target, which points.

A suite is one YAML mapping (read with PyYAML's safe loader)::

    role: prime_pi                    # required: one of the roles of oracle.roles
    target: mylib.count:prime_pi      # optional: a Python target, or
    exec: "./count --stdin"           #   an executable speaking the line protocol;
                                      #   neither: the targets configured for the role
    profile: ci                       # optional: pin a profile; default: the session's
    max: 10**12                       # optional: the largest input the target claims
    timeout: 5                        # optional: seconds per call; default: the profile's
    conventions: {primes_range: half-open}   # optional, as oracle.roles.Conventions
    cases:                            # required, a non-empty list
      - name: small                   # unique within the suite; used in test ids
        values: [0, 1, 2, 10**6]      # explicit points ([a, b] pairs for primes_in)
      - name: low
        range: {start: 0, stop: profile}
        segment: 1000                 # optional, any case: points per test item
                                      # every x in [start, stop]; stop "profile" is the
                                      # profile's exhaustive limit; for primes_in windows
                                      # [a, a + width - 1] tiling the range (width 1000)
      - name: boundaries
        family: boundaries            # a family of oracle.sampling at the profile
      - name: draws
        random: {count: 20, low: 0, high: 2**40, distribution: log-uniform}
      - name: outside
        invalid: role                 # the role's invalid inputs, or a list of points

Integers may be written as YAML integers or as text (``2**64-1``, ``10**12``,
``1e9``), parsed without ``eval`` (:func:`oracle._integers.parse_integer`).
Every case becomes one or more *groups* of at most ``segment`` points (default
500; 1000 for ranges); each group is one test item, independent of the others,
so pytest-xdist can spread them.  Random points are drawn from the session
seed, the suite name and the case name, so every worker draws the same points.

A malformed suite raises :class:`SuiteError`, which names the file, the line
and the problem.  Suites are read with limits (:mod:`oracle._safe_yaml`): at
most :data:`MAX_SUITE_BYTES` bytes, and the alias, expansion and depth limits
of :func:`oracle._safe_yaml.check_limits`, checked on the event stream before
anything is built, so an alias bomb or a huge file is refused at once.
"""

from __future__ import annotations

import dataclasses
import random
import re
from dataclasses import dataclass

import yaml

from .. import _safe_yaml
from .._errors import InvalidInputError
from .._integers import parse_integer, require_int
from .._options import positive_seconds
from ._settings import PROFILE_NAMES, PYTHON_SPEC, ROLE_NAMES

__all__ = ["SuiteError", "Case", "Suite", "Group", "load_suite", "parse_suite", "groups_of"]

#: Largest suite file, in bytes (a suite is a page of YAML; the bundled ones are a few KiB).
MAX_SUITE_BYTES = 1 * 2**20
#: Points per item unless a case says otherwise.
DEFAULT_SEGMENT = 500
RANGE_SEGMENT = 1000
RANGE_WINDOW = 1000
#: The sampler's small exhaustive family is capped here; long exhaustive runs are ``range`` cases.
SMALL_EXHAUSTIVE = 40
_SUITE_KEYS = {"role", "target", "exec", "profile", "max", "timeout", "conventions", "cases", "suite"}
_CASE_KINDS = ("values", "range", "family", "random", "invalid")
_DISTRIBUTIONS = ("uniform", "log-uniform")


class SuiteError(Exception):
    """A malformed suite: ``str()`` is ``file:line: problem``."""

    def __init__(self, path, line: int | None, problem: str):
        self.path, self.line, self.problem = str(path), line, problem
        where = f"{self.path}:{line}" if line is not None else self.path
        super().__init__(f"{where}: {problem}")


@dataclass(frozen=True)
class Case:
    """One case of a suite: its name, its kind (one of :data:`_CASE_KINDS`) and the spec."""

    name: str
    kind: str
    spec: object
    segment: int
    line: int


@dataclass(frozen=True)
class Suite:
    """A parsed suite."""

    name: str
    path: str
    role: str
    target: tuple[str, str] | None
    profile: str | None
    maximum: int | None
    timeout: float | None
    conventions: dict
    cases: tuple[Case, ...]
    line: int = 1


@dataclass(frozen=True)
class Group:
    """The points of one test item: a case name, a readable label, and the argument tuples
    (a range segment keeps only its ends until it is run)."""

    case: str
    label: str
    kind: str
    points: tuple[tuple[int, ...], ...] = ()
    segment: tuple[int, int] | None = None
    line: int = 1

    def arguments(self, arity: int) -> list[tuple[int, ...]]:
        if self.segment is None:
            return list(self.points)
        start, stop = self.segment
        if arity == 1:
            return [(x,) for x in range(start, stop + 1)]
        return [(a, min(a + RANGE_WINDOW - 1, stop)) for a in range(start, stop + 1, RANGE_WINDOW)]


# -- reading with line numbers ---------------------------------------------- #

class _Located:
    """A composed YAML node with the constructed Python value beside it."""

    def __init__(self, node, value):
        self.node, self.value = node, value

    @property
    def line(self) -> int:
        return self.node.start_mark.line + 1

    def get(self, key):
        if isinstance(self.node, yaml.MappingNode):
            for key_node, value_node in self.node.value:
                if key_node.value == key:
                    return _Located(value_node, self.value[key])
        return None

    def item(self, index: int) -> "_Located":
        return _Located(self.node.value[index], self.value[index])

    def key_line(self, key) -> int:
        for key_node, _ in self.node.value:
            if key_node.value == key:
                return key_node.start_mark.line + 1
        return self.line


def _limits_error(error: InvalidInputError, path) -> SuiteError:
    """A :mod:`oracle._safe_yaml` refusal (``name: [line N: ]problem``) as a SuiteError."""
    found = re.match(r"(?:line (\d+): )?(.*)\Z", str(error).removeprefix(f"{path}: "), re.S)
    line = int(found.group(1)) if found.group(1) else None
    return SuiteError(path, line, found.group(2))


def _compose(text: str, path) -> _Located:
    if len(text) > MAX_SUITE_BYTES:         # characters: at least as many bytes
        raise SuiteError(path, None, f"more than the limit of {MAX_SUITE_BYTES} bytes for a suite")
    try:
        _safe_yaml.check_limits(text, name=str(path))
    except InvalidInputError as error:
        raise _limits_error(error, path) from None
    try:
        node = yaml.compose(text, Loader=yaml.SafeLoader)
    except yaml.MarkedYAMLError as error:
        mark = error.problem_mark or error.context_mark
        line = mark.line + 1 if mark is not None else None
        raise SuiteError(path, line, f"not valid YAML: {error.problem or error}") from None
    except yaml.YAMLError as error:
        raise SuiteError(path, None, f"not valid YAML: {error}") from None
    if node is None:
        raise SuiteError(path, 1, "the file is empty; a suite is a mapping with 'role' and 'cases'")
    loader = yaml.SafeLoader("")
    try:
        value = loader.construct_document(node)
    except yaml.MarkedYAMLError as error:
        mark = error.problem_mark or error.context_mark
        raise SuiteError(path, mark.line + 1 if mark else None, f"not valid YAML: {error.problem}") from None
    finally:
        loader.dispose()
    return _Located(node, value)


def _integer(located: _Located, what: str, path, *, minimum: int | None = None) -> int:
    raw = located.value
    if isinstance(raw, str):
        try:
            raw = parse_integer(raw)
        except InvalidInputError as error:
            raise SuiteError(path, located.line, f"{what}: {error}") from None
    try:
        return require_int(what, raw, minimum=minimum)
    except InvalidInputError as error:
        raise SuiteError(path, located.line, str(error)) from None


def load_suite(path) -> Suite:
    """Parse the suite file at ``path``."""
    try:
        text, _ = _safe_yaml.read_limited(path, max_bytes=MAX_SUITE_BYTES)
    except InvalidInputError as error:
        raise _limits_error(error, path) from None
    return parse_suite(text, path)


def parse_suite(text: str, path) -> Suite:
    """Parse the text of a suite; ``path`` is only used in messages and the default name."""
    document = _compose(text, path)
    if not isinstance(document.value, dict):
        raise SuiteError(path, document.line, "a suite is a mapping with 'role' and 'cases', "
                                             f"not a {type(document.value).__name__}")
    for key in document.value:
        if key not in _SUITE_KEYS:
            raise SuiteError(path, document.key_line(key),
                             f"unknown key {key!r}; expected one of {', '.join(sorted(_SUITE_KEYS))}")
    role_node = document.get("role")
    if role_node is None:
        raise SuiteError(path, document.line, "missing 'role' (one of " + ", ".join(ROLE_NAMES) + ")")
    if role_node.value not in ROLE_NAMES:
        raise SuiteError(path, role_node.line,
                         f"role={role_node.value!r}: expected one of {', '.join(ROLE_NAMES)}")
    role = role_node.value
    target = None
    for key, kind in (("target", "python"), ("exec", "exec")):
        located = document.get(key)
        if located is not None:
            if target is not None:
                raise SuiteError(path, located.line, "give 'target' or 'exec', not both")
            if not isinstance(located.value, str) or not located.value.strip():
                raise SuiteError(path, located.line, f"{key}={located.value!r}: expected text")
            if kind == "python" and not PYTHON_SPEC.match(located.value.strip()):
                raise SuiteError(path, located.line,
                                 f"target={located.value!r}: expected package.module:function")
            target = (kind, located.value.strip())
    profile = None
    if (located := document.get("profile")) is not None:
        if located.value not in PROFILE_NAMES:
            raise SuiteError(path, located.line,
                             f"profile={located.value!r}: expected one of {', '.join(PROFILE_NAMES)}")
        profile = located.value
    maximum = None
    if (located := document.get("max")) is not None:
        maximum = _integer(located, "max", path, minimum=0)
    timeout = None
    if (located := document.get("timeout")) is not None:
        if isinstance(located.value, bool) or not isinstance(located.value, (int, float)):
            raise SuiteError(path, located.line, f"timeout={located.value!r}: expected a positive number")
        try:
            timeout = positive_seconds(located.value, "timeout")
        except InvalidInputError as error:
            raise SuiteError(path, located.line, str(error)) from None
    conventions = {}
    if (located := document.get("conventions")) is not None:
        conventions = _conventions(located, path)
    name_node = document.get("suite")
    name = str(name_node.value) if name_node is not None else _stem(path)
    cases_node = document.get("cases")
    if cases_node is None or not isinstance(cases_node.value, list) or not cases_node.value:
        line = cases_node.line if cases_node is not None else document.line
        raise SuiteError(path, line, "'cases' must be a non-empty list of cases")
    cases, seen = [], set()
    for index in range(len(cases_node.value)):
        case = _case(cases_node.item(index), path, role)
        if case.name in seen:
            raise SuiteError(path, case.line, f"case name {case.name!r} is used twice")
        seen.add(case.name)
        cases.append(case)
    return Suite(name=name, path=str(path), role=role, target=target, profile=profile,
                 maximum=maximum, timeout=timeout, conventions=conventions, cases=tuple(cases),
                 line=document.line)


def _stem(path) -> str:
    name = str(path).replace("\\", "/").rsplit("/", 1)[-1]
    for suffix in (".ntoracle.yaml", ".yaml"):
        if name.endswith(suffix):
            return name[: -len(suffix)]
    return name


def _conventions(located: _Located, path) -> dict:
    if not isinstance(located.value, dict):
        raise SuiteError(path, located.line, "'conventions' must be a mapping")
    from ..roles import Conventions                       # validates the values

    try:
        Conventions(**located.value)
    except TypeError:
        known = ", ".join(field.name for field in dataclasses.fields(Conventions))
        raise SuiteError(path, located.line, f"conventions: expected keys among {known}") from None
    except InvalidInputError as error:
        raise SuiteError(path, located.line, f"conventions: {error}") from None
    return dict(located.value)


def _case(located: _Located, path, role: str) -> Case:
    arity = 2 if role == "primes_in" else 1
    if not isinstance(located.value, dict):
        raise SuiteError(path, located.line, "a case is a mapping with 'name' and one of "
                                             + ", ".join(_CASE_KINDS))
    name_node = located.get("name")
    if name_node is None or not isinstance(name_node.value, str) or not name_node.value.strip():
        raise SuiteError(path, located.line, "a case needs a 'name' (text)")
    name = name_node.value.strip()
    if any(character in name for character in "[]:/ \t"):
        raise SuiteError(path, name_node.line, f"case name {name!r}: no spaces, brackets, ':' or '/'")
    kinds = [kind for kind in _CASE_KINDS if kind in located.value]
    unknown = set(located.value) - set(_CASE_KINDS) - {"name", "segment"}
    if unknown:
        key = sorted(unknown)[0]
        raise SuiteError(path, located.key_line(key), f"case {name!r}: unknown key {key!r}; "
                                                      f"expected name, segment, and one of "
                                                      + ", ".join(_CASE_KINDS))
    if len(kinds) != 1:
        raise SuiteError(path, located.line, f"case {name!r}: give exactly one of "
                                             + ", ".join(_CASE_KINDS))
    kind = kinds[0]
    body = located.get(kind)
    segment = RANGE_SEGMENT if kind == "range" else DEFAULT_SEGMENT
    if (segment_node := located.get("segment")) is not None:
        segment = _integer(segment_node, f"case {name!r}: segment", path, minimum=1)
    if kind == "family":
        spec = _family_spec(body, path, arity, name, role)
    else:
        parse = {"values": _points, "range": _range_spec, "random": _random_spec,
                 "invalid": _invalid_spec}[kind]
        spec = parse(body, path, arity, name)
    return Case(name, kind, spec, segment, located.line)


def _point(located: _Located, path, arity: int, what: str) -> tuple[int, ...]:
    if arity == 1:
        if isinstance(located.value, list):
            raise SuiteError(path, located.line, f"{what}: expected one integer, got a list")
        return (_integer(located, what, path),)
    if not isinstance(located.value, list) or len(located.value) != 2:
        raise SuiteError(path, located.line, f"{what}: expected a pair [a, b]")
    return tuple(_integer(located.item(i), what, path) for i in range(2))


def _points(located: _Located, path, arity: int, name: str) -> tuple:
    if not isinstance(located.value, list) or not located.value:
        raise SuiteError(path, located.line, f"case {name!r}: expected a non-empty list of points")
    return tuple(_point(located.item(i), path, arity, f"case {name!r}, point {i + 1}")
                 for i in range(len(located.value)))


def _invalid_spec(located, path, arity, name):
    if located.value == "role":
        return "role"
    if not isinstance(located.value, list):
        raise SuiteError(path, located.line, f"case {name!r}: invalid is 'role' or a list of points")
    return _points(located, path, arity, name)


def _range_spec(located, path, arity, name):
    if not isinstance(located.value, dict):
        raise SuiteError(path, located.line, f"case {name!r}: range is a mapping {{start, stop}}")
    extra = set(located.value) - {"start", "stop"}
    if extra or "start" not in located.value or "stop" not in located.value:
        raise SuiteError(path, located.line, f"case {name!r}: range needs exactly 'start' and 'stop'")
    start = _integer(located.get("start"), f"case {name!r}: start", path, minimum=0)
    stop_node = located.get("stop")
    if stop_node.value == "profile":
        return (start, "profile")
    stop = _integer(stop_node, f"case {name!r}: stop", path, minimum=0)
    if stop < start:
        raise SuiteError(path, stop_node.line, f"case {name!r}: stop={stop} is below start={start}")
    return (start, stop)


def _family_spec(located, path, arity, name, role):
    from ..roles import get

    known = get(role).families
    if located.value not in known:
        raise SuiteError(path, located.line, f"case {name!r}: family={located.value!r}: the "
                                             f"{role} families are {', '.join(known)}")
    return located.value


def _random_spec(located, path, arity, name):
    if not isinstance(located.value, dict):
        raise SuiteError(path, located.line, f"case {name!r}: random is a mapping {{count, low, high}}")
    extra = set(located.value) - {"count", "low", "high", "distribution"}
    if extra or not {"count", "low", "high"} <= set(located.value):
        raise SuiteError(path, located.line, f"case {name!r}: random needs 'count', 'low', 'high' "
                                             "and optionally 'distribution'")
    count = _integer(located.get("count"), f"case {name!r}: count", path, minimum=1)
    low = _integer(located.get("low"), f"case {name!r}: low", path, minimum=0)
    high = _integer(located.get("high"), f"case {name!r}: high", path, minimum=0)
    if high < low:
        raise SuiteError(path, located.get("high").line, f"case {name!r}: high={high} is below low={low}")
    distribution = located.value.get("distribution", "uniform")
    if distribution not in _DISTRIBUTIONS:
        raise SuiteError(path, located.get("distribution").line,
                         f"case {name!r}: distribution={distribution!r}: expected one of "
                         + ", ".join(_DISTRIBUTIONS))
    return (count, low, high, distribution)


# -- from cases to groups of points ------------------------------------------ #

def _label(point: tuple[int, ...]) -> str:
    return ",".join(str(value) for value in point)


def _chunks(case: Case, points: list[tuple[int, ...]], kind: str) -> list[Group]:
    ordered = sorted(set(points), key=lambda p: (max(p), p))
    groups = []
    for start in range(0, len(ordered), case.segment):
        chunk = tuple(ordered[start:start + case.segment])
        label = _label(chunk[0]) if len(chunk) == 1 else f"{_label(chunk[0])}..{_label(chunk[-1])}"
        groups.append(Group(case.name, label, kind, points=chunk, line=case.line))
    return groups


def groups_of(suite: Suite, case: Case, *, profile, seed: int, sampled) -> list[Group]:
    """The groups of one case; ``profile`` is an :class:`oracle.sampling.Profile`, ``sampled``
    a function ``family name -> points`` (the sampler's points of the suite's role)."""
    arity = 2 if suite.role == "primes_in" else 1
    if case.kind == "values":
        return [Group(case.name, _label(point), "values", points=(point,), line=case.line)
                for point in dict.fromkeys(case.spec)]           # a point given twice runs once
    if case.kind == "invalid":
        if case.spec == "role":
            from ..roles import get

            points = list(get(suite.role).invalid_inputs)
        else:
            points = list(case.spec)
        return [Group(case.name, _label(points[0]) if len(points) == 1 else
                      f"{_label(points[0])}..{_label(points[-1])}", "invalid",
                      points=tuple(points), line=case.line)] if points else []
    if case.kind == "family":
        return _chunks(case, sampled(case.spec), "family")
    if case.kind == "random":
        count, low, high, distribution = case.spec
        rng = random.Random(f"{seed}:{suite.name}:{case.name}")
        values = []
        for _ in range(count):
            if distribution == "uniform":
                values.append(rng.randint(low, high))
            else:                                     # every bit length equally likely
                bits = rng.randint(max(low, 1).bit_length(), max(high, 1).bit_length())
                drawn = rng.randint(1 << (bits - 1), (1 << bits) - 1)
                values.append(min(max(drawn, low), high))
        if arity == 1:
            points = [(value,) for value in values]
        else:
            points = [(value, min(value + int(2 ** rng.uniform(0, 12)), max(high, value)))
                      for value in values]
        return _chunks(case, points, "random")
    start, stop = case.spec
    if stop == "profile":
        stop = profile.exhaustive
    if stop < start:
        return []
    step = case.segment if arity == 1 else case.segment * RANGE_WINDOW
    groups = []
    for low in range(start, stop + 1, step):
        high = min(low + step - 1, stop)
        groups.append(Group(case.name, f"{low}..{high}", "range", segment=(low, high), line=case.line))
    return groups


def small_exhaustive(profile):
    """``profile`` with its exhaustive family capped at :data:`SMALL_EXHAUSTIVE` (the rest of
    the exhaustive range is a ``range`` case, split into segment items)."""
    return dataclasses.replace(profile, exhaustive=min(profile.exhaustive, SMALL_EXHAUSTIVE))
