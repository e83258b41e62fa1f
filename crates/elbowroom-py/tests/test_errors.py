"""Bad input raises ValueError with the command line's one-line message (for
the inputs both take), and oversized work is refused before it starts."""

from fractions import Fraction

import pytest

import elbowroom as er


# (the Python call, the same input on the command line)
SAME_MESSAGE = [
    (lambda: er.schubert("1442"), ["schubert", "1442"]),
    (lambda: er.schubert("12a"), ["schubert", "12a"]),
    (lambda: er.schubert("1,,2"), ["schubert", "1,,2"]),
    (lambda: er.reduced_words("0"), ["words", "0"]),
    (lambda: er.count_reduced_words("1,2,17,3"), ["words", "1,2,17,3"]),
    (lambda: er.pipe_dreams("321 4 4"), ["dreams", "321 4 4"]),
    (lambda: er.product("21", "321", 2), ["product", "21", "321", "--n", "2"]),
    (lambda: er.product("21", "21", 17), ["product", "21", "21", "--n", "17"]),
    (lambda: er.expand("x1 +", 3), ["expand", "x1 +", "--n", "3"]),
    (lambda: er.expand("x4", 3), ["expand", "x4", "--n", "3"]),
    (lambda: er.expand("x1", 0), ["expand", "x1", "--n", "0"]),
    (lambda: er.divsym("x1^2", 3, "2,2,3,3"), ["divsym", "x1^2", "--n", "3", "--h", "2,2,3,3"]),
    (lambda: er.divsym("x1^2", 3, "3,2,3"), ["divsym", "x1^2", "--n", "3", "--h", "3,2,3"]),
    (lambda: er.divsym("x1^2", 3, "2,,3"), ["divsym", "x1^2", "--n", "3", "--h", "2,,3"]),
    (lambda: er.divsym("x1^30", 8), ["divsym", "x1^30", "--n", "8"]),
    (lambda: er.divsym("x1 * * x2", 3), ["divsym", "x1 * * x2", "--n", "3"]),
    (lambda: er.hessenberg(18), ["hessenberg", "--n", "18"]),
    (lambda: er.divsym("x1", 17), ["divsym", "x1", "--n", "17"]),
    (lambda: er.hessenberg(0), ["hessenberg", "--n", "0"]),
    (lambda: er.hessenberg(4, "2,3,3"), ["hessenberg", "--n", "4", "--h", "2,3,3"]),
    (lambda: er.hessenberg(4, "1,3,2,4"), ["hessenberg", "--n", "4", "--h", "1,3,2,4"]),
    (lambda: er.reduce("x1", 13), ["reduce", "x1", "--n", "13"]),
    (lambda: er.reduce("x1^(", 3), ["reduce", "x1^(", "--n", "3"]),
    (lambda: er.quotient_basis(13), ["quotient", "--n", "13"]),
    (lambda: er.volume("1,x"), ["volume", "--lambda", "1,x"]),
    (lambda: er.volume("1,,2"), ["volume", "--lambda", "1,,2"]),
    (lambda: er.volume(",".join(["1"] * 17)), ["volume", "--lambda", ",".join(["1"] * 17)]),
    (lambda: er.volume("1/0,2"), ["volume", "--lambda", "1/0,2"]),
    (lambda: er.volume(f"{10**800},0,1"), ["volume", "--lambda", f"{10**800},0,1"]),
    (lambda: er.mixed_eulerian(1), ["eulerian", "--n", "1"]),
    (lambda: er.mixed_eulerian(11), ["eulerian", "--n", "11"]),
    (lambda: er.schubert("1,16,15,14,13,12,11,10,9,8,7,6,5,4,3,2"),
     ["schubert", "1,16,15,14,13,12,11,10,9,8,7,6,5,4,3,2"]),
]


@pytest.mark.parametrize("call,args", SAME_MESSAGE, ids=[" ".join(a) for _, a in SAME_MESSAGE])
def test_the_message_is_the_command_lines(cli, call, args):
    with pytest.raises(ValueError) as raised:
        call()
    assert str(raised.value) == cli.error(*args)


@pytest.mark.parametrize(
    "call",
    [
        # permutations given as Python values
        lambda: er.schubert([1, 4, 4, 2]),
        lambda: er.schubert((1, "a", 2)),
        lambda: er.schubert(3.5),
        lambda: er.schubert(None),
        lambda: er.schubert([]),
        lambda: er.product((2, 1), {1: 2}),
        # polynomials given as dicts
        lambda: er.expand({(1, 2, 3, 4): 1}, 3),
        lambda: er.expand({(1,): 0.5}, 2),
        lambda: er.expand({(-1,): 1}, 2),
        lambda: er.expand({(1.0,): 1}, 2),
        lambda: er.expand({"x1": 1}, 2),
        lambda: er.expand({(256,): 1}, 2),
        lambda: er.divsym({(2,): "1/x"}, 3),
        lambda: er.reduce(3, 3),
        # sizes and limits
        lambda: er.expand("x1", -1),
        lambda: er.hessenberg(4.0),
        lambda: er.hessenberg(16),
        lambda: er.reduced_words("321", limit=-1),
        lambda: er.pipe_dreams("321", limit="3"),
        # h and λ given as Python values
        lambda: er.hessenberg(3, [2, 3]),
        lambda: er.hessenberg(3, (2, 3.0, 3)),
        lambda: er.volume([1, 0.5]),
        lambda: er.volume([]),
        lambda: er.volume({1, 2}),
        lambda: er.polynomial("x1 +"),
    ],
)
def test_value_error_for_python_values(call):
    with pytest.raises(ValueError) as raised:
        call()
    message = str(raised.value)
    assert message and "\n" not in message


def test_the_collected_table_limit_names_the_size():
    # the default h of n = 16 has M(16, 15) = 43 874 857 rows (OEIS A008302):
    # refused before it starts, naming the size and the limit
    with pytest.raises(ValueError, match="43874857 permutations; at most 12000000"):
        er.hessenberg(16)


def test_good_input_in_every_accepted_form():
    s = er.schubert("1432")
    assert er.schubert((1, 4, 3, 2)) == s
    assert er.schubert([1, 4, 3, 2]) == s
    assert er.schubert("1 4 3 2") == s
    assert er.schubert("1,4,3,2") == s
    assert er.schubert(1432) == s
    assert er.volume(["3", Fraction(1, 2), 0]) == Fraction(23, 4)
    assert er.hessenberg(3, (2, 3, 3)) == er.hessenberg(3, "2,3,3") == er.hessenberg(3)
