"""The line protocols: how requests and answers travel as text lines.

Executable candidates (docs/DESIGN.md): one request per line on stdin -- one integer,
or two separated by a space for primes_in -- and one answer per line on stdout:
an integer; for is_prime ``1``/``0`` or ``true``/``false``; for primes_in the
primes separated by spaces (an empty line for none); for factor the prime
factors with multiplicity separated by spaces (``2 2 3``), ``p^e`` allowed
(``2^2 3``).  A line starting with ``error`` is the candidate refusing the
input (it counts as raising an exception).  Anything else is passed on as
text, which the role then reports as a wrong type.

The isolated Python worker speaks the same framing with JSON values, so that
types survive the trip: a float stays a float, ``None`` stays ``None``.
"""

from __future__ import annotations

import json
import re

__all__ = ["encode_text_request", "decode_text_answer", "encode_json_value", "decode_json_answer",
           "Opaque"]

_INTEGER = re.compile(rb"^\s*[-+]?\d+\s*$")
_FACTOR = re.compile(r"^(\d+)(?:(?:\^|\*\*)(\d+))?$")


def encode_text_request(arguments: tuple[int, ...]) -> bytes:
    return (" ".join(str(value) for value in arguments) + "\n").encode()


def decode_text_answer(role_name: str, line: bytes) -> tuple[bool, object]:
    """``(refused, value)`` for one answer line of an executable."""
    text = line.decode(errors="replace").strip()
    if text.lower().startswith("error"):
        return True, text
    if role_name == "is_prime":
        lowered = text.lower()
        if lowered in ("1", "true"):
            return False, True
        if lowered in ("0", "false"):
            return False, False
        return False, text
    if role_name == "primes_in":
        tokens = text.split()
        if all(_INTEGER.match(token.encode()) for token in tokens):
            return False, [int(token) for token in tokens]
        return False, text
    if role_name == "factor":
        pairs = []
        for token in text.split():
            match = _FACTOR.match(token)
            if match is None:
                return False, text
            pairs.append((int(match.group(1)), int(match.group(2) or 1)))
        return False, pairs
    if _INTEGER.match(line):
        return False, int(text)
    return False, text


class Opaque:
    """Stand-in for an answer of a type that cannot cross the pipe (its type name and repr)."""

    def __init__(self, type_name: str, text: str):
        self.type_name, self.text = type_name, text

    def __repr__(self) -> str:
        return f"<{self.type_name} {self.text}>"


def encode_json_value(value: object) -> object:
    """A JSON-able, type-preserving form of a candidate's answer."""
    if isinstance(value, bool) or value is None:
        return value
    if isinstance(value, int):
        return int(value)
    if isinstance(value, float):
        return {"float": repr(value)}
    if isinstance(value, str):
        return {"str": value}
    if isinstance(value, dict):
        return {"dict": [[encode_json_value(k), encode_json_value(v)] for k, v in value.items()]}
    if type(value).__name__ == "bool_":
        return bool(value)
    if hasattr(value, "__index__") and not hasattr(value, "__len__"):
        return int(value.__index__())
    if hasattr(value, "dtype") and getattr(value, "shape", None) == ():
        return encode_json_value(value.item())
    tolist = getattr(value, "tolist", None)
    if callable(tolist):
        return encode_json_value(tolist())
    if isinstance(value, (list, tuple, set, frozenset, range)) or hasattr(value, "__next__"):
        return {"list": [encode_json_value(item) for item in value]}
    return {"object": type(value).__name__, "repr": repr(value)[:200]}


def decode_json_value(data: object) -> object:
    if not isinstance(data, dict):
        return data
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


def decode_json_answer(role_name: str, line: bytes) -> tuple[bool, object]:
    message = json.loads(line)
    if "raised" in message:
        return True, message["raised"]
    return False, decode_json_value(message["value"])
