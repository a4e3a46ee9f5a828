"""Reports (oracle.report): terminal table and progress, JSON, self-contained HTML with plots.

The audits reported on are real: small ``quick`` audits of the bundled demo
library (oracle.demo), run in this process.  Values are checked against
outside references: primecountpy (a test-only reference) for pi(x), the
published value pi(2**20) = 82025 (OEIS A007053), the PNG signature (PNG
specification, ISO/IEC 15948, section 5.2) and the standard library's HTML
parser and ``html.escape``.
"""

from __future__ import annotations

import base64
import html
import io
import json
import re
import shlex
from html.parser import HTMLParser

import pytest

from oracle import engine, report, targets
from oracle._errors import InvalidInputError
from oracle.cli import build_parser
from oracle.demo import SCENARIO
from oracle.report import _json, _plot_data
from oracle.report._html import render_html
from _references import primecountpy

PNG_SIGNATURE = b"\x89PNG\r\n\x1a\n"          # PNG specification, section 5.2
HOSTILE = "<script>alert(1)</script>"
HOSTILE_TARGET = "brindle:<img src=x onerror=alert(2)>"
#: HTML elements without an end tag (HTML Living Standard, "void elements").
VOID_ELEMENTS = {"meta", "img", "br", "hr", "link", "input", "source", "wbr"}


def audit_with_records(spec: str, role: str, tmp_path_factory, seed: int = 7,
                       maximum: int | None = None):
    path = tmp_path_factory.mktemp("audit") / f"{role}.jsonl"
    target = targets.python_target(spec, role_name=role, timeout=10.0)
    try:
        summary = engine.run_audit(target, engine.AuditOptions(
            role=role, profile="quick", seed=seed, maximum=maximum, stream=str(path)))
    finally:
        target.close()
    return summary, engine.read_records(path)


@pytest.fixture(autouse=True)
def _terminal_environment(monkeypatch):
    """Each test states its terminal: a colour-capable TERM, no NO_COLOR, a fixed width, unless
    the test sets otherwise (CI runners and editors often export TERM=dumb or NO_COLOR)."""
    monkeypatch.setenv("TERM", "xterm-256color")
    monkeypatch.setenv("COLUMNS", "120")
    for name in ("NO_COLOR", "FORCE_COLOR"):
        monkeypatch.delenv(name, raising=False)


@pytest.fixture(scope="module")
def failing_prime_pi(tmp_path_factory):
    entry = SCENARIO.entry("prime_pi")          # the 16-bit tallies that wrap from 2**20 on
    return audit_with_records(entry.target, "prime_pi", tmp_path_factory, maximum=entry.maximum)


@pytest.fixture(scope="module")
def passing_nth_prime(tmp_path_factory):
    entry = SCENARIO.entry("nth_prime")         # documented as correct in its domain
    return audit_with_records(entry.target, "nth_prime", tmp_path_factory, maximum=entry.maximum)


@pytest.fixture(scope="module")
def failing_is_prime(tmp_path_factory):
    entry = SCENARIO.entry("is_prime")          # too few Miller-Rabin bases
    return audit_with_records(entry.target, "is_prime", tmp_path_factory, maximum=entry.maximum)


def hostile_prime_pi(x):
    """Raises with markup in its message on even x, answers markup on odd x."""
    if x % 2 == 0:
        raise ValueError(HOSTILE)
    return HOSTILE


@pytest.fixture(scope="module")
def hostile_run(tmp_path_factory):
    path = tmp_path_factory.mktemp("hostile") / "prime_pi.jsonl"
    target = targets.InProcessTarget(hostile_prime_pi, timeout=5.0, description=HOSTILE_TARGET)
    summary = engine.run_audit(target, engine.AuditOptions(
        role="prime_pi", profile="quick", seed=1, maximum=10**4, stream=str(path)))
    return summary, engine.read_records(path)


@pytest.fixture(scope="module")
def page(failing_prime_pi, passing_nth_prime, failing_is_prime, tmp_path_factory):
    path = tmp_path_factory.mktemp("html") / "report.html"
    report.write_html([failing_prime_pi, passing_nth_prime, failing_is_prime], path,
                      command="ntoracle demo", title="brindle audit")
    return path.read_text(encoding="utf-8")


# -- the audits themselves are what the scenario says ------------------------------ #

def test_the_audits_reported_on_fail_and_pass_as_documented(failing_prime_pi, passing_nth_prime):
    assert failing_prime_pi[0]["passed"] is False
    assert failing_prime_pi[0]["first_divergence"]["input"] == [2**20]
    assert passing_nth_prime[0]["passed"] is True and passing_nth_prime[0]["checks"] > 100


# -- HTML ------------------------------------------------------------------------- #

class TagBalance(HTMLParser):
    """Records unbalanced end tags and what is left open at the end."""

    def __init__(self):
        super().__init__(convert_charrefs=True)
        self.open: list[str] = []
        self.errors: list[str] = []
        self.images: list[dict] = []
        self.text: list[str] = []

    def handle_starttag(self, tag, attributes):
        if tag == "img":
            self.images.append(dict(attributes))
        if tag not in VOID_ELEMENTS:
            self.open.append(tag)

    def handle_startendtag(self, tag, attributes):
        self.handle_starttag(tag, attributes)
        if tag not in VOID_ELEMENTS:
            self.open.pop()

    def handle_endtag(self, tag):
        if not self.open or self.open[-1] != tag:
            self.errors.append(f"</{tag}> closes {self.open[-1] if self.open else 'nothing'}")
        else:
            self.open.pop()

    def handle_data(self, data):
        self.text.append(data)


def parse(text: str) -> TagBalance:
    parser = TagBalance()
    parser.feed(text)
    parser.close()
    return parser


def test_the_tag_checker_catches_an_unbalanced_page():
    assert parse("<html><body><p>x</body></html>").errors


def test_html_parses_with_balanced_tags(page):
    parsed = parse(page)
    assert parsed.errors == [] and parsed.open == []
    assert page.startswith("<!DOCTYPE html>")


def test_html_shows_summary_verdicts_seed_and_reproducing_commands(page, failing_prime_pi):
    text = " ".join(parse(page).text)
    assert "ntoracle demo" in text
    assert ("ntoracle audit oracle.demo.brindle.counting:prime_pi --role prime_pi --profile quick "
            "--seed 7 --timeout 5 --max 16777216") in text
    for role in ("prime_pi", "nth_prime", "is_prime"):
        assert f'id="run-{("prime_pi", "nth_prime", "is_prime").index(role)}"' in page
        assert role in text
    assert text.count("failed") >= 2 and "passed" in text
    assert "first divergence 1048576, last agreeing 1048575" in text


def test_html_failure_table_shows_got_expected_provenance(page, failing_prime_pi):
    text = " ".join(parse(page).text)
    # OEIS A007053: pi(2**20) = 82025; the wrapped 16-bit tally is 82025 - 65536 = 16489.
    assert re.search(r"\(1048576\)\s*16489\s*82025\s*table:oeis-a007053", text)
    failures = failing_prime_pi[0]["failures"]
    assert f"Failures ({len(failures)})" in text
    assert ("more failure(s)" in text) == (len(failures) > report._html.FAILURE_ROWS)


def test_html_failure_table_is_capped_and_says_how_many_more(failing_prime_pi, monkeypatch):
    monkeypatch.setattr(report._html, "FAILURE_ROWS", 10)
    summary, records = failing_prime_pi
    records = [r for r in records if r["type"] != "check" or r["status"] != "pass"]  # fewer to plot
    text = report._html.render_html([(summary, records)])
    failure_rows = re.findall(r"<tr><td>wrong</td>", text)
    assert len(failure_rows) == 10
    assert f"and {len(summary['failures']) - 10} more failure(s)" in text


def test_html_shows_the_cautions(page):
    text = " ".join(parse(page).text)
    assert "not a proof of primality" in text
    assert "evidence, not a certificate" in text
    assert "published standards" in text and "vetted library" in text


def test_html_embeds_png_plots_and_nothing_external(page):
    images = parse(page).images
    # prime_pi and nth_prime: difference and bounds envelope; is_prime: the verdict strip.
    assert len(images) == 5
    for image in images:
        prefix = "data:image/png;base64,"
        assert image["src"].startswith(prefix)
        assert base64.b64decode(image["src"][len(prefix):], validate=True).startswith(PNG_SIGNATURE)
    assert not re.search(r"<script|<link|https?://|src=\"(?!data:)", page, flags=re.IGNORECASE)


def test_hostile_candidate_output_and_name_are_escaped(hostile_run, tmp_path):
    summary, records = hostile_run
    assert {failure["status"] for failure in summary["failures"]} == {"raised", "wrong-type"}
    path = tmp_path / "hostile.html"
    report.write_html([hostile_run], path, command=f"ntoracle audit '{HOSTILE_TARGET}'", title=HOSTILE)
    text = path.read_text(encoding="utf-8")
    assert HOSTILE not in text and "<img src=x" not in text
    assert "<script" not in text.lower()
    assert html.escape(HOSTILE) in text                       # the exception message, escaped
    assert html.escape(HOSTILE_TARGET) in text                # the target's name, escaped
    parsed = parse(text)
    assert parsed.errors == [] and parsed.open == []
    assert all(image["src"].startswith("data:image/png;base64,") for image in parsed.images)


def test_write_html_refuses_what_is_not_a_list_of_runs(tmp_path, failing_prime_pi):
    for runs in ([], [failing_prime_pi[0]], [(failing_prime_pi[0],)], "report", [({}, [])]):
        with pytest.raises(InvalidInputError):
            report.write_html(runs, tmp_path / "x.html")


# -- what the plots show ------------------------------------------------------------ #

def test_differences_are_candidate_minus_an_independent_count(failing_prime_pi):
    summary, records = failing_prime_pi
    from oracle.demo.brindle.counting import prime_pi as candidate

    points = _plot_data.differences(records)
    assert len(points) > 300
    for point in points[:: max(1, len(points) // 60)]:
        assert point.difference == candidate(point.x) - primecountpy.prime_pi(point.x)
        assert point.failed == (point.difference != 0)
    at_divergence = next(point for point in points if point.x == 2**20)
    assert at_divergence.difference == 16489 - 82025                      # OEIS A007053
    assert _plot_data.divergence_input(summary) == 2**20


def test_envelope_holds_the_true_count_and_spans_the_inputs(failing_prime_pi):
    _, records = failing_prime_pi
    points = _plot_data.envelope("prime_pi", records)
    assert 10 <= len(points) <= _plot_data.ENVELOPE_POINTS
    for point in points:
        true = primecountpy.prime_pi(point.x)
        assert point.exact and point.reference == true
        assert point.lower <= true <= point.upper
    assert any(point.failed and not point.lower <= point.got <= point.upper for point in points)
    assert min(point.x for point in points) < 10**3 and max(point.x for point in points) > 10**6


def test_statuses_place_each_check_at_its_largest_argument(failing_is_prime):
    _, records = failing_is_prime
    points = _plot_data.statuses(records)
    checks = [r for r in records if r["type"] == "check" and max(r["arguments"]) >= 1]
    assert len(points) == len(checks)
    assert sorted(p.size for p in points if p.status == "wrong") == \
        sorted(max(r["arguments"]) for r in checks if r["status"] == "wrong")


def test_spread_keeps_first_last_and_at_most_the_limit():
    items = list(range(1000))
    kept = _plot_data.spread(items, 7)
    assert len(kept) == 7 and kept[0] == 0 and kept[-1] == 999
    assert all(166 <= later - earlier <= 167 for earlier, later in zip(kept, kept[1:]))
    assert _plot_data.spread(items[:5], 7) == items[:5] and _plot_data.spread(items, 0) == []


def test_huge_answers_are_drawn_at_the_plot_limit():
    assert _plot_data.as_float(10**400) == _plot_data.PLOT_LIMIT
    assert _plot_data.as_float(-(10**400)) == -_plot_data.PLOT_LIMIT
    assert _plot_data.as_float(2**64) == 18446744073709551616.0


# -- JSON ------------------------------------------------------------------------- #

def test_json_round_trips_a_list_with_the_documented_keys_in_order(
        tmp_path, failing_prime_pi, passing_nth_prime):
    summaries = [failing_prime_pi[0], passing_nth_prime[0]]
    path = tmp_path / "out" / "summary.json"
    report.write_json(summaries, path)
    loaded = json.loads(path.read_text(encoding="utf-8"))
    assert loaded == json.loads(json.dumps(summaries))
    for summary in loaded:
        assert tuple(summary)[:len(report.SUMMARY_KEYS)] == report.SUMMARY_KEYS
        assert set(summary) - set(report.SUMMARY_KEYS) <= set(report.OPTIONAL_KEYS)
    first = loaded[0]["failures"][0]
    assert type(first["arguments"][0]) is int and first["expected"] == 82025   # OEIS A007053


def test_json_of_one_audit_is_one_object(tmp_path, passing_nth_prime):
    path = tmp_path / "one.json"
    report.write_json(passing_nth_prime[0], path)
    loaded = json.loads(path.read_text(encoding="utf-8"))
    assert isinstance(loaded, dict) and loaded["passed"] is True and loaded["failures"] == []


def test_json_keeps_integers_beyond_64_bits_exact(tmp_path, passing_nth_prime):
    summary = dict(passing_nth_prime[0], seed=2**130 + 1)
    path = tmp_path / "big.json"
    report.write_json(summary, path)
    assert json.loads(path.read_text(encoding="utf-8"))["seed"] == 2**130 + 1


def test_every_summary_key_is_documented():
    for key in report.SUMMARY_KEYS + report.OPTIONAL_KEYS:
        assert f"``{key}``\n" in _json.__doc__


def test_json_refuses_what_is_not_a_summary(tmp_path, passing_nth_prime):
    incomplete = {key: value for key, value in passing_nth_prime[0].items() if key != "seed"}
    for bad in (incomplete, [incomplete], "summary", 3):
        with pytest.raises(InvalidInputError):
            report.write_json(bad, tmp_path / "bad.json")


# -- the terminal ------------------------------------------------------------------- #

class TerminalStream(io.StringIO):
    """A stream that says it is a terminal."""

    def isatty(self):
        return True


ANSI = re.compile(r"\x1b\[")


def test_summary_table_on_a_pipe_is_plain_text(failing_prime_pi, passing_nth_prime):
    stream = io.StringIO()
    report.summary_table([failing_prime_pi[0], passing_nth_prime[0]], stream)
    text = stream.getvalue()
    assert not ANSI.search(text)
    summary = failing_prime_pi[0]
    row = next(line for line in text.splitlines() if line.strip().startswith("prime_pi"))
    assert re.search(rf"prime_pi\s+7\s+{summary['checks']}\s+{summary['passed_checks']}\s+"
                     rf"{len(summary['failures'])}\s+\d+\s+first divergence 1048576", row)
    assert "FAILED" in row
    assert "PASSED" in next(line for line in text.splitlines() if "nth_prime" in line)
    assert "not a proof of primality" in text


def test_summary_table_colours_a_terminal_unless_no_color(failing_prime_pi, monkeypatch):
    monkeypatch.delenv("NO_COLOR", raising=False)
    coloured = TerminalStream()
    report.summary_table(failing_prime_pi[0], coloured)
    assert ANSI.search(coloured.getvalue())
    monkeypatch.setenv("NO_COLOR", "1")
    plain = TerminalStream()
    report.summary_table(failing_prime_pi[0], plain)
    assert not ANSI.search(plain.getvalue()) and "FAILED" in plain.getvalue()


def test_a_candidates_markup_is_not_interpreted_by_the_table(hostile_run):
    stream = io.StringIO()
    summary = dict(hostile_run[0], role="[bold]prime_pi[/bold]")
    report.summary_table(summary, stream, colour=True)
    assert "[bold]prime_pi[/bold]" in stream.getvalue()


def test_quiet_mode_prints_nothing_but_the_summary(failing_prime_pi):
    alone = io.StringIO()
    report.summary_table(failing_prime_pi[0], alone)
    stream = io.StringIO()
    with report.Progress(total=50, description="prime_pi", quiet=True, stream=stream,
                         live=True, delay=0) as progress:
        for _ in range(50):
            progress.advance()
    assert stream.getvalue() == "" and progress.completed == 50
    report.summary_table(failing_prime_pi[0], stream)
    assert stream.getvalue() == alone.getvalue()


def test_progress_draws_count_and_remaining_time_when_live():
    stream = io.StringIO()
    with report.Progress(total=None, description="twin_pi", stream=stream, live=True,
                         delay=0) as progress:
        progress.set_total(40)
        for _ in range(40):
            progress.observe({"type": "check"})
        progress.observe({"type": "divergence"})
    text = stream.getvalue()
    assert "twin_pi" in text and "40/40" in text and "remaining" in text
    assert progress.completed == 40


def test_progress_is_silent_on_a_pipe_and_before_its_delay():
    piped = io.StringIO()
    with report.Progress(total=5, stream=piped, delay=0) as progress:
        progress.advance(5)
    early = TerminalStream()
    with report.Progress(total=5, stream=early, delay=3600) as progress:
        progress.advance(5)
    assert piped.getvalue() == "" and early.getvalue() == ""


@pytest.mark.parametrize("arguments", [dict(total=-1), dict(total=2.5), dict(delay=-1),
                                       dict(delay="1")])
def test_progress_refuses_bad_arguments(arguments):
    with pytest.raises(InvalidInputError):
        report.Progress(**arguments)


def test_progress_refuses_a_bad_step():
    with report.Progress(total=3, quiet=True) as progress, pytest.raises(InvalidInputError):
        progress.advance(1.5)


# -- the command that repeats a run ------------------------------------------------- #

def test_reproduce_command_is_understood_by_the_audit_command(failing_prime_pi):
    start = failing_prime_pi[1][0]
    command = report.reproduce_command(start)
    parsed = build_parser().parse_args(shlex.split(command)[1:])
    assert parsed.command == "audit" and parsed.target == SCENARIO.entry("prime_pi").target
    assert (parsed.role, parsed.profile, parsed.seed, parsed.maximum) == \
        ("prime_pi", "quick", 7, str(2**24))   # --seed is read as an integer
    assert parsed.timeout == 5.0              # the quick profile's timeout, as recorded


def test_reproduce_command_of_an_executable_with_conventions():
    start = {"target": "./my_primes --fast", "role": "primes_in", "profile": "ci", "seed": 5,
             "timeout": 2.5, "maximum": None, "isolated": True,
             "conventions": {"primes_range": "half-open", "factor_shape": "any",
                             "invalid_input": "raise"}}
    command = report.reproduce_command(start)
    assert command == ("ntoracle audit --exec './my_primes --fast' --role primes_in --profile ci "
                       "--seed 5 --timeout 2.5 --invalid-input raise --half-open")
    parsed = build_parser().parse_args(shlex.split(command)[1:])
    assert parsed.exec_command == "./my_primes --fast" and parsed.half_open


# -- a run without a verdict is not said to have failed (issue 11) ------------ #

def _without_end(records):
    """The records of a run cut before its end record (a torn or killed run)."""
    return [record for record in records if record.get("type") != "end"]


def test_a_run_without_a_verdict_is_never_called_failed(passing_nth_prime, failing_prime_pi):
    from oracle.report._describe import verdict_of

    records = _without_end(passing_nth_prime[1])
    summary = engine.summarise(records)
    assert summary["verdict"] == "no verdict" and not summary["passed"] and not summary["failures"]
    assert verdict_of(summary) == "no verdict"
    assert verdict_of(engine.summarise(_without_end(failing_prime_pi[1]))) == "failed"  # findings stay
    assert verdict_of(failing_prime_pi[0]) == "failed" and verdict_of(passing_nth_prime[0]) == "passed"
    assert verdict_of(engine.summarise([])) == "no verdict"               # no check at all
    stream = io.StringIO()
    report.summary_table(summary, stream, colour=False)
    row = next(line for line in stream.getvalue().splitlines() if line.strip().startswith("nth_prime"))
    assert "NO VERDICT" in row and "FAILED" not in row
    page = render_html([(summary, records), failing_prime_pi])
    assert "1 audit(s)" not in page and "0 without findings, 1 with findings, 1 without a verdict" in page
    section = page[page.index('<section id="run-0">'):page.index('<section id="run-1">')]
    assert '<span class="no-verdict">no verdict</span>' in section and "failed</span>" not in section
    assert "interrupted before its end" in section
    parse(page)                                                            # still well formed


def test_an_early_stopped_failed_run_is_partial_not_interrupted(failing_prime_pi):
    summary, records = failing_prime_pi
    cut = dict(summary, complete=False, not_run=3)
    section = render_html([(cut, records)])
    assert "not every point was run" in section and "interrupted before its end" not in section


# -- candidate-controlled text is bounded in records and reports (issue 11) ---------- #

HUGE_STRING = "<b>" + "y" * (10 * 2**20)             # 10 MiB and 3 characters of markup
TEN_MILLION = list(range(10**7))
LINE_LIMIT = 64 * 2**10


def huge_integer_prime_pi(x):
    return 10**100000 + x                             # 100,001 decimal digits, by definition


def huge_string_is_prime(n):
    return HUGE_STRING


def huge_listing_primes_in(a, b):
    return TEN_MILLION


def huge_message_prime_pi(x):
    raise ValueError("<i>" + "boom" * 2**20)


def bounded_run(function, role, path, description):
    target = targets.InProcessTarget(function, timeout=30.0, description=description)
    try:
        summary = engine.run_audit(target, engine.AuditOptions(
            role=role, profile="quick", seed=3, maximum=50, stream=str(path), stop_after=2,
            time_budget=600.0))       # a loaded machine must not cut the run before 2 findings
    finally:
        target.close()
    return summary, engine.read_records(path)


@pytest.mark.parametrize("function, role, shown", [
    (huge_integer_prime_pi, "prime_pi", "an integer of 100001 digits"),
    (huge_string_is_prime, "is_prime", f"... ({len(HUGE_STRING)} characters)"),
    (huge_listing_primes_in, "primes_in", " of 10000000 items)"),
    (huge_message_prime_pi, "prime_pi", "ValueError: &lt;i&gt;boomboom"),
])
def test_huge_answers_and_messages_give_bounded_records_and_cut_reports(tmp_path, function, role,
                                                                        shown):
    description = "huge:" + "<u>" * 100_000                   # a long name with markup
    summary, records = bounded_run(function, role, tmp_path / "run.jsonl", description)
    assert summary["verdict"] == "failed" and len(summary["failures"]) >= 2
    lines = (tmp_path / "run.jsonl").read_bytes().splitlines()
    assert lines and max(len(line) for line in lines) < LINE_LIMIT
    assert len(records[0]["target"]) < 2100 and records[0]["target"].startswith("huge:<u><u>")
    report.write_json(summary, tmp_path / "summary.json")
    assert all(len(line) < LINE_LIMIT for line in (tmp_path / "summary.json").read_bytes().splitlines())
    page = render_html([(summary, records)], command="ntoracle audit huge")
    assert "<u>" not in page and "<b>y" not in page and "<i>boom" not in page  # escaped
    assert shown in page and len(page) < 2 * 2**20
    stream = io.StringIO()
    report.summary_table(summary, stream, colour=False)
    assert len(stream.getvalue()) < 20_000


def test_huge_integer_answer_is_wrong_and_described_by_its_digits(tmp_path):
    summary, records = bounded_run(huge_integer_prime_pi, "prime_pi", tmp_path / "r.jsonl", "huge")
    failure = summary["failures"][0]
    assert (failure["status"], failure["check"]) == ("wrong", "size")
    assert failure["got"] == "an integer of 100001 digits"
    assert summary["first_divergence"]["got"] == "an integer of 100001 digits"


def test_huge_listing_is_cut_in_the_record_but_localised_on_the_whole_answer(tmp_path):
    summary, records = bounded_run(huge_listing_primes_in, "primes_in", tmp_path / "r.jsonl", "huge")
    failure = summary["failures"][0]
    got = failure["got"]
    assert got[:3] == [0, 1, 2] and got[-1].endswith("(10000000 in all)")
    kept = len(got) - 1
    assert got[-1] == f"... and {10**7 - kept} more (10000000 in all)"
    divergence = summary["first_divergence"]                  # 0 is listed, and 0 is not prime
    assert divergence["kind"] == "first extra prime" and divergence["prime"] == 0


def test_digit_counts_from_the_bit_length_agree_with_the_decimal_text():
    import random

    from oracle._bounded import describe_integer, integer_digits

    rng = random.Random(11)
    numbers = [0, 1, 9, 10, 99, 100, -1, -10]
    for k in range(1, 4200, 37):
        numbers += [10**k - 1, 10**k, 10**k + 1, -(10**k), rng.randrange(10**k), 2**k, 2**k - 1]
    for number in numbers:
        assert integer_digits(number) == len(str(abs(number))), number   # str: under 4300 digits
    assert describe_integer(10**100000) == "an integer of 100001 digits"
    assert describe_integer(-(10**99999) + 1) == "a negative integer of 99999 digits"


def test_bounded_text_and_values_never_raise_and_stay_within_their_limits():
    from oracle._bounded import TEXT_LIMIT, VALUE_LIMIT, bounded_text, bounded_value
    from oracle.engine._records import jsonable

    class Hostile:
        def __repr__(self):
            raise RuntimeError("no repr for you")

    assert bounded_text(Hostile()) == "<Hostile object>"
    assert bounded_text([10**5000, Hostile()]) == "[<an integer of 5001 digits>, <Hostile object>]"
    assert bounded_text("x" * 5000, 10) == "xxxxxxxxxx... (5000 characters)"
    assert bounded_text(bounded_text("x" * 5000, 100), 10) == "xxxxxxxxxx... (5000 characters)"
    assert len(bounded_text(list(range(10**6)))) <= TEXT_LIMIT + 3
    nested = [[10**4100 + i for i in range(100)] for _ in range(100)]
    kept = json.dumps(bounded_value(nested))
    assert len(kept) < VALUE_LIMIT + 5000                       # 4 integers of 4101 digits
    assert kept.endswith('"... and 96 more (100 in all)"], "... and 99 more (100 in all)"]')
    assert bounded_value({2: 3, 5: 1}) == {"2": 3, "5": 1}       # a factorisation's primes as keys
    assert bounded_value((1, 2.5, None, True)) == [1, "2.5", None, True]
    assert jsonable(2**64 + 13) == 2**64 + 13             # exact, as the JSON report promises


def test_bounded_text_and_values_read_an_int_subclass_and_survive_any_base_exception():
    from oracle._bounded import bounded_text, bounded_value

    class TwoFaced(int):            # holds 97; its own methods raise or say otherwise
        def __int__(self):
            raise RuntimeError("no int for you")

        def __abs__(self):
            return 10**5000

    class Skipping:                 # a repr raising a BaseException (as pytest's skip does)
        def __repr__(self):
            raise SystemExit(0)

    assert bounded_text(TwoFaced(97)) == "97" and bounded_value(TwoFaced(97)) == 97
    assert bounded_text(Skipping()) == "<Skipping object>"
    assert bounded_value([Skipping()]) == ["<Skipping object>"]
