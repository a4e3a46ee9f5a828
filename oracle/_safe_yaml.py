"""YAML read with limits: size, aliases and nesting depth are bounded before anything is built.

A YAML file given to the harness (a suite, a regression corpus) may come from
anyone.  Plain ``yaml.safe_load`` runs no code, but a few hundred bytes of
nested aliases (an "alias bomb") expand to gigabytes, and a deep nesting of
``[[[[...]]]]`` exhausts the recursion limit.  :func:`load_limited` rejects a
file larger than ``max_bytes``, with more than ``max_aliases`` alias nodes, whose
nodes would number more than ``max_nodes`` with every alias expanded, or nested
deeper than ``max_depth``, by walking the *event* stream first -- which costs
memory linear in the file, not in its expansion -- and then composing it.
Every error names the file (and the line where it can).
"""

from __future__ import annotations

import os
from pathlib import Path

from ._errors import InvalidInputError

__all__ = ["load_limited", "read_limited", "read_bytes_limited", "check_limits", "MAX_BYTES", "MAX_ALIASES", "MAX_NODES", "MAX_DEPTH"]

#: Default largest file, in bytes.
MAX_BYTES = 8 * 2**20
#: Default largest number of alias nodes (``*name``) in one document.
MAX_ALIASES = 1000
#: Default largest number of nodes with every alias expanded.
MAX_NODES = 2_000_000
#: Default deepest nesting of mappings and sequences.
MAX_DEPTH = 64


def load_limited(source: str | os.PathLike | bytes, *, name: str | None = None,
                 max_bytes: int = MAX_BYTES, max_aliases: int = MAX_ALIASES,
                 max_nodes: int = MAX_NODES, max_depth: int = MAX_DEPTH):
    """The document of a YAML file (a path) or text (``bytes``/``str`` with ``name``).

    Raises :class:`oracle.InvalidInputError` naming the source for a file too
    large, not UTF-8, not YAML, or over the alias, expansion or depth limit.
    """
    import yaml

    text, name = read_limited(source, name=name, max_bytes=max_bytes)
    check_limits(text, name=name, max_aliases=max_aliases, max_nodes=max_nodes,
                 max_depth=max_depth)
    try:
        return yaml.load(text, Loader=yaml.SafeLoader)
    except yaml.YAMLError as error:
        raise _not_yaml(name, error) from None


def read_limited(source: str | os.PathLike | bytes, *, name: str | None = None,
                 max_bytes: int = MAX_BYTES) -> tuple[str, str]:
    """``(text, name)`` of a file (a path) or of given ``bytes``/``str`` (with ``name``):
    refused (InvalidInputError naming it) above ``max_bytes`` -- a file before it is read --
    or when it is not UTF-8."""
    if isinstance(source, (str, os.PathLike)) and name is None:
        data = read_bytes_limited(source, max_bytes=max_bytes)
        name = str(Path(source))
    else:
        data = source.encode("utf-8") if isinstance(source, str) else bytes(source)
        name = name or "<yaml>"
    if len(data) > max_bytes:
        raise InvalidInputError(f"{name}: more than the limit of {max_bytes} bytes")
    try:
        return data.decode("utf-8"), name
    except UnicodeDecodeError as error:
        raise InvalidInputError(f"{name}: not UTF-8 text (byte {error.start})") from None


def read_bytes_limited(path: str | os.PathLike, *, max_bytes: int = MAX_BYTES) -> bytes:
    """The bytes of the file ``path``, refused (InvalidInputError naming it) above ``max_bytes``
    before it is read, or when it cannot be read."""
    name = str(Path(path))
    try:
        size = Path(path).stat().st_size
        if size > max_bytes:
            raise InvalidInputError(f"{name}: {size} bytes, more than the limit of {max_bytes}")
        with Path(path).open("rb") as handle:
            data = handle.read(max_bytes + 1)            # a file growing meanwhile stays bounded
    except OSError as error:
        raise InvalidInputError(f"{name}: cannot read: {error.strerror or error}") from None
    if len(data) > max_bytes:
        raise InvalidInputError(f"{name}: more than the limit of {max_bytes} bytes")
    return data


def check_limits(text: str, *, name: str = "<yaml>", max_aliases: int = MAX_ALIASES,
                 max_nodes: int = MAX_NODES, max_depth: int = MAX_DEPTH) -> None:
    """Walk the YAML events of ``text`` and raise InvalidInputError (``name: line N: ...``)
    over the alias, expansion or depth limit, or for text that is not YAML.  Costs memory
    linear in the text, not in its expansion; builds nothing."""
    import yaml

    aliases = total = 0                 # total: nodes so far, aliases expanded
    sizes: dict[str, int] = {}          # anchor -> nodes of its subtree, aliases expanded
    open_nodes: list[list] = [[None, 0]]  # [anchor, nodes so far] per open collection
    try:
        for event in yaml.parse(text, Loader=yaml.SafeLoader):
            line = event.start_mark.line + 1 if event.start_mark is not None else 0
            if isinstance(event, yaml.AliasEvent):
                aliases += 1
                if aliases > max_aliases:
                    raise InvalidInputError(f"{name}: line {line}: more than {max_aliases} aliases")
                added = sizes.get(event.anchor, 1)
                open_nodes[-1][1] += added
                total += added
            elif isinstance(event, yaml.ScalarEvent):
                open_nodes[-1][1] += 1
                total += 1
                if event.anchor is not None:
                    sizes[event.anchor] = 1
            elif isinstance(event, (yaml.MappingStartEvent, yaml.SequenceStartEvent)):
                open_nodes.append([event.anchor, 1])
                total += 1
                if len(open_nodes) - 1 > max_depth:
                    raise InvalidInputError(f"{name}: line {line}: nested more than {max_depth} "
                                            "levels deep")
            elif isinstance(event, (yaml.MappingEndEvent, yaml.SequenceEndEvent)):
                anchor, count = open_nodes.pop()
                if anchor is not None:
                    sizes[anchor] = count
                open_nodes[-1][1] += count
            if total > max_nodes:
                raise InvalidInputError(f"{name}: line {line}: more than {max_nodes} nodes with "
                                        "its aliases expanded")
    except yaml.YAMLError as error:
        raise _not_yaml(name, error) from None


def _not_yaml(name: str, error) -> InvalidInputError:
    mark = getattr(error, "problem_mark", None)
    where = f"line {mark.line + 1}: " if mark is not None else ""
    problem = getattr(error, "problem", None) or str(error).splitlines()[0]
    return InvalidInputError(f"{name}: {where}not valid YAML: {problem}")
