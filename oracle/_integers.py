"""Strict integer handling: validation of arguments and safe parsing of text.

The oracle answers questions about integers only.  A float that happens to be
integral (``1e12``) is refused as an *argument*, because silently truncating
``2.5`` or rounding ``2**64 + 1.0`` would be a wrong answer; ``bool`` is
refused because ``True`` is almost always a bug in the caller.  Objects that
implement ``__index__`` (numpy integers, gmpy2 ``mpz``) are accepted and
converted to ``int``.

On the command line, text is parsed without ``eval``: decimal literals with
optional underscores, ``a**b``, ``a^b``, products/sums/differences of those,
and scientific notation ``1e12`` / ``2.5e3`` when the value is exactly integral.
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


_TOKEN = re.compile(r"\s*(?:(?P<num>\d[\d_]*(?:\.\d[\d_]*)?(?:[eE][+-]?\d+)?)|(?P<op>\*\*|[-+*^()]))")


def parse_integer(text: str) -> int:
    """Parse an integer expression from the command line, without ``eval``.

    Grammar (usual precedence, ``**``/``^`` right-associative)::

        expr   := term (('+' | '-') term)*
        term   := power ('*' power)*
        power  := unary (('**' | '^') power)?
        unary  := '-' unary | atom
        atom   := NUMBER | '(' expr ')'

    >>> parse_integer("2**64-1")
    18446744073709551615
    >>> parse_integer("1e12")
    1000000000000
    """
    if not isinstance(text, str):
        raise InvalidInputError(f"expected text, got {type(text).__name__}")
    tokens = _tokenize(text)
    parser = _Parser(text, tokens)
    value = parser.expression()
    if parser.position != len(tokens):
        raise InvalidInputError(f"{text!r}: unexpected {tokens[parser.position]!r}")
    if value.denominator != 1:
        raise InvalidInputError(f"{text!r} is not an integer (it equals {float(value)!r})")
    return require_int("value", int(value))


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
                f"{text!r}: cannot read {stripped[position:position + 10]!r} "
                f"(allowed: digits, _, e-notation, + - * ** ^ and parentheses)")
        tokens.append(match.group("num") or match.group("op"))
        position = match.end()
    return tokens


class _Parser:
    """Recursive-descent evaluator over exact rationals (``Fraction``)."""

    def __init__(self, text: str, tokens: list[str]):
        self.text = text
        self.tokens = tokens
        self.position = 0

    def _peek(self) -> str | None:
        return self.tokens[self.position] if self.position < len(self.tokens) else None

    def _take(self) -> str:
        token = self._peek()
        if token is None:
            raise InvalidInputError(f"{self.text!r}: expression ends too early")
        self.position += 1
        return token

    def expression(self) -> Fraction:
        value = self.term()
        while self._peek() in ("+", "-"):
            sign = self._take()
            right = self.term()
            value = value + right if sign == "+" else value - right
        return value

    def term(self) -> Fraction:
        value = self.power()
        while self._peek() == "*":
            self._take()
            value = value * self.power()
            self._check_size(value)
        return value

    def power(self) -> Fraction:
        base = self.unary()
        if self._peek() in ("**", "^"):
            self._take()
            exponent = self.power()
            if exponent.denominator != 1 or exponent < 0:
                raise InvalidInputError(f"{self.text!r}: exponents must be non-negative integers")
            if base not in (0, 1, -1) and exponent * max(abs(base).numerator.bit_length(), 1) > MAX_DIGITS * 4:
                raise InvalidInputError(f"{self.text!r}: absurd size (limit about {MAX_DIGITS} digits)")
            base = base ** int(exponent)
        return base

    def unary(self) -> Fraction:
        if self._peek() == "-":
            self._take()
            return -self.unary()
        if self._peek() == "+":
            self._take()
            return self.unary()
        return self.atom()

    def atom(self) -> Fraction:
        token = self._take()
        if token == "(":
            value = self.expression()
            if self._take() != ")":
                raise InvalidInputError(f"{self.text!r}: missing ')'")
            return value
        if token[0].isdigit():
            return self._number(token)
        raise InvalidInputError(f"{self.text!r}: unexpected {token!r}")

    def _number(self, token: str) -> Fraction:
        if "__" in token or token.endswith("_") or "_." in token or "._" in token:
            raise InvalidInputError(f"{self.text!r}: misplaced '_' in {token!r}")
        mantissa, _, exponent = token.replace("_", "").lower().partition("e")
        if exponent and abs(int(exponent)) > MAX_DIGITS:
            raise InvalidInputError(f"{self.text!r}: absurd size (limit about {MAX_DIGITS} digits)")
        value = Fraction(mantissa)
        if exponent:
            value *= Fraction(10) ** int(exponent)
        return value

    def _check_size(self, value: Fraction) -> None:
        if value.numerator.bit_length() > MAX_DIGITS * 4:
            raise InvalidInputError(f"{self.text!r}: absurd size (limit about {MAX_DIGITS} digits)")
