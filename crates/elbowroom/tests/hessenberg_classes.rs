//! Hessenberg class tables a^h_w = DS_h(S_w): facts of the trade, the definition,
//! the Schubert expansion of Anderson–Tymoczko's class, and reduced words.
#![allow(clippy::unwrap_used)]

use elbowroom::math::hessenberg::coefficients::coefficient_table;
use elbowroom::math::hessenberg::divsym::divided_symmetrize_number_by_definition;
use elbowroom::math::hessenberg::function::HessenbergFn;
use elbowroom::math::hessenberg::reference::coefficient_table_by_divsym;
use elbowroom::math::perms::listing::perms_of_length;
use elbowroom::math::perms::words;
use elbowroom::math::permutohedra::mixed_eulerian::mixed_eulerian_numbers;
use elbowroom::math::schubert::polynomial::SchubertTable;
use elbowroom::math::{IntPoly, MathError, Perm, Progress};
use num_bigint::BigInt;
use num_rational::BigRational;
use num_traits::{Signed, Zero};
use std::collections::{BTreeMap, HashMap};

fn table(h: &HessenbergFn) -> Vec<(Perm, BigInt)> {
    coefficient_table(h, &|_| true, &Progress::new(0))
        .unwrap()
        .entries
        .into_iter()
        .map(|e| (e.perm, e.value))
        .collect()
}

#[test]
fn listing_sizes_are_mahonian_numbers() {
    // OEIS A008302 (Mahonian numbers): row n = 5 is 1 4 9 15 20 22 20 15 9 4 1
    let row = [1usize, 4, 9, 15, 20, 22, 20, 15, 9, 4, 1];
    for (k, &c) in row.iter().enumerate() {
        let list = perms_of_length(5, k);
        assert_eq!(list.len(), c);
        assert!(list.windows(2).all(|w| w[0] < w[1]), "lexicographic order");
        assert!(list.iter().all(|w| w.length() == k));
    }
    // the default tables: n = 9 lists T(9, 8) = 3606 and n = 10 lists T(10, 9) = 13640 (A008302)
    assert_eq!(perms_of_length(9, 8).len(), 3606);
    assert_eq!(perms_of_length(10, 9).len(), 13640);
}

#[test]
fn point_and_full_hessenberg_varieties() {
    // Common practice: h(i) = i gives n! points, so a^h_id = n!; h(i) = n gives the
    // whole flag variety, whose class is the fundamental class: a^h_{w0} = 1.
    for n in 1..=6usize {
        let point = HessenbergFn::new(&(1..=n).collect::<Vec<_>>()).unwrap();
        let t = table(&point);
        let fact: u64 = (1..=n as u64).product();
        assert_eq!(t, vec![(Perm::identity(n), BigInt::from(fact))]);
        let full = HessenbergFn::new(&vec![n; n]).unwrap();
        assert_eq!(table(&full), vec![(Perm::longest(n), BigInt::from(1))]);
    }
}

#[test]
fn every_coefficient_is_a_nonnegative_integer_for_all_h_up_to_n_5() {
    // Common practice (the class of a Hessenberg variety is effective); Catalan(5) = 42 functions
    let all = HessenbergFn::all(5);
    assert_eq!(all.len(), 42);
    for n in 1..=5 {
        for h in HessenbergFn::all(n) {
            for (w, v) in table(&h) {
                assert!(!v.is_negative(), "a^h_w < 0 for h = {h}, w = {w}");
            }
        }
    }
}

#[test]
fn table_entries_match_the_definition_up_to_n_5() {
    let mut memo = SchubertTable::new();
    for n in 2..=5 {
        for h in HessenbergFn::all(n) {
            for (w, v) in table(&h) {
                let s = memo.get(&w);
                let slow = divided_symmetrize_number_by_definition(&s, &h).unwrap();
                assert_eq!(BigRational::from_integer(v), slow, "h = {h}, w = {w}");
            }
        }
    }
}

/// ∂_v f for v in S_n, applying ∂_i for a descent i of v first: ∂_v = ∂_{v s_i} ∂_i.
fn apply_divided_differences(v: &Perm, f: &IntPoly) -> IntPoly {
    let mut v = v.clone();
    let mut f = f.clone();
    while let Some(i) = (1..v.n()).find(|&i| v.has_descent(i)) {
        f = f.divided_difference(i);
        v = v.times_s(i).unwrap();
    }
    f
}

#[test]
fn anderson_tymoczko_class_expanded_in_schubert_classes() {
    // Anderson, Tymoczko (J. Algebra 2010), from memory: the class of the regular
    // Hessenberg variety of h in H*(Fl_n) is Q_h = Π_{i<j, j>h(i)} (x_i - x_j). Its
    // coefficient on σ_v is ∂_v Q_h at x = 0 (Schubert duality); the coefficient on
    // σ_{w0 w} must equal a^h_w = DS_h(S_w). This runs no divided symmetrization.
    for n in 2..=5 {
        let w0 = Perm::longest(n);
        for h in HessenbergFn::all(n) {
            let q = h.complement_product().unwrap();
            for (w, v) in table(&h) {
                let u = w0.compose(&w).unwrap();
                assert_eq!(u.length(), q.degree() as usize);
                let c = apply_divided_differences(&u, &q);
                let constant = c
                    .terms()
                    .iter()
                    .find(|(m, _)| m.degree() == 0)
                    .map(|(_, c)| c.clone())
                    .unwrap_or_else(BigInt::zero);
                assert_eq!(constant, v, "h = {h}, w = {w}, w0 w = {u}");
            }
        }
    }
}

/// Reduced words of w by their content (c_i = number of letters i), by recursion on the
/// last letter: the last letter of a reduced word of w is a descent of w.
fn counts_by_content(
    w: &Perm,
    memo: &mut HashMap<Perm, BTreeMap<Vec<usize>, BigInt>>,
) -> BTreeMap<Vec<usize>, BigInt> {
    if let Some(v) = memo.get(w) {
        return v.clone();
    }
    let n = w.n();
    let mut out = BTreeMap::new();
    if w.length() == 0 {
        out.insert(vec![0; n.saturating_sub(1)], BigInt::from(1));
    } else {
        for i in 1..n {
            if w.has_descent(i) {
                let v = w.times_s(i).unwrap();
                for (mut c, k) in counts_by_content(&v, memo) {
                    c[i - 1] += 1;
                    *out.entry(c).or_insert_with(BigInt::zero) += k;
                }
            }
        }
    }
    memo.insert(w.clone(), out.clone());
    out
}

#[test]
fn coefficients_are_averages_of_mixed_eulerian_numbers_over_reduced_words() {
    // For ℓ(w) = n-1: a_w = DS_n(S_w) = (1/(n-1)!) Σ_{a in R(w)} A_{content(a)}, a reduced-word
    // form of the class of the permutohedral variety (Nadeau, Tewari, "Divided symmetrization
    // and quasisymmetric functions", from memory; it has the shape of Macdonald's identity
    // Σ_{a in R(w)} a_1 ... a_l = l! S_w(1, ..., 1)). The two sides share no code: the right side
    // counts reduced words by content (math::perms::words) and takes A_c from the mixed Eulerian walk.
    for n in 2..=7 {
        let h = HessenbergFn::default_for(n).unwrap();
        let a: BTreeMap<Vec<u32>, BigInt> = mixed_eulerian_numbers(n, &Progress::new(0))
            .unwrap()
            .into_iter()
            .collect();
        let fact: u64 = (1..n as u64).product();
        let mut memo = HashMap::new();
        for (w, v) in table(&h) {
            let by_content = words::counts_by_content(&w);
            // the word counts agree with a small local enumeration (recursion on descents)
            let local = counts_by_content(&w, &mut memo);
            let converted: BTreeMap<Vec<usize>, BigInt> = by_content
                .iter()
                .map(|(c, k)| (c.clone(), BigInt::from(k.clone())))
                .collect();
            assert_eq!(converted, local, "reduced words of {w}");
            let mut total = BigInt::zero();
            for (c, k) in converted {
                let c32: Vec<u32> = c.iter().map(|&x| x as u32).collect();
                total += &a[&c32] * k;
            }
            assert_eq!(
                BigRational::new(total, BigInt::from(fact)),
                BigRational::from_integer(v),
                "w = {w}"
            );
        }
    }
}

#[test]
fn shards_partition_the_table_and_cancel_stops_the_work() {
    let h = HessenbergFn::default_for(6).unwrap();
    let whole = table(&h);
    let mut pieces: Vec<(Perm, BigInt)> = Vec::new();
    for k in 0..3 {
        let t = coefficient_table(&h, &|i| i % 3 == k, &Progress::new(0)).unwrap();
        pieces.extend(t.entries.into_iter().map(|e| (e.perm, e.value)));
    }
    pieces.sort();
    assert_eq!(pieces, whole);
    let p = Progress::new(0);
    p.cancel();
    assert_eq!(
        coefficient_table(&h, &|_| true, &p).unwrap_err(),
        MathError::Canceled
    );
}

#[test]
fn transition_values_agree_with_schubert_polynomials() {
    use elbowroom::math::hessenberg::reference::coefficient_table_by_polynomials;
    let mut cases: Vec<HessenbergFn> = (1..=5).flat_map(HessenbergFn::all).collect();
    cases.extend((6..=8).map(|n| HessenbergFn::default_for(n).unwrap()));
    cases.push(HessenbergFn::new(&[3, 3, 4, 6, 6, 6]).unwrap());
    for h in cases {
        let fast = coefficient_table_by_divsym(&h, &|_| true, &Progress::new(0)).unwrap();
        let slow = coefficient_table_by_polynomials(&h, &|_| true, &Progress::new(0)).unwrap();
        assert_eq!(fast, slow, "h = {h}");
    }
}
