"""The bound catalogue: published inequalities as data, loaded and checked for form.

The data live in ``fixtures/bounds.yaml`` (installed as ``oracle.fixtures``).
Each entry is one theorem: the function it bounds, the kind of statement, its
formula(s), the range of the argument where it is proven, whether it assumes
the Riemann hypothesis, and its source with a status saying what was read.

This module only checks *form* (every field present, formulas in the accepted
language, ranges well ordered, ids unique).  Whether the inequalities are
*true* is checked against exact values by :mod:`oracle.bounds._selfcheck`.
"""

from __future__ import annotations

import functools
import importlib.resources
from dataclasses import dataclass
from fractions import Fraction
from pathlib import Path

import yaml

from .._errors import OracleError
from ._expressions import Formula, FormulaError, parse_constant, parse_formula

__all__ = ["Bound", "ValidityRange", "Side", "Catalogue", "CatalogueError", "load_catalogue",
           "default_catalogue", "FUNCTION_VARIABLES"]

#: Which variable the formulas of each function use.
FUNCTION_VARIABLES = {
    "pi": "x", "theta": "x", "psi": "x", "twin_pi": "x", "nth_prime": "n",
    "prime_in_interval": "x", "primes_between": "h", "primes_in_dyadic": "x",
}
KINDS = ("lower", "upper", "interval")
ASSUMPTIONS = ("unconditional", "RH")
STATUSES = ("confirmed", "partial", "from-memory", "elementary")
ARGUMENTS = ("real", "integer")


class CatalogueError(OracleError):
    """The bound catalogue is malformed (a data error, not a user error)."""


@dataclass(frozen=True)
class ValidityRange:
    """The set of arguments where a theorem is proven: an interval of the reals."""

    start: Fraction | None
    start_inclusive: bool
    end: Fraction | None
    end_inclusive: bool

    def contains(self, value: int | Fraction) -> bool:
        """True when ``value`` lies in the range (exact comparison)."""
        if self.start is not None:
            if value < self.start or (value == self.start and not self.start_inclusive):
                return False
        if self.end is not None:
            if value > self.end or (value == self.end and not self.end_inclusive):
                return False
        return True

    def __str__(self) -> str:
        left = "" if self.start is None else f"{_show(self.start)} {'<=' if self.start_inclusive else '<'} "
        right = "" if self.end is None else f" {'<=' if self.end_inclusive else '<'} {_show(self.end)}"
        return f"{left}arg{right}" if (left or right) else "every arg"


def _show(value: Fraction) -> str:
    if value.denominator == 1:
        number = value.numerator
        return f"{number:.4g}" if abs(number) >= 10 ** 12 else str(number)
    return str(float(value))


@dataclass(frozen=True)
class Side:
    """One side of a bound: ``f >= formula`` (lower) or ``f <= formula`` (upper); strict or not."""

    direction: str
    formula: Formula
    strict: bool


@dataclass(frozen=True)
class Bound:
    """One catalogue entry (one published or elementary inequality)."""

    id: str
    function: str
    kind: str
    statement: str
    range: ValidityRange
    assumption: str
    source: str
    status: str
    argument: str
    strict: bool
    sides: tuple[Side, ...]
    left: Formula | None = None
    left_closed: bool = False
    right: Formula | None = None
    right_closed: bool = False
    seen_in: str | None = None
    notes: str | None = None
    proof: str | None = None

    @property
    def conditional(self) -> bool:
        """True for statements that assume an unproven hypothesis (RH)."""
        return self.assumption != "unconditional"

    def applies_to(self, value: int | Fraction) -> bool:
        """Usable as proof at ``value``: unconditional and ``value`` in the stated range."""
        return not self.conditional and self.range.contains(value)


@dataclass(frozen=True)
class Catalogue:
    """All entries of one catalogue file, plus its list of known-false readings."""

    entries: tuple[Bound, ...]
    errata: tuple[Bound, ...]
    path: str

    def entry(self, bound_id: str) -> Bound:
        for bound in self.entries:
            if bound.id == bound_id:
                return bound
        raise CatalogueError(f"no bound with id {bound_id!r}")

    def for_function(self, function: str) -> tuple[Bound, ...]:
        return tuple(bound for bound in self.entries if bound.function == function)


def load_catalogue(path: str | Path | None = None) -> Catalogue:
    """Read and check a catalogue file (the installed ``bounds.yaml`` by default)."""
    if path is None:
        resource = importlib.resources.files("oracle.fixtures") / "bounds.yaml"
        text, where = resource.read_text(encoding="utf-8"), str(resource)
    else:
        text, where = Path(path).read_text(encoding="utf-8"), str(path)
    try:
        # libyaml's loader when present: the same safe constructor, ten times faster.
        document = yaml.load(text, Loader=getattr(yaml, "CSafeLoader", yaml.SafeLoader))
    except yaml.YAMLError as exc:
        raise CatalogueError(f"{where}: not valid YAML ({exc})") from None
    if not isinstance(document, dict) or not isinstance(document.get("entries"), list):
        raise CatalogueError(f"{where}: expected a mapping with a list 'entries'")
    entries = tuple(_bound(item, where) for item in document["entries"])
    errata = tuple(_bound(item, where) for item in document.get("errata") or [])
    seen: set[str] = set()
    for bound in entries + errata:
        if bound.id in seen:
            raise CatalogueError(f"{where}: duplicate id {bound.id!r}")
        seen.add(bound.id)
    return Catalogue(entries, errata, where)


@functools.lru_cache(maxsize=1)
def default_catalogue() -> Catalogue:
    """The installed catalogue, loaded once."""
    return load_catalogue()


def _bound(item: object, where: str) -> Bound:
    if not isinstance(item, dict) or not isinstance(item.get("id"), str):
        raise CatalogueError(f"{where}: every entry needs a text 'id', got {item!r:.80}")
    name = item["id"]

    def need(key: str, allowed: tuple[str, ...] | None = None) -> str:
        value = item.get(key)
        if not isinstance(value, str) or not value.strip():
            raise CatalogueError(f"{where}: {name}: field {key!r} is missing or not text")
        if allowed is not None and value not in allowed:
            raise CatalogueError(f"{where}: {name}: {key}={value!r}, expected one of {allowed}")
        return value

    function = need("function", tuple(FUNCTION_VARIABLES))
    kind = need("kind", KINDS)
    variable = FUNCTION_VARIABLES[function]

    def formula(key: str) -> Formula | None:
        text = item.get(key)
        if text is None:
            return None
        try:
            parsed = parse_formula(str(text))
        except FormulaError as exc:
            raise CatalogueError(f"{where}: {name}: {key}: {exc}") from None
        if parsed.variable not in (None, variable):
            raise CatalogueError(f"{where}: {name}: {key} uses {parsed.variable!r}, "
                                 f"but {function} formulas use {variable!r}")
        return parsed

    argument = item.get("argument", "real")
    if argument not in ARGUMENTS:
        raise CatalogueError(f"{where}: {name}: argument={argument!r}, expected one of {ARGUMENTS}")
    strict = item.get("strict", False)
    if not isinstance(strict, bool):
        raise CatalogueError(f"{where}: {name}: 'strict' must be true or false")
    sides: list[Side] = []
    left = right = None
    if function == "prime_in_interval":
        left, right = formula("left"), formula("right")
        if kind != "interval" or left is None or right is None:
            raise CatalogueError(f"{where}: {name}: prime_in_interval needs kind 'interval', 'left' and 'right'")
    elif kind == "interval":
        center, radius = formula("center"), formula("radius")
        if center is None or radius is None:
            raise CatalogueError(f"{where}: {name}: an interval needs 'center' and 'radius'")
        sides.append(Side("lower", parse_formula(f"({center.text})-({radius.text})"), strict))
        sides.append(Side("upper", parse_formula(f"({center.text})+({radius.text})"), strict))
    else:
        side = formula(kind)
        if side is None:
            raise CatalogueError(f"{where}: {name}: a {kind} bound needs the field {kind!r}")
        sides.append(Side(kind, side, strict))

    return Bound(
        id=name, function=function, kind=kind, statement=need("statement"),
        range=_range(item.get("range"), name, where),
        assumption=need("assumption", ASSUMPTIONS), source=need("source"),
        status=need("status", STATUSES), argument=argument,
        strict=strict, sides=tuple(sides), left=left,
        left_closed=bool(item.get("left_closed", False)), right=right,
        right_closed=bool(item.get("right_closed", False)),
        seen_in=item.get("seen_in"), notes=item.get("notes"), proof=item.get("proof"))


def _range(item: object, name: str, where: str) -> ValidityRange:
    if not isinstance(item, dict):
        raise CatalogueError(f"{where}: {name}: 'range' must be a mapping")

    def endpoint(key: str) -> Fraction | None:
        value = item.get(key)
        if value is None:
            return None
        if isinstance(value, float) or isinstance(value, bool):
            raise CatalogueError(f"{where}: {name}: range {key}={value!r}: write it as quoted text, "
                                 f"a binary float is not an exact threshold")
        try:
            return parse_constant(str(value))
        except FormulaError as exc:
            raise CatalogueError(f"{where}: {name}: range {key}: {exc}") from None

    start, end = endpoint("from"), endpoint("to")
    if start is not None and end is not None and start > end:
        raise CatalogueError(f"{where}: {name}: empty range {start} .. {end}")
    return ValidityRange(start, bool(item.get("from_inclusive", True)), end,
                         bool(item.get("to_inclusive", True)))
