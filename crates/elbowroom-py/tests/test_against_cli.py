"""Every function against the command line's --json output: on the README's
examples and on random cases (a fixed seed, so a failure can be replayed).
The command line and the module call the same functions of the math crate;
these tests check the module's reading of the inputs and its conversion of
the results (values, key shapes, order)."""

import random
from fractions import Fraction

import pytest

import elbowroom as er
from conftest import poly_from_json, same_ordered, terms_from_json

RNG = random.Random(20261204)


def random_perm(n):
    w = list(range(1, n + 1))
    RNG.shuffle(w)
    return w


def random_poly(n, degree, terms=4):
    """A random polynomial as (text, dict): a few monomials of total degree <= degree."""
    out = {}
    for _ in range(terms):
        e = [0] * n
        for _ in range(RNG.randint(0, degree)):
            e[RNG.randrange(n)] += 1
        c = Fraction(RNG.randint(-5, 5), RNG.choice([1, 1, 2, 3]))
        if c:
            out[tuple(e)] = out.get(tuple(e), 0) + c
    text = " + ".join(
        f"({c})" + "".join(f" x{i + 1}^{k}" for i, k in enumerate(e) if k)
        for e, c in out.items()
    ) or "0"
    return text, {e: c for e, c in out.items() if c}


def random_h(n):
    """A random Hessenberg function: weakly increasing, i <= h(i) <= n."""
    h, low = [], 1
    for i in range(1, n + 1):
        low = RNG.randint(max(low, i), n)
        h.append(low)
    return h


PERMS = ["1432", "4321", "2413", "31524", "132", "1"] + [
    "".join(map(str, random_perm(n))) for n in (3, 4, 5, 5, 6, 6)
]


@pytest.mark.parametrize("w", PERMS)
def test_schubert(cli, w):
    doc = cli.json("schubert", w)
    got = er.schubert(w)
    same_ordered(got, poly_from_json(doc["polynomial"]))
    assert all(type(c) is int for c in got.values())
    # the same answer from a tuple and from a comma list
    assert er.schubert(tuple(doc["perm"])) == got
    assert er.schubert(",".join(map(str, doc["perm"]))) == got


@pytest.mark.parametrize("w", PERMS)
def test_reduced_words_and_their_number(cli, w):
    doc = cli.json("words", w, "--limit", "50")
    assert list(er.reduced_words(w, limit=50)) == [tuple(a) for a in doc["words"]]
    assert er.count_reduced_words(w) == int(doc["count"])
    if int(doc["count"]) <= 50:
        assert len(list(er.reduced_words(w))) == int(doc["count"])


@pytest.mark.parametrize("w", PERMS)
def test_pipe_dreams(cli, w):
    doc = cli.json("dreams", w, "--limit", "40")
    want = [tuple(tuple(c) for c in d["crosses"]) for d in doc["dreams"]]
    assert list(er.pipe_dreams(w, limit=40)) == want
    assert list(er.pipe_dreams(w, limit=0)) == []


def test_the_iterators_are_lazy():
    # w0 of S_9 has about 2.9·10^19 reduced words; the first (lexicographically
    # smallest: 1, 21, 321, ...) comes at once
    it = er.reduced_words("987654321")
    first = next(it)
    assert first == tuple(a for k in range(1, 9) for a in range(k, 0, -1))
    # S_{w0} is one monomial: w0 has exactly one reduced pipe dream
    assert len(list(er.pipe_dreams("987654321", limit=3))) == 1


PRODUCTS = [("132", "132", None), ("132", "132", 3), ("2143", "1432", None),
            ("231", "312", 4), ("1432", "1432", None), ("21", "21", None)] + [
    ("".join(map(str, random_perm(4))), "".join(map(str, random_perm(4))), RNG.choice([None, 5]))
    for _ in range(6)
]


@pytest.mark.parametrize("u,v,n", PRODUCTS)
def test_product(cli, u, v, n):
    args = ["product", u, v] + ([] if n is None else ["--n", str(n)])
    doc = cli.json(*args)
    got = er.product(u, v, n)
    same_ordered(got, terms_from_json(doc["terms"]))
    assert all(type(c) is int for c in got.values())


EXPANSIONS = [("(x1 - x3)(x2 - x3)", 3, False), ("x2^2", 2, True), ("x1^2 + x2 x3", 3, False),
              ("(x1 + 2x2)^3", 4, True), ("x1 x2 x3 - 1/2 x3^2", 4, False)]


@pytest.mark.parametrize("text,n,stable", EXPANSIONS)
def test_expand_typed(cli, text, n, stable):
    doc = cli.json("expand", text, "--n", str(n), *(["--stable"] if stable else []))
    got = er.expand(text, n, stable=stable)
    same_ordered(got, terms_from_json(doc["terms"]))
    assert all(isinstance(c, Fraction) for c in got.values())


@pytest.mark.parametrize("case", range(8))
def test_expand_dict_random(cli, case):
    n = RNG.randint(2, 4)
    text, poly = random_poly(n, 4)
    stable = case % 2 == 0
    doc = cli.json("expand", text, "--n", str(n), *(["--stable"] if stable else []))
    want = terms_from_json(doc["terms"])
    same_ordered(er.expand(poly, n, stable=stable), want)
    same_ordered(er.expand(text, n, stable=stable), want)


DIVSYMS = [("x1^2 x2", 3, None), ("x1^3", 3, None), ("x1^2", 3, "2,3,3"),
           ("x1 x2^2 x3 + 3/2 x1^4", 4, "2,4,4,4")]


@pytest.mark.parametrize("text,n,h", DIVSYMS)
def test_divsym(cli, text, n, h):
    doc = cli.json("divsym", text, "--n", str(n), *([] if h is None else ["--h", h]))
    same_ordered(er.divsym(text, n, h), poly_from_json(doc["result"]))
    same_ordered(er.divsym(poly_from_json(doc["input"]), n, h), poly_from_json(doc["result"]))


@pytest.mark.parametrize("case", range(6))
def test_divsym_random(cli, case):
    n = RNG.randint(2, 5)
    h = random_h(n)
    text, poly = random_poly(n, sum(v - i for i, v in enumerate(h, 1)) + 2)
    doc = cli.json("divsym", text, "--n", str(n), "--h", ",".join(map(str, h)))
    same_ordered(er.divsym(poly, n, tuple(h)), poly_from_json(doc["result"]))


HESSENBERG = [(3, None), (4, None), (5, None), (7, None), (4, "3,3,4,4"), (5, "2,4,4,5,5")] + [
    (n, ",".join(map(str, random_h(n)))) for n in (4, 5, 6, 6, 7)
]


@pytest.mark.parametrize("n,h", HESSENBERG)
def test_hessenberg(cli, n, h):
    doc = cli.json("hessenberg", "--n", str(n), *([] if h is None else ["--h", h]))
    want = {tuple(r["perm"]): int(r["value"]) for r in doc["coefficients"]}
    got = er.hessenberg(n, h)
    assert list(got.items()) == list(want.items())
    assert len(got) == doc["listed"]
    assert all(type(c) is int for c in got.values())
    # a second call (from the cache) gives the same
    again = er.hessenberg(n, None if h is None else [int(v) for v in h.split(",")])
    assert list(again.items()) == list(got.items())


REDUCTIONS = [("x1^2 + x2 x3", 3), ("x1 x2^2 + 1/2 x3", 3), ("(x1 + x2 + x3 + x4)^3 - x4^3", 4),
              ("x2 x3^2 x4 - 7 x1", 4), ("x1 x2 + x12^3 - 2/3 x5 x7 x9", 12)]


@pytest.mark.parametrize("text,n", REDUCTIONS)
def test_reduce(cli, text, n):
    doc = cli.json("reduce", text, "--n", str(n))
    same_ordered(er.reduce(text, n), poly_from_json(doc["normal_form"]))
    same_ordered(er.reduce(poly_from_json(doc["input"]), n), poly_from_json(doc["normal_form"]))


def test_quasisymmetric_polynomials_vanish_at_n_12():
    # J_12 is generated by the M_alpha (its definition): M_(2,1) = sum over i < j of
    # x_i^2 x_j, and M_(1,1,1), reduce to 0 (n = 12 goes through the forest basis)
    n = 12
    m21 = {}
    m111 = {}
    for i in range(n):
        for j in range(i + 1, n):
            e = [0] * n
            e[i], e[j] = 2, 1
            m21[tuple(e)] = 1
            for k in range(j + 1, n):
                e = [0] * n
                e[i] = e[j] = e[k] = 1
                m111[tuple(e)] = 1
    assert er.reduce(m21, n) == {}
    assert er.reduce(m111, n) == {}
    # x1 is congruent to -(x2 + ... + x12)
    assert er.reduce({(1,) + (0,) * 11: 1}, n) == {
        tuple(1 if k == i else 0 for k in range(n)): -1 for i in range(1, n)
    }


@pytest.mark.parametrize("case", range(6))
def test_reduce_random(cli, case):
    n = RNG.randint(2, 5)
    text, poly = random_poly(n, 5)
    doc = cli.json("reduce", text, "--n", str(n))
    got = er.reduce(poly, n)
    same_ordered(got, poly_from_json(doc["normal_form"]))
    basis = set(er.quotient_basis(n))
    assert set(got) <= basis


@pytest.mark.parametrize("n", [1, 2, 3, 4, 5, 6])
def test_quotient_basis(cli, n):
    doc = cli.json("quotient", "--n", str(n))
    assert er.quotient_basis(n) == [tuple(e) for e in doc["basis"]]


LAMBDAS = ["2,1,0", "3,1/2,0", "1,1,0,0", "5/3,-2,7/11,0", "0.25,1"] + [
    ",".join(str(Fraction(RNG.randint(-9, 9), RNG.randint(1, 4))) for _ in range(RNG.randint(2, 6)))
    for _ in range(6)
]


@pytest.mark.parametrize("lam", LAMBDAS)
def test_volume(cli, lam):
    doc = cli.json("volume", "--lambda", lam)
    got = er.volume(lam)
    assert isinstance(got, Fraction)
    assert got == Fraction(doc["volume"])
    assert er.volume([Fraction(x) for x in lam.split(",")]) == got


@pytest.mark.parametrize("n", [2, 3, 4, 5, 6])
def test_mixed_eulerian(cli, n):
    doc = cli.json("eulerian", "--n", str(n))
    want = {tuple(r["c"]): int(r["value"]) for r in doc["numbers"]}
    got = er.mixed_eulerian(n)
    assert list(got.items()) == list(want.items())
    assert sum(got.values()) == int(doc["sum"])
