//! Schubert expansions through Monk's rule: Hessenberg tables by the class Q_h beside
//! the DS_h method, products of Schubert classes beside the polynomial product, the
//! sweep over every h beside one table per h, and typed products of linear forms
//! beside peeling the multiplied-out polynomial.
#![allow(missing_docs, clippy::unwrap_used)]

use criterion::{Criterion, criterion_group, criterion_main};
use elbowroom::math::hessenberg::function::HessenbergFn;
use elbowroom::math::hessenberg::reference::coefficient_table_by_divsym;
use elbowroom::math::hessenberg::rows::coefficient_table_by_class;
use elbowroom::math::hessenberg::sweep::sweep_every_h;
use elbowroom::math::poly::parse::{parse_linear_factors, parse_poly};
use elbowroom::math::schubert::expansion::{expand_linear_factors, schubert_expansion};
use elbowroom::math::schubert::product::{product_by_polynomials, schubert_product};
use elbowroom::math::schubert::vector::Space;
use elbowroom::math::{Perm, Progress};
use std::hint::black_box;
use std::time::Duration;

fn h(text: &str) -> HessenbergFn {
    HessenbergFn::parse(text, None).unwrap()
}

fn tables(c: &mut Criterion) {
    let mut g = c.benchmark_group("hessenberg_table");
    g.sample_size(10);
    g.warm_up_time(Duration::from_secs(1));
    g.measurement_time(Duration::from_secs(3));
    // a non-default h at n = 8, both methods
    let h8 = h("3,4,5,6,7,8,8,8");
    g.bench_function("n8_h34567888/class", |b| {
        b.iter(|| {
            coefficient_table_by_class(black_box(&h8), &|_| true, &Progress::default()).unwrap()
        })
    });
    g.bench_function("n8_h34567888/ds_h", |b| {
        b.iter(|| {
            coefficient_table_by_divsym(black_box(&h8), &|_| true, &Progress::default()).unwrap()
        })
    });
    // the default h at n = 10, both methods
    let d10 = HessenbergFn::default_for(10).unwrap();
    g.bench_function("n10_default/class", |b| {
        b.iter(|| {
            coefficient_table_by_class(black_box(&d10), &|_| true, &Progress::default()).unwrap()
        })
    });
    g.bench_function("n10_default/ds_h", |b| {
        b.iter(|| {
            coefficient_table_by_divsym(black_box(&d10), &|_| true, &Progress::default()).unwrap()
        })
    });
    // the h at n = 9 (the DS_h method takes about two minutes for it: measured
    // once in the README, not here) and larger tables by the class only
    for (name, text) in [
        ("n9_h345678999/class", "3,4,5,6,7,8,9,9,9"),
        ("n10_h3_to_10/class", "3,4,5,6,7,8,9,10,10,10"),
        ("n11_h4_to_11/class", "4,5,6,7,8,9,10,11,11,11,11"),
    ] {
        let hh = h(text);
        g.bench_function(name, |b| {
            b.iter(|| {
                coefficient_table_by_class(black_box(&hh), &|_| true, &Progress::default()).unwrap()
            })
        });
    }
    g.finish();
}

fn products(c: &mut Criterion) {
    let mut g = c.benchmark_group("schubert_product");
    g.sample_size(10);
    g.warm_up_time(Duration::from_secs(1));
    g.measurement_time(Duration::from_secs(3));
    let p = |s: &str| Perm::parse(s).unwrap();
    // ℓ(u) + ℓ(v) = 14 in S_8: the slowest pair of a scan of about 2000 (21543876 squared)
    let (u, v) = (p("21543876"), p("21543876"));
    g.bench_function("s8_len14_worst/stable", |b| {
        b.iter(|| {
            schubert_product(
                black_box(&u),
                black_box(&v),
                Space::Stable,
                &Progress::default(),
            )
            .unwrap()
        })
    });
    g.bench_function("s8_len14_worst/flag8", |b| {
        b.iter(|| {
            schubert_product(
                black_box(&u),
                black_box(&v),
                Space::Flag(8),
                &Progress::default(),
            )
            .unwrap()
        })
    });
    // a pair the polynomial product can still do stably, both methods
    let (u, v) = (p("13284675"), p("13258746"));
    g.bench_function("s8_len14/transition_monk", |b| {
        b.iter(|| {
            schubert_product(
                black_box(&u),
                black_box(&v),
                Space::Stable,
                &Progress::default(),
            )
            .unwrap()
        })
    });
    g.bench_function("s8_len14/polynomials", |b| {
        b.iter(|| {
            product_by_polynomials(
                black_box(&u),
                black_box(&v),
                Space::Stable,
                &Progress::default(),
            )
            .unwrap()
        })
    });
    g.finish();
}

fn sweeps(c: &mut Criterion) {
    let mut g = c.benchmark_group("sweep_every_h");
    g.sample_size(10);
    g.warm_up_time(Duration::from_secs(1));
    g.measurement_time(Duration::from_secs(3));
    g.bench_function("n8/shared_walk", |b| {
        b.iter(|| sweep_every_h(black_box(8), &Progress::default()).unwrap())
    });
    // the baseline: one table per h by the class, no sharing
    let all8 = HessenbergFn::all(8);
    g.bench_function("n8/table_per_h", |b| {
        b.iter(|| {
            for hh in &all8 {
                black_box(coefficient_table_by_class(hh, &|_| true, &Progress::default()).unwrap());
            }
        })
    });
    // at n = 6 also one DS_h table per h
    g.bench_function("n6/shared_walk", |b| {
        b.iter(|| sweep_every_h(black_box(6), &Progress::default()).unwrap())
    });
    let all6 = HessenbergFn::all(6);
    g.bench_function("n6/ds_h_per_h", |b| {
        b.iter(|| {
            for hh in &all6 {
                black_box(
                    coefficient_table_by_divsym(hh, &|_| true, &Progress::default()).unwrap(),
                );
            }
        })
    });
    g.bench_function("n9/shared_walk", |b| {
        b.iter(|| sweep_every_h(black_box(9), &Progress::default()).unwrap())
    });
    g.finish();
}

fn expansions(c: &mut Criterion) {
    let mut g = c.benchmark_group("expand");
    g.sample_size(10);
    g.warm_up_time(Duration::from_secs(1));
    g.measurement_time(Duration::from_secs(3));
    // Δ in 6 variables: 15 linear factors through Monk, beside the general path on the
    // multiplied-out polynomial (720 terms; its stable expansion would leave S_16, so the
    // general path takes divided differences in H*(Fl_6))
    let text = "(x1-x2)(x1-x3)(x1-x4)(x1-x5)(x1-x6)(x2-x3)(x2-x4)(x2-x5)(x2-x6)(x3-x4)(x3-x5)(x3-x6)(x4-x5)(x4-x6)(x5-x6)";
    let factors = parse_linear_factors(text, Some(6)).unwrap().unwrap();
    let poly = parse_poly(text, Some(6)).unwrap();
    g.bench_function("delta6_flag6/monk", |b| {
        b.iter(|| {
            expand_linear_factors(black_box(&factors), Space::Flag(6), &Progress::default())
                .unwrap()
        })
    });
    g.bench_function("delta6_flag6/polynomial", |b| {
        b.iter(|| {
            schubert_expansion(black_box(&poly), Space::Flag(6), &Progress::default()).unwrap()
        })
    });
    // a product of general linear forms, stably
    let text = "(x1 + 2x2 - x3)^3 (x2 - 3x4) (2x1 + x3 + x4)^2";
    let factors = parse_linear_factors(text, Some(4)).unwrap().unwrap();
    let poly = parse_poly(text, Some(4)).unwrap();
    g.bench_function("forms_deg6_stable/monk", |b| {
        b.iter(|| {
            expand_linear_factors(black_box(&factors), Space::Stable, &Progress::default()).unwrap()
        })
    });
    g.bench_function("forms_deg6_stable/peel", |b| {
        b.iter(|| {
            schubert_expansion(black_box(&poly), Space::Stable, &Progress::default()).unwrap()
        })
    });
    g.finish();
}

criterion_group!(benches, tables, products, sweeps, expansions);
criterion_main!(benches);
