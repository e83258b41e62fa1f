//! a_w explained by its reduced words (the formula, the rules, the symmetries and the
//! cyclic orbit; and a_w(q)) against the class method of the Hessenberg view, which
//! gives the whole table of a_w at once, as the baseline.
#![allow(missing_docs, clippy::unwrap_used)]

use criterion::{Criterion, criterion_group, criterion_main};
use elbowroom::math::explain::explanation::explain;
use elbowroom::math::explain::formula::word_formula;
use elbowroom::math::explain::qvalue::q_coefficient;
use elbowroom::math::hessenberg::coefficients::coefficient_table;
use elbowroom::math::hessenberg::function::HessenbergFn;
use elbowroom::math::{Perm, Progress};
use std::hint::black_box;
use std::time::Duration;

fn coefficient(c: &mut Criterion) {
    let mut g = c.benchmark_group("coefficient");
    g.sample_size(10).measurement_time(Duration::from_secs(10));
    // n = 10, ℓ(w) = 9: w0 of S_4 times three commuting s_i (many words), and a mixed one
    for text in ["4,3,2,1,6,5,8,7,10,9", "2,5,4,3,1,7,6,9,8,10"] {
        let w = Perm::parse(text).unwrap();
        g.bench_function(format!("explain {text}"), |b| {
            b.iter(|| explain(black_box(&w), &Progress::default()).unwrap())
        });
        g.bench_function(format!("formula {text}"), |b| {
            b.iter(|| word_formula(black_box(&w), &Progress::default()).unwrap())
        });
        g.bench_function(format!("q {text}"), |b| {
            b.iter(|| q_coefficient(black_box(&w), &Progress::default()).unwrap())
        });
    }
    let h = HessenbergFn::default_for(10).unwrap();
    g.bench_function("class table n = 10 (baseline)", |b| {
        b.iter(|| coefficient_table(black_box(&h), &|_| true, &Progress::default()).unwrap())
    });
    g.finish();
}

criterion_group!(benches, coefficient);
criterion_main!(benches);
