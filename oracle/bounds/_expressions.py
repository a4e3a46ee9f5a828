"""Formulas of the bound catalogue: a small, safe expression language.

A catalogue formula is text such as ``x/ln(x)*(1 + 1.2762/ln(x))``.  It is read
with Python's own parser (:mod:`ast`), but only a whitelist of node types is
accepted, so nothing in a fixture file can run code.  Decimal literals are kept
*exactly* (as :class:`fractions.Fraction` taken from the source text), because
``1.25506`` read as a binary float is already a different constant.

Grammar: numbers, one variable (``x``, ``n`` or ``h``), ``+ - * / **``, unary
minus, parentheses, the functions ``ln``, ``sqrt``, ``exp``, ``li`` and the
constants ``pi``, ``e``, ``gamma`` (Euler's constant) and ``C2`` (the twin prime
constant, OEIS A005597).

Two evaluators share one parsed tree:

* :func:`enclose` -- interval arithmetic (``mpmath.iv``, directed rounding), used
  by the oracle; every result is an interval that contains the true value.
* :func:`evaluate_float` -- float64 arrays (numpy), used only to *screen* many
  points quickly in self-validation; every doubtful point is re-checked with
  :func:`enclose`.
"""

from __future__ import annotations

import ast
from dataclasses import dataclass
from fractions import Fraction

import numpy as np
from mpmath import iv

from . import _enclosures

__all__ = ["Formula", "parse_formula", "parse_constant", "enclose", "evaluate_float",
           "FormulaError", "Unenclosable"]

VARIABLES = ("x", "n", "h")
FUNCTIONS = ("ln", "sqrt", "exp", "li")
CONSTANTS = ("pi", "e", "gamma", "C2")

_BINARY = {ast.Add: "+", ast.Sub: "-", ast.Mult: "*", ast.Div: "/", ast.Pow: "**"}


class FormulaError(ValueError):
    """A catalogue formula is not in the accepted language."""


class Unenclosable(ArithmeticError):
    """No finite enclosure is available (e.g. an astronomically large power)."""


@dataclass(frozen=True)
class Formula:
    """A parsed formula: its source text and a tree of tuples.

    Tree nodes: ``("num", Fraction)``, ``("var", name)``, ``("const", name)``,
    ``("neg", a)``, ``(op, a, b)`` for ``op`` in ``+ - * / **``, and
    ``("call", name, a)``.
    """

    text: str
    tree: tuple
    variable: str | None

    def __str__(self) -> str:
        return self.text


def parse_formula(text: str) -> Formula:
    """Parse ``text``; raise :class:`FormulaError` for anything outside the grammar."""
    if not isinstance(text, str) or not text.strip():
        raise FormulaError(f"formula must be non-empty text, got {text!r}")
    source = text.strip()
    try:
        module = ast.parse(source, mode="eval")
    except SyntaxError as exc:
        raise FormulaError(f"{text!r}: not a formula ({exc.msg})") from None
    variables: set[str] = set()
    tree = _convert(module.body, source, variables)
    if len(variables) > 1:
        raise FormulaError(f"{text!r}: uses several variables {sorted(variables)}")
    return Formula(source, tree, variables.pop() if variables else None)


def parse_constant(text: object) -> Fraction:
    """An exact rational from catalogue text: ``17``, ``5.6``, ``1.101e26``, ``10**19``, ``3/2``."""
    formula = parse_formula(str(text))
    value = _exact(formula.tree)
    if value is None:
        raise FormulaError(f"{text!r}: expected an exact number")
    return value


def _exact(tree: tuple) -> Fraction | None:
    """Evaluate a tree made only of numbers and + - * / and integer powers."""
    kind = tree[0]
    if kind == "num":
        return tree[1]
    if kind == "neg":
        inner = _exact(tree[1])
        return None if inner is None else -inner
    if kind in ("+", "-", "*", "/", "**"):
        left, right = _exact(tree[1]), _exact(tree[2])
        if left is None or right is None:
            return None
        if kind == "+":
            return left + right
        if kind == "-":
            return left - right
        if kind == "*":
            return left * right
        if kind == "/":
            return left / right
        if right.denominator != 1 or abs(right) > 10_000:
            return None
        return left ** int(right)
    return None


def _convert(node: ast.AST, source: str, variables: set[str]) -> tuple:
    if isinstance(node, ast.Constant) and type(node.value) in (int, float):
        literal = ast.get_source_segment(source, node)
        return ("num", Fraction(literal.replace("_", "")))
    if isinstance(node, ast.Name):
        if node.id in VARIABLES:
            variables.add(node.id)
            return ("var", node.id)
        if node.id in CONSTANTS:
            return ("const", node.id)
        raise FormulaError(f"{source!r}: unknown name {node.id!r}")
    if isinstance(node, ast.UnaryOp) and isinstance(node.op, (ast.USub, ast.UAdd)):
        inner = _convert(node.operand, source, variables)
        return ("neg", inner) if isinstance(node.op, ast.USub) else inner
    if isinstance(node, ast.BinOp) and type(node.op) in _BINARY:
        return (_BINARY[type(node.op)], _convert(node.left, source, variables),
                _convert(node.right, source, variables))
    if (isinstance(node, ast.Call) and isinstance(node.func, ast.Name)
            and node.func.id in FUNCTIONS and len(node.args) == 1 and not node.keywords):
        return ("call", node.func.id, _convert(node.args[0], source, variables))
    raise FormulaError(f"{source!r}: {ast.get_source_segment(source, node)!r} is not allowed")


# --------------------------------------------------------------------- intervals

def enclose(formula: Formula, value: int | Fraction, precision: int):
    """An ``mpmath.iv`` interval containing ``formula`` at the exact ``value``.

    ``precision`` is the working precision in bits; callers choose it from the
    size of the argument (:func:`oracle.bounds._enclosures.working_precision`).
    Raises :class:`Unenclosable` if the value cannot be enclosed in finite terms.
    """
    with _enclosures.precision(precision):
        point = _enclosures.exact_interval(value)
        return _enclose(formula.tree, point, precision)


def _enclose(tree: tuple, point, precision: int):
    kind = tree[0]
    if kind == "num":
        return _enclosures.exact_interval(tree[1])
    if kind == "var":
        return point
    if kind == "const":
        return _enclosures.constant(tree[1])
    if kind == "neg":
        return -_enclose(tree[1], point, precision)
    if kind == "call":
        argument = _enclose(tree[2], point, precision)
        return _enclosures.function(tree[1], argument, precision)
    left = _enclose(tree[1], point, precision)
    right = _enclose(tree[2], point, precision)
    if kind == "+":
        return left + right
    if kind == "-":
        return left - right
    if kind == "*":
        return left * right
    if kind == "/":
        if _contains_zero(right):
            raise Unenclosable("division by an interval containing 0")
        return left / right
    return _enclosures.power(left, right, precision)


def _contains_zero(interval) -> bool:
    """True when the interval touches 0 (a divisor we cannot use)."""
    return interval.a <= 0 <= interval.b


# ------------------------------------------------------------------------ floats

def evaluate_float(formula: Formula, values: np.ndarray, cache: dict | None = None) -> np.ndarray:
    """``formula`` at every entry of the float64 array ``values`` (screening only).

    ``cache`` (a dict owned by the caller, tied to one ``values`` array) keeps
    repeated sub-expressions such as ``ln(x)`` and ``li(x)`` from being recomputed
    for every catalogue entry.
    """
    cache = {} if cache is None else cache
    with np.errstate(all="ignore"):
        result = _float(formula.tree, np.asarray(values, dtype=np.float64), cache)
    return np.broadcast_to(result, np.shape(values)).astype(np.float64)


_FLOAT_CONSTANTS = {"pi": np.pi, "e": np.e, "gamma": 0.5772156649015329,
                    "C2": 0.6601618158468696}


def _float(tree: tuple, values: np.ndarray, cache: dict):
    kind = tree[0]
    if kind == "num":
        return float(tree[1])
    if kind == "var":
        return values
    if kind == "const":
        return _FLOAT_CONSTANTS[tree[1]]
    key = repr(tree)
    if key in cache:
        return cache[key]
    if kind == "neg":
        result = -_float(tree[1], values, cache)
    elif kind == "call":
        argument = _float(tree[2], values, cache)
        result = _FLOAT_FUNCTIONS[tree[1]](argument)
    else:
        left, right = _float(tree[1], values, cache), _float(tree[2], values, cache)
        if kind == "+":
            result = left + right
        elif kind == "-":
            result = left - right
        elif kind == "*":
            result = left * right
        elif kind == "/":
            result = np.divide(left, right)
        else:
            result = np.power(left, right)
    cache[key] = result
    return result


_FLOAT_FUNCTIONS = {"ln": np.log, "sqrt": np.sqrt, "exp": np.exp,
                    "li": lambda values: _enclosures.li_float(values)}
