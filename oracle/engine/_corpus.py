"""The regression corpus: every failure found, kept in the user's project and replayed first.

A YAML file (default ``.ntoracle/regressions.yaml``) holding, under
``regressions``, a list of entries, each with ``role``, ``arguments``,
``target``, ``kind`` (``python`` or ``exec``), ``check``, ``status``,
``detail``, ``seed``, ``profile`` and ``recorded`` (UTC time).  An input is
recorded once per role and target.

Reading is bounded: the file is read by :func:`oracle._safe_yaml.load_limited`
(at most :data:`MAX_CORPUS_BYTES`), holds at most :data:`MAX_ENTRIES` entries,
and each entry is checked (an error names the file and the entry's line).

Writing is safe for concurrent audits: :func:`record_failures` takes an
exclusive ``fcntl.flock`` on ``<corpus>.lock`` beside the corpus, reads the
file again under the lock, merges, writes a temporary file and moves it over
the corpus with ``os.replace`` -- two audits (or pytest-xdist workers)
recording at once lose no entry, and a reader never sees a half-written file.
"""

from __future__ import annotations

import contextlib
import datetime
import os
from pathlib import Path

from .._errors import InvalidInputError

__all__ = ["DEFAULT_CORPUS", "MAX_CORPUS_BYTES", "MAX_ENTRIES", "MAX_ARGUMENT_BITS",
           "load_corpus", "record_failures"]

DEFAULT_CORPUS = os.path.join(".ntoracle", "regressions.yaml")
#: Largest corpus file read, in bytes.
MAX_CORPUS_BYTES = 4 * 2**20
#: Most entries in one corpus.
MAX_ENTRIES = 10_000
#: Largest argument kept or read, in bits (the roles reach 2**128 at most).
MAX_ARGUMENT_BITS = 1024


def load_corpus(path: str | os.PathLike) -> list[dict]:
    """The entries of the corpus at ``path`` (none if the file does not exist)."""
    from .._safe_yaml import load_limited

    path = Path(path)
    if not path.exists():
        return []
    data = load_limited(path, max_bytes=MAX_CORPUS_BYTES)
    if data is None:
        return []
    entries = data.get("regressions") if isinstance(data, dict) else None
    if not isinstance(entries, list):
        raise InvalidInputError(f"{path}: line 1: expected a mapping with a list under 'regressions'")
    if len(entries) > MAX_ENTRIES:
        raise InvalidInputError(f"{path}: {len(entries)} entries, more than the limit of {MAX_ENTRIES}")
    for index, entry in enumerate(entries):
        problem = _entry_problem(entry)
        if problem is not None:
            raise InvalidInputError(f"{path}: line {_entry_line(path, index)}: entry {index}: {problem}")
    return entries


def _entry_problem(entry: object) -> str | None:
    """What is wrong with one entry, or None."""
    if not isinstance(entry, dict):
        return "expected a mapping"
    if not isinstance(entry.get("role"), str):
        return "needs a role (a string)"
    arguments = entry.get("arguments")
    if not isinstance(arguments, list) or not arguments or not all(
            type(a) is int for a in arguments):
        return "needs a non-empty list of integer arguments"
    if len(arguments) > 2 or any(a.bit_length() > MAX_ARGUMENT_BITS for a in arguments):
        return f"at most 2 arguments of at most {MAX_ARGUMENT_BITS} bits"
    for key in ("target", "kind", "check", "status", "detail", "profile", "recorded"):
        if entry.get(key) is not None and not isinstance(entry[key], str):
            return f"{key} must be a string"
    if entry.get("kind", "python") not in ("python", "exec"):
        return "kind must be python or exec"
    return None


def _entry_line(path: Path, index: int) -> int:
    """The line of entry ``index`` (composed again only when an error is reported)."""
    import yaml

    try:
        root = yaml.compose(path.read_text(encoding="utf-8"), Loader=yaml.SafeLoader)
        for key, value in root.value:
            if key.value == "regressions":
                return value.value[index].start_mark.line + 1
    except Exception:  # the line is a courtesy; the message stands without it
        pass
    return 1


@contextlib.contextmanager
def _locked(path: Path):
    """An exclusive lock on ``<path>.lock`` for the read-merge-write of the corpus."""
    import fcntl

    path.parent.mkdir(parents=True, exist_ok=True)
    with open(path.with_name(path.name + ".lock"), "a") as lock:
        fcntl.flock(lock, fcntl.LOCK_EX)
        try:
            yield
        finally:
            fcntl.flock(lock, fcntl.LOCK_UN)


def record_failures(path: str | os.PathLike, failures: list[dict], *, target: str, role: str,
                    seed: int, profile: str, kind: str = "python") -> int:
    """Add the failures not yet in the corpus (same role, target and arguments); return how many
    were added.  Locked, merged with what other runs wrote meanwhile, replaced atomically; the
    corpus never grows beyond :data:`MAX_ENTRIES` entries or :data:`MAX_CORPUS_BYTES` bytes
    (the newest entries beyond are not kept)."""
    import yaml

    path = Path(path)
    now = datetime.datetime.now(datetime.timezone.utc).replace(microsecond=0).isoformat()
    fresh = [failure for failure in failures
             if 1 <= len(failure["arguments"]) <= 2
             and all(type(a) is int and a.bit_length() <= MAX_ARGUMENT_BITS
                     for a in failure["arguments"])]
    if not fresh:
        return 0
    with _locked(path):
        entries = load_corpus(path)
        known = {(entry["role"], entry.get("target"), tuple(entry["arguments"])) for entry in entries}
        added = 0
        for failure in fresh:
            key = (role, target, tuple(failure["arguments"]))
            if key in known or len(entries) >= MAX_ENTRIES:
                continue
            known.add(key)
            entries.append({"role": role, "arguments": list(failure["arguments"]), "target": target,
                            "kind": kind, "check": str(failure["check"]), "status": str(failure["status"]),
                            "detail": str(failure.get("detail", ""))[:300], "seed": seed,
                            "profile": profile, "recorded": now})
            added += 1
        text = yaml.safe_dump({"regressions": entries}, sort_keys=False)
        while added and len(text.encode("utf-8")) > MAX_CORPUS_BYTES:   # never write what
            dropped = max(1, added // 10)                                # cannot be read back
            del entries[-dropped:]
            added -= dropped
            text = yaml.safe_dump({"regressions": entries}, sort_keys=False)
        if added:
            temporary = path.with_name(f".{path.name}.{os.getpid()}.{id(entries)}.tmp")
            try:
                temporary.write_text(text, encoding="utf-8")
                os.replace(temporary, path)
            finally:
                if temporary.exists():
                    temporary.unlink()
    return added
