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

from ._judging import DEFAULT_BUDGET_SECONDS, judge_table
from ._reading import (BAD_ROW_KINDS, COLUMNS, FORMATS, FUNCTIONS, MAX_BYTES, MAX_LINE, MAX_ROWS,
                       BadRow, Row, read_table)
from ._summary import FINDING_KINDS, audit_table

__all__ = ["FUNCTIONS", "FORMATS", "COLUMNS", "FINDING_KINDS", "BAD_ROW_KINDS", "MAX_BYTES",
           "MAX_ROWS", "MAX_LINE", "DEFAULT_BUDGET_SECONDS", "Row", "BadRow", "read_table",
           "judge_table", "audit_table"]
