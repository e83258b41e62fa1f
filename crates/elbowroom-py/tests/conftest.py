"""Shared helpers: the command-line binary of the same checkout, run with
--json, and the conversion of its JSON values to the module's Python values."""

import json
import os
import subprocess
from fractions import Fraction
from pathlib import Path

import pytest

ROOT = Path(__file__).resolve().parents[3]


def _binary():
    given = os.environ.get("ELBOWROOM_BIN")
    if given:
        return Path(given)
    target = Path(os.environ.get("CARGO_TARGET_DIR", ROOT / "target"))
    if not target.is_absolute():
        target = ROOT / target
    return target / "debug" / "elbowroom"


BINARY = _binary()


class Cli:
    """Runs `elbowroom ARGS` and returns its parsed JSON, or its error line."""

    def json(self, *args):
        out = subprocess.run(
            [str(BINARY), *args, "--json"], capture_output=True, text=True, timeout=300
        )
        assert out.returncode == 0, f"elbowroom {' '.join(args)}: {out.stderr}"
        return json.loads(out.stdout)

    def error(self, *args):
        """The one-line message of a refused command (exit status 2), without the program's name."""
        out = subprocess.run(
            [str(BINARY), *args], capture_output=True, text=True, timeout=300
        )
        assert out.returncode == 2, f"elbowroom {' '.join(args)} exited {out.returncode}"
        line = out.stderr.strip()
        assert "\n" not in line
        prefix = "elbowroom: "
        assert line.startswith(prefix)
        return line[len(prefix):]


@pytest.fixture(scope="session")
def cli():
    if not BINARY.exists():
        pytest.skip(
            f"the command-line binary {BINARY} is missing: build it with `cargo build` "
            "at the repository root (or set ELBOWROOM_BIN) to compare with it"
        )
    return Cli()


def poly_from_json(p):
    """{"nvars", "terms": [[[e...], "c"], ...]} as an ordered dict {exponents: Fraction}."""
    return {tuple(e): Fraction(c) for e, c in p["terms"]}


def terms_from_json(terms):
    """[{"perm": [...], "coefficient": "c"}, ...] as an ordered dict {perm: Fraction}."""
    return {tuple(t["perm"]): Fraction(t["coefficient"]) for t in terms}


def same_ordered(got, want):
    """Equal as dicts and in the same order (leading term first)."""
    assert list(got.items()) == list(want.items())
