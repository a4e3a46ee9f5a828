"""Strict argument validation and safe parsing of integers from text."""

import fractions

import numpy as np
import pytest
from hypothesis import given, strategies as st

from oracle._errors import InvalidInputError, OracleError
from oracle._integers import MAX_DIGITS, parse_integer, require_int


@pytest.mark.parametrize("text, expected", [
    ("123", 123),
    ("1_000", 1000),
    ("10**14", 10**14),
    ("2**64-1", 2**64 - 1),
    ("2^32 + 15", 2**32 + 15),
    ("1e12", 10**12),
    ("2.5e3", 2500),
    ("3*10**9", 3 * 10**9),
    ("2**2**3", 256),          # right-associative, as in Python
    ("-(2**3)", -8),
    ("(10**6 + 1) * 2", 2000002),
    ("  42  ", 42),
    ("10**0", 1),
])
def test_parse_integer_accepts_the_documented_forms(text, expected):
    assert parse_integer(text) == expected


@pytest.mark.parametrize("text", [
    "", "   ", "abc", "1.5", "1e-3", "2**-1", "10**10**10", "__import__('os')", "1__0",
    "1_", "2**", "(1 + 2", "1 + 2)", "0x10", "1/2", "9" * (MAX_DIGITS + 10) + "e10",
    "1e99999", "3.0.1",
])
def test_parse_integer_rejects_everything_else_with_our_error(text):
    with pytest.raises(InvalidInputError):
        parse_integer(text)


@given(st.integers(min_value=-10**40, max_value=10**40))
def test_parse_integer_round_trips_decimal_literals(value):
    assert parse_integer(str(value)) == value
    assert parse_integer(f"{value:_}") == value


@pytest.mark.parametrize("value", [True, False, 1.0, 2.5, float("nan"), "7", None, [3],
                                   fractions.Fraction(3, 1), complex(2, 0)])
def test_require_int_refuses_non_integers(value):
    with pytest.raises(InvalidInputError) as raised:
        require_int("x", value)
    assert "x=" in str(raised.value)


def test_require_int_accepts_index_types_and_converts_to_int():
    import gmpy2

    for value in (np.int64(17), np.uint64(2**64 - 1), gmpy2.mpz(10**30), 5):
        converted = require_int("n", value)
        assert type(converted) is int and converted == int(value)


def test_require_int_checks_the_range_and_names_it():
    with pytest.raises(InvalidInputError, match=r"n=-1: must be >= 0"):
        require_int("n", -1, minimum=0)
    with pytest.raises(InvalidInputError, match=r"must be <= 10"):
        require_int("n", 11, maximum=10)


def test_require_int_refuses_absurd_sizes():
    with pytest.raises(InvalidInputError, match="absurd size"):
        require_int("x", 10**(MAX_DIGITS + 100))


def test_our_errors_are_value_errors():
    assert issubclass(InvalidInputError, OracleError)
    assert issubclass(OracleError, ValueError)
