r"""Judging a table of claimed values: every row of a file checked against the oracle.

A table of claims -- a legacy program's output, a paper's table, a cluster
run -- is a file of rows, each naming a function (a role name such as
``prime_pi``), its argument and the claimed value.  Nothing is re-run: each row
is judged against the oracle, and neighbouring rows against each other.

Per row (``oracle.facade`` and the checks of :mod:`oracle.claims`):

* **exact** where the oracle reaches within the budget -- the claim must equal
  the exact value (``prime_pi``, ``twin_pi``, ``nth_prime``, ``is_prime``,
  ``next_prime``, ``prev_prime``); a claimed factorisation must multiply back
  to n with every factor prime (``factor``);
* beyond exact reach, the **proven interval** of the bounds catalogue (and,
  for ``nth_prime``, primality of the claimed p_n).

Between neighbouring rows of ``prime_pi`` or of ``twin_pi`` (sorted by the
argument), when at least one of the two was not judged exactly:

* **monotonicity** -- π and π₂ never decrease, and one argument has one value;
* **short-interval difference** -- f(x + h) − f(x) is the exact count of
  primes (or twin pairs) in (x, x + h], sieved at any height when h is short.

A row that cannot be read (malformed, an unknown function, a bad argument or
claimed value, a line that is not UTF-8) is reported with its line and the
rest are judged.  Rows are untrusted text: integers go through
:func:`oracle._integers.parse_integer` (no ``eval``, bounded size), YAML
through the limits of :mod:`oracle._safe_yaml`, and the file, the line and the
number of rows are bounded.

Verdicts per row: ``confirmed`` (equals the exact value, or a valid
factorisation), ``consistent`` (only bounds and neighbours checked, none
refutes it: evidence, not proof), ``refuted`` (its own check failed) or
``conflicting`` (it and a neighbour cannot both be right: one of them is wrong).
A confirmation by a ``probable`` route (Baillie-PSW) is not a proof of primality.

Cost: one oracle answer per row, each bounded by the budget (seconds), and one
sieve of the interval between each pair of neighbours short enough to sieve.
The theorems behind the intervals are those of the bounds catalogue
(``fixtures/bounds.yaml``: Dusart 2018, Axler 2019 and others, each with its source).

>>> import pathlib, tempfile
>>> path = pathlib.Path(tempfile.mkdtemp()) / "claims.csv"
>>> _ = path.write_text("function,argument,claimed\nprime_pi,10**6,78498\nprime_pi,10**40,10**38\n")
>>> summary = audit_table(path)
>>> [(f["lines"], f["kind"]) for f in summary["findings"]], summary["verdict"]
([([3], 'outside-proven-interval')], 'failed')
"""

from __future__ import annotations

import csv
import json
import time
from dataclasses import dataclass, field

from ._bounded import bounded_text
from ._errors import InvalidInputError, OracleError, OutOfReachError
from ._integers import MAX_DIGITS, parse_integer, require_int

__all__ = ["FUNCTIONS", "FORMATS", "COLUMNS", "FINDING_KINDS", "BAD_ROW_KINDS", "MAX_BYTES",
           "MAX_ROWS", "MAX_LINE", "DEFAULT_BUDGET_SECONDS", "Row", "BadRow", "read_table",
           "judge_table", "audit_table"]

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
#: Seconds of computation the oracle may spend on one exact answer of a table.
DEFAULT_BUDGET_SECONDS = 20.0

#: What each failed check means, as the kind of the finding.
FINDING_KINDS = {"exact": "wrong-value", "proven-interval": "outside-proven-interval",
                 "is-prime": "not-prime", "factorization": "wrong-factorization",
                 "monotone": "non-monotone", "short-interval": "wrong-difference"}
#: Why a row could not be judged.
BAD_ROW_KINDS = ("malformed", "unknown-function", "bad-argument", "bad-claimed-value", "not-utf-8",
                 "not-judged")

# Role name -> the name oracle.claims uses for that counting function.
_COUNTING = {"prime_pi": "pi", "twin_pi": "twin_pi"}
_MINIMUM = {"prime_pi": 0, "twin_pi": 0, "nth_prime": 1, "is_prime": 0, "next_prime": 0,
            "prev_prime": 3, "factor": 1}
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
    def __init__(self, kind: str, detail: str):
        super().__init__(detail)
        self.kind = kind
        self.detail = detail


# --------------------------------------------------------------------------- #
# Reading
# --------------------------------------------------------------------------- #

def read_table(path, *, format: str | None = None) -> tuple[list[Row], list[BadRow], str]:
    """The readable rows, the bad rows and the format of the table in the file ``path``.

    Raises :class:`InvalidInputError` naming the file when the file as a whole
    cannot be read (missing, too large, an unknown format, a CSV header
    without the columns, YAML that is not a list of rows).
    """
    from ._safe_yaml import read_bytes_limited

    name = str(path)
    format = format or _format_of(name)
    data = read_bytes_limited(path, max_bytes=MAX_BYTES)
    if format == "yaml":
        entries = _yaml_entries(data, name)
    else:
        entries = _line_entries(data, name, format)
    rows: list[Row] = []
    bad: list[BadRow] = []
    for line, entry in entries:
        if len(rows) + len(bad) >= MAX_ROWS:
            raise InvalidInputError(f"{name}: more than {MAX_ROWS} rows (the limit of one table)")
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


def _yaml_entries(data: bytes, name: str):
    """(line, mapping or BadRow) per row of a YAML table: a list of mappings, or a mapping
    whose ``claims`` is one.  Scalars are kept as their text (YAML 1.1 would read ``010``
    as octal 8 and ``1:30`` as 90), so every integer goes through parse_integer."""
    import yaml

    from . import _safe_yaml

    text, _ = _safe_yaml.read_limited(data, name=name, max_bytes=MAX_BYTES)
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
    if argument < _MINIMUM[function]:
        raise _Bad("bad-argument", f"argument {argument}: {function} is defined for arguments "
                                   f">= {_MINIMUM[function]}")
    claimed = _claimed(function, entry["claimed"])
    note = entry.get("note")
    written = entry["argument"].strip() if isinstance(entry["argument"], str) else ""
    return Row(line, function, argument, claimed, "" if note is None else bounded_text(note, 200),
               "" if written == str(argument) or len(written) > 80 else written)


def _unknown_function(function: object) -> str:
    text = bounded_text(function, 40)
    if not isinstance(function, str):
        return f"function {text}: expected a name, one of {', '.join(FUNCTIONS)}"
    from . import roles

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


# --------------------------------------------------------------------------- #
# Judging
# --------------------------------------------------------------------------- #

@dataclass
class _Judged:
    row: Row
    checks: list = field(default_factory=list)      # ClaimCheck, this row's own
    pairs: list = field(default_factory=list)       # (ClaimCheck, lower row, upper row)

    @property
    def exact(self) -> bool:
        return any(check.check in ("exact", "factorization") for check in self.checks)

    @property
    def verdict(self) -> str:
        if any(not check.passed for check in self.checks):
            return "refuted"
        if any(not check.passed for check, _, _ in self.pairs):
            return "conflicting"            # this row or its neighbour is wrong: not which
        return "confirmed" if self.exact else "consistent"


def judge_table(rows: list[Row], *, budget: float | None = DEFAULT_BUDGET_SECONDS,
                progress=None):
    """Judge each row, then each pair of neighbouring counting rows; returns
    ``(judged rows, rows that could not be judged, pairs left unchecked)``.
    ``progress``, if given, is called as ``progress(rows_done, rows_in_all)`` after each row."""
    judged: list[_Judged] = []
    not_judged: list[BadRow] = []
    for done, row in enumerate(rows, start=1):
        try:
            judged.append(_Judged(row, _judge_row(row, budget)))
        except OracleError as error:
            not_judged.append(BadRow(row.line, "not-judged", bounded_text(str(error), 300)))
        if progress is not None:
            progress(done, len(rows))
    unchecked = _judge_neighbours(judged, budget)
    return judged, not_judged, unchecked


def _judge_row(row: Row, budget):
    from . import claims, facade
    from .claims import ClaimCheck

    if row.function in _COUNTING:
        return [claims.check_count(_COUNTING[row.function], row.argument, row.claimed,
                                   budget=budget)]
    if row.function == "nth_prime":
        return claims.check_nth_prime(row.argument, row.claimed, budget=budget)
    if row.function == "factor":
        report = facade.verify_factorization(row.argument, row.claimed)
        return [ClaimCheck("factorization", "factor", (row.argument,), row.claimed,
                           "a product equal to n of primes", report.provenance, report.ok,
                           "; ".join(report.problems))]
    answer = facade.answer(row.function, row.argument, budget=budget)
    return [ClaimCheck("exact", row.function, (row.argument,), row.claimed, answer.value,
                       answer.provenance, row.claimed == answer.value)]


def _judge_neighbours(judged: list[_Judged], budget) -> int:
    """Monotonicity and short-interval differences between neighbours of each counting
    function, where at least one of the two was not judged exactly; returns how many such
    pairs were too far apart for an exact difference."""
    from . import claims

    unchecked = 0
    for function, name in _COUNTING.items():
        ordered = sorted((entry for entry in judged if entry.row.function == function),
                         key=lambda entry: (entry.row.argument, entry.row.line))
        for first, second in zip(ordered, ordered[1:]):
            if first.exact and second.exact:
                continue                  # both exact: each row's own verdict says it all
            a, b = first.row, second.row
            monotone = claims.check_monotone(name, [(a.argument, a.claimed),
                                                    (b.argument, b.claimed)])
            first.pairs.append((monotone, a, b))
            second.pairs.append((monotone, a, b))
            if a.argument == b.argument:
                continue
            try:
                difference = claims.check_difference(name, a.argument, b.argument - a.argument,
                                                     a.claimed, b.claimed, budget=budget)
            except OutOfReachError:
                unchecked += 1
                continue
            first.pairs.append((difference, a, b))
            second.pairs.append((difference, a, b))
    return unchecked


# --------------------------------------------------------------------------- #
# The summary
# --------------------------------------------------------------------------- #

def audit_table(path, *, format: str | None = None,
                budget: float | None = DEFAULT_BUDGET_SECONDS, progress=None) -> dict:
    """Read and judge the table in ``path``; the summary as a JSON-ready dict.

    Keys: ``file``, ``format``, ``verdict`` (``passed``: no row refuted and none bad;
    ``failed``: a row refuted or two in conflict; ``incomplete``: none refuted but some
    could not be read or judged; ``no verdict``: the table has no rows), ``passed``,
    ``rows``, ``confirmed``, ``consistent``, ``refuted``, ``conflicting``, ``bad_rows``,
    ``checks``, ``passed_checks``, ``findings`` (``kind``, ``lines``,
    ``function``, ``arguments``, ``claimed``, ``expected``, ``provenance``, ``check``,
    ``detail``), ``bad`` (``line``, ``kind``, ``detail``), ``pairs_too_far_apart``,
    ``results`` (one per judged row: ``line``, ``function``, ``argument``, ``written`` (the
    argument as the table wrote it, when that differs), ``claimed``, ``verdict``, ``note``,
    ``checks``), ``budget_seconds`` and ``timings``.  ``progress`` as for :func:`judge_table`.
    """
    started = time.perf_counter()
    rows, bad, format = read_table(path, format=format)
    judged, not_judged, unchecked = judge_table(rows, budget=budget, progress=progress)
    bad = sorted(bad + not_judged, key=lambda entry: entry.line)
    findings = _findings(judged)
    verdicts = [entry.verdict for entry in judged]
    checks = _distinct_checks(judged)
    if "refuted" in verdicts or "conflicting" in verdicts:
        verdict = "failed"
    elif bad:
        verdict = "incomplete"
    elif not judged:
        verdict = "no verdict"
    else:
        verdict = "passed"
    return {
        "file": str(path), "format": format, "verdict": verdict, "passed": verdict == "passed",
        "rows": len(rows) + sum(1 for entry in bad if entry.kind != "not-judged"),
        "confirmed": verdicts.count("confirmed"), "consistent": verdicts.count("consistent"),
        "refuted": verdicts.count("refuted"), "conflicting": verdicts.count("conflicting"),
        "bad_rows": len(bad),
        "checks": len(checks), "passed_checks": sum(1 for check in checks if check.passed),
        "findings": findings,
        "bad": [{"line": entry.line, "kind": entry.kind, "detail": entry.detail} for entry in bad],
        "pairs_too_far_apart": unchecked,
        "results": [_result(entry) for entry in judged],
        "budget_seconds": budget,
        "timings": {"total_seconds": round(time.perf_counter() - started, 6)},
    }


def _distinct_checks(judged: list[_Judged]) -> list:
    seen, checks = set(), []
    for entry in judged:
        checks.extend(entry.checks)
        for check, _, _ in entry.pairs:
            if id(check) not in seen:
                seen.add(id(check))
                checks.append(check)
    return checks


def _findings(judged: list[_Judged]) -> list[dict]:
    findings, seen = [], set()
    for entry in judged:
        for check in entry.checks:
            if not check.passed:
                findings.append(_finding(check, (entry.row.line,), entry.row.function,
                                         _row_detail(check, entry.row)))
        for check, first, second in entry.pairs:
            if not check.passed and id(check) not in seen:
                seen.add(id(check))
                findings.append(_finding(check, tuple(sorted((first.line, second.line))),
                                         first.function, _pair_detail(check, first, second)))
    return sorted(findings, key=lambda finding: finding["lines"])


def _finding(check, lines: tuple[int, ...], function: str, detail: str) -> dict:
    return {"kind": FINDING_KINDS.get(check.check, check.check), "lines": list(lines),
            "function": function, "arguments": list(check.arguments),
            "claimed": _plain(check.claimed), "expected": _plain(check.expected),
            "provenance": check.provenance, "check": check.check, "detail": detail}


def _row_detail(check, row: Row) -> str:
    """One sentence: what the row claims and what the oracle knows instead."""
    call = row.call
    claimed = (" * ".join(f"{p}^{e}" if e > 1 else f"{p}" for p, e in check.claimed)
               if row.function == "factor" else _shown(check.claimed))
    text = f"{call} claimed {claimed}"
    if check.check == "exact":
        return f"{text}; the exact value is {_shown(check.expected)}"
    if check.check == "proven-interval":
        lower, upper = check.expected
        return (f"{text}: {check.detail}; proven: {'?' if lower is None else _shown(lower)} <= "
                f"{call} <= {'?' if upper is None else _shown(upper)}")
    return f"{text}: {check.detail}"


def _pair_detail(check, first: Row, second: Row) -> str:
    """One sentence on two neighbouring rows that cannot both be right."""
    if check.check == "monotone" and first.argument == second.argument:
        return f"two different values for {first.call}: {_shown(first.claimed)} and " \
               f"{_shown(second.claimed)}"
    if check.check == "monotone":
        return (f"{second.call} = {_shown(second.claimed)} is less than {first.call} = "
                f"{_shown(first.claimed)}, but {first.function} never decreases")
    what = "primes" if first.function == "prime_pi" else "twin pairs (counted by p + 2)"
    return (f"{second.call} - {first.call} = {_shown(check.claimed)}, but the interval between "
            f"them holds {_shown(check.expected)} {what}")


def _shown(value) -> str:
    if isinstance(value, bool):
        return "true" if value else "false"
    return bounded_text(value, 120)


def _result(entry: _Judged) -> dict:
    row = entry.row
    return {"line": row.line, "function": row.function, "argument": row.argument,
            "written": row.written, "claimed": _plain(row.claimed), "verdict": entry.verdict,
            "note": row.note,
            "checks": [{"check": check.check, "passed": check.passed,
                        "expected": _plain(check.expected), "provenance": check.provenance}
                       for check in entry.checks + [pair for pair, _, _ in entry.pairs]]}


def _plain(value):
    """A value as JSON data: tuples become lists."""
    if isinstance(value, tuple):
        return [_plain(item) for item in value]
    return value
