"""The ``ntoracle`` command line.

Exit codes (DESIGN.md): 0 success; 1 a candidate failed a check; 2 usage,
configuration or input error; 3 the oracle cannot answer exactly and says what
it can prove instead.  Integers are parsed without ``eval``
(:func:`oracle._integers.parse_integer`).
"""

from __future__ import annotations

import argparse
import json
import os
import sys
import time

from ._errors import InvalidInputError, OracleError, OutOfReachError
from ._integers import parse_integer

EXIT_OK, EXIT_FAILED, EXIT_USAGE, EXIT_OUT_OF_REACH = 0, 1, 2, 3

VALUE_FUNCTIONS = ("pi", "twin_pi", "nth_prime", "is_prime", "next_prime", "prev_prime",
                   "triplets_026", "triplets_046", "quadruplets")
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
    commands = parser.add_subparsers(dest="command", metavar="COMMAND", parser_class=_ArgumentParser)

    value = commands.add_parser("value", help="an exact value with its provenance",
                                description="Print an exact value and how it was obtained.")
    value.add_argument("function", choices=VALUE_FUNCTIONS, metavar="FUNC",
                       help="one of: " + ", ".join(VALUE_FUNCTIONS))
    value.add_argument("n", metavar="N", help="an integer: 123, 1_000, 10**14, 2**64-1, 1e12")
    value.add_argument("--json", action="store_true", help="print one JSON object")
    value.add_argument("--budget", type=float, default=None, metavar="SECONDS",
                       help="refuse (exit 3) rather than compute longer than this")

    bounds = commands.add_parser("bounds", help="a proven interval with its theorems",
                                 description="Print the tightest proven interval and its sources.")
    bounds.add_argument("function", choices=BOUND_FUNCTIONS, metavar="FUNC",
                        help="one of: " + ", ".join(BOUND_FUNCTIONS))
    bounds.add_argument("n", metavar="N", help="an integer: 10**30, 2**80, ...")
    bounds.add_argument("--json", action="store_true", help="print one JSON object")

    commands.add_parser("demo", help="a tour of the oracle on a handful of questions",
                        description="Ask the oracle a handful of questions and show each "
                                    "answer with its provenance.")
    return parser


def main(argv: list[str] | None = None) -> int:
    parser = build_parser()
    arguments = parser.parse_args(argv)
    if arguments.command is None:
        parser.print_help()
        return EXIT_USAGE
    handler = {"value": _value, "bounds": _bounds, "demo": _demo}[arguments.command]
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
        return 4


def _value(arguments) -> int:
    from . import facade

    n = parse_integer(arguments.n)
    if arguments.budget is not None and not arguments.budget > 0:
        raise InvalidInputError(f"--budget {arguments.budget}: must be a positive number of seconds")
    result = facade.answer(arguments.function, n, budget=arguments.budget)
    if arguments.json:
        print(json.dumps(result.as_dict()))
    else:
        print(f"{arguments.function}({n}) = {_show(result.value)}    [{result.provenance}]")
        if result.provenance.endswith("probable"):
            print("note: 'probable' means Baillie-PSW: not a proof of primality.")
    return EXIT_OK


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
    ("is_prime", 2**89 - 1, "a Mersenne prime"),
    ("next_prime", 2**64, "the first prime above 2**64: Baillie-PSW, probable"),
    ("prev_prime", 2**64, "the largest prime below 2**64"),
)


def _demo(arguments) -> int:
    from . import facade
    from .exact import sieve

    print("ntoracle demo: the oracle answers a handful of questions, each with its provenance.")
    print(f"sieve engine: {sieve.active_engine()}\n")
    for function, n, comment in _TOUR:
        started = time.perf_counter()
        result = facade.answer(function, n)
        elapsed = time.perf_counter() - started
        print(f"  {function}({n}) = {_show(result.value)}")
        print(f"      [{result.provenance}]  {comment}  ({elapsed:.2f} s)")
    print(f"\n{CAUTION}")
    return EXIT_OK


def _show(value) -> str:
    return str(value).lower() if isinstance(value, bool) else str(value)


def _version() -> str:
    from . import __version__

    return f"ntoracle {__version__}"


if __name__ == "__main__":  # pragma: no cover
    sys.exit(main())
