"""The HTML report: one self-contained file for one or several audits.

Everything is inside the file: the style sheet inline, the plots as base64 PNG
``data:`` addresses; nothing is fetched from a network and no script runs.
Every string that reached the report from a candidate or its run -- answers,
exception messages, target names, details -- is escaped with
:func:`html.escape`, so a hostile candidate cannot put markup into the page.

Per audited role the report shows its settings and the command that repeats
it, the first divergence, the plots of :mod:`oracle.report._plots` and the
table of failures (the first :data:`FAILURE_ROWS`; the JSON report has all).
"""

from __future__ import annotations

import base64
import html
import os
from pathlib import Path

from .._errors import InvalidInputError
from . import _plot_data, _plots
from ._cautions import CAUTIONS
from ._describe import VERDICT_CLASSES, describe_divergence, show_arguments, show_value, verdict_of
from ._summary_text import verdict_line
from ._values import show_pair
from ._json import ordered_summary
from ._reproduce import reproduce_command

__all__ = ["write_html", "render_html", "FAILURE_ROWS"]

#: Failures listed per role; the rest are counted.
FAILURE_ROWS = 50

_STYLE = """
body { font-family: system-ui, sans-serif; max-width: 64rem; margin: 2rem auto; padding: 0 1rem;
       color: #212121; line-height: 1.45; }
h1 { font-size: 1.6rem; } h2 { font-size: 1.3rem; margin-top: 2.2rem; border-bottom: 1px solid #ccc; }
h3 { font-size: 1.05rem; }
table { border-collapse: collapse; margin: 0.6rem 0; font-size: 0.88rem; }
th, td { border: 1px solid #ddd; padding: 0.25rem 0.5rem; text-align: left; vertical-align: top; }
th { background: #f5f5f5; }
td.number { text-align: right; }
code, pre { font-family: ui-monospace, monospace; font-size: 0.85rem; }
pre { background: #f5f5f5; padding: 0.5rem; white-space: pre-wrap; word-break: break-all; }
td.value { font-family: ui-monospace, monospace; word-break: break-all; max-width: 18rem; }
.passed { color: #2e7d32; font-weight: bold; } .failed { color: #c62828; font-weight: bold; }
.incomplete, .no-verdict { color: #ef6c00; font-weight: bold; }
.cautions { border: 2px solid #ef6c00; background: #fff3e0; padding: 0.4rem 1rem; }
figure { margin: 1rem 0; } figure img { max-width: 100%; }
figcaption { font-size: 0.85rem; color: #555; }
dl { display: grid; grid-template-columns: max-content auto; gap: 0.1rem 1rem; font-size: 0.9rem; }
dt { font-weight: bold; } dd { margin: 0; }
"""


def _text(value: object) -> str:
    return html.escape(str(value), quote=True)


def _check_runs(runs) -> list[tuple[dict, list[dict]]]:
    if not isinstance(runs, (list, tuple)) or not runs:
        raise InvalidInputError("runs: expected a non-empty list of (summary, records) pairs")
    checked = []
    for index, run in enumerate(runs):
        if not isinstance(run, (list, tuple)) or len(run) != 2 or not isinstance(run[1], (list, tuple)):
            raise InvalidInputError(f"runs[{index}]: expected a (summary, records) pair")
        checked.append((ordered_summary(run[0]), list(run[1])))
    return checked


def write_html(runs, path: str | os.PathLike, *, command: str | None = None,
               title: str = "ntoracle audit report") -> None:
    """Write the report of ``runs`` -- a list of ``(summary, records)``, one per audited
    role -- to ``path`` as one self-contained HTML file.  ``command`` is the command line
    that produced the whole report (shown as given, escaped)."""
    page = render_html(runs, command=command, title=title)
    path = Path(path)
    path.parent.mkdir(parents=True, exist_ok=True)
    path.write_text(page, encoding="utf-8")


def render_html(runs, *, command: str | None = None, title: str = "ntoracle audit report") -> str:
    """The text of the report that :func:`write_html` writes."""
    runs = _check_runs(runs)
    parts = ["<!DOCTYPE html>", '<html lang="en">', "<head>", '<meta charset="utf-8">',
             f"<title>{_text(title)}</title>", f"<style>{_STYLE}</style>", "</head>", "<body>",
             f"<h1>{_text(title)}</h1>"]
    parts += _summary_section(runs, command)
    parts += _cautions_section()
    for index, (summary, records) in enumerate(runs):
        parts += _run_section(index, summary, records)
    parts += ["</body>", "</html>", ""]
    return "\n".join(parts)


def _summary_section(runs, command: str | None) -> list[str]:
    verdicts = [verdict_of(summary) for summary, _ in runs]
    failed, undecided = verdicts.count("failed"), verdicts.count("no verdict")
    parts = ['<section id="summary">', "<h2>Summary</h2>",
             f"<p>{len(runs)} audit(s): {len(runs) - failed - undecided} without findings, "
             f"{failed} with findings"
             + (f", {undecided} without a verdict (no check completed)" if undecided else "")
             + ".</p>", "<table>",
             "<tr><th>role</th><th>target</th><th>profile</th><th>seed</th><th>checks</th>"
             "<th>passed</th><th>failed</th><th>skipped</th><th>first divergence</th>"
             "<th>verdict</th></tr>"]
    for index, (summary, _) in enumerate(runs):
        verdict = verdict_of(summary)
        parts.append(
            f'<tr><td><a href="#run-{index}">{_text(summary["role"])}</a></td>'
            f'<td class="value">{_text(show_value(summary["target"]))}</td><td>{_text(summary["profile"])}</td>'
            f'<td>{_text(summary["seed"])}</td><td class="number">{_text(summary["checks"])}</td>'
            f'<td class="number">{_text(summary["passed_checks"])}</td>'
            f'<td class="number">{len(summary["failures"])}</td>'
            f'<td class="number">{sum(summary["skipped"].values())}</td>'
            f'<td>{_text(describe_divergence(summary["first_divergence"]))}</td>'
            f'<td class="{VERDICT_CLASSES[verdict]}">{verdict}</td></tr>')
    parts.append("</table>")
    if command is not None:
        parts += ["<p>The command that produced this report:</p>", f"<pre><code>{_text(command)}</code></pre>"]
    parts.append("</section>")
    return parts


def _cautions_section() -> list[str]:
    return (['<section class="cautions" id="cautions">', "<h3>Cautions</h3>", "<ul>"]
            + [f"<li>{_text(caution)}</li>" for caution in CAUTIONS] + ["</ul>", "</section>"])


def _start_record(summary: dict, records: list[dict]) -> dict:
    start = next((record for record in records if record.get("type") == "start"), None)
    return start if start is not None else {key: summary[key] for key in ("target", "role", "profile", "seed")}


def _run_section(index: int, summary: dict, records: list[dict]) -> list[str]:
    start = _start_record(summary, records)
    verdict = verdict_of(summary)
    settings = [("target", show_value(start["target"], 400)), ("role", start["role"]), ("profile", start["profile"]),
                ("seed", start["seed"]), ("timeout per call", _seconds(start.get("timeout"))),
                ("declared domain", "" if start.get("maximum") is None else f"inputs <= {start['maximum']}"),
                ("checks", f"{summary['checks']} made, {summary['passed_checks']} passed, "
                           f"{len(summary['failures'])} failed"),
                ("time", _seconds(summary["timings"]["total_seconds"]))]
    settings += [(f"skipped: {reason}", f"{count} point(s), not counted as passed")
                 for reason, count in summary["skipped"].items()]
    if not summary.get("ended", summary["complete"]) or summary.get("interrupted"):
        settings.append(("run", "interrupted before its end: the results are partial"))
    elif not summary["complete"]:
        settings.append(("run", "not every point was run: the results are partial"))
    parts = [f'<section id="run-{index}">',
             f'<h2>{_text(summary["role"])}: <span class="{VERDICT_CLASSES[verdict]}">{verdict}</span></h2>',
             f'<p class="verdict-line">{_text(verdict_line(summary))}</p>' if "not_run" in summary else "",
             "<dl>"]
    parts += [f"<dt>{_text(name)}</dt><dd>{_text(value)}</dd>" for name, value in settings if value != ""]
    parts += ["</dl>", "<p>To repeat this audit:</p>",
              f"<pre><code>{_text(reproduce_command(start))}</code></pre>"]
    if summary["first_divergence"]:
        parts += ["<h3>First divergence</h3>", _divergence_table(summary["first_divergence"])]
    parts += _reach_table(summary)
    parts += _figures(summary, records)
    parts += _failure_table(summary["failures"])
    parts.append("</section>")
    return parts


def _reach_table(summary: dict) -> list[str]:
    """How far each family of inputs was checked, and why it went no higher."""
    from ._terminal import readable_size

    reach = summary.get("reach") or {}
    rows = sorted(((entry.get("largest"), family, entry.get("stopped") or "")
                   for family, entry in reach.items() if entry.get("largest") is not None),
                  key=lambda row: -row[0])
    if not rows:
        return []
    parts = ["<h3>Reach</h3>", "<table><thead><tr><th>family</th><th>checked up to</th>"
             "<th>stopped by</th></tr></thead><tbody>"]
    parts += [f"<tr><td>{_text(family)}</td><td>{_text(readable_size(largest))}</td>"
              f"<td>{_text(stopped)}</td></tr>" for largest, family, stopped in rows]
    parts.append("</tbody></table>")
    return parts


def _seconds(value) -> str:
    return "" if value is None else f"{value:.3g} s"


def _divergence_table(divergence: dict) -> str:
    rows = "".join(f'<tr><th>{_text(key)}</th><td class="value">{_text(show_value(value))}</td></tr>'
                   for key, value in divergence.items())
    return f"<table>{rows}</table>"


def _image(png: bytes, alternative: str) -> str:
    encoded = base64.b64encode(png).decode("ascii")
    return f'<img src="data:image/png;base64,{encoded}" alt="{_text(alternative)}">'


def _figure(png: bytes, alternative: str, caption: str) -> str:
    return f"<figure>{_image(png, alternative)}<figcaption>{_text(caption)}</figcaption></figure>"


def _figures(summary: dict, records: list[dict]) -> list[str]:
    role = str(summary["role"])
    divergence = _plot_data.divergence_input(summary)
    figures = []
    differences = _plot_data.differences(records)
    if differences:
        figures.append(_figure(
            _plots.difference_plot(role, differences, divergence),
            f"{role}: candidate minus oracle against x",
            f"Candidate minus oracle at {len(differences)} checked inputs x >= 1 whose answer and "
            f"reference are integers (at most {_plot_data.MAX_POINTS} agreeing and as many "
            f"differing are drawn, spread over x). The y axis is logarithmic on both sides of "
            f"zero and linear between -1 and 1." + _divergence_caption(divergence)))
    else:
        statuses = _plot_data.statuses(records)
        if statuses:
            figures.append(_figure(
                _plots.status_strip(role, statuses, divergence), f"{role}: verdict of each check",
                f"The verdict of {len(statuses)} checks against the size of the input"
                + ("." if len(statuses) == summary["checks"] else
                   f" (drawn from the summary's {summary['checks']} checks: inputs of at least 1, "
                   f"at most {_plot_data.MAX_POINTS} of each verdict, spread over the sizes).")
                + _divergence_caption(divergence)))
    envelope = _plot_data.envelope(role, records)
    if envelope:
        beyond = sum(1 for point in envelope if not point.exact)
        figures.append(_figure(
            _plots.envelope_plot(role, envelope, divergence),
            f"{role}: the candidate inside the proven bounds",
            f"The proven interval of oracle.bounds (unconditional theorems only) and the candidate's "
            f"answer at {len(envelope)} inputs, both as (value - oracle) / oracle"
            + (f"; at {beyond} input(s) beyond exact reach the reference is the middle of the "
               f"proven interval" if beyond else "")
            + ". An answer outside the band is disproved by a theorem, whatever the oracle's "
              "exact value; an answer inside it may still be wrong."))
    if not figures:
        return ["<p>No checks with plottable inputs were recorded.</p>"]
    return ["<h3>Plots</h3>"] + figures


def _divergence_caption(divergence: int | None) -> str:
    return "" if divergence is None else f" The dashed line marks the first divergence, at {divergence}."


def _failure_table(failures: list[dict]) -> list[str]:
    if not failures:
        return ["<p>No check failed.</p>"]
    parts = [f"<h3>Failures ({len(failures)})</h3>", "<table>",
             "<tr><th>status</th><th>check</th><th>family</th><th>input</th><th>got</th>"
             "<th>expected</th><th>provenance</th><th>detail</th></tr>"]
    for failure in failures[:FAILURE_ROWS]:
        got, expected = show_pair(failure.get("got"), failure.get("expected"))
        parts.append(
            f"<tr><td>{_text(failure.get('status'))}</td><td>{_text(failure.get('check'))}</td>"
            f"<td>{_text(failure.get('family'))}</td>"
            f'<td class="value">{_text(show_arguments(failure.get("arguments")))}</td>'
            f'<td class="value">{_text(got)}</td><td class="value">{_text(expected)}</td>'
            f"<td>{_text(failure.get('provenance'))}</td>"
            f"<td>{_text(show_value(failure.get('detail'), 400))}</td></tr>")
    parts.append("</table>")
    if len(failures) > FAILURE_ROWS:
        parts.append(f"<p>... and {len(failures) - FAILURE_ROWS} more failure(s), not shown here; "
                     f"the JSON report lists them all.</p>")
    return parts
