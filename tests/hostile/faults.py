"""Candidates that fault from x = 500 on and count primes correctly elsewhere (a sieve of their own,
so that nothing here depends on the oracle)."""

import ctypes
import math
import os
import sys
import time

TRIGGER = 500


def _count(x):
    if x < 2:
        return 0
    sieve = bytearray([1]) * (x + 1)
    sieve[0:2] = b"\0\0"
    for p in range(2, math.isqrt(x) + 1):
        if sieve[p]:
            sieve[p * p::p] = bytes(len(range(p * p, x + 1, p)))
    return sum(sieve)


def exits_zero(x):
    if x >= TRIGGER:
        os._exit(0)
    return _count(x)


def segfaults(x):
    if x >= TRIGGER:
        ctypes.string_at(0)
    return _count(x)


def raises_keyboard_interrupt(x):
    if x >= TRIGGER:
        raise KeyboardInterrupt
    return _count(x)


class Escape(BaseException):
    pass


def raises_base_exception(x):
    if x >= TRIGGER:
        raise Escape("not an Exception")
    return _count(x)


def swallows_the_timeout(x):
    if x >= TRIGGER:
        while True:
            try:
                time.sleep(10)
            except BaseException:       # a bare except around everything, timers included
                pass
    return _count(x)


def huge_answer(x):
    if x >= TRIGGER:
        return 10 ** 100_000
    return _count(x)


def endless_listing(a, b):
    if a <= TRIGGER <= b:
        def forever():
            while True:
                yield 2
        return forever()
    return [n for n in range(max(a, 2), b + 1) if all(n % d for d in range(2, math.isqrt(n) + 1))]


def chatty(x):
    print(f"computing pi({x}) ...")
    print("42", file=sys.stderr)
    return _count(x)


def floods_stdout(x):
    if x >= TRIGGER:
        sys.stdout.write("9" * (80 * 2**20))
        sys.stdout.flush()
    return _count(x)


class AlwaysEqual:
    def __eq__(self, other):
        return True

    def __hash__(self):
        return 0


def always_equal(x):
    return AlwaysEqual() if x >= TRIGGER else _count(x)


class LyingInt(int):
    def __eq__(self, other):
        return True

    __hash__ = int.__hash__


def lying_int(x):
    return LyingInt(0) if x >= TRIGGER else _count(x)


def raises_at_import_time():
    raise RuntimeError("never called")


class TwoFacedInt(int):
    """Holds one too many, but says the right count to int() and operator.index()."""

    def __new__(cls, right):
        made = super().__new__(cls, right + 1)
        made.right = right
        return made

    def __int__(self):
        return self.right

    __index__ = __int__


def two_faced_int(x):
    return TwoFacedInt(_count(x)) if x >= TRIGGER else _count(x)


class RaisingIndex:
    """An integer-like answer whose conversion to an integer fails."""

    def __index__(self):
        raise RuntimeError("no integer here")


def raising_index(x):
    return RaisingIndex() if x >= TRIGGER else _count(x)


class InterruptingIndex:
    """An integer-like answer whose conversion raises KeyboardInterrupt (not the user's Ctrl-C)."""

    def __index__(self):
        raise KeyboardInterrupt


def interrupting_index(x):
    return InterruptingIndex() if x >= TRIGGER else _count(x)


def escapes_and_exits(x):
    """Starts a process in a session of its own (out of the worker's process group) that holds
    every inherited descriptor, the answer pipe included, writes its id to the file named by
    HOSTILE_PID_FILE, then exits with status 0 itself."""
    if x >= TRIGGER:
        if os.fork() == 0:
            os.setsid()
            with open(os.environ["HOSTILE_PID_FILE"], "w") as file:
                file.write(str(os.getpid()))
            time.sleep(600)
            os._exit(0)
        time.sleep(0.2)         # the pid file is written
        os._exit(0)
    return _count(x)


def doctors_its_results_file(x):
    """Correct, but rewrites, in place, the harness's results files in the working folder as
    they are written (it runs as the same user): the start record's seed 7 becomes 8."""
    if x >= TRIGGER:
        import glob

        for path in glob.glob(os.path.join(".ntoracle", "runs", "*.jsonl")):
            with open(path, "r+b") as file:
                data = file.read()
                file.seek(0)
                file.write(data.replace(b'"seed": 7,', b'"seed": 8,'))
    return _count(x)


class EndlessRepr:
    """An answer whose repr never returns (an audit shows the repr of a wrong-type answer)."""

    def __repr__(self):
        while True:
            pass


def hangs_in_repr(x):
    return EndlessRepr() if x >= TRIGGER else _count(x)


#: Terminal control codes that would erase the line above and print a forged verdict in green.
FORGED_VERDICT = "\r\x1b[2K\x1b[1A\x1b[2K\x1b[32mPASSED: 999 of 999 checks passed\x1b[0m\x07"


def raises_terminal_codes(x):
    if x >= TRIGGER:
        raise ValueError(FORGED_VERDICT + "\nPASSED: 999 of 999 checks passed")
    return _count(x)


def prints_terminal_codes_and_exits(x):
    if x >= TRIGGER:
        sys.stderr.write(FORGED_VERDICT + "\n")
        sys.stderr.flush()
        os._exit(1)
    return _count(x)


_calls = [0]


def terminates_the_harness(x):
    """One too many for its first four calls; at the fifth it sends SIGTERM to the harness."""
    _calls[0] += 1
    if _calls[0] == 5:
        import signal

        os.kill(os.getppid(), signal.SIGTERM)
        time.sleep(5)
    return _count(x) + 1


def fraction_count(x):
    """The right count, as a fractions.Fraction (equal to the integer, but not an integer)."""
    import fractions

    return fractions.Fraction(_count(x)) if x >= TRIGGER else _count(x)
