"""The answer store (oracle._store): kept answers, integrity, switches, threshold, concurrency.

References: sympy's ``primepi`` (a test-only reference library) for every prime count
the oracle answers here; the store's own values are compared with what was put in.
"""

from __future__ import annotations

import multiprocessing
import sqlite3

import pytest
import sympy

from oracle import _store, cli, facade

X = 10**7 + 3                       # a generic point: no table holds it, the sieve answers


@pytest.fixture
def store_folder(tmp_path, monkeypatch):
    """A fresh store that keeps every answer, however fast (threshold 0 s)."""
    folder = tmp_path / "store"
    monkeypatch.setenv("NTORACLE_STORE", str(folder))
    monkeypatch.setenv("NTORACLE_STORE_MIN_SECONDS", "0")
    return folder


def _rows(folder):
    with sqlite3.connect(folder / _store.FILE_NAME) as db:
        return db.execute("SELECT key, value, provenance FROM answers").fetchall()


# --------------------------------------------------------------------------- #
# Encoding
# --------------------------------------------------------------------------- #

@pytest.mark.parametrize("value", [0, 1, -31, 2**64 + 1, 10**5000 + 7, True, False, [], [2, 3, 5]],
                         ids=["0", "1", "-31", "2**64+1", "10**5000+7", "true", "false", "[]",
                              "[2,3,5]"])
def test_values_round_trip_through_their_text(value):
    # 10**5000 + 7 has more digits than Python's int->str limit (4300): hex has no such limit.
    text = _store.encode_value(value)
    assert _store.decode_value(text) == value
    assert type(_store.decode_value(text)) is type(value)


def test_unkeyable_arguments_are_not_looked_up():
    assert _store.encode_arguments((True,)) is None
    assert _store.encode_arguments((1.5,)) is None
    assert _store.encode_arguments(("twins", 10, 2**70)) == "twins,a," + format(2**70, "x")


# --------------------------------------------------------------------------- #
# The facade keeps and reuses answers
# --------------------------------------------------------------------------- #

def test_a_computed_answer_is_kept_and_served_again(store_folder, monkeypatch):
    expected = int(sympy.primepi(X))                       # sympy: independent reference
    first = facade.answer("pi", X)
    assert first.value == expected
    assert [(value, provenance) for _, value, provenance in _rows(store_folder)] == \
        [(_store.encode_value(expected), first.provenance)]

    def no_sieve(*arguments):
        raise AssertionError("the kept answer should have been served")

    monkeypatch.setattr(facade, "_sieve_count", no_sieve)
    again = facade.answer("pi", X)
    assert again == first


def test_answers_of_other_oracle_versions_are_not_used(store_folder):
    first = facade.answer("pi", X)
    other = _store.Store(store_folder, version="0.0.0-other", min_seconds=0)
    assert other.get("pi", (X,)) is None
    assert _store.default_store().get("pi", (X,)) == (int(sympy.primepi(X)), first.provenance)


def test_a_fast_answer_is_not_kept_under_the_default_threshold(store_folder, monkeypatch):
    monkeypatch.delenv("NTORACLE_STORE_MIN_SECONDS")
    assert _store.default_store().min_seconds == _store.MIN_SECONDS
    assert facade.is_prime(97) is True                      # microseconds: below 50 ms
    assert not (store_folder / _store.FILE_NAME).exists() or _rows(store_folder) == []
    store = _store.default_store()
    assert store.put("pi", (1000,), 168, "table:x", seconds=0.01) is False
    assert store.put("pi", (1000,), 168, "table:x", seconds=0.2) is True
    assert store.get("pi", (1000,)) == (168, "table:x")


# --------------------------------------------------------------------------- #
# Integrity
# --------------------------------------------------------------------------- #

@pytest.mark.parametrize("column, text", [("value", "i:1"), ("provenance", "combinatorial"),
                                          ("value", "garbage"), ("digest", "0" * 64)])
def test_a_corrupt_row_is_deleted_and_never_returned(store_folder, column, text):
    expected = int(sympy.primepi(X))
    facade.answer("pi", X)
    with sqlite3.connect(store_folder / _store.FILE_NAME) as db:
        db.execute(f"UPDATE answers SET {column} = ?", (text,))
    assert _store.default_store().get("pi", (X,)) is None
    assert _rows(store_folder) == []
    assert facade.answer("pi", X).value == expected        # recomputed, and kept again
    assert len(_rows(store_folder)) == 1


# --------------------------------------------------------------------------- #
# Switches
# --------------------------------------------------------------------------- #

@pytest.mark.parametrize("setting", ["off", "OFF", "0", "no"])
def test_the_environment_switches_the_store_off(tmp_path, monkeypatch, setting):
    monkeypatch.setenv("NTORACLE_STORE", setting)
    monkeypatch.setenv("XDG_CACHE_HOME", str(tmp_path))
    assert _store.default_store() is None
    assert facade.pi(X) == int(sympy.primepi(X))
    assert list(tmp_path.iterdir()) == []


def test_the_store_lives_in_the_xdg_cache_folder_by_default(tmp_path, monkeypatch):
    monkeypatch.delenv("NTORACLE_STORE")
    monkeypatch.setenv("XDG_CACHE_HOME", str(tmp_path))
    assert _store.default_store().path == tmp_path / "ntoracle" / _store.FILE_NAME


@pytest.mark.parametrize("position", ["before", "after"])
def test_the_no_store_option_neither_reads_nor_writes(store_folder, capsys, position):
    command = ["value", "pi", str(X)]
    command = ["--no-store", *command] if position == "before" else [*command, "--no-store"]
    assert cli.main(command) == 0
    assert capsys.readouterr().out.startswith(f"pi({X}) = {sympy.primepi(X)} ")
    assert not store_folder.exists()


def test_store_show_and_clear(store_folder, capsys):
    facade.answer("pi", X)
    facade.answer("twin_pi", X)
    assert cli.main(["store", "show", "--json"]) == 0
    import json

    shown = json.loads(capsys.readouterr().out)
    assert (shown["entries"], shown["by_function"]) == (2, {"pi": 1, "twin_pi": 1})
    assert shown["bytes"] > 0
    assert cli.main(["store", "clear"]) == 0
    assert "cleared 2 answer(s)" in capsys.readouterr().out
    assert _rows(store_folder) == []


def test_store_show_when_switched_off(monkeypatch, capsys):
    monkeypatch.setenv("NTORACLE_STORE", "off")
    assert cli.main(["store", "show"]) == 0
    assert "switched off" in capsys.readouterr().out


# --------------------------------------------------------------------------- #
# When the store cannot be used, the oracle still answers
# --------------------------------------------------------------------------- #

def test_a_locked_database_is_skipped_not_fatal(store_folder):
    expected = int(sympy.primepi(X))
    _store.default_store().put("pi", (5,), 3, "sieve", seconds=1.0)      # creates the file
    blocker = sqlite3.connect(store_folder / _store.FILE_NAME, timeout=0)
    blocker.execute("BEGIN EXCLUSIVE")
    try:
        _store.default_store().close()                  # the next call opens a new connection
        assert facade.answer("pi", X).value == expected
        assert _store.default_store().put("pi", (7,), 4, "sieve", seconds=1.0) is False
    finally:
        blocker.rollback()
        blocker.close()
    assert facade.answer("pi", X).value == expected


def test_an_unusable_folder_is_skipped_not_fatal(tmp_path, monkeypatch):
    blocker = tmp_path / "a-file"
    blocker.write_text("not a folder")
    monkeypatch.setenv("NTORACLE_STORE", str(blocker / "store"))
    monkeypatch.setenv("NTORACLE_STORE_MIN_SECONDS", "0")
    assert facade.pi(X) == int(sympy.primepi(X))
    assert _store.default_store().put("pi", (5,), 3, "sieve", seconds=1.0) is False


# --------------------------------------------------------------------------- #
# Several processes at once
# --------------------------------------------------------------------------- #

def _writer(folder: str, worker: int, workers: int, count: int) -> list[str]:
    """Put ``count`` answers, read every worker's; return the problems seen."""
    import os

    os.environ["NTORACLE_STORE"] = folder
    os.environ["NTORACLE_STORE_MIN_SECONDS"] = "0"
    from oracle import _store as store_module

    store = store_module.default_store()
    problems = []
    for i in range(count):
        n = worker * count + i
        if not store.put("pi", (n,), n * n, f"sieve-{worker}", seconds=1.0):
            problems.append(f"put {n} skipped")
        for other in range(workers):
            m = other * count + i
            kept = store.get("pi", (m,))
            if kept is not None and kept != (m * m, f"sieve-{other}"):
                problems.append(f"get {m} returned {kept}")
    return problems


def test_several_processes_share_the_store(tmp_path):
    workers, count = 4, 60
    context = multiprocessing.get_context("spawn")         # never fork (primecountpy's pool)
    with context.Pool(workers) as pool:
        results = pool.starmap(_writer, [(str(tmp_path), w, workers, count) for w in range(workers)])
    problems = [problem for result in results for problem in result]
    # Wrong values are never acceptable; a put skipped under heavy contention is allowed,
    # but with a 1 s busy timeout and tiny writes none is expected.
    assert [p for p in problems if p.startswith("get")] == []
    from oracle import __version__

    store = _store.Store(tmp_path, version=__version__)
    kept = {n: store.get("pi", (n,)) for n in range(workers * count)}
    skipped = {int(p.split()[1]) for p in problems}
    assert all(kept[n] == (n * n, f"sieve-{n // count}") for n in kept if n not in skipped)
    assert len(skipped) <= workers * count // 10
