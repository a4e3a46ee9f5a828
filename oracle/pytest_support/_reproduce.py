"""The command line that re-runs exactly one item: the same item id, targets, settings and seed.

``--ntoracle-item ID`` (repeatable) keeps only the items whose node id is
``ID`` -- an exact match, unlike ``-k``, whose words match parts of names (so
``-k 'primes[0..10]'`` also selects ``primes[0..100]``, and an item of another
role with the same case).  With it the plugin collects only the files those
ids live in, and the bundled suites only when an id is one of theirs.  The
targets of the item's role are written out with their settings
(:meth:`TargetSetting.written`), so the line works without the ini file that
configured them; a bundled item's id depends on them (with several targets
of one role each collector is named after its target).
"""

from __future__ import annotations

import shlex

from ._settings import SETTINGS

__all__ = ["reproduce_line"]


def reproduce_line(config, nodeid: str, *, role: str | None = None, targets=None) -> str:
    """``pytest --ntoracle-item NODEID [--ntoracle-target ROLE=SPEC KEY=VALUE ...] --ntoracle-seed S
    --ntoracle-profile P``: the targets given (default: those configured for ``role``), and the
    session's other settings that change what the item does."""
    settings = config.stash[SETTINGS]
    words = ["pytest", "--ntoracle-item", nodeid]
    chosen = list(targets) if targets is not None else (settings.targets_for(role) if role else [])
    for target in chosen:
        words += ["--ntoracle-target" if target.kind == "python" else "--ntoracle-exec", target.written()]
    words += ["--ntoracle-seed", str(settings.seed), "--ntoracle-profile", settings.profile]
    if settings.in_process:
        words.append("--ntoracle-in-process")
    if settings.hypothesis_profile:
        words += ["--ntoracle-hypothesis-profile", settings.hypothesis_profile]
    return shlex.join(words)
