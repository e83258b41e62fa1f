#!/bin/sh
# The Python module: installs it with `pip install .` (maturin, from PyPI) in a
# fresh virtual environment, with pytest and sympy, and runs its tests
# (crates/elbowroom-py/tests), which compare it with the command-line binary
# of the same checkout (built here first if it is missing).
set -eu
cd "$(dirname "$0")/.."
target="${CARGO_TARGET_DIR:-target}"
if [ ! -x "$target/debug/elbowroom" ]; then
    cargo build -p elbowroom
fi
venv="$(mktemp -d "${TMPDIR:-/tmp}/elbowroom-venv.XXXXXX")"
trap 'rm -rf "$venv"' EXIT INT TERM
python3 -m venv "$venv"
"$venv/bin/python" -m pip install --quiet . pytest sympy
# from the crate's directory the installed module is imported, not the sources
cd crates/elbowroom-py
"$venv/bin/python" -m pytest -q tests
