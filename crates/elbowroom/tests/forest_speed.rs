//! Timings of the forest computations (ignored by default; run with
//! `cargo test --release --test forest_speed -- --ignored --nocapture`):
//! the forest expansion of every S_w in S_8, some S_w in S_10, and the class
//! modulo J_10 in the forest basis (by trimming, no Gröbner basis) against the
//! normal form through the Gröbner basis, with the two classes compared.
#![allow(clippy::unwrap_used)]

use elbowroom::math::forest::quotient::forest_normal_form;
use elbowroom::math::forest::schubert::schubert_forest_expansion;
use elbowroom::math::forest::{indexed::Forest, polynomial::forest_polynomial};
use elbowroom::math::poly::parse::parse_poly;
use elbowroom::math::quotient::normal_form::{groebner_basis, normal_form};
use elbowroom::math::schubert::polynomial::schubert;
use elbowroom::math::{Perm, PolyBuilder, Progress, RatPoly};
use std::time::Instant;

#[test]
#[ignore]
fn forest_expansions_of_s8_and_s10() {
    let start = Instant::now();
    let mut worst = (0.0f64, Perm::identity(8));
    let mut forests = 0usize;
    for w in Perm::all(8) {
        let t = Instant::now();
        let e = schubert_forest_expansion(&w, &Progress::default()).unwrap();
        forests += e.len();
        let s = t.elapsed().as_secs_f64();
        if s > worst.0 {
            worst = (s, w);
        }
    }
    println!(
        "S_8: all 40320 expansions in {:.1} s ({forests} forests); slowest {} in {:.3} s",
        start.elapsed().as_secs_f64(),
        worst.1,
        worst.0
    );
    assert!(worst.0 < 1.0);
    for text in [
        "1,10,2,9,3,8,4,7,5,6",
        "4,8,2,10,6,1,9,3,7,5",
        "5,10,4,9,3,8,2,7,1,6",
        "2,1,4,3,6,5,8,7,10,9",
    ] {
        let w = Perm::parse(text).unwrap();
        let t = Instant::now();
        let e = schubert_forest_expansion(&w, &Progress::default()).unwrap();
        println!(
            "S_{w} (ℓ = {}, {} terms): {} forests in {:.3} s",
            w.length(),
            schubert(&w).len(),
            e.len(),
            t.elapsed().as_secs_f64()
        );
    }
}

#[test]
#[ignore]
fn quotient_classes_at_n10_by_forests_and_by_groebner() {
    let n = 10;
    let t = Instant::now();
    let q = groebner_basis(n).unwrap();
    println!("Gröbner basis of J_10: {:.1} s", t.elapsed().as_secs_f64());
    // degrees below n (every polynomial of degree n or more lies in J_n)
    let mut inputs: Vec<(String, RatPoly)> = Vec::new();
    for text in [
        "2,5,1,7,3,4,6,10,8,9",
        "4,1,3,2,7,5,6,9,8,10",
        "10,1,2,3,4,5,6,7,8,9",
    ] {
        let w = Perm::parse(text).unwrap();
        let f = schubert(&w).reverse_vars().to_rational();
        inputs.push((format!("S_{w}(x10..x1), ℓ = {}", w.length()), f));
    }
    for text in ["(x1 + 2*x4 - x7 + x10)^9", "(x1*x5 - x3*x10 + x2 + x9)^4"] {
        inputs.push((text.to_string(), parse_poly(text, Some(n)).unwrap()));
    }
    for (what, f) in inputs {
        let t = Instant::now();
        let nf = normal_form(&q, &f).unwrap();
        let tg = t.elapsed().as_secs_f64();
        let t = Instant::now();
        let forest = forest_normal_form(&f, n, &Progress::default()).unwrap();
        let tf = t.elapsed().as_secs_f64();
        // the two classes agree: Σ c_F P_F reduces to NF(f)
        let mut b = PolyBuilder::new(n);
        for (code, c) in &forest {
            let p =
                forest_polynomial(&Forest::from_code(code).unwrap(), &Progress::default()).unwrap();
            b.add_scaled(&p.to_rational().with_nvars(n).unwrap(), c);
        }
        let back: RatPoly = b.build();
        assert_eq!(normal_form(&q, &back).unwrap(), nf);
        println!(
            "{what}, {} terms: Gröbner normal form {tg:.3} s ({} standard monomials), forest class {tf:.3} s ({} forests)",
            f.len(),
            nf.coefficients.len(),
            forest.len()
        );
    }
}

/// Beyond n = 5: the w whose S_w is a single forest polynomial against the
/// avoiders of 1432, 2413, 2431, 14523, 32154, 341265 (ordinary containment),
/// for n = 6 and 7, with the first disagreements printed.
#[test]
#[ignore]
fn single_forest_polynomials_and_patterns_beyond_n5() {
    use elbowroom::math::forest::schubert::is_single;
    use elbowroom::math::perms::class::contains_pattern;
    let patterns: [&[usize]; 6] = [
        &[1, 4, 3, 2],
        &[2, 4, 1, 3],
        &[2, 4, 3, 1],
        &[1, 4, 5, 2, 3],
        &[3, 2, 1, 5, 4],
        &[3, 4, 1, 2, 6, 5],
    ];
    for n in 6..=7 {
        let (mut single, mut avoid, mut single_not_avoid, mut avoid_not_single) = (0, 0, 0, 0);
        let mut examples = Vec::new();
        for w in Perm::all(n) {
            let s = is_single(&schubert_forest_expansion(&w, &Progress::default()).unwrap());
            let a = patterns.iter().all(|p| !contains_pattern(&w, p));
            single += s as usize;
            avoid += a as usize;
            if s && !a {
                single_not_avoid += 1;
                if examples.len() < 6 {
                    examples.push(format!("{w} single, contains a pattern"));
                }
            }
            if a && !s {
                avoid_not_single += 1;
                if examples.len() < 6 {
                    examples.push(format!("{w} avoids, not single"));
                }
            }
        }
        println!(
            "n = {n}: {single} single, {avoid} avoiders; {single_not_avoid} single but containing, {avoid_not_single} avoiding but not single; {examples:?}"
        );
    }
}
