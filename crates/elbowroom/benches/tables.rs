//! The two halves of a Hessenberg table, each beside its baseline in the same
//! run: a Monk step (x_i − x_j) · P on the flat bucketed vector against the same
//! step on one hash map (`SchubertVector::times_linear`), and the row reader (one
//! backward merge of the listing with the sorted class) against a binary-search
//! look-up per row. The Monk step also runs on the wide key (five bits an
//! entry, what n = 17 needs) beside the 64-bit key, on the same input.
#![allow(missing_docs, clippy::unwrap_used)]

use criterion::{BatchSize, Criterion, criterion_group, criterion_main};
use elbowroom::math::Progress;
use elbowroom::math::hessenberg::class::class_factors;
use elbowroom::math::hessenberg::function::HessenbergFn;
use elbowroom::math::hessenberg::rows::{FlatClass, flat_class, for_each_row_of};
use elbowroom::math::perms::listing::for_each_of_length;
use elbowroom::math::schubert::flat::{FlatKey, FlatVector, LexKey, WideLexKey};
use elbowroom::math::schubert::vector::{LinearForm, SchubertVector, Space};
use std::hint::black_box;
use std::time::Duration;

/// The partial product of the default h of n after all but its last `left` factors,
/// both ways, and the next factor.
fn partial(n: usize, left: usize) -> (FlatVector<i64>, SchubertVector<i64>, (usize, usize)) {
    let h = HessenbergFn::default_for(n).unwrap();
    let factors = class_factors(&h);
    let upto = factors.len() - left;
    let go = Progress::default();
    let mut flat = FlatVector::<i64>::one(n).unwrap();
    let mut map = SchubertVector::<i64>::one(Space::Flag(n));
    for &(i, j) in &factors[..upto] {
        flat = flat.times_difference((i, j), &go, u128::MAX).unwrap();
        map = map
            .times_linear(&LinearForm::difference(i, j).unwrap(), &go)
            .unwrap();
    }
    assert_eq!(flat.len(), map.len());
    (flat, map, factors[upto])
}

fn monk_step(c: &mut Criterion) {
    let mut g = c.benchmark_group("monk_step");
    g.sample_size(10);
    g.warm_up_time(Duration::from_secs(1));
    g.measurement_time(Duration::from_secs(4));
    for (n, left) in [(11usize, 1usize), (12, 1)] {
        let (flat, map, (i, j)) = partial(n, left);
        let form = LinearForm::difference(i, j).unwrap();
        let label = format!("n{n}_last_factor_{}_terms", flat.len());
        g.bench_function(format!("{label}/flat_buckets"), |b| {
            b.iter_batched(
                || flat.clone(),
                |v| black_box(v.times_difference((i, j), &Progress::default(), u128::MAX)),
                BatchSize::LargeInput,
            )
        });
        // the same input on the wide key: what packing for S_17 costs
        let wide = {
            let mut v = FlatVector::<i64, WideLexKey>::one(n).unwrap();
            let h = HessenbergFn::default_for(n).unwrap();
            let factors = class_factors(&h);
            for &f in &factors[..factors.len() - left] {
                v = v
                    .times_difference(f, &Progress::default(), u128::MAX)
                    .unwrap();
            }
            assert_eq!(v.len(), flat.len());
            v
        };
        g.bench_function(format!("{label}/flat_buckets_wide_key"), |b| {
            b.iter_batched(
                || wide.clone(),
                |v| black_box(v.times_difference((i, j), &Progress::default(), u128::MAX)),
                BatchSize::LargeInput,
            )
        });
        g.bench_function(format!("{label}/hash_map_baseline"), |b| {
            b.iter(|| black_box(map.times_linear(&form, &Progress::default()).unwrap()))
        });
    }
    g.finish();
}

fn row_reader(c: &mut Criterion) {
    let mut g = c.benchmark_group("row_reader");
    g.sample_size(10);
    g.warm_up_time(Duration::from_secs(1));
    g.measurement_time(Duration::from_secs(4));
    let h = HessenbergFn::default_for(12).unwrap();
    let class = flat_class(&h, &Progress::default()).unwrap();
    let FlatClass::Word(vector) = &class else {
        panic!("the default class of n = 12 fits i64");
    };
    g.bench_function("n12_default_h/merge", |b| {
        b.iter(|| {
            let mut sum = 0i128;
            for_each_row_of(&class, &h, &|_| true, &Progress::default(), &mut |row| {
                if let elbowroom::math::hessenberg::rows::RowValue::Int(v) = row.value {
                    sum += v;
                }
                Ok::<(), elbowroom::math::MathError>(())
            })
            .unwrap();
            black_box(sum)
        })
    });
    g.bench_function("n12_default_h/lookup_baseline", |b| {
        b.iter(|| {
            let mut sum = 0i128;
            for_each_of_length(12, h.dimension(), &mut |_, line| {
                sum += i128::from(vector.coefficient(LexKey::of_reversed(line, 12)));
                Ok(())
            })
            .unwrap();
            black_box(sum)
        })
    });
    g.finish();
}

criterion_group!(benches, monk_step, row_reader);
criterion_main!(benches);
