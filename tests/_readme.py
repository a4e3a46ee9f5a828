"""Reading the README's checked parts: named lists, cheap shell blocks, fenced blocks.

A named list is a bullet list between ``<!-- names: LIST -->`` and ``<!-- /names -->``; the
names of a bullet are the backticked words it starts with (``- `a`, `b` or `c` — text``).
A cheap shell block is a fenced ``sh`` block right after ``<!-- run: cheap -->``.
"""

from __future__ import annotations

import re
from pathlib import Path

README = Path(__file__).resolve().parents[1] / "README.md"
_LEADING_NAMES = re.compile(r"^(?:`([^`]+)`(?:, | or |/)?)+")


def text() -> str:
    return README.read_text(encoding="utf-8")


def named_list(name: str) -> list[str]:
    """The names of the list ``name``, in order."""
    found = re.search(rf"<!-- names: {re.escape(name)} -->\n(.*?)<!-- /names -->", text(), re.S)
    assert found, f"README has no list {name!r}"
    bullets: list[str] = []
    for line in found.group(1).splitlines():
        if line.startswith("- "):
            bullets.append(line[2:])
        elif line.startswith("  ") and bullets:
            bullets[-1] += " " + line.strip()
    names = []
    for bullet in bullets:
        leading = _LEADING_NAMES.match(bullet)
        assert leading, f"README list {name!r}: a bullet that starts with no name: {bullet!r}"
        names += re.findall(r"`([^`]+)`", leading.group(0))
    return names


def cheap_shell_lines() -> list[str]:
    """Every command line of the cheap shell blocks."""
    lines = []
    for block in re.findall(r"<!-- run: cheap -->\n```sh\n(.*?)```", text(), re.S):
        lines += [line for line in block.splitlines() if line.strip()]
    return lines


def fenced(language: str) -> list[str]:
    """The bodies of the fenced blocks of ``language``."""
    return re.findall(rf"```{language}\n(.*?)```", text(), re.S)
