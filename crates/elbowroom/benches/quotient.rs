//! Speed of the quasisymmetric quotient: the Gröbner basis (through forests, beside the
//! construction by elimination), reduction of a large
//! polynomial, and the Schubert survey of S_7, each beside a naive baseline where one
//! makes sense (plain multivariate division by the basis).
#![allow(clippy::unwrap_used, missing_docs)]

use criterion::{Criterion, criterion_group, criterion_main};
use elbowroom::math::poly::compositions::monomials_of_degree;
use elbowroom::math::quotient::forest_route::ForestReducer;
use elbowroom::math::quotient::groebner::QuasiGroebner;
use elbowroom::math::quotient::normal_form::{groebner_basis, normal_form};
use elbowroom::math::quotient::survey::{survey, survey_by};
use elbowroom::math::schubert::polynomial::SchubertTable;
use elbowroom::math::{Perm, Progress, RatPoly};
use num_bigint::BigInt;
use num_rational::BigRational;
use std::hint::black_box;

/// Plain multivariate division by the basis polynomials, leading term first.
fn divide(f: &RatPoly, divisors: &[RatPoly]) -> RatPoly {
    let n = f.nvars();
    let mut rem = RatPoly::zero(n);
    let mut p = f.clone();
    while let Some((lead, c)) = p.terms().first().cloned() {
        match divisors.iter().find(|g| g.terms()[0].0.divides(lead)) {
            Some(g) => {
                let (gl, gc) = &g.terms()[0];
                p = p.sub(&g.mul_term(lead.divided_by(*gl), &(c / gc)).unwrap());
            }
            None => {
                rem = rem.add(&RatPoly::monomial(n, lead, c.clone()));
                p = p.sub(&RatPoly::monomial(n, lead, c));
            }
        }
    }
    rem
}

/// Every monomial of degree <= 7 in 8 variables (6435 of them, the most a polynomial of
/// degree 7 in 8 variables can have) with small varying coefficients.
fn big_poly(n: usize, max_deg: u32) -> RatPoly {
    let mut terms = Vec::new();
    for d in 0..=max_deg {
        for (i, m) in monomials_of_degree(n, d).into_iter().enumerate() {
            let c = ((i * 37 + d as usize * 11) % 19) as i64 - 9;
            terms.push((m, BigRational::from_integer(BigInt::from(c))));
        }
    }
    RatPoly::from_terms(n, terms)
}

fn bench_groebner(c: &mut Criterion) {
    let mut g = c.benchmark_group("groebner");
    g.sample_size(10);
    g.bench_function("compute n=7", |b| {
        b.iter(|| QuasiGroebner::compute(black_box(7), None).unwrap())
    });
    g.bench_function("compute n=8", |b| {
        b.iter(|| QuasiGroebner::compute(black_box(8), None).unwrap())
    });
    g.bench_function("compute n=9", |b| {
        b.iter(|| QuasiGroebner::compute(black_box(9), None).unwrap())
    });
    // the baseline of the same run: the construction by division and elimination
    g.bench_function("compute_by_elimination n=8", |b| {
        b.iter(|| QuasiGroebner::compute_by_elimination(black_box(8), None).unwrap())
    });
    g.bench_function("compute_by_elimination n=9", |b| {
        b.iter(|| QuasiGroebner::compute_by_elimination(black_box(9), None).unwrap())
    });
    g.finish();
}

fn bench_reduce(c: &mut Criterion) {
    let q = groebner_basis(8).unwrap();
    let f = big_poly(8, 7);
    let mut g = c.benchmark_group("reduce");
    g.sample_size(10);
    g.bench_function("normal form, n=8, 6435 terms of degree <= 7", |b| {
        b.iter(|| normal_form(&q, black_box(&f)).unwrap())
    });
    // the naive baseline: division step by step, on a smaller input (n = 6, degree <= 5)
    let q6 = groebner_basis(6).unwrap();
    let gb6: Vec<RatPoly> = q6.polys().iter().map(|p| p.to_rational()).collect();
    let f6 = big_poly(6, 5);
    g.bench_function("normal form, n=6, degree <= 5 (tables)", |b| {
        b.iter(|| normal_form(&q6, black_box(&f6)).unwrap())
    });
    g.bench_function("plain division, n=6, degree <= 5 (baseline)", |b| {
        b.iter(|| divide(black_box(&f6), &gb6))
    });
    g.finish();
}

fn bench_survey(c: &mut Criterion) {
    groebner_basis(7).unwrap();
    let perms: Vec<Perm> = Perm::all(7).collect();
    let mut g = c.benchmark_group("survey");
    g.sample_size(10);
    g.bench_function("all of S_7", |b| {
        b.iter(|| {
            let p = Progress::new(perms.len() as u64);
            survey(black_box(&perms), &p).unwrap()
        })
    });
    g.finish();
}

/// The survey's transition walk on normal forms against the baseline of expanding each
/// Schubert polynomial and dividing it (S_8, the 40320 permutations, most of length >= 8).
fn bench_survey_walk(c: &mut Criterion) {
    groebner_basis(8).unwrap();
    let q = groebner_basis(8).unwrap();
    let perms: Vec<Perm> = Perm::all(8).filter(|w| w.length() < 8).collect();
    let mut g = c.benchmark_group("survey walk");
    g.sample_size(10);
    g.bench_function("S_8, length < 8: transition on normal forms", |b| {
        b.iter(|| survey(black_box(&perms), &Progress::new(0)).unwrap())
    });
    g.bench_function(
        "S_8, length < 8: transition, normal forms through forests",
        |b| {
            b.iter(|| {
                let r = ForestReducer::new(8).unwrap();
                survey_by(&r, black_box(&perms), &Progress::new(0)).unwrap()
            })
        },
    );
    g.bench_function("S_8, length < 8: expand S_w and divide (baseline)", |b| {
        b.iter(|| {
            let mut table = SchubertTable::new();
            for w in &perms {
                let s = table.get(w).reverse_vars();
                black_box(normal_form(&q, &s).unwrap());
            }
        })
    });
    g.finish();
}

criterion_group!(
    benches,
    bench_groebner,
    bench_reduce,
    bench_survey,
    bench_survey_walk
);
criterion_main!(benches);
