//! Reading what the printer writes gives back the same polynomial, and the
//! reader agrees with arithmetic done directly on polynomials.
#![allow(clippy::unwrap_used)]

use elbowroom::math::poly::parse::parse_poly;
use elbowroom::math::{MathError, Mono, RatPoly};
use num_bigint::BigInt;
use num_rational::BigRational;
use proptest::prelude::*;

fn poly_strategy() -> impl Strategy<Value = RatPoly> {
    let term = (proptest::collection::vec(0u32..4, 4), -20i64..20, 1i64..6);
    proptest::collection::vec(term, 0..8).prop_map(|terms| {
        RatPoly::from_terms(
            4,
            terms.into_iter().map(|(e, p, q)| {
                (
                    Mono::from_exps(&e).unwrap(),
                    BigRational::new(BigInt::from(p), BigInt::from(q)),
                )
            }),
        )
    })
}

proptest! {
    #[test]
    fn printed_text_reads_back(p in poly_strategy()) {
        let again = parse_poly(&p.to_text(), Some(4)).unwrap();
        prop_assert_eq!(again, p);
    }

    #[test]
    fn reading_a_product_is_multiplying(p in poly_strategy(), q in poly_strategy()) {
        let text = format!("({}) ({}) - ({})^2", p.to_text(), q.to_text(), q.to_text());
        let read = parse_poly(&text, Some(4)).unwrap();
        let direct = p.mul(&q).unwrap().sub(&q.pow(2).unwrap());
        prop_assert_eq!(read, direct);
    }

    #[test]
    fn arbitrary_text_never_panics(s in "[ x_0-9+*/^()a-zM,.{}-]{0,24}") {
        match parse_poly(&s, Some(5)) {
            Ok(_) => {}
            Err(MathError::Syntax { column, input, .. }) => {
                prop_assert_eq!(input, s.clone());
                prop_assert!(column >= 1 && column <= s.chars().count() + 1);
            }
            Err(_) => {}
        }
    }
}
