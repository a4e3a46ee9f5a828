"""Test-suite settings shared by every test file.

The oracle keeps slow answers in an on-disk store (:mod:`oracle._store`), by
default in the user's cache folder.  The tests must never write there, so each
pytest process (each xdist worker too) points the store at a fresh temporary
folder, removed at the end; child processes started by the tests inherit it.
"""

import os
import shutil
import tempfile

_STORE_VARIABLE = "NTORACLE_STORE"


def pytest_configure(config):
    folder = tempfile.mkdtemp(prefix="ntoracle-test-store-")
    config._ntoracle_store_folder = (folder, os.environ.get(_STORE_VARIABLE))
    os.environ[_STORE_VARIABLE] = folder


def pytest_unconfigure(config):
    folder, before = getattr(config, "_ntoracle_store_folder", (None, None))
    if folder is None:
        return
    if before is None:
        os.environ.pop(_STORE_VARIABLE, None)
    else:
        os.environ[_STORE_VARIABLE] = before
    shutil.rmtree(folder, ignore_errors=True)
