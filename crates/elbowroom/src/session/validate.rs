//! Checks that a loaded session describes a possible exploration, and says
//! which field is wrong and what is accepted when it does not.

use super::model::Session;
use crate::math::MAX_N;
use crate::math::limits::{FIGURE_INDEX_LIMIT, QUOTE_LIMIT, SESSION_LIST_LIMIT, TYPED_TEXT_LIMIT};
use crate::math::perms::class::PermClass;
use crate::math::poly::rational::parse_rational;

/// Why a session is impossible: the first problem found, as one sentence.
pub fn check(session: &Session) -> Result<(), String> {
    let n = session.n;
    if !(1..=MAX_N).contains(&n) {
        return Err(format!(
            "n = {n} is out of range; elbowroom works with 1 <= n <= {MAX_N}"
        ));
    }
    if session.current.len() != n {
        return Err(format!(
            "current {:?} has {} entries but n = {n}; it must list w(1), ..., w(n)",
            session.current,
            session.current.len()
        ));
    }
    if !is_permutation(&session.current) {
        return Err(format!(
            "current {:?} is not a permutation of 1..{n}",
            session.current
        ));
    }
    for (name, list) in [("history", &session.history), ("pins", &session.pins)] {
        if list.len() > SESSION_LIST_LIMIT {
            return Err(format!(
                "{name} has {} entries; at most {SESSION_LIST_LIMIT} are kept",
                list.len()
            ));
        }
    }
    for (k, w) in session.history.iter().enumerate() {
        check_listed("history", k, w)?;
    }
    if !session.history.is_empty() && session.history_pos >= session.history.len() {
        return Err(format!(
            "history_pos = {} but the history has {} entries (positions start at 0)",
            session.history_pos,
            session.history.len()
        ));
    }
    for (k, w) in session.pins.iter().enumerate() {
        check_listed("pins", k, w)?;
    }
    check_hessenberg(&session.hessenberg.h)?;
    check_browser(session)?;
    for (name, index) in [
        ("dreams.index", session.dreams.index),
        ("words.index", session.words.index),
    ] {
        if index > FIGURE_INDEX_LIMIT {
            return Err(format!(
                "{name} = {index}; positions go from 0 to {FIGURE_INDEX_LIMIT}"
            ));
        }
    }
    check_products(&session.products)?;
    for (name, text) in [
        ("quotient.typed", &session.quotient.typed),
        ("workbench.poly", &session.workbench.poly),
        ("products.poly", &session.products.poly),
    ] {
        let len = text.chars().count();
        if len > TYPED_TEXT_LIMIT {
            return Err(format!(
                "{name} is {len} characters long; a typed polynomial has at most {TYPED_TEXT_LIMIT}"
            ));
        }
    }
    for (name, entries) in [
        ("solid.lambda", &session.solid.lambda),
        ("solid.from", &session.solid.from),
        ("solid.to", &session.solid.to),
    ] {
        check_rationals(name, entries)?;
    }
    let scale = session.figure.scale;
    if !(scale.is_finite() && scale > 0.0 && scale <= 64.0) {
        return Err(format!(
            "figure.scale = {scale} is not accepted; use a number in (0, 64]"
        ));
    }
    for (name, v) in [
        ("solid.yaw", session.solid.yaw),
        ("solid.pitch", session.solid.pitch),
    ] {
        if !v.is_finite() {
            return Err(format!("{name} = {v} is not a finite angle"));
        }
    }
    Ok(())
}

/// λ as typed in the permutohedron view: at most [`MAX_N`] entries, each an
/// exact rational as the view reads it (or empty, a field being typed).
/// The products view: n and poly_n in 1..=[`MAX_N`], the factors short texts
/// (what they say is read, and refused if need be, in the view).
fn check_products(p: &super::model::ProductsPlace) -> Result<(), String> {
    for (name, n) in [("products.n", p.n), ("products.poly_n", p.poly_n)] {
        if !(1..=MAX_N).contains(&n) {
            return Err(format!("{name} = {n} is out of range; 1 <= n <= {MAX_N}"));
        }
    }
    for (name, text) in [("products.u", &p.u), ("products.v", &p.v)] {
        let len = text.chars().count();
        if len > QUOTE_LIMIT * 10 {
            return Err(format!(
                "{name} is {len} characters long; a factor has at most {}",
                QUOTE_LIMIT * 10
            ));
        }
    }
    Ok(())
}

fn check_rationals(name: &str, entries: &[String]) -> Result<(), String> {
    if entries.len() > MAX_N {
        return Err(format!(
            "{name} has {} entries; λ has at most {MAX_N}",
            entries.len()
        ));
    }
    for (k, text) in entries.iter().enumerate() {
        if text.trim().is_empty() {
            continue;
        }
        if text.chars().count() > QUOTE_LIMIT * 10 {
            return Err(format!(
                "{name}[{k}] is {} characters long; an entry has at most {}",
                text.chars().count(),
                QUOTE_LIMIT * 10
            ));
        }
        if let Err(e) = parse_rational(text) {
            return Err(format!("{name}[{k}]: {e}"));
        }
    }
    Ok(())
}

/// The browser's filter: lengths within 0..=n(n−1)/2 for n <= [`MAX_N`]
/// (smallest first), and a class named by its key.
fn check_browser(session: &Session) -> Result<(), String> {
    let b = &session.browser;
    let top = MAX_N * (MAX_N - 1) / 2;
    for (name, v) in [
        ("browser.min_length", b.min_length),
        ("browser.max_length", b.max_length),
    ] {
        if let Some(v) = v
            && v > top
        {
            return Err(format!(
                "{name} = {v}; lengths go from 0 to {top} (the length of w0 in S_{MAX_N})"
            ));
        }
    }
    if let (Some(lo), Some(hi)) = (b.min_length, b.max_length)
        && lo > hi
    {
        return Err(format!(
            "browser.min_length = {lo} is larger than browser.max_length = {hi}"
        ));
    }
    if let Some(key) = &b.class
        && PermClass::from_key(key).is_none()
    {
        let keys: Vec<String> = PermClass::ALL
            .iter()
            .map(|c| format!("\"{}\"", c.key()))
            .collect();
        return Err(format!(
            "browser.class = \"{key}\" is not a class; accepted: {} (or leave it out)",
            keys.join(", ")
        ));
    }
    Ok(())
}

/// Whether `w` lists each of 1..=len exactly once.
pub fn is_permutation(w: &[usize]) -> bool {
    let mut seen = vec![false; w.len()];
    for &v in w {
        let Some(slot) = v.checked_sub(1).and_then(|i| seen.get_mut(i)) else {
            return false;
        };
        if *slot {
            return false;
        }
        *slot = true;
    }
    true
}

fn check_listed(field: &str, k: usize, w: &[usize]) -> Result<(), String> {
    if w.is_empty() || w.len() > MAX_N {
        return Err(format!(
            "{field}[{k}] = {w:?} has {} entries; a permutation has 1 to {MAX_N}",
            w.len()
        ));
    }
    if !is_permutation(w) {
        return Err(format!(
            "{field}[{k}] = {w:?} is not a permutation of 1..{}",
            w.len()
        ));
    }
    Ok(())
}

/// A Hessenberg function: empty (the default h(i) = i + 1), or h(1..n) weakly
/// increasing with i <= h(i) <= n.
/// The Hessenberg view chooses its own n (the length of h), which need not be
/// the n of the current permutation.
fn check_hessenberg(h: &[usize]) -> Result<(), String> {
    if h.is_empty() {
        return Ok(());
    }
    let n = h.len();
    if n > MAX_N {
        return Err(format!(
            "hessenberg.h = {h:?} has {n} entries; give h(1), ..., h(m) with m <= {MAX_N}, or leave it empty"
        ));
    }
    for (i, &hi) in h.iter().enumerate() {
        let row = i + 1;
        if hi < row || hi > n {
            return Err(format!(
                "hessenberg.h = {h:?}: h({row}) = {hi}, but a Hessenberg function has {row} <= h({row}) <= {n}"
            ));
        }
        if i > 0 && hi < h[i - 1] {
            return Err(format!(
                "hessenberg.h = {h:?} is not weakly increasing: h({}) = {} > h({row}) = {hi}",
                row - 1,
                h[i - 1]
            ));
        }
    }
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_default_session_is_valid() {
        assert_eq!(check(&Session::default()), Ok(()));
    }

    #[test]
    fn permutations_are_recognised() {
        assert!(is_permutation(&[3, 1, 2]));
        assert!(!is_permutation(&[3, 1, 3]));
        assert!(!is_permutation(&[0, 1, 2]));
        assert!(!is_permutation(&[1, 2, 4]));
    }

    #[test]
    fn hessenberg_functions_are_checked() {
        assert!(check_hessenberg(&[2, 3, 4, 4]).is_ok());
        assert!(check_hessenberg(&[1, 2, 3, 4]).is_ok());
        let e = check_hessenberg(&[3, 2, 4, 4]).unwrap_err();
        assert!(e.contains("not weakly increasing"), "{e}");
        let e = check_hessenberg(&[2, 3, 4, 3]).unwrap_err();
        assert!(e.contains("h(4) = 3"), "{e}");
    }
}
