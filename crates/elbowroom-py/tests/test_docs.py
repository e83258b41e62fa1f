"""The `pycon` examples of docs/python.md, run as doctests in one namespace
(their printed values must be exactly what the module returns)."""

import doctest
import importlib.util
import re

import pytest

from conftest import ROOT

DOC = ROOT / "docs" / "python.md"


def blocks():
    text = DOC.read_text(encoding="utf-8")
    return re.findall(r"```pycon\n(.*?)```", text, flags=re.S)


def test_the_documentation_has_examples():
    assert len(blocks()) >= 2


def test_the_documentation_examples_run_as_shown():
    namespace = {}
    parser = doctest.DocTestParser()
    runner = doctest.DocTestRunner(optionflags=doctest.ELLIPSIS)
    has_sympy = importlib.util.find_spec("sympy") is not None
    ran = 0
    for k, block in enumerate(blocks()):
        if "sympy" in block and not has_sympy:
            continue
        test = parser.get_doctest(block, namespace, f"python.md block {k + 1}", str(DOC), 0)
        runner.run(test, clear_globs=False)
        namespace.update(test.globs)  # a DocTest works on a copy of the namespace
        ran += 1
    result = runner.summarize(verbose=False)
    assert ran >= 2
    assert result.failed == 0, f"{result.failed} of {result.attempted} examples differ"
    if not has_sympy:
        pytest.skip("sympy is not installed: its examples were not run")
