"""Checks of command-line options: bounded numbers and writable output paths.

Every number an option takes is checked before anything runs: a float option
(seconds) must be finite, positive and at most a stated bound; an integer
option is read by :func:`oracle._integers.parse_integer` (no ``eval``, bounded
size) and checked against its range.  Used as argparse ``type=`` functions
(:func:`seconds_option`, :func:`integer_option`), a bad value is a usage error
of one line naming the option (exit 2).

Output paths (``--json FILE``, ``--report DIR``, the corpus, the results file)
are checked before an audit starts by :func:`check_output_file` and
:func:`check_output_folder`: the nearest existing ancestor must be a folder in
which the missing folders and the file can be created.  The check probes by
creating and at once removing what did not exist, so it leaves nothing behind.
"""

from __future__ import annotations

import argparse
import math
import os
import tempfile

from ._errors import InvalidInputError
from ._integers import parse_integer

__all__ = ["MAX_SECONDS", "MAX_SEED", "seconds_option", "integer_option", "memory_option",
           "physical_memory_mib", "check_output_file", "check_output_folder"]

#: Longest time any seconds option may give: one day.
MAX_SECONDS = 86400.0
#: Seeds are below 2**64 (the plugin's ``--ntoracle-seed`` has the same bound).
MAX_SEED = 2**64 - 1


def positive_seconds(text: str, option: str, maximum: float = MAX_SECONDS) -> float:
    """``text`` as a finite number of seconds in (0, ``maximum``]; else InvalidInputError
    naming ``option``."""
    try:
        value = float(text)
    except (TypeError, ValueError):
        raise InvalidInputError(f"{option} {_quote(text)}: expected a number of seconds") from None
    if not math.isfinite(value) or not 0 < value <= maximum:
        raise InvalidInputError(f"{option} {_quote(text)}: must be a finite number of seconds, "
                                f"> 0 and <= {maximum:g}")
    return value


def seconds_option(option: str, maximum: float = MAX_SECONDS):
    """An argparse ``type=`` for a seconds option (see :func:`positive_seconds`)."""
    def parse(text: str) -> float:
        try:
            return positive_seconds(text, option, maximum)
        except InvalidInputError as error:
            raise argparse.ArgumentTypeError(str(error).removeprefix(option + " ")) from None

    parse.__name__ = "seconds"
    return parse


def integer_option(option: str, minimum: int | None = None, maximum: int | None = None,
                   unit: str = "", top_name: str = ""):
    """An argparse ``type=`` for an integer option in [``minimum``, ``maximum``]
    (``maximum`` may be a function, evaluated when the option is read; ``top_name`` says
    what it is)."""
    def parse(text: str) -> int:
        try:
            value = parse_integer(text)
        except InvalidInputError as error:
            raise argparse.ArgumentTypeError(str(error)) from None
        top = maximum() if callable(maximum) else maximum
        if minimum is not None and value < minimum:
            raise argparse.ArgumentTypeError(f"{_quote(text)}: must be >= {minimum}{unit}")
        if top is not None and value > top:
            raise argparse.ArgumentTypeError(f"{_quote(text)}: must be <= {top}{unit}{top_name}")
        return value

    parse.__name__ = "integer"
    return parse


def physical_memory_mib() -> int | None:
    """The machine's physical memory in MiB, or None where the system does not say."""
    try:
        pages, size = os.sysconf("SC_PHYS_PAGES"), os.sysconf("SC_PAGE_SIZE")
    except (AttributeError, ValueError, OSError):
        return None
    if pages <= 0 or size <= 0:
        return None
    return pages * size // 2**20


def memory_option(option: str = "--memory-limit"):
    """An argparse ``type=`` for a memory limit in MiB: positive, at most the physical memory."""
    return integer_option(option, minimum=1, maximum=physical_memory_mib, unit=" MiB",
                          top_name=", the physical memory of this machine")


def check_output_folder(folder: str | os.PathLike, option: str) -> None:
    """Raise InvalidInputError (one line naming ``option``) unless ``folder`` is, or can be
    created as, a folder where files can be written.  Leaves nothing behind."""
    path = os.path.abspath(os.fspath(folder))
    if os.path.exists(path) and not os.path.isdir(path):
        raise InvalidInputError(f"{option} {folder}: exists and is not a folder")
    created = []
    try:
        _make_missing(path, folder, option, created)
        handle, probe = tempfile.mkstemp(prefix=".ntoracle-probe-", dir=path)
        os.close(handle)
        os.unlink(probe)
    except OSError as error:
        raise InvalidInputError(f"{option} {folder}: cannot write there: "
                                f"{error.strerror or error}") from None
    finally:
        _remove(created)


def check_output_file(file: str | os.PathLike, option: str) -> None:
    """Raise InvalidInputError (one line naming ``option``) unless ``file`` can be written
    (created, with its missing folders, or opened for appending).  Leaves nothing behind:
    a file or folder the probe creates is removed, an existing file is not changed."""
    path = os.path.abspath(os.fspath(file))
    if os.path.isdir(path):
        raise InvalidInputError(f"{option} {file}: is a folder, not a file")
    created = []
    try:
        _make_missing(os.path.dirname(path), file, option, created)
        if os.path.lexists(path):
            with open(path, "ab"):
                pass
        else:
            with open(path, "xb"):
                pass
            os.unlink(path)
    except OSError as error:
        raise InvalidInputError(f"{option} {file}: cannot write it: "
                                f"{error.strerror or error}") from None
    finally:
        _remove(created)


def _make_missing(path: str, given, option: str, created: list) -> None:
    """Create the missing folders of ``path``, outermost first, noting each in ``created``."""
    missing = []
    while not os.path.exists(path):
        missing.append(path)
        parent = os.path.dirname(path)
        if parent == path:
            break
        path = parent
    if not os.path.isdir(path):
        raise InvalidInputError(f"{option} {given}: {path} is not a folder")
    for folder in reversed(missing):
        os.mkdir(folder)
        created.append(folder)


def _remove(created: list) -> None:
    for folder in reversed(created):
        try:
            os.rmdir(folder)
        except OSError:
            pass


def _quote(text: object, limit: int = 40) -> str:
    shown = str(text)
    return shown if len(shown) <= limit else shown[:limit] + "..."
