"""ntoracle: a reference oracle for testing number-theory software.

>>> import oracle
>>> oracle.pi(10**6)
78498
>>> oracle.answer("pi", 10**6).provenance
'table:oeis-a006880'

Plain calls return plain ints and bools; :func:`answer` returns the value with
its provenance.  Submodules ``oracle.bounds`` (proven intervals) and
``oracle.tables`` (published data) load on first use.

Cautions: a "probable" verdict (Baillie–PSW) is not a proof of primality;
agreement with this oracle is evidence, not a certificate; for cryptographic
use defer to the published standards and a vetted library.
"""

from __future__ import annotations

import importlib

from ._errors import InvalidInputError, OracleError, OutOfReachError
from .facade import (
    Answer,
    FactorizationReport,
    answer,
    count,
    is_prime,
    next_prime,
    nth_prime,
    pi,
    prev_prime,
    primes,
    tuplet_pi,
    twin_pi,
    verify_factorization,
)
from .facade import mertens, prime_pi_mod, prime_sum, squarefree_count

__version__ = "0.1.0"

__all__ = [
    "Answer", "FactorizationReport", "InvalidInputError", "OracleError", "OutOfReachError",
    "answer", "count", "is_prime", "next_prime", "nth_prime", "pi", "prev_prime", "primes",
    "tuplet_pi", "twin_pi", "verify_factorization", "bounds", "tables",
    "prime_sum", "prime_pi_mod", "mertens", "squarefree_count",
]

_LAZY_SUBMODULES = ("bounds", "tables")


def __getattr__(name: str):
    if name in _LAZY_SUBMODULES:
        return importlib.import_module(f".{name}", __name__)
    raise AttributeError(f"module 'oracle' has no attribute {name!r}")
