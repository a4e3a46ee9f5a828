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
           "physical_memory_mib", "check_output_file", "check_output_folder", "remove_folders"]

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


def check_output_folder(folder: str | os.PathLike, option: str, created: list | None = None) -> None:
    """Raise InvalidInputError (one line naming ``option``) unless ``folder`` is, or can be
    created as, a folder where files can be written.  The folders it creates stay when the
    check passes (the run writes there next; removing them would race with a concurrent
    audit using the same folder; they are noted in ``created``, for a caller whose later
    check fails) and are removed when it fails."""
    path = os.path.abspath(os.fspath(folder))
    if os.path.exists(path) and not os.path.isdir(path):
        raise InvalidInputError(f"{option} {folder}: exists and is not a folder")
    mine: list = []
    try:
        _make_missing(path, folder, option, mine)
        handle, probe = tempfile.mkstemp(prefix=".ntoracle-probe-", dir=path)
        os.close(handle)
        os.unlink(probe)
    except (OSError, InvalidInputError) as error:
        _remove(mine)
        if isinstance(error, InvalidInputError):
            raise
        raise InvalidInputError(f"{option} {folder}: cannot write there: "
                                f"{error.strerror or error}") from None
    if created is not None:
        created.extend(mine)


def check_output_file(file: str | os.PathLike, option: str, created: list | None = None) -> None:
    """Raise InvalidInputError (one line naming ``option``) unless ``file`` can be written
    (created, with its missing folders, or opened for appending).  The probe file is removed
    and an existing file is not changed; folders it creates stay when the check passes and
    are removed when it fails (see :func:`check_output_folder` for ``created``)."""
    path = os.path.abspath(os.fspath(file))
    if os.path.isdir(path):
        raise InvalidInputError(f"{option} {file}: is a folder, not a file")
    mine: list = []
    try:
        _make_missing(os.path.dirname(path), file, option, mine)
        try:
            with open(path, "xb"):
                pass
        except FileExistsError:
            with open(path, "ab"):      # it exists (perhaps made just now by a concurrent run)
                pass
        else:
            os.unlink(path)
    except (OSError, InvalidInputError) as error:
        _remove(mine)
        if isinstance(error, InvalidInputError):
            raise
        raise InvalidInputError(f"{option} {file}: cannot write it: "
                                f"{error.strerror or error}") from None
    if created is not None:
        created.extend(mine)


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
        try:
            os.mkdir(folder)
        except FileExistsError:
            if not os.path.isdir(folder):
                raise
            continue            # a concurrent audit made it first: it is not ours to remove
        created.append(folder)


def remove_folders(created: list) -> None:
    """Remove the (empty) folders noted by the checks above, innermost first."""
    _remove(created)


def _remove(created: list) -> None:
    for folder in reversed(created):
        try:
            os.rmdir(folder)
        except OSError:
            pass


def _quote(text: object, limit: int = 40) -> str:
    shown = str(text)
    return shown if len(shown) <= limit else shown[:limit] + "..."
