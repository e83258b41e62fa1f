//! Benchmarks of the combinatorial core, each beside a naive baseline measured in
//! the same run: Schubert polynomials of all of S_8 (transition in one table vs
//! divided differences), the number of reduced words of w0 (layers vs plain
//! recursion), and pipe dream enumeration (ladder-move tree vs a search with a
//! set of dreams seen).
#![allow(clippy::unwrap_used, missing_docs)]

use criterion::{Criterion, criterion_group, criterion_main};
use elbowroom::math::Perm;
use elbowroom::math::Progress;
use elbowroom::math::perms::words::{
    count_reduced_words, count_reduced_words_by_rank, count_reduced_words_layered, reduced_words,
};
use elbowroom::math::pipes::dream::{PipeDream, pipe_dreams};
use elbowroom::math::schubert::polynomial::{SchubertTable, schubert_by_divided_differences};
use std::collections::HashSet;
use std::hint::black_box;
use std::time::Duration;

fn schubert_all(c: &mut Criterion) {
    let mut g = c.benchmark_group("schubert");
    g.sample_size(10).measurement_time(Duration::from_secs(20));
    let all8: Vec<Perm> = Perm::all(8).collect();
    g.bench_function("transition_all_of_s8_40320", |b| {
        b.iter(|| {
            let mut t = SchubertTable::new();
            let mut terms = 0usize;
            for w in &all8 {
                terms += t.get(w).len();
            }
            black_box(terms)
        })
    });
    // the baseline per permutation: every 400th permutation of S_8 (101 of them)
    let sample: Vec<Perm> = all8.iter().step_by(400).cloned().collect();
    g.bench_function("divided_differences_101_of_s8", |b| {
        b.iter(|| {
            let mut terms = 0usize;
            for w in &sample {
                terms += schubert_by_divided_differences(w).len();
            }
            black_box(terms)
        })
    });
    g.bench_function("transition_fresh_table_101_of_s8", |b| {
        b.iter(|| {
            let mut terms = 0usize;
            for w in &sample {
                let mut t = SchubertTable::new();
                terms += t.get(w).len();
            }
            black_box(terms)
        })
    });
    g.finish();
}

fn naive_count(w: &mut Vec<u8>, len: usize) -> u64 {
    if len == 0 {
        return 1;
    }
    let mut total = 0;
    for i in 0..w.len() - 1 {
        if w[i] > w[i + 1] {
            w.swap(i, i + 1);
            total += naive_count(w, len - 1);
            w.swap(i, i + 1);
        }
    }
    total
}

fn words(c: &mut Criterion) {
    let mut g = c.benchmark_group("reduced_words");
    g.sample_size(10).measurement_time(Duration::from_secs(10));
    let w10 = Perm::longest(10);
    let p = Progress::default();
    // w0 is vexillary, so count_reduced_words takes the hook formula; time the rank pull itself too
    g.bench_function("count_w0_s10_rank", |b| {
        b.iter(|| black_box(count_reduced_words_by_rank(&w10, &p).unwrap()))
    });
    g.bench_function("count_w0_s10_hooks", |b| {
        b.iter(|| black_box(count_reduced_words(&w10).unwrap()))
    });
    g.bench_function("count_w0_s10_layers", |b| {
        b.iter(|| black_box(count_reduced_words_layered(&w10, &p).unwrap()))
    });
    // the plain recursion visits every word (292864 of them for w0 in S_6)
    let w6 = Perm::longest(6);
    g.bench_function("count_w0_s6_rank", |b| {
        b.iter(|| black_box(count_reduced_words_by_rank(&w6, &p).unwrap()))
    });
    g.bench_function("count_w0_s6_layers", |b| {
        b.iter(|| black_box(count_reduced_words_layered(&w6, &p).unwrap()))
    });
    g.bench_function("count_w0_s6_naive_recursion", |b| {
        b.iter(|| {
            let mut v: Vec<u8> = w6.as_bytes().to_vec();
            black_box(naive_count(&mut v, 15))
        })
    });
    g.bench_function("list_w0_s6_lazy_292864", |b| {
        b.iter(|| black_box(reduced_words(&w6).count()))
    });
    g.finish();
}

fn dreams_by_set(w: &Perm) -> usize {
    let start = PipeDream::bottom(w);
    let mut seen = HashSet::from([start]);
    let mut queue = vec![start];
    while let Some(d) = queue.pop() {
        for (i, j) in d.crosses() {
            if let Some(e) = d.ladder_move_at(i, j)
                && seen.insert(e)
            {
                queue.push(e);
            }
        }
    }
    seen.len()
}

fn dreams(c: &mut Criterion) {
    let mut g = c.benchmark_group("pipe_dreams");
    g.sample_size(10).measurement_time(Duration::from_secs(10));
    // 132987654 has 163592 reduced pipe dreams, the most in S_9
    let w = Perm::parse("132987654").unwrap();
    g.bench_function("enumerate_132987654_tree", |b| {
        b.iter(|| black_box(pipe_dreams(&w).count()))
    });
    g.bench_function("enumerate_132987654_set_baseline", |b| {
        b.iter(|| black_box(dreams_by_set(&w)))
    });
    g.finish();
}

criterion_group!(benches, schubert_all, words, dreams);
criterion_main!(benches);
