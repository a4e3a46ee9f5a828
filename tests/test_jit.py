"""Tests of the compiled partial sieve (oracle/exact/combinatorial/_jit.py, extra ``jit``).

Two witnesses: the numpy loops of ``PartialSieve`` (the fallback), which must
give the same counts and the same pi(x) at every tested x; and outside the
project, primecountpy (a test-only reference) and OEIS A006880.  The tests
that run the compiled kernel skip, saying why, when numba is absent.
"""

from __future__ import annotations

import random
import subprocess
import sys

import numpy as np
import pytest

from oracle.exact.combinatorial import _parallel
from oracle.exact.combinatorial._deleglise_rivat import prime_pi_deleglise_rivat
from oracle.exact.combinatorial._partial_sieve import (JIT_MIN_X, JIT_SWITCH, SEGMENT_GRANULE,
                                                       PartialSieve, jit_available,
                                                       partial_sieve_type)
from _references import primecount

needs_numba = pytest.mark.skipif(
    not jit_available(), reason=f"numba (extra 'jit') is not installed, or {JIT_SWITCH}=off")

# OEIS A006880: pi(10^n), n = 0..12 (values from memory; each is also checked
# against primecountpy below).
PI_POWERS_OF_TEN = [0, 4, 25, 168, 1229, 9592, 78498, 664579, 5761455, 50847534,
                    455052511, 4118054813, 37607912018]


def _both(x: int, **options) -> tuple[int, int]:
    return (prime_pi_deleglise_rivat(x, kernel="numpy", **options),
            prime_pi_deleglise_rivat(x, kernel="jit", **options))


def _brute_survivors(lo: int, hi: int, primes: list[int]) -> np.ndarray:
    """Flags of n in [lo, hi) prime to 6 and to every p of ``primes`` (by the definition)."""
    n = np.arange(lo, hi, dtype=np.int64)
    alive = (n % 2 != 0) & (n % 3 != 0)
    for p in primes:
        alive &= n % p != 0
    return alive


@needs_numba
@pytest.mark.parametrize("lo_blocks, length_blocks", [(0, 1), (0, 5), (7, 3), (1000, 2)])
def test_compiled_sieve_counts_agree_with_numpy_and_the_definition(lo_blocks, length_blocks):
    from oracle.exact.combinatorial._jit import CompiledPartialSieve

    lo, hi = lo_blocks * SEGMENT_GRANULE, (lo_blocks + length_blocks) * SEGMENT_GRANULE
    primes = [5, 7, 11, 13, 17, 19, 23, 29, 31, 37, 41, 43, 47, 53, 59, 61, 67, 71,
              251, 257, 263, 1009, 4099]
    rng = random.Random(lo_blocks)
    numpy_sieve = PartialSieve(lo, hi, (5, 7))
    compiled = CompiledPartialSieve(lo, hi, (5, 7))
    removed = [5, 7]
    for p in primes[2:]:
        values = np.array(sorted(rng.randrange(lo, hi) for _ in range(300)) + [lo, hi - 1],
                          dtype=np.int64)
        alive = _brute_survivors(lo, hi, removed)
        expected = np.cumsum(alive)[values - lo]
        assert np.array_equal(compiled.count_up_to(values), expected), p
        assert np.array_equal(numpy_sieve.count_up_to(values), expected), p
        assert compiled.survivors() == numpy_sieve.survivors() == int(alive.sum())
        # n // d over divisors d with lpf(d) > p, as the hard leaves use it
        n = hi * 7 + 3
        divisors = np.arange(8, 15, dtype=np.int64)
        lpf = np.array([2, 3, 2, 5, 2, 11, 2], dtype=np.int64)      # lpf of 8..14
        inside = [i for i in range(7) if lo <= n // int(divisors[i]) < hi and lpf[i] > 3]
        if inside:
            first, last = inside[0], inside[-1] + 1
            chosen = [i for i in range(first, last) if lpf[i] > 3]
            expected_sum = sum(int(np.cumsum(alive)[n // int(divisors[i]) - lo]) for i in chosen)
            assert compiled.quotient_count_sum(n, divisors, lpf, 3, first, last) == (
                expected_sum, len(chosen))
        compiled.remove_multiples(p)
        numpy_sieve.remove_multiples(p)
        removed.append(p)
    assert np.array_equal(compiled.words, numpy_sieve.words)
    assert np.array_equal(compiled.popcounts, numpy_sieve.popcounts)


@needs_numba
@pytest.mark.parametrize("k", range(6, 13))
def test_both_kernels_near_powers_of_ten_agree_with_primecountpy(k):
    for x in (10**k - 3, 10**k - 1, 10**k, 10**k + 1, 10**k + 7):
        numpy_value, jit_value = _both(x)
        assert numpy_value == jit_value == primecount.prime_pi(x), x
    assert prime_pi_deleglise_rivat(10**k, kernel="jit") == PI_POWERS_OF_TEN[k]  # OEIS A006880


@needs_numba
def test_both_kernels_at_random_x_up_to_10_to_12_agree_with_primecountpy():
    rng = random.Random(2026)
    for _ in range(30):
        x = int(10 ** rng.uniform(5, 12))
        numpy_value, jit_value = _both(x)
        assert numpy_value == jit_value == primecount.prime_pi(x), x


@needs_numba
@pytest.mark.parametrize("segments", [1, 3, 17])
def test_both_kernels_with_many_short_segments_agree(segments):
    x = 98765432198
    numpy_value, jit_value = _both(x, segment_size=segments * SEGMENT_GRANULE)
    assert numpy_value == jit_value == primecount.prime_pi(x)


@needs_numba
def test_workers_with_the_compiled_kernel_agree_with_primecountpy():
    x = 12345678901234
    assert _parallel.prime_pi_in_workers(x, 2, kernel="jit") == primecount.prime_pi(x)


@needs_numba
def test_default_choice_uses_the_kernel_from_jit_min_x_only(monkeypatch):
    monkeypatch.delenv(JIT_SWITCH, raising=False)
    assert partial_sieve_type(JIT_MIN_X - 1) is PartialSieve
    assert partial_sieve_type(JIT_MIN_X).__name__ == "CompiledPartialSieve"
    monkeypatch.setenv(JIT_SWITCH, "off")
    assert partial_sieve_type(JIT_MIN_X) is PartialSieve


def test_unknown_kernel_is_refused():
    with pytest.raises(ValueError, match="kernel must be one of"):
        partial_sieve_type(10**12, "cuda")


def _run(code: str) -> subprocess.CompletedProcess:
    return subprocess.run([sys.executable, "-c", code], capture_output=True, text=True, timeout=120)


def test_import_oracle_and_the_plugin_do_not_import_numba():
    result = _run("import sys, oracle, oracle.plugin, oracle.exact.combinatorial\n"
                  "print('numba' in sys.modules, 'oracle.exact.combinatorial._jit' in sys.modules)")
    assert result.returncode == 0, result.stderr
    assert result.stdout.split() == ["False", "False"]


def test_without_numba_the_numpy_path_answers_and_jit_is_a_clear_error():
    # sys.modules[name] = None makes every import of numba fail, as if it were not installed.
    result = _run("import sys\nsys.modules['numba'] = None\n"
                  "from oracle.exact.combinatorial._partial_sieve import partial_sieve_type\n"
                  "from oracle.exact.combinatorial._deleglise_rivat import prime_pi_deleglise_rivat\n"
                  "print(partial_sieve_type(10**15).__name__)\n"
                  "print(prime_pi_deleglise_rivat(10**12))\n"
                  "try:\n    partial_sieve_type(10**15, 'jit')\n"
                  "except ValueError as error:\n    print('refused:', error)\n")
    assert result.returncode == 0, result.stderr
    lines = result.stdout.splitlines()
    assert lines[0] == "PartialSieve"
    assert int(lines[1]) == PI_POWERS_OF_TEN[12]  # OEIS A006880
    assert lines[2].startswith("refused: the jit kernel needs numba")
