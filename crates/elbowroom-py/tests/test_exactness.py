"""Exact values: integers beyond 2^64, rational λ, and checks against
published results and second methods computed here in Python."""

import math
from fractions import Fraction

import pytest

import elbowroom as er


def staircase_words(n):
    """The number of reduced words of w0 in S_n by Stanley's formula
    (European J. Combin. 1984): C(n, 2)! / Π_{k=1}^{n-1} (2k − 1)^{n−k}."""
    den = 1
    for k in range(1, n):
        den *= (2 * k - 1) ** (n - k)
    return math.factorial(n * (n - 1) // 2) // den


def w0(n):
    return tuple(range(n, 0, -1))


def test_reduced_words_of_w0_beyond_two_to_the_64():
    # OEIS A005118 starts 1, 1, 2, 16, 768, 292864 (from memory; also Stanley's formula)
    assert [staircase_words(n) for n in range(1, 7)] == [1, 1, 2, 16, 768, 292864]
    for n in range(1, 12):
        assert er.count_reduced_words(w0(n)) == staircase_words(n)
    big = er.count_reduced_words(w0(11))
    assert type(big) is int and big > 2**64


def test_a_coefficient_beyond_two_to_the_64_crosses_both_ways():
    c = 2**70 + 1
    # x1 = S_21, so the expansion of c·x1 is c·S_21
    assert er.expand({(1, 0): c}, 2) == {(2, 1): Fraction(c)}
    # DS_3(x1^2) = 1 (Postnikov, Permutohedra, associahedra, and beyond, IMRN 2009)
    assert er.divsym({(2,): c}, 3) == {(0, 0, 0): Fraction(c)}
    assert er.divsym(f"{c} x1^2", 3) == {(0, 0, 0): Fraction(c)}
    # modulo J_2 the standard monomials are 1 and x2; x1 = -x2 (x1 + x2 in J_2)
    assert er.reduce({(1, 0): c, (0, 0): Fraction(1, c)}, 2) == {
        (0, 1): Fraction(-c),
        (0, 0): Fraction(1, c),
    }


def shoelace(cycle):
    """The exact area of a polygon from its vertices in cyclic order."""
    area = Fraction(0)
    for (x1, y1), (x2, y2) in zip(cycle, cycle[1:] + cycle[:1]):
        area += x1 * y2 - x2 * y1
    return abs(area) / 2


@pytest.mark.parametrize(
    "lam",
    [
        (Fraction(3), Fraction(1, 2), Fraction(0)),
        (Fraction(7, 3), Fraction(-1, 5), Fraction(-2)),
        (Fraction(1, 10**30), Fraction(0), Fraction(-1, 7)),
    ],
)
def test_volume_of_a_rational_hexagon_by_the_shoelace_formula(lam):
    # P_λ for n = 3 projected to the first two coordinates is a hexagon;
    # its area, exactly, by the shoelace formula (a second method)
    # the vertices abc, acb, bca, cba, cab, bac (a > b > c) go round the hexagon:
    # each step swaps two values adjacent in λ, an edge of P_λ
    a, b, c = lam
    cycle = [(a, b), (a, c), (b, c), (c, b), (c, a), (b, a)]
    got = er.volume(list(lam))
    assert isinstance(got, Fraction)
    assert got == shoelace(cycle)


def test_volume_regular_and_homogeneous():
    # the regular permutohedron (n−1, ..., 0) has volume n^{n−2}
    # (Postnikov 2009; OEIS A000272), and Vol P_{tλ} = t^{n−1} Vol P_λ
    for n in range(2, 8):
        lam = list(range(n - 1, -1, -1))
        assert er.volume(lam) == n ** (n - 2)
        t = Fraction(2, 3)
        assert er.volume([t * x for x in lam]) == t ** (n - 1) * n ** (n - 2)


def test_mixed_eulerian_sums_and_special_values():
    # Postnikov 2009, §16: Σ_c A_c = (n−1)!·C_{n−1} ... checked here in the form
    # proved there: A_{(0,..,0,n−1)} = A_{(n−1,0,..,0)} = 1, A_{(1,...,1)} = (n−1)!,
    # and Σ_c A_c / c! ... = Vol of the permutohedron with u = (1, ..., 1), i.e. n^{n−2}
    for n in range(2, 8):
        a = er.mixed_eulerian(n)
        top = n - 1
        assert a[(top,) + (0,) * (top - 1)] == 1
        assert a[(0,) * (top - 1) + (top,)] == 1
        assert a[(1,) * top] == math.factorial(top)
        vol = sum(Fraction(v, math.prod(math.factorial(k) for k in c)) for c, v in a.items())
        assert vol == n ** (n - 2)


def test_hessenberg_point_count_and_full_flag():
    for n in range(2, 8):
        # h(i) = i: Q_h = Π_{i<j} (x_i − x_j), n! points (common-practice fact)
        assert er.hessenberg(n, list(range(1, n + 1))) == {tuple(range(1, n + 1)): math.factorial(n)}
        # h(i) = n: the whole flag variety, Q_h = 1 = S_id, so a_{w0} = 1
        assert er.hessenberg(n, [n] * n) == {w0(n): 1}


def test_hessenberg_at_n_17_reads_one_difference():
    # h = (16, 17, ..., 17): Q_h = x_1 − x_17 = S_{s_1} + S_{s_16} in H*(Fl_17),
    # as S_{s_k} = x_1 + ... + x_k and x_1 + ... + x_17 = 0 there (Fulton,
    # Young Tableaux, §10); a^h_w is its coefficient of S_{w0 w}
    table = er.hessenberg(17, [16] + [17] * 16)
    assert len(table) == 16
    ones = [w for w, c in table.items() if c == 1]
    assert ones == [(16, 17, *range(15, 0, -1)), (*range(17, 2, -1), 1, 2)]
    assert all(c == 0 for w, c in table.items() if w not in ones)


def test_schubert_is_the_sum_over_pipe_dreams():
    # Billey–Jockusch–Stanley (J. Algebraic Combin. 1993): S_w = Σ over reduced
    # pipe dreams of Π x_i over the crosses (i, j)
    for w in ["1432", "2413", "31524", "215364", "1423", "4132"]:
        n = len(w)
        total = {}
        for dream in er.pipe_dreams(w):
            e = [0] * n
            for i, _ in dream:
                e[i - 1] += 1
            total[tuple(e)] = total.get(tuple(e), 0) + 1
        assert er.schubert(w) == total


def test_macdonald_reduced_word_identity():
    # Macdonald, Notes on Schubert Polynomials (1991): Σ_{a in R(w)} a_1 ⋯ a_l = l! S_w(1, ..., 1)
    for w in ["1432", "4321", "2413", "31524"]:
        words = list(er.reduced_words(w))
        lhs = sum(math.prod(a) for a in words)
        l = len(words[0])
        assert lhs == math.factorial(l) * sum(er.schubert(w).values())
        assert len(words) == er.count_reduced_words(w)


def test_monk_in_the_product():
    # Monk's rule: S_{s_k} · S_w = Σ S_{w t_{ab}}, a <= k < b, ℓ raised by one
    def length(w):
        return sum(1 for i in range(len(w)) for j in range(i + 1, len(w)) if w[i] > w[j])

    for w in [(1, 4, 3, 2), (2, 4, 1, 3), (3, 1, 5, 2, 4)]:
        for k in range(1, len(w)):
            m = len(w) + 1
            ww = w + (m,)
            want = {}
            for a in range(k):
                for b in range(k, m):
                    v = list(ww)
                    v[a], v[b] = v[b], v[a]
                    if length(v) == length(ww) + 1:
                        while len(v) > 1 and v[-1] == len(v):
                            v.pop()
                        want[tuple(v)] = 1
            s = list(range(1, k + 2))
            s[k - 1], s[k] = s[k], s[k - 1]
            assert er.product(tuple(s), w) == want


def test_quotient_dimension_is_catalan():
    # Aval–Bergeron–Bergeron (Adv. Math. 2004): dim Q[x1..xn]/J_n = Catalan(n) (OEIS A000108)
    for n in range(1, 8):
        basis = er.quotient_basis(n)
        assert len(basis) == math.comb(2 * n, n) // (n + 1)
        assert all(sum(e[:i]) <= i - 1 for e in basis for i in range(1, n + 1))


def test_expand_round_trip_through_the_polynomial():
    # the expansion of S_w itself is S_w, as dict input and as text
    for w in ["1432", "2413", "312"]:
        s = er.schubert(w)
        n = len(w)
        assert er.expand(s, n, stable=True) == {tuple(int(c) for c in w): 1}
