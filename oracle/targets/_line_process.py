"""A long-lived child process answering one request per line, restarted after it dies.

Two kinds of child speak this way: an executable candidate (requests on its stdin, answers
on its stdout) and the Python worker of :mod:`oracle.targets._worker` (requests and answers
on two private pipes; the candidate's stdout and stderr go to a file, so its prints never mix
with its answers).

Requests are pipelined: up to :data:`WINDOW` of them are in flight at once (a few kilobytes,
well under a pipe's buffer, so writing never blocks), and the answers are read in order.  The
deadline of each answer is the per-call timeout counted from the later of its request being
sent and the previous answer arriving.  What can happen to a call:

* an answer line -- decoded by the role's protocol;
* no answer in time -- the process is killed ("timeout");
* the process dies -- "crashed", with the signal or exit status *it* caused (the harness
  waits for it to exit before killing it, so its own kill is never reported as the cause)
  and the tail of its stderr;
* a line longer than :data:`MAX_LINE` bytes -- "bad-output" (a flood), the process is killed;
* more lines than requests (an executable that prints an extra line) -- seen after a batch;
  the batch is then asked again one request at a time, so that the call that printed the
  extra line gets "bad-output" and every other call its own answer.

After a fault a fresh process takes the requests that had not been answered.  The child is
started through a launcher that asks the kernel to kill it when the harness dies (Linux
``PR_SET_PDEATHSIG``) and caps its address space (``RLIMIT_AS``) and the size of the files
it writes (``RLIMIT_FSIZE``).
"""

from __future__ import annotations

import json
import os
import select
import signal
import subprocess
import sys
import tempfile
import time
from pathlib import Path
from typing import Callable, Sequence

from .._errors import InvalidInputError
from ._call import BAD_OUTPUT, CRASHED, OK, RAISED, TIMEOUT, CallResult
from ._leftovers import end_leftovers, identities

__all__ = ["LineProcess", "WINDOW", "MAX_LINE", "MAX_OUTPUT"]

#: Requests in flight at once.
WINDOW = 64
#: Bytes of one answer line beyond which the answer is a flood.
MAX_LINE = 256 * 2**20
#: Bytes a child may write to its stdout and stderr files (``RLIMIT_FSIZE``).
MAX_OUTPUT = 64 * 2**20
_STARTUP_GRACE = 3.0      # seconds a fresh process may take for its first answer, on top of the timeout
_IMPORT_GRACE = 60.0      # seconds the worker may take to import the candidate
_EXIT_GRACE = 2.0         # seconds a child that closed its output may take to exit
_SETTLE = 0.005           # seconds to wait for a surplus line when asking one at a time
_POLL = 0.05              # seconds between looks at whether a silent child has exited
_WORKER = str(Path(__file__).with_name("_worker.py"))

#: The launcher of an executable: set the limits, then become the candidate (stdlib only).
#: Its fourth number is a pipe closed by a successful exec; a failed one writes why into it.
_LAUNCHER = """
import ctypes, os, resource, sys
memory, output, parent, report = (int(word) for word in sys.argv[1:5])
os.set_inheritable(report, False)
try:
    ctypes.CDLL(None).prctl(1, 9, 0, 0, 0)
except (OSError, AttributeError):
    pass
if os.getppid() != parent:
    os._exit(0)
if memory:
    resource.setrlimit(resource.RLIMIT_AS, (memory, memory))
if output:
    resource.setrlimit(resource.RLIMIT_FSIZE, (output, output))
    import signal
    signal.signal(signal.SIGXFSZ, signal.SIG_DFL)
try:
    os.execvp(sys.argv[5], sys.argv[5:])
except OSError as error:
    message = f"cannot run {sys.argv[5]!r}: {error.strerror}"
    os.write(report, message.encode(errors="replace")[:500])
    sys.stderr.write(message + "\\n")
    os._exit(127)
"""


def _exec_failure(fd: int, wait: float) -> str:
    """What the launcher wrote into its report pipe before the pipe closed (``""``: the exec
    succeeded, or the launcher ended otherwise, which the first call then reports)."""
    data, deadline = b"", time.perf_counter() + wait
    while len(data) < 1000:
        remaining = deadline - time.perf_counter()
        if remaining <= 0 or not select.select([fd], [], [], remaining)[0]:
            break
        chunk = os.read(fd, 1000)
        if not chunk:
            break
        data += chunk
    return data.decode(errors="replace").strip()


class LineProcess:
    """``call_many`` sends requests to the child and decodes the answers.

    ``argv`` is an executable's command line, or with ``worker_spec`` the Python target run
    by the worker (``env`` then carries its ``PYTHONPATH``).
    """

    isolated = True

    def __init__(self, argv: Sequence[str] | None, *, encode: Callable, decode: Callable,
                 timeout: float, memory_limit: int | None, description: str,
                 env: dict | None = None, worker_spec: str | None = None):
        self.argv = list(argv or [])
        self.worker_spec = worker_spec
        self.encode, self.decode = encode, decode
        self.timeout = timeout
        self.memory_limit = memory_limit
        self.description = description
        self.env = env
        self.process: subprocess.Popen | None = None
        self.restarts = 0
        self._buffer = bytearray()
        self._scanned = 0
        self._fresh = False
        self._write_fd = self._read_fd = -1
        self._killed_by_us = False

    # -- process management ------------------------------------------------ #

    def start(self) -> None:
        """Start the child (for the worker: and wait for its handshake).  A worker that cannot
        import its target raises :class:`InvalidInputError` with the reason."""
        self._output = tempfile.TemporaryFile()
        self._buffer, self._scanned = bytearray(), 0
        # an executable's first answer may include its start-up; the worker's start-up ends
        # with its handshake, so its first call has the plain timeout like every other
        self._fresh, self._killed_by_us = self.worker_spec is None, False
        if self.worker_spec is None:
            self._start_executable()
        else:
            self._start_worker()

    def _start_executable(self) -> None:
        """Start the command; one that cannot be run at all (a script whose interpreter is
        missing, a binary of another machine) raises :class:`InvalidInputError` with the
        system's reason: a usage error, not a crash at every call."""
        report_read, report_write = os.pipe()
        launcher = [sys.executable, "-I", "-S", "-c", _LAUNCHER, str(self.memory_limit or 0),
                    str(MAX_OUTPUT), str(os.getpid()), str(report_write)]
        try:
            self.process = subprocess.Popen(launcher + self.argv, stdin=subprocess.PIPE,
                                            stdout=subprocess.PIPE, stderr=self._output,
                                            env=self.env, bufsize=0, start_new_session=True,
                                            pass_fds=(report_write,))
        finally:
            os.close(report_write)
        self._write_fd, self._read_fd = self.process.stdin.fileno(), self.process.stdout.fileno()
        try:
            failure = _exec_failure(report_read, _IMPORT_GRACE)
        finally:
            os.close(report_read)
        if failure:
            self._killed_by_us = True
            self._stop()
            raise InvalidInputError(failure)

    def _start_worker(self) -> None:
        requests_read, requests_write = os.pipe()
        answers_read, answers_write = os.pipe()
        argv = [sys.executable, "-P", _WORKER, "--requests", str(requests_read),
                "--answers", str(answers_write), "--memory", str(self.memory_limit or 0),
                "--output", str(MAX_OUTPUT), "--parent", str(os.getpid()), self.worker_spec]
        try:
            self.process = subprocess.Popen(argv, stdin=subprocess.DEVNULL, stdout=self._output,
                                            stderr=self._output, env=self.env,
                                            pass_fds=(requests_read, answers_write),
                                            start_new_session=True)
        finally:
            os.close(requests_read)
            os.close(answers_write)
        self._write_fd, self._read_fd = requests_write, answers_read
        line = self._read_line(time.perf_counter() + _IMPORT_GRACE + self.timeout)
        if isinstance(line, bytearray):
            try:
                handshake = json.loads(line)
            except ValueError:
                handshake = {"load_error": "the worker's first line was not its handshake"}
            if isinstance(handshake, dict) and handshake.get("ready") is True:
                return
            if isinstance(handshake, dict) and "load_error" in handshake:
                self._killed_by_us = True
                self._stop()
                raise InvalidInputError(str(handshake["load_error"])[:500])
            reason = "the worker's first line was not its handshake"
        elif line == "timeout":
            reason = f"importing the target took longer than {_IMPORT_GRACE + self.timeout:g} s"
        else:
            reason = "the worker ended while importing the target"
        ending = self._stop()
        raise InvalidInputError(f"{reason} ({ending})")

    def _stop(self) -> str:
        """End the process; return how it ended, in words, for the report."""
        process, self.process = self.process, None
        if process is None:
            return ""
        held = identities([self._write_fd, self._read_fd, self._output.fileno()])
        for fd in (self._write_fd, self._read_fd):
            if fd >= 0 and self.worker_spec is not None:
                try:
                    os.close(fd)
                except OSError:
                    pass
        self._write_fd = self._read_fd = -1
        if process.poll() is None:
            try:
                process.wait(timeout=_EXIT_GRACE if not self._killed_by_us else 0.0)
            except subprocess.TimeoutExpired:
                pass
        killed_here = False
        if process.poll() is None:
            killed_here = True
            try:
                os.killpg(process.pid, signal.SIGKILL)
            except (ProcessLookupError, PermissionError):
                process.kill()
        process.wait()
        left = end_leftovers(held, group=process.pid)
        for stream in (process.stdin, process.stdout):
            if stream is not None:
                try:
                    stream.close()
                except OSError:
                    pass
        note = (f"; {len(left)} process(es) it had started outside its process group were "
                "still running and were killed" if left else "")
        return self._ending(process.returncode, killed_here) + note + self._stderr_tail()

    def _ending(self, code: int, killed_here: bool) -> str:
        if killed_here:
            return "it stopped answering but did not exit; the harness killed it"
        if code < 0:
            name = signal.Signals(-code).name if -code in signal.Signals._value2member_map_ else "?"
            note = (f": it wrote more than {MAX_OUTPUT // 2**20} MiB of output" if -code == signal.SIGXFSZ
                    else "")
            return f"killed by signal {-code} ({name}){note}"
        if code == 127 and self.worker_spec is None:
            return "exited with status 127 (the command could not be run)"
        return f"exited with status {code}"

    def _stderr_tail(self) -> str:
        try:
            self._output.seek(0, os.SEEK_END)
            size = self._output.tell()
            self._output.seek(max(0, size - 400))
            tail = self._output.read().decode(errors="replace").strip().splitlines()
            self._output.close()
        except (OSError, ValueError):
            return ""
        return f"; its last output line: {tail[-1][:200]}" if tail else ""

    def _kill(self) -> str:
        self._killed_by_us = True
        if self.process is not None and self.process.poll() is None:
            try:
                os.killpg(self.process.pid, signal.SIGKILL)
            except (ProcessLookupError, PermissionError):
                self.process.kill()
        self._stop()
        self.restarts += 1
        return ""

    def close(self) -> None:
        if self.process is not None:
            try:
                if self.worker_spec is None:
                    self.process.stdin.close()
                else:
                    os.close(self._write_fd)
                    self._write_fd = -1
                self.process.wait(timeout=2)
            except (OSError, subprocess.TimeoutExpired):
                pass
            self._killed_by_us = True
            self._stop()

    # -- calls ------------------------------------------------------------- #

    def call_many(self, calls: Sequence[tuple[int, ...]], *, stop_on_fault: bool = False) -> list[CallResult]:
        """The results of ``calls`` in order; with ``stop_on_fault`` the list ends at the first
        call that timed out, crashed or broke the protocol (the caller decides about the rest,
        instead of paying a timeout or a restart for each of them)."""
        if self.worker_spec is None and self._surplus():
            self._kill()        # lines left over from the last batch: start in step again
        results = self._pipelined(calls, stop_on_fault=stop_on_fault)
        if self.worker_spec is not None or len(calls) < 2:
            return results
        faulted = next((i for i, r in enumerate(results) if r.status not in (OK, RAISED)), None)
        if faulted is None and not self._surplus(_SETTLE):
            return results
        return self._realigned(calls, results, faulted, stop_on_fault)

    def _realigned(self, calls, results: list[CallResult], faulted: int | None,
                   stop_on_fault: bool) -> list[CallResult]:
        """The results of an executable's batch that printed more lines than it was asked for,
        or that faulted while several requests were in flight (an extra line earlier would
        have shifted the fault onto the wrong request): the calls are asked again one at a
        time, each followed by a look for a surplus line.  When the calls before a fault
        answer as they did, the fault was where it seemed and is not paid for twice."""
        self._kill()
        again: list[CallResult] = []
        upto = faulted if faulted is not None else len(calls)
        for index in range(upto):
            again.append(self._one(calls[index]))
            if again[-1].status not in (OK, RAISED):
                faulted = None if faulted is None else faulted      # a fault of its own
                break
        aligned = (faulted is not None and len(again) == upto
                   and all(a.status == r.status and a.value == r.value
                           for a, r in zip(again, results)))
        if aligned:
            return again + [results[faulted]] + ([] if stop_on_fault else
                                                 self._pipelined(calls[faulted + 1:]))
        if stop_on_fault and again and again[-1].status not in (OK, RAISED):
            return again
        for index in range(len(again), len(calls)):
            again.append(self._one(calls[index]))
            if stop_on_fault and again[-1].status not in (OK, RAISED):
                break
        return again

    def _pipelined(self, calls: Sequence[tuple[int, ...]], window: int = WINDOW,
                   stop_on_fault: bool = False) -> list[CallResult]:
        results: list[CallResult | None] = [None] * len(calls)
        sent = received = 0
        sent_at = [0.0] * len(calls)
        last_answer = time.perf_counter()
        while received < len(calls):
            if self.process is None:
                try:
                    self.start()
                except InvalidInputError as error:      # the worker no longer starts
                    for index in range(received, len(calls)):
                        results[index] = CallResult(CRASHED, error=f"could not restart: {error}"[:300])
                    return results
                sent = received
                last_answer = time.perf_counter()
            if sent < len(calls) and sent - received < window:
                stop = min(len(calls), received + window)
                payload = b"".join(self.encode(calls[i]) for i in range(sent, stop))
                now = time.perf_counter()
                for i in range(sent, stop):
                    sent_at[i] = now
                sent = stop
                try:
                    os.write(self._write_fd, payload)
                except OSError:
                    pass        # the process died; reading will see the end of its output
            started = max(sent_at[received], last_answer)
            grace = _STARTUP_GRACE if self._fresh else 0.0
            line = self._read_line(started + self.timeout + grace)
            now = time.perf_counter()
            if isinstance(line, bytearray):
                self._fresh = False
                results[received] = self._decoded(bytes(line), now - started)
                last_answer = now
            elif line == "timeout":
                self._kill()
                results[received] = CallResult(TIMEOUT, error=f"no answer within {self.timeout:g} s",
                                               seconds=now - started)
            elif line == "flood":
                self._kill()
                results[received] = CallResult(
                    BAD_OUTPUT, error=f"flooded its output: more than {MAX_LINE // 2**20} MiB "
                                      "without ending the answer line", seconds=now - started)
            else:
                ending = self._stop()
                self.restarts += 1
                results[received] = CallResult(CRASHED, error=f"the process died: {ending}",
                                               seconds=now - started)
            received += 1
            if stop_on_fault and results[received - 1].status not in (OK, RAISED):
                if self.process is not None and sent > received:
                    self._kill()        # it holds requests that are no longer wanted
                return results[:received]
        return results

    def _one(self, arguments: tuple[int, ...]) -> CallResult:
        """One request alone; a surplus line after its answer makes it "bad-output"."""
        (result,) = self._pipelined([arguments], window=1)
        if result.status in (OK, RAISED) and self._surplus(_SETTLE):
            self._kill()
            return CallResult(BAD_OUTPUT, error="answered with more than one line",
                              seconds=result.seconds)
        return result

    def _surplus(self, wait: float = 0.0) -> bool:
        """Whether the child has written more than it was asked for."""
        if self.process is None:
            return False
        if self._buffer:
            return True
        try:
            ready, _, _ = select.select([self._read_fd], [], [], wait)
        except (OSError, ValueError):
            return False
        if not ready:
            return False
        chunk = os.read(self._read_fd, 1 << 16)
        self._buffer += chunk
        return bool(chunk)

    def _decoded(self, line: bytes, seconds: float) -> CallResult:
        try:
            refused, value, reported = self.decode(line)
        except ValueError as error:
            return CallResult(OK, value=line[:1000].decode(errors="replace").strip(), seconds=seconds,
                              error=f"undecodable answer: {error}")
        if reported is not None and 0 <= reported <= seconds + 1.0:
            seconds = reported      # the worker's own timing (the parent's includes waiting)
        if refused:
            return CallResult(RAISED, error=str(value)[:300], seconds=seconds)
        return CallResult(OK, value, seconds=seconds)

    def _read_line(self, deadline: float):
        """The next line (a bytearray, without its newline), or ``"timeout"``, ``"flood"`` or
        ``"eof"``.  The buffer is searched only where new bytes arrived, so a long line costs
        linear time."""
        fd = self._read_fd
        while True:
            newline = self._buffer.find(b"\n", self._scanned)
            if newline >= 0:
                line = self._buffer[:newline]
                del self._buffer[:newline + 1]
                self._scanned = 0
                return line
            self._scanned = len(self._buffer)
            if self._scanned > MAX_LINE:
                return "flood"
            remaining = deadline - time.perf_counter()
            if remaining <= 0:
                return "timeout"
            try:
                ready, _, _ = select.select([fd], [], [], min(remaining, _POLL))
                if not ready and self.process is not None and self.process.poll() is not None:
                    # the child has exited, but a process it started holds the pipe open:
                    # what the child wrote before it exited is there now, nothing more will be
                    ready, _, _ = select.select([fd], [], [], 0)
                    if not ready:
                        return "eof"
            except (OSError, ValueError):
                return "eof"
            if not ready:
                continue            # the deadline is checked above
            chunk = os.read(fd, 1 << 20)
            if not chunk:
                return "eof"
            self._buffer += chunk

