"""The oracle's facade: exact answers, each with the route that produced it.

Every public function validates its input strictly (:mod:`oracle._integers`),
picks the cheapest *exact* route, and either answers or raises.  It never
guesses: a question out of exact reach raises :class:`OutOfReachError`, which
carries the proven interval where the bounds catalogue gives one.

Routes and their provenance labels (docs/DESIGN.md, "The oracle's promise"):

``table:<id>``
    a published value from ``fixtures/`` (see :mod:`oracle.tables`);
``table:<id>+sieve``
    a published value corrected by an exact sieve count over the short interval
    between the tabulated point and the argument, e.g.
    π(10¹¹ + 5) = π(10¹¹) + #{p prime : 10¹¹ < p ≤ 10¹¹ + 5};
``sieve``
    a segmented sieve of Eratosthenes (primesieve or our numpy engine);
``combinatorial``
    our Meissel–Lehmer-family prime counting (:mod:`oracle.exact.combinatorial`);
``deterministic``
    Miller–Rabin with a base set proven sufficient below a published bound;
``probable``
    Baillie–PSW above that bound: no counterexample is known, none is proven
    impossible.  A probable prime is not a proven prime.
``factorised+deterministic`` / ``factorised+probable``
    a factorisation found by trial division and Brent's rho within the budget
    (:mod:`oracle.exact.factorisation`), each prime factor proven or probable as
    above; μ, φ, d and σ are computed from it;
``constructed: certified factors``
    n was built from primes with Pocklington certificates and registered by
    the sampling family that built it (:mod:`oracle.adversarial._constructed`):
    its factorisation is proven at any size.

Answers that took long to compute are kept on disk between runs
(:mod:`oracle._store`); every route below passes through :func:`_kept`, the one
place where the store is read and written.

Heavy modules (numpy, gmpy2, primesieve) are imported inside the functions, so
``import oracle`` stays cheap for the pytest plugin.
"""

from __future__ import annotations

import functools
import math
import time
from dataclasses import dataclass
from typing import Callable, Iterable

from ._bounded import bounded_text
from ._errors import InvalidInputError, OutOfReachError
from ._integers import require_int

__all__ = [
    "Answer", "FactorizationReport",
    "pi", "twin_pi", "tuplet_pi", "count", "nth_prime", "is_prime",
    "next_prime", "prev_prime", "primes", "verify_factorization", "answer",
    "factorization", "mobius", "totient", "divisor_count", "divisor_sum", "MULTIPLICATIVE",
    "FUNCTIONS", "TUPLET_KINDS", "DEFAULT_BUDGET_SECONDS",
]

#: Seconds of computation the oracle spends on one answer unless told otherwise.
DEFAULT_BUDGET_SECONDS = 300.0

#: The constellation kinds that :func:`count` and :func:`tuplet_pi` accept.
TUPLET_KINDS = ("primes", "twins", "triplets_026", "triplets_046", "quadruplets")

#: Longest interval whose primes :func:`primes` returns as a list.
PRIMES_MAX_SPAN = 10**9
#: Most primes :func:`primes` returns (a list of Python ints costs ~32 bytes each).
PRIMES_MAX_COUNT = 5 * 10**7

# Cost model of the sieve, in seconds per integer sieved (primesieve on one
# core of this machine counts the primes below 10**10 in about 0.5 s; our numpy
# engine is slower).  Used only to choose a route and to refuse early.
_SIEVE_SECONDS_PER_INTEGER = {"primesieve": 6e-11, "numpy": 6e-10}
# The numpy engine on a short interval high up: small-prime sieve, survivors proven.
_NUMPY_PROOF_SECONDS_PER_INTEGER = 3e-7
# Beyond 2**64 a short interval is sieved by small primes and every survivor
# is tested with Baillie-PSW; this caps the interval length.
_SIEVE_MAX_SPAN_BEYOND_64 = 10**8
# Above _TEST_EACH_ABOVE a short interval is listed by testing each number: a
# sieve would first need every prime up to the square root (about 2 s near 2**64).
_TEST_EACH_ABOVE = 2**40
_TEST_EACH_SPAN = 2**14
# Longest interval listed above 2**64, where testing each number is the only route.
_TEST_EACH_MAX_SPAN_BEYOND_64 = 10**6
_TWO_64 = 2**64


@dataclass(frozen=True)
class Answer:
    """An exact answer and how it was obtained."""

    function: str
    arguments: tuple[int | str, ...]
    value: int | bool | list[int]
    provenance: str

    def as_dict(self) -> dict:
        argument = self.arguments[0] if len(self.arguments) == 1 else list(self.arguments)
        return {"function": self.function, "n": argument, "value": self.value,
                "provenance": self.provenance}


@dataclass(frozen=True)
class FactorizationReport:
    """Outcome of :func:`verify_factorization`; true when the factorisation is right.

    ``verdicts`` maps each distinct claimed factor to ``"deterministic"``,
    ``"probable"`` (a probable prime: not a proof) or ``"composite"`` / ``"not prime"``.
    """

    n: int
    factors: tuple[tuple[int, int], ...]
    product_matches: bool
    verdicts: dict[int, str]
    problems: tuple[str, ...]

    @property
    def ok(self) -> bool:
        return not self.problems

    @property
    def provenance(self) -> str:
        if not self.ok:
            return "deterministic"
        return "probable" if "probable" in self.verdicts.values() else "deterministic"

    def __bool__(self) -> bool:
        return self.ok


# --------------------------------------------------------------------------- #
# Counting functions
# --------------------------------------------------------------------------- #

def pi(x: int, *, budget: float | None = None, progress=None) -> int:
    """π(x), the number of primes p ≤ x (0 for x < 2).

    ``progress``, if given, is called as ``progress(fraction_done, stage)`` during a
    long combinatorial computation.
    """
    return _pi(x, budget, progress).value


def twin_pi(x: int, *, budget: float | None = None) -> int:
    """π₂(x), the number of twin pairs (p, p + 2) with p + 2 ≤ x."""
    return _tuplet_pi("twins", x, budget).value


def tuplet_pi(kind: str, x: int, *, budget: float | None = None) -> int:
    """Number of constellations of ``kind`` lying wholly in [0, x].

    ``kind`` is one of :data:`TUPLET_KINDS`; ``tuplet_pi("primes", x) == pi(x)``.
    """
    if _check_kind(kind) == "primes":
        return _pi(x, budget).value
    return _tuplet_pi(kind, x, budget).value


def count(kind: str, a: int, b: int, *, budget: float | None = None) -> int:
    """Number of constellations of ``kind`` lying wholly in the closed interval [a, b]."""
    return _count(_check_kind(kind), a, b, budget).value


def nth_prime(n: int, *, budget: float | None = None, progress=None) -> int:
    """p_n, the n-th prime: nth_prime(1) = 2 (``progress`` as for :func:`pi`)."""
    return _nth_prime(n, budget, progress).value


# --------------------------------------------------------------------------- #
# Primality
# --------------------------------------------------------------------------- #

def is_prime(n: int) -> bool:
    """Whether n is prime (n ≥ 0).  See :func:`answer` for the verdict used."""
    return _is_prime(n).value


def next_prime(n: int) -> int:
    """The smallest prime > n (n ≥ 0)."""
    return _next_prime(n).value


def prev_prime(n: int) -> int:
    """The largest prime < n (n ≥ 3)."""
    return _prev_prime(n).value


def primes(a: int, b: int) -> list[int]:
    """All primes p with a ≤ p ≤ b, ascending, as Python ints."""
    return _primes(a, b).value


def verify_factorization(n: int, factors) -> FactorizationReport:
    """Check a claimed factorisation of n ≥ 1.

    ``factors`` may be a mapping {p: e}, a flat list [p, p, q] or a list of
    pairs [(p, e)]; n = 1 has the empty factorisation.  The report says whether
    the product equals n, and the primality verdict of each factor.
    """
    n = require_int("n", n, minimum=1)
    pairs = _factor_pairs(factors)
    from .exact import primality

    product = 1
    for prime, exponent in pairs:
        product *= prime ** exponent
    problems: list[str] = []
    if product != n:
        problems.append(f"product of the factors is {bounded_text(product, 200)}, not {n}")
    verdicts: dict[int, str] = {}
    for prime, _ in pairs:
        if prime < 2:
            verdicts[prime] = "not prime"
            problems.append(f"factor {prime} is not prime")
        elif primality.is_prime(prime):
            verdicts[prime] = primality.verdict(prime)
        else:
            verdicts[prime] = "composite"
            problems.append(f"factor {prime} is composite")
    return FactorizationReport(n, tuple(pairs), product == n, verdicts, tuple(problems))


# --------------------------------------------------------------------------- #
# Factorisation and the multiplicative functions
# --------------------------------------------------------------------------- #

def factorization(n: int, *, budget: float | None = None) -> dict[int, int]:
    """The prime factorisation {p: e} of n ≥ 1 ({} for 1), or :class:`OutOfReachError`."""
    return dict(_factorization(n, budget)[0])


def mobius(n: int, *, budget: float | None = None) -> int:
    """μ(n) for n ≥ 1: 0 if a square > 1 divides n, else (−1)^(number of prime factors)."""
    return _multiplicative("mobius", n, budget).value


def totient(n: int, *, budget: float | None = None) -> int:
    """φ(n) for n ≥ 1: how many k in [1, n] have gcd(k, n) = 1 (φ(1) = 1)."""
    return _multiplicative("totient", n, budget).value


def divisor_count(n: int, *, budget: float | None = None) -> int:
    """d(n) = σ₀(n) for n ≥ 1: the number of positive divisors (d(1) = 1)."""
    return _multiplicative("divisor_count", n, budget).value


def divisor_sum(n: int, *, budget: float | None = None) -> int:
    """σ(n) = σ₁(n) for n ≥ 1: the sum of the positive divisors (σ(1) = 1)."""
    return _multiplicative("divisor_sum", n, budget).value


def _mobius_of(pairs) -> int:
    return 0 if any(e > 1 for _, e in pairs) else (-1) ** len(pairs)


def _totient_of(pairs) -> int:
    return math.prod(p ** (e - 1) * (p - 1) for p, e in pairs)


def _divisor_count_of(pairs) -> int:
    return math.prod(e + 1 for _, e in pairs)


def _divisor_sum_of(pairs) -> int:
    return math.prod((p ** (e + 1) - 1) // (p - 1) for p, e in pairs)


#: The multiplicative functions, each from the (p, e) pairs of n (Hardy & Wright, ch. XVI).
MULTIPLICATIVE = {"mobius": _mobius_of, "totient": _totient_of,
                  "divisor_count": _divisor_count_of, "divisor_sum": _divisor_sum_of}

#: Provenance of a factorisation known from its construction.
CONSTRUCTED = "constructed: certified factors"


def _factorization(n, budget) -> tuple[list[tuple[int, int]], str]:
    """The sorted (p, e) pairs of n and their provenance: the construction when n was
    registered, else trial division and Brent's rho within the budget."""
    n = require_int("n", n, minimum=1)
    budget = _budget(budget)
    from .adversarial import _constructed

    built = _constructed.known(n)
    if built is not None:
        return sorted(built.factorisation.items()), CONSTRUCTED
    from .exact import factorisation

    try:
        found, verdict = factorisation.factorise(n, budget)
    except factorisation.TooSlow as error:
        raise OutOfReachError(f"factorization({n}): {error} ({budget:g} s)") from None
    return sorted(found.items()), f"factorised+{verdict}"


def _multiplicative(function: str, n, budget) -> Answer:
    pairs, provenance = _factorization(n, budget)
    if function == "factorization":
        return Answer(function, (n,), [list(pair) for pair in pairs], provenance)
    return Answer(function, (n,), MULTIPLICATIVE[function](pairs), provenance)


# --------------------------------------------------------------------------- #
# The companion call
# --------------------------------------------------------------------------- #

#: Functions :func:`answer` knows, with their arity.
FUNCTIONS = {
    "pi": 1, "twin_pi": 1, "nth_prime": 1, "is_prime": 1, "next_prime": 1,
    "prev_prime": 1, "triplets_026": 1, "triplets_046": 1, "quadruplets": 1,
    "count": 3, "primes": 2,
    "factorization": 1, "mobius": 1, "totient": 1, "divisor_count": 1, "divisor_sum": 1,
}


def answer(function: str, *arguments, budget: float | None = None, progress=None) -> Answer:
    """The exact answer with its provenance, e.g. ``answer("pi", 10**11 + 5)``.

    ``function`` is a key of :data:`FUNCTIONS`; ``answer("count", kind, a, b)``
    counts constellations of ``kind`` in [a, b], ``answer("primes", a, b)`` lists the
    primes of [a, b]; ``progress`` as for :func:`pi`.
    """
    if function not in FUNCTIONS:
        raise InvalidInputError(
            f"unknown function {function!r}; known: {', '.join(FUNCTIONS)}")
    if len(arguments) != FUNCTIONS[function]:
        raise InvalidInputError(
            f"{function} takes {FUNCTIONS[function]} argument(s), got {len(arguments)}")
    if function == "pi":
        return _pi(arguments[0], budget, progress)
    if function == "twin_pi":
        return _tuplet_pi("twins", arguments[0], budget)
    if function == "primes":
        return _primes(*arguments)
    if function in TUPLET_KINDS:
        return _tuplet_pi(function, arguments[0], budget)
    if function == "nth_prime":
        return _nth_prime(arguments[0], budget, progress)
    if function == "is_prime":
        return _is_prime(arguments[0])
    if function == "next_prime":
        return _next_prime(arguments[0])
    if function == "prev_prime":
        return _prev_prime(arguments[0])
    if function == "factorization" or function in MULTIPLICATIVE:
        return _multiplicative(function, arguments[0], budget)
    kind, a, b = arguments
    return _count(_check_kind(kind), a, b, budget)


# --------------------------------------------------------------------------- #
# Answers kept between runs
# --------------------------------------------------------------------------- #

def _kept(question: Callable[..., tuple[str, tuple]]):
    """Serve the route from the on-disk store, and keep what it computes slowly.

    ``question(*route_arguments)`` names the answer as ``(function, arguments)``,
    e.g. ``("twin_pi", (x,))`` for ``_tuplet_pi("twins", x, budget)``.  Only
    plain ``int`` and kind-name arguments are looked up; anything else (a bool,
    a numpy integer, a float) goes straight to the route, which validates it.
    An answer is kept when computing it took longer than the store's threshold.
    """
    def decorate(route):
        @functools.wraps(route)
        def served(*arguments, **options):
            from ._store import default_store

            store = default_store()
            if store is None:
                return route(*arguments, **options)
            function, key_arguments = question(*arguments)
            kept = store.get(function, key_arguments)
            if kept is not None:
                return Answer(function, key_arguments, kept[0], kept[1])
            started = time.perf_counter()
            result = route(*arguments, **options)
            store.put(function, key_arguments, result.value, result.provenance,
                      time.perf_counter() - started)
            return result
        served.uncached = route
        return served
    return decorate


def _tuplet_name(kind) -> str:
    return "twin_pi" if kind == "twins" else kind


# --------------------------------------------------------------------------- #
# Routes
# --------------------------------------------------------------------------- #

@_kept(lambda x, budget=None, progress=None: ("pi", (x,)))
def _pi(x, budget, progress=None) -> Answer:
    x = require_int("x", x)
    budget = _budget(budget)
    if x < 2:
        return Answer("pi", (x,), 0, "sieve")
    table = _route_by_table("pi", "primes", x, budget)
    if table is not None and table.seconds == 0:
        # A tabulated point: no route is cheaper, and the others need numpy to estimate.
        return _cheapest("pi", x, [table], budget)
    candidates = [table, _route_by_combinatorial(x, budget, progress),
                  _route_by_sieve("primes", x, budget)]
    return _cheapest("pi", x, candidates, budget)


@_kept(lambda kind, x, budget=None: (_tuplet_name(kind), (x,)))
def _tuplet_pi(kind, x, budget) -> Answer:
    x = require_int("x", x)
    budget = _budget(budget)
    name = _tuplet_name(kind)
    if x < 2:
        return Answer(name, (x,), 0, "sieve")
    table_function = "twin_pi" if kind == "twins" else None
    candidates = [_route_by_table(table_function, kind, x, budget) if table_function else None,
                  _route_by_sieve(kind, x, budget)]
    return _cheapest(name, x, candidates, budget)


@_kept(lambda kind, a, b, budget=None: ("count", (kind, a, b)))
def _count(kind, a, b, budget) -> Answer:
    a = require_int("a", a, minimum=0)
    b = require_int("b", b)
    budget = _budget(budget)
    arguments = (kind, a, b)
    if b < a:
        return Answer("count", arguments, 0, "sieve")
    sieve_cost = _sieve_seconds(a, b)
    if sieve_cost is not None and sieve_cost <= budget:
        value, provenance = _sieve_count(kind, a, b)
        return Answer("count", arguments, value, provenance)
    if kind == "primes" and a >= 1:
        # A long interval of primes is a difference of two prime counts.
        upper = _pi(b, budget)
        lower = _pi(a - 1, budget)
        provenance = _join(upper.provenance, lower.provenance)
        return Answer("count", arguments, upper.value - lower.value, provenance)
    raise OutOfReachError(
        f"count({kind!r}, {a}, {b}): the interval is too long to sieve within "
        f"{budget:g} s and no exact method counts {kind} over it")


@_kept(lambda n, budget=None, progress=None: ("nth_prime", (n,)))
def _nth_prime(n, budget, progress=None) -> Answer:
    n = require_int("n", n, minimum=1)
    budget = _budget(budget)
    from . import tables

    known = tables.values("nth_prime").get(n)
    if known is not None:
        return Answer("nth_prime", (n,), known[0], f"table:{known[1]}")
    upper = _nth_prime_upper_bound(n)
    if _sieve_seconds(0, upper) is not None and _sieve_seconds(0, upper) <= min(budget, 2.0):
        from .exact import sieve

        found = sieve.primes(0, upper)
        return Answer("nth_prime", (n,), int(found[n - 1]), "sieve")
    combinatorial = _combinatorial()
    if combinatorial is not None:
        value = combinatorial.nth_prime(n, time_budget=budget, progress=progress)
        return Answer("nth_prime", (n,), value, "combinatorial")
    raise OutOfReachError(f"nth_prime({n}): beyond what the sieve reaches within "
                          f"{budget:g} s, and the combinatorial method is not available")


def _nth_prime_upper_bound(n: int) -> int:
    """An integer ≥ p_n.

    p_n < n (ln n + ln ln n) for n ≥ 6 (Rosser & Schoenfeld 1962, Illinois J.
    Math. 6, (3.13)); evaluated in floats with a 1 % margin plus 10, far above
    any rounding error; p_5 = 11 covers n ≤ 5.
    """
    if n <= 5:
        return 11
    log_n = math.log(n)
    return int(n * (log_n + math.log(log_n)) * 1.01) + 10


@_kept(lambda n: ("is_prime", (n,)))
def _is_prime(n) -> Answer:
    n = require_int("n", n, minimum=0)
    from .exact import primality

    prime = primality.is_prime(n)
    # A "composite" answer is always proven (a failed strong or Lucas test is a
    # witness); only a "prime" answer above the bound is merely probable.
    return Answer("is_prime", (n,), prime, primality.verdict(n) if prime else "deterministic")


@_kept(lambda n: ("next_prime", (n,)))
def _next_prime(n) -> Answer:
    n = require_int("n", n, minimum=0)
    from .exact import primality

    value = primality.next_prime(n)
    return Answer("next_prime", (n,), value, primality.verdict(value))


@_kept(lambda n: ("prev_prime", (n,)))
def _prev_prime(n) -> Answer:
    n = require_int("n", n, minimum=3)
    from .exact import primality

    value = primality.prev_prime(n)
    return Answer("prev_prime", (n,), value, primality.verdict(value))


@_kept(lambda a, b: ("primes", (a, b)))
def _primes(a, b) -> Answer:
    a = require_int("a", a, minimum=0)
    b = require_int("b", b)
    if b < a:
        return Answer("primes", (a, b), [], "sieve")
    if b - a > PRIMES_MAX_SPAN:
        raise OutOfReachError(
            f"primes({a}, {b}): the interval is longer than {PRIMES_MAX_SPAN}; "
            f"count them with count('primes', a, b) or ask for shorter pieces")
    short = b - a <= _TEST_EACH_SPAN
    if b < _TWO_64 and not (b >= _TEST_EACH_ABOVE and short):
        from .exact import sieve

        found = sieve.primes(a, b)
        if len(found) > PRIMES_MAX_COUNT:
            raise OutOfReachError(f"primes({a}, {b}): {len(found)} primes, more than the "
                                  f"{PRIMES_MAX_COUNT} returned as a list")
        return Answer("primes", (a, b), [int(p) for p in found.tolist()], "sieve")
    if b - a > _TEST_EACH_MAX_SPAN_BEYOND_64:
        raise OutOfReachError(
            f"primes({a}, {b}): above 2**64 only intervals up to "
            f"{_TEST_EACH_MAX_SPAN_BEYOND_64} long are listed")
    found, provenance = _primes_by_testing_each(a, b)
    return Answer("primes", (a, b), found, provenance)


def _primes_by_testing_each(a: int, b: int) -> tuple[list[int], str]:
    """The primes of [a, b], each number tested: composites are proven, primes as verdict() says."""
    from .exact import primality

    found = [n for n in range(max(a, 2), b + 1) if primality.is_prime(n)]
    probable = bool(found) and primality.verdict(found[-1]) == "probable"
    return found, "probable" if probable else "deterministic"


# --------------------------------------------------------------------------- #
# Route helpers
# --------------------------------------------------------------------------- #

@dataclass(frozen=True)
class _Route:
    seconds: float
    compute: object          # zero-argument callable returning (value, provenance)


def _cheapest(name: str, x: int, routes: Iterable[_Route | None], budget: float) -> Answer:
    usable = sorted((route for route in routes if route is not None), key=lambda r: r.seconds)
    if usable and usable[0].seconds <= budget:
        value, provenance = usable[0].compute()
        return Answer(name, (x,), value, provenance)
    raise _out_of_reach(name, x, budget, usable[0].seconds if usable else None)


def _route_by_table(function: str | None, kind: str, x: int, budget: float) -> _Route | None:
    """π(x) from the nearest tabulated point, corrected by a sieve count.

    For a constellation of span s (s = 2 for twins) counted wholly inside
    [0, x]: N(x) = N(A) + count(A - s + 1, x) when A ≤ x, and
    N(x) = N(A) - count(x - s + 1, A) when A > x.
    """
    from . import tables

    known = tables.values(function)
    if not known:
        return None
    exact = known.get(x)
    if exact is not None:
        return _Route(0.0, lambda: (exact[0], f"table:{exact[1]}"))
    span = _span(kind)
    below = max((a for a in known if a <= x), default=None)
    above = min((a for a in known if a > x), default=None)
    best = None
    for anchor in (below, above):
        if anchor is None:
            continue
        low, high = (anchor - span + 1, x) if anchor <= x else (x - span + 1, anchor)
        seconds = _sieve_seconds(max(low, 0), high)
        if seconds is None:
            continue
        if best is None or seconds < best[0]:
            best = (seconds, anchor, max(low, 0), high)
    if best is None:
        return None
    seconds, anchor, low, high = best
    base_value, table_id = known[anchor]

    def compute():
        correction, provenance = _sieve_count(kind, low, high)
        value = base_value + correction if anchor <= x else base_value - correction
        return value, f"table:{table_id}+{provenance}"

    return _Route(seconds, compute)


def _route_by_sieve(kind: str, x: int, budget: float) -> _Route | None:
    seconds = _sieve_seconds(0, x)
    if seconds is None:
        return None
    return _Route(seconds, lambda: _sieve_count(kind, 0, x))


def _route_by_combinatorial(x: int, budget: float, progress=None) -> _Route | None:
    combinatorial = _combinatorial()
    if combinatorial is None or x > combinatorial.MAX_X:
        return None
    seconds = combinatorial.estimated_seconds(x)
    return _Route(seconds, lambda: (combinatorial.prime_pi(x, time_budget=budget, progress=progress),
                                    "combinatorial"))


def _combinatorial():
    """The combinatorial module when it is usable, else None."""
    try:
        from .exact import combinatorial
    except ImportError:
        return None
    return combinatorial if hasattr(combinatorial, "prime_pi") else None


def _sieve_seconds(a: int, b: int) -> float | None:
    """Estimated seconds to sieve [a, b], or None when no sieve route exists."""
    length = b - a + 1
    if b >= _TWO_64:
        if length > _SIEVE_MAX_SPAN_BEYOND_64:
            return None
        return length * 2e-7
    from .exact import sieve

    engine = "primesieve" if sieve.active_engine().startswith("primesieve") else "numpy"
    # Sieving also needs the primes up to sqrt(b) -- except that the numpy engine
    # proves the survivors of a small-prime sieve instead on a short interval high up.
    seconds = (length + math.isqrt(b)) * _SIEVE_SECONDS_PER_INTEGER[engine]
    if engine == "numpy":
        seconds = min(seconds, length * _NUMPY_PROOF_SECONDS_PER_INTEGER)
    return seconds


def _sieve_count(kind: str, a: int, b: int) -> tuple[int, str]:
    from .exact import sieve

    if b < a:
        return 0, "sieve"
    if b >= _TWO_64:
        return sieve.count(kind, a, b), "probable"
    return sieve.count(kind, a, b), "sieve"


def _span(kind: str) -> int:
    """Distance from the first to the last member of the constellation (2 for twins)."""
    from .exact import sieve

    return sieve.PATTERNS[kind][-1]


def _check_kind(kind) -> str:
    if kind not in TUPLET_KINDS:
        raise InvalidInputError(f"kind={kind!r}: expected one of {', '.join(TUPLET_KINDS)}")
    return kind


def _budget(budget) -> float:
    if budget is None:
        return DEFAULT_BUDGET_SECONDS
    if isinstance(budget, bool) or not isinstance(budget, (int, float)) or not budget > 0:
        raise InvalidInputError(f"budget={budget!r}: expected a positive number of seconds")
    return float(budget)


def _join(*provenances: str) -> str:
    """Combine provenance labels such as ``table:x+sieve`` and ``sieve``, each once, in order."""
    labels = []
    for provenance in provenances:
        for label in provenance.split("+"):
            if label not in labels:
                labels.append(label)
    return "+".join(labels)


def _out_of_reach(name: str, x: int, budget: float, seconds: float | None) -> OutOfReachError:
    reason = (f"the cheapest exact route needs about {seconds:.3g} s, over the budget of "
              f"{budget:g} s" if seconds is not None else "no exact method reaches it")
    lower = upper = None
    theorems: tuple[str, ...] = ()
    interval = _proven_interval(name, x)
    if interval is not None:
        lower, upper, theorems = interval.lower, interval.upper, interval.theorems
        reason += f"; proven: {lower} <= {name}({x}) <= {upper} ({', '.join(theorems)})"
    return OutOfReachError(f"{name}({x}): {reason}", lower=lower, upper=upper, theorems=theorems)


def _proven_interval(name: str, x: int):
    try:
        from . import bounds
    except ImportError:
        return None
    function = {"pi": "pi", "twin_pi": "twin_pi", "nth_prime": "nth_prime"}.get(name)
    if function is None or not hasattr(bounds, function):
        return None
    return getattr(bounds, function)(x)


def _factor_pairs(factors) -> list[tuple[int, int]]:
    """Normalise the three accepted shapes of a factorisation to sorted (p, e) pairs."""
    if isinstance(factors, dict):
        items = list(factors.items())
    else:
        try:
            items = list(factors)
        except TypeError:
            raise InvalidInputError(
                f"factors={factors!r}: expected a mapping {{p: e}}, a list of primes "
                f"or a list of (p, e) pairs") from None
        if all(isinstance(item, (tuple, list)) for item in items):
            items = [tuple(item) for item in items]
        else:
            items = [(item, 1) for item in items]
    merged: dict[int, int] = {}
    for item in items:
        if len(item) != 2:
            raise InvalidInputError(f"factor entry {item!r}: expected (prime, exponent)")
        prime = require_int("factor", item[0])
        exponent = require_int("exponent", item[1], minimum=1)
        merged[prime] = merged.get(prime, 0) + exponent
    return sorted(merged.items())
