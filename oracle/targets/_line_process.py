"""A long-lived child process answering one request per line, restarted after it dies.

Requests are pipelined: up to :data:`WINDOW` of them are in flight at once (a
few kilobytes, well under a pipe's buffer, so writing never blocks), and the
answers are read in order.  The deadline of each answer is the per-call
timeout counted from the later of its request being sent and the previous
answer arriving.  When no answer comes in time the process is killed
("timeout"); when it dies, the request it was answering gets "crashed" with
its exit status and the tail of its stderr.  Either way a fresh process takes
the requests that had not been answered.

With ``memory_limit`` the child's address space is capped by
``resource.setrlimit(RLIMIT_AS)`` before it starts.
"""

from __future__ import annotations

import os
import resource
import select
import signal
import subprocess
import tempfile
import time
from typing import Callable, Sequence

from ._call import CRASHED, OK, RAISED, TIMEOUT, CallResult

__all__ = ["LineProcess", "WINDOW"]

#: Requests in flight at once.
WINDOW = 64
_STARTUP_GRACE = 3.0      # seconds a fresh process may take for its first answer, on top of the timeout


class LineProcess:
    """``call_many`` sends requests to ``argv`` and decodes the answers."""

    isolated = True

    def __init__(self, argv: Sequence[str], *, encode: Callable, decode: Callable, timeout: float,
                 memory_limit: int | None, description: str, env: dict | None = None):
        self.argv = list(argv)
        self.encode, self.decode = encode, decode
        self.timeout = timeout
        self.memory_limit = memory_limit
        self.description = description
        self.env = env
        self.process: subprocess.Popen | None = None
        self.restarts = 0
        self._buffer = b""
        self._fresh = False

    # -- process management ------------------------------------------------ #

    def _limits(self) -> None:
        if self.memory_limit:
            resource.setrlimit(resource.RLIMIT_AS, (self.memory_limit, self.memory_limit))

    def _start(self) -> None:
        self._stderr = tempfile.TemporaryFile()
        self.process = subprocess.Popen(self.argv, stdin=subprocess.PIPE, stdout=subprocess.PIPE,
                                        stderr=self._stderr, preexec_fn=self._limits,
                                        env=self.env, bufsize=0, start_new_session=True)
        self._buffer = b""
        self._fresh = True

    def _stop(self) -> str:
        """Kill the process if alive; return how it ended, for the report."""
        process, self.process = self.process, None
        if process is None:
            return ""
        if process.poll() is None:
            try:
                os.killpg(process.pid, signal.SIGKILL)
            except ProcessLookupError:
                pass
        process.wait()
        for stream in (process.stdin, process.stdout):
            try:
                stream.close()
            except OSError:
                pass
        code = process.returncode
        ending = (f"killed by signal {-code} ({signal.Signals(-code).name})" if code < 0
                  else f"exited with status {code}")
        self._stderr.seek(0, os.SEEK_END)
        size = self._stderr.tell()
        self._stderr.seek(max(0, size - 400))
        tail = self._stderr.read().decode(errors="replace").strip().splitlines()
        self._stderr.close()
        return ending + (f"; stderr: {tail[-1][:200]}" if tail else "")

    def close(self) -> None:
        if self.process is not None:
            try:
                self.process.stdin.close()
                self.process.wait(timeout=2)
            except (OSError, subprocess.TimeoutExpired):
                pass
            self._stop()

    # -- calls ------------------------------------------------------------- #

    def call_many(self, calls: Sequence[tuple[int, ...]]) -> list[CallResult]:
        results: list[CallResult | None] = [None] * len(calls)
        sent = received = 0
        sent_at = [0.0] * len(calls)
        last_answer = time.perf_counter()
        while received < len(calls):
            if self.process is None:
                self._start()
                sent = received
                last_answer = time.perf_counter()
            if sent < len(calls) and sent - received < WINDOW:
                stop = min(len(calls), received + WINDOW)
                payload = b"".join(self.encode(calls[i]) for i in range(sent, stop))
                now = time.perf_counter()
                for i in range(sent, stop):
                    sent_at[i] = now
                sent = stop
                try:
                    self.process.stdin.write(payload)
                except (BrokenPipeError, OSError):
                    pass        # the process died; reading will see the end of its output
            started = max(sent_at[received], last_answer)
            grace = _STARTUP_GRACE if self._fresh else 0.0
            line = self._read_line(started + self.timeout + grace)
            now = time.perf_counter()
            if isinstance(line, bytes):
                self._fresh = False
                results[received] = self._decoded(line, now - started)
                last_answer = now
            elif line == "timeout":
                self._stop()
                self.restarts += 1
                results[received] = CallResult(TIMEOUT, error=f"no answer within {self.timeout:g} s",
                                               seconds=now - started)
            else:
                ending = self._stop()
                self.restarts += 1
                results[received] = CallResult(CRASHED, error=f"the process died: {ending}",
                                               seconds=now - started)
            received += 1
        return results

    def _decoded(self, line: bytes, seconds: float) -> CallResult:
        try:
            refused, value = self.decode(line)
        except ValueError as error:
            return CallResult(OK, value=line.decode(errors="replace").strip(), seconds=seconds,
                              error=f"undecodable answer: {error}")
        if refused:
            return CallResult(RAISED, error=str(value)[:300], seconds=seconds)
        return CallResult(OK, value, seconds=seconds)

    def _read_line(self, deadline: float):
        """The next line (without its newline), or ``"timeout"``, or ``"eof"``."""
        stdout = self.process.stdout
        fd = stdout.fileno()
        while True:
            newline = self._buffer.find(b"\n")
            if newline >= 0:
                line, self._buffer = self._buffer[:newline], self._buffer[newline + 1:]
                return line
            remaining = deadline - time.perf_counter()
            if remaining <= 0:
                return "timeout"
            ready, _, _ = select.select([fd], [], [], remaining)
            if not ready:
                return "timeout"
            chunk = os.read(fd, 1 << 16)
            if not chunk:
                return "eof"
            self._buffer += chunk
