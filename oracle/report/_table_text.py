"""The terminal summary of a judged table of claims (:mod:`oracle.claims_table`).

The verdict and the counts first, then every finding and unreadable row with
its line (the first :data:`SHOWN` of each; ``report.txt`` has them all), then
the confirmed and consistent rows, with the provenance of their checks.
"""

from __future__ import annotations

from .._bounded import bounded_text
from ._describe import show_value

__all__ = ["table_summary_lines", "SHOWN"]

#: Findings, and unreadable rows, shown on the terminal.
SHOWN = 50

_VERDICTS = {"passed": "PASSED", "failed": "FAILED", "incomplete": "INCOMPLETE"}


def table_summary_lines(summary: dict, *, listed: int = 40, shown: int = SHOWN) -> list[str]:
    """The lines of the summary: all findings and bad rows up to ``shown`` each, and the
    confirmed or consistent rows among the first ``listed`` judged."""
    lines = [f"ntoracle judge-table: {summary['file']} ({summary['format']}), "
             f"{summary['rows']} row(s)",
             f"{_VERDICTS.get(summary['verdict'], 'NO VERDICT')}: {summary['refuted']} row(s) "
             f"refuted, {summary['conflicting']} in conflict with a neighbour, "
             f"{summary['confirmed']} confirmed exactly, {summary['consistent']} consistent with "
             f"the proven bounds and their neighbours, {summary['bad_rows']} not judged; "
             f"{summary['passed_checks']} of {summary['checks']} checks passed"]
    for finding in summary["findings"][:shown]:
        where = " and ".join(str(line) for line in finding["lines"])
        lines.append(f"  line {where}: {finding['kind']}: {bounded_text(finding['detail'], 400)} "
                     f"[{finding['provenance']}]")
    for bad in summary["bad"][:shown]:
        lines.append(f"  line {bad['line']}: {bad['kind']}: {bounded_text(bad['detail'], 200)}")
    hidden = max(0, len(summary["findings"]) - shown) + max(0, len(summary["bad"]) - shown)
    if hidden:
        lines.append(f"  ... and {hidden} more finding(s) or bad row(s) (see --json or --report)")
    if listed:
        for result in summary["results"][:listed]:
            if result["verdict"] in ("confirmed", "consistent"):
                provenance = ", ".join(sorted({check["provenance"] for check in result["checks"]}))
                argument = result.get("written") or show_value(result["argument"], 60)
                lines.append(f"  line {result['line']}: {result['verdict']}: {result['function']}"
                             f"({argument}) = "
                             f"{show_value(result['claimed'], 60)} [{provenance}]")
        if len(summary["results"]) > listed:
            lines.append(f"  ... {len(summary['results']) - listed} more row(s) in the JSON summary")
    if summary["pairs_too_far_apart"]:
        lines.append(f"{summary['pairs_too_far_apart']} neighbouring pair(s) too far apart for an "
                     "exact count of the interval between them (monotonicity still checked)")
    lines.append(f"time: {summary['timings']['total_seconds']:.2f} s; 'consistent' is evidence, "
                 "not proof")
    return lines
