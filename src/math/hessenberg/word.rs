//! Checked `i64` coefficients for the partial products of Q_h: half the memory of
//! `i128` a term (a hash-map slot of 16 bytes instead of 32), which is what the
//! expansion at n = 16 needs to stay within a few GB. A product that leaves the
//! `i64` range stops with `StepError::Overflow` and is run again in `i128`, then in
//! big integers ([`crate::math::hessenberg::rows`]).

use crate::math::schubert::vector::{Coefficient, StepError, StepResult};
use num_bigint::BigInt;
use num_traits::ToPrimitive;

impl Coefficient for i64 {
    fn zero_value() -> Self {
        0
    }
    #[inline]
    fn is_zero_value(&self) -> bool {
        *self == 0
    }
    fn from_big(v: &BigInt) -> Option<Self> {
        v.to_i64()
    }
    fn from_i64(v: i64) -> Self {
        v
    }
    fn to_big(&self) -> BigInt {
        BigInt::from(*self)
    }
    #[inline]
    fn add_assign_checked(&mut self, other: &Self) -> StepResult<()> {
        *self = self.checked_add(*other).ok_or(StepError::Overflow)?;
        Ok(())
    }
    #[inline]
    fn mul_checked(&self, other: &Self) -> StepResult<Self> {
        self.checked_mul(*other).ok_or(StepError::Overflow)
    }
    #[inline]
    fn sub_checked(&self, other: &Self) -> StepResult<Self> {
        self.checked_sub(*other).ok_or(StepError::Overflow)
    }
    #[inline]
    fn neg_checked(&self) -> StepResult<Self> {
        self.checked_neg().ok_or(StepError::Overflow)
    }
    fn is_negative_value(&self) -> bool {
        *self < 0
    }
}

#[cfg(test)]
mod tests {
    use crate::math::schubert::vector::{Coefficient, StepError};

    #[test]
    fn leaving_the_word_is_an_overflow_not_a_wrap() {
        let mut x = i64::MAX;
        assert_eq!(x.add_assign_checked(&1), Err(StepError::Overflow));
        assert_eq!(i64::MIN.neg_checked(), Err(StepError::Overflow));
        assert_eq!(3i64.mul_checked(&-4), Ok(-12));
    }
}
