"""Import a Python target named ``package.module:function``."""

from __future__ import annotations

import importlib
from typing import Callable

from .._errors import InvalidInputError
from ._worker import SPEC      # one pattern for the parent's check and the worker's import

__all__ = ["load_callable", "SPEC"]


def load_callable(spec: str) -> Callable:
    """The callable ``module:attribute`` (the attribute may be dotted: ``module:Class.method``)."""
    if not isinstance(spec, str) or not SPEC.match(spec):
        raise InvalidInputError(f"target={spec!r}: expected package.module:function")
    module_name, _, attribute = spec.partition(":")
    try:
        found = importlib.import_module(module_name)
    except ImportError as error:
        raise InvalidInputError(f"target={spec!r}: cannot import {module_name!r}: {error}") from None
    for part in attribute.split("."):
        try:
            found = getattr(found, part)
        except AttributeError:
            raise InvalidInputError(f"target={spec!r}: {module_name!r} has no {attribute!r}") from None
    if not callable(found):
        raise InvalidInputError(f"target={spec!r}: {attribute!r} is not callable")
    return found
