//! How a Schubert expansion Σ c_w S_w prints, shared by `expand` and
//! `product`: readable text (`S_231 + 2 S_1423 − S_2143`, `0` when empty)
//! and the JSON terms `[{"perm": [...], "coefficient": "c"}, ...]`.

use crate::math::Perm;
use num_traits::{One, Signed, Zero};
use serde::Serialize;
use std::fmt::Display;
use std::ops::Neg;

/// Σ c_w S_w as text, in the order given; coefficients ±1 are left out.
pub fn sum_text<C>(terms: &[(Perm, C)]) -> String
where
    C: Display + Signed + Zero + One + Clone + Neg<Output = C>,
{
    if terms.is_empty() {
        return "0".into();
    }
    let mut out = String::new();
    for (k, (w, c)) in terms.iter().enumerate() {
        let magnitude = c.abs();
        let sign = match (k, c.is_negative()) {
            (0, false) => "",
            (0, true) => "-",
            (_, false) => " + ",
            (_, true) => " - ",
        };
        out.push_str(sign);
        if !magnitude.is_one() {
            out.push_str(&format!("{magnitude} "));
        }
        out.push_str(&format!("S_{w}"));
    }
    out
}

/// One term c_w S_w as JSON: `{"perm": [...], "coefficient": "c"}`.
#[derive(Serialize)]
pub struct TermRecord {
    /// w in one-line notation.
    pub perm: Vec<usize>,
    /// c_w, exact, as a string.
    pub coefficient: String,
}

impl TermRecord {
    /// The record of c·S_w.
    pub fn of<C: Display>(w: &Perm, c: &C) -> TermRecord {
        TermRecord {
            perm: w.one_line(),
            coefficient: c.to_string(),
        }
    }
}

/// The terms as JSON records `{"perm": [...], "coefficient": "c"}`.
pub fn terms_json<C: Display>(terms: &[(Perm, C)]) -> Vec<TermRecord> {
    terms.iter().map(|(w, c)| TermRecord::of(w, c)).collect()
}

#[cfg(test)]
mod tests {
    use super::*;
    use num_bigint::BigInt;

    #[test]
    fn signs_and_unit_coefficients() {
        let p = |s: &str| Perm::parse(s).unwrap();
        let terms = vec![
            (p("231"), BigInt::from(1)),
            (p("1423"), BigInt::from(2)),
            (p("2143"), BigInt::from(-1)),
        ];
        assert_eq!(sum_text(&terms), "S_231 + 2 S_1423 - S_2143");
        assert_eq!(sum_text::<BigInt>(&[]), "0");
        assert_eq!(sum_text(&[(p("21"), BigInt::from(-3))]), "-3 S_21");
    }
}
