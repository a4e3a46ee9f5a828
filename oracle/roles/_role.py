"""What a role is: the conventions of one kind of candidate and how its answers are judged.

A *role* is a function the harness knows how to check (docs/DESIGN.md, "Candidate
conventions"): ``prime_pi``, ``twin_pi``, ``nth_prime``, ``is_prime``,
``next_prime``, ``prev_prime``, ``primes_in`` and ``factor``, and the arithmetic
functions ``mobius``, ``totient``, ``divisor_count`` and ``divisor_sum``
(:mod:`oracle.roles._pointwise`).  Each role module
builds one :class:`Role`; the role turns a raw answer into a canonical value
(:meth:`Role.normalise`), judges it against the oracle (:meth:`Role.judge`),
and may look across all answers of a run for broken identities
(:meth:`Role.relations`).

A raw answer of the wrong *type* (a float for a count, ``None``, a string) is
a finding of its own, raised here as :class:`WrongType`; numpy integers, gmpy2
``mpz`` and ``bool`` for ``is_prime`` are accepted and converted.
"""

from __future__ import annotations

import operator
from dataclasses import dataclass, field
from typing import Callable, Iterable, Sequence

from .._bounded import bounded_text, describe_integer
from .._errors import InvalidInputError

__all__ = ["Conventions", "Verdict", "Role", "WrongType", "as_integer", "as_boolean",
           "as_integer_sequence"]

RANGE_CONVENTIONS = ("closed", "half-open")
FACTOR_SHAPES = ("any", "mapping", "flat", "pairs")
INVALID_INPUT_POLICIES = ("unchecked", "raise")


@dataclass(frozen=True)
class Conventions:
    """The conventions a target follows, where candidates legitimately differ.

    ``primes_range``: ``"closed"`` lists the primes of [a, b], ``"half-open"`` of [a, b).
    ``factor_shape``: ``"any"`` accepts {p: e}, [p, p, q] and [(p, e)]; the others demand one.
    ``invalid_input``: ``"raise"`` demands an exception on an input outside the role's
    domain (nth_prime(0), prev_prime(2), factor(0), ...); ``"unchecked"`` accepts any
    answer there, though a hang or a crash is still a finding.
    """

    primes_range: str = "closed"
    factor_shape: str = "any"
    invalid_input: str = "unchecked"

    def __post_init__(self):
        for name, value, allowed in (("primes_range", self.primes_range, RANGE_CONVENTIONS),
                                     ("factor_shape", self.factor_shape, FACTOR_SHAPES),
                                     ("invalid_input", self.invalid_input, INVALID_INPUT_POLICIES)):
            if value not in allowed:
                raise InvalidInputError(f"{name}={value!r}: expected one of {', '.join(allowed)}")


@dataclass(frozen=True)
class Verdict:
    """The judgement of one answer: ``passed``, the reference and where it came from.

    ``check`` names the comparison: ``exact`` (the oracle's value), ``proven-interval``,
    ``short-interval``, ``factorization``, ``listing``, ...  ``reach`` is ``False`` when
    no reference could be had at all (the check was skipped, not passed).
    """

    check: str
    passed: bool
    expected: object
    provenance: str
    detail: str = ""
    reach: bool = True


class WrongType(Exception):
    """A raw answer whose type the role does not accept; the message says what came back."""


#: An integer answer of more bits is wrong whatever the input: inputs have at most 4000 digits
#: (oracle._integers.MAX_DIGITS) and no role's answer to one has more than about 4010, so such
#: an answer is refused unread (it is not even converted to text: Python refuses above 4300).
MAX_ANSWER_BITS = 14_000


class AbsurdAnswer(WrongType):
    """An integer answer larger than any answer to any input (:data:`MAX_ANSWER_BITS`): a
    wrong answer, judged without the oracle."""


def _type_name(raw: object) -> str:
    """The name of the type the candidate answered with: an answer of a type that cannot cross
    the worker's pipe arrives as a stand-in (``oracle.targets._protocol.Opaque``) that carries
    the name of the candidate's type, which is the one to name."""
    if type(raw).__name__ == "Opaque" and isinstance(getattr(raw, "type_name", None), str):
        return bounded_text(raw.type_name, 60)
    return type(raw).__name__


def _shown(raw: object, limit: int = 60) -> str:
    """A short repr of a raw answer for a message, never built whole."""
    if isinstance(raw, (str, bytes)):
        return repr(raw[:limit]) + (f"... ({len(raw)} characters)" if len(raw) > limit else "")
    return bounded_text(raw, limit)


@dataclass(frozen=True)
class Role:
    """One role: its name, domain, how answers are normalised, judged and related.

    ``arity`` is 1, or 2 for ``primes_in(a, b)``.  ``minimum`` is the smallest valid
    argument (each argument, for arity 2).  ``counting`` roles are non-decreasing
    functions of their argument, which is what makes bisection to a first
    divergence meaningful.  ``magnitude`` maps arguments to the size used for the
    declared domain (``--max``) and for ordering.  ``memory``, when given, makes
    what the judge may remember during one run (exact values already computed,
    from which nearby ones come cheaply); the engine then passes it to ``judge``
    as the keyword ``memory``.
    """

    name: str
    arity: int
    minimum: int
    counting: bool
    signature: str
    normalise: Callable[[object, Conventions], object]
    judge: Callable[[tuple, object, Conventions, float | None], Verdict]
    invalid_inputs: tuple[tuple[int, ...], ...] = ()
    relations: Callable[[dict, Conventions, float | None], list] | None = None
    families: tuple[str, ...] = field(default=())
    memory: Callable[[], object] | None = None
    #: The argument whose size the cost of a call follows (None: the largest argument); for
    #: prime_pi_mod(x, q, a) it is x, whatever the modulus.
    size_argument: int | None = None

    def magnitude(self, arguments: Sequence[int]) -> int:
        if self.size_argument is not None:
            return arguments[self.size_argument]
        return max(arguments)


def as_integer(raw: object) -> int:
    """``raw`` as an ``int``: ints and integer-like objects (numpy, gmpy2) only."""
    if type(raw) is int and raw.bit_length() <= MAX_ANSWER_BITS:       # the common case, first
        return raw
    if isinstance(raw, bool):
        raise WrongType(f"a bool ({raw!r}) where an integer is expected")
    if isinstance(raw, int):            # a subclass: the integer it holds, not what its
        return _not_absurd(int.__index__(raw))      # __int__ or __index__ says
    if isinstance(raw, float):
        raise WrongType(f"a float ({raw!r}) where an integer is expected")
    if raw is None or isinstance(raw, (str, bytes)):
        raise WrongType(f"{type(raw).__name__} {_shown(raw)} where an integer is expected")
    try:
        return _not_absurd(operator.index(raw))
    except TypeError:
        raise WrongType(f"a {_type_name(raw)} ({_shown(raw)}) where an integer is expected") from None


def _not_absurd(value: int) -> int:
    if value.bit_length() > MAX_ANSWER_BITS:
        raise AbsurdAnswer(f"{describe_integer(value)}: larger than any answer to an input of "
                           "at most 4000 digits")
    return value


def as_boolean(raw: object) -> bool:
    """``raw`` as a ``bool``: bools (numpy bools included) and the integers 0 and 1."""
    if isinstance(raw, bool):
        return raw
    if type(raw).__name__ == "bool_":          # numpy.bool_
        return bool(raw)
    if isinstance(raw, float) or raw is None or isinstance(raw, (str, bytes)):
        raise WrongType(f"{type(raw).__name__} {_shown(raw)} where a bool is expected")
    try:
        value = int.__index__(raw) if isinstance(raw, int) else operator.index(raw)
    except TypeError:
        raise WrongType(f"a {_type_name(raw)} where a bool is expected") from None
    if value not in (0, 1):
        raise WrongType(f"the integer {bounded_text(value, 60)} where a bool (or 0/1) is expected")
    return bool(value)


def as_integer_sequence(raw: object) -> list[int]:
    """An iterable of integers as a list of ``int`` (a str or a mapping is refused)."""
    if raw is None or isinstance(raw, (str, bytes, dict, int, float)):
        raise WrongType(f"{type(raw).__name__} {_shown(raw)} where an iterable of integers is expected")
    tolist = getattr(raw, "tolist", None)           # numpy arrays
    items: Iterable = tolist() if callable(tolist) else raw
    try:
        return [as_integer(item) for item in items]
    except TypeError:
        raise WrongType(f"a {_type_name(raw)} that is not iterable") from None


def exact_verdict(got: object, expected: object, provenance: str, show=repr) -> Verdict:
    """The ``exact`` check: equality with the oracle's value."""
    passed = got == expected
    return Verdict("exact", passed, expected, provenance,
                   "" if passed else f"got {show(got)}, expected {show(expected)}")
