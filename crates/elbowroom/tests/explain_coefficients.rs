//! Why a_w is what it is: the reduced-word formula, the monomial route, the rules,
//! the symmetries and the cyclic sum, the principal specialization and its q-identity,
//! and the q-deformed mixed Eulerian numbers A_c(q) of K_n(q), each checked against
//! something outside the formula being tested (sources named beside each check).
#![allow(clippy::unwrap_used)]

use elbowroom::math::explain::explanation::explain;
use elbowroom::math::explain::formula::{is_parking, word_formula};
use elbowroom::math::explain::monomials::{coefficient_by_monomials, monomial_value};
use elbowroom::math::explain::qvalue::q_coefficient;
use elbowroom::math::explain::rules::{Rule, tableau_descents, tableaux_with_descents};
use elbowroom::math::explain::symmetry::{
    conjugate_by_longest, cyclic_orbit, transpose_hessenberg,
};
use elbowroom::math::hessenberg::coefficients::coefficient_table;
use elbowroom::math::hessenberg::divsym::divided_symmetrize;
use elbowroom::math::hessenberg::function::HessenbergFn;
use elbowroom::math::perms::words::{
    content, count_reduced_words, counts_by_content_and_comaj_with, reduced_words,
};
use elbowroom::math::permutohedra::mixed_eulerian::mixed_eulerian_numbers;
use elbowroom::math::permutohedra::remixed::{mixed_eulerian_at_one, remixed_eulerian};
use elbowroom::math::pipes::dream::count_pipe_dreams;
use elbowroom::math::poly::compositions::weak_compositions;
use elbowroom::math::poly::qpoly::QPoly;
use elbowroom::math::schubert::polynomial::schubert;
use elbowroom::math::schubert::principal::principal_specialization;
use elbowroom::math::{Perm, Progress};
use num_bigint::{BigInt, BigUint};
use num_rational::BigRational;
use num_traits::{One, Zero};
use std::collections::HashMap;

fn go() -> Progress {
    Progress::default()
}

fn p(s: &str) -> Perm {
    Perm::parse(s).unwrap()
}

fn q(v: &[i64]) -> QPoly {
    QPoly::from_coeffs(v.iter().map(|&c| BigInt::from(c)).collect())
}

/// The permutohedral table a_w (h(i) = i + 1) by the class method of the Hessenberg view.
fn class_table(n: usize) -> HashMap<Perm, BigInt> {
    let h = HessenbergFn::default_for(n).unwrap();
    let t = coefficient_table(&h, &|_| true, &go()).unwrap();
    t.entries.into_iter().map(|e| (e.perm, e.value)).collect()
}

#[test]
fn worked_example_1432() {
    // Nadeau–Tewari (IMRN 2023), worked in the statement of the formula: Red(1432) =
    // {232, 323}, contents (0,2,1), (0,1,2), (A_021 + A_012)/3! = (4 + 2)/6 = 1
    let f = word_formula(&p("1432"), &go()).unwrap();
    let rows: Vec<(Vec<usize>, String, String)> = f
        .shares
        .iter()
        .map(|s| {
            (
                s.content.clone(),
                s.words.to_string(),
                s.eulerian.to_string(),
            )
        })
        .collect();
    assert_eq!(
        rows,
        vec![
            (vec![0, 2, 1], "1".into(), "4".into()),
            (vec![0, 1, 2], "1".into(), "2".into())
        ]
    );
    assert_eq!(f.value, BigRational::one());
}

#[test]
fn reduced_word_formula_equals_the_class_method_up_to_n_9() {
    // Nadeau–Tewari, IMRN 2023 (arXiv 2005.12194): a_w = (1/(n−1)!) Σ_{a ∈ Red(w)} A_{c(a)},
    // against the class of the permutohedral variety expanded by Monk's rule
    // (Anderson–Tymoczko 2010), for every w with ℓ(w) = n − 1.
    let top = 9;
    for n in 2..=top {
        let table = class_table(n);
        let mut checked = 0;
        for (w, value) in &table {
            let f = word_formula(w, &go()).unwrap();
            assert_eq!(f.value, BigRational::from(value.clone()), "w = {w}");
            assert_eq!(f.total, value * &f.factorial, "w = {w}");
            checked += 1;
        }
        // the w of length n − 1 number the Mahonian number T(n, n−1) (OEIS A008302),
        // the coefficient of q^{n−1} in [n]_q! (Rodrigues)
        let mahonian = QPoly::q_factorial(n).coeffs()[n - 1].clone();
        assert_eq!(BigInt::from(checked), mahonian, "n = {n}");
    }
}

#[test]
fn monomial_route_is_divided_symmetrization() {
    // Postnikov (IMRN 2009), DS_n(x^c) = (−1)^{|S|} β_n(S) (from memory), against the
    // definition of DS_n evaluated by the fast divided symmetrization, for every
    // monomial of degree n − 1, n ≤ 6; and a_w by monomials = a_w by words, n ≤ 7.
    for n in 2..=6 {
        let h = HessenbergFn::default_for(n).unwrap();
        for e in weak_compositions((n - 1) as u32, n) {
            let mono = elbowroom::math::Mono::from_exps(&e).unwrap();
            let f = elbowroom::math::RatPoly::from_terms(n, vec![(mono, BigRational::one())]);
            let ds = divided_symmetrize(&f, &h).unwrap();
            let v = monomial_value(&e).unwrap();
            assert_eq!(
                ds.value
                    .coeff(elbowroom::math::Mono::from_exps(&vec![0; n]).unwrap()),
                BigRational::from(BigInt::from(v.value)),
                "x^{e:?}"
            );
        }
    }
    for n in 2..=7 {
        for (w, value) in class_table(n) {
            let s = schubert(&w);
            let (rows, total) = coefficient_by_monomials(&w, &s).unwrap();
            assert_eq!(total, value, "w = {w}");
            assert_eq!(rows.len(), s.len());
        }
    }
}

#[test]
fn rules_give_the_value_where_they_apply() {
    // each rule against the formula; the Grassmannian rule's tableaux against the hook
    // length formula f^λ = |λ|!/Π hooks (Frame–Robinson–Thrall 1954), summed over descents
    let mut seen: HashMap<&str, usize> = HashMap::new();
    for n in 2..=7 {
        for (w, value) in class_table(n) {
            let e = explain(&w, &go()).unwrap();
            for r in &e.rules {
                assert_eq!(r.value(), value, "{} at w = {w}", r.name());
                *seen.entry(r.name()).or_default() += 1;
                match r {
                    Rule::Parking { pipe_dreams } => {
                        assert!(e.formula.shares.iter().all(|s| is_parking(&s.content)));
                        let at_one = principal_specialization(&schubert(&w)).at_one();
                        assert_eq!(BigInt::from(pipe_dreams.clone()), at_one);
                    }
                    Rule::Grassmannian {
                        shape,
                        tableaux,
                        descent,
                        count,
                    } => {
                        let all: BigUint = (0..n)
                            .map(|d| tableaux_with_descents(shape, d, &go()).unwrap().0)
                            .sum();
                        assert_eq!(all, hook_length(shape), "λ = {shape:?}");
                        assert_eq!(BigUint::from(tableaux.len()), *count);
                        for t in tableaux {
                            assert_eq!(tableau_descents(t).len(), descent - 1);
                        }
                    }
                    Rule::Coxeter { reduced_words } => {
                        assert_eq!(*reduced_words, count_reduced_words(&w).unwrap());
                    }
                }
            }
        }
    }
    for name in ["parking", "grassmannian", "coxeter"] {
        assert!(
            seen.get(name).copied().unwrap_or(0) > 10,
            "{name}: {seen:?}"
        );
    }
}

fn hook_length(shape: &[usize]) -> BigUint {
    let size: usize = shape.iter().sum();
    let mut hooks = BigUint::one();
    for (i, &row) in shape.iter().enumerate() {
        for j in 0..row {
            let below = shape[i + 1..].iter().filter(|&&r| r > j).count();
            hooks *= BigUint::from(row - j + below);
        }
    }
    (1..=size).map(BigUint::from).product::<BigUint>() / hooks
}

#[test]
fn symmetries_and_the_cyclic_sum_up_to_n_8() {
    // a_w = a_{w^{-1}} = a_{w0 w w0}, and Σ_j a_{w^{(j)}} = |Red(w)| (from the formula and
    // the cyclic sum of mixed Eulerian numbers, Postnikov IMRN 2009 §16), n ≤ 8,
    // every value read from the class method
    let top = 8;
    for n in 2..=top {
        let table = class_table(n);
        for (w, value) in &table {
            assert_eq!(table[&w.inverse()], *value, "w = {w}");
            assert_eq!(table[&conjugate_by_longest(w)], *value, "w = {w}");
            let orbit = cyclic_orbit(w).unwrap();
            assert_eq!(orbit[0].1, *w);
            let sum: BigInt = orbit.iter().map(|(_, u)| table[u].clone()).sum();
            let words = BigInt::from(count_reduced_words(w).unwrap());
            assert_eq!(sum, words, "w = {w}");
            // the shifted words are exactly the reduced words of w^{(j)}
            for (j, u) in &orbit {
                let shifted: Vec<Vec<usize>> = reduced_words(w)
                    .map(|a| a.iter().map(|x| (x + j) % n).collect())
                    .collect();
                let mut mine: Vec<Vec<usize>> = reduced_words(u).collect();
                let mut theirs = shifted;
                mine.sort();
                theirs.sort();
                assert_eq!(mine, theirs, "w = {w}, j = {j}");
            }
        }
    }
    // the example: 1432 (letters {2, 3}) and 3214 = 121 shifted
    let orbit = cyclic_orbit(&p("1432")).unwrap();
    assert_eq!(orbit, vec![(0, p("1432")), (3, p("3214"))]);
}

#[test]
fn other_h_by_the_transpose() {
    // a^h_w = a^{h*}_{w0 w w0}, h* the transpose of h in the antidiagonal, every h, n ≤ 7
    // values from the class method for both sides
    let top = 7;
    for n in 1..=top {
        for h in HessenbergFn::all(n) {
            let star = transpose_hessenberg(&h).unwrap();
            assert_eq!(transpose_hessenberg(&star).unwrap(), h);
            let a = coefficient_table(&h, &|_| true, &go()).unwrap();
            let b: HashMap<Perm, BigInt> = coefficient_table(&star, &|_| true, &go())
                .unwrap()
                .entries
                .into_iter()
                .map(|e| (e.perm, e.value))
                .collect();
            for e in &a.entries {
                assert_eq!(
                    b[&conjugate_by_longest(&e.perm)],
                    e.value,
                    "h = {h}, w = {}",
                    e.perm
                );
            }
        }
    }
}

fn comaj(a: &[usize]) -> usize {
    (1..a.len()).filter(|&i| a[i - 1] < a[i]).sum()
}

#[test]
fn principal_specialization_and_the_q_identity_up_to_n_6() {
    // worked values: S_1432(1, q, q², …) = q + 2q² + q³ + q⁴; S_2413 = S_3142 there = q + q²
    // (from S_1432 and S_2413 = x1² x2 + x1 x2², S_3142 = x1² x2 + x1² x3, Macdonald's table)
    assert_eq!(
        principal_specialization(&schubert(&p("1432"))),
        q(&[0, 1, 2, 1, 1])
    );
    assert_eq!(
        principal_specialization(&schubert(&p("2413"))),
        q(&[0, 1, 1])
    );
    assert_eq!(
        principal_specialization(&schubert(&p("3142"))),
        q(&[0, 1, 1])
    );
    // Fomin–Stanley: Σ_a q^{comaj(a)} [a_1]_q ⋯ [a_l]_q = [l]_q! S_w(1, q, q², …), and at q = 1
    // Macdonald's identity Σ_a a_1 ⋯ a_l = l! S_w(1, …, 1) (Notes on Schubert Polynomials,
    // 1991), for every w with n ≤ 6: words listed one by one for n ≤ 5, and for n = 6
    // through the distribution by (content, comaj), itself checked against the listing
    for n in 1..=6 {
        for w in Perm::all(n) {
            let l = w.length();
            let by = counts_by_content_and_comaj_with(&w, &go()).unwrap();
            let mut left = QPoly::default();
            for (c, by_comaj) in &by {
                let mut term =
                    QPoly::from_coeffs(by_comaj.iter().map(|&k| BigInt::from(k)).collect());
                for (i, &e) in c.iter().enumerate() {
                    for _ in 0..e {
                        term = term.mul(&QPoly::q_integer(i + 1));
                    }
                }
                left = left.add(&term);
            }
            if n <= 5 {
                let mut listed: HashMap<Vec<usize>, Vec<u64>> = HashMap::new();
                let mut at_one = BigInt::zero();
                for a in reduced_words(&w) {
                    let entry = listed.entry(content(&a, n)).or_default();
                    let k = comaj(&a);
                    if entry.len() <= k {
                        entry.resize(k + 1, 0);
                    }
                    entry[k] += 1;
                    at_one += a.iter().map(|&x| BigInt::from(x)).product::<BigInt>();
                }
                let by_map: HashMap<Vec<usize>, Vec<u64>> = by.clone().into_iter().collect();
                assert_eq!(listed, by_map, "w = {w}");
                let factorial: BigInt = (1..=l).map(BigInt::from).product();
                assert_eq!(
                    at_one,
                    factorial * BigInt::from(count_pipe_dreams(&w)),
                    "w = {w}"
                );
            }
            let principal = principal_specialization(&schubert(&w));
            assert_eq!(left, QPoly::q_factorial(l).mul(&principal), "w = {w}");
            assert_eq!(
                left.at_one(),
                QPoly::q_factorial(l).at_one() * principal.at_one()
            );
        }
    }
}

#[test]
fn remixed_numbers_satisfy_the_relations_of_k_n_q() {
    // The relations (1+q) u_i² = q u_{i−1} u_i + u_i u_{i+1} (u_0 = u_n = 0) on every monomial
    // of degree n − 3, with A_{(n−1,0,…,0)}(q) = 1: in the one-dimensional top degree these
    // determine every A_c(q) (a brute-force normal form), n ≤ 7.
    for n in 3..=7 {
        let m = n - 1;
        let mut value: HashMap<Vec<u32>, QPoly> = HashMap::new();
        for c in weak_compositions(m as u32, m) {
            value.insert(c.clone(), remixed_eulerian(&c).unwrap());
        }
        let mut first = vec![0u32; m];
        first[0] = m as u32;
        assert_eq!(value[&first], q(&[1]));
        let one_plus_q = q(&[1, 1]);
        let q1 = q(&[0, 1]);
        let mut relations = 0;
        for base in weak_compositions((m - 2) as u32, m) {
            for i in 0..m {
                let with = |a: usize, b: usize| {
                    let mut c = base.clone();
                    c[a] += 1;
                    c[b] += 1;
                    value[&c].clone()
                };
                let left = one_plus_q.mul(&with(i, i));
                let mut right = QPoly::default();
                if i > 0 {
                    right = right.add(&q1.mul(&with(i - 1, i)));
                }
                if i + 1 < m {
                    right = right.add(&with(i, i + 1));
                }
                assert_eq!(left, right, "n = {n}, base {base:?}, i = {}", i + 1);
                relations += 1;
            }
        }
        assert!(relations > 0);
    }
}

#[test]
fn remixed_numbers_properties_up_to_n_8() {
    // A_c(1) = A_c (Postnikov's mixed Eulerian numbers, the walk of the permutohedra view);
    // palindromic, unimodal, nonnegative; Π [i]_q^{c_i} for parking c; A_{(1,…,1)}(q) = [n−1]_q!
    // (these are the properties of the remixed Eulerian numbers, Nadeau–Tewari 2023)
    let top = 8;
    for n in 2..=top {
        for (c, a) in mixed_eulerian_numbers(n, &go()).unwrap() {
            let aq = remixed_eulerian(&c).unwrap();
            assert_eq!(aq.at_one(), a, "c = {c:?}");
            assert_eq!(mixed_eulerian_at_one(&c).unwrap(), a, "c = {c:?}");
            assert!(
                aq.is_nonnegative() && aq.is_palindromic() && aq.is_unimodal(),
                "{c:?}: {aq}"
            );
            let cu: Vec<usize> = c.iter().map(|&x| x as usize).collect();
            if is_parking(&cu) {
                let product = c.iter().enumerate().fold(q(&[1]), |acc, (i, &e)| {
                    (0..e).fold(acc, |acc, _| acc.mul(&QPoly::q_integer(i + 1)))
                });
                assert_eq!(aq, product, "c = {c:?}");
            }
        }
        assert_eq!(
            remixed_eulerian(&vec![1; n - 1]).unwrap(),
            QPoly::q_factorial(n - 1)
        );
    }
}

#[test]
fn q_coefficient_worked_values_and_properties() {
    // n = 4, from the definition: a_1432(q) = q², a_2341 = q³, a_2413 = a_3142 = q + q²,
    // a_3214 = q, a_4123 = 1
    for (w, v) in [
        ("1432", q(&[0, 0, 1])),
        ("2341", q(&[0, 0, 0, 1])),
        ("2413", q(&[0, 1, 1])),
        ("3142", q(&[0, 1, 1])),
        ("3214", q(&[0, 1])),
        ("4123", q(&[1])),
    ] {
        assert_eq!(
            q_coefficient(&p(w), &go()).unwrap().value,
            Some(v),
            "w = {w}"
        );
    }
}

/// What holds of a_w(q) for every w with ℓ(w) = n − 1, n ≤ `top`: a_w(1) = a_w; a
/// polynomial with nonnegative integer coefficients (the exceptions returned); equal to
/// S_w(1, q, …) when every reduced word is a parking word; and equal to the functional
/// of K_n(q) applied to S_w(u_1, u_2 − u_1, …, −u_{n−1}).
fn q_survey(top: usize) -> Vec<String> {
    let mut exceptions = Vec::new();
    for n in 2..=top {
        for (w, value) in class_table(n) {
            let a = q_coefficient(&w, &go()).unwrap();
            let Some(v) = a.value else {
                exceptions.push(format!("{w}: not a polynomial"));
                continue;
            };
            assert_eq!(v.at_one(), value, "w = {w}");
            if !v.is_nonnegative() {
                exceptions.push(format!("{w}: {v}"));
            }
            let f = word_formula(&w, &go()).unwrap();
            if f.all_parking() {
                assert_eq!(v, principal_specialization(&schubert(&w)), "w = {w}");
            }
            if n <= 6 {
                assert_eq!(v, functional_of_schubert(&w), "w = {w}");
            }
        }
    }
    exceptions
}

/// Σ_c [u^c] S_w(u_1, u_2 − u_1, …, u_{n−1} − u_{n−2}, −u_{n−1}) · A_c(q).
fn functional_of_schubert(w: &Perm) -> QPoly {
    use elbowroom::math::{IntPoly, Mono};
    let n = w.n();
    let m = n - 1;
    let u = |i: usize| IntPoly::var_index(m, i);
    let x: Vec<IntPoly> = (0..n)
        .map(|i| match (i, i == m) {
            (0, _) => u(0),
            (_, true) => IntPoly::zero(m).sub(&u(m - 1)),
            _ => u(i).sub(&u(i - 1)),
        })
        .collect();
    let mut total = QPoly::default();
    for (mono, c) in schubert(w).terms() {
        let mut term = IntPoly::one(m).scale(c);
        for (i, xi) in x.iter().enumerate() {
            term = term.mul(&xi.pow(mono.exp(i)).unwrap()).unwrap();
        }
        for (um, uc) in term.terms() {
            let content: Vec<u32> = (0..m).map(|i| Mono::exp(*um, i)).collect();
            total = total.add(&remixed_eulerian(&content).unwrap().scale(uc));
        }
    }
    total
}

#[test]
fn q_coefficients_are_nonnegative_polynomials() {
    // verified independently for n ≤ 5 (with the definition); here every w with n ≤ 8
    let top = 8;
    let exceptions = q_survey(top);
    assert!(exceptions.is_empty(), "{exceptions:?}");
}
