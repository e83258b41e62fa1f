//! Schubert polynomials three ways (transition, divided differences, reduced pipe
//! dreams), stability under S_n ⊂ S_{n+1}, and Macdonald's tables (1991).
#![allow(clippy::unwrap_used)]

use elbowroom::math::pipes::dream::pipe_dreams;
use elbowroom::math::schubert::polynomial::{SchubertTable, schubert_by_divided_differences};
use elbowroom::math::{IntPoly, Mono, Perm, PolyBuilder};
use num_bigint::BigInt;

fn from_dreams(w: &Perm) -> IntPoly {
    let mut b = PolyBuilder::new(w.n());
    let one = BigInt::from(1);
    for d in pipe_dreams(w) {
        b.add_term(Mono::from_exps(&d.monomial()).unwrap(), &one);
    }
    b.build()
}

#[test]
fn transition_divided_differences_and_pipe_dreams_agree_up_to_s6() {
    let mut table = SchubertTable::new();
    for n in 1..=6 {
        for w in Perm::all(n) {
            let t = table.get(&w);
            assert_eq!(*t, schubert_by_divided_differences(&w), "w = {w}");
            assert_eq!(*t, from_dreams(&w), "w = {w}");
        }
    }
}

#[test]
fn stable_under_embedding() {
    let mut table = SchubertTable::new();
    for n in 1..=5 {
        for w in Perm::all(n) {
            let small = table.get(&w);
            let big_w = w.embed(n + 1).unwrap();
            let big = schubert_by_divided_differences(&big_w);
            assert_eq!(big, small.with_nvars(n + 1).unwrap(), "w = {w}");
            assert_eq!(from_dreams(&big_w), big, "w = {w}");
        }
    }
}

/// Macdonald, Notes on Schubert Polynomials (1991), the table of S_w for S_3 and
/// some of S_4 (written from memory; each checked by hand with divided differences
/// from S_{w0}).
#[test]
fn macdonald_tables() {
    let cases: [(&str, &str); 17] = [
        ("123", "1"),
        ("213", "x1"),
        ("132", "x1 + x2"),
        ("231", "x1 x2"),
        ("312", "x1^2"),
        ("321", "x1^2 x2"),
        ("1324", "x1 + x2"),
        ("1243", "x1 + x2 + x3"),
        ("2143", "x1^2 + x1 x2 + x1 x3"),
        ("1342", "x1 x2 + x1 x3 + x2 x3"),
        ("1423", "x1^2 + x1 x2 + x2^2"),
        ("2413", "x1^2 x2 + x1 x2^2"),
        ("3412", "x1^2 x2^2"),
        ("4132", "x1^3 x2 + x1^3 x3"),
        ("1432", "x1^2 x2 + x1^2 x3 + x1 x2^2 + x1 x2 x3 + x2^2 x3"),
        ("4321", "x1^3 x2^2 x3"),
        ("2341", "x1 x2 x3"),
    ];
    let mut table = SchubertTable::new();
    for (w, expected) in cases {
        let w = Perm::parse(w).unwrap();
        assert_eq!(table.get(&w).to_text(), expected, "w = {w}");
        assert_eq!(
            schubert_by_divided_differences(&w).to_text(),
            expected,
            "w = {w}"
        );
        assert_eq!(from_dreams(&w).to_text(), expected, "w = {w}");
    }
}

#[test]
fn all_of_s7_by_transition_and_pipe_dreams() {
    let mut table = SchubertTable::new();
    for w in Perm::all(7) {
        assert_eq!(*table.get(&w), from_dreams(&w), "w = {w}");
    }
}
