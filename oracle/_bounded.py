"""Bounded forms of what a candidate controls: its answers, error messages, reprs, names.

A candidate may answer a 100,000-digit integer, a 10 MB string or a list of
ten million items, raise with a megabyte of message, or carry a name of any
length.  Whatever of it is shown (terminal, HTML) or stored (the records of a
run, the JSON summary) goes through this module, so every such text is at most
:data:`TEXT_LIMIT` characters and every stored value a bounded JSON form:

* :func:`bounded_text` -- the one function for text: a string cut to the limit
  with the length it had, an integer of more than :data:`INTEGER_DIGITS` digits
  described as ``an integer of N digits`` (estimated from ``int.bit_length``,
  never converted to text whole: Python refuses ``str()`` above 4300 digits
  anyway), any other object by a bounded ``repr`` that never raises;
* :func:`bounded_value` -- a JSON-able copy of an answer within
  :data:`VALUE_LIMIT` characters: lists and mappings keep their first items and
  say how many there were, strings and huge integers become bounded text.

Cut texts say that they were cut (``... (10485760 characters)``), so nobody
takes them for the candidate's whole answer.
"""

from __future__ import annotations

import math
import re
import reprlib

__all__ = ["TEXT_LIMIT", "VALUE_LIMIT", "INTEGER_DIGITS", "bounded_text", "bounded_value",
           "describe_integer", "integer_digits", "printable"]

#: Longest text kept of one candidate-controlled string (message, repr, answer, name).
TEXT_LIMIT = 2000
#: Longest JSON form (characters, about) of one stored value: an answer or an expected value.
VALUE_LIMIT = 16000
#: Integers with more decimal digits are described, not written (below Python's 4300).
INTEGER_DIGITS = 4200
#: Deepest nesting of lists and mappings kept in a stored value.
_DEPTH = 6

_LOG10_2 = math.log10(2)
_CUT = re.compile(r"\.\.\. \((\d+) characters\)\Z")


def integer_digits(number: int) -> int:
    """The number of decimal digits of ``number`` (without its sign), from its bit length:
    exact up to a million bits, else an estimate within one digit."""
    bits = abs(number).bit_length()
    if bits == 0:
        return 1
    digits = int((bits - 1) * _LOG10_2) + 1            # 10**(digits - 1) <= 2**(bits - 1)
    if bits <= 1_000_000 and abs(number) >= 10 ** digits:
        digits += 1
    return digits


def describe_integer(number: int) -> str:
    """``an integer of N digits`` (``a negative integer of ...``), for numbers too long to show."""
    digits = integer_digits(number)
    about = "" if abs(number).bit_length() <= 1_000_000 else "about "
    sign = "a negative integer" if number < 0 else "an integer"
    return f"{sign} of {about}{digits} digits"


class _Repr(reprlib.Repr):
    """reprlib, with huge integers described and every repr bounded and safe."""

    def __init__(self, limit: int):
        super().__init__()
        self.maxlevel = 4
        self.maxtuple = self.maxlist = self.maxarray = self.maxdict = 20
        self.maxset = self.maxfrozenset = self.maxdeque = 20
        self.maxstring = self.maxother = self.maxlong = limit

    def repr_int(self, x, level):
        if x.bit_length() > INTEGER_DIGITS * 3.3:
            return f"<{describe_integer(x)}>"
        return repr(x)

    def repr_instance(self, x, level):
        try:
            text = repr(x)
        except KeyboardInterrupt:
            raise                                   # the user's Ctrl-C during a slow repr
        except BaseException:                       # a hostile __repr__ raises: say what it is
            return f"<{type(x).__name__} object>"
        return text if len(text) <= self.maxother else text[:self.maxother]


#: Characters that act on a terminal instead of showing: C0 controls but the tab (escape
#: sequences, carriage return, newline, bell), DEL, C1 controls, and the bidirectional
#: embeddings, overrides and isolates that reorder what is shown.
_CONTROLS = re.compile("[\x00-\x08\x0a-\x1f\x7f-\x9f\u202a-\u202e\u2066-\u2069]")


def printable(line: str) -> str:
    """One line of terminal text with every control character written as a visible escape
    (``\\x1b``, ``\\r``, ``\\n``...): text a candidate controls (an exception message, its
    output, a string answer) then cannot move the cursor, erase or recolour what the harness
    printed, or start a line of its own, say a forged verdict."""
    return _CONTROLS.sub(lambda found: repr(found.group())[1:-1], line)


def bounded_text(value: object, limit: int = TEXT_LIMIT) -> str:
    """``value`` as text of at most about ``limit`` characters: a ``str`` itself (a longer one
    is cut and says how long it was), an ``int`` in decimal (or :func:`describe_integer`
    beyond :data:`INTEGER_DIGITS` digits), anything else its ``repr``, built with the long
    parts left out (``[1, 2, 3, ...]``) and never raising."""
    if isinstance(value, str):
        text = value
    elif type(value) is int or (isinstance(value, int) and not isinstance(value, bool)):
        value = int.__index__(value)        # a subclass: the integer it holds, not its methods'
        if integer_digits(value) > INTEGER_DIGITS:
            return describe_integer(value)
        text = str(value)
        return text if len(text) <= limit else f"{text[:limit]}... ({len(text.lstrip('-'))} digits)"
    else:
        try:
            text = _Repr(limit).repr(value)         # reprlib marks what it leaves out with ...
        except KeyboardInterrupt:
            raise
        except BaseException:
            text = f"<{type(value).__name__} object>"
        return text if len(text) <= limit else text[:limit] + "..."
    if len(text) > limit:
        found = _CUT.search(text)                   # cut before: keep the size it had then
        return f"{text[:limit]}... ({found.group(1) if found else len(text)} characters)"
    return text


def bounded_value(value: object, limit: int = VALUE_LIMIT) -> object:
    """A JSON-able copy of ``value`` whose JSON text is at most about ``limit`` characters:
    ints (up to :data:`INTEGER_DIGITS` digits), bools and None as they are, tuples as lists,
    floats and other objects as bounded text, long strings cut; a long list or mapping keeps
    its first items and ends with ``"... and K more (N in all)"``."""
    budget = [limit]
    return _bounded(value, budget, 0)


def _bounded(value: object, budget: list, depth: int) -> object:
    if value is None or isinstance(value, bool):
        budget[0] -= 5
        return value
    if isinstance(value, int):
        value = int.__index__(value)        # a subclass: the integer it holds
        if integer_digits(value) > INTEGER_DIGITS:
            text = describe_integer(value)
            budget[0] -= len(text) + 2
            return text
        number = value
        budget[0] -= integer_digits(number) + 2
        return number
    if isinstance(value, str):
        text = bounded_text(value, max(40, min(TEXT_LIMIT, budget[0])))
        budget[0] -= len(text) + 2
        return text
    if isinstance(value, (list, tuple)) and depth < _DEPTH:
        items = []
        for index, item in enumerate(value):
            if budget[0] <= 0:
                items.append(f"... and {len(value) - index} more ({len(value)} in all)")
                break
            items.append(_bounded(item, budget, depth + 1))
        return items
    if isinstance(value, dict) and depth < _DEPTH:
        mapping = {}
        for index, (key, item) in enumerate(value.items()):
            if budget[0] <= 0:
                mapping["..."] = f"and {len(value) - index} more ({len(value)} in all)"
                break
            name = _key(key)
            budget[0] -= len(name) + 4
            mapping[name] = _bounded(item, budget, depth + 1)
        return mapping
    if isinstance(value, float):
        text = repr(value)
    else:
        text = bounded_text(value, max(40, min(TEXT_LIMIT, budget[0])))
    budget[0] -= len(text) + 2
    return text


def _key(key: object) -> str:
    """A mapping key as JSON text: ``str(key)`` for ints (a factorisation's primes) and short
    strings, bounded text otherwise."""
    if isinstance(key, int) and not isinstance(key, bool) and integer_digits(key) <= INTEGER_DIGITS:
        return str(int(key))
    if isinstance(key, str) and len(key) <= 200:
        return key
    if key is None or isinstance(key, (bool, float)):
        return str(key)
    return bounded_text(key, 200)
