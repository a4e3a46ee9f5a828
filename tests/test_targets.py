"""Targets: faults of the candidate come back as results, never as errors of the harness."""

import sys
import textwrap

import pytest

from oracle import InvalidInputError, roles, targets

EXEC_PI = textwrap.dedent("""
    import sys, sympy
    for line in sys.stdin:
        x = int(line)
        if x == 13:
            import os; os.kill(os.getpid(), 11)
        if x == 14:
            import time; time.sleep(60)
        if x == 15:
            print("error: refused", flush=True); continue
        print(sympy.primepi(x), flush=True)
""")


@pytest.fixture
def exec_pi(tmp_path):
    script = tmp_path / "pi.py"
    script.write_text(EXEC_PI)
    target = targets.exec_target(f"{sys.executable} {script}", role_name="prime_pi", timeout=2.0)
    yield target
    target.close()


def test_in_process_call_exception_and_timeout():
    target = targets.python_target("_candidates:prime_pi_slow", role_name="prime_pi", timeout=0.2,
                                   isolate=False)
    ok, slow = target.call_many([(100,), (10**6,)])
    assert ok.status == targets.OK and ok.value == 25          # OEIS A006880: pi(100) = 25
    assert slow.status == targets.TIMEOUT
    raised = targets.python_target("math:isqrt", role_name="prime_pi", timeout=1,
                                   isolate=False).call_many([(-1,)])[0]
    assert raised.status == targets.RAISED and "ValueError" in raised.error


def test_generators_are_consumed_inside_the_call():
    target = targets.python_target("builtins:range", role_name="primes_in", timeout=1)
    assert target.call_many([(3,)])[0].value == [0, 1, 2]      # a range arrives as its list
    gen = targets.python_target("itertools:repeat", role_name="primes_in", timeout=1)
    assert gen.call_many([(7, 2)])[0].value == [7, 7]


def test_executable_survives_crash_hang_and_refusal(exec_pi):
    results = exec_pi.call_many([(10,), (13,), (100,), (14,), (1000,), (15,)])
    assert [r.status for r in results] == ["ok", "crashed", "ok", "timeout", "ok", "raised"]
    assert [results[0].value, results[2].value, results[4].value] == [4, 25, 168]   # OEIS A006880
    assert "SIGSEGV" in results[1].error
    assert exec_pi.restarts >= 2     # a batch that faults is asked again one request at a time


def test_isolated_python_target_keeps_types_and_contains_a_crash():
    target = targets.python_target("_candidates:prime_pi_crash", role_name="prime_pi", timeout=5,
                                   isolate=True)
    try:
        results = target.call_many([(10,), (77,), (100,)])
        assert [r.status for r in results] == ["ok", "crashed", "ok"]
        assert results[2].value == 25
        floats = targets.python_target("_candidates:prime_pi_float", role_name="prime_pi",
                                       timeout=5, isolate=True)
        value = floats.call_many([(100,)])[0].value
        floats.close()
        assert isinstance(value, float) and value == 25.0
    finally:
        target.close()


@pytest.mark.parametrize("spec, role, arguments, expected", [
    ("_candidates:next_prime_mpz", "next_prime", (97,), 101),
    ("_candidates:factor_mpz_pairs", "factor", (360,), ((2, 3), (3, 2), (5, 1))),   # 360 = 2^3 3^2 5
])
def test_isolated_worker_carries_gmpy2_integers_as_integers(spec, role, arguments, expected):
    """gmpy2's mpz has a len(); it is an integer all the same (it was read as a wrong type)."""
    target = targets.python_target(spec, role_name=role, timeout=5, isolate=True)
    try:
        result = target.call_many([arguments])[0]
    finally:
        target.close()
    assert result.status == "ok"
    assert roles.get(role).normalise(result.value, roles.Conventions()) == expected


def test_isolated_target_memory_limit_turns_exhaustion_into_a_finding():
    target = targets.python_target("builtins:bytearray", role_name="prime_pi", timeout=5,
                                   isolate=True, memory_limit=512 * 2**20)
    try:
        result = target.call_many([(2**31,)])[0]
        assert result.status == targets.RAISED and "MemoryError" in result.error
    finally:
        target.close()


@pytest.mark.parametrize("spec", ["no_colon", "math:", "nosuchmodule_xyz:f", "math:nosuchfunction"])
def test_bad_target_names_refused(spec):
    with pytest.raises(InvalidInputError, match="target"):
        targets.python_target(spec, role_name="prime_pi", timeout=1)


def test_text_protocol_decoding():
    from oracle.targets._protocol import decode_text_answer

    assert decode_text_answer("is_prime", b"true") == (False, True, None)
    assert decode_text_answer("primes_in", b"") == (False, [], None)
    assert decode_text_answer("factor", b"2^2 3") == (False, [(2, 2), (3, 1)], None)
    assert decode_text_answer("prime_pi", b"3.5") == (False, "3.5", None)
    assert decode_text_answer("prime_pi", b"error: x too big")[0] is True


def test_text_protocol_leading_zeros_do_not_make_an_integer_huge():
    # 000...05 is 5 whatever the zeros (int() alone refuses more than 4300 characters); only
    # significant digits make an answer too long to show
    from oracle.targets._protocol import decode_text_answer

    zeros = b"0" * 5000
    assert decode_text_answer("prime_pi", zeros + b"5") == (False, 5, None)
    assert decode_text_answer("prime_pi", b" -" + zeros + b"5 ") == (False, -5, None)
    assert decode_text_answer("factor", zeros + b"5^" + zeros + b"2 7") == (False, [(5, 2), (7, 1)], None)
    assert repr(decode_text_answer("prime_pi", b"1" * 5000)[1]) == "<an integer of 5000 digits>"
