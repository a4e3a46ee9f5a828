"""How a candidate is called: in an isolated child (the default), as an executable, or in
this process (trusting it).

>>> from oracle import targets
>>> target = targets.python_target("math:isqrt", role_name="prime_pi", timeout=1.0)
>>> target.call_many([(10,)])[0].value
3
>>> target.close()

Every target has ``call_many(list of argument tuples) -> list of CallResult``
and ``close()``.  Faults never escape as exceptions: an exception of the
candidate (any ``BaseException``), a hang past the timeout, a dead process or a
broken protocol come back as a :class:`CallResult` with status ``raised``,
``timeout``, ``crashed`` or ``bad-output``.

* :func:`python_target` -- ``package.module:function``, resolved and run only in a
  child process (:mod:`oracle.targets._worker`) under a memory limit: this process,
  which holds the oracle and the judge, never imports the candidate, so nothing the
  candidate does -- patching the oracle, exiting, crashing, printing -- reaches the
  verdict.  With ``isolate=False`` it is called in this process instead (faster;
  documented as trusting the candidate).
* :func:`exec_target` -- a command speaking the line protocol
  (:mod:`oracle.targets._protocol`); always a child process, with a memory limit
  by default.
"""

from __future__ import annotations

import functools
import os
import math
import shlex
import shutil
import sys

from .._errors import InvalidInputError
from ._call import CRASHED, OK, RAISED, TIMEOUT, CallResult
from ._in_process import InProcessTarget
from ._line_process import LineProcess
from ._call import BAD_OUTPUT
from ._loader import SPEC, load_callable
from ._tamper import fingerprint
from ._protocol import decode_json_answer, decode_text_answer, encode_text_request

__all__ = ["CallResult", "OK", "RAISED", "TIMEOUT", "CRASHED", "BAD_OUTPUT", "python_target",
           "exec_target", "load_callable", "DEFAULT_MEMORY_LIMIT", "MAX_TIMEOUT"]

#: Address-space limit of an isolated candidate unless told otherwise (bytes).
DEFAULT_MEMORY_LIMIT = 4 * 2**30
#: The longest per-call timeout accepted (seconds): one day.
MAX_TIMEOUT = 86400.0


def python_target(spec: str, *, role_name: str, timeout: float, isolate: bool = True,
                  memory_limit: int | None = DEFAULT_MEMORY_LIMIT, python_path: list[str] | None = None):
    """A target for the Python callable ``spec`` (``package.module:function``).

    Isolated (the default), the worker is started at once and imports the target there; a
    target that cannot be imported raises :class:`InvalidInputError` with the worker's reason.
    """
    _check_timeout(timeout)
    if not isinstance(spec, str) or not SPEC.match(spec):
        raise InvalidInputError(f"target={spec!r}: expected package.module:function")
    if not isolate:
        before = fingerprint()
        return InProcessTarget(load_callable(spec), timeout=timeout, description=spec,
                               fingerprint=before)
    env = dict(os.environ)
    paths = list(python_path if python_path is not None else sys.path)
    env["PYTHONPATH"] = os.pathsep.join(path or os.getcwd() for path in paths)
    target = LineProcess(None, encode=_encode_json_request,
                         decode=functools.partial(decode_json_answer, role_name),
                         timeout=timeout, memory_limit=memory_limit, description=spec, env=env,
                         worker_spec=spec)
    target.start()
    return target


def exec_target(command: str, *, role_name: str, timeout: float,
                memory_limit: int | None = DEFAULT_MEMORY_LIMIT):
    """A target for an executable; ``command`` is split like a shell would (no shell runs)."""
    _check_timeout(timeout)
    try:
        argv = shlex.split(command)
    except ValueError as error:
        raise InvalidInputError(f"--exec {command[:200]!r}: {error}") from None
    if not argv:
        raise InvalidInputError("--exec: empty command")
    if shutil.which(argv[0]) is None:
        raise InvalidInputError(f"--exec {argv[0][:200]!r}: no such command (or not executable)")
    target = LineProcess(argv, encode=encode_text_request,
                         decode=functools.partial(decode_text_answer, role_name),
                         timeout=timeout, memory_limit=memory_limit, description=command)
    target.start()          # a command that cannot be run is a usage error, here
    return target


def _encode_json_request(arguments: tuple[int, ...]) -> bytes:
    return ("[" + ", ".join(str(value) for value in arguments) + "]\n").encode()


def _check_timeout(timeout: float) -> None:
    if isinstance(timeout, bool) or not isinstance(timeout, (int, float)) \
            or not (timeout > 0 and math.isfinite(timeout) and timeout <= MAX_TIMEOUT):
        raise InvalidInputError(f"timeout={timeout!r}: must be a positive number of seconds, "
                                f"at most {MAX_TIMEOUT:g}")
