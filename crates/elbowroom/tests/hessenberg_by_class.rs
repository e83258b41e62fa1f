//! Hessenberg coefficients through the class Q_h itself, against the DS_h method for
//! every h up to n = 7, facts of the trade, the sweep over every h, sizing and cancel.
#![allow(clippy::unwrap_used)]

use elbowroom::math::hessenberg::class::{class_factors, hessenberg_class};
use elbowroom::math::hessenberg::function::HessenbergFn;
use elbowroom::math::hessenberg::reference::coefficient_table_by_divsym;
use elbowroom::math::hessenberg::rows::{CLASS_TABLE_LIMIT, coefficient_table_by_class};
use elbowroom::math::hessenberg::sweep::{SWEEP_MAX_N, sweep_every_h};
use elbowroom::math::perms::listing::perms_of_length;
use elbowroom::math::schubert::expansion::schubert_expansion;
use elbowroom::math::schubert::vector::{PackedPerm, Space};
use elbowroom::math::{MathError, Perm, Progress};
use num_bigint::BigInt;
use num_rational::BigRational;
use num_traits::{Signed, Zero};
use rayon::prelude::*;
use std::sync::Arc;
use std::time::{Duration, Instant};

fn go() -> Progress {
    Progress::default()
}

#[test]
fn class_method_agrees_with_ds_h_for_every_h_up_to_n_6() {
    // a^h_w = DS_h(S_w) (the DS_h method) = the coefficient of S_{w0 w} in Q_h
    // (Anderson–Tymoczko 2010); Catalan(n) functions for each n (OEIS A000108).
    let mut functions = 0;
    let mut nonzero = 0;
    for n in 1..=6 {
        for h in HessenbergFn::all(n) {
            let by_class = coefficient_table_by_class(&h, &|_| true, &go()).unwrap();
            let by_ds = coefficient_table_by_divsym(&h, &|_| true, &go()).unwrap();
            assert_eq!(by_class, by_ds, "h = {h}");
            functions += 1;
            nonzero += by_class.nonzero();
        }
    }
    assert_eq!(functions, 1 + 2 + 5 + 14 + 42 + 132);
    assert!(nonzero > 1000, "{nonzero} nonzero coefficients");
}

#[test]
fn class_method_agrees_with_ds_h_for_a_sample_of_h_at_n_7() {
    // Every 24th of the 429 functions of n = 7 (and the default h), every entry: the
    // whole sweep below runs nightly.
    let all = HessenbergFn::all(7);
    let default = HessenbergFn::default_for(7).unwrap();
    let mut sample: Vec<&HessenbergFn> = all.iter().step_by(24).collect();
    sample.push(&default);
    let mut nonzero = 0;
    for h in sample {
        let by_class = coefficient_table_by_class(h, &|_| true, &go()).unwrap();
        let by_ds = coefficient_table_by_divsym(h, &|_| true, &go()).unwrap();
        assert_eq!(by_class, by_ds, "h = {h}");
        nonzero += by_class.nonzero();
    }
    assert!(nonzero > 300, "{nonzero} nonzero coefficients");
}

#[test]
#[ignore = "nightly: about a minute of the DS_h method in the debug build"]
fn class_method_agrees_with_ds_h_for_every_h_at_n_7() {
    // The same for the 429 functions of n = 7, every entry. The DS_h side is the slow one
    // (about 50 s of one core in the debug build), so the functions run on a pool of
    // their own (the global pool stays free for the other tests, which time a cancel).
    let all = HessenbergFn::all(7);
    assert_eq!(all.len(), 429);
    let pool = rayon::ThreadPoolBuilder::new()
        .num_threads(2)
        .build()
        .unwrap();
    let nonzero: usize = pool.install(|| {
        all.par_iter()
            .map(|h| {
                let by_class = coefficient_table_by_class(h, &|_| true, &go()).unwrap();
                let by_ds = coefficient_table_by_divsym(h, &|_| true, &go()).unwrap();
                assert_eq!(by_class, by_ds, "h = {h}");
                by_class.nonzero()
            })
            .sum()
    });
    assert!(nonzero > 10_000, "{nonzero} nonzero coefficients");
}

#[test]
fn select_sees_the_listing_index_and_zeros_are_kept() {
    for h in ["3,3,4,5,5", "2,4,4,5,6,6", "2,3,4,5,6,7,7"] {
        let h = HessenbergFn::parse(h, None).unwrap();
        let shard = |i: usize| i % 3 == 1;
        let by_class = coefficient_table_by_class(&h, &shard, &go()).unwrap();
        assert_eq!(
            by_class,
            coefficient_table_by_divsym(&h, &shard, &go()).unwrap(),
            "h = {h}"
        );
        let listing = perms_of_length(h.n(), h.dimension());
        assert_eq!(by_class.listed, listing.len());
        for e in &by_class.entries {
            assert_eq!(e.index % 3, 1);
            assert_eq!(e.perm, listing[e.index]);
        }
    }
    // h = (2,3,3,4,5): a table with zero entries, which are listed
    let h = HessenbergFn::parse("1,3,3,5,5", None).unwrap();
    let t = coefficient_table_by_class(&h, &|_| true, &go()).unwrap();
    assert!(
        t.entries.iter().any(|e| e.value.is_zero()),
        "zeros are kept"
    );
    assert_eq!(t.entries.len(), t.listed);
}

#[test]
fn point_and_full_hessenberg_varieties() {
    // Common practice: h(i) = i gives n! points, so a^h_id = n!; h(i) = n gives the whole
    // flag variety, a^h_{w0} = 1. Up to n = 12 by the class (Q_h = Δ with 66 factors).
    for n in 1..=12usize {
        let point = HessenbergFn::new(&(1..=n).collect::<Vec<_>>()).unwrap();
        let t = coefficient_table_by_class(&point, &|_| true, &go()).unwrap();
        let factorial: u64 = (1..=n as u64).product();
        assert_eq!(t.entries.len(), 1);
        assert_eq!(t.entries[0].perm, Perm::identity(n));
        assert_eq!(t.entries[0].value, BigInt::from(factorial), "n = {n}");
        let full = HessenbergFn::new(&vec![n; n]).unwrap();
        let t = coefficient_table_by_class(&full, &|_| true, &go()).unwrap();
        assert_eq!(t.entries.len(), 1);
        assert_eq!(
            (t.entries[0].perm.clone(), t.entries[0].value.clone()),
            (Perm::longest(n), BigInt::from(1))
        );
    }
}

#[test]
fn the_class_does_not_depend_on_the_order_of_its_factors() {
    // Q_h through Monk in the chosen order, against the polynomial Q_h multiplied out and
    // expanded by peeling (no Monk step at all), for every h up to n = 5.
    for n in 1..=5 {
        for h in HessenbergFn::all(n) {
            let class = hessenberg_class(&h, &go()).unwrap();
            let q = h.complement_product().unwrap().to_rational();
            let peeled = schubert_expansion(&q, Space::Flag(n), &go()).unwrap();
            let got: Vec<(Perm, BigRational)> = class
                .sorted_terms()
                .into_iter()
                .map(|(w, c)| (w, BigRational::from_integer(c)))
                .collect();
            assert_eq!(got, peeled.terms, "h = {h}");
            assert_eq!(class_factors(&h).len(), h.complement_pairs().len());
        }
    }
}

#[test]
fn the_sweep_counts_catalan_many_functions_and_matches_per_h_tables() {
    // Catalan numbers, OEIS A000108: 1, 1, 2, 5, 14, 42, 132, 429, 1430
    let catalan = [1usize, 1, 2, 5, 14, 42, 132, 429, 1430];
    for (n, &count) in catalan.iter().enumerate().skip(1) {
        let rows = sweep_every_h(n, &go()).unwrap();
        assert_eq!(rows.len(), count, "n = {n}");
        let hs: Vec<HessenbergFn> = rows.iter().map(|r| r.h.clone()).collect();
        assert_eq!(hs, HessenbergFn::all(n), "lexicographic order");
        // the classes are effective: no negative coefficient (common practice)
        assert!(rows.iter().all(|r| r.negative == 0), "n = {n}");
        if n <= 6 {
            for r in &rows {
                let t = coefficient_table_by_divsym(&r.h, &|_| true, &go()).unwrap();
                assert_eq!(r.dimension, r.h.dimension());
                assert_eq!(r.total, t.total(), "h = {}", r.h);
                assert_eq!(r.nonzero, t.nonzero(), "h = {}", r.h);
                assert_eq!(r.max, t.max(), "h = {}", r.h);
                assert_eq!(r.negative, t.negative().len(), "h = {}", r.h);
            }
        }
    }
}

#[test]
fn sizes_are_refused_before_the_work() {
    // M(13, 39) permutations would be listed: far above the limit
    let h = HessenbergFn::parse("4,5,6,7,8,9,10,11,12,13,13,13,13", None).unwrap();
    let listed = elbowroom::math::perms::listing::mahonian_row(13)[h.dimension()];
    assert!(listed > CLASS_TABLE_LIMIT);
    let progress = go();
    match coefficient_table_by_class(&h, &|_| true, &progress) {
        Err(MathError::OutOfRange(m)) => {
            assert!(
                m.contains(&listed.to_string()) && m.contains(&CLASS_TABLE_LIMIT.to_string()),
                "{m}"
            );
        }
        other => panic!("expected a refusal, got {:?}", other.map(|t| t.listed)),
    }
    assert_eq!(progress.done(), 0, "refused before any work");
    let e = sweep_every_h(SWEEP_MAX_N + 1, &go()).unwrap_err();
    assert!(e.to_string().contains(&SWEEP_MAX_N.to_string()), "{e}");
}

/// Runs `work` on a thread, cancels after `after`, and returns how long the stop took.
fn stop_time<T: Send + 'static>(
    after: Duration,
    work: impl FnOnce(&Progress) -> Result<T, MathError> + Send + 'static,
) -> (Duration, bool) {
    let progress = Arc::new(Progress::default());
    let p = progress.clone();
    let handle = std::thread::spawn(move || work(&p).map(|_| ()));
    std::thread::sleep(after);
    let asked = Instant::now();
    progress.cancel();
    let result = handle.join().unwrap();
    (asked.elapsed(), matches!(result, Err(MathError::Canceled)))
}

#[test]
fn cancel_takes_effect_quickly() {
    // A large table (n = 11, |h| = 27, M(11, 27) = 2 409 581 listed) and the sweep at n = 10,
    // each cancelled mid-run. The bound here is loose (debug build on a shared machine);
    // the release build is timed by the benchmarks.
    let h = HessenbergFn::parse("4,5,6,7,8,9,10,11,11,11,11", None).unwrap();
    assert_eq!(h.dimension(), 27);
    let (took, canceled) = stop_time(Duration::from_millis(300), move |p| {
        coefficient_table_by_class(&h, &|_| true, p)
    });
    assert!(canceled, "the table was not cancelled (it finished first?)");
    assert!(
        took < Duration::from_millis(1000),
        "the table stopped after {took:?}"
    );
    let (took, canceled) = stop_time(Duration::from_millis(300), |p| sweep_every_h(10, p));
    assert!(canceled, "the sweep was not cancelled");
    assert!(
        took < Duration::from_millis(1000),
        "the sweep stopped after {took:?}"
    );
    // cancelled before the start: nothing is computed
    let p = go();
    p.cancel();
    let h = HessenbergFn::default_for(6).unwrap();
    assert_eq!(
        coefficient_table_by_class(&h, &|_| true, &p).unwrap_err(),
        MathError::Canceled
    );
}

#[test]
fn entries_are_read_at_w0_w() {
    // (w0 w)(i) = n + 1 − w(i): the entry of w is the coefficient of S_{w0 w}
    let h = HessenbergFn::parse("2,3,4,5,5", None).unwrap();
    let class = hessenberg_class(&h, &go()).unwrap();
    let t = coefficient_table_by_class(&h, &|_| true, &go()).unwrap();
    for e in &t.entries {
        let line: Vec<usize> = e.perm.one_line().iter().map(|v| 6 - v).collect();
        let key = PackedPerm::from_perm(&Perm::from_one_line(&line).unwrap());
        assert_eq!(class.coefficient(key), e.value);
        assert!(!e.value.is_negative());
    }
    assert_eq!(class.len(), t.nonzero());
}
