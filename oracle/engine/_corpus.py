"""The regression corpus: every failure found, kept in the user's project and replayed first.

A YAML file (default ``.ntoracle/regressions.yaml``) holding a list of
entries, each with ``role``, ``arguments``, ``target``, ``kind`` (``python`` or ``exec``), ``check``, ``status``,
``detail``, ``seed``, ``profile`` and ``recorded`` (UTC time).  An input is
recorded once per role; the next audit of that role asks those inputs before
any sampled point.
"""

from __future__ import annotations

import datetime
import os
from pathlib import Path

import yaml

from .._errors import InvalidInputError

__all__ = ["DEFAULT_CORPUS", "load_corpus", "record_failures"]

DEFAULT_CORPUS = os.path.join(".ntoracle", "regressions.yaml")


def load_corpus(path: str | os.PathLike) -> list[dict]:
    """The entries of the corpus at ``path`` (none if the file does not exist)."""
    path = Path(path)
    if not path.exists():
        return []
    try:
        data = yaml.safe_load(path.read_text(encoding="utf-8"))
    except yaml.YAMLError as error:
        raise InvalidInputError(f"{path}: not valid YAML: {error}") from None
    if data is None:
        return []
    entries = data.get("regressions") if isinstance(data, dict) else None
    if not isinstance(entries, list):
        raise InvalidInputError(f"{path}: expected a mapping with a list under 'regressions'")
    for index, entry in enumerate(entries):
        if (not isinstance(entry, dict) or not isinstance(entry.get("role"), str)
                or not isinstance(entry.get("arguments"), list)
                or not all(isinstance(a, int) and not isinstance(a, bool) for a in entry["arguments"])):
            raise InvalidInputError(f"{path}: entry {index} needs a role and a list of integer arguments")
    return entries


def record_failures(path: str | os.PathLike, failures: list[dict], *, target: str, role: str,
                    seed: int, profile: str, kind: str = "python") -> int:
    """Append the failures not yet in the corpus; return how many were added."""
    path = Path(path)
    entries = load_corpus(path)
    known = {(entry["role"], tuple(entry["arguments"])) for entry in entries}
    now = datetime.datetime.now(datetime.timezone.utc).replace(microsecond=0).isoformat()
    added = 0
    for failure in failures:
        key = (role, tuple(failure["arguments"]))
        if key in known or len(failure["arguments"]) > 2:
            continue
        known.add(key)
        entries.append({"role": role, "arguments": list(failure["arguments"]), "target": target,
                        "kind": kind, "check": failure["check"], "status": failure["status"],
                        "detail": str(failure.get("detail", ""))[:300], "seed": seed,
                        "profile": profile, "recorded": now})
        added += 1
    if added:
        path.parent.mkdir(parents=True, exist_ok=True)
        temporary = path.with_suffix(path.suffix + ".tmp")
        temporary.write_text(yaml.safe_dump({"regressions": entries}, sort_keys=False), encoding="utf-8")
        os.replace(temporary, path)
    return added
