"""Answers kept between runs: an on-disk store of the oracle's expensive answers.

An exact answer never changes for a given oracle version, so one that took
long to compute (more than :data:`MIN_SECONDS`) is written to an SQLite file in
the user's cache folder and read back by later runs instead of recomputed.

Where: ``$NTORACLE_STORE`` when it names a folder, else
``$XDG_CACHE_HOME/ntoracle``, else ``~/.cache/ntoracle``; the file is
``answers.sqlite3``.  ``NTORACLE_STORE=off`` (or the CLI's ``--no-store``)
disables it.  ``NTORACLE_STORE_MIN_SECONDS`` overrides the threshold.

Each row holds the key (function, arguments, oracle version), the value, the
provenance and a SHA-256 digest of all of them.  A row whose digest does not
match (a torn write, a flipped bit, a hand edit) is deleted and never returned.
The digest detects corruption, not a deliberate forgery: anyone who can write
the user's cache folder can also recompute a digest.

Several processes may share the file (pytest-xdist workers, concurrent
audits): the database runs in WAL mode with a short busy timeout, and any
SQLite error ("database is locked", a read-only folder, a full disk) makes the
store step aside for that call: the answer is computed, never refused.

Integers are written in hexadecimal, which Python converts in both directions
without the 4300-digit limit of decimal ``int``/``str`` conversion.
"""

from __future__ import annotations

import os
import threading
from pathlib import Path

__all__ = ["MIN_SECONDS", "FILE_NAME", "Store", "default_store", "encode_value", "decode_value",
           "encode_arguments"]

#: Answers that took less than this many seconds are not kept (recomputing is cheap).
MIN_SECONDS = 0.05
#: Name of the SQLite file inside the store folder.
FILE_NAME = "answers.sqlite3"
#: A prime list longer than this is not kept (the row would outweigh the sieve).
MAX_LIST_ITEMS = 200_000
# Seconds a writer waits for another process's lock before the store steps aside.
_BUSY_SECONDS = 1.0
_OFF_WORDS = {"off", "0", "no", "false", "none"}
# What _run returns when SQLite refused (a row can be None, so None cannot say it).
_FAILED = object()

_SCHEMA = """
CREATE TABLE IF NOT EXISTS answers (
    key        TEXT PRIMARY KEY,
    function   TEXT NOT NULL,
    value      TEXT NOT NULL,
    provenance TEXT NOT NULL,
    seconds    REAL NOT NULL,
    digest     TEXT NOT NULL
)
"""


# --------------------------------------------------------------------------- #
# Encoding
# --------------------------------------------------------------------------- #

def _hex(number: int) -> str:
    return format(number, "x")             # '-1f' for -31: int(text, 16) reads it back


def encode_arguments(arguments: tuple) -> str | None:
    """The arguments as key text (ints in hex, kind names as they are), or None if unkeyable."""
    parts = []
    for argument in arguments:
        if isinstance(argument, bool):
            return None
        if isinstance(argument, int):
            parts.append(_hex(int(argument)))
        elif isinstance(argument, str) and argument.isidentifier():
            parts.append(argument)
        else:
            return None
    return ",".join(parts)


def encode_value(value) -> str | None:
    """``b:1``, ``i:<hex>`` or ``l:<hex>,<hex>,...``; None for a value not worth keeping."""
    if isinstance(value, bool):
        return "b:1" if value else "b:0"
    if isinstance(value, int):
        return "i:" + _hex(value)
    if isinstance(value, list) and len(value) <= MAX_LIST_ITEMS \
            and all(type(item) is int for item in value):
        return "l:" + ",".join(_hex(item) for item in value)
    return None


def decode_value(text: str):
    """Inverse of :func:`encode_value`; raises ValueError on malformed text."""
    tag, _, body = text.partition(":")
    if tag == "b" and body in ("0", "1"):
        return body == "1"
    if tag == "i":
        return int(body, 16)
    if tag == "l":
        return [int(item, 16) for item in body.split(",")] if body else []
    raise ValueError(f"unknown value encoding {tag!r}")


def _digest(key: str, value: str, provenance: str) -> str:
    import hashlib

    return hashlib.sha256("\x00".join((key, value, provenance)).encode()).hexdigest()


# --------------------------------------------------------------------------- #
# The store
# --------------------------------------------------------------------------- #

class Store:
    """One SQLite file of kept answers; every method steps aside on an SQLite error."""

    def __init__(self, folder: str | os.PathLike, *, version: str,
                 min_seconds: float = MIN_SECONDS) -> None:
        self.folder = Path(folder)
        self.path = self.folder / FILE_NAME
        self.version = version
        self.min_seconds = min_seconds
        self._lock = threading.Lock()
        self._connection = None
        self._pid = None
        self.broken = False                # set after an error that will not go away (no folder)

    # -- keys --------------------------------------------------------------- #

    def key(self, function: str, arguments: tuple) -> str | None:
        encoded = encode_arguments(arguments)
        return None if encoded is None else f"{self.version}|{function}|{encoded}"

    # -- reading and writing --------------------------------------------------- #

    def get(self, function: str, arguments: tuple):
        """``(value, provenance)`` kept for this question, or None."""
        key = self.key(function, arguments)
        if key is None:
            return None
        row = self._run(lambda db: db.execute(
            "SELECT value, provenance, digest FROM answers WHERE key = ?", (key,)).fetchone())
        if row is None or row is _FAILED:
            return None
        value_text, provenance, digest = row
        try:
            if not isinstance(value_text, str) or not isinstance(provenance, str) \
                    or digest != _digest(key, value_text, provenance):
                raise ValueError("digest mismatch")
            return decode_value(value_text), provenance
        except ValueError:
            self._run(lambda db: db.execute("DELETE FROM answers WHERE key = ?", (key,)), write=True)
            return None

    def put(self, function: str, arguments: tuple, value, provenance: str, seconds: float) -> bool:
        """Keep an answer that took ``seconds`` to compute; True when it was written."""
        if seconds < self.min_seconds:
            return False
        key = self.key(function, arguments)
        value_text = encode_value(value)
        if key is None or value_text is None:
            return False
        digest = _digest(key, value_text, provenance)
        done = self._run(lambda db: db.execute(
            "INSERT OR REPLACE INTO answers (key, function, value, provenance, seconds, digest) "
            "VALUES (?, ?, ?, ?, ?, ?)",
            (key, function, value_text, provenance, float(seconds), digest)), write=True)
        return done is not _FAILED

    # -- upkeep --------------------------------------------------------------- #

    def summary(self) -> dict:
        """Path, file size, entry count and entries per function (this version and all)."""
        size = sum(path.stat().st_size for path in self.folder.glob(FILE_NAME + "*")
                   if path.is_file()) if self.folder.is_dir() else 0
        rows, current = [], (0,)
        if self.path.exists():
            rows = self._run(lambda db: db.execute(
                "SELECT function, COUNT(*), SUM(seconds) FROM answers GROUP BY function").fetchall())
            current = self._run(lambda db: db.execute(
                "SELECT COUNT(*) FROM answers WHERE substr(key, 1, ?) = ?",
                (len(self.version) + 1, self.version + "|")).fetchone())
            if rows is _FAILED or current is _FAILED:
                raise OSError(f"could not read {self.path} (locked by another process?)")
        return {"path": str(self.path), "bytes": size,
                "entries": sum(count for _, count, _ in rows),
                "entries_this_version": current[0],
                "seconds_saved_per_reuse": round(sum(seconds or 0 for _, _, seconds in rows), 3),
                "by_function": {function: count for function, count, _ in sorted(rows)}}

    def clear(self) -> int:
        """Delete every kept answer; returns how many there were."""
        if not self.path.exists():
            return 0
        counted = self._run(lambda db: db.execute("SELECT COUNT(*) FROM answers").fetchone())
        if counted is _FAILED or self._run(lambda db: db.execute("DELETE FROM answers"),
                                           write=True) is _FAILED:
            raise OSError(f"could not clear {self.path} (locked by another process?)")
        self._run(lambda db: db.execute("VACUUM"))
        return counted[0]

    def close(self) -> None:
        with self._lock:
            if self._connection is not None and self._pid == os.getpid():
                self._connection.close()
            self._connection = None

    # -- the connection ------------------------------------------------------- #

    def _run(self, action, *, write: bool = False):
        """``action(connection)`` under the lock; :data:`_FAILED` after any SQLite or OS error."""
        import sqlite3

        if self.broken:
            return _FAILED
        with self._lock:
            try:
                db = self._connect()
                result = action(db)
                if write:
                    db.commit()
                return result
            except (sqlite3.Error, OSError):
                if self._connection is not None:
                    try:
                        self._connection.rollback()
                    except sqlite3.Error:
                        pass
                return _FAILED

    def _connect(self):
        import sqlite3

        if self._connection is not None and self._pid == os.getpid():
            return self._connection
        # A connection inherited through fork() is never used: open a new one.
        try:
            self.folder.mkdir(parents=True, exist_ok=True)
        except OSError:
            self.broken = True
            raise
        db = sqlite3.connect(self.path, timeout=_BUSY_SECONDS, check_same_thread=False,
                             isolation_level="DEFERRED")
        db.execute(f"PRAGMA busy_timeout = {int(_BUSY_SECONDS * 1000)}")
        db.execute("PRAGMA journal_mode = WAL")
        db.execute("PRAGMA synchronous = NORMAL")
        db.execute(_SCHEMA)
        db.commit()
        self._connection, self._pid = db, os.getpid()
        return db


# --------------------------------------------------------------------------- #
# The store the oracle uses
# --------------------------------------------------------------------------- #

_default: tuple[tuple, Store | None] | None = None


def store_folder() -> Path | None:
    """The folder of the store the environment asks for, or None when it is switched off."""
    setting = os.environ.get("NTORACLE_STORE", "").strip()
    if setting.lower() in _OFF_WORDS:
        return None
    if setting and setting.lower() != "on":
        return Path(setting).expanduser()
    cache = os.environ.get("XDG_CACHE_HOME", "").strip()
    base = Path(cache).expanduser() if cache else Path.home() / ".cache"
    return base / "ntoracle"


def _min_seconds() -> float:
    text = os.environ.get("NTORACLE_STORE_MIN_SECONDS", "").strip()
    try:
        value = float(text) if text else MIN_SECONDS
    except ValueError:
        return MIN_SECONDS
    return value if value >= 0 else MIN_SECONDS


def default_store() -> Store | None:
    """The store for this environment (re-read on every call, so tests can switch it), or None."""
    global _default
    folder = store_folder()
    settings = (str(folder) if folder else None, _min_seconds(), os.getpid())
    if _default is not None and _default[0] == settings:
        return _default[1]
    from . import __version__

    store = Store(folder, version=__version__, min_seconds=settings[1]) if folder else None
    _default = (settings, store)
    return store
