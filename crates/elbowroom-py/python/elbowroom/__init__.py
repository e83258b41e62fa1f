"""Exact Schubert calculus from Python, on the engine of the elbowroom program.

Schubert polynomials, reduced words and pipe dreams, products and Schubert
expansions, divided symmetrization and Hessenberg class tables, the
quasisymmetric quotient Q[x1..xn]/J_n, permutohedra, the coefficients a^h_w
explained (``coefficient``) and forest expansions (``forest``): the functions the
``elbowroom`` commands call, with exact Python values.

Conventions
-----------
* Permutations are in one-line notation w = w(1)...w(n), 1-based, given as a
  tuple or list (``(1, 4, 3, 2)``) or a string (``"1432"``, ``"3,1,5,2,4"``),
  and returned as tuples of int. s_i swaps i and i+1; w·s_i swaps the entries
  in positions i and i+1; a reduced word (a_1, ..., a_l) means
  w = s_{a_1} ... s_{a_l}.
* Polynomials are dicts from exponent tuples (e_1, ..., e_n) to exact
  coefficients (int or fractions.Fraction), or the text the commands take
  (``"x1^2 x2 - 3/2 x3"``). Dicts come back leading term first in lex order
  with x1 > x2 > ... > xn, the order the quotient by J_n uses.
* Bad input raises ValueError with the command line's one-line message; the
  command line's size limits refuse oversized work before it starts.
* Long computations release the GIL, accept ``progress=callable(done, total)``
  (called about every 50 ms), and stop on KeyboardInterrupt.
"""

from fractions import Fraction as _Fraction
import re as _re

from ._elbowroom import (
    __version__,
    coefficient,
    count_reduced_words,
    divsym,
    expand,
    forest,
    hessenberg,
    mixed_eulerian,
    pipe_dreams,
    polynomial,
    product,
    quotient_basis,
    reduce,
    reduced_words,
    schubert,
    volume,
)

__all__ = [
    "coefficient",
    "count_reduced_words",
    "divsym",
    "expand",
    "forest",
    "from_sympy",
    "hessenberg",
    "mixed_eulerian",
    "pipe_dreams",
    "polynomial",
    "product",
    "quotient_basis",
    "reduce",
    "reduced_words",
    "schubert",
    "to_sympy",
    "volume",
]

_VARIABLE = _re.compile(r"^x_?\{?([1-9][0-9]*)\}?$")


def _sympy():
    try:
        import sympy
    except ImportError as e:  # pragma: no cover - depends on the environment
        raise ImportError(
            "to_sympy and from_sympy need sympy, which is not installed "
            "(pip install sympy)"
        ) from e
    return sympy


def to_sympy(poly, n=None):
    """The polynomial as a sympy expression in the symbols x1, x2, ...

    ``poly`` is a dict from exponent tuples to exact coefficients (as the
    functions of this module return) or text such as ``"x1^2 x2 - 3/2"``
    (read by :func:`polynomial`, with ``n`` variables if given). Coefficients
    become sympy Integers and Rationals; nothing is rounded.
    """
    sympy = _sympy()
    if isinstance(poly, str):
        poly = polynomial(poly, n)
    if not isinstance(poly, dict):
        raise ValueError(
            "to_sympy takes a dict from exponent tuples to coefficients or a "
            f"polynomial as text, not {type(poly).__name__}"
        )
    width = max((len(e) for e in poly), default=0)
    if n is not None:
        width = max(width, n)
    xs = sympy.symbols(f"x1:{width + 1}") if width else ()
    total = sympy.Integer(0)
    for exps, c in poly.items():
        c = _Fraction(c)
        term = sympy.Rational(c.numerator, c.denominator)
        for x, e in zip(xs, exps):
            term *= x ** int(e)
        total += term
    return total


def from_sympy(expr, n=None):
    """A sympy polynomial expression in x1, x2, ... (or x_1, ...) as a dict.

    The result maps exponent tuples (of length n, or the largest index used)
    to int or Fraction, leading term first in lex order x1 > x2 > ...; it can
    be given to any function of this module. Symbols other than x<i>,
    non-polynomial expressions and floating-point coefficients are refused
    with ValueError.
    """
    sympy = _sympy()
    expr = sympy.sympify(expr)
    index = {}
    for s in expr.free_symbols:
        m = _VARIABLE.match(s.name)
        if not m:
            raise ValueError(
                f"the symbol {s.name} is not a variable x1, x2, ... (or x_1, x_2, ...)"
            )
        index[s] = int(m.group(1))
    width = max(index.values(), default=0)
    if n is not None:
        if width > n:
            raise ValueError(f"the expression uses x{width}, beyond x{n}")
        width = n
    width = max(width, 1)
    gens = sorted(index, key=index.get)
    if gens:
        try:
            p = sympy.Poly(sympy.expand(expr), *gens)
        except sympy.PolynomialError as e:
            raise ValueError(f"{expr} is not a polynomial in x1, x2, ...: {e}") from e
        raw = p.terms()
    else:
        raw = [((), expr)]
    terms = {}
    for monom, c in raw:
        if c == 0:
            continue
        if not c.is_Rational:
            raise ValueError(
                f"the coefficient {c} is not an exact rational number "
                "(give integers or fractions, not floats or symbols)"
            )
        exps = [0] * width
        for g, e in zip(gens, monom):
            exps[index[g] - 1] = int(e)
        value = _Fraction(int(c.p), int(c.q))
        terms[tuple(exps)] = value.numerator if value.denominator == 1 else value
    return dict(sorted(terms.items(), reverse=True))
