"""coefficient(w, h=None, q=False) and forest(w) against `elbowroom coefficient
--json` and `elbowroom forest W --json`: the same keys, in the same order and
nesting, with exact Python values in place of the command's strings; on the
documented examples and on random w of length n − 1 (a fixed seed). Beside
them, checks by the mathematics: the cyclic sum of a_w is the number of
reduced words, a_w by trees sums to a_w, and worked values."""

import random
from fractions import Fraction
from itertools import permutations

import pytest

import elbowroom as er

RNG = random.Random(20261205)

# keys whose JSON lists are tuples in Python (permutations, h, codes, contents, shapes)
TUPLE_KEYS = {"perm", "h", "code", "content", "shape"}


def expected(value, key=None):
    """The command's JSON value as the module's Python value."""
    if isinstance(value, dict):
        return {k: expected(v, k) for k, v in value.items()}
    if isinstance(value, list):
        if key in TUPLE_KEYS:
            return tuple(value)
        if key == "tableaux":
            return [[tuple(row) for row in t] for t in value]
        return [expected(v, key) for v in value]
    if isinstance(value, str) and key != "name":
        r = Fraction(value)
        return int(r) if r.denominator == 1 else r
    return value


def same_shape(got, want, where="record"):
    """Equal, with the keys of every dict in the same order and the same types."""
    assert type(got) is type(want), f"{where}: {type(got).__name__} != {type(want).__name__}"
    if isinstance(want, dict):
        assert list(got) == list(want), f"{where}: keys {list(got)} != {list(want)}"
        for k in want:
            same_shape(got[k], want[k], f"{where}.{k}")
    elif isinstance(want, (list, tuple)):
        assert len(got) == len(want), f"{where}: {got} != {want}"
        for k, (g, w) in enumerate(zip(got, want)):
            same_shape(g, w, f"{where}[{k}]")
    else:
        assert got == want, f"{where}: {got!r} != {want!r}"


def length(w):
    return sum(1 for i in range(len(w)) for j in range(i + 1, len(w)) if w[i] > w[j])


def random_of_length_n_minus_1(n):
    while True:
        w = list(range(1, n + 1))
        RNG.shuffle(w)
        if length(w) == n - 1:
            return tuple(w)


# the documented examples (docs/coefficients.md, docs/forests.md) and a few more
DOCUMENTED = ["1432", "2413", "3142", "21543", "15324", "2,1,6,4,3,5", "3,1,2,6,5,4"]
RANDOM = [random_of_length_n_minus_1(n) for n in (4, 5, 5, 6, 6, 7)]


@pytest.mark.parametrize("w", DOCUMENTED + RANDOM, ids=str)
def test_coefficient_is_the_commands_record(cli, w):
    arg = w if isinstance(w, str) else ",".join(map(str, w))
    got = er.coefficient(w)
    want = expected(cli.json("coefficient", arg))
    assert "by_trees" in got and list(got)[-1] == "by_trees"
    same_shape(got, want)


@pytest.mark.parametrize("w", ["1432", "2413", "21543", "3,1,2,6,5,4"], ids=str)
def test_coefficient_with_q_is_the_commands_record(cli, w):
    got = er.coefficient(w, q=True)
    want = expected(cli.json("coefficient", w, "--q"))
    same_shape(got, want)
    assert list(got)[-2:] == ["by_trees", "q_value"]
    # a_w(q) at q = 1 is a_w
    assert sum(got["q_value"]) == got["value"]


@pytest.mark.parametrize(
    "w,h",
    [("4213", "3,3,4,4"), ("3241", "3,3,4,4"), ("2431", "3,3,4,4"), ("4321", "4,4,4,4"), ("321", "3,3,3"),
     ("42153", "2,4,4,5,5"), ("3,1,2,5,4", (2, 3, 3, 5, 5))],
    ids=str,
)
def test_coefficient_for_another_h_is_the_commands_record(cli, w, h):
    text = h if isinstance(h, str) else ",".join(map(str, h))
    got = er.coefficient(w, h)
    want = expected(cli.json("coefficient", w, "--h", text))
    same_shape(got, want)
    assert list(got) == ["perm", "n", "h", "value"]
    # a^h_w is also the table's entry (the same functional by another path)
    assert er.hessenberg(len(got["perm"]), h)[got["perm"]] == got["value"]


def test_the_default_h_given_explicitly_is_the_default(cli):
    assert er.coefficient("2413", "2,3,4,4") == er.coefficient("2413")


@pytest.mark.parametrize("n", [3, 4, 5, 6])
def test_every_coefficient_of_n_against_the_table_and_the_cyclic_sum(n):
    # a_w = DS_n(S_w) is the Hessenberg table of the default h (Postnikov,
    # "Permutohedra, associahedra, and beyond", 2009, §16), and the sum of a_w
    # over the cyclic orbit of w is the number of reduced words of w
    # (Nadeau–Tewari, "Remixed Eulerian numbers" / "divided symmetrization",
    # from memory); a_w by trees adds up to a_w
    table = er.hessenberg(n)
    for w, a in table.items():
        got = er.coefficient(w)
        assert got["value"] == a
        assert sum(t["coefficient"] * t["labelings"] for t in got["by_trees"]) == a
        assert got["cyclic"]["sum"] == er.count_reduced_words(w)
        assert sum(o["value"] for o in got["cyclic"]["orbit"]) == got["cyclic"]["sum"]
        assert got["inverse"]["value"] == a and got["conjugate"]["value"] == a


def test_worked_values():
    # a_1432 = 1 and a_2413 = a_3142 = 2 (the n = 4 values of Postnikov 2009, §16,
    # from memory); 2413 is Grassmannian of shape (2, 1) with 2 standard tableaux,
    # and its 2 reduced words (2,1,3 and 2,3,1) have content (1,1,1), a parking
    # function (worked by hand)
    assert er.coefficient("1432")["value"] == 1
    assert er.coefficient((2, 4, 1, 3))["value"] == 2
    assert er.coefficient([3, 1, 4, 2])["value"] == 2
    names = [r["name"] for r in er.coefficient("2413")["rules"]]
    assert names == ["parking", "grassmannian", "coxeter"]


@pytest.mark.parametrize(
    "w", ["1432", "2413", "3142", "4321", "1", "21", "321", "13254", "2,1,5,4,3", "1,5,3,6,2,4"]
    + [tuple(RNG.sample(range(1, n + 1), n)) for n in (4, 5, 6, 6)],
    ids=str,
)
def test_forest_is_the_commands_record(cli, w):
    arg = w if isinstance(w, str) else ",".join(map(str, w))
    got = er.forest(w)
    want = expected(cli.json("forest", arg))
    same_shape(got, want)
    assert list(got) == ["perm", "terms", "single"]


def test_forest_expansions_by_hand():
    # S_2413 = P_(1,2) + P_(2,1) (Nadeau–Tewari, an example checked by hand);
    # S_1432 = P_(1,2) + P_(0,2,1)
    assert er.forest("2413") == {
        "perm": (2, 4, 1, 3),
        "terms": [{"code": (2, 1), "coefficient": 1}, {"code": (1, 2), "coefficient": 1}],
        "single": False,
    }
    got = er.forest("1432")
    assert {t["code"]: t["coefficient"] for t in got["terms"]} == {(1, 2): 1, (0, 2, 1): 1}
    # S_w for w in S_3: the forest expansion has nonnegative integer coefficients
    # (Nadeau–Tewari); evaluating both sides is done by the math crate's tests
    for w in permutations((1, 2, 3)):
        assert all(t["coefficient"] > 0 for t in er.forest(w)["terms"])


W16 = "1,16,15,14,13,12,11,10,9,8,7,6,5,4,3,2"
H16 = "1" + ",16" * 15

# (the Python call, the same input on the command line)
SAME_MESSAGE = [
    (lambda: er.coefficient("1432", "3,3,4"), ["coefficient", "1432", "--h", "3,3,4"]),
    (lambda: er.coefficient("1432", "2,3,3"), ["coefficient", "1432", "--h", "2,3,3"]),
    (lambda: er.coefficient("1432", "3,3,4,4"), ["coefficient", "1432", "--h", "3,3,4,4"]),
    (lambda: er.coefficient("1432", "2,3,3,3,3"), ["coefficient", "1432", "--h", "2,3,3,3,3"]),
    (lambda: er.coefficient("1234"), ["coefficient", "1234"]),
    (lambda: er.coefficient("4321"), ["coefficient", "4321"]),
    (lambda: er.coefficient("1442"), ["coefficient", "1442"]),
    (lambda: er.coefficient("2431", "3,3,4,4", q=True),
     ["coefficient", "2431", "--h", "3,3,4,4", "--q"]),
    (lambda: er.coefficient(W16, H16), ["coefficient", W16, "--h", H16]),
    (lambda: er.coefficient("2,3,4,5,6,7,8,9,10,11,12,13,14,15,16,1"),
     ["coefficient", "2,3,4,5,6,7,8,9,10,11,12,13,14,15,16,1"]),
    (lambda: er.forest(W16), ["forest", W16]),
    (lambda: er.forest("12a"), ["forest", "12a"]),
]


@pytest.mark.parametrize("call,args", SAME_MESSAGE, ids=[" ".join(a)[:60] for _, a in SAME_MESSAGE])
def test_the_message_is_the_command_lines(cli, call, args):
    with pytest.raises(ValueError) as raised:
        call()
    assert str(raised.value) == cli.error(*args)


def test_too_large_is_refused_before_it_starts():
    with pytest.raises(ValueError, match="at most 2000000 are accepted"):
        er.forest(W16)
    with pytest.raises(ValueError, match="2 <= n <= 14"):
        er.coefficient("2,3,4,5,6,7,8,9,10,11,12,13,14,15,16,1")
