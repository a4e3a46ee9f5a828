"""How a value is written in every front end: terminal, pytest failure text, HTML report.

One renderer, so that the same answer reads the same everywhere:

* booleans are ``true`` and ``false`` (as in JSON and the line protocol);
* an integer too long to show is cut and says how many digits it has; beyond
  :data:`oracle._bounded.INTEGER_DIGITS` (below Python's 4300-digit limit of
  ``int -> str``) it is only counted: ``an integer of 5000 digits``;
* lists and mappings are written as compact JSON-like text, items separated by
  ``", "``; when a pair of lists (got, expected) is too long to show whole, each
  is shown around the *first difference*, with a few items of context on either
  side, so the two never look alike;
* a missing answer (a timeout, a crash: ``got`` is ``None``) is ``no answer``.
"""

from __future__ import annotations

import json
import re

from .._bounded import bounded_text, bounded_value

__all__ = ["show_value", "show_pair", "got_expected", "VALUE_LIMIT", "NO_ANSWER", "CONTEXT_ITEMS"]

#: Longest text shown for one value; longer ones are cut and say how long they were.
VALUE_LIMIT = 160
#: The text of a missing answer.
NO_ANSWER = "no answer"
#: Items shown on either side of the first difference of two lists.
CONTEXT_ITEMS = 3
_ITEM_LIMIT = 40


def show_value(value: object, limit: int = VALUE_LIMIT) -> str:
    """``value`` as text of about ``limit`` characters at most; ``""`` for None."""
    if value is None:
        return ""
    if isinstance(value, bool):
        return "true" if value else "false"
    if isinstance(value, str):
        return value if len(value) <= limit else f"{value[:limit]}... ({_size_of_text(value)})"
    if isinstance(value, (list, tuple, dict)):
        text = _compact(bounded_value(value))
        if len(text) <= limit:
            return text
        if isinstance(value, dict):
            return f"{text[:limit]}... ({len(value)} entries)"
        return _window(*_listing(value), 0, limit)
    return bounded_text(value, max(limit, 40))


def show_pair(got: object, expected: object, limit: int = VALUE_LIMIT) -> tuple[str, str]:
    """``got`` and ``expected`` as texts; two long lists are each shown around their first
    difference (never the same prefix for both); a missing ``got`` is ``no answer``."""
    if got is None:
        return NO_ANSWER, show_value(expected, limit)
    if isinstance(got, (list, tuple)) and isinstance(expected, (list, tuple)):
        if len(_compact(bounded_value(got))) <= limit and len(_compact(bounded_value(expected))) <= limit:
            return show_value(got, limit), show_value(expected, limit)
        (got_items, got_total), (expected_items, expected_total) = _listing(got), _listing(expected)
        first = _first_difference(got_items, expected_items)
        return (_window(got_items, got_total, first, limit),
                _window(expected_items, expected_total, first, limit))
    return show_value(got, limit), show_value(expected, limit)


def got_expected(got: object, expected: object, limit: int = VALUE_LIMIT) -> str:
    """``got X, expected Y``; ``no answer`` (``no answer, expected Y``) when nothing came back."""
    got_text, expected_text = show_pair(got, expected, limit)
    if got is None:
        return NO_ANSWER + (f", expected {expected_text}" if expected is not None else "")
    return f"got {got_text}, expected {expected_text}"


def _first_difference(a: list, b: list) -> int:
    for index, (x, y) in enumerate(zip(a, b)):
        if x != y:
            return index
    return min(len(a), len(b))


_CUT_LIST = re.compile(r"\.\.\. and \d+ more \((\d+) in all\)\Z")


def _listing(value) -> tuple[list, int]:
    """The items of a list and how many it had: a list cut when it was recorded
    (:func:`oracle._bounded.bounded_value`) ends with ``... and K more (N in all)``."""
    items = list(value)
    if items and isinstance(items[-1], str) and (found := _CUT_LIST.search(items[-1])):
        return items[:-1], int(found.group(1))
    return items, len(items)


def _window(items: list, total: int, centre: int, limit: int) -> str:
    """The items around index ``centre`` within about ``limit`` characters, of a list of
    ``total`` items: ``[... 67, 71, 73, 79 ...] (items 18 to 21 of 25)``, ``[2, 3, 5 ...] (first 3 of 25 items)``."""
    start = max(0, centre - CONTEXT_ITEMS)
    end = min(len(items), centre + CONTEXT_ITEMS + 1)
    shown = [_item(item) for item in items[start:end]]
    while len(shown) > 1 and sum(len(text) + 2 for text in shown) > limit:
        if end - centre > centre - start:       # drop from the longer side
            end -= 1
            shown.pop()
        else:
            start += 1
            shown.pop(0)
    body = ", ".join(shown)
    if len(body) > limit:
        body = body[:limit] + "..."
    text = "[" + ("... " if start > 0 else "") + body + (" ..." if end < total else "") + "]"
    if start == 0 and end == total:
        return text
    if start >= end:                            # nothing at the difference: the list ended
        return f"[... ] (ends after item {len(items)} of {total})" if items else "[]"
    if start == 0:
        return f"{text} (first {end} of {total} items)"
    where = f"item {start + 1}" if end - start == 1 else f"items {start + 1} to {end}"
    return f"{text} ({where} of {total})"


def _item(item: object) -> str:
    if isinstance(item, (list, tuple, dict)):
        return show_value(item, _ITEM_LIMIT)
    return show_value(item, _ITEM_LIMIT) if item is not None else "null"


def _compact(value: object) -> str:
    """JSON with ", " between items and ": " after keys, and nothing else added."""
    return json.dumps(value, separators=(", ", ": "), ensure_ascii=False)


def _size_of_text(text: str) -> str:
    found = re.search(r"\.\.\. \((\d+ (?:characters|digits))\)\Z", text)
    return found.group(1) if found else f"{len(text)} characters"
