//! Reduced pipe dreams: enumeration against Schubert polynomials (Billey–Jockusch–
//! Stanley 1993), pipe tracing, ladder and chute moves (Bergeron–Billey 1993),
//! published counts (Catalan numbers, OEIS A000108), and bumpless pipe dreams
//! (Lam–Lee–Shimozono 2021).
#![allow(clippy::unwrap_used)]

use elbowroom::math::pipes::bumpless::{bumpless_dreams, count_bumpless};
use elbowroom::math::pipes::dream::{
    PipeDream, count_pipe_dreams, count_pipe_dreams_by_polynomial, pipe_dreams,
};
use elbowroom::math::pipes::moves::MoveKind;
use elbowroom::math::schubert::polynomial::SchubertTable;
use elbowroom::math::{IntPoly, Mono, Perm};
use num_bigint::{BigInt, BigUint};
use proptest::prelude::*;
use std::collections::HashSet;

fn poly_of(nvars: usize, monomials: impl Iterator<Item = Vec<u32>>) -> IntPoly {
    let mut b = elbowroom::math::PolyBuilder::new(nvars);
    let one = BigInt::from(1);
    for e in monomials {
        b.add_term(Mono::from_exps(&e).unwrap(), &one);
    }
    b.build()
}

#[test]
fn enumeration_matches_schubert_polynomials_up_to_s6() {
    let mut table = SchubertTable::new();
    for n in 1..=6 {
        for w in Perm::all(n) {
            let dreams: Vec<PipeDream> = pipe_dreams(&w).collect();
            let distinct: HashSet<PipeDream> = dreams.iter().copied().collect();
            assert_eq!(distinct.len(), dreams.len(), "repeat for w = {w}");
            assert_eq!(
                BigUint::from(dreams.len()),
                count_pipe_dreams(&w),
                "w = {w}"
            );
            assert_eq!(dreams[0], PipeDream::bottom(&w));
            assert!(distinct.contains(&PipeDream::top(&w)), "top dream of {w}");
            for d in &dreams {
                assert_eq!(d.permutation(), w, "{d:?}");
                assert!(d.is_reduced());
                assert_eq!(d.len(), w.length());
                assert_eq!(
                    Perm::from_reduced_word(&d.reading_word(), Some(n)).unwrap(),
                    w
                );
                assert_eq!(d.trace().permutation(), w, "trace of {d:?}");
            }
            let sum = poly_of(n, dreams.iter().map(|d| d.monomial()));
            assert_eq!(sum, *table.get(&w), "w = {w}");
        }
    }
}

#[test]
fn moves_preserve_permutation_and_stay_among_the_dreams() {
    for n in 2..=5 {
        for w in Perm::all(n) {
            let all: HashSet<PipeDream> = pipe_dreams(&w).collect();
            for d in &all {
                for mv in d.available_moves() {
                    let e = d.move_at(mv.kind, mv.from.0, mv.from.1).unwrap();
                    assert!(all.contains(&e), "{d:?} {mv:?}");
                    assert!(e.is_cross(mv.to.0, mv.to.1) && !e.is_cross(mv.from.0, mv.from.1));
                    let back = match mv.kind {
                        MoveKind::Ladder => e.ladder_back_at(mv.to.0, mv.to.1),
                        MoveKind::LadderBack => e.ladder_move_at(mv.to.0, mv.to.1),
                        MoveKind::Chute => e.chute_back_at(mv.to.0, mv.to.1),
                        MoveKind::ChuteBack => e.chute_move_at(mv.to.0, mv.to.1),
                    };
                    assert_eq!(back, Some(*d), "{mv:?} is undone");
                }
            }
        }
    }
}

/// Bergeron–Billey 1993: chute moves from the top dream also reach every dream.
#[test]
fn chute_moves_from_the_top_reach_every_dream() {
    for n in 2..=6 {
        for w in Perm::all(n) {
            let all: HashSet<PipeDream> = pipe_dreams(&w).collect();
            let top = PipeDream::top(&w);
            let mut seen = HashSet::from([top]);
            let mut queue = vec![top];
            while let Some(d) = queue.pop() {
                for (i, j) in d.crosses() {
                    if let Some(e) = d.chute_move_at(i, j)
                        && seen.insert(e)
                    {
                        queue.push(e);
                    }
                }
            }
            assert_eq!(seen, all, "w = {w}");
        }
    }
}

#[test]
fn transposing_gives_the_dreams_of_the_inverse() {
    for w in Perm::all(5) {
        let a: HashSet<PipeDream> = pipe_dreams(&w).map(|d| d.transpose()).collect();
        let b: HashSet<PipeDream> = pipe_dreams(&w.inverse()).collect();
        assert_eq!(a, b, "w = {w}");
    }
}

/// S_{1 (m+1) m ... 2}(1, ..., 1) is the Catalan number C_m (Woo 2004, conjectured by
/// Fomin–Kirillov; from memory); Catalan numbers from OEIS A000108.
#[test]
fn catalan_counts_for_one_followed_by_a_decreasing_run() {
    let catalan = [1u64, 1, 2, 5, 14, 42, 132, 429];
    for (m, &c) in catalan.iter().enumerate().skip(1) {
        let mut v = vec![1];
        v.extend((2..=m + 1).rev());
        let w = Perm::from_one_line(&v).unwrap();
        assert_eq!(count_pipe_dreams(&w), BigUint::from(c), "w = {w}");
        assert_eq!(pipe_dreams(&w).count() as u64, c, "w = {w}");
    }
}

/// Dominant permutations (132-avoiding) have S_w = x^{code}: a single pipe dream
/// (common practice; Macdonald 1991, (4.7) from memory).
#[test]
fn dominant_permutations_have_one_dream() {
    use elbowroom::math::perms::class::{PermClass, classes_of};
    for w in Perm::all(6) {
        if classes_of(&w).contains(&PermClass::Dominant) {
            assert_eq!(pipe_dreams(&w).count(), 1, "w = {w}");
        }
    }
    assert_eq!(pipe_dreams(&Perm::longest(8)).count(), 1);
}

#[test]
fn trace_labels_and_tiles() {
    // 312: bottom dream crosses (1,1), (1,2); pipe 2 enters row 2 and leaves at column 1
    let w = Perm::parse("2413").unwrap();
    for d in pipe_dreams(&w) {
        let t = d.trace();
        assert_eq!(t.tiles.len(), 4 + 3 + 2 + 1);
        for tile in &t.tiles {
            let expected = if tile.boundary { 1 } else { 2 };
            assert_eq!(tile.passages.len(), expected, "{tile:?}");
            assert_eq!(tile.cross, d.is_cross(tile.row, tile.col));
        }
        for (i, p) in t.pipes.iter().enumerate() {
            assert_eq!(p.entry_row, i + 1);
            assert_eq!(p.exit_col, w.at(i + 1));
            assert_eq!(p.cells[0], (i + 1, 1));
            assert_eq!(p.cells.last().unwrap().0, 1);
        }
        assert_eq!(t.tile(2, 3).unwrap().row, 2);
        assert_eq!(t.tile(2, 3).unwrap().col, 3);
        assert!(t.tile(3, 3).is_none());
    }
}

#[test]
fn bad_cells_are_refused() {
    assert!(PipeDream::from_crosses(4, &[(2, 3)]).is_err());
    assert!(PipeDream::from_crosses(4, &[(0, 1)]).is_err());
    assert!(PipeDream::empty(17).is_err());
    // (1,2) and (2,1) both stand for s_2: the word 2 2 is not reduced
    let twice = PipeDream::from_crosses(3, &[(1, 2), (2, 1)]).unwrap();
    assert_eq!(twice.reading_word(), vec![2, 2]);
    assert!(!twice.is_reduced());
    let d = PipeDream::from_crosses(3, &[(1, 1), (1, 2), (2, 1)]).unwrap();
    assert_eq!(d.reading_word(), vec![2, 1, 2]);
    assert!(d.is_reduced());
    assert_eq!(d.permutation(), Perm::parse("321").unwrap());
}

#[test]
fn bumpless_dreams_match_schubert_polynomials_up_to_s5() {
    let mut table = SchubertTable::new();
    for n in 1..=5 {
        for w in Perm::all(n) {
            let dreams = bumpless_dreams(&w);
            for d in &dreams {
                assert_eq!(d.permutation(), w, "{d:?}");
                assert_eq!(d.blanks().len(), w.length());
            }
            let sum = poly_of(n, dreams.iter().map(|d| d.monomial()));
            assert_eq!(sum, *table.get(&w), "w = {w}");
            assert_eq!(BigUint::from(count_bumpless(&w)), count_pipe_dreams(&w));
        }
    }
}

#[test]
fn bumpless_counts_match_pipe_dream_counts_in_s6() {
    for w in Perm::all(6) {
        assert_eq!(
            BigUint::from(count_bumpless(&w)),
            count_pipe_dreams(&w),
            "w = {w}"
        );
    }
}

#[test]
fn bumpless_tiles_round_trip() {
    use elbowroom::math::pipes::bumpless::BumplessDream;
    for w in Perm::all(4) {
        for d in bumpless_dreams(&w) {
            let again = BumplessDream::from_tiles(4, d.tiles().to_vec()).unwrap();
            assert_eq!(again, d);
        }
    }
    assert!(BumplessDream::from_tiles(2, vec![]).is_err());
}

fn perm_strategy(max_n: usize) -> impl Strategy<Value = Perm> {
    (2usize..=max_n).prop_flat_map(|n| {
        Just((1..=n).collect::<Vec<usize>>())
            .prop_shuffle()
            .prop_map(|v| Perm::from_one_line(&v).unwrap())
    })
}

proptest! {
    #[test]
    fn listed_dreams_trace_to_w(w in perm_strategy(9)) {
        for d in pipe_dreams(&w).take(300) {
            prop_assert_eq!(d.permutation(), w.clone());
            prop_assert_eq!(d.trace().permutation(), w.clone());
        }
    }

    #[test]
    fn ladder_moves_preserve_permutation_and_degree(w in perm_strategy(9)) {
        for d in pipe_dreams(&w).take(100) {
            for (i, j) in d.crosses() {
                if let Some(e) = d.ladder_move_at(i, j) {
                    prop_assert_eq!(e.permutation(), w.clone());
                    prop_assert_eq!(e.monomial().iter().sum::<u32>(), d.monomial().iter().sum::<u32>());
                    prop_assert!(e.is_reduced());
                }
            }
        }
    }
}

#[test]
fn integer_transition_count_is_the_coefficient_sum_in_s7() {
    for w in Perm::all(7) {
        assert_eq!(
            count_pipe_dreams(&w),
            count_pipe_dreams_by_polynomial(&w),
            "w = {w}"
        );
    }
}
