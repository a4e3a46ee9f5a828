"""The line protocols: how requests and answers travel as text lines.

Executable candidates (docs/DESIGN.md): one request per line on stdin -- one integer,
or two separated by a space for primes_in -- and one answer per line on stdout:
an integer; for is_prime ``1``/``0`` or ``true``/``false``; for primes_in the
primes separated by spaces (an empty line for none); for factor the prime
factors with multiplicity separated by spaces (``2 2 3``), ``p^e`` allowed
(``2^2 3``).  A line starting with ``error`` is the candidate refusing the
input (it counts as raising an exception).  Anything else is passed on as
text, which the role then reports as a wrong type.

The isolated Python worker (:mod:`oracle.targets._worker`) speaks the same framing
with JSON values on private pipes, so that types survive the trip: a float stays a
float, ``None`` stays ``None``.
"""

from __future__ import annotations

import json
import math
import re

from ._worker import MAX_DIGITS, Overlong, Oversized

__all__ = ["encode_text_request", "decode_text_answer", "decode_json_answer", "Opaque"]

_INTEGER = re.compile(rb"^\s*[-+]?\d+\s*$")
_FACTOR = re.compile(rb"^(\d+)(?:(?:\^|\*\*)(\d+))?$")
#: Characters of an answer line kept when it is not an answer.
MAX_TEXT = 1000


def encode_text_request(arguments: tuple[int, ...]) -> bytes:
    return (" ".join(str(value) for value in arguments) + "\n").encode()


def decode_text_answer(role_name: str, line: bytes) -> tuple[bool, object, None]:
    """``(refused, value, None)`` for one answer line of an executable; text that is not an answer
    is passed on cut to :data:`MAX_TEXT` characters, an integer of more than
    :data:`oracle.targets._worker.MAX_DIGITS` digits as its size only."""
    text = line[:MAX_TEXT].decode(errors="replace").strip() if len(line) > MAX_TEXT \
        else line.decode(errors="replace").strip()
    if text.lower().startswith("error"):
        return True, text, None
    if role_name == "is_prime":
        lowered = text.lower()
        if lowered in ("1", "true"):
            return False, True, None
        if lowered in ("0", "false"):
            return False, False, None
        return False, text, None
    if role_name == "primes_in":
        tokens = line.split()
        if all(_INTEGER.match(token) for token in tokens):
            return False, [_integer(token) for token in tokens], None
        return False, text, None
    if role_name == "factor":
        pairs = []
        for token in line.split():
            match = _FACTOR.match(token)
            if match is None:
                return False, text, None
            pairs.append((_integer(match.group(1)), _integer(match.group(2) or b"1")))
        return False, pairs, None
    if _INTEGER.match(line):
        return False, _integer(line), None
    return False, text, None


def _integer(token: bytes) -> int | Oversized:
    """The integer of a token of ASCII digits with an optional sign.  Leading zeros are dropped
    first: ``000...05`` is 5 however many zeros come before it (Python's int() would refuse
    it above 4300 characters, and its size is that of 5)."""
    token = token.strip()
    negative = token.startswith(b"-")
    digits = token.lstrip(b"+-").lstrip(b"0") or b"0"
    if len(digits) > MAX_DIGITS:
        return Oversized(len(digits), negative)
    return -int(digits) if negative else int(digits)


class Opaque:
    """Stand-in for an answer of a type that cannot cross the pipe (its type name and repr)."""

    def __init__(self, type_name: str, text: str):
        self.type_name, self.text = type_name, text

    def __repr__(self) -> str:
        return f"<{self.type_name} {self.text}>"


def decode_json_value(data: object) -> object:
    """The answer encoded by :func:`oracle.targets._worker.encode_value`."""
    if not isinstance(data, dict):
        return data
    if "huge" in data:
        return Oversized(int(data["huge"]), bool(data.get("negative")))
    if "overlong" in data:
        return Overlong(int(data["overlong"]), bool(data.get("endless")))
    if "float" in data:
        return float(data["float"])
    if "str" in data:
        return data["str"]
    if "dict" in data:
        return {_hashable(decode_json_value(k)): decode_json_value(v) for k, v in data["dict"]}
    if "list" in data:
        return [decode_json_value(item) for item in data["list"]]
    return Opaque(data.get("object", "object"), data.get("repr", ""))


def _hashable(value: object) -> object:
    return tuple(value) if isinstance(value, list) else value


def decode_json_answer(role_name: str, line: bytes) -> tuple[bool, object, float | None]:
    """``(refused, value, seconds the call took)`` for one answer line of the Python worker."""
    try:
        message = json.loads(line)
        seconds = float(message.get("seconds", 0.0))
        if "raised" in message:
            return True, str(message["raised"])[:300], seconds
        return False, decode_json_value(message["value"]), seconds
    except (ValueError, TypeError, KeyError, RecursionError, AttributeError) as error:
        raise ValueError(f"not an answer of the worker: {type(error).__name__}") from None
