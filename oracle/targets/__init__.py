"""How a candidate is called: in this process, in an isolated child, or as an executable.

>>> from oracle import targets
>>> target = targets.python_target("math:isqrt", role_name="prime_pi", timeout=1.0)
>>> target.call_many([(10,)])[0].value
3

Every target has ``call_many(list of argument tuples) -> list of CallResult``
and ``close()``.  Faults never escape as exceptions: an exception of the
candidate, a hang past the timeout, or a dead process come back as a
:class:`CallResult` with status ``raised``, ``timeout`` or ``crashed``.

* :func:`python_target` -- ``package.module:function``; with ``isolate=True``
  it runs in a child process under a memory limit (a segfault or memory
  exhaustion is then a finding, not the end of the audit).
* :func:`exec_target` -- a command speaking the line protocol
  (:mod:`oracle.targets._protocol`); always a child process, with a memory limit
  by default.
"""

from __future__ import annotations

import functools
import os
import shlex
import sys

from .._errors import InvalidInputError
from ._call import CRASHED, OK, RAISED, TIMEOUT, CallResult
from ._in_process import InProcessTarget
from ._line_process import LineProcess
from ._loader import load_callable
from ._protocol import decode_json_answer, decode_text_answer, encode_text_request

__all__ = ["CallResult", "OK", "RAISED", "TIMEOUT", "CRASHED", "python_target", "exec_target",
           "load_callable", "DEFAULT_MEMORY_LIMIT"]

#: Address-space limit of an isolated candidate unless told otherwise (bytes).
DEFAULT_MEMORY_LIMIT = 4 * 2**30


def python_target(spec: str, *, role_name: str, timeout: float, isolate: bool = False,
                  memory_limit: int | None = DEFAULT_MEMORY_LIMIT, python_path: list[str] | None = None):
    """A target for the Python callable ``spec`` (``package.module:function``)."""
    _check_timeout(timeout)
    if not isolate:
        return InProcessTarget(load_callable(spec), timeout=timeout, description=spec)
    load_callable(spec)        # fail early, in this process, on a bad name
    env = dict(os.environ)
    paths = list(python_path if python_path is not None else sys.path)
    env["PYTHONPATH"] = os.pathsep.join(path or os.getcwd() for path in paths)
    return LineProcess([sys.executable, "-m", "oracle.targets._worker", spec],
                       encode=_encode_json_request, decode=functools.partial(decode_json_answer, role_name),
                       timeout=timeout, memory_limit=memory_limit, description=spec, env=env)


def exec_target(command: str, *, role_name: str, timeout: float,
                memory_limit: int | None = DEFAULT_MEMORY_LIMIT):
    """A target for an executable; ``command`` is split like a shell would (no shell runs)."""
    _check_timeout(timeout)
    argv = shlex.split(command)
    if not argv:
        raise InvalidInputError("--exec: empty command")
    return LineProcess(argv, encode=encode_text_request,
                       decode=functools.partial(decode_text_answer, role_name),
                       timeout=timeout, memory_limit=memory_limit, description=command)


def _encode_json_request(arguments: tuple[int, ...]) -> bytes:
    return ("[" + ", ".join(str(value) for value in arguments) + "]\n").encode()


def _check_timeout(timeout: float) -> None:
    if isinstance(timeout, bool) or not isinstance(timeout, (int, float)) or not timeout > 0:
        raise InvalidInputError(f"timeout={timeout!r}: must be a positive number of seconds")
