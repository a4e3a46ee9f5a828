"""The HTML report of a judged table of claims (:mod:`oracle.claims_table`).

The same page as an audit's report (:mod:`oracle.report._html`): one
self-contained file, the style sheet inline, no script, nothing fetched, the
cautions on top.  Every text that came from the table -- functions, notes,
claimed values, details -- is escaped, since the table is untrusted.  The
page lists the findings with their lines, the rows that could not be judged,
and the first :data:`ROW_LIMIT` judged rows with their verdicts.
"""

from __future__ import annotations

import os
from pathlib import Path

from .._errors import InvalidInputError
from ._describe import show_value
from ._html import _STYLE, _cautions_section, _text

__all__ = ["write_table_html", "render_table_html", "ROW_LIMIT"]

#: Judged rows listed; the JSON summary has them all.
ROW_LIMIT = 500

_VERDICT_CLASSES = {"passed": "passed", "failed": "failed", "incomplete": "incomplete",
                    "no verdict": "no-verdict", "confirmed": "passed", "consistent": "incomplete",
                    "refuted": "failed", "conflicting": "failed"}
_SUMMARY_KEYS = ("file", "format", "verdict", "rows", "confirmed", "consistent", "refuted",
                 "bad_rows", "checks", "passed_checks", "findings", "bad", "results")


def write_table_html(summary: dict, path: str | os.PathLike, *, command: str | None = None,
                     title: str = "ntoracle: a table of claims, judged") -> None:
    """Write the report of one judged table (the summary of ``audit_table``) to ``path``."""
    page = render_table_html(summary, command=command, title=title)
    path = Path(path)
    path.parent.mkdir(parents=True, exist_ok=True)
    path.write_text(page, encoding="utf-8")


def render_table_html(summary: dict, *, command: str | None = None,
                      title: str = "ntoracle: a table of claims, judged") -> str:
    """The text of the page that :func:`write_table_html` writes."""
    if not isinstance(summary, dict) or any(key not in summary for key in _SUMMARY_KEYS):
        raise InvalidInputError("summary: expected the summary of a judged table "
                                "(oracle.claims_table.audit_table)")
    verdict = summary["verdict"]
    parts = ["<!DOCTYPE html>", '<html lang="en">', "<head>", '<meta charset="utf-8">',
             f"<title>{_text(title)}</title>", f"<style>{_STYLE}</style>", "</head>", "<body>",
             f"<h1>{_text(title)}</h1>", '<section id="summary">', "<h2>Summary</h2>",
             f'<p>{_text(summary["file"])} ({_text(summary["format"])}): '
             f'<span class="{_VERDICT_CLASSES.get(verdict, "no-verdict")}">{_text(verdict)}</span>'
             f'. {_text(summary["rows"])} row(s): {_text(summary["refuted"])} refuted, '
             f'{_text(summary.get("conflicting", 0))} in conflict with a neighbour, '
             f'{_text(summary["confirmed"])} confirmed exactly, {_text(summary["consistent"])} '
             f'consistent with the proven bounds and their neighbours (evidence, not proof), '
             f'{_text(summary["bad_rows"])} not judged; {_text(summary["passed_checks"])} of '
             f'{_text(summary["checks"])} checks passed.</p>']
    if command is not None:
        parts += ["<p>The command that produced this report:</p>",
                  f"<pre><code>{_text(command)}</code></pre>"]
    parts.append("</section>")
    parts += _cautions_section()
    parts += _findings(summary["findings"])
    parts += _bad_rows(summary["bad"])
    parts += _rows(summary["results"])
    parts += ["</body>", "</html>", ""]
    return "\n".join(parts)


def _findings(findings: list[dict]) -> list[str]:
    if not findings:
        return ['<section id="findings">', "<h2>Findings</h2>", "<p>No row was refuted.</p>",
                "</section>"]
    parts = ['<section id="findings">', f"<h2>Findings ({len(findings)})</h2>", "<table>",
             "<tr><th>line</th><th>kind</th><th>function</th><th>arguments</th><th>claimed</th>"
             "<th>expected</th><th>provenance</th><th>detail</th></tr>"]
    for finding in findings:
        parts.append(
            f"<tr><td>{_text(' and '.join(str(line) for line in finding['lines']))}</td>"
            f"<td>{_text(finding['kind'])}</td><td>{_text(finding['function'])}</td>"
            f'<td class="value">{_text(show_value(finding["arguments"]))}</td>'
            f'<td class="value">{_text(show_value(finding["claimed"]))}</td>'
            f'<td class="value">{_text(show_value(finding["expected"]))}</td>'
            f"<td>{_text(finding['provenance'])}</td>"
            f"<td>{_text(show_value(finding['detail'], 400))}</td></tr>")
    parts += ["</table>", "</section>"]
    return parts


def _bad_rows(bad: list[dict]) -> list[str]:
    if not bad:
        return []
    parts = ['<section id="bad-rows">', f"<h2>Rows not judged ({len(bad)})</h2>", "<table>",
             "<tr><th>line</th><th>kind</th><th>detail</th></tr>"]
    parts += [f"<tr><td>{_text(entry['line'])}</td><td>{_text(entry['kind'])}</td>"
              f"<td>{_text(show_value(entry['detail'], 400))}</td></tr>" for entry in bad]
    parts += ["</table>", "</section>"]
    return parts


def _rows(results: list[dict]) -> list[str]:
    parts = ['<section id="rows">', f"<h2>Rows judged ({len(results)})</h2>", "<table>",
             "<tr><th>line</th><th>function</th><th>argument</th><th>claimed</th>"
             "<th>verdict</th><th>checks</th><th>note</th></tr>"]
    for result in results[:ROW_LIMIT]:
        checks = "; ".join(f"{check['check']} {'passed' if check['passed'] else 'FAILED'} "
                           f"[{check['provenance']}]" for check in result["checks"])
        parts.append(
            f"<tr><td>{_text(result['line'])}</td><td>{_text(result['function'])}</td>"
            f'<td class="value">{_text(show_value(result["argument"]))}</td>'
            f'<td class="value">{_text(show_value(result["claimed"]))}</td>'
            f'<td class="{_VERDICT_CLASSES.get(result["verdict"], "no-verdict")}">'
            f"{_text(result['verdict'])}</td><td>{_text(show_value(checks, 400))}</td>"
            f"<td>{_text(show_value(result.get('note') or '', 200))}</td></tr>")
    parts.append("</table>")
    if len(results) > ROW_LIMIT:
        parts.append(f"<p>... and {len(results) - ROW_LIMIT} more row(s); the JSON summary "
                     "lists them all.</p>")
    parts.append("</section>")
    return parts
