"""to_sympy and from_sympy, where sympy is installed."""

from fractions import Fraction

import pytest

import elbowroom as er

sympy = pytest.importorskip("sympy")


def test_schubert_polynomial_to_sympy():
    x1, x2, x3 = sympy.symbols("x1 x2 x3")
    # S_1432 = x1^2 x2 + x1^2 x3 + x1 x2^2 + x1 x2 x3 + x2^2 x3 (Macdonald's tables)
    want = x1**2 * x2 + x1**2 * x3 + x1 * x2**2 + x1 * x2 * x3 + x2**2 * x3
    assert sympy.expand(er.to_sympy(er.schubert("1432")) - want) == 0


def test_round_trip_is_exact():
    p = {(2, 0, 1): Fraction(-3, 7), (0, 1, 0): 2**80, (0, 0, 0): Fraction(1, 3)}
    e = er.to_sympy(p)
    back = er.from_sympy(e)
    assert back == p
    assert list(back) == sorted(p, reverse=True)
    # and the result is accepted by the module
    assert er.reduce(back, 3) == er.reduce(p, 3)


def test_text_and_underscored_names():
    x_1, x_2 = sympy.symbols("x_1 x_2")
    assert er.from_sympy((x_1 + x_2) ** 2, n=3) == er.polynomial("(x1 + x2)^2", 3)
    assert er.to_sympy("x1 x2 - 1/2") == sympy.Symbol("x1") * sympy.Symbol("x2") - sympy.Rational(1, 2)


def test_refusals():
    x1, y = sympy.symbols("x1 y")
    with pytest.raises(ValueError):
        er.from_sympy(x1 + y)
    with pytest.raises(ValueError):
        er.from_sympy(0.5 * x1)
    with pytest.raises(ValueError):
        er.from_sympy(1 / x1)
    with pytest.raises(ValueError):
        er.from_sympy(x1**2, n=0) if False else er.from_sympy(sympy.Symbol("x3"), n=2)
