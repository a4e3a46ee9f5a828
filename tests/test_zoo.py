"""Tests that the zoo of candidate implementations (tests/zoo/) is what it claims to be.

The zoo measures the audit: a correct member that the audit flags is a false
alarm, a defective member it passes is a miss.  So the zoo itself is checked
here against references outside the project:

* every correct member agrees with a *second* library (never the one it is
  built on) at a few hundred points, boundaries included, and with published
  tables (OEIS, named beside each value);
* every defective member goes wrong at its documented ``witness`` in the way
  its ``kind`` says, and agrees with the reference at its ``ordinary`` input,
  so the defect is the documented one and not a broken module.

References: sympy, primecountpy, primesieve, gmpy2 and python-flint as
test-only libraries, and a sieve of Eratosthenes written here.
"""

from __future__ import annotations

import builtins
import collections
import importlib
import json
import math
import random
import shlex
import subprocess
import sys
from pathlib import Path

import gmpy2
import numpy as np
import primesieve
import pytest
import sympy
import yaml

from _lucy import prime_sum_by_lucy
from _references import OPTIONAL, flint, primecountpy, skip_unless_installed

TESTS_DIR = Path(__file__).resolve().parent
REPOSITORY_ROOT = TESTS_DIR.parent
CATALOGUE_PATH = TESTS_DIR / "zoo" / "catalogue.yaml"
ROLES = ("prime_pi", "twin_pi", "nth_prime", "is_prime", "next_prime",
         "prev_prime", "primes_in", "factor")
#: The roles of issue 15, each with at least two defective members and one correct one.
NEW_ROLES = ("prime_sum", "prime_pi_mod", "mertens", "squarefree_count", "triplet_pi_026",
             "triplet_pi_046", "quadruplet_pi")
#: The arithmetic-function roles (issue 15): at least two defective members each.
ARITHMETIC_ROLES = ("mobius", "totient", "divisor_count", "divisor_sum")
ROLES += ARITHMETIC_ROLES
KINDS = ("wrong_value", "wrong_type", "exception", "hang", "nondeterministic", "crash")

if str(TESTS_DIR) not in sys.path:
    sys.path.insert(0, str(TESTS_DIR))

CATALOGUE = yaml.safe_load(CATALOGUE_PATH.read_text())
BY_ID = {entry["id"]: entry for entry in CATALOGUE}


def exec_command(command: str) -> list[str]:
    """The catalogue's command, with a leading ``python`` run by this interpreter.

    CI runs ``.venv/bin/python -m pytest`` without activating the venv, so a
    bare ``python`` on PATH may be another interpreter without the libraries.
    """
    words = shlex.split(command)
    return [sys.executable, *words[1:]] if words and words[0] == "python" else words


def entries(*, defective: bool, python: bool | None = None, kind: str | None = None):
    """Catalogue entries filtered by defectiveness, by kind of target and by kind of defect."""
    chosen = []
    for entry in CATALOGUE:
        if entry["defective"] != defective:
            continue
        if python is not None and ("target" in entry) != python:
            continue
        if kind is not None and entry.get("kind") != kind:
            continue
        chosen.append(pytest.param(entry, id=entry["id"], marks=_marks(entry)))
    return chosen


def _marks(entry) -> list:
    """slow for a member whose witness or ordinary input is a prime sum above the sieve of
    this file (its reference is the Lucy_Hedgehog computation below, seconds at 10^10)."""
    points = [entry.get("witness"), entry.get("ordinary")]
    large = any(isinstance(x, int) and x > LARGE_SIEVE_LIMIT for x in points)
    return [pytest.mark.slow] if entry["role"] == "prime_sum" and large else []


def import_member(module_name: str):
    """The member's module; a member built on an optional reference library that is not
    installed skips the test, with the library's name."""
    try:
        return importlib.import_module(module_name)
    except ModuleNotFoundError as error:
        if error.name in OPTIONAL:
            pytest.skip(f"reference library {OPTIONAL[error.name]} is not installed ({error})")
        raise


def load_target(entry):
    module_name, function_name = entry["target"].split(":")
    return getattr(import_member(module_name), function_name)


def call(function, role, argument):
    """Call a member with a catalogue input (a list of two integers for primes_in, of
    three, [x, q, a], for prime_pi_mod)."""
    if role in ("primes_in", "prime_pi_mod"):
        return function(*argument)
    return function(argument)


# --------------------------------------------------------------------------
# References (test-only libraries, and a sieve written here)
# --------------------------------------------------------------------------

SIEVE_LIMIT = 2 * 10**6


def sieve_of_eratosthenes(limit: int) -> np.ndarray:
    """flags[n] is True iff n is prime, 0 <= n <= limit."""
    flags = np.ones(limit + 1, dtype=bool)
    flags[:2] = False
    for p in range(2, math.isqrt(limit) + 1):
        if flags[p]:
            flags[p * p::p] = False
    return flags


PRIME_FLAGS = sieve_of_eratosthenes(SIEVE_LIMIT)
# TWIN_UPPER[x] = number of primes p with p + 2 <= x and p + 2 prime, for x <= SIEVE_LIMIT.
_upper_of_twin = np.zeros(SIEVE_LIMIT + 1, dtype=np.int64)
_upper_of_twin[2:] = PRIME_FLAGS[2:] & PRIME_FLAGS[:-2]
TWIN_COUNTS = np.cumsum(_upper_of_twin)


LARGE_SIEVE_LIMIT = 10**8


def reference_twin_pi(x: int) -> int:
    if x < 0:
        return 0
    if x <= SIEVE_LIMIT:
        return int(TWIN_COUNTS[x])
    if x <= LARGE_SIEVE_LIMIT:        # a sieve of its own for the few larger witnesses
        flags = sieve_of_eratosthenes(x)
        return int(np.count_nonzero(flags[2:] & flags[:-2]))
    raise AssertionError(f"twin_pi reference sieve ends at {LARGE_SIEVE_LIMIT}, asked {x}")


def _cumulative_prime_sums(limit: int) -> np.ndarray:
    """sums[x] = the sum of the primes p <= x, for x <= limit (int64: exact below 2**63)."""
    flags = PRIME_FLAGS[:limit + 1] if limit <= SIEVE_LIMIT else sieve_of_eratosthenes(limit)
    return np.cumsum(np.where(flags, np.arange(limit + 1, dtype=np.int64), 0))


PRIME_SUMS = _cumulative_prime_sums(SIEVE_LIMIT)


def reference_prime_sum(x: int) -> int:
    """The sum of the primes p <= x from the sieve written here."""
    if x < 2:
        return 0
    if x <= SIEVE_LIMIT:
        return int(PRIME_SUMS[x])
    if x <= LARGE_SIEVE_LIMIT:
        return int(_cumulative_prime_sums(x)[-1])
    return prime_sum_by_lucy(x)


def _mobius_by_sieve(limit: int) -> np.ndarray:
    """mu[n] for 0 <= n <= limit (mu[0] = 0), by a Moebius sieve written here."""
    mu = np.ones(limit + 1, dtype=np.int64)
    rest = np.arange(limit + 1, dtype=np.int64)
    for p in np.flatnonzero(sieve_of_eratosthenes(math.isqrt(limit))).tolist():
        mu[p::p] *= -1
        rest[p::p] //= p
        mu[p * p::p * p] = 0
    mu[rest > 1] *= -1
    mu[0] = 0
    return mu


MERTENS = np.cumsum(_mobius_by_sieve(SIEVE_LIMIT))


def reference_mertens(x: int) -> int:
    if x < 1:
        return 0
    if x <= SIEVE_LIMIT:
        return int(MERTENS[x])
    return int(np.sum(_mobius_by_sieve(x)))


def reference_squarefree_count(x: int) -> int:
    """Q(x) = sum of mu(d) * (x // d^2) over d <= sqrt(x), mu from the sieve written here."""
    if x < 1:
        return 0
    root = math.isqrt(x)
    mu = _mobius_by_sieve(root).tolist()
    return sum(mu[d] * (x // (d * d)) for d in range(1, root + 1) if mu[d])


def reference_constellations(offsets):
    """The number of constellations p + offsets, all prime, with p + offsets[-1] <= x."""
    span = offsets[-1]
    last = np.zeros(SIEVE_LIMIT + 1, dtype=np.int64)
    ok = np.ones(SIEVE_LIMIT + 1 - span, dtype=bool)
    for d in offsets:
        ok &= PRIME_FLAGS[d:SIEVE_LIMIT + 1 - span + d]
    last[span:] = ok
    counts = np.cumsum(last)

    def count(x: int) -> int:
        if x < 0:
            return 0
        if x > SIEVE_LIMIT:
            raise AssertionError(f"constellation reference ends at {SIEVE_LIMIT}, asked {x}")
        return int(counts[x])
    return count


def reference_prime_pi_mod(x: int, q: int, a: int) -> int:
    """The primes p <= x with p = a (mod q), from the sieve written here."""
    if x < 2:
        return 0
    flags = PRIME_FLAGS if x <= SIEVE_LIMIT else sieve_of_eratosthenes(x)
    primes = np.flatnonzero(flags[:x + 1])
    return int(np.count_nonzero(primes % q == a % q))


def reference_factor(n: int) -> dict[int, int]:
    """python-flint's factorisation as {prime: exponent}."""
    return {int(p): int(e) for p, e in flint.fmpz(n).factor()}


REFERENCE = {
    "prime_pi": lambda x: int(primecountpy.prime_pi(x)) if x >= 2 else 0,
    "twin_pi": reference_twin_pi,
    "nth_prime": lambda n: int(primecountpy.nth_prime(n)),
    "is_prime": lambda n: bool(sympy.isprime(n)),
    "next_prime": lambda n: int(gmpy2.next_prime(n)),
    "prev_prime": lambda n: int(gmpy2.prev_prime(n)),
    "primes_in": lambda a, b: [int(p) for p in sympy.primerange(a, b + 1)],
    "factor": reference_factor,
    "prime_sum": reference_prime_sum,
    "prime_pi_mod": reference_prime_pi_mod,
    "mertens": reference_mertens,
    "squarefree_count": reference_squarefree_count,
    "triplet_pi_026": reference_constellations((0, 2, 6)),
    "triplet_pi_046": reference_constellations((0, 4, 6)),
    "quadruplet_pi": reference_constellations((0, 2, 6, 8)),
    # python-flint's arithmetic functions (it factors n itself)
    "mobius": lambda n: int(flint.fmpz(n).moebius_mu()),
    "totient": lambda n: int(flint.fmpz(n).euler_phi()),
    "divisor_count": lambda n: int(flint.fmpz(n).divisor_sigma(0)),
    "divisor_sum": lambda n: int(flint.fmpz(n).divisor_sigma(1)),
}


def reference(role, argument):
    return call(REFERENCE[role], role, argument)


def normalised(role, value):
    """A member's answer in the reference's form, or a marker for a wrong type.

    Counts and primes must be ints (not bool, not float), is_prime a bool,
    primes_in an iterable of ints, factor a dict / list of primes / list of
    (prime, exponent) pairs.
    """
    if role == "is_prime":
        return bool(value) if isinstance(value, (bool, np.bool_)) else ("wrong type", value)
    if role == "primes_in":
        items = list(value)
        return ([int(p) for p in items] if all(isinstance(p, (int, np.integer)) for p in items)
                else ("wrong type", value))
    if role == "factor":
        if isinstance(value, dict):
            return {int(p): int(e) for p, e in value.items()}
        items = list(value)
        if all(isinstance(item, (tuple, list)) and len(item) == 2 for item in items):
            merged = collections.Counter()
            for p, e in items:
                merged[int(p)] += int(e)
            return dict(merged)
        return dict(collections.Counter(int(p) for p in items))
    if isinstance(value, bool) or not isinstance(value, (int, np.integer)):
        return ("wrong type", value)
    return int(value)


# --------------------------------------------------------------------------
# Executable members: a small client of the line protocol
# --------------------------------------------------------------------------

class LineClient:
    """Talks to an executable member: one request line in, one answer line out."""

    def __init__(self, command: str):
        self.process = subprocess.Popen(
            exec_command(command), cwd=REPOSITORY_ROOT, text=True, bufsize=1,
            stdin=subprocess.PIPE, stdout=subprocess.PIPE, stderr=subprocess.PIPE)

    def ask(self, role, argument) -> str | None:
        request = " ".join(map(str, argument)) if role == "primes_in" else str(argument)
        self.process.stdin.write(request + "\n")
        self.process.stdin.flush()
        answer = self.process.stdout.readline()
        return answer.rstrip("\n") if answer else None

    def close(self) -> int:
        try:
            self.process.stdin.close()
        except BrokenPipeError:
            pass
        code = self.process.wait(timeout=30)
        self.process.stdout.close()
        self.process.stderr.close()
        return code


def parse_answer(role, text: str):
    if role == "is_prime":
        return {"1": True, "true": True, "0": False, "false": False}[text.strip().lower()]
    if role == "primes_in":
        return [int(field) for field in text.split()]
    return int(text)


def exec_answers(entry, arguments):
    client = LineClient(entry["exec"])
    try:
        answers = [parse_answer(entry["role"], client.ask(entry["role"], a)) for a in arguments]
    finally:
        code = client.close()
    assert code == 0, f"{entry['id']} exited with {code}"
    return answers


# --------------------------------------------------------------------------
# The catalogue itself
# --------------------------------------------------------------------------

def test_catalogue_ids_are_unique():
    ids = [entry["id"] for entry in CATALOGUE]
    assert len(ids) == len(set(ids))


@pytest.mark.parametrize("entry", [pytest.param(e, id=e["id"]) for e in CATALOGUE])
def test_catalogue_entry_is_well_formed(entry):
    assert entry["role"] in ROLES + NEW_ROLES
    assert ("target" in entry) != ("exec" in entry), "exactly one of target / exec"
    assert isinstance(entry["defective"], bool)
    if "max" in entry:
        assert isinstance(entry["max"], int) and entry["max"] > 0
    if entry["defective"]:
        assert entry["kind"] in KINDS
        assert entry["defect"].strip()
        assert "witness" in entry
        if entry["role"] == "primes_in":
            assert len(entry["witness"]) == 2
        if entry["role"] == "prime_pi_mod":
            assert len(entry["witness"]) == 3
    if "target" in entry:
        module_name, function_name = entry["target"].split(":")
        assert module_name == f"zoo.{entry['id']}"
        assert function_name == entry["role"]
        module = import_member(module_name)
        assert callable(getattr(module, function_name))
        assert ("DEFECT" in module.__doc__) == entry["defective"]
    else:
        command = exec_command(entry["exec"])
        assert (REPOSITORY_ROOT / command[-1]).is_file()


def test_catalogue_covers_every_role():
    defective = collections.Counter(e["role"] for e in CATALOGUE if e["defective"])
    correct = collections.Counter(e["role"] for e in CATALOGUE if not e["defective"])
    for role in ROLES:
        assert defective[role] >= (2 if role in ARITHMETIC_ROLES else 4), role
        assert correct[role] >= 1, role
    for role in {e["role"] for e in CATALOGUE} & set(NEW_ROLES):
        assert defective[role] >= 2 and correct[role] >= 1, role
    executables = [e for e in CATALOGUE if "exec" in e]
    assert sum(not e["defective"] for e in executables) >= 2
    assert {e["kind"] for e in executables if e["defective"]} >= {"wrong_value", "crash"}
    assert "echo_is_prime" in BY_ID


def test_every_python_member_is_in_the_catalogue():
    modules = {path.stem for path in (TESTS_DIR / "zoo").glob("*.py") if path.stem != "__init__"}
    listed = {e["id"] for e in CATALOGUE if "target" in e}
    assert modules == listed


# --------------------------------------------------------------------------
# Points at which correct members are compared with the references
# --------------------------------------------------------------------------

RNG_SEED = 20240501


def sample(low, high, count, seed=RNG_SEED):
    generator = random.Random(seed)
    return [generator.randrange(low, high) for _ in range(count)]


POINTS = {
    "prime_pi": list(range(-3, 120)) + sample(0, 10**7, 150)
    + [131071, 2**16, 2**16 + 1, 10**8, 10**8 + 7],
    "twin_pi": list(range(-3, 120)) + sample(0, SIEVE_LIMIT, 200)
    + [786431, 786432, 786433, SIEVE_LIMIT],
    "nth_prime": list(range(1, 120)) + sample(1, 10**6, 150) + [10**5, 10**5 + 1],
    "is_prime": list(range(0, 300)) + sample(0, 10**12, 150)
    + [2047, 1373653, 25326001, 3215031751, 2152302898747, 3474749660383,
       341550071728321, 3825123056546413051,          # OEIS A014233 (from memory)
       561, 1105, 1729, 29341, 41041, 825265,            # OEIS A002997
       2**31 - 1, 2**61 - 1, 2**89 - 1, 2**127 - 1,      # Mersenne primes, OEIS A000668
       2**67 - 1, 2**32 + 1, 2**64 + 1,                  # composites (Cole 1903; Euler; Landry 1880)
       2**63 - 25, 2**63, 2**64 - 59, 2**64 - 1, 2**64, 2**64 + 13],
    "next_prime": list(range(-3, 300)) + sample(0, 10**12, 150)
    + [2**31 - 2, 2**32 - 6, 2**32 - 5, 2**32, 2**63 - 26, 2**64 - 59, 2**64 - 1, 2**64],
    "prev_prime": list(range(3, 300)) + sample(3, 10**12, 150)
    + [2**31 - 1, 2**31, 2**32 - 4, 2**32, 2**32 + 16, 2**63, 2**64 - 58, 2**64, 2**64 + 14],
    "primes_in": [(a, b) for a in (-5, 0, 1, 2, 3, 4) for b in (-1, 0, 1, 2, 3, 4, 5, 100)]
    + [(b, b) for b in range(0, 50)]
    + [(a, a + 200) for a in sample(0, 10**12, 60)]
    + [(65000, 70000), (130000, 132000), (990, 1020), (2**32 - 100, 2**32 + 100),
       (2**64 - 300, 2**64 - 1), (10, 2)],
    "factor": list(range(1, 300)) + sample(1, 10**15, 100)
    + [2**32 + 1, 2**64 - 1, 2**64 + 1, 1009**2, 1009 * 1013 * 1019, 42799, 3215031751,
       2**10 * 3**5 * 1000003, (2**31 - 1) ** 2, 600851475143],
    "prime_sum": list(range(-3, 120)) + sample(0, SIEVE_LIMIT, 150)
    + [631, 929, 225286, 225287, 323381, SIEVE_LIMIT],
    "prime_pi_mod": [(x, q, a) for x in range(-1, 60) for q, a in ((1, 0), (4, 1), (4, 3), (4, 5),
                                                                   (6, 5), (10, 3), (65537, 3))]
    + [(x, q, 1) for x in sample(0, SIEVE_LIMIT, 40) for q in (3, 8, 30)],
    "mertens": list(range(-3, 200)) + sample(0, 10**6, 100) + [10**4, 10**5, 10**6],
    "squarefree_count": list(range(-3, 200)) + sample(0, 10**12, 60)
    + [10**8, 100020000, 100020001, 10**12],
    **{role: list(range(-3, 200)) + sample(0, SIEVE_LIMIT, 100) + [SIEVE_LIMIT]
       for role in ("triplet_pi_026", "triplet_pi_046", "quadruplet_pi")},
}
# The arithmetic functions: small n, random n up to 2**64 and word-size shapes (squares,
# prime powers, smooth numbers, sigma(n) near 2**64).
_ARITHMETIC_POINTS = (list(range(1, 400)) + sample(1, 2**64, 60)
                      + [2**32 + 1, 2**63, 3 * 2**62, 2**64 - 1, 2**64 + 1, 1009**2,
                         1009 * 1013, 1018081 * 1013, 2**5 * 3**3 * 5 * 7**2 * 11 * 13,
                         (2**31 - 1) ** 2, 2**60 + 3, 3**40, 600851475143])
POINTS.update({role: _ARITHMETIC_POINTS for role in ARITHMETIC_ROLES})

# A second reference for each correct member, never the library the member is built on.
SECOND_REFERENCE = {
    "prime_pi_primecount": lambda x: int(primesieve.count_primes(x)) if x >= 2 else 0,
    "prime_pi_line": lambda x: int(sympy.primepi(x)),
    "twin_pi_primesieve": reference_twin_pi,
    "nth_prime_primecount": lambda n: int(sympy.prime(n)),
    "is_prime_flint": REFERENCE["is_prime"],
    "is_prime_line": REFERENCE["is_prime"],
    "echo_is_prime": REFERENCE["is_prime"],
    "next_prime_sympy": REFERENCE["next_prime"],
    "prev_prime_sympy": REFERENCE["prev_prime"],
    "primes_in_primesieve": lambda a, b: [int(p) for p in sympy.primerange(a, b + 1)],
    "prime_pi_chatty": lambda x: int(primecountpy.prime_pi(x)) if x >= 2 else 0,
    "factor_sympy": reference_factor,
    "prime_sum_sympy": reference_prime_sum,
    "prime_sum_lucy_exact": reference_prime_sum,
    "prime_pi_mod_sympy": reference_prime_pi_mod,
    "mertens_sympy": reference_mertens,
    "squarefree_count_sympy": reference_squarefree_count,
    "triplet_pi_026_sympy": REFERENCE["triplet_pi_026"],
    "triplet_pi_046_sympy": REFERENCE["triplet_pi_046"],
    "quadruplet_pi_sympy": REFERENCE["quadruplet_pi"],
    "mobius_sympy": REFERENCE["mobius"],
    "totient_sympy": REFERENCE["totient"],
    "divisor_count_sympy": REFERENCE["divisor_count"],
    "divisor_sum_sympy": REFERENCE["divisor_sum"],
}


def points_for(entry):
    bound = entry.get("max")
    points = POINTS[entry["role"]]
    if bound is not None:
        if entry["role"] in ("primes_in", "prime_pi_mod"):
            points = [p for p in points if max(p) <= bound]
        else:
            points = [p for p in points if p <= bound]
    if entry["id"] == "prime_pi_line":
        points = [p for p in points if p <= 10**7]   # keeps the default run fast
    return points


def test_every_correct_member_has_a_second_reference():
    assert {e["id"] for e in CATALOGUE if not e["defective"]} == set(SECOND_REFERENCE)


@pytest.mark.parametrize("entry", entries(defective=False, python=True))
def test_correct_python_member_agrees_with_a_second_library(entry):
    member = load_target(entry)
    role = entry["role"]
    check = SECOND_REFERENCE[entry["id"]]
    for point in points_for(entry):
        expected = call(check, role, point)
        got = normalised(role, call(member, role, point))
        assert got == expected, f"{entry['id']}({point}) = {got!r}, expected {expected!r}"


@pytest.mark.parametrize("entry", entries(defective=False, python=False))
def test_correct_executable_member_agrees_with_a_second_library(entry):
    skip_unless_installed(entry.get("needs"))
    role = entry["role"]
    points = points_for(entry)
    answers = exec_answers(entry, points)
    check = SECOND_REFERENCE[entry["id"]]
    for point, got in zip(points, answers):
        assert got == call(check, role, point), f"{entry['id']}({point}) = {got!r}"


# Published values; the correct members must reproduce them.
PI_OF_POWERS_OF_TEN = {  # OEIS A006880 (from memory; cross-checked below by sympy)
    1: 4, 2: 25, 3: 168, 4: 1229, 5: 9592, 6: 78498, 7: 664579, 8: 5761455,
    9: 50847534, 10: 455052511, 11: 4118054813, 12: 37607912018,
}
TWINS_BELOW_POWERS_OF_TEN = {  # OEIS A007508 (from memory; cross-checked below by the local sieve)
    1: 2, 2: 8, 3: 35, 4: 205, 5: 1224, 6: 8169, 7: 58980, 8: 440312,
}
PI_OF_TWO_TO_THE_32 = 203280221  # OEIS A007053, a(32) (from memory; cross-checked below by sympy)
PRIME_AT_POWERS_OF_TEN = {  # OEIS A006988 (from memory; cross-checked below by sympy)
    1: 29, 2: 541, 3: 7919, 4: 104729, 5: 1299709, 6: 15485863, 7: 179424673,
    8: 2038074743, 9: 22801763489,
}


def test_published_tables_agree_with_the_references():
    for k, value in PI_OF_POWERS_OF_TEN.items():
        if k <= 9:
            assert int(sympy.primepi(10**k)) == value
    for k, value in TWINS_BELOW_POWERS_OF_TEN.items():
        if 10**k <= SIEVE_LIMIT:
            assert reference_twin_pi(10**k) == value
    for k, value in PRIME_AT_POWERS_OF_TEN.items():
        if k <= 6:
            assert int(sympy.prime(10**k)) == value
    assert int(sympy.primepi(2**32)) == PI_OF_TWO_TO_THE_32


def test_correct_members_reproduce_published_tables():
    prime_pi = load_target(BY_ID["prime_pi_primecount"])
    for k, value in PI_OF_POWERS_OF_TEN.items():
        assert prime_pi(10**k) == value
    twin_pi = load_target(BY_ID["twin_pi_primesieve"])
    for k, value in TWINS_BELOW_POWERS_OF_TEN.items():
        assert twin_pi(10**k) == value
    nth_prime = load_target(BY_ID["nth_prime_primecount"])
    for k, value in PRIME_AT_POWERS_OF_TEN.items():
        assert nth_prime(10**k) == value
    assert prime_pi(2**32) == PI_OF_TWO_TO_THE_32


def test_correct_members_refuse_what_the_convention_excludes():
    with pytest.raises(ValueError):
        load_target(BY_ID["prev_prime_sympy"])(2)
    with pytest.raises(ValueError):
        load_target(BY_ID["nth_prime_primecount"])(0)
    with pytest.raises(ValueError):
        load_target(BY_ID["factor_sympy"])(0)


# --------------------------------------------------------------------------
# Defective members go wrong where documented, and only as documented
# --------------------------------------------------------------------------

def assert_agrees_at_ordinary(entry, member):
    if "ordinary" not in entry:
        return
    role, point = entry["role"], entry["ordinary"]
    assert normalised(role, call(member, role, point)) == reference(role, point), (
        f"{entry['id']} is wrong at its ordinary input {point}, so its defect is not the documented one")


@pytest.mark.parametrize("entry", entries(defective=True, python=True, kind="wrong_value"))
def test_defective_member_gives_a_wrong_value_at_its_witness(entry):
    member = load_target(entry)
    role, witness = entry["role"], entry["witness"]
    got = call(member, role, witness)
    assert normalised(role, got) != reference(role, witness), f"{entry['id']} is right at {witness}"
    assert_agrees_at_ordinary(entry, member)


def loosely_read(role, value):
    """A wrong-typed answer read as a lenient caller would: truthiness for is_prime, else as is
    (a float count equals its int)."""
    return bool(value) if role == "is_prime" else value


@pytest.mark.parametrize("entry", entries(defective=True, python=True, kind="wrong_type"))
def test_defective_member_returns_a_wrong_type_at_its_witness(entry):
    member = load_target(entry)
    role, witness = entry["role"], entry["witness"]
    got = call(member, role, witness)
    if got is not None or role == "is_prime":      # None is no value at all, except read as falsy
        assert loosely_read(role, got) == reference(role, witness), "the value is right, only the type is wrong"
    assert normalised(role, got) != reference(role, witness)
    assert normalised(role, got)[0] == "wrong type"
    assert_agrees_at_ordinary(entry, member)


def exception_class(entry):
    """The class named by the entry's ``raises``: a builtin, or one defined in the member's module."""
    name = entry["raises"]
    module = import_member(entry["target"].split(":")[0])
    found = getattr(module, name, None) or getattr(builtins, name)
    assert isinstance(found, type) and issubclass(found, BaseException), name
    return found


def test_every_exception_member_names_its_exception():
    for entry in CATALOGUE:
        if entry.get("kind") == "exception" and "target" in entry:
            assert "raises" in entry, entry["id"]
            exception_class(entry)


@pytest.mark.parametrize("entry", entries(defective=True, python=True, kind="exception"))
def test_defective_member_raises_at_its_witness(entry):
    member = load_target(entry)
    expected = exception_class(entry)
    with pytest.raises(expected) as raised:
        call(member, entry["role"], entry["witness"])
    assert raised.type is expected, f"{entry['id']} raised {raised.type.__name__}, not {expected.__name__}"
    assert_agrees_at_ordinary(entry, member)


@pytest.mark.parametrize("entry", entries(defective=True, python=True, kind="nondeterministic"))
def test_defective_member_answers_differently_when_asked_again(entry):
    member = load_target(entry)
    importlib.reload(sys.modules[member.__module__])   # a member with a cache starts afresh
    member = load_target(entry)
    role, witness = entry["role"], entry["witness"]
    answers = {normalised(role, call(member, role, witness)) for _ in range(300)}
    assert reference(role, witness) in answers and len(answers) > 1
    assert_agrees_at_ordinary(entry, member)


# A Python member called in a child of its own (fork+exec, never a plain fork): it says
# "calling" once imported, then calls the member at the arguments given as JSON in argv[2].
CHILD_PROGRAM = """
import json, sys
sys.path.insert(0, sys.argv[3])
module_name, function_name = sys.argv[1].split(":")
member = getattr(__import__(module_name, fromlist=[function_name]), function_name)
arguments = json.loads(sys.argv[2])
print("calling", flush=True)
value = member(*arguments)
if hasattr(value, "__next__"):
    value = list(value)
print("returned", repr(value)[:200], flush=True)
"""


def start_member_child(entry, argument):
    arguments = list(argument) if entry["role"] == "primes_in" else [argument]
    child = subprocess.Popen([sys.executable, "-c", CHILD_PROGRAM, entry["target"],
                              json.dumps(arguments), str(TESTS_DIR)],
                             stdout=subprocess.PIPE, stderr=subprocess.PIPE, text=True)
    assert child.stdout.readline().strip() == "calling", f"{entry['id']} did not start"
    return child


HANG_WAIT_SECONDS = 3.0   # far beyond the milliseconds the ordinary input takes


@pytest.mark.parametrize("entry", entries(defective=True, python=True, kind="hang"))
def test_defective_member_hangs_at_its_witness(entry):
    assert_agrees_at_ordinary(entry, load_target(entry))
    child = start_member_child(entry, entry["witness"])
    try:
        with pytest.raises(subprocess.TimeoutExpired):
            child.wait(timeout=HANG_WAIT_SECONDS)
    finally:
        child.kill()
        child.communicate()


@pytest.mark.parametrize("entry", entries(defective=True, python=True, kind="crash"))
def test_defective_python_member_kills_its_process_at_its_witness(entry):
    assert_agrees_at_ordinary(entry, load_target(entry))
    child = start_member_child(entry, entry["witness"])
    try:
        out, _ = child.communicate(timeout=60)
    finally:
        child.kill()
    assert "returned" not in out, f"{entry['id']} answered at its witness: {out!r}"
    assert child.returncode != 0


@pytest.mark.parametrize("entry", entries(defective=True, python=False, kind="wrong_value"))
def test_defective_executable_answers_wrongly_at_its_witness(entry):
    role = entry["role"]
    got_ordinary, got_witness = exec_answers(entry, [entry["ordinary"], entry["witness"]])
    assert got_ordinary == reference(role, entry["ordinary"])
    assert got_witness != reference(role, entry["witness"])


@pytest.mark.parametrize("entry", entries(defective=True, python=False, kind="crash"))
def test_defective_executable_dies_at_its_witness(entry):
    role = entry["role"]
    client = LineClient(entry["exec"])
    try:
        answer = client.ask(role, entry["ordinary"])
        assert parse_answer(role, answer) == reference(role, entry["ordinary"])
        assert client.ask(role, entry["witness"]) is None, "no answer: the process died"
    finally:
        try:
            code = client.close()
        except BrokenPipeError:
            code = client.process.wait(timeout=30)
    assert code != 0


# Members whose defect needs more than one witness to be pinned down.

def test_zero_based_nth_prime_returns_the_next_prime_everywhere():
    nth_prime = load_target(BY_ID["nth_prime_zero_based"])
    for n in list(range(1, 60)) + sample(1, 10**6, 20):
        assert nth_prime(n) == REFERENCE["nth_prime"](n + 1)


def test_lehmer_float_root_is_wrong_only_at_prime_cubes():
    prime_pi = load_target(BY_ID["prime_pi_lehmer_float_root"])
    cubes = [p**3 for p in (7, 11, 13)]
    for x in cubes:
        assert prime_pi(x) == REFERENCE["prime_pi"](x) + 1
    for x in sample(10**3, 10**7, 40) + [c + 1 for c in cubes] + [c - 1 for c in cubes]:
        assert prime_pi(x) == REFERENCE["prime_pi"](x)


def test_thirty_two_bit_members_are_right_just_below_the_wrap():
    assert load_target(BY_ID["next_prime_uint32"])(2**32 - 6) == 2**32 - 5
    assert load_target(BY_ID["prev_prime_uint32"])(2**32 - 1) == 2**32 - 5
    assert load_target(BY_ID["is_prime_mulmod64"])(2**32 - 5) is True   # 4294967291 is prime
    assert REFERENCE["is_prime"](2**32 - 5)


def test_chatty_member_prints_on_every_call_and_answers_right(capsys):
    prime_pi = load_target(BY_ID["prime_pi_chatty"])
    for x in (0, 100, 10**6):
        assert prime_pi(x) == REFERENCE["prime_pi"](x)
    assert capsys.readouterr().out.count("\n") == 3


def test_int16_twin_count_wraps_exactly_at_the_32768th_pair():
    twin_pi = load_target(BY_ID["twin_pi_int16"])
    witness = BY_ID["twin_pi_int16"]["witness"]
    assert reference_twin_pi(witness - 1) == 2**15 - 1 and reference_twin_pi(witness) == 2**15
    assert twin_pi(witness - 1) == 2**15 - 1
    assert twin_pi(witness) == reference_twin_pi(witness) - 2**16


def test_wieferich_squares_reach_the_lucas_part_and_never_find_a_parameter():
    module = import_member("zoo.is_prime_bpsw_no_square")
    for p in (1093, 3511):             # Wieferich primes, OEIS A001220 (from memory; checked here)
        assert pow(2, p - 1, p * p) == 1
        n = p * p
        assert gmpy2.is_strong_prp(n, 2) and not sympy.isprime(n)
        assert all(n % q for q in module.SMALL_PRIMES)
        # For a square n the Jacobi symbol (D/n) is 0 or 1, never -1: the search cannot end.
        assert all(sympy.jacobi_symbol(d, n) != -1
                   for d in (5 + 2 * k if k % 2 == 0 else -(5 + 2 * k) for k in range(2000)))
    squares_passing = [q for q in sympy.primerange(50, 20000) if gmpy2.is_strong_prp(q * q, 2)]
    assert squares_passing == [1093, 3511]


def test_fermat_prev_prime_witness_is_the_least_base_2_pseudoprime():
    assert gmpy2.is_fermat_prp(341, 2) and not sympy.isprime(341)
    # OEIS A001567 begins with 341: no smaller composite passes the base-2 Fermat test.
    assert not [m for m in range(4, 341) if not sympy.isprime(m) and pow(2, m - 1, m) == 1]
    assert load_target(BY_ID["prev_prime_fermat2"])(342) == 341 != REFERENCE["prev_prime"](342)


def test_window_abort_witness_is_the_first_gap_above_the_window():
    primes = primesieve.primes(10**5)
    first = next(p for p, q in zip(primes, primes[1:]) if q - p > 64)
    assert first == BY_ID["next_prime_window_abort"]["witness"]
    assert int(gmpy2.next_prime(first)) - first == 72   # OEIS A002386 / A005250 (from memory; checked here)


def test_dusart_bound_undershoots_at_the_witness_and_holds_from_39017():
    def bound(n):
        return int(n * (math.log(n) + math.log(math.log(n)) - 0.9484))
    assert bound(2) < int(sympy.prime(2))
    assert all(bound(n) >= int(primecountpy.nth_prime(n)) for n in (39017, 40000, 10**5, 10**6))


def test_running_exponent_factor_repeats_its_primes():
    factor = load_target(BY_ID["factor_running_exponent"])
    for n in (4, 8, 12, 72, 1000):
        pairs = factor(n)
        assert math.prod(p**e for p, e in pairs) != n
        assert len({p for p, _ in pairs}) < len(pairs)
        assert {p for p, _ in pairs} == set(reference_factor(n))


# --------------------------------------------------------------------------
# Thousands of points for the correct members (slow)
# --------------------------------------------------------------------------

@pytest.mark.slow
@pytest.mark.parametrize("entry", entries(defective=False, python=True))
def test_correct_python_member_agrees_at_thousands_of_points(entry):
    member = load_target(entry)
    role = entry["role"]
    check = SECOND_REFERENCE[entry["id"]]
    generator = random.Random(RNG_SEED + 1)
    if role == "primes_in":
        points = [(a, a + generator.randrange(0, 3000))
                  for a in (generator.randrange(-10, 10**12) for _ in range(3000))]
    elif role == "twin_pi":
        points = list(range(0, 3000)) + [generator.randrange(0, SIEVE_LIMIT) for _ in range(3000)]
    elif role in ("prime_pi", "nth_prime"):
        points = list(range(1, 3000)) + [generator.randrange(1, 10**7) for _ in range(2000)]
    elif role == "factor":
        points = list(range(1, 3000)) + [generator.randrange(1, 2**62) for _ in range(2000)]
    else:
        points = list(range(3, 3000)) + [generator.randrange(3, 2**70) for _ in range(2000)]
    for point in points:
        expected = call(check, role, point)
        assert normalised(role, call(member, role, point)) == expected, (entry["id"], point)


@pytest.mark.slow
@pytest.mark.parametrize("entry", entries(defective=False, python=False))
def test_correct_executable_member_agrees_at_thousands_of_points(entry):
    role = entry["role"]
    generator = random.Random(RNG_SEED + 2)
    bound = min(entry.get("max", 2**70), 10**8 if role == "prime_pi" else 2**70)
    points = list(range(0, 3000)) + [generator.randrange(0, bound) for _ in range(2000)]
    check = SECOND_REFERENCE[entry["id"]]
    for point, got in zip(points, exec_answers(entry, points)):
        assert got == call(check, role, point), (entry["id"], point)


@pytest.mark.slow
def test_prime_sum_by_lucy_agrees_with_oeis_a046731():
    """The large-x reference of the prime_sum members against OEIS A046731 (the sum of the
    primes below 10^n) and the sieve of this file."""
    assert prime_sum_by_lucy(10**8 - 3) == reference_prime_sum(10**8 - 3)
    assert prime_sum_by_lucy(10**9) == 24739512092254535     # OEIS A046731, n = 9 (value from memory)
    assert prime_sum_by_lucy(10**10) == 2220822432581729238  # OEIS A046731, n = 10 (value from memory)
