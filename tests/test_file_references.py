"""Every file the repository cites exists in the repository (issue 13: no references outside it).

The code, the data and the documents point readers at other files -- ``docs/DESIGN.md``,
``fixtures/bounds.yaml``, ``tests/zoo/catalogue.yaml`` -- and such a pointer rots silently when a
file is moved, or was never part of a clone (a design brief kept beside the repository).  This
test reads every tracked text file and checks each path under one of the repository's own
folders, and each ``*.md`` document named anywhere, against the files ``git`` tracks.

The only exceptions are the examples of a *user's* project in the plugin's documentation
(``tests/test_fast.py``, ``tests/pi.ntoracle.yaml``) and the installed layout of a wheel
(``oracle/fixtures``, ``oracle/suites``), listed below with their reason.
"""

from __future__ import annotations

import posixpath
import re
import shutil
import subprocess
from pathlib import Path, PurePosixPath

import pytest

REPOSITORY = Path(__file__).resolve().parent.parent

#: Paths in a user's project or in an installed wheel, not in this repository.
NOT_OURS = {
    "tests/test_fast.py": "the README's example of a user's test file",
    "tests/pi.ntoracle.yaml": "the README's example of a user's suite file",
    "oracle/fixtures": "where the wheel installs fixtures/",
    "oracle/suites/__init__.py": "the wheel's copy of suites/",
}

#: A path under one of the repository's top-level folders, as prose or code cites it; a
#: pattern such as ``fixtures/table-<id>.yaml`` is not a path.
_PATH = re.compile(r"(?<![\w./<-])((?:\.ci|oracle|tests|fixtures|suites|docs)/[\w./*-]*[\w/*])(?![\w./*-]*[<{])")
#: A Markdown document, named on its own (``DESIGN.md``) or with a relative folder
#: (``../shared/DESIGN.md``, ``reference/bounds.md``); web addresses are not matched.
_DOCUMENT = re.compile(r"(?<![\w./:-])((?:[\w.-]+/)*[A-Za-z_][\w-]*\.md)\b")
_TEXT_SUFFIXES = {".py", ".md", ".yaml", ".yml", ".toml", ".ini", ".sh", ".txt", ".cfg", ".csv"}


def _tracked() -> list[str]:
    if shutil.which("git") is None or not (REPOSITORY / ".git").exists():
        pytest.skip("not a git checkout: the tracked files cannot be listed")
    listing = subprocess.run(["git", "ls-files"], cwd=REPOSITORY, capture_output=True, text=True, check=True)
    return [name for name in listing.stdout.splitlines() if (REPOSITORY / name).is_file()]


def cited_paths(text: str) -> list[tuple[int, str]]:
    """(line number, path) of every repository path and Markdown document named in ``text``."""
    cited = []
    for number, line in enumerate(text.splitlines(), 1):
        cited += [(number, match.group(1).rstrip("/.")) for match in _PATH.finditer(line)]
        cited += [(number, match.group(1)) for match in _DOCUMENT.finditer(line)]
    return list(dict.fromkeys(cited))


def _exists(path: str, files: set[str], folders: set[str], names: set[str], citing: str = "") -> bool:
    if "/" not in path:
        return path in names
    if path.endswith(".md") and not path.startswith(("docs/", "tests/", "oracle/", "fixtures/", "suites/")):
        beside = posixpath.normpath(posixpath.join(posixpath.dirname(citing), path))
        return path in files or beside in files
    if "*" in path:
        return any(PurePosixPath(name).match(path) for name in files)
    return path in files or path in folders


def test_the_scanner_sees_a_missing_file_and_an_outside_document():
    files, folders, names = {"docs/DESIGN.md", "oracle/facade.py"}, {"docs", "oracle"}, {"DESIGN.md", "facade.py"}
    text = ("see docs/DESIGN.md and oracle/facade.py;\nalso docs/gone.md, reference/bounds.md, "
            "tests/bench_*.py, fixtures/table-<id>.yaml")
    missing = [path for _, path in cited_paths(text) if not _exists(path, files, folders, names)]
    assert missing == ["docs/gone.md", "tests/bench_*.py", "reference/bounds.md"]
    beside_readme = cited_paths("the brief, ../shared/DESIGN.md, and https://example.org/x/NOTES.md")
    assert [path for _, path in beside_readme] == ["../shared/DESIGN.md"]
    assert not _exists("../shared/DESIGN.md", files, folders, names, citing="README.md")


def test_every_cited_file_is_in_the_repository():
    files = _tracked()
    tracked = set(files)
    folders = {str(parent) for name in files for parent in PurePosixPath(name).parents}
    names = {PurePosixPath(name).name for name in files}
    missing = []
    for name in files:
        if name == "tests/test_file_references.py":        # its own examples of missing files
            continue
        if PurePosixPath(name).suffix not in _TEXT_SUFFIXES and name != ".ci/run":
            continue
        text = (REPOSITORY / name).read_text(encoding="utf-8", errors="replace")
        missing += [f"{name}:{line}: {path}" for line, path in cited_paths(text)
                    if path not in NOT_OURS and not _exists(path, tracked, folders, names, citing=name)]
    assert not missing, "references to files the repository does not hold:\n" + "\n".join(missing)
