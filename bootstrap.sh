#!/usr/bin/env bash
# Set up ntoracle in ./.venv on a Debian machine with Python >= 3.11.
#
# As root with apt available, installs Debian's libprimesieve-dev (the fast
# sieve engine's library) and libprimecount-dev (for the test-only reference
# primecountpy) first.  Without them, ntoracle still works on its own numpy
# sieve; the tests that need a missing reference library are skipped and say so.
set -euo pipefail
cd "$(dirname "$0")"

packages="libprimesieve-dev libprimecount-dev"
if command -v apt-get >/dev/null 2>&1 && [ "$(id -u)" = 0 ]; then
    if ! dpkg -s $packages >/dev/null 2>&1; then
        echo "bootstrap: installing Debian packages: $packages"
        apt-get update -qq
        DEBIAN_FRONTEND=noninteractive apt-get install -y -qq $packages >/dev/null
    fi
fi

python=${PYTHON:-python3}
if [ ! -x .venv/bin/python ]; then
    "$python" -m venv .venv
fi
.venv/bin/python -m pip install -q --upgrade pip "setuptools>=68" wheel
if dpkg -s libprimesieve-dev >/dev/null 2>&1; then
    extras="fast,test"
else
    echo "bootstrap: libprimesieve-dev is not installed: using ntoracle's own numpy sieve"
    extras="test"
fi
.venv/bin/python -m pip install -q -e ".[$extras]"
echo "bootstrap: ready ($(.venv/bin/ntoracle --version))"
