//! Reduced words: published counts (Stanley 1984 / OEIS A005118), Macdonald's
//! identity, a naive recursive count, lexicographic order, contents and moves.
#![allow(clippy::unwrap_used)]

use elbowroom::math::Perm;
use elbowroom::math::Progress;
use elbowroom::math::perms::words::{
    apply_word_move, content, count_reduced_words, count_reduced_words_by_rank,
    count_reduced_words_layered, count_reduced_words_vexillary, counts_by_content, reduced_words,
    word_moves,
};
use elbowroom::math::schubert::polynomial::SchubertTable;
use num_bigint::{BigInt, BigUint};
use num_traits::{One, ToPrimitive, Zero};
use proptest::prelude::*;
use std::collections::{BTreeMap, HashSet};

/// OEIS A005118: number of reduced words of the longest element of S_n, n = 1..10.
const A005118: [&str; 10] = [
    "1",
    "1",
    "2",
    "16",
    "768",
    "292864",
    "1100742656",
    "48608795688960",
    "29258366996258488320",
    "273035280663535522487992320",
];

/// Stanley (European J. Combin. 1984): the reduced words of w0 in S_n are counted
/// by the standard Young tableaux of the staircase (n-1, ..., 1); the hook of cell
/// (i, j) is 2(n - i - j) + 1, so the count is N! / Π_{k=1}^{n-1} (2k - 1)^{n-k}.
fn stanley_staircase(n: usize) -> BigUint {
    let big_n = n * (n - 1) / 2;
    let mut num = BigUint::one();
    for k in 1..=big_n {
        num *= BigUint::from(k);
    }
    let mut den = BigUint::one();
    for k in 1..n {
        for _ in 0..(n - k) {
            den *= BigUint::from(2 * k - 1);
        }
    }
    assert!((&num % &den).is_zero());
    num / den
}

#[test]
fn oeis_a005118_agrees_with_the_hook_formula() {
    for n in 1..=10 {
        assert_eq!(stanley_staircase(n).to_string(), A005118[n - 1], "n = {n}");
    }
}

#[test]
fn longest_element_counts_match_a005118() {
    for n in 1..=9 {
        assert_eq!(
            count_reduced_words(&Perm::longest(n)).unwrap().to_string(),
            A005118[n - 1],
            "n = {n}"
        );
    }
}

#[test]
fn rank_and_layered_methods_agree() {
    let p = Progress::default();
    for n in 1..=7 {
        for w in Perm::all(n).step_by(if n == 7 { 11 } else { 1 }) {
            let by_rank = count_reduced_words_by_rank(&w, &p).unwrap().unwrap();
            assert_eq!(
                by_rank,
                count_reduced_words_layered(&w, &p).unwrap(),
                "w = {w}"
            );
        }
    }
    for n in 8..=9 {
        let w = Perm::longest(n);
        assert_eq!(
            count_reduced_words_layered(&w, &p).unwrap().to_string(),
            A005118[n - 1]
        );
        let by_rank = count_reduced_words_by_rank(&w, &p).unwrap().unwrap();
        assert_eq!(by_rank.to_string(), A005118[n - 1]);
    }
    // beyond the rank limit the rank method declines
    let big = Perm::parse("12,11,10,9,8,7,6,5,4,3,2,1").unwrap();
    assert!(count_reduced_words_by_rank(&big, &p).unwrap().is_none());
    let small_big = Perm::parse("2,1,3,4,5,6,7,8,9,10,11,12").unwrap();
    assert_eq!(count_reduced_words(&small_big).unwrap(), BigUint::one());
}

/// Stanley 1984 / Edelman–Greene 1987: for vexillary w the reduced words are
/// counted by the standard Young tableaux of the sorted code (hook length formula).
#[test]
fn hook_formula_for_vexillary_permutations_agrees_with_the_count() {
    let p = Progress::default();
    let mut vexillary = 0;
    for n in 1..=7 {
        for w in Perm::all(n) {
            if let Some(by_hooks) = count_reduced_words_vexillary(&w) {
                vexillary += 1;
                let by_rank = count_reduced_words_by_rank(&w, &p).unwrap().unwrap();
                assert_eq!(by_hooks, by_rank, "w = {w}");
            }
        }
    }
    assert!(vexillary > 2000);
    // and w0 of every size, against A005118 and beyond the reach of the layers
    for n in 1..=10 {
        assert_eq!(
            count_reduced_words(&Perm::longest(n)).unwrap().to_string(),
            A005118[n - 1]
        );
    }
    assert_eq!(
        count_reduced_words(&Perm::longest(16)).unwrap(),
        stanley_staircase(16)
    );
}

#[test]
fn lazy_listing_of_w0_in_s5_has_768_words() {
    assert_eq!(reduced_words(&Perm::longest(5)).count(), 768);
}

/// A naive reference: R(w) = Σ over right descents i of R(w s_i), no layers, no memo.
fn naive_count(w: &Perm) -> u64 {
    if w.length() == 0 {
        return 1;
    }
    w.descents()
        .iter()
        .map(|&i| naive_count(&w.times_s(i).unwrap()))
        .sum()
}

#[test]
fn listing_counting_and_naive_recursion_agree_up_to_s6() {
    for n in 1..=6 {
        for w in Perm::all(n) {
            let words: Vec<Vec<usize>> = reduced_words(&w).collect();
            let count = count_reduced_words(&w).unwrap();
            assert_eq!(BigUint::from(words.len()), count, "w = {w}");
            if n <= 5 {
                assert_eq!(naive_count(&w), count.to_u64().unwrap(), "w = {w}");
            }
            // strictly increasing in lex order, hence no repeats
            assert!(words.windows(2).all(|p| p[0] < p[1]), "w = {w}");
            for a in &words {
                assert_eq!(a.len(), w.length());
                assert_eq!(Perm::from_word(a, Some(n)).unwrap(), w, "word {a:?}");
            }
        }
    }
}

#[test]
fn contents_tally_the_listed_words() {
    for n in 1..=5 {
        for w in Perm::all(n) {
            let mut tally: BTreeMap<Vec<usize>, BigUint> = BTreeMap::new();
            for a in reduced_words(&w) {
                *tally.entry(content(&a, n)).or_insert_with(BigUint::zero) += 1u8;
            }
            assert_eq!(counts_by_content(&w), tally, "w = {w}");
        }
    }
    // the total over contents is the count
    let w = Perm::longest(6);
    let total: BigUint = counts_by_content(&w).values().sum();
    assert_eq!(total, count_reduced_words(&w).unwrap());
}

/// Macdonald, Notes on Schubert Polynomials (1991), (6.11) (number from memory):
/// Σ_{a in R(w)} a_1 a_2 ... a_l = l! S_w(1, ..., 1).
#[test]
fn macdonald_identity_up_to_s6() {
    let mut table = SchubertTable::new();
    for n in 1..=6 {
        for w in Perm::all(n) {
            let lhs: BigInt = reduced_words(&w)
                .map(|a| a.iter().fold(BigInt::one(), |p, &x| p * BigInt::from(x)))
                .sum();
            let l = w.length();
            let fact: BigInt = (1..=l).fold(BigInt::one(), |p, k| p * BigInt::from(k));
            let rhs = fact * table.get(&w).coefficient_sum();
            assert_eq!(lhs, rhs, "w = {w}");
        }
    }
}

/// Matsumoto–Tits: the reduced words of w are connected by commutation and braid moves.
#[test]
fn moves_stay_in_and_connect_the_reduced_words() {
    for n in 1..=5 {
        for w in Perm::all(n) {
            let all: HashSet<Vec<usize>> = reduced_words(&w).collect();
            let first = reduced_words(&w).next().unwrap();
            let mut seen = HashSet::from([first.clone()]);
            let mut queue = vec![first];
            while let Some(a) = queue.pop() {
                for mv in word_moves(&a) {
                    let b = apply_word_move(&a, mv).unwrap();
                    assert!(all.contains(&b), "w = {w}, {a:?} -> {b:?}");
                    if seen.insert(b.clone()) {
                        queue.push(b);
                    }
                }
            }
            assert_eq!(seen, all, "w = {w}");
        }
    }
}

#[test]
fn moves_that_do_not_apply_are_refused() {
    use elbowroom::math::perms::words::WordMove;
    assert!(apply_word_move(&[1, 2], WordMove::Commute { at: 0 }).is_err());
    assert!(apply_word_move(&[1, 2, 3], WordMove::Braid { at: 0 }).is_err());
    assert!(apply_word_move(&[1, 3], WordMove::Commute { at: 1 }).is_err());
}

/// OEIS A008302 (Mahonian numbers): permutations of S_n by number of inversions.
#[test]
fn mahonian_numbers() {
    let rows: [&[u64]; 5] = [
        &[1],
        &[1, 1],
        &[1, 2, 2, 1],
        &[1, 3, 5, 6, 5, 3, 1],
        &[1, 4, 9, 15, 20, 22, 20, 15, 9, 4, 1],
    ];
    for (k, row) in rows.iter().enumerate() {
        let n = k + 1;
        let mut by_len = vec![0u64; n * (n - 1) / 2 + 1];
        for w in Perm::all(n) {
            by_len[w.length()] += 1;
        }
        assert_eq!(&by_len[..], *row, "n = {n}");
    }
}

fn perm_strategy() -> impl Strategy<Value = Perm> {
    (2usize..=9).prop_flat_map(|n| {
        Just((1..=n).collect::<Vec<usize>>())
            .prop_shuffle()
            .prop_map(|v| Perm::from_one_line(&v).unwrap())
    })
}

proptest! {
    #[test]
    fn code_and_permutation_round_trip(w in perm_strategy()) {
        prop_assert_eq!(Perm::from_code(&w.code(), Some(w.n())).unwrap(), w);
    }

    #[test]
    fn listed_words_multiply_to_w(w in perm_strategy()) {
        for a in reduced_words(&w).take(200) {
            prop_assert_eq!(a.len(), w.length());
            prop_assert_eq!(Perm::from_word(&a, Some(w.n())).unwrap(), w.clone());
        }
    }

    #[test]
    fn inverse_reverses_words(w in perm_strategy()) {
        // a word of w read backwards is a word of w^{-1}: equal counts
        prop_assume!(w.length() <= 18);
        prop_assert_eq!(count_reduced_words(&w).unwrap(), count_reduced_words(&w.inverse()).unwrap());
    }
}
