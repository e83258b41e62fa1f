//! Fuzzing the reader of typed polynomials: random texts up to 100 KB built
//! from the tokens it knows (and from any characters), read by both readers,
//! must give a polynomial or an error; never a panic, never a stack overflow,
//! and an error quotes at most a short excerpt of the input.
#![allow(clippy::unwrap_used)]

use elbowroom::math::poly::parse::{parse_linear_factors, parse_poly};
use proptest::prelude::*;

/// Pieces of typed polynomials, well formed or not.
fn token() -> impl Strategy<Value = &'static str> {
    prop::sample::select(vec![
        "(",
        ")",
        "(",
        ")",
        "-",
        "+",
        "-",
        "*",
        "/",
        "^",
        "^2",
        "^255",
        "^(3)",
        "x1",
        "x2",
        "x_3",
        "x_{4}",
        "x16",
        "x17",
        "x0",
        "2",
        "3/2",
        "0.25",
        "1.",
        ".5",
        "..",
        "255",
        "999999999999",
        " ",
        " ",
        "M(2,1)",
        "F(1,1)",
        "M(",
        "F(300)",
        ",",
        "·",
        "−",
        "×",
        "é",
        "x",
        "{",
        "}",
    ])
}

/// A text of up to `max` tokens, each at most a dozen bytes.
fn text(max: usize) -> impl Strategy<Value = String> {
    prop::collection::vec(token(), 0..max).prop_map(|t| t.concat())
}

fn read_both(s: &str) {
    for n in [None, Some(4)] {
        match parse_poly(s, n) {
            Ok(p) => assert!(p.len() as u128 <= elbowroom::math::limits::TYPED_TERM_LIMIT),
            Err(e) => {
                let m = e.to_string();
                assert!(m.len() < 1_000, "a long message: {} bytes", m.len());
            }
        }
        let _ = parse_linear_factors(s, n);
    }
}

proptest! {
    #![proptest_config(ProptestConfig { cases: 48, ..ProptestConfig::default() })]

    #[test]
    fn long_token_soup_is_read_or_refused(s in text(12_000)) {
        read_both(&s);
    }

    #[test]
    fn short_token_soup_is_read_or_refused(s in text(40)) {
        read_both(&s);
    }

    #[test]
    fn any_characters_are_read_or_refused(s in "\\PC{0,200}") {
        read_both(&s);
    }

    #[test]
    fn deep_runs_of_one_token_are_refused_or_read(k in 1usize..100_000, which in 0usize..5) {
        let s = match which {
            0 => format!("{}x1{}", "(".repeat(k), ")".repeat(k)),
            1 => format!("{}x1", "-".repeat(k)),
            2 => format!("x1{}", "^2".repeat(k)),
            3 => "(".repeat(k),
            _ => format!("{}x1", "+-".repeat(k / 2)),
        };
        read_both(&s);
    }
}
