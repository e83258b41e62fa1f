//! Divided symmetrization, Hessenberg tables, permutohedron volumes and mixed Eulerian
//! numbers, with the definition (a sum over S_n) as the naive baseline at small n.
#![allow(missing_docs, clippy::unwrap_used)]

use criterion::{Criterion, criterion_group, criterion_main};
use elbowroom::math::hessenberg::divsym::{divided_symmetrize, divided_symmetrize_at};
use elbowroom::math::hessenberg::function::HessenbergFn;
use elbowroom::math::hessenberg::reference::{
    coefficient_table_by_divsym, coefficient_table_by_polynomials,
};
use elbowroom::math::permutohedra::mixed_eulerian::mixed_eulerian_numbers;
use elbowroom::math::permutohedra::permutohedron::Permutohedron;
use elbowroom::math::{Mono, PolyBuilder, Progress, RatPoly};
use num_bigint::BigInt;
use num_rational::BigRational;
use std::hint::black_box;
use std::time::Duration;

/// A deterministic pseudo-random stream (a linear congruential generator).
struct Lcg(u64);
impl Lcg {
    fn next(&mut self) -> u64 {
        self.0 = self
            .0
            .wrapping_mul(6364136223846793005)
            .wrapping_add(1442695040888963407);
        self.0 >> 33
    }
}

/// A polynomial of degree n-1 in n variables with `terms` distinct terms.
fn random_poly(n: usize, terms: usize, seed: u64) -> RatPoly {
    let mut rng = Lcg(seed);
    let mut b = PolyBuilder::new(n);
    let mut count = 0;
    let mut seen = std::collections::HashSet::new();
    while count < terms {
        let mut e = vec![0u32; n];
        for _ in 0..n - 1 {
            e[(rng.next() as usize) % n] += 1;
        }
        let m = Mono::from_exps(&e).unwrap();
        if seen.insert(m) {
            let c = BigRational::new(
                BigInt::from(rng.next() % 19) - 9,
                BigInt::from(1 + rng.next() % 4),
            );
            b.add_term(m, &c);
            count += 1;
        }
    }
    b.build()
}

fn generic_lambda(n: usize) -> Vec<BigRational> {
    let mut rng = Lcg(7);
    (0..n)
        .map(|_| {
            BigRational::new(
                BigInt::from(rng.next() % 1000) - 500,
                BigInt::from(1 + rng.next() % 9),
            )
        })
        .collect()
}

fn point(n: usize) -> Vec<BigRational> {
    (0..n)
        .map(|i| BigRational::new(BigInt::from(3 * i * i + 1), BigInt::from(i + 2)))
        .collect()
}

fn benches(c: &mut Criterion) {
    let mut g = c.benchmark_group("divsym");
    g.sample_size(10);
    g.warm_up_time(Duration::from_secs(1));
    g.measurement_time(Duration::from_secs(3));

    // DS of a degree n-1 polynomial with 10^5 terms (n = 12)
    let big = random_poly(12, 100_000, 1);
    let h12 = HessenbergFn::default_for(12).unwrap();
    g.bench_function("ds_1e5_terms_n12", |b| {
        b.iter(|| black_box(divided_symmetrize(&big, &h12).unwrap()))
    });

    // fast against the definition (a sum over S_6) on one 40-term polynomial
    let small = random_poly(6, 40, 2);
    let h6 = HessenbergFn::default_for(6).unwrap();
    let p6 = point(6);
    g.bench_function("ds_40_terms_n6_fast", |b| {
        b.iter(|| black_box(divided_symmetrize(&small, &h6).unwrap()))
    });
    g.bench_function("ds_40_terms_n6_definition", |b| {
        b.iter(|| black_box(divided_symmetrize_at(&small, &h6, &p6).unwrap()))
    });

    // permutohedron volume: n = 12 generic, and n = 5 fast against the definition
    let l12 = generic_lambda(12);
    g.bench_function("volume_n12", |b| {
        b.iter(|| black_box(Permutohedron::new(&l12).unwrap().volume()))
    });
    let l5 = generic_lambda(5);
    let mut sorted5 = l5.clone();
    sorted5.sort_by(|a, b| b.cmp(a));
    let mut lin = RatPoly::zero(5);
    for (i, l) in sorted5.iter().enumerate() {
        lin = lin.add(&RatPoly::var_index(5, i).scale(l));
    }
    let power = lin.pow(4).unwrap();
    let h5 = HessenbergFn::default_for(5).unwrap();
    let p5 = point(5);
    g.bench_function("volume_n5_fast", |b| {
        b.iter(|| black_box(Permutohedron::new(&l5).unwrap().volume()))
    });
    g.bench_function("volume_n5_definition", |b| {
        b.iter(|| black_box(divided_symmetrize_at(&power, &h5, &p5).unwrap()))
    });

    // mixed Eulerian numbers, n = 9
    g.bench_function("eulerian_n9", |b| {
        b.iter(|| black_box(mixed_eulerian_numbers(9, &Progress::new(0)).unwrap()))
    });

    // Hessenberg tables: n = 9, 10 by transition on values; n = 9 by building each S_w;
    // n = 5 fast against the definition entry by entry
    let all = |_: usize| true;
    let h9 = HessenbergFn::default_for(9).unwrap();
    g.bench_function("table_n9", |b| {
        b.iter(|| black_box(coefficient_table_by_divsym(&h9, &all, &Progress::new(0)).unwrap()))
    });
    let h10 = HessenbergFn::default_for(10).unwrap();
    g.bench_function("table_n10", |b| {
        b.iter(|| black_box(coefficient_table_by_divsym(&h10, &all, &Progress::new(0)).unwrap()))
    });
    g.bench_function("table_n9_by_polynomials", |b| {
        b.iter(|| {
            black_box(coefficient_table_by_polynomials(&h9, &all, &Progress::new(0)).unwrap())
        })
    });
    g.bench_function("table_n5_fast", |b| {
        b.iter(|| black_box(coefficient_table_by_divsym(&h5, &all, &Progress::new(0)).unwrap()))
    });
    let t5 = coefficient_table_by_divsym(&h5, &all, &Progress::new(0)).unwrap();
    let mut memo = elbowroom::math::schubert::polynomial::SchubertTable::new();
    let polys: Vec<RatPoly> = t5
        .entries
        .iter()
        .map(|e| memo.get(&e.perm).to_rational())
        .collect();
    g.bench_function("table_n5_definition", |b| {
        b.iter(|| {
            for f in &polys {
                black_box(divided_symmetrize_at(f, &h5, &p5).unwrap());
            }
        })
    });
    g.finish();
}

criterion_group!(divsym_benches, benches);
criterion_main!(divsym_benches);
