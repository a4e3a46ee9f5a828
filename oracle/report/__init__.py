"""Reports of audits: a progress line and a summary table on the terminal, JSON, and HTML.

>>> from oracle import report
>>> with report.Progress(total=3, description="prime_pi", quiet=True) as progress:
...     for _ in range(3):
...         progress.advance()
>>> progress.completed
3

* :class:`Progress` and :func:`summary_table` -- the terminal (rich; plain text and
  no colour when the stream is not a terminal or ``NO_COLOR`` is set);
* :func:`write_json` -- the summaries with the stable keys of :data:`SUMMARY_KEYS`
  (documented in :mod:`oracle.report._json`);
* :func:`write_html` -- one self-contained HTML file with embedded plots;
* :func:`table_summary_lines` and :func:`write_table_html` -- the terminal summary and the
  same kind of page for a judged table of claims;
* :func:`reproduce_command` -- the ``ntoracle audit`` command that repeats a run;
* :func:`show_value`, :func:`show_pair`, :func:`got_expected` -- the one way values are
  written (booleans, long lists around their first difference, huge integers counted);
* :func:`summary_lines` -- the one text summary of an audit (terminal, report.txt, HTML).

Every report carries :data:`CAUTIONS`: a probable prime is not a proven prime;
passing is evidence, not a certificate; for cryptographic use defer to the
published standards and a vetted library.
"""

from ._cautions import CAUTIONS
from ._describe import describe_divergence
from ._json import OPTIONAL_KEYS, SUMMARY_KEYS, write_json
from ._reproduce import reproduce_command
from ._summary_text import divergence_line, finding_line, summary_lines, verdict_line
from ._table_text import table_summary_lines
from ._values import got_expected, show_pair, show_value
from ._terminal import Progress, summary_table

__all__ = ["Progress", "summary_table", "write_json", "SUMMARY_KEYS", "OPTIONAL_KEYS",
           "write_html", "write_table_html", "table_summary_lines", "reproduce_command",
           "describe_divergence", "CAUTIONS", "summary_lines", "verdict_line", "finding_line",
           "divergence_line", "show_value", "show_pair", "got_expected"]

#: The HTML writers draw the proven-bound envelopes (mpmath, numpy): imported on first use, so
#: that a value printed on the terminal does not pay for them (issue 14, start-up).
_LAZY = {"write_html": "._html", "write_table_html": "._table_html"}


def __getattr__(name: str):
    if name in _LAZY:
        import importlib

        return getattr(importlib.import_module(_LAZY[name], __name__), name)
    raise AttributeError(f"module {__name__!r} has no attribute {name!r}")
