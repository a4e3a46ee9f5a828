"""Published reference values, loaded from the YAML tables in ``fixtures/``.

Each file ``fixtures/table-<id>.yaml`` holds one published table -- for
example π(10^n) from OEIS A006880 -- together with its source, a full
citation, and an account of how the values were transcribed.  This module
reads those files, checks them against a fixed schema, and answers lookups.
Every answer carries the table id, so the oracle can report the provenance
``table:<id>``.

A tabulated value is only as good as its source and its transcription; the
project's tests recompute every entry this machine can reach (see
``tests/test_tables.py``) and list the ones it cannot.

Only the standard library and PyYAML are used here, because the pytest
plugin imports this module.

Schema of one table file (a YAML mapping)::

    id:             stable id of ours, equal to the file name after "table-"
    function:       one of FUNCTIONS
    title, source, citation, transcription:   non-empty text
    argument_form:  how an entry's ``n`` becomes its argument (ARGUMENT_FORMS);
                    "explicit" means every entry gives ``argument`` itself
    convention:     optional text (e.g. which twin pairs are counted)
    complete_up_to: optional integer: no qualifying entry with a smaller or
                    equal argument is missing from the table
    entries:        a non-empty list of mappings with keys
                    n / argument, value, from_memory (optional bool),
                    note (optional text)
"""

from __future__ import annotations

import functools
import importlib.resources
import math
from dataclasses import dataclass
from pathlib import Path
from typing import Callable, Iterable, Protocol

import yaml

from ._errors import OracleError
from ._integers import require_int

__all__ = [
    "Entry",
    "Table",
    "FUNCTIONS",
    "ARGUMENT_FORMS",
    "all_tables",
    "table",
    "tables_for",
    "values",
    "anchor_at_or_below",
    "load_directory",
]

#: The functions a table may tabulate, with what its value is.
FUNCTIONS: dict[str, str] = {
    "pi": "π(x), the number of primes p ≤ x",
    "twin_pi": "π₂(x), the number of pairs (p, p + 2) of primes with p + 2 ≤ x",
    "nth_prime": "p_n, the n-th prime (p_1 = 2); the argument is n",
    "prime_gap_record": "a maximal gap: the argument is the prime p, the value the gap g "
                        "to the next prime, larger than every gap below p",
    "strong_pseudoprime_bound": "the smallest odd composite that is a strong probable "
                                "prime to each of the first k prime bases; the argument is k",
    "carmichael": "the k-th Carmichael number; the argument is k",
    "factorization": "the prime factors of the argument, ascending, with multiplicity",
}

#: How an entry's index ``n`` determines its argument.
ARGUMENT_FORMS: dict[str, Callable[[int], int]] = {
    "index": lambda n: n,
    "10**n": lambda n: 10 ** n,
    "2**n": lambda n: 2 ** n,
    "2**2**n+1": lambda n: 2 ** (2 ** n) + 1,
    "2**n-1": lambda n: 2 ** n - 1,
}
_EXPLICIT = "explicit"

#: Largest index accepted in a table file (keeps 2**2**n within reason).
_MAX_INDEX = {"index": 10 ** 30, "10**n": 1000, "2**n": 4000, "2**2**n+1": 14, "2**n-1": 4000}

_FILE_PREFIX = "table-"
_FILE_SUFFIX = ".yaml"
_TEXT_FIELDS = ("title", "source", "citation", "transcription")
_TABLE_KEYS = {"id", "function", "argument_form", "convention", "complete_up_to",
               "entries", *_TEXT_FIELDS}
_ENTRY_KEYS = {"n", "argument", "value", "from_memory", "note"}


@dataclass(frozen=True)
class Entry:
    """One tabulated value: ``function(argument) == value``.

    ``index`` is the ``n`` the file gave (for π(10^n) the exponent n), or
    ``None`` when the file gave the argument itself.
    """

    argument: int
    value: object
    from_memory: bool
    note: str = ""
    index: int | None = None


@dataclass(frozen=True)
class Table:
    """A published table with its provenance."""

    id: str
    function: str
    title: str
    source: str
    citation: str
    transcription: str
    entries: tuple[Entry, ...]
    convention: str = ""
    complete_up_to: int | None = None

    @property
    def provenance(self) -> str:
        """The provenance string the oracle reports: ``table:<id>``."""
        return f"table:{self.id}"

    def value_at(self, argument: int) -> object:
        """The tabulated value at ``argument``; :class:`OracleError` if absent."""
        for entry in self.entries:
            if entry.argument == argument:
                return entry.value
        raise OracleError(f"table {self.id}: no entry at argument {argument}")


class _Resource(Protocol):
    """What we need of a file or a directory: a ``Path`` or a resource ``Traversable``."""

    name: str

    def iterdir(self) -> Iterable["_Resource"]: ...

    def read_text(self, encoding: str = ...) -> str: ...

    def is_file(self) -> bool: ...


# --------------------------------------------------------------------------- lookups


@functools.cache
def all_tables() -> dict[str, Table]:
    """Every shipped table by id, loaded once and validated.

    Raises :class:`OracleError` naming the file and the problem when a table
    is malformed, or when two tables of one function disagree on a value.
    """
    return load_directory(_fixtures_directory())


def table(table_id: str) -> Table:
    """The table with id ``table_id``."""
    tables = all_tables()
    if table_id not in tables:
        raise OracleError(f"no table with id {table_id!r}; known: {', '.join(sorted(tables))}")
    return tables[table_id]


def tables_for(function: str) -> tuple[Table, ...]:
    """The tables tabulating ``function``, in id order."""
    _require_function(function)
    return tuple(t for _, t in sorted(all_tables().items()) if t.function == function)


def values(function: str) -> dict[int, tuple[object, str]]:
    """``argument -> (value, table id)`` over every table of ``function``.

    Where two tables share an argument (π(10^0) = π(2^0)) their values agree
    -- :func:`all_tables` checks that -- and the table whose id sorts first
    is named.
    """
    merged: dict[int, tuple[object, str]] = {}
    for source_table in tables_for(function):
        for entry in source_table.entries:
            merged.setdefault(entry.argument, (entry.value, source_table.id))
    return dict(sorted(merged.items()))


def anchor_at_or_below(function: str, x: int) -> tuple[int, object, str] | None:
    """``(argument, value, table id)`` for the largest tabulated argument ≤ ``x``.

    ``None`` when no tabulated argument is ≤ ``x``.
    """
    x = require_int("x", x)
    best: tuple[int, object, str] | None = None
    for argument, (value, table_id) in values(function).items():
        if argument <= x and (best is None or argument > best[0]):
            best = (argument, value, table_id)
    return best


# --------------------------------------------------------------------------- loading


def load_directory(directory: _Resource | str | Path) -> dict[str, Table]:
    """Load and validate every ``table-*.yaml`` file in ``directory``.

    Other files (such as ``bounds.yaml``, which has a schema of its own) are
    not read.
    """
    if isinstance(directory, (str, Path)):
        directory = Path(directory)
    tables: dict[str, Table] = {}
    files = sorted((f for f in directory.iterdir()
                    if f.name.startswith(_FILE_PREFIX) and f.name.endswith(_FILE_SUFFIX)),
                   key=lambda f: f.name)
    for resource in files:
        loaded = _load_file(resource.name, resource.read_text(encoding="utf-8"))
        if loaded.id in tables:
            raise OracleError(f"{resource.name}: table id {loaded.id!r} is used twice")
        tables[loaded.id] = loaded
    _check_overlaps(tables)
    return tables


def _fixtures_directory() -> _Resource:
    """The installed ``oracle.fixtures`` resources, else ``<repo>/fixtures`` of a checkout."""
    try:
        return importlib.resources.files("oracle.fixtures")
    except ModuleNotFoundError:
        checkout = Path(__file__).resolve().parent.parent / "fixtures"
        if not checkout.is_dir():
            raise OracleError(f"the fixtures are missing: neither the package oracle.fixtures "
                              f"nor {checkout} exists") from None
        return checkout


def _load_file(filename: str, text: str) -> Table:
    try:
        # libyaml's loader when present: the same safe constructor, ten times faster.
        document = yaml.load(text, Loader=getattr(yaml, "CSafeLoader", yaml.SafeLoader))
    except yaml.YAMLError as error:
        raise OracleError(f"{filename}: not valid YAML ({error})") from None
    problem = _Problem(filename)
    if not isinstance(document, dict):
        raise problem("the file must hold one mapping")
    unknown = set(document) - _TABLE_KEYS
    if unknown:
        raise problem(f"unknown keys {sorted(unknown)}")

    table_id = _text(document, "id", problem)
    expected_name = f"{_FILE_PREFIX}{table_id}{_FILE_SUFFIX}"
    if filename != expected_name:
        raise problem(f"id {table_id!r} does not match the file name (expected {expected_name})")
    function = _text(document, "function", problem)
    if function not in FUNCTIONS:
        raise problem(f"function {function!r} is not one of {sorted(FUNCTIONS)}")
    texts = {name: _text(document, name, problem) for name in _TEXT_FIELDS}
    convention = document.get("convention", "")
    if not isinstance(convention, str):
        raise problem("convention must be text")
    form = _text(document, "argument_form", problem)
    if form != _EXPLICIT and form not in ARGUMENT_FORMS:
        raise problem(f"argument_form {form!r} is not one of "
                      f"{sorted([_EXPLICIT, *ARGUMENT_FORMS])}")
    complete_up_to = document.get("complete_up_to")
    if complete_up_to is not None and not _is_int(complete_up_to):
        raise problem("complete_up_to must be an integer")

    raw_entries = document.get("entries")
    if not isinstance(raw_entries, list) or not raw_entries:
        raise problem("entries must be a non-empty list")
    entries = tuple(_entry(raw, position, form, function, problem)
                    for position, raw in enumerate(raw_entries, start=1))
    arguments = [entry.argument for entry in entries]
    if arguments != sorted(set(arguments)):
        raise problem("entries must be in strictly increasing order of argument, without repeats")
    return Table(id=table_id, function=function, entries=entries, convention=convention.strip(),
                 complete_up_to=complete_up_to, **texts)


def _entry(raw: object, position: int, form: str, function: str, problem: "_Problem") -> Entry:
    where = f"entry {position}"
    if not isinstance(raw, dict):
        raise problem(f"{where} must be a mapping")
    unknown = set(raw) - _ENTRY_KEYS
    if unknown:
        raise problem(f"{where}: unknown keys {sorted(unknown)}")
    index = raw.get("n")
    if index is not None and (not _is_int(index) or index < 0):
        raise problem(f"{where}: n must be a non-negative integer, got {index!r}")
    if form == _EXPLICIT:
        argument = raw.get("argument")
        if not _is_int(argument) or argument < 0:
            raise problem(f"{where}: argument must be a non-negative integer, got {argument!r}")
    else:
        if "argument" in raw:
            raise problem(f"{where}: give n, not argument, when argument_form is {form!r}")
        if index is None:
            raise problem(f"{where}: n is missing")
        if index > _MAX_INDEX[form]:
            raise problem(f"{where}: n={index} is too large for argument_form {form!r}")
        argument = ARGUMENT_FORMS[form](index)
    if "value" not in raw:
        raise problem(f"{where}: value is missing")
    value = _value(raw["value"], argument, function, f"{where} (argument {argument})", problem)
    from_memory = raw.get("from_memory", False)
    if not isinstance(from_memory, bool):
        raise problem(f"{where}: from_memory must be true or false")
    note = raw.get("note", "")
    if not isinstance(note, str):
        raise problem(f"{where}: note must be text")
    return Entry(argument=argument, value=value, from_memory=from_memory, note=note, index=index)


def _value(value: object, argument: int, function: str, where: str,
           problem: "_Problem") -> object:
    """Check a value's type, and for a factorisation that it multiplies back."""
    if function != "factorization":
        if not _is_int(value) or value < 0:
            raise problem(f"{where}: value must be a non-negative integer, got {value!r}")
        return value
    if not isinstance(value, list) or not value or not all(_is_int(p) and p >= 2 for p in value):
        raise problem(f"{where}: value must be a non-empty list of integers >= 2")
    if value != sorted(value):
        raise problem(f"{where}: the factors must be in ascending order")
    if math.prod(value) != argument:
        raise problem(f"{where}: the factors do not multiply to the argument")
    return tuple(value)


def _check_overlaps(tables: dict[str, Table]) -> None:
    """Two tables of one function must agree wherever they share an argument."""
    seen: dict[tuple[str, int], tuple[object, str]] = {}
    for table_id, loaded in sorted(tables.items()):
        for entry in loaded.entries:
            key = (loaded.function, entry.argument)
            if key in seen and seen[key][0] != entry.value:
                other_value, other_id = seen[key]
                raise OracleError(
                    f"{_FILE_PREFIX}{table_id}{_FILE_SUFFIX}: {loaded.function}({entry.argument}) "
                    f"= {entry.value} disagrees with table {other_id} ({other_value})")
            seen.setdefault(key, (entry.value, table_id))


# --------------------------------------------------------------------------- helpers


class _Problem:
    """Builds the error for one file: ``OracleError("<file>: <problem>")``."""

    def __init__(self, filename: str):
        self.filename = filename

    def __call__(self, message: str) -> OracleError:
        return OracleError(f"{self.filename}: {message}")


def _text(document: dict, key: str, problem: _Problem) -> str:
    value = document.get(key)
    if not isinstance(value, str) or not value.strip():
        raise problem(f"{key} is missing or empty (it must be text)")
    return value.strip()


def _is_int(value: object) -> bool:
    return isinstance(value, int) and not isinstance(value, bool)


def _require_function(function: str) -> None:
    if function not in FUNCTIONS:
        raise OracleError(f"function={function!r}: no tables of that function; "
                          f"known: {', '.join(sorted(FUNCTIONS))}")
