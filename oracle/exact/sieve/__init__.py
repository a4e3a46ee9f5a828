"""Exact counts of primes and prime constellations on intervals, by sieving.

``count(kind, a, b)`` is the number of tuples ``(p, p + d_2, ..., p + d_k)`` of
the pattern ``PATTERNS[kind]`` that lie wholly in ``[a, b]`` with every entry
prime; ``primes(a, b)`` lists the primes of ``[a, b]``.

Below :data:`ENGINE_LIMIT` = 2**64 one of two engines answers:

* ``primesieve`` (Kim Walisch's library, through its Python binding) when it
  can be imported -- the default;
* our numpy segmented sieve of Eratosthenes otherwise.

The environment variable ``NTORACLE_SIEVE_ENGINE`` chooses explicitly:
``numpy`` forces our sieve, ``primesieve`` insists on primesieve (an error if
it is missing); unset or empty means the default.  It is read on every call.

From 2**64 on, :func:`count_beyond_64` answers for short intervals only: small
primes sieve the interval and the survivors are tested with
:func:`oracle.exact.primality.is_prime` -- proven below about 3.2 * 10**23,
Baillie-PSW *probable* primes above, where a count is evidence, not proof.
"""

from __future__ import annotations

import os

import numpy as np

from ..._errors import InvalidInputError, OutOfReachError
from ..._integers import require_int
from . import _primesieve_engine
from ._beyond_64 import ENGINE_LIMIT, count_beyond_64
from ._constellations import KINDS, PATTERNS, offsets_of
from ._segmented import SegmentedSieveEngine

__all__ = ["KINDS", "PATTERNS", "ENGINE_LIMIT", "MAX_LIST_SPAN",
           "count", "primes", "active_engine", "count_beyond_64"]

#: Longest interval (number of integers) :func:`primes` lists at once;
#: it holds at most about 2 * 10**8 primes, 1.6 GB as uint64.
MAX_LIST_SPAN = 2**32

_ENGINE_VARIABLE = "NTORACLE_SIEVE_ENGINE"

_NUMPY_ENGINE = SegmentedSieveEngine()
_PRIMESIEVE_ENGINE = (_primesieve_engine.PrimesieveEngine()
                      if _primesieve_engine.AVAILABLE else None)


def _engines() -> dict[str, object]:
    """The engines that can run here, by short name (for side-by-side tests)."""
    engines = {"numpy": _NUMPY_ENGINE}
    if _PRIMESIEVE_ENGINE is not None:
        engines["primesieve"] = _PRIMESIEVE_ENGINE
    return engines


def _choice() -> tuple[object, str]:
    """The engine that answers now, and the sentence that describes it."""
    requested = os.environ.get(_ENGINE_VARIABLE, "").strip()
    if requested not in ("", "numpy", "primesieve"):
        raise InvalidInputError(
            f"{_ENGINE_VARIABLE}={requested!r}: must be 'numpy' or 'primesieve' (or unset)")
    if requested == "numpy":
        return _NUMPY_ENGINE, f"{_NUMPY_ENGINE.name} (forced by {_ENGINE_VARIABLE}=numpy)"
    if _PRIMESIEVE_ENGINE is not None:
        return _PRIMESIEVE_ENGINE, _PRIMESIEVE_ENGINE.name
    if requested == "primesieve":
        raise InvalidInputError(
            f"{_ENGINE_VARIABLE}=primesieve, but primesieve is not installed "
            f"(pip install 'ntoracle[fast]')")
    return _NUMPY_ENGINE, f"{_NUMPY_ENGINE.name} (primesieve not installed)"


def active_engine() -> str:
    """Which engine answers below 2**64, e.g. ``"primesieve 11.0"``."""
    return _choice()[1]


def count(kind: str, a: int, b: int) -> int:
    """Number of tuples of ``kind`` lying wholly in ``[a, b]`` (0 when ``b < a``).

    ``a >= 0``.  For ``b >= 2**64`` the interval must be short, see
    :func:`count_beyond_64`.
    """
    offsets_of(kind)
    a = require_int("a", a, minimum=0)
    b = require_int("b", b)
    if b < a:
        return 0
    if b >= ENGINE_LIMIT:
        return count_beyond_64(kind, a, b)
    return _choice()[0].count(kind, a, b)


def primes(a: int, b: int) -> np.ndarray:
    """The primes of ``[a, b]``, ascending, as a ``uint64`` array (``b < 2**64``).

    At most :data:`MAX_LIST_SPAN` integers at once.
    """
    a = require_int("a", a, minimum=0)
    b = require_int("b", b)
    if b >= ENGINE_LIMIT:
        raise InvalidInputError(f"b={b}: primes() lists primes below 2**64 only (uint64 output)")
    if b < a:
        return np.zeros(0, dtype=np.uint64)
    if b - a + 1 > MAX_LIST_SPAN:
        raise OutOfReachError(
            f"primes(a, b): the interval holds {b - a + 1} integers; "
            f"the limit is {MAX_LIST_SPAN} (2**32) per call")
    return _choice()[0].primes(a, b)
