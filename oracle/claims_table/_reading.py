"""Reading a table of claims: rows of (function, argument, claimed value) from an untrusted file.

Formats: CSV (a header line naming ``function``, ``argument``, ``claimed`` and
optionally ``note``), JSON lines (one object per line with those keys) and YAML
(a list of such mappings, or a mapping whose ``claims`` is one).  Blank lines
and ``#`` lines of CSV and JSON lines are skipped.

Everything is bounded before it is built: the file (:data:`MAX_BYTES`), each
line (:data:`MAX_LINE`), the number of rows (:data:`MAX_ROWS`), YAML's aliases,
expansion and depth (:mod:`oracle._safe_yaml`); integers are read by
:func:`oracle._integers.parse_integer` (no ``eval``; a JSON ``1e27`` is read
exactly from its text, never through a float).  A row that cannot be read
becomes a :class:`BadRow` with its line and kind; only a file that cannot be
read at all raises.
"""

from __future__ import annotations

import csv
import json
from dataclasses import dataclass

from .._bounded import bounded_text
from .._errors import InvalidInputError, OracleError
from .._integers import MAX_DIGITS, parse_integer, require_int

__all__ = ["FUNCTIONS", "FORMATS", "COLUMNS", "BAD_ROW_KINDS", "MAX_BYTES", "MAX_ROWS",
           "MAX_LINE", "Row", "BadRow", "read_table"]

#: The functions (role names) a table may claim values of.
FUNCTIONS = ("prime_pi", "twin_pi", "nth_prime", "is_prime", "next_prime", "prev_prime", "factor")
#: The formats read, by file ending: ``.csv``, ``.jsonl``/``.ndjson``, ``.yaml``/``.yml``.
FORMATS = ("csv", "jsonl", "yaml")
#: The fields of a row; ``note`` is optional free text.
COLUMNS = ("function", "argument", "claimed")
_OPTIONAL_COLUMNS = ("note",)
#: Largest file read, in bytes.
MAX_BYTES = 4 * 2**20
#: Most rows judged from one file.
MAX_ROWS = 20_000
#: Longest line of a CSV or JSON-lines file, in characters.
MAX_LINE = 3 * MAX_DIGITS + 1000

#: Why a row could not be judged.
BAD_ROW_KINDS = ("malformed", "unknown-function", "bad-argument", "bad-claimed-value", "not-utf-8",
                 "not-judged")

_BOOLEANS = {"true": True, "false": False}


@dataclass(frozen=True)
class Row:
    """One readable row: ``function(argument)`` is claimed to be ``claimed``."""

    line: int
    function: str
    argument: int
    claimed: object
    note: str = ""
    written: str = ""          # the argument as the table wrote it, e.g. 10**40+10**12

    @property
    def call(self) -> str:
        """``function(argument)`` as the table wrote it (``prime_pi(10**40)``)."""
        return f"{self.function}({self.written or _shown(self.argument)})"


@dataclass(frozen=True)
class BadRow:
    """A row that could not be judged: its line, the kind of problem (:data:`BAD_ROW_KINDS`)."""

    line: int
    kind: str
    detail: str


class _Bad(Exception):
    """Raised while reading one row: the kind of problem and one sentence."""

    def __init__(self, kind: str, detail: str):
        super().__init__(detail)
        self.kind = kind
        self.detail = detail


def read_table(path, *, format: str | None = None, max_bytes: int = MAX_BYTES,
               max_rows: int = MAX_ROWS) -> tuple[list[Row], list[BadRow], str]:
    """The readable rows, the bad rows and the format of the table in the file ``path``.

    Raises :class:`InvalidInputError` naming the file when the file as a whole
    cannot be read (missing, too large, an unknown format, a CSV header
    without the columns, YAML that is not a list of rows).
    """
    from .._safe_yaml import read_bytes_limited

    name = str(path)
    format = format or _format_of(name)
    if format not in FORMATS:
        raise InvalidInputError(f"format={format!r}: expected one of {', '.join(FORMATS)}")
    data = read_bytes_limited(path, max_bytes=max_bytes)
    if format == "yaml":
        entries = _yaml_entries(data, name, max_bytes)
    else:
        entries = _line_entries(data, name, format)
    rows: list[Row] = []
    bad: list[BadRow] = []
    for line, entry in entries:
        if len(rows) + len(bad) >= max_rows:
            raise InvalidInputError(f"{name}: more than {max_rows} rows (the limit of one table)")
        if isinstance(entry, BadRow):
            bad.append(entry)
            continue
        try:
            rows.append(_row(line, entry))
        except _Bad as problem:
            bad.append(BadRow(line, problem.kind, problem.detail))
    return rows, bad, format


def _format_of(name: str) -> str:
    ending = name.lower().rpartition(".")[2]
    formats = {"csv": "csv", "jsonl": "jsonl", "ndjson": "jsonl", "yaml": "yaml", "yml": "yaml"}
    if ending not in formats:
        raise InvalidInputError(f"{name}: cannot tell the format from the name; give --format "
                                f"{' | '.join(FORMATS)}")
    return formats[ending]


def _line_entries(data: bytes, name: str, format: str):
    """(line, mapping or BadRow) per non-blank, non-comment line of a CSV or JSON-lines file."""
    header: list[str] | None = None
    for number, raw in enumerate(data.split(b"\n"), start=1):
        if number == 1 and raw.startswith(b"\xef\xbb\xbf"):
            raw = raw[3:]                                   # a byte-order mark from a spreadsheet
        try:
            text = raw.decode("utf-8").rstrip("\r")
        except UnicodeDecodeError as error:
            if header is None and format == "csv":
                raise InvalidInputError(f"{name}: line {number}: not UTF-8 text (byte "
                                        f"{error.start} of the line), in the header") from None
            yield number, BadRow(number, "not-utf-8",
                                 f"not UTF-8 text (byte {error.start} of the line)")
            continue
        if not text.strip() or text.lstrip().startswith("#"):
            continue
        if len(text) > MAX_LINE:
            yield number, BadRow(number, "malformed",
                                 f"{len(text)} characters, more than the limit of {MAX_LINE}")
            continue
        if format == "jsonl":
            yield number, _json_entry(number, text)
            continue
        fields = _csv_fields(text)
        if header is None:
            header = _csv_header(fields, name, number)
            continue
        if fields is not None and len(fields) < len(header) \
                and all(column in _OPTIONAL_COLUMNS for column in header[len(fields):]):
            fields = fields + [""] * (len(header) - len(fields))     # an empty trailing note
        if fields is None or len(fields) != len(header):
            yield number, BadRow(number, "malformed",
                                 f"expected {len(header)} comma-separated fields "
                                 f"({', '.join(header)}), found "
                                 f"{'an unreadable line' if fields is None else len(fields)}")
            continue
        yield number, dict(zip(header, (field.strip() for field in fields)))
    if format == "csv" and header is None:
        raise InvalidInputError(f"{name}: no header line (expected: {','.join(COLUMNS)})")


def _csv_fields(text: str) -> list[str] | None:
    try:
        return next(csv.reader([text], strict=True))
    except (csv.Error, StopIteration):
        return None


def _csv_header(fields, name: str, line: int) -> list[str]:
    columns = [field.strip().lower() for field in fields or []]
    missing = [column for column in COLUMNS if column not in columns]
    unknown = [column for column in columns if column not in COLUMNS + _OPTIONAL_COLUMNS]
    if missing or unknown or len(set(columns)) != len(columns):
        raise InvalidInputError(
            f"{name}: line {line}: the header must name the columns {', '.join(COLUMNS)} "
            f"(and optionally {', '.join(_OPTIONAL_COLUMNS)}), each once; "
            + (f"missing {', '.join(missing)}" if missing else
               f"unknown {', '.join(bounded_text(c, 40) for c in unknown)}" if unknown
               else "a column is repeated"))
    return columns


def _json_entry(line: int, text: str):
    def integer(digits: str) -> int:
        if len(digits.lstrip("-")) > MAX_DIGITS:
            raise _Bad("malformed", f"a number of {len(digits)} digits, above the limit of "
                                    f"{MAX_DIGITS}")
        return int(digits)

    def constant(word: str):
        raise _Bad("malformed", f"{word} is not a number")

    try:
        # A JSON number with a fraction or an exponent (1e27) is kept as its text, which
        # parse_integer reads exactly: no float ever rounds a claim.
        entry = json.loads(text, parse_int=integer, parse_float=str, parse_constant=constant)
    except _Bad as problem:
        return BadRow(line, problem.kind, problem.detail)
    except RecursionError:
        return BadRow(line, "malformed", "not JSON: nested too deeply")
    except ValueError as error:
        return BadRow(line, "malformed", f"not JSON: {bounded_text(str(error), 120)}")
    if not isinstance(entry, dict):
        return BadRow(line, "malformed", "expected a JSON object with the keys "
                                         f"{', '.join(COLUMNS)}")
    return entry


def _yaml_entries(data: bytes, name: str, max_bytes: int):
    """(line, mapping or BadRow) per row of a YAML table: a list of mappings, or a mapping
    whose ``claims`` is one.  Scalars are kept as their text (YAML 1.1 would read ``010``
    as octal 8 and ``1:30`` as 90), so every integer goes through parse_integer."""
    import yaml

    from .. import _safe_yaml

    text, _ = _safe_yaml.read_limited(data, name=name, max_bytes=max_bytes)
    _safe_yaml.check_limits(text, name=name)
    try:
        document = yaml.compose(text, Loader=yaml.SafeLoader)
    except yaml.YAMLError as error:
        raise _safe_yaml._not_yaml(name, error) from None
    if isinstance(document, yaml.MappingNode):
        keys = {_scalar_text(key): value for key, value in document.value}
        unknown = [key for key in keys if key not in ("claims", "title", "source", "note")]
        if "claims" not in keys or unknown:
            raise InvalidInputError(f"{name}: a YAML table is a list of rows, or a mapping with "
                                    f"'claims: [rows]' (and title, source, note)")
        document = keys["claims"]
    if document is None:
        return []
    if not isinstance(document, yaml.SequenceNode):
        raise InvalidInputError(f"{name}: a YAML table is a list of rows")
    entries = []
    for item in document.value:
        line = item.start_mark.line + 1
        if not isinstance(item, yaml.MappingNode):
            entries.append((line, BadRow(line, "malformed", "expected a mapping with the keys "
                                                            f"{', '.join(COLUMNS)}")))
            continue
        entry = {}
        for key, value in item.value:
            entry[_scalar_text(key)] = _yaml_value(value)
        entries.append((line, entry))
    return entries


def _scalar_text(node) -> str:
    import yaml

    return node.value if isinstance(node, yaml.ScalarNode) else repr(node.tag)


def _yaml_value(node):
    """A node as plain data: scalars as text (booleans and null recognised), lists, mappings."""
    import yaml

    if isinstance(node, yaml.SequenceNode):
        return [_yaml_value(item) for item in node.value]
    if isinstance(node, yaml.MappingNode):
        return {_scalar_text(key): _yaml_value(value) for key, value in node.value}
    if node.tag == "tag:yaml.org,2002:bool":
        return node.value.lower() in ("true", "yes", "on", "y")
    if node.tag == "tag:yaml.org,2002:null":
        return None
    return node.value


def _row(line: int, entry: dict) -> Row:
    """The :class:`Row` of one entry, or :class:`_Bad` saying what is wrong with it."""
    unknown = [key for key in entry if key not in COLUMNS + _OPTIONAL_COLUMNS]
    if unknown:
        raise _Bad("malformed", f"unknown key {bounded_text(unknown[0], 40)!s}; the keys are "
                                f"{', '.join(COLUMNS)} (and note)")
    missing = [key for key in COLUMNS if key not in entry or entry[key] in (None, "")]
    if missing:
        raise _Bad("malformed", f"no {missing[0]}")
    function = entry["function"]
    if not isinstance(function, str) or function.strip() not in FUNCTIONS:
        raise _Bad("unknown-function", _unknown_function(function))
    function = function.strip()
    argument = _integer(entry["argument"], "argument", "bad-argument")
    from .. import roles

    minimum = roles.get(function).minimum           # the role's domain
    if minimum is not None and argument < minimum:
        raise _Bad("bad-argument", f"argument {argument}: {function} is defined for arguments "
                                   f">= {minimum}")
    claimed = _claimed(function, entry["claimed"])
    note = entry.get("note")
    written = entry["argument"].strip() if isinstance(entry["argument"], str) else ""
    return Row(line, function, argument, claimed, "" if note is None else bounded_text(note, 200),
               "" if written == str(argument) or len(written) > 80 else written)


def _unknown_function(function: object) -> str:
    text = bounded_text(function, 40)
    if not isinstance(function, str):
        return f"function {text}: expected a name, one of {', '.join(FUNCTIONS)}"
    from .. import roles

    try:
        meant = roles.infer(function.strip())
    except OracleError:
        meant = None
    if meant in FUNCTIONS:
        hint = f" (did you mean {meant}?)"
    elif meant is not None:
        hint = f" ({meant} is a role, but tables of its claims are not judged here)"
    else:
        hint = ""
    return f"unknown function {text!r}{hint}; known: {', '.join(FUNCTIONS)}"


def _integer(value: object, what: str, kind: str) -> int:
    try:
        if isinstance(value, str):
            return parse_integer(value.strip())
        return require_int(what, value)
    except InvalidInputError as error:
        raise _Bad(kind, f"{what}: {error}") from None


def _claimed(function: str, value: object):
    if function == "is_prime":
        if isinstance(value, bool):
            return value
        if isinstance(value, str) and value.strip().lower() in _BOOLEANS:
            return _BOOLEANS[value.strip().lower()]
        raise _Bad("bad-claimed-value", f"claimed {bounded_text(value, 40)}: is_prime claims "
                                        "true or false")
    if function == "factor":
        return _factorization(value)
    return _integer(value, "claimed", "bad-claimed-value")


def _factorization(value: object) -> tuple[tuple[int, int], ...]:
    """A claimed factorisation: text ``2^3 * 3 * 5`` (``**`` too), a list of primes, a list of
    [p, e] pairs, or a mapping {p: e}; returned as (p, e) pairs in the order given."""
    if isinstance(value, dict):
        items = list(value.items())
    elif isinstance(value, list):
        items = [tuple(item) if isinstance(item, list) else (item, 1) for item in value]
    elif isinstance(value, str) and value.strip():
        items = []
        for factor in value.replace("**", "^").split("*"):
            prime, _, exponent = factor.partition("^")
            items.append((prime, exponent if exponent.strip() else 1))
    else:
        raise _Bad("bad-claimed-value", "claimed: a factorisation such as '2^3 * 3 * 5'")
    if len(items) > 5000:
        raise _Bad("bad-claimed-value", f"claimed: {len(items)} factors, above the limit of 5000")
    pairs = []
    for item in items:
        if len(item) != 2:
            raise _Bad("bad-claimed-value", "claimed: each factor is a prime or [prime, exponent]")
        prime = _integer(item[0], "claimed factor", "bad-claimed-value")
        exponent = _integer(item[1], "claimed exponent", "bad-claimed-value")
        if exponent < 1 or exponent > 20000:
            raise _Bad("bad-claimed-value", f"claimed exponent {exponent}: must be in 1..20000")
        pairs.append((prime, exponent))
    return tuple(pairs)


def _shown(value) -> str:
    if isinstance(value, bool):
        return "true" if value else "false"
    return bounded_text(value, 120)
