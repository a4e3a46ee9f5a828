"""The child process that runs a Python candidate, and the bounding of a candidate's answers.

Run as ``python -P _worker.py --requests FD --answers FD [--memory BYTES] [--output BYTES]
--parent PID SPEC`` by :mod:`oracle.targets._line_process`.  This file uses the standard
library only and is run by its path, so the child never imports the oracle: a candidate that
patches ``oracle`` patches nothing the judge uses (the judge lives in the parent).

The child, before it imports the candidate:

* asks the kernel to kill it when the parent dies (Linux ``PR_SET_PDEATHSIG``), so a killed
  harness leaves no orphaned worker;
* caps its address space (``RLIMIT_AS``) and the size of any file it writes (``RLIMIT_FSIZE``:
  its stdout and stderr go to files of the parent, so a candidate that floods its output is
  stopped by ``SIGXFSZ``);
* talks to the parent only over two private pipes (``--requests``/``--answers``), never over
  stdout, so the candidate's prints cannot be taken for answers.

Protocol: the first line on the answer pipe is the handshake, ``{"ready": true}`` or
``{"load_error": "..."}``.  Then one JSON list of arguments per request line, one JSON object
per answer line: ``{"value": V, "seconds": S}`` or ``{"raised": "Type: message", "seconds": S}``
(:func:`encode_value` gives V), each written as soon as it is known.

Answers are bounded before they are encoded (:func:`bounded_answer`): an iterator is consumed
up to :data:`MAX_ITEMS` items, an integer of more than :data:`MAX_DIGITS` decimal digits is
replaced by its size, never converted whole (Python refuses int→str above 4300 digits).  Only integers of more than ``MAX_DIGITS``
digits are replaced, so every ordinary answer arrives whole.
"""

from __future__ import annotations

import importlib
import itertools
import json
import math
import os
import re
import sys
import time

#: Items of an answer (a list, or an iterator consumed) beyond which it is "over-long".
MAX_ITEMS = 1 << 24
#: Decimal digits of an integer beyond which it is described by its size only.
MAX_DIGITS = 4200
#: Bits of the smallest integer with more than MAX_DIGITS digits, give or take one digit.
_HUGE_BITS = math.ceil(MAX_DIGITS / math.log10(2))
#: Characters of a string answer kept (as oracle._bounded.TEXT_LIMIT).
_MAX_TEXT = 2000
#: Nesting of an answer beyond which it is described, not encoded.
_MAX_DEPTH = 20

SPEC = re.compile(r"^[A-Za-z_][\w.]*:[A-Za-z_][\w.]*$")


class Oversized:
    """An integer answer too large to show: only its number of decimal digits is kept."""

    def __init__(self, digits: int, negative: bool = False):
        self.digits, self.negative = digits, negative

    @classmethod
    def of(cls, value: int) -> "Oversized":
        """The size of ``value``, from its bit length (exact: 2**(b-1) <= |value| < 2**b leaves
        two digit counts, and one comparison with a power of ten decides)."""
        bits = abs(value).bit_length()
        digits = int((bits - 1) * math.log10(2)) + 1
        if abs(value) >= 10 ** digits:
            digits += 1
        return cls(digits, value < 0)

    def __repr__(self) -> str:
        return f"<{'a negative' if self.negative else 'an'} integer of {self.digits} digits>"

    def __eq__(self, other):
        return isinstance(other, Oversized) and (other.digits, other.negative) == (self.digits, self.negative)

    def __hash__(self):
        return hash(("Oversized", self.digits, self.negative))


class Overlong:
    """An answer with more than :data:`MAX_ITEMS` items (an endless iterator, most likely)."""

    def __init__(self, items: int, endless: bool):
        self.items, self.endless = items, endless

    def __repr__(self) -> str:
        kind = "an iterator that yielded" if self.endless else "a collection of"
        return f"<{kind} more than {self.items - 1} items>"

    def __eq__(self, other):
        return isinstance(other, Overlong) and (other.items, other.endless) == (self.items, self.endless)

    def __hash__(self):
        return hash(("Overlong", self.items, self.endless))


def bounded_answer(value: object, depth: int = 0) -> object:
    """``value`` with iterators consumed (at most MAX_ITEMS + 1 items), huge integers replaced
    by :class:`Oversized` and collections of more than MAX_ITEMS items by :class:`Overlong`."""
    if type(value) is int:
        return value if value.bit_length() <= _HUGE_BITS else Oversized.of(value)
    if isinstance(value, bool) or value is None or isinstance(value, (float, str, bytes)):
        return value
    if isinstance(value, int):          # a subclass: its own value, whatever its methods say
        value = true_int(value)
        return Oversized.of(value) if value.bit_length() > _HUGE_BITS else value
    if depth > _MAX_DEPTH:
        return _Described(type(value).__name__, "nested too deeply")
    if hasattr(value, "__next__"):
        items = list(itertools.islice(value, MAX_ITEMS + 1))
        if len(items) > MAX_ITEMS:
            return Overlong(len(items), endless=True)
        return [bounded_answer(item, depth + 1) for item in items]
    if isinstance(value, (list, tuple, set, frozenset, dict)):
        if len(value) > MAX_ITEMS:
            return Overlong(len(value) + 1, endless=False)
        if isinstance(value, dict):
            return {bounded_answer(k, depth + 1): bounded_answer(v, depth + 1) for k, v in value.items()}
        base = next(kind for kind in (list, tuple, set, frozenset) if isinstance(value, kind))
        return base(bounded_answer(item, depth + 1) for item in value)
    return value


def true_int(value: int) -> int:
    """The integer an ``int`` subclass holds, as a plain ``int``.  ``int.__index__`` reads the
    stored digits; ``int(value)``, ``operator.index``, ``abs`` and ``bit_length`` would call the
    subclass's own methods, which may say anything (an answer that holds 97 but whose
    ``__int__`` says 96 is 97 to every comparison and every sum its user makes)."""
    return int.__index__(value)


def contains_oversized(value: object, depth: int = 0) -> bool:
    """Whether a bounded answer holds an :class:`Oversized` or :class:`Overlong` anywhere."""
    if isinstance(value, (Oversized, Overlong)):
        return True
    if depth > _MAX_DEPTH or not isinstance(value, (list, tuple, set, frozenset, dict)):
        return False
    items = list(value.items()) if isinstance(value, dict) else value
    return any(contains_oversized(item, depth + 1) for item in items)


class _Described:
    """Stand-in for a value that is not encoded: its type name and a short note."""

    def __init__(self, type_name: str, text: str):
        self.type_name, self.text = type_name, text

    def __repr__(self) -> str:
        return f"<{self.type_name} {self.text}>"


def _short_repr(value: object) -> str:
    try:
        return repr(value)[:200]
    except BaseException:       # a candidate's __repr__ may do anything
        return "<unprintable>"


def encode_value(value: object, depth: int = 0) -> object:
    """A JSON-able, type-preserving form of a bounded answer (see :func:`bounded_answer`)."""
    if isinstance(value, bool) or value is None:
        return value
    if isinstance(value, int):
        return true_int(value)
    if depth > _MAX_DEPTH:
        return {"object": type(value).__name__, "repr": "nested too deeply"}
    if isinstance(value, Oversized):
        return {"huge": value.digits, "negative": value.negative}
    if isinstance(value, Overlong):
        return {"overlong": value.items, "endless": value.endless}
    if isinstance(value, float):
        return {"float": repr(value)}
    if isinstance(value, str):      # cut as oracle._bounded cuts, saying how long it was
        return {"str": value if len(value) <= _MAX_TEXT else
                f"{value[:_MAX_TEXT]}... ({len(value)} characters)"}
    if isinstance(value, dict):
        return {"dict": [[encode_value(k, depth + 1), encode_value(v, depth + 1)] for k, v in value.items()]}
    if type(value).__name__ == "bool_":
        return bool(value)
    # an integer type: gmpy2's mpz (which has a len()), flint's fmpz, numpy's scalars come next
    if hasattr(value, "__index__") and not hasattr(value, "shape"):
        return encode_value(bounded_answer(int(value.__index__())), depth + 1)
    if hasattr(value, "dtype") and getattr(value, "shape", None) == ():
        return encode_value(bounded_answer(value.item()), depth + 1)
    if isinstance(value, float) or type(value).__name__.startswith("float"):
        return {"float": repr(float(value))}
    tolist = getattr(value, "tolist", None)
    if callable(tolist):
        return encode_value(bounded_answer(tolist()), depth + 1)
    if isinstance(value, (list, tuple, set, frozenset, range)):
        return {"list": [encode_value(item, depth + 1) for item in value]}
    if isinstance(value, _Described):
        return {"object": value.type_name, "repr": value.text}
    return {"object": type(value).__name__, "repr": _short_repr(value)}


def describe_exception(error: BaseException) -> str:
    """``Type: message``, cut to 300 characters, whatever the exception's ``__str__`` does."""
    try:
        text = str(error)
    except BaseException:
        text = "<unprintable message>"
    return f"{type(error).__name__}: {text}"[:300]


def _die_with_parent(parent: int) -> None:
    try:
        import ctypes

        libc = ctypes.CDLL(None, use_errno=True)
        libc.prctl(1, 9, 0, 0, 0)       # PR_SET_PDEATHSIG = 1, SIGKILL = 9
    except (OSError, AttributeError):
        pass                            # not Linux: the parent's close() still reaps us
    if os.getppid() != parent:          # the parent died before the request took effect
        os._exit(0)


def _limit(memory: int | None, output: int | None) -> None:
    import resource

    if memory:
        resource.setrlimit(resource.RLIMIT_AS, (memory, memory))
    if output:
        resource.setrlimit(resource.RLIMIT_FSIZE, (output, output))
        import signal

        signal.signal(signal.SIGXFSZ, signal.SIG_DFL)   # Python ignores it: a flood must end us


def _load(spec: str):
    """The callable ``module:attribute``, or an error message (the candidate's import may raise
    anything, BaseException included)."""
    if not SPEC.match(spec):
        return None, f"target={spec!r}: expected package.module:function"
    module_name, _, attribute = spec.partition(":")
    try:
        found = importlib.import_module(module_name)
    except BaseException as error:
        return None, f"target={spec!r}: cannot import {module_name!r}: {describe_exception(error)}"
    for part in attribute.split("."):
        try:
            found = getattr(found, part)
        except BaseException:
            return None, f"target={spec!r}: {module_name!r} has no {attribute!r}"
    if not callable(found):
        return None, f"target={spec!r}: {attribute!r} is not callable"
    return found, ""


def _answer(function, arguments: list) -> bytes:
    """The answer line of one call (a plain int or bool, the common case, without json)."""
    started = time.perf_counter()
    try:
        value = bounded_answer(function(*arguments))
        seconds = time.perf_counter() - started
        if type(value) is int:
            return b'{"value": %d, "seconds": %r}\n' % (value, seconds)
        if type(value) is bool:
            return b'{"value": %s, "seconds": %r}\n' % (b"true" if value else b"false", seconds)
        return _encode_message({"value": encode_value(value), "seconds": seconds})
    except BaseException as error:       # KeyboardInterrupt, SystemExit, MemoryError...
        return _encode_message({"raised": describe_exception(error),
                                "seconds": time.perf_counter() - started})


def _encode_message(message: dict) -> bytes:
    try:
        return (json.dumps(message) + "\n").encode()
    except (ValueError, TypeError, RecursionError) as error:
        return (json.dumps({"value": {"object": "unencodable", "repr": describe_exception(error)},
                            "seconds": message.get("seconds", 0.0)}) + "\n").encode()


def _write_all(fd: int, data: bytes) -> None:
    view = memoryview(data)
    while view:
        view = view[os.write(fd, view):]


def serve(function, requests: int, answers: int) -> None:
    """Answer every request line on ``requests`` until the parent closes it.  Each answer is
    written as soon as it is known (a later call may hang: the answers before it must not wait
    for it); the parent reads whatever has arrived in one go."""
    pending = bytearray()
    while True:
        chunk = os.read(requests, 1 << 16)
        if not chunk:
            return
        pending += chunk
        lines = pending.split(b"\n")
        pending = bytearray(lines.pop())
        for line in lines:
            _write_all(answers, _answer(function, json.loads(line)))


def main(argv: list[str]) -> int:
    options = dict(zip(argv[:-1:2], argv[1:-1:2]))
    spec = argv[-1]
    requests, answers = int(options["--requests"]), int(options["--answers"])
    _die_with_parent(int(options["--parent"]))
    _limit(int(options.get("--memory", 0)) or None, int(options.get("--output", 0)) or None)
    function, error = _load(spec)
    _write_all(answers, _encode_message({"load_error": error} if error else {"ready": True}))
    if error:
        return 3
    serve(function, requests, answers)
    return 0


if __name__ == "__main__":
    sys.exit(main(sys.argv[1:]))
