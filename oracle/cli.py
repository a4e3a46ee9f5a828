"""The ``ntoracle`` command line.

Exit codes (README, docs/DESIGN.md): 0 success; 1 a candidate failed a check; 2 usage,
configuration or input error; 3 the oracle cannot answer exactly and says what
it can prove instead; 4 an internal error; 5 no verdict (an audit that
completed no check, or a results file without an ``end`` record); 130 an
interrupted audit (its summary so far is printed, its findings are saved).  Integers are parsed without ``eval``
(:func:`oracle._integers.parse_integer`).
"""

from __future__ import annotations

import argparse
import json
import os
import signal
import sys
import time

from ._errors import InvalidInputError, OracleError, OutOfReachError
from ._integers import parse_integer
from ._options import (MAX_SEED, check_output_file, check_output_folder, integer_option,
                       memory_option, remove_folders, seconds_option)

EXIT_OK, EXIT_FAILED, EXIT_USAGE, EXIT_OUT_OF_REACH, EXIT_INTERNAL, EXIT_NO_VERDICT = 0, 1, 2, 3, 4, 5
EXIT_INTERRUPTED = 130

#: ``ntoracle value`` answers the roles under their own names, and the short names of the facade.
VALUE_FUNCTIONS = ("prime_pi", "twin_pi", "nth_prime", "is_prime", "next_prime", "prev_prime",
                   "factor", "primes_in", "mobius", "totient", "divisor_count", "divisor_sum",
                   "prime_sum", "mertens", "squarefree_count",
                   "pi", "triplets_026", "triplets_046", "quadruplets")
# The facade's name of each role's question, where it differs from the role's name.
_FACADE_NAMES = {"prime_pi": "pi", "primes_in": "primes", "factor": "factorization"}
# Most primes ``value primes_in`` prints as text (--json prints every one).
_LISTED_PRIMES = 1000
BOUND_FUNCTIONS = ("pi", "nth_prime", "twin_pi")

CAUTION = ("Cautions: a 'probable' verdict (Baillie-PSW) is not a proof of primality; "
           "agreement with this oracle is evidence, not a certificate; for cryptographic use "
           "defer to the published standards and a vetted library.")


class _ArgumentParser(argparse.ArgumentParser):
    """argparse, with usage errors as one line and exit code 2."""

    def error(self, message: str):
        self.exit(EXIT_USAGE, f"{self.prog}: error: {message} (try: {self.prog} --help)\n")


def build_parser() -> argparse.ArgumentParser:
    parser = _ArgumentParser(prog="ntoracle", description=(
        "A reference oracle of exact prime counts and proven bounds, for testing "
        "number-theory code."), epilog=CAUTION)
    parser.add_argument("--version", action="version", version=_version())
    parser.add_argument("--no-store", action="store_true", help=_NO_STORE_HELP)
    commands = parser.add_subparsers(dest="command", metavar="COMMAND", parser_class=_ArgumentParser)

    value = commands.add_parser("value", help="an exact value with its provenance",
                                description="Print an exact value and how it was obtained.")
    value.add_argument("function", choices=VALUE_FUNCTIONS, metavar="FUNC",
                       help="one of: " + ", ".join(VALUE_FUNCTIONS)
                            + " (pi is prime_pi; primes_in takes A B, the primes of [A, B])")
    value.add_argument("n", metavar="N", nargs="+",
                       help="an integer: 123, 1_000, 10**14, 2**64-1, 1e12")
    value.add_argument("--json", action="store_true", help="print one JSON object")
    value.add_argument("--budget", type=seconds_option("--budget"), default=None, metavar="SECONDS",
                       help="refuse (exit 3) rather than compute longer than this")

    bounds = commands.add_parser("bounds", help="a proven interval with its theorems",
                                 description="Print the tightest proven interval and its sources.")
    bounds.add_argument("function", choices=BOUND_FUNCTIONS, metavar="FUNC",
                        help="one of: " + ", ".join(BOUND_FUNCTIONS))
    bounds.add_argument("n", metavar="N", help="an integer: 10**30, 2**80, ...")
    bounds.add_argument("--json", action="store_true", help="print one JSON object")

    demo = commands.add_parser(
        "demo", help="audit the bundled legacy library (an invented scenario) and write a report",
        description="Audit every routine of the bundled 'brindle' library (the invented "
                    "Brindlewick observatory's) with the ci profile, print the findings and first "
                    "divergences, and write HTML and JSON reports. Exit 0 when the audit finds "
                    "exactly the defects the scenario documents.")
    demo.add_argument("--seed", type=integer_option("--seed", 0, MAX_SEED), default=None, metavar="N",
                      help="sampling seed (default 1987)")
    demo.add_argument("--report", default="ntoracle-report", metavar="DIR",
                      help="folder for report.html, audit.json and the results (default ./ntoracle-report)")
    demo.add_argument("--quiet", action="store_true", help="print only the summary table")

    commands.add_parser("tour", help="the oracle answers a handful of questions, with provenance",
                        description="Ask the oracle a handful of questions and show each "
                                    "answer with its provenance.")
    _add_audit_parser(commands)
    _add_replay_parser(commands)
    _add_judge_table_parser(commands)
    store = commands.add_parser(
        "store", help="show or clear the answers kept between runs",
        description="The oracle keeps answers that took long to compute in an SQLite file in "
                    "the user's cache folder (NTORACLE_STORE=off or --no-store disables it; "
                    "NTORACLE_STORE=DIR moves it).  'show' prints its size and entries, "
                    "'clear' deletes them.")
    store.add_argument("action", choices=("show", "clear"), help="show | clear")
    store.add_argument("--json", action="store_true", help="print one JSON object")
    for command in (value, commands.choices["audit"], commands.choices["replay"],
                    commands.choices["judge-table"]):
        command.add_argument("--no-store", action="store_true", default=argparse.SUPPRESS,
                             help=_NO_STORE_HELP)
    return parser


_NO_STORE_HELP = ("neither read nor keep answers in the on-disk store of slow answers "
                  "(the same as NTORACLE_STORE=off)")


ROLE_NAMES = ("prime_pi", "twin_pi", "nth_prime", "is_prime", "next_prime", "prev_prime",
              "primes_in", "factor")
ROLE_NAMES += ("prime_sum", "prime_pi_mod", "mertens", "squarefree_count", "triplet_pi_026",
               "triplet_pi_046", "quadruplet_pi")
ROLE_NAMES += ("mobius", "totient", "divisor_count", "divisor_sum")
PROFILE_NAMES = ("quick", "ci", "deep", "exhaustive")


def _add_target_options(command) -> None:
    command.add_argument("--role", choices=ROLE_NAMES, metavar="ROLE",
                         help="what the target computes: " + ", ".join(ROLE_NAMES)
                              + " (inferred from the function name when unambiguous)")
    command.add_argument("--timeout", type=seconds_option("--timeout"), default=None, metavar="SECONDS",
                         help="per-call limit; a call past it is 'hung' (a finding) or, at the top of the "
                              "candidate's reach after calls that grew slower, 'too slow' (the end of "
                              "its reach; a finding only with --slow-fails)")
    command.add_argument("--in-process", action="store_true",
                         help="call a Python target in this process: faster, but it then shares "
                              "the harness's memory and can change the verdict; only for code "
                              "you trust (default: an isolated child process)")
    command.add_argument("--isolate", action="store_true",
                         help="the default for Python targets (kept for old command lines)")
    command.add_argument("--memory-limit", type=memory_option(), default=4096, metavar="MIB",
                         help="address-space limit of an isolated target (default 4096 MiB)")
    command.add_argument("--half-open", action="store_true",
                         help="primes_in(a, b) lists the primes of [a, b) instead of [a, b]")
    command.add_argument("--factor-shape", choices=("any", "mapping", "flat", "pairs"), default="any",
                         help="the shape factor(n) must return (default: any of the three)")
    command.add_argument("--invalid-input", choices=("unchecked", "raise"), default="unchecked",
                         help="'raise': an input outside the domain must raise (or answer 'error')")


def _add_audit_parser(commands) -> None:
    audit = commands.add_parser(
        "audit", help="audit a candidate implementation against the oracle",
        description="Check a candidate at sampled points (tables, boundaries, adversarial "
                    "families, seeded random points), contain its faults, and localise the "
                    "first divergence.  Exit 0 all checks passed, 1 a check failed, 5 no verdict "
                    "(no check completed), 130 interrupted (findings saved).",
        epilog=CAUTION)
    audit.add_argument("target", nargs="?", metavar="TARGET",
                       help="a Python callable, package.module:function")
    audit.add_argument("--exec", dest="exec_command", metavar="CMD",
                       help="an executable speaking the line protocol, e.g. \"./my_pi --fast\"")
    _add_target_options(audit)
    audit.add_argument("--profile", choices=PROFILE_NAMES, default="ci", metavar="PROFILE",
                       help="quick | ci (default) | deep | exhaustive")
    audit.add_argument("--seed", type=integer_option("--seed", 0, MAX_SEED), metavar="N",
                       help="seed of the random points (printed by every run)")
    audit.add_argument("--max", dest="maximum", metavar="N",
                       help="the largest input the target claims to handle; checks above are skipped")
    audit.add_argument("--json", dest="json_file", metavar="FILE", help="write the summary as JSON")
    audit.add_argument("--quiet", action="store_true",
                       help="for CI logs: no progress display, only the verdict and first divergence")
    audit.add_argument("--report", metavar="DIR", help="write summary.json and report.txt into DIR")
    audit.add_argument("--stream", metavar="FILE", default=None,
                       help="JSON-lines file of results, written as they happen (default: a new "
                            "file under .ntoracle/runs/, linked from .ntoracle/last-audit.jsonl)")
    audit.add_argument("--stop-after", metavar="N", default=None,
                       help="stop asking after N findings (default: the profile's enough_findings)")
    audit.add_argument("--no-early-stop", action="store_true",
                       help="ask every point however many checks fail")
    audit.add_argument("--slow-fails", action="store_true",
                       help="a call too slow at the top of the candidate's reach is a failure "
                            "(default: it ends the reach, and a hang is still a failure)")
    audit.add_argument("--corpus", metavar="FILE", default=os.path.join(".ntoracle", "regressions.yaml"),
                       help="regression corpus, replayed first and extended with new failures "
                            "(default .ntoracle/regressions.yaml)")
    audit.add_argument("--no-corpus", action="store_true", help="neither replay nor record regressions")
    audit.add_argument("--summary-from", metavar="FILE",
                       help="do not audit: rebuild and print the summary of a (possibly "
                            "interrupted) run from its JSON-lines file")


def _add_replay_parser(commands) -> None:
    replay = commands.add_parser(
        "replay", help="re-run recorded failures",
        description="Ask again every input of a regression corpus (YAML) or of the failures in a "
                    "results file (JSON lines).  The Python target recorded with each failure is "
                    "used unless TARGET or --exec is given; a recorded executable is never run: "
                    "its entries are replayed only against an --exec given now.  Exit 0 when "
                    "all pass now, 1 otherwise, 5 when nothing could be replayed.",
        epilog=CAUTION)
    replay.add_argument("file", metavar="FILE", help=".ntoracle/regressions.yaml or a .jsonl results file")
    replay.add_argument("target", nargs="?", metavar="TARGET", help="package.module:function")
    replay.add_argument("--exec", dest="exec_command", metavar="CMD", help="an executable target")
    replay.add_argument("--json", dest="json_file", metavar="FILE", help="write the summaries as JSON")
    _add_target_options(replay)
    for action in replay._actions:
        if action.dest == "role":
            action.help = "replay only the entries of this role"


def _add_judge_table_parser(commands) -> None:
    table = commands.add_parser(
        "judge-table", help="judge a file of claimed values (CSV, JSON lines, YAML) row by row",
        description="Judge every row of a table of claimed values -- function (prime_pi, "
                    "twin_pi, nth_prime, is_prime, next_prime, prev_prime, factor), argument, "
                    "claimed value -- without running anything: exact where the oracle reaches, "
                    "beyond it the proven interval, and between neighbouring prime_pi or "
                    "twin_pi rows monotonicity and the exact count of the short interval "
                    "between them.  Unreadable rows are reported with their line; the rest are "
                    "judged.  Exit 0 no row refuted and none unreadable, 1 a row refuted or "
                    "two neighbours in conflict, 2 a usage error, an unreadable file or "
                    "unreadable rows (none refuted), 5 no row at all.",
        epilog=CAUTION)
    table.add_argument("file", metavar="FILE", help="a .csv, .jsonl or .yaml table of claims")
    table.add_argument("--format", choices=("csv", "jsonl", "yaml"), default=None,
                       help="the file's format (default: from its name)")
    table.add_argument("--budget", type=seconds_option("--budget"), default=None, metavar="SECONDS",
                       help="longest computation of one exact value (default 20); beyond it the "
                            "row is judged by the proven interval and its neighbours")
    table.add_argument("--json", dest="json_file", metavar="FILE", help="write the summary as JSON")
    table.add_argument("--report", metavar="DIR",
                       help="write summary.json, report.txt and report.html into DIR")
    table.add_argument("--quiet", action="store_true", help="print only the verdict and the findings")


def main(argv: list[str] | None = None) -> int:
    parser = build_parser()
    arguments = parser.parse_args(argv)
    if arguments.command is None:
        parser.print_help()
        return EXIT_USAGE
    if arguments.no_store:
        os.environ["NTORACLE_STORE"] = "off"       # child processes inherit the choice
    handler = {"value": _value, "bounds": _bounds, "demo": _demo, "tour": _tour, "audit": _audit,
               "replay": _replay, "store": _store,
               "judge-table": _judge_table}[arguments.command]
    stdout, sys.stdout = sys.stdout, _OutputMayClose(sys.stdout)
    terminate = _terminate_as_interrupt()
    try:
        return handler(arguments)
    except OutOfReachError as error:
        print(f"ntoracle: out of exact reach: {error}", file=sys.stderr)
        return EXIT_OUT_OF_REACH
    except OracleError as error:
        print(f"ntoracle: error: {error}", file=sys.stderr)
        return EXIT_USAGE
    except KeyboardInterrupt:
        print("ntoracle: interrupted", file=sys.stderr)
        return 130
    except BrokenPipeError:
        return EXIT_OK
    except Exception as error:  # a bug of ours: say so in one line, keep the trace on request
        if os.environ.get("NTORACLE_DEBUG"):
            raise
        print(f"ntoracle: internal error: {type(error).__name__}: {error} "
              f"(set NTORACLE_DEBUG=1 for the traceback, and please report it)", file=sys.stderr)
        return EXIT_INTERNAL
    finally:
        sys.stdout = stdout
        if terminate is not None:
            signal.signal(signal.SIGTERM, terminate)


def _terminate_as_interrupt():
    """Make ``SIGTERM`` (a CI job cancelled, ``timeout``, or a candidate signalling the harness)
    end a run as Ctrl-C does -- the summary so far printed, the findings saved, exit 130 --
    instead of killing it with its findings unsaved.  Returns the previous handler (``None``
    outside the main thread, where nothing is installed)."""
    import threading

    if threading.current_thread() is not threading.main_thread():
        return None

    def interrupt(signum, frame):
        signal.raise_signal(signal.SIGINT)      # through the SIGINT handler of the moment

    previous = signal.signal(signal.SIGTERM, interrupt)
    return previous if previous is not None else signal.SIG_DFL


class _OutputMayClose:
    """Standard output whose reader may go away (``ntoracle audit ... | head``): the run goes on
    to its end, its later output dropped, so that the exit code is still the verdict's -- a
    broken pipe ended the run with 0 before, a pass that a failed audit had not earned."""

    def __init__(self, stream):
        self._stream, self._gone = stream, False

    def write(self, text: str) -> int:
        if not self._gone:
            try:
                return self._stream.write(text)
            except BrokenPipeError:
                self._close()
        return len(text)

    def flush(self) -> None:
        if not self._gone:
            try:
                self._stream.flush()
            except BrokenPipeError:
                self._close()

    def _close(self) -> None:
        self._gone = True
        try:        # the interpreter flushes stdout once more at exit: let that go nowhere
            devnull = os.open(os.devnull, os.O_WRONLY)
            os.dup2(devnull, self._stream.fileno())
            os.close(devnull)
        except (OSError, ValueError, AttributeError):
            pass

    def __getattr__(self, name: str):
        return getattr(self._stream, name)


_PROGRESS_STEPS = 1000


def _value(arguments) -> int:
    from . import facade

    function = _FACADE_NAMES.get(arguments.function, arguments.function)
    arity = facade.FUNCTIONS[function]
    if len(arguments.n) != arity:
        raise InvalidInputError(f"value {arguments.function} takes {arity} integer(s), "
                                f"got {len(arguments.n)}")
    numbers = [parse_integer(text) for text in arguments.n]
    call = f"{arguments.function}({', '.join(map(str, numbers))})"
    if arguments.budget is not None and not arguments.budget > 0:
        raise InvalidInputError(f"--budget {arguments.budget}: must be a positive number of seconds")
    import contextlib

    with contextlib.ExitStack() as stack:
        shown = []                  # the progress bar, opened (rich imported) on the first report

        def progress(fraction: float, stage: str) -> None:
            if not shown:
                from . import report

                shown.append(stack.enter_context(report.Progress(
                    total=_PROGRESS_STEPS, description=call)))
            shown[0].advance(max(0, round(fraction * _PROGRESS_STEPS) - shown[0].completed))

        options = {"progress": progress} if function in ("pi", "nth_prime") else {}
        if function not in ("is_prime", "next_prime", "prev_prime", "primes"):
            options["budget"] = arguments.budget
        try:
            result = facade.answer(function, *numbers, **options)
        except OutOfReachError as error:
            if function != "factorization" and function not in facade.MULTIPLICATIVE:
                raise
            raise OutOfReachError(str(error).replace("factorization(", "factor(", 1)
                                  + "; a larger --budget may reach it") from None
    if arguments.json:
        answer = result.as_dict()
        answer["function"] = arguments.function
        print(json.dumps(answer))
    else:
        print(f"{call} = {_value_text(function, result.value)}    [{result.provenance}]")
        if "probable" in result.provenance:
            print("note: 'probable' means Baillie-PSW: not a proof of primality.")
    return EXIT_OK


def _value_text(function: str, value) -> str:
    """An answer of ``value`` as text: a factorisation as p^e * q, a long list of primes cut."""
    if function == "factorization":
        return " * ".join(f"{p}^{e}" if e > 1 else str(p) for p, e in value) or "1 (no prime factor)"
    if function == "primes":
        shown = ", ".join(map(str, value[:_LISTED_PRIMES]))
        if len(value) > _LISTED_PRIMES:
            shown += f", ... {len(value) - _LISTED_PRIMES} more ({len(value)} primes; --json lists all)"
        return f"[{shown}]"
    return _show(value)


def _bounds(arguments) -> int:
    from . import bounds

    n = parse_integer(arguments.n)
    interval = getattr(bounds, arguments.function)(n)
    if arguments.json:
        print(json.dumps({"function": arguments.function, "n": n, "lower": interval.lower,
                          "upper": interval.upper, "theorems": list(interval.theorems)}))
        return EXIT_OK
    lower = "?" if interval.lower is None else str(interval.lower)
    upper = "?" if interval.upper is None else str(interval.upper)
    print(f"{lower} <= {arguments.function}({n}) <= {upper}")
    for side, ids in (("lower", interval.lower_ids), ("upper", interval.upper_ids)):
        for theorem in ids:
            entry = bounds.entry(theorem)
            print(f"  {side}: {theorem}: {entry.statement}  -- {entry.source}")
    return EXIT_OK


_TOUR = (
    ("pi", 10**6, "a published value (OEIS A006880)"),
    ("pi", 10**11 + 5, "a published value corrected by a short sieve"),
    ("pi", 2**32 + 1, "straddles 2**32, where 32-bit counters wrap"),
    ("twin_pi", 10**9, "twin pairs (p, p + 2) with p + 2 <= x"),
    ("quadruplets", 10**8, "prime quadruplets (p, p+2, p+6, p+8) up to 10**8"),
    ("nth_prime", 10**6, "the millionth prime"),
    ("is_prime", 3215031751, "a strong pseudoprime to bases 2, 3, 5 and 7 (OEIS A014233)"),
    ("is_prime", 2**89 - 1, "a Mersenne prime, above the proven range: Baillie-PSW"),
    ("next_prime", 2**64, "the first prime above 2**64 (12 Miller-Rabin bases prove it)"),
    ("prev_prime", 2**64, "the largest prime below 2**64"),
)


def _demo(arguments) -> int:
    from .demo import DEMO_SEED, run_demo

    seed = arguments.seed if arguments.seed is not None else DEMO_SEED
    if seed < 0:
        raise InvalidInputError(f"--seed {seed}: must be >= 0")
    _check_outputs(report=arguments.report, runs=False)
    return run_demo(arguments.report, seed=seed, quiet=arguments.quiet)


def _tour(arguments) -> int:
    from . import facade
    from .exact import sieve

    print("ntoracle tour: the oracle answers a handful of questions, each with its provenance.")
    print(f"sieve engine: {sieve.active_engine()}\n")
    for function, n, comment in _TOUR:
        started = time.perf_counter()
        result = facade.answer(function, n)
        elapsed = time.perf_counter() - started
        print(f"  {function}({n}) = {_show(result.value)}")
        print(f"      [{result.provenance}]  {comment}  ({elapsed:.2f} s)")
    print(f"\n{CAUTION}")
    return EXIT_OK


def _conventions(arguments):
    from .roles import Conventions

    return Conventions(primes_range="half-open" if arguments.half_open else "closed",
                       factor_shape=arguments.factor_shape, invalid_input=arguments.invalid_input)


def _make_target(spec, command, role, arguments):
    from . import targets

    timeout = arguments.timeout
    if timeout is not None and not timeout > 0:
        raise InvalidInputError(f"--timeout {timeout}: must be a positive number of seconds")
    if not arguments.memory_limit > 0:
        raise InvalidInputError(f"--memory-limit {arguments.memory_limit}: must be positive")
    memory = arguments.memory_limit * 2**20
    if command is not None:
        return targets.exec_target(command, role_name=role, timeout=timeout or 1.0,
                                   memory_limit=memory), "exec"
    if os.getcwd() not in sys.path and "" not in sys.path:
        sys.path.insert(0, os.getcwd())
    if arguments.in_process and arguments.isolate:
        raise InvalidInputError("--in-process and --isolate: choose one")
    return targets.python_target(spec, role_name=role, timeout=timeout or 1.0,
                                 isolate=not arguments.in_process, memory_limit=memory), "python"


def _role_of(spec, command, given) -> str:
    from . import roles

    if given:
        return given
    if spec:
        return roles.infer(spec.rpartition(":")[2].rpartition(".")[2])
    return roles.infer(os.path.basename(command.split()[0]).rpartition(".")[0]
                       or os.path.basename(command.split()[0]))


def _audit(arguments) -> int:
    from . import engine, sampling

    if arguments.summary_from:
        if not os.path.isfile(arguments.summary_from):
            raise InvalidInputError(f"{arguments.summary_from}: no such file")
        _check_outputs(json_file=arguments.json_file)
        summary = engine.rebuild_summary(arguments.summary_from)
        _print_summary(summary)
        _write_json(arguments.json_file, summary)
        return _exit_code(summary)
    if (arguments.target is None) == (arguments.exec_command is None):
        raise InvalidInputError("give either TARGET (package.module:function) or --exec CMD")
    role = _role_of(arguments.target, arguments.exec_command, arguments.role)
    seed = arguments.seed if arguments.seed is not None else sampling.new_seed()
    if seed < 0:
        raise InvalidInputError(f"--seed {seed}: must be >= 0")
    maximum = parse_integer(arguments.maximum) if arguments.maximum is not None else None
    minimum = _role_minimum(role)
    if maximum is not None and minimum is not None and maximum < minimum:
        raise InvalidInputError(f"--max {maximum}: below the smallest input of {role} ({minimum})")
    stop_after = parse_integer(arguments.stop_after) if arguments.stop_after is not None else None
    if stop_after is not None and stop_after < 1:
        raise InvalidInputError(f"--stop-after {stop_after}: must be >= 1")
    if stop_after is not None and arguments.no_early_stop:
        raise InvalidInputError("give --stop-after N or --no-early-stop, not both")
    profile = sampling.profile(arguments.profile)
    timeout = arguments.timeout if arguments.timeout is not None else profile.timeout
    arguments.timeout = timeout
    _check_outputs(json_file=arguments.json_file, report=arguments.report,
                   corpus=None if arguments.no_corpus else arguments.corpus,
                   stream=arguments.stream)
    target, kind = _make_target(arguments.target, arguments.exec_command, role, arguments)
    print(f"ntoracle audit: {target.description} as {role}, profile {profile.name}, seed {seed} "
          f"(repeat with --seed {seed}); timeout {timeout:g} s per call"
          + (f"; declared domain <= {maximum}" if maximum is not None else ""), flush=True)
    options = engine.AuditOptions(role=role, profile=profile.name, seed=seed, timeout=timeout,
                                  maximum=maximum, conventions=_conventions(arguments),
                                  corpus=None if arguments.no_corpus else arguments.corpus,
                                  stream=arguments.stream or engine.new_run_path(".ntoracle"),
                                  stop_after=stop_after, early_stop=not arguments.no_early_stop,
                                  slow_fails=arguments.slow_fails)
    from . import report

    interrupted = False
    kept: list[dict] = []       # the records as written: the report is drawn from these, never
                                # from the results file, which the candidate can reach and edit
    try:
        with report.Progress(description=f"{role} checks", quiet=arguments.quiet) as progress:
            def observe(record: dict) -> None:
                kept.append(record)
                progress.observe(record)

            options.on_record = observe
            summary = engine.run_audit(target, options, kind=kind)
    except engine.AuditInterrupted as stop:
        summary, interrupted = stop.summary, True
    finally:
        target.close()
        if arguments.stream is None and os.path.exists(options.stream):
            engine.point_to_latest(options.stream, os.path.join(".ntoracle", "last-audit.jsonl"))
    _print_summary(summary, listed=0 if arguments.quiet else 20)
    print(f"results: {options.stream}")
    _write_json(arguments.json_file, summary)
    if arguments.report:
        _write_report(arguments.report, summary, kept, " ".join(sys.argv[1:]))
    if interrupted:
        print("ntoracle: interrupted; the findings so far are saved", file=sys.stderr)
        return EXIT_INTERRUPTED
    return _exit_code(summary)


def _check_outputs(*, json_file=None, report=None, corpus=None, stream=None, runs=None) -> None:
    """Refuse (exit 2, one line) an output path that cannot be written, before anything runs.
    ``stream`` None means the default results folder .ntoracle/runs (and runs=False skips it)."""
    created: list = []      # folders made by the checks: kept if all pass, removed if one fails
    try:
        if json_file:
            check_output_file(json_file, "--json", created)
        if report:
            check_output_folder(report, "--report", created)
        if corpus:
            check_output_file(corpus, "--corpus", created)
        if stream:
            check_output_file(stream, "--stream", created)
        elif runs is not False:
            check_output_folder(os.path.join(".ntoracle", "runs"), "the results folder", created)
    except InvalidInputError:
        remove_folders(created)
        raise


def _role_minimum(name: str) -> int | None:
    from . import roles

    try:
        return roles.get(name).minimum
    except OracleError:
        return None


def _exit_code(summary: dict) -> int:
    """0 passed, 1 failed, 3 nothing within the oracle's reach, 5 no verdict."""
    if summary["verdict"] == "failed":
        return EXIT_FAILED
    if summary["verdict"] == "passed":
        return EXIT_OK
    if summary["ended"] and summary["checks"] == 0 and summary["skipped"].get("out of the oracle's reach"):
        print("ntoracle: no point was within the oracle's reach", file=sys.stderr)
        return EXIT_OUT_OF_REACH
    print("ntoracle: no verdict: " + ("no check was completed" if summary["ended"]
                                      else "the run has no end record (interrupted or torn)"),
          file=sys.stderr)
    return EXIT_NO_VERDICT


def _judge_table(arguments) -> int:
    from . import claims_table, report

    _check_outputs(json_file=arguments.json_file, report=arguments.report, runs=False)
    budget = arguments.budget if arguments.budget is not None else claims_table.DEFAULT_BUDGET_SECONDS
    with report.Progress(description="rows judged", quiet=arguments.quiet) as bar:
        def progress(done: int, total: int) -> None:
            if bar.total is None:
                bar.set_total(total)
            bar.advance()

        summary = claims_table.audit_table(arguments.file, format=arguments.format,
                                           budget=budget, progress=progress)
    _print_table_summary(summary, listed=0 if arguments.quiet else 40)
    _write_json(arguments.json_file, summary)
    if arguments.report:
        _write_table_report(arguments.report, summary, " ".join(sys.argv[1:]))
    return {"failed": EXIT_FAILED, "passed": EXIT_OK, "incomplete": EXIT_USAGE}.get(
        summary["verdict"], EXIT_NO_VERDICT)


def _print_table_summary(summary: dict, listed: int = 40, shown: int | None = None) -> None:
    from .report import table_summary_lines

    options = {} if shown is None else {"shown": shown}
    print("\n".join(table_summary_lines(summary, listed=listed, **options)))
    print(CAUTION)


def _write_table_report(directory: str, summary: dict, command: str) -> None:
    """summary.json, report.txt and the self-contained report.html of a judged table."""
    import contextlib
    import io

    from . import report

    os.makedirs(directory, exist_ok=True)
    _write_json(os.path.join(directory, "summary.json"), summary)
    text = io.StringIO()
    with contextlib.redirect_stdout(text):
        _print_table_summary(summary, listed=len(summary["results"]),
                             shown=len(summary["findings"]) + len(summary["bad"]))
    with open(os.path.join(directory, "report.txt"), "w", encoding="utf-8") as handle:
        handle.write(text.getvalue())
    page = os.path.join(directory, "report.html")
    report.write_table_html(summary, page, command=f"ntoracle {command}")
    print(f"report: {page}")


def _replay(arguments) -> int:
    from . import engine

    if arguments.target and arguments.exec_command:
        raise InvalidInputError("give TARGET or --exec CMD, not both")
    _check_outputs(json_file=arguments.json_file, runs=False)
    groups = _replay_groups(arguments.file)
    if arguments.role:
        groups = {key: points for key, points in groups.items() if key[2] == arguments.role}
    given = arguments.target or arguments.exec_command
    roles_in_file = sorted({role for _, _, role in groups})
    if given and len(roles_in_file) > 1:
        raise InvalidInputError(
            f"{arguments.file} holds entries of {len(roles_in_file)} roles "
            f"({', '.join(roles_in_file)}); a given target plays one: pass --role ROLE")
    if not groups:
        print(f"{arguments.file}: no recorded failures to replay"
              + (f" of role {arguments.role}" if arguments.role else ""))
        return EXIT_OK
    summaries, refused = [], 0
    for (spec, kind, role), points in groups.items():
        if arguments.target or arguments.exec_command:
            spec, kind = arguments.exec_command or arguments.target, "exec" if arguments.exec_command else "python"
        elif kind == "exec" or not spec:
            refused += 1
            print(f"replay: skipped {len(points)} recorded input(s) of {role} for the executable "
                  f"{spec!r}: a command written in a file is never run (give --exec CMD)")
            continue
        target, kind = _make_target(spec if kind == "python" else None,
                                    spec if kind == "exec" else None, role, arguments)
        options = engine.AuditOptions(role=role, profile="ci", seed=0,
                                      timeout=arguments.timeout or 10.0,
                                      conventions=_conventions(arguments))
        try:
            summary = engine.run_audit(target, options, only=points, kind=kind)
        finally:
            target.close()
        summaries.append(summary)
        still = len(summary["failures"])
        print(f"replay: {target.description} as {role}: {len(points)} recorded input(s), "
              f"{still} still failing")
        for failure in summary["failures"][:20]:
            print("  " + _describe(failure))
    _write_json(arguments.json_file, summaries)
    if not summaries:
        return EXIT_NO_VERDICT
    if any(s["verdict"] == "failed" for s in summaries):
        return EXIT_FAILED
    return EXIT_OK if all(s["passed"] for s in summaries) else EXIT_NO_VERDICT


def _replay_groups(path: str) -> dict:
    from . import engine

    if not os.path.exists(path):
        raise InvalidInputError(f"{path}: no such file")
    groups: dict = {}
    if path.endswith(".jsonl"):
        records = engine.read_records(path)
        start = next((r for r in records if r.get("type") == "start"), None)
        if start is None:
            raise InvalidInputError(f"{path}: not a results file of ntoracle audit (no start record)")
        target = start.get("target") if isinstance(start.get("target"), str) else None
        kind = start.get("kind")
        if kind not in ("python", "exec"):      # an older file: a Python target names module:function
            kind = "python" if target and ":" in target and " " not in target else "exec"
        for record in records:
            if record.get("type") == "check" and record["status"] in engine.FAILURE_STATUSES \
                    and record["family"] not in ("identity",):
                key = (target, kind, start.get("role"))
                groups.setdefault(key, [])
                if record["arguments"] not in groups[key]:
                    groups[key].append(record["arguments"])
        return groups
    for entry in engine.load_corpus(path):
        key = (entry.get("target"), entry.get("kind", "python"), entry["role"])
        groups.setdefault(key, []).append(entry["arguments"])
    return groups


def _describe(failure: dict) -> str:
    from ._bounded import printable
    from .report import finding_line

    return printable(finding_line(failure))


def _print_summary(summary: dict, listed: int = 20) -> None:
    """The verdict, the first ``listed`` findings, the first divergence, skips, reach and timings
    (:func:`oracle.report.summary_lines`, the same text as report.txt), then the cautions."""
    from .report import summary_lines

    print("\n".join(summary_lines(summary, listed)))
    print(CAUTION)


def _write_json(path, data) -> None:
    if path:
        if os.path.dirname(path):
            os.makedirs(os.path.dirname(path), exist_ok=True)
        with open(path, "w", encoding="utf-8") as handle:
            json.dump(data, handle, indent=1)


def _write_report(directory: str, summary: dict, records: list[dict], command: str) -> None:
    """summary.json, report.txt and, from the run's records (as the harness wrote them, kept in
    memory: the results file on disk is within reach of the candidate, which runs as the same
    user), the self-contained report.html."""
    import contextlib
    import io

    from . import report

    os.makedirs(directory, exist_ok=True)
    report.write_json(summary, os.path.join(directory, "summary.json"))
    text = io.StringIO()
    with contextlib.redirect_stdout(text):
        _print_summary(summary)
    with open(os.path.join(directory, "report.txt"), "w", encoding="utf-8") as handle:
        handle.write(text.getvalue())
    if records:
        page = os.path.join(directory, "report.html")
        as_read = [json.loads(json.dumps(record)) for record in records]     # as a file gives them
        report.write_html([(summary, as_read)], page, command=f"ntoracle {command}")
        print(f"report: {page}")


def _store(arguments) -> int:
    from . import _store

    store = _store.default_store()
    if store is None:
        print("ntoracle: the answer store is switched off (NTORACLE_STORE=off or --no-store)")
        return EXIT_OK
    if arguments.action == "clear":
        removed = store.clear()
        print(json.dumps({"path": str(store.path), "removed": removed}) if arguments.json
              else f"cleared {removed} answer(s) from {store.path}")
        return EXIT_OK
    summary = store.summary()
    if arguments.json:
        print(json.dumps(summary))
        return EXIT_OK
    print(f"answer store: {summary['path']}")
    print(f"  {summary['bytes']} bytes, {summary['entries']} answer(s) "
          f"({summary['entries_this_version']} for this oracle version), "
          f"{summary['seconds_saved_per_reuse']:g} s of computation saved per reuse")
    for function, count in summary["by_function"].items():
        print(f"  {function}: {count}")
    return EXIT_OK


def _show(value) -> str:
    from .report import show_value

    return show_value(value, 10**6)


def _version() -> str:
    from . import __version__

    return f"ntoracle {__version__}"


if __name__ == "__main__":  # pragma: no cover
    sys.exit(main())
