"""Noticing a candidate that changed the harness, when it runs in the harness's own process.

In the trusting mode (``--in-process``) a candidate shares the judge's memory and can replace
any function of the oracle or the engine.  Isolation is the cure; this is the alarm: a
fingerprint of every ``oracle`` module -- the identity of each global, of each function's code,
defaults and closure, and of each class attribute -- and of the builtins, taken before the
candidate is imported and compared after the audit.  Any difference voids the verdict.  It
catches the patching a careless or mischievous candidate does; a candidate set on fooling it
can defeat it, which is why the default is the isolated worker.
"""

from __future__ import annotations

import builtins
import sys
import types

__all__ = ["fingerprint", "changes"]


def _members(value: object) -> list[tuple[str, int]]:
    if isinstance(value, types.FunctionType):
        return [("code", id(value.__code__)), ("defaults", id(value.__defaults__)),
                ("kwdefaults", id(value.__kwdefaults__)),
                ("closure", id(value.__closure__))] + [
            (f"cell{index}", id(cell.cell_contents))
            for index, cell in enumerate(value.__closure__ or ()) if _filled(cell)]
    if isinstance(value, type):
        return [(f"attr {name}", id(member)) for name, member in list(vars(value).items())]
    if isinstance(value, (tuple, frozenset)):
        return [("items", hash(value))] if _hashable(value) else []
    return []


def _filled(cell) -> bool:
    try:
        cell.cell_contents
    except ValueError:
        return False
    return True


def _hashable(value: object) -> bool:
    try:
        hash(value)
    except TypeError:
        return False
    return True


def fingerprint() -> dict[tuple[str, str], tuple]:
    """``(module, name) -> identities`` for the oracle's modules and the builtins."""
    modules = [(name, module) for name, module in list(sys.modules.items())
               if module is not None and (name == "oracle" or name.startswith("oracle."))]
    modules.append(("builtins", builtins))
    prints: dict[tuple[str, str], tuple] = {}
    for module_name, module in modules:
        for name, value in list(vars(module).items()):
            if name.startswith("__") and name != "__dict__":
                continue
            prints[(module_name, name)] = (id(value), tuple(_members(value)))
    return prints


def changes(before: dict, after: dict) -> list[str]:
    """Names (``module.name``) bound before to a function, a class or a constant tuple that
    are now gone or bound to something else, or whose code, defaults or attributes changed.
    Names bound later (lazy imports, caches filled on first use) are not changes."""
    return [f"{module}.{name}" for (module, name), print_ in sorted(before.items())
            if print_[1] and after.get((module, name)) != print_]
