//! Schubert expansions and structure constants: Monk's rule against the polynomial
//! product, the Littlewood–Richardson and Pieri rules through Grassmannian
//! permutations, laws of the product, and agreement of the expansion methods.
#![allow(clippy::unwrap_used)]

use elbowroom::math::perms::listing::mahonian_row;
use elbowroom::math::poly::parse::{parse_linear_factors, parse_poly};
use elbowroom::math::schubert::expansion::{
    expand_linear_factors, expand_typed, expansion_by_divided_differences, schubert_expansion,
};
use elbowroom::math::schubert::polynomial::SchubertTable;
use elbowroom::math::schubert::product::{product_by_polynomials, schubert_product};
use elbowroom::math::schubert::vector::{LinearForm, PackedPerm, SchubertVector, Space};
use elbowroom::math::{IntPoly, MathError, Mono, Perm, PolyBuilder, Progress, RatPoly};
use num_bigint::BigInt;
use num_rational::BigRational;
use num_traits::{One, Zero};
use proptest::prelude::*;
use std::collections::BTreeMap;

fn go() -> Progress {
    Progress::default()
}

/// Σ c_w S_w multiplied out in `nvars` variables.
fn polynomial_of(v: &SchubertVector<BigInt>, nvars: usize, table: &mut SchubertTable) -> IntPoly {
    let mut b = PolyBuilder::new(nvars);
    for (w, c) in v.iter() {
        let s = table.get(&w.to_minimal_perm());
        b.add_scaled(&s, c);
    }
    b.build()
}

fn terms_of(v: &SchubertVector<BigInt>) -> Vec<(String, i64)> {
    v.sorted_terms()
        .into_iter()
        .map(|(w, c)| (w.to_string(), i64::try_from(c).unwrap()))
        .collect()
}

#[test]
fn lex_smallest_monomial_of_s_w_is_x_to_the_code_with_coefficient_one() {
    // The bottom pipe dream (crosses in columns 1..c_i of row i) has weight x^{code(w)}
    // (Bergeron–Billey 1993, from memory); the claim checked here, on every w in S_6, is
    // that this monomial is the lex-smallest of S_w (x_1 > x_2 > ...) and has coefficient 1.
    let mut table = SchubertTable::new();
    for w in Perm::all(6) {
        let s = table.get(&w);
        let exps: Vec<u32> = w.code().iter().map(|&c| c as u32).collect();
        let code = Mono::from_exps(&exps).unwrap();
        let (smallest, c) = s.terms().last().unwrap();
        assert_eq!(*smallest, code, "w = {w}");
        assert!(c.is_one(), "w = {w}");
    }
}

#[test]
fn monk_rule_on_every_w_in_s6_against_the_polynomial_product() {
    // Monk (1959): x_k S_w = Σ_{j>k} S_{w t_kj} − Σ_{i<k} S_{w t_ik} over length-raising
    // transpositions. The vector from the rule, multiplied out, must be x_k · S_w.
    let mut table = SchubertTable::new();
    let mut terms_seen = 0;
    for w in Perm::all(6) {
        let v = SchubertVector::<BigInt>::basis(Space::Stable, &w).unwrap();
        let flag = SchubertVector::<BigInt>::basis(Space::Flag(6), &w).unwrap();
        for k in 1..=6 {
            let product = v.times_var(k, &go()).unwrap();
            terms_seen += product.len();
            let expected = table
                .get(&w)
                .with_nvars(8)
                .unwrap()
                .mul_term(Mono::var_index(k - 1), &BigInt::one())
                .unwrap();
            assert_eq!(
                polynomial_of(&product, 8, &mut table),
                expected,
                "x{k} S_{w}"
            );
            // in H*(Fl_6) the rule keeps exactly the terms in S_6
            let in_flag = flag.times_var(k, &go()).unwrap();
            assert_eq!(
                in_flag,
                product.to_flag(6).unwrap(),
                "x{k} S_{w} in H*(Fl_6)"
            );
            for (u, _) in product.iter() {
                assert_eq!(u.length(), w.length() + 1);
            }
        }
    }
    assert!(terms_seen > 720 * 6, "the rule produced {terms_seen} terms");
}

#[test]
fn linear_forms_act_by_the_chevalley_form_of_monk() {
    // λ · S_w = Σ_k λ_k x_k S_w: the form's action is the sum of Monk's rule over k.
    let lambda = [3i64, -1, 0, 2, -5];
    let form =
        LinearForm::<BigInt>::new(lambda.iter().map(|&c| BigInt::from(c)).collect()).unwrap();
    for w in Perm::all(5) {
        for space in [Space::Stable, Space::Flag(5)] {
            let v = SchubertVector::<BigInt>::basis(space, &w).unwrap();
            let mut sum = SchubertVector::<BigInt>::zero(space);
            for (k, &c) in lambda.iter().enumerate() {
                sum.add_scaled(&v.times_var(k + 1, &go()).unwrap(), &BigInt::from(c))
                    .unwrap();
            }
            assert_eq!(v.times_linear(&form, &go()).unwrap(), sum, "w = {w}");
            let small = SchubertVector::<i128>::basis(space, &w).unwrap();
            let small_form =
                LinearForm::<i128>::new(lambda.iter().map(|&c| c as i128).collect()).unwrap();
            assert_eq!(
                small.times_linear(&small_form, &go()).unwrap().to_big(),
                sum
            );
        }
    }
}

/// The Grassmannian permutation of a partition λ with at most d parts and its only
/// descent at d: w(i) = i + λ_{d+1−i} for i ≤ d, the other values increasing after d.
/// Then S_w = s_λ(x_1, ..., x_d) (Macdonald, Notes on Schubert polynomials, (4.8), from memory).
fn grassmannian(lambda: &[usize], d: usize) -> Perm {
    assert!(lambda.len() <= d);
    let part = |k: usize| lambda.get(k).copied().unwrap_or(0);
    let mut values: Vec<usize> = (1..=d).map(|i| i + part(d - i)).collect();
    let n = values.last().copied().unwrap_or(0).max(d) + 1;
    for v in 1..=n {
        if !values.contains(&v) {
            values.push(v);
        }
    }
    Perm::from_one_line(&values).unwrap()
}

/// The partition of a Grassmannian permutation with descent at d (inverse of the map above).
fn partition_of(w: &Perm, d: usize) -> Option<Vec<usize>> {
    let line = w.one_line();
    let padded: Vec<usize> = (1..=d.max(line.len()))
        .map(|i| line.get(i - 1).copied().unwrap_or(i))
        .collect();
    if padded
        .windows(2)
        .enumerate()
        .any(|(i, p)| p[0] > p[1] && i + 1 != d)
    {
        return None;
    }
    let mut lambda: Vec<usize> = (1..=d).rev().map(|i| padded[i - 1] - i).collect();
    while lambda.last() == Some(&0) {
        lambda.pop();
    }
    Some(lambda)
}

/// Σ c_ν s_ν for s_λ · s_μ through the Schubert product in d variables.
fn schur_product(lambda: &[usize], mu: &[usize], d: usize) -> BTreeMap<Vec<usize>, i64> {
    let p = schubert_product(
        &grassmannian(lambda, d),
        &grassmannian(mu, d),
        Space::Stable,
        &go(),
    )
    .unwrap();
    let mut out = BTreeMap::new();
    for (w, c) in p.sorted_terms() {
        let nu = partition_of(&w, d).unwrap_or_else(|| panic!("{w} is not Grassmannian at {d}"));
        out.insert(nu, i64::try_from(c).unwrap());
    }
    out
}

/// f^λ, the number of standard Young tableaux, by the hook length formula.
fn tableaux(lambda: &[usize]) -> u64 {
    let size: usize = lambda.iter().sum();
    let mut hooks = 1u64;
    for (i, &row) in lambda.iter().enumerate() {
        for j in 0..row {
            let arm = row - j - 1;
            let leg = lambda[i + 1..].iter().filter(|&&r| r > j).count();
            hooks *= (arm + leg + 1) as u64;
        }
    }
    (1..=size as u64).product::<u64>() / hooks
}

#[test]
fn littlewood_richardson_s21_squared() {
    // s_21 · s_21 = s_42 + s_411 + s_33 + 2 s_321 + s_3111 + s_222 + s_2211 (from memory);
    // in 4 variables no partition has more than 4 parts, so all seven terms survive.
    let got = schur_product(&[2, 1], &[2, 1], 4);
    let expected: BTreeMap<Vec<usize>, i64> = [
        (vec![4, 2], 1),
        (vec![4, 1, 1], 1),
        (vec![3, 3], 1),
        (vec![3, 2, 1], 2),
        (vec![3, 1, 1, 1], 1),
        (vec![2, 2, 2], 1),
        (vec![2, 2, 1, 1], 1),
    ]
    .into_iter()
    .collect();
    assert_eq!(got, expected);
    // the dimension check: Σ c_ν f^ν = C(6,3) f^21 f^21 = 20 · 2 · 2 = 80
    let dims: u64 = got.iter().map(|(nu, &c)| c as u64 * tableaux(nu)).sum();
    assert_eq!(dims, 80);
    assert_eq!(tableaux(&[3, 2, 1]), 16);
    // in 3 variables s_3111 and s_2211 vanish
    let three = schur_product(&[2, 1], &[2, 1], 3);
    assert_eq!(three.len(), 5);
    assert!(!three.contains_key(&vec![3, 1, 1, 1]));
}

/// The μ ⊇ λ with μ/λ a horizontal strip of size k and at most d parts (interlacing
/// μ_1 ≥ λ_1 ≥ μ_2 ≥ λ_2 ≥ ...), by brute force over the rows.
fn horizontal_strips(lambda: &[usize], k: usize, d: usize) -> Vec<Vec<usize>> {
    fn go(
        i: usize,
        lambda: &[usize],
        d: usize,
        left: usize,
        mu: &mut Vec<usize>,
        out: &mut Vec<Vec<usize>>,
    ) {
        if i == d {
            if left == 0 {
                let mut m = mu.clone();
                while m.last() == Some(&0) {
                    m.pop();
                }
                out.push(m);
            }
            return;
        }
        let low = lambda.get(i).copied().unwrap_or(0);
        let high = if i == 0 {
            low + left
        } else {
            lambda.get(i - 1).copied().unwrap_or(0).min(low + left)
        };
        for m in low..=high {
            mu.push(m);
            go(i + 1, lambda, d, left - (m - low), mu, out);
            mu.pop();
        }
    }
    let mut out = Vec::new();
    go(0, lambda, d, k, &mut Vec::new(), &mut out);
    out
}

#[test]
fn pieri_rule_through_grassmannian_permutations() {
    // Pieri: s_k · s_λ = Σ s_μ over μ/λ a horizontal strip of size k (Macdonald,
    // Symmetric functions, (5.16), from memory).
    for (lambda, k, d) in [
        (vec![2, 1], 2, 3),
        (vec![3, 1], 3, 3),
        (vec![2, 2], 1, 3),
        (vec![1], 4, 3),
        (vec![3, 2, 1], 2, 4),
        (vec![], 3, 2),
    ] {
        let got = schur_product(&[k], &lambda, d);
        let expected: BTreeMap<Vec<usize>, i64> = horizontal_strips(&lambda, k, d)
            .into_iter()
            .map(|m| (m, 1))
            .collect();
        assert!(!expected.is_empty());
        assert_eq!(got, expected, "s_{k} · s_{lambda:?} in {d} variables");
    }
}

#[test]
fn every_structure_constant_of_s5_is_a_nonnegative_integer() {
    // A fact of the trade (c^w_uv counts points of a transverse intersection).
    let all: Vec<Perm> = Perm::all(5).collect();
    let mut nonzero = 0usize;
    for (i, u) in all.iter().enumerate() {
        for v in &all[i..] {
            let p = schubert_product(u, v, Space::Flag(5), &go()).unwrap();
            for (w, c) in p.sorted_terms() {
                assert!(c > BigInt::zero(), "c^{w}_{{{u},{v}}} = {c}");
                assert_eq!(w.length(), u.length() + v.length());
                nonzero += 1;
            }
        }
    }
    assert!(nonzero > 1000, "{nonzero} nonzero constants");
    // stably, for the u, v of S_5 whose products fit S_16
    for u in all.iter().step_by(7) {
        for v in all.iter().step_by(5) {
            match schubert_product(u, v, Space::Stable, &go()) {
                Ok(p) => assert!(p.sorted_terms().iter().all(|(_, c)| *c > BigInt::zero())),
                Err(MathError::OutOfRange(_)) => {}
                Err(e) => panic!("{u} {v}: {e}"),
            }
        }
    }
}

#[test]
fn fast_product_equals_the_polynomial_product() {
    for u in Perm::all(4) {
        for v in Perm::all(4) {
            for space in [Space::Stable, Space::Flag(4), Space::Flag(5)] {
                let fast = schubert_product(&u, &v, space, &go()).unwrap();
                let naive = product_by_polynomials(&u, &v, space, &go()).unwrap();
                assert_eq!(fast, naive, "S_{u} S_{v} in {space:?}");
            }
        }
    }
    // two longer ones in S_6
    for (u, v) in [("264153", "315264"), ("532614", "351624")] {
        let (u, v) = (Perm::parse(u).unwrap(), Perm::parse(v).unwrap());
        let fast = schubert_product(&u, &v, Space::Flag(6), &go()).unwrap();
        assert_eq!(
            fast,
            product_by_polynomials(&u, &v, Space::Flag(6), &go()).unwrap()
        );
    }
}

#[test]
fn identity_is_the_unit_and_known_small_products() {
    let id = Perm::identity(1);
    for w in Perm::all(4) {
        let p = schubert_product(&id, &w, Space::Stable, &go()).unwrap();
        assert_eq!(p, SchubertVector::basis(Space::Stable, &w).unwrap());
        let q = schubert_product(&w, &Perm::identity(4), Space::Flag(4), &go()).unwrap();
        assert_eq!(q, SchubertVector::basis(Space::Flag(4), &w).unwrap());
    }
    // (x_1 + x_2)^2 = x_1^2 + 2 x_1 x_2 + x_2^2 = S_{231} + S_{1423} (S_{1423} = h_2(x_1, x_2))
    let s132 = Perm::parse("132").unwrap();
    let p = schubert_product(&s132, &s132, Space::Stable, &go()).unwrap();
    assert_eq!(
        terms_of(&p),
        vec![("1423".to_string(), 1), ("231".to_string(), 1)]
    );
    // in H*(Fl_n) the top class times anything of positive degree is 0
    let w0 = Perm::longest(4);
    let p = schubert_product(&w0, &Perm::parse("2134").unwrap(), Space::Flag(4), &go()).unwrap();
    assert!(p.is_empty());
    // refused, with a reason, before the work
    let e =
        schubert_product(&Perm::parse("12354").unwrap(), &w0, Space::Flag(4), &go()).unwrap_err();
    assert!(e.to_string().contains("S_4"), "{e}");
    let big = Perm::longest(9);
    let e = schubert_product(&big, &big, Space::Stable, &go()).unwrap_err();
    assert!(matches!(e, MathError::OutOfRange(_)), "{e}");
}

fn perm_of_s(n: usize) -> impl Strategy<Value = Perm> {
    let total: usize = (1..=n).product();
    (0..total).prop_map(move |mut r| {
        // the r-th permutation in the factorial number system
        let mut left: Vec<usize> = (1..=n).collect();
        let mut line = Vec::with_capacity(n);
        for k in (1..=n).rev() {
            let f: usize = (1..k).product();
            line.push(left.remove(r / f));
            r %= f;
        }
        Perm::from_one_line(&line).unwrap()
    })
}

/// (Σ c_x S_x) · S_w, by the product of basis elements.
fn times_basis(v: &SchubertVector<BigInt>, w: &Perm) -> SchubertVector<BigInt> {
    let space = v.space();
    let mut out = SchubertVector::zero(space);
    for (x, c) in v.iter() {
        let n = match space {
            Space::Flag(n) => n,
            Space::Stable => x.support(),
        };
        let p = schubert_product(&x.to_perm(n).unwrap(), w, space, &go()).unwrap();
        out.add_scaled(&p, c).unwrap();
    }
    out
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(24))]

    #[test]
    fn the_product_commutes_and_associates_in_h_fl5(u in perm_of_s(5), v in perm_of_s(5), w in perm_of_s(5)) {
        let space = Space::Flag(5);
        let uv = schubert_product(&u, &v, space, &go()).unwrap();
        prop_assert_eq!(&uv, &schubert_product(&v, &u, space, &go()).unwrap());
        let vw = schubert_product(&v, &w, space, &go()).unwrap();
        let left = times_basis(&uv, &w);
        // S_u (S_v S_w) = (S_v S_w) S_u by commutativity of basis products
        let right = times_basis(&vw, &u);
        prop_assert_eq!(left, right);
    }

    #[test]
    fn the_stable_product_commutes_and_associates(u in perm_of_s(4), v in perm_of_s(4), w in perm_of_s(4)) {
        prop_assume!(u.length() + v.length() + w.length() <= 9);
        let uv = schubert_product(&u, &v, Space::Stable, &go()).unwrap();
        prop_assert_eq!(&uv, &schubert_product(&v, &u, Space::Stable, &go()).unwrap());
        let vw = schubert_product(&v, &w, Space::Stable, &go()).unwrap();
        prop_assert_eq!(times_basis(&uv, &w), times_basis(&vw, &u));
        // and the fast product agrees with the polynomial one
        prop_assert_eq!(&uv, &product_by_polynomials(&u, &v, Space::Stable, &go()).unwrap());
    }
}

#[test]
fn each_s_w_expands_to_itself() {
    let mut table = SchubertTable::new();
    for w in Perm::all(5) {
        let f = table.get(&w).to_rational();
        let stable = schubert_expansion(&f, Space::Stable, &go()).unwrap();
        let minimal = w.restrict(w.support_size()).unwrap();
        assert_eq!(stable.terms, vec![(minimal, BigRational::one())], "w = {w}");
        let flag = schubert_expansion(&f, Space::Flag(5), &go()).unwrap();
        assert_eq!(flag.terms, vec![(w.clone(), BigRational::one())], "w = {w}");
        assert_eq!(
            expansion_by_divided_differences(&f, Space::Flag(5), &go()).unwrap(),
            flag
        );
    }
}

#[test]
fn stable_and_flag_expansions_are_related_by_the_ideal() {
    // e_k(x_1..x_n) lies in I_n: its class in H*(Fl_n) is 0, while stably it is a sum of S_w
    // with w outside S_n (e_k(x_1..x_n) = S_w for w the cycle with one descent at n, from memory:
    // checked here only through the relation, not the value).
    for n in 2..=5 {
        for k in 1..=n {
            let mut b = PolyBuilder::new(n);
            let one = BigRational::one();
            for subset in 0u32..(1 << n) {
                if subset.count_ones() as usize == k {
                    let exps: Vec<u32> = (0..n).map(|i| (subset >> i) & 1).collect();
                    b.add_term(Mono::from_exps(&exps).unwrap(), &one);
                }
            }
            let e: RatPoly = b.build();
            let stable = schubert_expansion(&e, Space::Stable, &go()).unwrap();
            assert!(!stable.is_empty());
            assert!(stable.terms.iter().all(|(w, _)| w.support_size() > n));
            assert!(
                schubert_expansion(&e, Space::Flag(n), &go())
                    .unwrap()
                    .is_empty()
            );
            assert!(
                expansion_by_divided_differences(&e, Space::Flag(n), &go())
                    .unwrap()
                    .is_empty()
            );
        }
    }
    // a polynomial whose stable expansion would leave S_16 still has a class in H*(Fl_4)
    let f = parse_poly("x4^13 + x1 x2", Some(4)).unwrap();
    assert!(schubert_expansion(&f, Space::Stable, &go()).is_err());
    let flag = schubert_expansion(&f, Space::Flag(4), &go()).unwrap();
    let x1x2 = schubert_expansion(
        &parse_poly("x1 x2", Some(4)).unwrap(),
        Space::Flag(4),
        &go(),
    )
    .unwrap();
    assert_eq!(flag, x1x2, "x4^13 lies in I_4 (degree above 6)");
}

fn small_poly() -> impl Strategy<Value = RatPoly> {
    let term = (proptest::collection::vec(0u32..3, 4), -6i64..7, 1i64..4);
    proptest::collection::vec(term, 0..6).prop_map(|terms| {
        let mut b = PolyBuilder::new(4);
        for (e, num, den) in terms {
            b.add_term(
                Mono::from_exps(&e).unwrap(),
                &BigRational::new(num.into(), den.into()),
            );
        }
        b.build()
    })
}

fn linear_product_text() -> impl Strategy<Value = String> {
    let form = proptest::collection::vec(-2i64..3, 4);
    proptest::collection::vec((form, 1u32..3), 1..4).prop_map(|factors| {
        factors
            .iter()
            .map(|(c, e)| {
                let body: Vec<String> = c
                    .iter()
                    .enumerate()
                    .map(|(i, a)| format!("({a})x{}", i + 1))
                    .collect();
                format!("({})^{e}", body.join(" + "))
            })
            .collect::<Vec<_>>()
            .join(" ")
    })
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(32))]

    #[test]
    fn peeling_and_divided_differences_agree(f in small_poly()) {
        for space in [Space::Stable, Space::Flag(4), Space::Flag(5)] {
            let peel = schubert_expansion(&f, space, &go()).unwrap();
            let dd = expansion_by_divided_differences(&f, space, &go()).unwrap();
            prop_assert_eq!(&peel, &dd);
        }
        let stable = schubert_expansion(&f, Space::Stable, &go()).unwrap();
        prop_assert_eq!(stable.to_polynomial(8).unwrap(), f.with_nvars(8).unwrap());
        prop_assert_eq!(stable.to_flag(4).unwrap(), schubert_expansion(&f, Space::Flag(4), &go()).unwrap());
    }

    #[test]
    fn products_of_linear_forms_through_monk_agree_with_peeling(text in linear_product_text()) {
        let product = parse_linear_factors(&text, Some(4)).unwrap().unwrap();
        let f = product.expand().unwrap();
        prop_assert_eq!(parse_poly(&text, Some(4)).unwrap(), f.clone());
        for space in [Space::Stable, Space::Flag(4), Space::Flag(6)] {
            let monk = expand_linear_factors(&product, space, &go()).unwrap();
            prop_assert_eq!(monk, schubert_expansion(&f, space, &go()).unwrap());
        }
    }
}

#[test]
fn typed_products_of_linear_forms_are_recognized() {
    for (text, factors, scalar) in [
        ("(x1-x3)(x2-x4)^2", 2, "1"),
        ("-2 x1 (x1 + x2/2)^3 / 3", 2, "-2/3"),
        ("x1 x2 x3", 3, "1"),
        ("((x1 - x2)^2 (x3 + 1))^2", 2, "1"),
        ("3", 0, "3"),
        ("(2 + 1)(x1 - x2)", 1, "3"),
    ] {
        let p = parse_linear_factors(text, Some(4))
            .unwrap()
            .unwrap_or_else(|| panic!("{text}"));
        assert_eq!(p.factors.len(), factors, "{text}");
        assert_eq!(p.scalar.to_string(), scalar, "{text}");
        assert_eq!(
            p.expand().unwrap(),
            parse_poly(text, Some(4)).unwrap(),
            "{text}"
        );
    }
    for text in [
        "x1 + x2",
        "(x1 + x2)(x1 x2 - 1)",
        "x1^2 - x2",
        "M(2,1)",
        "(x1 - x2) + 0",
    ] {
        assert!(
            parse_linear_factors(text, Some(4)).unwrap().is_none(),
            "{text}"
        );
    }
    for text in ["x5 (x1 - x2)", "(x1 - ", "x1 ** x2", ""] {
        assert!(parse_linear_factors(text, Some(4)).is_err(), "{text}");
    }
}

#[test]
fn typed_expansions_take_either_path_and_agree() {
    // the class Δ = Π_{i<j} (x_i − x_j) is n! times the class of a point (common practice)
    let delta = "(x1-x2)(x1-x3)(x1-x4)(x2-x3)(x2-x4)(x3-x4)";
    let e = expand_typed(delta, 4, false, &go()).unwrap();
    assert_eq!(
        e.terms,
        vec![(Perm::longest(4), BigRational::from_integer(24.into()))]
    );
    let multiplied = parse_poly(delta, Some(4)).unwrap().to_text();
    assert_eq!(expand_typed(&multiplied, 4, false, &go()).unwrap(), e);
    assert_eq!(
        expand_typed(delta, 4, true, &go()).unwrap(),
        expand_typed(&multiplied, 4, true, &go()).unwrap()
    );
    assert!(expand_typed(delta, 4, true, &go()).unwrap().len() > 1);
    // a variable beyond x_N is refused
    assert!(expand_typed("x5", 4, false, &go()).is_err());
    assert!(expand_typed("(x1 - x5)^2", 4, true, &go()).is_err());
}

#[test]
fn sizes_follow_the_mahonian_numbers() {
    // OEIS A008302, row 5: 1 4 9 15 20 22 20 15 9 4 1
    assert_eq!(mahonian_row(5), vec![1, 4, 9, 15, 20, 22, 20, 15, 9, 4, 1]);
    assert_eq!(mahonian_row(10).iter().sum::<u128>(), 3_628_800);
    // the packed key does not depend on the S_n that holds w
    let w = Perm::parse("3142").unwrap();
    assert_eq!(
        PackedPerm::from_perm(&w),
        PackedPerm::from_perm(&w.embed(16).unwrap())
    );
    // the identity's stable expansion is written [1]
    let one = expand_typed("1", 3, true, &go()).unwrap();
    assert_eq!(one.terms, vec![(Perm::identity(1), BigRational::one())]);
}
