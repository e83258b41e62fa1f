//! The quasisymmetric quotient Q[x]/J_n checked against published values, against an
//! independent linear-algebra computation of J_n, against Buchberger's criterion, and
//! against the definition of divided symmetrization.
#![allow(clippy::unwrap_used)]

use elbowroom::math::hessenberg::divsym::PostnikovFunctional;
use elbowroom::math::poly::compositions::{compositions, monomials_of_degree};
use elbowroom::math::poly::quasisym::{fundamental_qsym, monomial_qsym, refinements};
use elbowroom::math::quotient::groebner::QuasiGroebner;
use elbowroom::math::quotient::lattice_path::{LatticePath, Step};
use elbowroom::math::quotient::normal_form::{
    divsym_via_quotient, groebner_basis, hilbert_series, normal_form,
};
use elbowroom::math::quotient::standard::is_standard;
use elbowroom::math::{IntPoly, Mono, Perm, RatPoly};
use num_bigint::BigInt;
use num_rational::BigRational;
use num_traits::{One, Zero};
use proptest::prelude::*;
use std::collections::{BTreeMap, HashMap};

fn rat(v: i64) -> BigRational {
    BigRational::from_integer(BigInt::from(v))
}

fn binomial(n: u64, k: u64) -> u64 {
    (0..k).fold(1u64, |acc, i| acc * (n - i) / (i + 1))
}

// ---------------------------------------------------------------- published values

/// Aval, Bergeron, Bergeron (Adv. Math. 2004): dim Q[x_1..x_n]/J_n = Catalan(n);
/// Catalan numbers from OEIS A000108: 1, 1, 2, 5, 14, 42, 132, 429, 1430.
#[test]
fn dimension_is_catalan_a000108() {
    let catalan = [1usize, 1, 2, 5, 14, 42, 132, 429, 1430];
    for (n, &c) in catalan.iter().enumerate().skip(1) {
        assert_eq!(groebner_basis(n).unwrap().basis().len(), c, "n = {n}");
    }
}

/// Aval–Bergeron–Bergeron (2004): the graded dimension in degree k is
/// (n-k)/(n+k)·C(n+k, k). These are the entries of row n-1 of the Catalan triangle,
/// OEIS A009766 (T(m, k) = C(m+k, k)(m-k+1)/(m+1)); rows written out from memory:
/// row 3 = 1, 3, 5, 5 and row 4 = 1, 4, 9, 14, 14, row 7 = 1, 7, 27, 75, 165, 297, 429, 429.
#[test]
fn hilbert_series_is_the_catalan_triangle_a009766() {
    assert_eq!(
        hilbert_series(&groebner_basis(4).unwrap()),
        vec![1, 3, 5, 5]
    );
    assert_eq!(
        hilbert_series(&groebner_basis(5).unwrap()),
        vec![1, 4, 9, 14, 14]
    );
    assert_eq!(
        hilbert_series(&groebner_basis(8).unwrap()),
        vec![1, 7, 27, 75, 165, 297, 429, 429]
    );
    for n in 1..=8u64 {
        let h = hilbert_series(&groebner_basis(n as usize).unwrap());
        assert_eq!(h.len() as u64, n, "the top degree is n - 1");
        for k in 0..n {
            // (n-k)/(n+k)·C(n+k,k), and the A009766 form with m = n - 1
            let abb = (n - k) * binomial(n + k, k) / (n + k);
            assert_eq!((n - k) * binomial(n + k, k) % (n + k), 0);
            let m = n - 1;
            let triangle = binomial(m + k, k) * (m - k + 1) / (m + 1);
            assert_eq!(h[k as usize] as u64, abb, "n = {n}, k = {k}");
            assert_eq!(abb, triangle);
        }
    }
}

/// Aval–Bergeron–Bergeron (2004): the standard monomials are the x^e with
/// e_1 + ... + e_i <= i - 1, i.e. the lattice paths weakly below the diagonal.
/// Here the paths are enumerated independently, as words in E and N, for n <= 8.
#[test]
fn basis_is_the_set_of_paths_below_the_diagonal() {
    for n in 1..=8usize {
        let q = groebner_basis(n).unwrap();
        let mut from_paths: Vec<Vec<u32>> = Vec::new();
        // all words with n E and n N staying weakly below y = x
        fn walk(n: usize, x: usize, y: usize, e: &mut Vec<u32>, out: &mut Vec<Vec<u32>>) {
            if x == n {
                out.push(e.clone());
                return;
            }
            // an east step closes the run of x_{x+1}
            e.push(0);
            walk_run(n, x, y, e, out);
            e.pop();
        }
        fn walk_run(n: usize, x: usize, y: usize, e: &mut Vec<u32>, out: &mut Vec<Vec<u32>>) {
            // the run before east step x+1 sits at abscissa x; north steps keep y <= x
            walk(n, x + 1, y, e, out);
            if y < x {
                *e.last_mut().unwrap() += 1;
                walk_run(n, x, y + 1, e, out);
                *e.last_mut().unwrap() -= 1;
            }
        }
        walk(n, 0, 0, &mut Vec::new(), &mut from_paths);
        let mut basis: Vec<Vec<u32>> = q.basis().iter().map(|m| m.exps(n)).collect();
        basis.sort();
        from_paths.sort();
        assert_eq!(basis, from_paths, "n = {n}");
        for e in &basis {
            let p = LatticePath::of_monomial(e).unwrap();
            let v = p.vertices();
            assert_eq!(v.last(), Some(&(n, n)));
            assert!(v.iter().all(|&(x, y)| y <= x), "{e:?} leaves the region");
            // labels: the north steps of x_i sit at abscissa i - 1
            for (s, w) in p.steps.iter().zip(&v) {
                if let Step::North { var: Some(i) } = s {
                    assert_eq!(w.0, i - 1);
                }
            }
        }
    }
}

// ---------------------------------------------------------------- Gessel (1984)

/// Gessel (1984): F_α = Σ_{β refines α} M_β (F computed directly from index words).
#[test]
fn fundamental_is_sum_of_monomials_over_refinements() {
    for n in 1..=5 {
        for d in 1..=6 {
            for alpha in compositions(d) {
                let f = fundamental_qsym(&alpha, n).unwrap();
                let mut sum = IntPoly::zero(n);
                for beta in refinements(&alpha) {
                    sum = sum.add(&monomial_qsym(&beta, n).unwrap());
                }
                assert_eq!(f, sum, "n = {n}, α = {alpha:?}");
            }
        }
    }
}

/// Quasisymmetry: the coefficient of x^e depends only on the nonzero entries of e, in order.
fn is_quasisymmetric(p: &IntPoly, n: usize) -> bool {
    let mut by_flat: HashMap<Vec<u32>, (BigInt, usize)> = HashMap::new();
    for (m, c) in p.terms() {
        let flat: Vec<u32> = m.exps(n).into_iter().filter(|&x| x > 0).collect();
        let entry = by_flat.entry(flat).or_insert((c.clone(), 0));
        if entry.0 != *c {
            return false;
        }
        entry.1 += 1;
    }
    by_flat
        .iter()
        .all(|(flat, (_, count))| *count as u64 == binomial(n as u64, flat.len() as u64))
}

fn composition_strategy() -> impl Strategy<Value = Vec<u32>> {
    proptest::collection::vec(1u32..4, 1..4)
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(40))]

    /// Gessel (1984): products of quasisymmetric polynomials are quasisymmetric.
    #[test]
    fn products_of_quasisymmetric_are_quasisymmetric(
        a in composition_strategy(), b in composition_strategy(), n in 1usize..6, fund in any::<bool>()
    ) {
        let (p, q) = if fund {
            (fundamental_qsym(&a, n).unwrap(), fundamental_qsym(&b, n).unwrap())
        } else {
            (monomial_qsym(&a, n).unwrap(), monomial_qsym(&b, n).unwrap())
        };
        prop_assert!(is_quasisymmetric(&p, n));
        prop_assert!(is_quasisymmetric(&p.mul(&q).unwrap(), n));
    }

    /// Elements of J_n (a monomial times a generator M_α, or a sum of such) reduce to 0.
    #[test]
    fn ideal_elements_reduce_to_zero(
        n in 1usize..=8, alpha in composition_strategy(),
        shifts in proptest::collection::vec((proptest::collection::vec(0u32..3, 8), -5i64..5), 1..4)
    ) {
        let q = groebner_basis(n).unwrap();
        let g = monomial_qsym(&alpha, n).unwrap();
        let mut f = IntPoly::zero(n);
        for (e, c) in shifts {
            let t = Mono::from_exps(&e[..n]).unwrap();
            f = f.add(&g.mul_term(t, &BigInt::from(c)).unwrap());
        }
        prop_assert!(normal_form(&q, &f).unwrap().poly.is_zero());
    }

    /// The normal form is linear, idempotent, and differs from f by an element of J_n
    /// (checked by reducing f - NF(f) once more).
    #[test]
    fn normal_form_is_linear_and_idempotent(
        n in 2usize..=7,
        a in proptest::collection::vec((proptest::collection::vec(0u32..4, 7), -6i64..6, 1i64..4), 0..12),
        b in proptest::collection::vec((proptest::collection::vec(0u32..4, 7), -6i64..6, 1i64..4), 0..12),
        s in -3i64..4,
    ) {
        let q = groebner_basis(n).unwrap();
        let mk = |t: &[(Vec<u32>, i64, i64)]| RatPoly::from_terms(n, t.iter().map(|(e, p, d)| {
            (Mono::from_exps(&e[..n]).unwrap(), BigRational::new(BigInt::from(*p), BigInt::from(*d)))
        }));
        let (f, g) = (mk(&a), mk(&b));
        let nf = |p: &RatPoly| normal_form(&q, p).unwrap().poly;
        let lhs = nf(&f.add(&g.scale(&rat(s))));
        let rhs = nf(&f).add(&nf(&g).scale(&rat(s)));
        prop_assert_eq!(&lhs, &rhs);
        prop_assert_eq!(nf(&nf(&f)), nf(&f));
        prop_assert!(nf(&f.sub(&nf(&f))).is_zero());
        for (m, _) in nf(&f).terms() {
            prop_assert!(is_standard(&m.exps(n)));
        }
    }
}

// ---------------------------------------------------------------- independent computation

/// J_n in degree d by plain linear algebra over Q: the span of x^b·M_α, |b| + |α| = d,
/// brought to reduced echelon form (pivot = leading monomial, lex).
fn naive_ideal_echelon(n: usize, d: u32) -> BTreeMap<Mono, BTreeMap<Mono, BigRational>> {
    let mut piv: BTreeMap<Mono, BTreeMap<Mono, BigRational>> = BTreeMap::new();
    for j in 1..=d {
        for alpha in compositions(j) {
            if alpha.len() > n {
                continue;
            }
            let g = monomial_qsym(&alpha, n).unwrap();
            for b in monomials_of_degree(n, d - j) {
                let mut row: BTreeMap<Mono, BigRational> = g
                    .terms()
                    .iter()
                    .map(|(m, c)| (Mono(m.0 + b.0), BigRational::from_integer(c.clone())))
                    .collect();
                // reduce by existing pivots, from the largest monomial down
                while let Some((&lead, lc)) = row.iter().rev().find(|(m, _)| piv.contains_key(m)) {
                    let lc = lc.clone();
                    for (m, c) in &piv[&lead] {
                        let e = row.entry(*m).or_insert_with(BigRational::zero);
                        *e -= &lc * c;
                        if e.is_zero() {
                            row.remove(m);
                        }
                    }
                }
                if let Some((&lead, lc)) = row.iter().next_back() {
                    let inv = BigRational::one() / lc.clone();
                    let row: BTreeMap<Mono, BigRational> =
                        row.iter().map(|(m, c)| (*m, c * &inv)).collect();
                    // keep the echelon reduced: clear `lead` from the other pivot rows
                    for other in piv.values_mut() {
                        if let Some(c) = other.get(&lead).cloned() {
                            for (m, v) in &row {
                                let e = other.entry(*m).or_insert_with(BigRational::zero);
                                *e -= &c * v;
                                if e.is_zero() {
                                    other.remove(m);
                                }
                            }
                        }
                    }
                    piv.insert(lead, row);
                }
            }
        }
    }
    piv
}

/// The independent computation agrees for n <= 5: the leading monomials of J_n are exactly
/// the non-standard monomials, every basis element lies in J_n, and normal forms of all
/// monomials agree.
#[test]
fn groebner_basis_agrees_with_plain_linear_algebra() {
    for n in 1..=5usize {
        let q = groebner_basis(n).unwrap();
        let gb = q.polys();
        for d in 1..=n as u32 {
            let piv = naive_ideal_echelon(n, d);
            for m in monomials_of_degree(n, d) {
                assert_eq!(
                    piv.contains_key(&m),
                    !is_standard(&m.exps(n)),
                    "n = {n}, monomial {m:?}"
                );
                // the naive normal form of m: m minus its pivot row (reduced echelon form)
                let naive = match piv.get(&m) {
                    None => RatPoly::monomial(n, m, rat(1)),
                    Some(row) => RatPoly::from_terms(
                        n,
                        row.iter()
                            .filter(|(k, _)| **k != m)
                            .map(|(k, c)| (*k, -c.clone())),
                    ),
                };
                let ours = normal_form(&q, &IntPoly::monomial(n, m, BigInt::one())).unwrap();
                assert_eq!(ours.poly, naive, "n = {n}, monomial {m:?}");
            }
            for g in gb.iter().filter(|g| g.degree() == d) {
                // G lies in J_n: it equals its leading monomial's pivot row
                let (lead, _) = &g.terms()[0];
                let row = &piv[lead];
                let as_poly = RatPoly::from_terms(n, row.iter().map(|(m, c)| (*m, c.clone())));
                assert_eq!(as_poly, g.to_rational(), "n = {n}");
            }
        }
    }
}

/// Multivariate division by a list of polynomials (leading term = first term), written
/// independently of the crate's reduction tables.
fn divide(f: &RatPoly, divisors: &[RatPoly]) -> RatPoly {
    let n = f.nvars();
    let mut rem = RatPoly::zero(n);
    let mut p = f.clone();
    while let Some((lead, c)) = p.terms().first().cloned() {
        match divisors.iter().find(|g| g.terms()[0].0.divides(lead)) {
            Some(g) => {
                let (gl, gc) = &g.terms()[0];
                let t = lead.divided_by(*gl);
                p = p.sub(&g.mul_term(t, &(c / gc)).unwrap());
            }
            None => {
                rem = rem.add(&RatPoly::monomial(n, lead, c.clone()));
                p = p.sub(&RatPoly::monomial(n, lead, c));
            }
        }
    }
    rem
}

/// Buchberger's criterion for n <= 6: every S-polynomial reduces to 0, so the computed set
/// is a Gröbner basis of the ideal it generates; with the generators reducing to 0
/// (checked when the basis is built) that ideal is J_n.
#[test]
fn buchberger_criterion_holds() {
    for n in 1..=6usize {
        let gb: Vec<RatPoly> = groebner_basis(n)
            .unwrap()
            .polys()
            .iter()
            .map(|p| p.to_rational())
            .collect();
        for i in 0..gb.len() {
            for j in i + 1..gb.len() {
                let (a, b) = (gb[i].terms()[0].0, gb[j].terms()[0].0);
                let lcm =
                    Mono::from_exps(&(0..n).map(|k| a.exp(k).max(b.exp(k))).collect::<Vec<_>>())
                        .unwrap();
                if lcm.degree() == a.degree() + b.degree() {
                    continue; // coprime leading terms: the S-pair reduces to 0 (product criterion)
                }
                let s = gb[i]
                    .mul_term(lcm.divided_by(a), &rat(1))
                    .unwrap()
                    .sub(&gb[j].mul_term(lcm.divided_by(b), &rat(1)).unwrap());
                assert!(divide(&s, &gb).is_zero(), "n = {n}: S({a:?}, {b:?})");
            }
        }
        // the generators M_α reduce to 0 under plain division too
        for d in 1..=n as u32 {
            for alpha in compositions(d) {
                let m = monomial_qsym(&alpha, n).unwrap().to_rational();
                assert!(divide(&m, &gb).is_zero(), "n = {n}, α = {alpha:?}");
            }
        }
    }
}

/// The observation quoted in `groebner`'s documentation: for a corner x^{(0^j, α)} whose
/// exponent has no zero after its first nonzero entry, G = F_α(x_{j+1}, ..., x_n).
#[test]
fn corners_without_inner_zeros_give_fundamentals() {
    for n in 1..=6usize {
        let q = groebner_basis(n).unwrap();
        let mut seen = 0;
        for g in q.polys() {
            let e = g.terms()[0].0.exps(n);
            let j = e.iter().position(|&x| x > 0).unwrap();
            let last = e.iter().rposition(|&x| x > 0).unwrap();
            if e[j..=last].contains(&0) {
                continue;
            }
            let alpha: Vec<u32> = e[j..=last].to_vec();
            let f = fundamental_qsym(&alpha, n - j).unwrap();
            let shifted: Vec<usize> = (0..n - j).map(|i| i + j).collect();
            let f = IntPoly::from_terms(n, f.terms().to_vec())
                .rename(&shifted.iter().copied().chain(0..j).collect::<Vec<_>>());
            assert_eq!(g, f, "n = {n}, corner {e:?}");
            seen += 1;
        }
        assert!(seen > 0);
    }
}

// ---------------------------------------------------------------- divided symmetrization

/// DS_n(f) = Σ_{σ ∈ S_n} σ(f / Π (x_i - x_{i+1})) evaluated at the point p (distinct coordinates).
fn divsym_at(f: &RatPoly, n: usize, p: &[BigRational]) -> BigRational {
    let mut total = BigRational::zero();
    for w in Perm::all(n) {
        let q: Vec<BigRational> = (1..=n).map(|i| p[w.at(i) - 1].clone()).collect();
        let mut den = BigRational::one();
        for i in 0..n - 1 {
            den *= &q[i] - &q[i + 1];
        }
        total += f.eval(&q) / den;
    }
    total
}

fn generic_points(n: usize) -> [Vec<BigRational>; 2] {
    [
        (0..n)
            .map(|i| BigRational::new(BigInt::from((i * i + 3 * i + 1) as i64), BigInt::from(7)))
            .collect(),
        (0..n)
            .map(|i| rat(2 * i as i64 - 5) / rat(3) + rat((i % 2) as i64) / rat(11))
            .collect(),
    ]
}

/// DS_n(f) = (-1)^{n-1}·(sum of the coefficients of NF(f)) for every monomial of degree n-1,
/// n <= 6, against the definition evaluated exactly at two generic rational points.
#[test]
fn divided_symmetrization_through_the_quotient_monomials() {
    for n in 1..=6usize {
        let [p1, p2] = generic_points(n);
        for m in monomials_of_degree(n, (n - 1) as u32) {
            let f = RatPoly::monomial(n, m, rat(1));
            let direct = divsym_at(&f, n, &p1);
            if n <= 5 {
                assert_eq!(direct, divsym_at(&f, n, &p2), "DS is a constant");
            }
            assert_eq!(
                divsym_via_quotient(&f, n).unwrap(),
                direct,
                "n = {n}, {m:?}"
            );
        }
    }
}

/// The same identity for a few polynomials with many terms at n = 7.
#[test]
fn divided_symmetrization_through_the_quotient_n7() {
    let n = 7;
    let [p1, _] = generic_points(n);
    let monos = monomials_of_degree(n, 6);
    for seed in 0..3usize {
        let f = RatPoly::from_terms(
            n,
            monos
                .iter()
                .enumerate()
                .filter(|(i, _)| (i * 7 + seed * 13) % 37 == 0)
                .map(|(i, m)| (*m, rat(((i * 31 + seed) % 11) as i64 - 5))),
        );
        assert!(f.len() > 10);
        assert_eq!(
            divsym_via_quotient(&f, n).unwrap(),
            divsym_at(&f, n, &p1),
            "seed {seed}"
        );
    }
}

/// Against the crate's other method, Postnikov's descent formula (`math::hessenberg::divsym`,
/// Postnikov 2009): DS_n(x^a) for every monomial of degree n - 1, n <= 8.
#[test]
fn divided_symmetrization_agrees_with_the_descent_formula() {
    for n in 1..=8usize {
        let ds = PostnikovFunctional::new(n);
        for m in monomials_of_degree(n, (n - 1) as u32) {
            let f = RatPoly::monomial(n, m, rat(1));
            assert_eq!(
                divsym_via_quotient(&f, n).unwrap(),
                rat(ds.value(m)),
                "n = {n}, {m:?}"
            );
        }
    }
}

/// The basis computed without the cache equals the cached one (n = 6).
#[test]
fn fresh_and_cached_bases_agree() {
    let fresh = QuasiGroebner::compute(6, None).unwrap();
    assert_eq!(fresh.polys(), groebner_basis(6).unwrap().polys());
}

/// As stated in `groebner`'s documentation: the tail coefficients of the reduced basis
/// are all 1 for n <= 5, lie in [-1, 1] at n = 6, [-1, 2] at n = 7 and [-2, 3] at n = 8
/// (both ends reached), every tail monomial is standard, and the leading monomials are the
/// corners, Catalan(k - 1) of them ending at x_k (so 1 + 1 + 2 + 5 + ... in all).
#[test]
fn basis_coefficient_ranges_and_leads_are_corners() {
    let catalan = [1usize, 1, 2, 5, 14, 42, 132, 429];
    for n in 1..=8usize {
        let q = groebner_basis(n).unwrap();
        let mut by_last = vec![0usize; n];
        for e in q.elements() {
            let x = e.corner.exps(n);
            assert!(elbowroom::math::quotient::standard::is_corner(&x), "{x:?}");
            by_last[x.iter().rposition(|&a| a > 0).unwrap()] += 1;
            for (m, c) in &e.tail {
                assert!(n >= 7 || *c == 1 || *c == -1, "n = {n}: coefficient {c}");
                assert!(*c != 0);
                assert!(is_standard(&m.exps(n)));
                assert!(*m < e.corner && m.degree() == e.corner.degree());
            }
        }
        assert_eq!(by_last, catalan[..n].to_vec(), "n = {n}");
        // the range of the tail coefficients that `groebner`'s documentation states
        let coefficients = q.elements().iter().flat_map(|e| e.tail.iter().map(|t| t.1));
        let range = (coefficients.clone().min(), coefficients.max());
        let stated = match n {
            1 => (None, None), // G_{x1} = x1: no tail at all
            2..=5 => (Some(1), Some(1)),
            6 => (Some(-1), Some(1)),
            7 => (Some(-1), Some(2)),
            _ => (Some(-2), Some(3)),
        };
        assert_eq!(
            range, stated,
            "n = {n}: smallest and largest tail coefficient"
        );
    }
}
