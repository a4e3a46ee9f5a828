"""Ending the processes a candidate leaves behind when it escapes its process group.

The harness kills a child's whole process group, but a candidate can fork a process that
calls ``setsid()`` (or a daemon's double fork): that process is in no group the harness
knows, outlives the harness (the kernel's parent-death signal is not inherited across
``fork``) and may keep working, or keep the answer pipe open so that its end is never seen.
Such a process still holds what it inherited: the pipes and the output file the harness
made for this child alone (``pass_fds`` and ``close_fds`` give them to no one else).  So any
process other than the harness that holds one of them is the candidate's leftover, and is
killed.  Linux only (``/proc/PID/fd``); elsewhere nothing is found.  A leftover that closed
every inherited descriptor is not found.
"""

from __future__ import annotations

import os
import signal

__all__ = ["identities", "end_leftovers"]


def identities(fds) -> set[tuple[int, int]]:
    """``(device, inode)`` of each open descriptor in ``fds`` (pipes and files alike)."""
    found = set()
    for fd in fds:
        try:
            status = os.fstat(fd)
        except (OSError, ValueError, TypeError):
            continue
        found.add((status.st_dev, status.st_ino))
    return found


def end_leftovers(held: set[tuple[int, int]], group: int) -> list[int]:
    """Kill (``SIGKILL``) every other process that holds one of ``held``; return the ids of
    those outside process group ``group`` (the child's own, already killed as a whole)."""
    if not held:
        return []
    me = os.getpid()
    try:
        pids = [int(name) for name in os.listdir("/proc") if name.isdigit()]
    except OSError:
        return []
    killed = []
    for pid in pids:
        if pid == me:
            continue
        try:
            fds = os.listdir(f"/proc/{pid}/fd")
        except OSError:             # gone, or not ours to look at
            continue
        for fd in fds:
            try:
                status = os.stat(f"/proc/{pid}/fd/{fd}")
            except OSError:
                continue
            if (status.st_dev, status.st_ino) in held:
                try:
                    outside = os.getpgid(pid) != group
                    os.kill(pid, signal.SIGKILL)
                except OSError:
                    break
                if outside:
                    killed.append(pid)
                break
    return killed
