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


# -- bounded parsing: hostile expressions are refused at once --------------- #

from oracle._integers import MAX_BITS, MAX_NESTING, MAX_TEXT, MAX_TOKENS  # noqa: E402


@pytest.mark.parametrize("text, problem", [
    ("((0.5**16000)**16000)**16000", "denominator"),        # the denominator grows, not the numerator
    ("0.5**16001", "exponent"),
    ("*".join(["1e-4000"] * 60), "denominator"),             # a chain of tiny factors
    ("+".join(f"1e-{k}" for k in range(3990, 4000)), "not an integer"),
    ("1**10**100", "exponent"),
    ("2**16001", "exponent|absurd size"),
    ("1e99999999999999999999", "e-notation"),
    ("(" * (MAX_NESTING + 1) + "1" + ")" * (MAX_NESTING + 1), "nested"),
    ("-" * (MAX_NESTING + 1) + "1", "nested"),
    ("+".join(["1"] * MAX_TOKENS), "numbers and operators"),
    ("1" * (MAX_TEXT + 1), "characters"),
])
def test_parse_integer_refuses_hostile_expressions_naming_the_limit(text, problem):
    with pytest.raises(InvalidInputError, match=problem):
        parse_integer(text)


@pytest.mark.parametrize("text, character", [
    ("\u0661\u0662\u0663", "U+0661"),     # Arabic-Indic digits: int() reads them as 123
    ("\uff11\uff12\uff13", "U+FF11"),     # full-width digits
    ("2\u00b2", "U+00B2"),                # a superscript two
    ("1\u09e6", "U+09E6"),                # Bengali digit zero
    ("10\u00a0000", "U+00A0"),            # a no-break space is not ASCII either
])
def test_parse_integer_accepts_ascii_digits_only(text, character):
    with pytest.raises(InvalidInputError, match="ASCII") as raised:
        parse_integer(text)
    assert character in str(raised.value)


def test_python_itself_would_read_those_digits():
    assert int("\u0661\u0662\u0663") == 123 and int("\uff11\uff12\uff13") == 123


@pytest.mark.parametrize("text, expected", [
    ("10**14", 10**14), ("2**64-1", 2**64 - 1), ("1e12", 10**12), ("12.5e1", 125),
    ("(1e-4000 + 1e-3999) * 1e4000", 11),
    ("1e-3 * 1e3", 1), ("0.5**3 * 8", 1), ("-(-(-(7)))", -7),
    ("9" * MAX_DIGITS, int("9" * MAX_DIGITS)),
    ("+".join(["1"] * (MAX_TOKENS // 2)), MAX_TOKENS // 2),
])
def test_parse_integer_still_reads_large_valid_forms_exactly(text, expected):
    assert parse_integer(text) == expected


def test_intermediates_may_exceed_the_final_limit_but_not_max_bits():
    # require_int caps the result near 13320 bits; an intermediate may reach MAX_BITS (16000)
    assert parse_integer("2**15999 - 2**15999 + 2**13000") == 2**13000
    with pytest.raises(InvalidInputError, match="absurd size"):
        parse_integer("2**15999")


def test_every_intermediate_limit_is_at_least_the_size_of_an_accepted_value():
    assert MAX_BITS >= MAX_DIGITS * 3.33                    # require_int's own limit


def test_error_messages_stay_short_for_long_input():
    with pytest.raises(InvalidInputError) as raised:
        parse_integer("*".join(["1e-4000"] * 60))
    assert len(str(raised.value)) < 300
