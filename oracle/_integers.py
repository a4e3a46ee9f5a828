"""Strict integer handling: validation of arguments and safe parsing of text.

The oracle answers questions about integers only.  A float that happens to be
integral (``1e12``) is refused as an *argument*, because silently truncating
``2.5`` or rounding ``2**64 + 1.0`` would be a wrong answer; ``bool`` is
refused because ``True`` is almost always a bug in the caller.  Objects that
implement ``__index__`` (numpy integers, gmpy2 ``mpz``) are accepted and
converted to ``int``.

On the command line, text is parsed without ``eval``: decimal literals with
optional underscores, ``a**b``, ``a^b``, products/sums/differences of those,
and scientific notation ``1e12`` / ``2.5e3`` when the value is exactly integral
(the grammar is in :func:`parse_integer`).  Only ASCII digits are read: Python's
``int`` also accepts Arabic-Indic, full-width and other Unicode digits, which
are refused here with a message that names the character.  Evaluation is exact
(rationals, never floats) and bounded: the text length, the number of tokens,
the nesting, every exponent and every intermediate numerator *and* denominator
are checked before or right after each step, so no input can run long or eat
memory (``((0.5**16000)**16000)**16000`` is refused at the first power).
"""

from __future__ import annotations

import operator
import re
from fractions import Fraction

from ._errors import InvalidInputError

__all__ = ["require_int", "parse_integer", "MAX_DIGITS"]

#: Largest input size the oracle accepts at all (decimal digits).  Far beyond
#: anything any method here can answer; it stops ``10**10**9`` from eating RAM.
MAX_DIGITS = 4000
#: Largest numerator or denominator of any intermediate value of :func:`parse_integer` (bits).
MAX_BITS = MAX_DIGITS * 4
#: Largest exponent of ``a**b`` (above it even ``2**b`` is beyond :data:`MAX_BITS`).
MAX_EXPONENT = MAX_BITS
#: Longest text :func:`parse_integer` reads (room for one literal of :data:`MAX_DIGITS` digits).
MAX_TEXT = MAX_DIGITS + 200
#: Most numbers and operators in one expression.
MAX_TOKENS = 200
#: Deepest nesting of parentheses, signs and powers in one expression.
MAX_NESTING = 40


def require_int(name: str, value: object, *, minimum: int | None = None,
                maximum: int | None = None) -> int:
    """Return ``value`` as an ``int`` or raise :class:`InvalidInputError`.

    ``name`` is the argument name used in the message, e.g. ``"x"``.
    """
    if isinstance(value, bool):
        raise InvalidInputError(f"{name}={value!r}: a bool is not an integer argument")
    if isinstance(value, int):
        number = int(value)
    elif isinstance(value, float):
        raise InvalidInputError(
            f"{name}={value!r}: floats are refused (pass an int; "
            f"a float cannot represent every integer above 2**53 exactly)")
    else:
        try:
            number = operator.index(value)
        except TypeError:
            raise InvalidInputError(
                f"{name}={value!r}: expected an integer, got {type(value).__name__}") from None
    if number.bit_length() > MAX_DIGITS * 3.33:
        raise InvalidInputError(f"{name}: absurd size ({number.bit_length()} bits); "
                                f"the limit is about {MAX_DIGITS} decimal digits")
    if minimum is not None and number < minimum:
        raise InvalidInputError(f"{name}={number}: must be >= {minimum}")
    if maximum is not None and number > maximum:
        raise InvalidInputError(f"{name}={number}: must be <= {maximum}")
    return number


_TOKEN = re.compile(r"\s*(?:(?P<num>[0-9][0-9_]*(?:\.[0-9][0-9_]*)?(?:[eE][+-]?[0-9]+)?)"
                    r"|(?P<op>\*\*|[-+*^()]))", re.ASCII)


def parse_integer(text: str) -> int:
    """Parse an integer expression from the command line, without ``eval``.

    Grammar (usual precedence, ``**``/``^`` right-associative)::

        expr   := term (('+' | '-') term)*
        term   := power ('*' power)*
        power  := unary (('**' | '^') power)?
        unary  := ('-' | '+') unary | atom
        atom   := NUMBER | '(' expr ')'
        NUMBER := DIGITS ('.' DIGITS)? (('e' | 'E') ('+' | '-')? [0-9]+)?
        DIGITS := [0-9] ('_'? [0-9])*

    Every limit of :data:`MAX_TEXT`, :data:`MAX_TOKENS`, :data:`MAX_NESTING`,
    :data:`MAX_EXPONENT` and :data:`MAX_BITS` is checked before the work it bounds.

    >>> parse_integer("2**64-1")
    18446744073709551615
    >>> parse_integer("1e12")
    1000000000000
    """
    if not isinstance(text, str):
        raise InvalidInputError(f"expected text, got {type(text).__name__}")
    if len(text) > MAX_TEXT:
        raise InvalidInputError(f"{_quote(text)}: {len(text)} characters, more than the limit "
                                f"of {MAX_TEXT}")
    _require_ascii(text)
    tokens = _tokenize(text)
    parser = _Parser(text, tokens)
    value = parser.expression()
    if parser.position != len(tokens):
        raise InvalidInputError(f"{_quote(text)}: unexpected {tokens[parser.position]!r}")
    if value.denominator != 1:
        raise InvalidInputError(f"{_quote(text)} is not an integer (it equals {_approximate(value)})")
    return require_int("value", int(value))


def _quote(text: str, limit: int = 60) -> str:
    """``repr`` of the user's text, cut so that an error stays one readable line."""
    return repr(text) if len(text) <= limit else repr(text[:limit]) + f"... ({len(text)} characters)"


def _approximate(value: Fraction) -> str:
    """A short exact-enough description of a non-integral rational (no float overflow)."""
    whole = value.numerator // value.denominator
    return f"{whole} + a fraction" if whole.bit_length() > 50 else repr(float(value))


def _require_ascii(text: str) -> None:
    """Refuse every non-ASCII character, naming Unicode digits (Python's ``int`` accepts them)."""
    if text.isascii():
        return
    import unicodedata

    position, character = next((i, c) for i, c in enumerate(text) if not c.isascii())
    name = unicodedata.name(character, "unnamed character")
    kind = "a non-ASCII digit" if character.isdigit() or character.isnumeric() else "not ASCII"
    raise InvalidInputError(f"{_quote(text)}: character {position + 1}, U+{ord(character):04X} "
                            f"{name}, is {kind}; only the ASCII digits 0-9 are accepted")


def _tokenize(text: str) -> list[str]:
    tokens: list[str] = []
    position = 0
    stripped = text.rstrip()
    if not stripped:
        raise InvalidInputError("empty input: expected an integer such as 1000, 10**12 or 2**64-1")
    while position < len(stripped):
        match = _TOKEN.match(stripped, position)
        if match is None or match.end() == position:
            raise InvalidInputError(
                f"{_quote(text)}: cannot read {stripped[position:position + 10]!r} "
                f"(allowed: digits, _, e-notation, + - * ** ^ and parentheses)")
        tokens.append(match.group("num") or match.group("op"))
        if len(tokens) > MAX_TOKENS:
            raise InvalidInputError(f"{_quote(text)}: more than {MAX_TOKENS} numbers and operators")
        position = match.end()
    return tokens


class _Parser:
    """Recursive-descent evaluator over exact rationals (``Fraction``), every value bounded."""

    def __init__(self, text: str, tokens: list[str]):
        self.text = text
        self.tokens = tokens
        self.position = 0
        self.depth = 0

    def _too_large(self, what: str) -> InvalidInputError:
        return InvalidInputError(f"{_quote(self.text)}: absurd size ({what}; the limit is "
                                 f"{MAX_BITS} bits, about {MAX_DIGITS} digits)")

    def _peek(self) -> str | None:
        return self.tokens[self.position] if self.position < len(self.tokens) else None

    def _take(self) -> str:
        token = self._peek()
        if token is None:
            raise InvalidInputError(f"{_quote(self.text)}: expression ends too early")
        self.position += 1
        return token

    def _nest(self) -> None:
        self.depth += 1
        if self.depth > MAX_NESTING:
            raise InvalidInputError(f"{_quote(self.text)}: nested more than {MAX_NESTING} levels "
                                    "deep (parentheses, signs, powers)")

    def expression(self) -> Fraction:
        value = self.term()
        while self._peek() in ("+", "-"):
            sign = self._take()
            right = self.term()
            value = self._bounded(value + right if sign == "+" else value - right)
        return value

    def term(self) -> Fraction:
        value = self.power()
        while self._peek() == "*":
            self._take()
            value = self._bounded(value * self.power())
        return value

    def power(self) -> Fraction:
        self._nest()
        base = self.unary()
        if self._peek() in ("**", "^"):
            self._take()
            exponent = self.power()
            if exponent.denominator != 1 or exponent < 0:
                raise InvalidInputError(f"{_quote(self.text)}: exponents must be non-negative integers")
            if exponent > MAX_EXPONENT:
                raise InvalidInputError(f"{_quote(self.text)}: exponent {_short(int(exponent))} is above "
                                        f"the limit of {MAX_EXPONENT}")
            widest = max(base.numerator.bit_length(), base.denominator.bit_length())
            if abs(base) != 1 and base != 0 and exponent * (widest - 1) > MAX_BITS:
                raise self._too_large(f"a power of about {int(exponent) * (widest - 1)} bits")
            base = self._bounded(base ** int(exponent))
        self.depth -= 1
        return base

    def unary(self) -> Fraction:
        if self._peek() in ("-", "+"):
            sign = self._take()
            self._nest()
            value = self.unary()
            self.depth -= 1
            return -value if sign == "-" else value
        return self.atom()

    def atom(self) -> Fraction:
        token = self._take()
        if token == "(":
            self._nest()
            value = self.expression()
            self.depth -= 1
            if self._take() != ")":
                raise InvalidInputError(f"{_quote(self.text)}: missing ')'")
            return value
        if token[0].isdigit():
            return self._number(token)
        raise InvalidInputError(f"{_quote(self.text)}: unexpected {token!r}")

    def _number(self, token: str) -> Fraction:
        if "__" in token or token.endswith("_") or "_." in token or "._" in token \
                or "_e" in token.lower():
            raise InvalidInputError(f"{_quote(self.text)}: misplaced '_' in {_short(token)}")
        mantissa, _, exponent = token.replace("_", "").lower().partition("e")
        if len(mantissa) > MAX_DIGITS + 1:
            raise self._too_large(f"a number of {len(mantissa)} digits")
        if len(exponent.lstrip("+-")) > 6 or (exponent and abs(int(exponent)) > MAX_DIGITS):
            raise self._too_large(f"e-notation exponent {_short(exponent)}")
        value = Fraction(mantissa)
        if exponent:
            value *= Fraction(10) ** int(exponent)
        return self._bounded(value)

    def _bounded(self, value: Fraction) -> Fraction:
        if value.numerator.bit_length() > MAX_BITS:
            raise self._too_large(f"a value of {value.numerator.bit_length()} bits")
        if value.denominator.bit_length() > MAX_BITS:
            raise self._too_large(f"a denominator of {value.denominator.bit_length()} bits")
        return value


def _short(value: object, limit: int = 30) -> str:
    text = value if isinstance(value, str) else (str(value) if abs(value).bit_length() < 200
                                                  else f"of {abs(value).bit_length()} bits")
    return text if len(text) <= limit else text[:limit] + "..."
