//! What the explorer can ask for, keyed by its inputs, and how each answer is
//! computed (always by the same `math` functions the command line uses).

use crate::math::perm_class::PermClass;
use crate::math::schubert::SchubertTable;
use crate::math::{IntPoly, MathError, MathResult, Perm, Progress};
use num_bigint::{BigInt, BigUint};
use std::fmt::Write as _;

/// How the permutation browser filters and orders S_n.
#[derive(Clone, Debug, PartialEq, Eq, Hash)]
pub struct BrowseKey {
    /// The size n.
    pub n: usize,
    /// Smallest length kept.
    pub min_length: usize,
    /// Largest length kept.
    pub max_length: usize,
    /// Keep only this class.
    pub class: Option<PermClass>,
    /// Order by length, then lexicographically (otherwise lexicographically).
    pub by_length: bool,
}

/// The inputs of one computation; equal keys give equal results.
#[derive(Clone, Debug, PartialEq, Eq, Hash)]
pub enum JobKey {
    /// The Schubert polynomial S_w.
    Schubert(Perm),
    /// The permutations of S_n passing a filter, in order.
    Browse(BrowseKey),
    /// The number of reduced pipe dreams S_w(1, ..., 1) of each permutation.
    Counts(Vec<Perm>),
}

impl JobKey {
    /// A short description for the status line.
    pub fn label(&self) -> String {
        match self {
            JobKey::Schubert(w) => format!("Schubert polynomial of {w}"),
            JobKey::Browse(b) => format!("listing S_{}", b.n),
            JobKey::Counts(ws) => format!("counting pipe dreams of {} permutations", ws.len()),
        }
    }
}

/// A finished result.
#[derive(Clone, Debug)]
pub enum Output {
    /// A polynomial with integer coefficients.
    Poly(IntPoly),
    /// A list of permutations.
    Perms(Vec<Perm>),
    /// A list of counts.
    Counts(Vec<BigUint>),
    /// Plain text.
    Text(String),
}

impl Output {
    /// The polynomial, if this is one.
    pub fn poly(&self) -> Option<&IntPoly> {
        match self {
            Output::Poly(p) => Some(p),
            _ => None,
        }
    }

    /// The permutations, if this is a list of them.
    pub fn perms(&self) -> Option<&[Perm]> {
        match self {
            Output::Perms(p) => Some(p),
            _ => None,
        }
    }

    /// The counts, if this is a list of them.
    pub fn counts(&self) -> Option<&[BigUint]> {
        match self {
            Output::Counts(c) => Some(c),
            _ => None,
        }
    }

    /// The text, if this is text.
    pub fn text(&self) -> Option<&str> {
        match self {
            Output::Text(t) => Some(t),
            _ => None,
        }
    }
}

/// Computes the answer for `key`, reporting to `progress` and stopping with
/// `Canceled` when asked to.
pub fn compute(key: &JobKey, progress: &Progress) -> MathResult<Output> {
    match key {
        JobKey::Schubert(w) => {
            progress.set_total(1);
            let p = SchubertTable::new().get(w);
            progress.advance(1);
            Ok(Output::Poly((*p).clone()))
        }
        JobKey::Browse(b) => browse(b, progress).map(Output::Perms),
        JobKey::Counts(ws) => {
            progress.set_total(ws.len() as u64);
            let mut table = SchubertTable::new();
            let mut out = Vec::with_capacity(ws.len());
            for w in ws {
                progress.check()?;
                out.push(to_count(table.get(w).coefficient_sum())?);
                progress.advance(1);
            }
            Ok(Output::Counts(out))
        }
    }
}

fn to_count(c: BigInt) -> MathResult<BigUint> {
    c.to_biguint().ok_or_else(|| {
        let mut msg = String::new();
        let _ = write!(msg, "a negative count {c}");
        MathError::InvalidInput(msg)
    })
}

fn browse(b: &BrowseKey, progress: &Progress) -> MathResult<Vec<Perm>> {
    if b.n == 0 || b.n > 9 {
        return Err(MathError::OutOfRange(format!(
            "the browser lists S_n for 1 <= n <= 9, not n = {}",
            b.n
        )));
    }
    let total: u64 = (1..=b.n as u64).product();
    progress.set_total(total);
    let mut out = Vec::new();
    for (k, w) in Perm::all(b.n).enumerate() {
        if k % 1024 == 0 {
            progress.check()?;
            progress.advance(1024.min(total - k as u64));
        }
        let l = w.length();
        if l < b.min_length || l > b.max_length {
            continue;
        }
        if let Some(c) = b.class
            && !c.contains(&w)
        {
            continue;
        }
        out.push(w);
    }
    if b.by_length {
        out.sort_by_cached_key(|w| w.length());
    }
    Ok(out)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn browsing_s4_by_class() {
        let p = Progress::new(0);
        let key = |class| BrowseKey {
            n: 4,
            min_length: 0,
            max_length: 6,
            class,
            by_length: true,
        };
        // all of S_4
        let all = browse(&key(None), &p).unwrap();
        assert_eq!(all.len(), 24);
        assert!(all.windows(2).all(|w| w[0].length() <= w[1].length()));
        // 132-avoiding permutations of S_4: Catalan(4) = 14 (OEIS A000108)
        assert_eq!(browse(&key(Some(PermClass::Dominant)), &p).unwrap().len(), 14);
        // 2143-avoiding permutations of S_4: 23 (OEIS A005802)
        assert_eq!(browse(&key(Some(PermClass::Vexillary)), &p).unwrap().len(), 23);
    }

    #[test]
    fn pipe_dream_counts_are_schubert_values_at_one() {
        // S_{1432}(1,1,1) = 5 and S_{w0} = x1^2 x2 has one pipe dream (Macdonald's table)
        let ws = vec![Perm::parse("1432").unwrap(), Perm::parse("321").unwrap()];
        let out = compute(&JobKey::Counts(ws), &Progress::new(0)).unwrap();
        let c: Vec<String> = out.counts().unwrap().iter().map(|c| c.to_string()).collect();
        assert_eq!(c, ["5", "1"]);
    }
}
