//! The volume of P_λ along a segment of λ's: the one computation behind the
//! explorer's plot and `elbowroom figure volume`.

use super::permutohedron::Permutohedron;
use crate::error::{MathError, MathResult};
use crate::progress::Progress;
use num_bigint::BigInt;
use num_rational::BigRational;
use num_traits::One;

/// (t, Vol P_λ(t)) at t = k/m for k = 0..=m, where λ(t) = (1 - t)a + tb; exact
/// (a drawing converts to floats at its own end). Sets `progress` to m + 1
/// samples and stops with `Canceled` between two samples when asked to.
///
/// ```
/// use elbowroom_math::Progress;
/// use elbowroom_math::permutohedra::segment::volume_along_segment;
/// use num_rational::BigRational;
/// let r = |v: i64| BigRational::from_integer(v.into());
/// // from the point (1, 1, 1) to the regular hexagon P_(2,1,0)
/// let samples = volume_along_segment(&[r(1), r(1), r(1)], &[r(2), r(1), r(0)], 2, &Progress::new(0)).unwrap();
/// assert_eq!(samples.len(), 3);
/// assert_eq!(samples[0].1, r(0));
/// assert_eq!(samples[2].1, r(3)); // n^{n-2} for λ = (n-1, ..., 0)
/// ```
pub fn volume_along_segment(
    a: &[BigRational],
    b: &[BigRational],
    m: usize,
    progress: &Progress,
) -> MathResult<Vec<(BigRational, BigRational)>> {
    if a.len() != b.len() || m == 0 {
        return Err(MathError::InvalidInput(
            "the two ends of the segment need the same number of entries".into(),
        ));
    }
    progress.set_total(m as u64 + 1);
    let mut out = Vec::with_capacity(m + 1);
    for k in 0..=m {
        progress.check()?;
        let t = BigRational::new(BigInt::from(k), BigInt::from(m));
        let one_minus = BigRational::one() - &t;
        let lambda: Vec<BigRational> = a
            .iter()
            .zip(b)
            .map(|(x, y)| &one_minus * x + &t * y)
            .collect();
        out.push((t, Permutohedron::new(&lambda)?.volume()));
        progress.advance(1);
    }
    Ok(out)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn ends_of_different_lengths_are_refused() {
        let r = |v: i64| BigRational::from_integer(v.into());
        let e = volume_along_segment(&[r(1)], &[r(1), r(0)], 3, &Progress::new(0));
        assert!(matches!(e, Err(MathError::InvalidInput(_))));
    }

    #[test]
    fn a_canceled_run_stops() {
        let r = |v: i64| BigRational::from_integer(v.into());
        let p = Progress::new(0);
        p.cancel();
        let e = volume_along_segment(&[r(1), r(0)], &[r(2), r(0)], 3, &p);
        assert_eq!(e, Err(MathError::Canceled));
    }
}
