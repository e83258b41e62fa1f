//! Divided symmetrization: the fast methods against the definition
//! Σ_σ σ(f)(p) / σ(D_h)(p), evaluated exactly at generic rational points.
#![allow(clippy::unwrap_used)]

use elbowroom::math::hessenberg::divsym::{
    HessenbergFunctional, PostnikovFunctional, descent_set_counts, divided_symmetrize,
    divided_symmetrize_at,
};
use elbowroom::math::hessenberg::function::HessenbergFn;
use elbowroom::math::poly::compositions::weak_compositions;
use elbowroom::math::{Mono, RatPoly};
use num_bigint::BigInt;
use num_rational::BigRational;
use num_traits::One;
use proptest::prelude::*;

fn q(p: i64, d: i64) -> BigRational {
    BigRational::new(BigInt::from(p), BigInt::from(d))
}

/// Points with distinct, unrelated coordinates.
fn points(n: usize) -> Vec<Vec<BigRational>> {
    let seeds = [
        (3i64, 7i64),
        (11, 2),
        (-5, 13),
        (17, 3),
        (2, 9),
        (-23, 5),
        (31, 11),
    ];
    (0..3)
        .map(|k| {
            (0..n)
                .map(|i| {
                    let (a, b) = seeds[(i + 2 * k) % seeds.len()];
                    q(a + (i * i * 7 + k * 19) as i64, b)
                })
                .collect()
        })
        .collect()
}

fn mono_poly(n: usize, e: &[u32]) -> RatPoly {
    RatPoly::monomial(n, Mono::from_exps(e).unwrap(), BigRational::one())
}

fn assert_agrees(f: &RatPoly, h: &HessenbergFn) {
    let fast = divided_symmetrize(f, h).unwrap();
    for p in points(h.n()) {
        let slow = divided_symmetrize_at(f, h, &p).unwrap();
        assert_eq!(fast.value.eval(&p), slow, "f = {f}, h = {h}, p = {p:?}");
    }
    assert!(
        fast.value.is_symmetric(),
        "DS_h({f}) = {} is not symmetric",
        fast.value
    );
}

#[test]
fn every_monomial_of_degree_n_minus_1_matches_the_definition_up_to_n_5() {
    for n in 2..=5 {
        let h = HessenbergFn::default_for(n).unwrap();
        for e in weak_compositions((n - 1) as u32, n) {
            assert_agrees(&mono_poly(n, &e), &h);
        }
    }
}

#[test]
fn monomials_above_degree_n_minus_1_match_the_definition() {
    for n in 2..=4 {
        let h = HessenbergFn::default_for(n).unwrap();
        for d in n..=n + 1 {
            for e in weak_compositions(d as u32, n) {
                assert_agrees(&mono_poly(n, &e), &h);
            }
        }
    }
    // and below degree n-1 the result is 0
    let h = HessenbergFn::default_for(4).unwrap();
    for e in weak_compositions(2, 4) {
        assert!(
            divided_symmetrize(&mono_poly(4, &e), &h)
                .unwrap()
                .value
                .is_zero()
        );
    }
}

#[test]
fn every_hessenberg_function_matches_the_definition_up_to_n_4() {
    for n in 1..=4 {
        for h in HessenbergFn::all(n) {
            let d = h.dimension() as u32;
            for deg in d..=d + 1 {
                for e in weak_compositions(deg, n) {
                    assert_agrees(&mono_poly(n, &e), &h);
                }
            }
        }
    }
}

#[test]
fn the_descent_formula_and_the_pairing_with_q_h_agree_up_to_n_6() {
    for n in 2..=6 {
        let h = HessenbergFn::default_for(n).unwrap();
        let postnikov = PostnikovFunctional::new(n);
        let pairing = HessenbergFunctional::by_complement(&h).unwrap();
        for e in weak_compositions((n - 1) as u32, n) {
            let m = Mono::from_exps(&e).unwrap();
            assert_eq!(
                BigInt::from(postnikov.value(m)),
                pairing.value(m),
                "x^{e:?}"
            );
        }
    }
}

#[test]
fn descent_classes_partition_s_n() {
    // Σ_S β_n(S) = n!, and β_n(∅) = β_n([n-1]) = 1; β_n({1}) = n - 1 (Stanley, EC1 §1.4, from memory)
    for n in 1..=10usize {
        let b = descent_set_counts(n);
        let fact: u64 = (1..=n as u64).product();
        assert_eq!(b.iter().sum::<u64>(), fact);
        assert_eq!(b[0], 1);
        assert_eq!(*b.last().unwrap(), 1);
        if n >= 2 {
            assert_eq!(b[1], (n - 1) as u64);
        }
    }
    // alternating (up-down) permutations of S_5 with descent set {2, 4}: Euler number E_5 = 16 (OEIS A000111)
    assert_eq!(descent_set_counts(5)[0b1010], 16);
}

fn small_poly(n: usize, degree: u32) -> impl Strategy<Value = RatPoly> {
    let terms = prop::collection::vec(
        (prop::collection::vec(0u32..=degree, n), -5i64..=5, 1i64..=3),
        1..6,
    );
    terms.prop_map(move |ts| {
        let mut f = RatPoly::zero(n);
        for (mut e, c, d) in ts {
            // push the exponents onto the required degree, spilling into the last variable
            let s: u32 = e.iter().sum();
            if s > degree {
                e = vec![0; n];
                e[0] = degree;
            } else {
                e[n - 1] += degree - s;
            }
            let t = RatPoly::monomial(n, Mono::from_exps(&e).unwrap(), q(c, d));
            f = f.add(&t);
        }
        f
    })
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(12))]
    #[test]
    fn random_polynomials_in_six_variables_match_the_definition(f in small_poly(6, 5)) {
        let h = HessenbergFn::default_for(6).unwrap();
        let fast = divided_symmetrize(&f, &h).unwrap();
        let p = &points(6)[0];
        prop_assert_eq!(fast.value.eval(p), divided_symmetrize_at(&f, &h, p).unwrap());
    }

    #[test]
    fn random_polynomials_of_degree_six_match_the_definition(f in small_poly(6, 6)) {
        let h = HessenbergFn::default_for(6).unwrap();
        let fast = divided_symmetrize(&f, &h).unwrap();
        let p = &points(6)[1];
        prop_assert_eq!(fast.value.eval(p), divided_symmetrize_at(&f, &h, p).unwrap());
        prop_assert!(fast.value.is_symmetric());
    }
}

#[test]
fn a_canceled_divided_symmetrization_stops() {
    use elbowroom::math::hessenberg::divsym::divided_symmetrize_with;
    use elbowroom::math::{MathError, Progress};
    use std::sync::Arc;
    use std::sync::mpsc;
    use std::time::Instant;
    // DS_8 of (x1 + … + x8)^9 goes through f·Q_h: 11 440 terms of f (C(16, 7)) times
    // the terms of Q_h, a product of 21 linear factors, seconds of work; cancelled
    // once the computation has been entered, it stops with `Canceled` (had it run
    // to its end it would be `Ok`). The time the stop took is printed, not bounded:
    // a wall-clock bound on a shared machine proves nothing.
    let h = HessenbergFn::default_for(8).unwrap();
    let f =
        elbowroom::math::poly::parse::parse_poly("(x1+x2+x3+x4+x5+x6+x7+x8)^9", Some(8)).unwrap();
    let progress = Arc::new(Progress::default());
    let p = progress.clone();
    let (entered, started) = mpsc::channel();
    let work = std::thread::spawn(move || {
        entered.send(()).unwrap();
        divided_symmetrize_with(&f, &h, &p).map(|_| ())
    });
    started.recv().unwrap();
    let asked = Instant::now();
    progress.cancel();
    let result = work.join().unwrap();
    eprintln!("stopped {:?} after the cancel", asked.elapsed());
    assert_eq!(result, Err(MathError::Canceled));
    // cancelled before the start, a non-default h: nothing is computed
    let p = Progress::default();
    p.cancel();
    let h = HessenbergFn::parse("3,3,4,5,5", None).unwrap();
    let f = RatPoly::monomial(
        5,
        Mono::from_exps(&[3, 2, 1, 0, 0]).unwrap(),
        BigRational::one(),
    );
    assert_eq!(
        divided_symmetrize_with(&f, &h, &p).unwrap_err(),
        MathError::Canceled
    );
}
