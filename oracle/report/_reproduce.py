"""The command that repeats one audit: the same target, role, profile, seed and settings.

Every run is reproducible from its printed seed (docs/DESIGN.md, "Profiles"); this
writes the whole ``ntoracle audit`` command from a run's ``start`` record.
"""

from __future__ import annotations

import re
import shlex

__all__ = ["reproduce_command"]

#: The form of a Python target, ``package.module:function`` (as oracle.targets accepts it).
_PYTHON_TARGET = re.compile(r"^[A-Za-z_][\w.]*:[A-Za-z_][\w.]*$")

#: Conventions that differ from the defaults, and the option that sets each.
_CONVENTION_OPTIONS = {
    ("primes_range", "half-open"): ["--half-open"],
    ("factor_shape", "mapping"): ["--factor-shape", "mapping"],
    ("factor_shape", "flat"): ["--factor-shape", "flat"],
    ("factor_shape", "pairs"): ["--factor-shape", "pairs"],
    ("invalid_input", "raise"): ["--invalid-input", "raise"],
}


def reproduce_command(start: dict) -> str:
    """The ``ntoracle audit`` command line that repeats the run whose start record is ``start``.

    ``start`` needs ``target``, ``role``, ``profile`` and ``seed``; ``timeout``,
    ``maximum``, ``isolated`` and ``conventions`` are used when present.  A target
    not of the form ``package.module:function`` is an executable (``--exec``).
    """
    target = str(start["target"])
    words = ["ntoracle", "audit"]
    if _PYTHON_TARGET.match(target):
        words.append(target)
        if start.get("isolated") is False:
            words.append("--in-process")
    else:
        words += ["--exec", target]
    words += ["--role", str(start["role"]), "--profile", str(start["profile"]),
              "--seed", str(start["seed"])]
    if start.get("timeout") is not None:
        words += ["--timeout", f"{start['timeout']:g}"]
    if start.get("maximum") is not None:
        words += ["--max", str(start["maximum"])]
    for name, value in sorted((start.get("conventions") or {}).items()):
        words += _CONVENTION_OPTIONS.get((name, value), [])
    return shlex.join(words)
