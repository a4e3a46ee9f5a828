"""Optional reference libraries of the tests, imported when a test first uses them.

The tests check the oracle against general-purpose libraries from the package
registry (python-flint, primecountpy, primesieve, sympy).  Any of them may be
missing -- primesieve's binding needs Debian's libprimesieve-dev, primecountpy
needs libprimecount-dev -- and then only the tests that use it are skipped, each
saying which library it wanted; collection of the rest of the module goes on.

>>> from _references import flint
>>> flint.fmpz(7).is_prime()        # skips the calling test if python-flint is absent
True
"""

from __future__ import annotations

import importlib

import pytest

__all__ = ["reference", "flint", "primecountpy", "primecount", "primesieve", "sympy"]


class _Reference:
    """Stands for a module; the first attribute access imports it or skips the test."""

    def __init__(self, module: str, distribution: str):
        self._module_name, self._distribution = module, distribution
        self._module = None

    def _load(self):
        if self._module is None:
            try:
                self._module = importlib.import_module(self._module_name)
            except ImportError as error:
                pytest.skip(f"reference library {self._distribution} is not installed ({error})")
        return self._module

    def __getattr__(self, name: str):
        if name.startswith("_") or name.startswith("pytest"):
            # pytest probes module attributes while collecting (``__test__``, ``pytestmark``);
            # only a test's own use of the library may import it
            raise AttributeError(name)
        return getattr(self._load(), name)


def reference(module: str, distribution: str | None = None) -> _Reference:
    """A lazy stand-in for ``module``; ``distribution`` is its name on PyPI, for the skip reason."""
    return _Reference(module, distribution or module)


#: Optional reference libraries: module name -> PyPI name (what a skip reason names).
OPTIONAL = {"flint": "python-flint", "primecountpy": "primecountpy", "primesieve": "primesieve"}

def skip_unless_installed(modules) -> None:
    """Skip the calling test unless every module of ``modules`` (optional references) imports."""
    import importlib.util

    for module in modules or ():
        if importlib.util.find_spec(module) is None:
            pytest.skip(f"reference library {OPTIONAL.get(module, module)} is not installed")


flint = reference("flint", "python-flint")
primecountpy = reference("primecountpy")
primecount = reference("primecountpy.primecount", "primecountpy")
primesieve = reference("primesieve")
sympy = reference("sympy")
