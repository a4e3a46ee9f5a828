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

import collections
import importlib
import math
import random
import shlex
import subprocess
import sys
import threading
from pathlib import Path

import flint
import gmpy2
import numpy as np
import primecountpy
import primesieve
import pytest
import sympy
import yaml

TESTS_DIR = Path(__file__).resolve().parent
REPOSITORY_ROOT = TESTS_DIR.parent
CATALOGUE_PATH = TESTS_DIR / "zoo" / "catalogue.yaml"
ROLES = ("prime_pi", "twin_pi", "nth_prime", "is_prime", "next_prime",
         "prev_prime", "primes_in", "factor")
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
        chosen.append(pytest.param(entry, id=entry["id"]))
    return chosen


def load_target(entry):
    module_name, function_name = entry["target"].split(":")
    return getattr(importlib.import_module(module_name), function_name)


def call(function, role, argument):
    """Call a member with a catalogue input (a list of two integers for primes_in)."""
    if role == "primes_in":
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


def reference_twin_pi(x: int) -> int:
    if x < 0:
        return 0
    if x <= SIEVE_LIMIT:
        return int(TWIN_COUNTS[x])
    raise AssertionError(f"twin_pi reference sieve ends at {SIEVE_LIMIT}, asked {x}")


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
    assert entry["role"] in ROLES
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
    if "target" in entry:
        module_name, function_name = entry["target"].split(":")
        assert module_name == f"zoo.{entry['id']}"
        assert function_name == entry["role"]
        module = importlib.import_module(module_name)
        assert callable(getattr(module, function_name))
        assert ("DEFECT" in module.__doc__) == entry["defective"]
    else:
        command = exec_command(entry["exec"])
        assert (REPOSITORY_ROOT / command[-1]).is_file()


def test_catalogue_covers_every_role():
    defective = collections.Counter(e["role"] for e in CATALOGUE if e["defective"])
    correct = collections.Counter(e["role"] for e in CATALOGUE if not e["defective"])
    for role in ROLES:
        assert defective[role] >= 4, role
        assert correct[role] >= 1, role
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
}

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
    "factor_sympy": reference_factor,
}


def points_for(entry):
    bound = entry.get("max")
    points = POINTS[entry["role"]]
    if bound is not None:
        if entry["role"] == "primes_in":
            points = [p for p in points if p[1] <= bound]
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


@pytest.mark.parametrize("entry", entries(defective=True, python=True, kind="wrong_type"))
def test_defective_member_returns_a_wrong_type_at_its_witness(entry):
    member = load_target(entry)
    role, witness = entry["role"], entry["witness"]
    got = call(member, role, witness)
    assert got == reference(role, witness), "the value is right, only the type is wrong"
    assert normalised(role, got) != reference(role, witness)
    assert_agrees_at_ordinary(entry, member)


@pytest.mark.parametrize("entry", entries(defective=True, python=True, kind="exception"))
def test_defective_member_raises_at_its_witness(entry):
    member = load_target(entry)
    with pytest.raises(Exception):
        call(member, entry["role"], entry["witness"])
    assert_agrees_at_ordinary(entry, member)


@pytest.mark.parametrize("entry", entries(defective=True, python=True, kind="nondeterministic"))
def test_defective_member_answers_differently_when_asked_again(entry):
    member = load_target(entry)
    role, witness = entry["role"], entry["witness"]
    answers = {normalised(role, call(member, role, witness)) for _ in range(300)}
    assert reference(role, witness) in answers and len(answers) > 1
    assert_agrees_at_ordinary(entry, member)


@pytest.mark.parametrize("entry", entries(defective=True, python=True, kind="hang"))
def test_defective_member_hangs_at_its_witness(entry):
    member = load_target(entry)
    result = {}

    def run(point, key):
        result[key] = call(member, entry["role"], point)

    stuck = threading.Thread(target=run, args=(entry["witness"], "witness"), daemon=True)
    stuck.start()
    stuck.join(timeout=1.0)
    assert stuck.is_alive(), f"{entry['id']} returned {result.get('witness')!r} at its witness"
    finishing = threading.Thread(target=run, args=(entry["ordinary"], "ordinary"), daemon=True)
    finishing.start()
    finishing.join(timeout=10.0)
    assert not finishing.is_alive()
    assert normalised(entry["role"], result["ordinary"]) == reference(entry["role"], entry["ordinary"])


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
