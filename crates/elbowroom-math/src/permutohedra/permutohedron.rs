//! Permutohedra P_λ = conv(S_n · λ): exact volume, the volume polynomial, vertices,
//! edges, and a projection for drawing.
//!
//! Volume (Postnikov, IMRN 2009, Thm. 3.2): with λ_1 >= ... >= λ_n,
//! Vol P_λ = DS_n((λ_1 x_1 + ... + λ_n x_n)^{n-1}) / (n-1)!, the (n-1)-dimensional
//! volume of the projection of P_λ to the first n-1 coordinates. Expanding the power
//! and using the descent formula DS_n(x^a) = (-1)^{|S_a|} β_n(S_a),
//! Vol P_λ = Σ_a Π_i (λ_i^{a_i} / a_i!) · (-1)^{|S_a|} β_n(S_a), over weak compositions a
//! of n-1 with n parts. The fast method runs this sum as one dynamic programme over
//! i = 1..n whose state is the partial sum a_1 + ... + a_i and the relative rank of the
//! i-th letter of a permutation with descent set S_a: O(n^4) rational operations.

use crate::error::{MathError, MathResult};
use crate::hessenberg::divsym::PostnikovFunctional;
use crate::perms::arrangement::prev_arrangement;
use crate::perms::perm::MAX_N;
use crate::poly::compositions::weak_compositions;
use crate::poly::mono::Mono;
use crate::poly::polynomial::{PolyBuilder, RatPoly};
use num_bigint::{BigInt, BigUint};
use num_rational::BigRational;
use num_traits::{One, Zero};

/// The largest n for which [`volume_polynomial`] builds its C(2n-2, n-1) terms.
pub const POLYNOMIAL_MAX_N: usize = 10;

/// A permutohedron P_λ, with λ kept sorted decreasingly.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct Permutohedron {
    lambda: Vec<BigRational>,
}

impl Permutohedron {
    /// P_λ for λ in any order (entries may repeat); 1 <= n <= 16.
    pub fn new(lambda: &[BigRational]) -> MathResult<Self> {
        let n = lambda.len();
        if n == 0 || n > MAX_N {
            return Err(MathError::OutOfRange(format!(
                "λ has {n} entries; 1 to {MAX_N} are supported"
            )));
        }
        let mut sorted = lambda.to_vec();
        sorted.sort_by(|a, b| b.cmp(a));
        Ok(Permutohedron { lambda: sorted })
    }

    /// The dimension of the ambient space.
    pub fn n(&self) -> usize {
        self.lambda.len()
    }

    /// λ sorted decreasingly.
    pub fn lambda(&self) -> &[BigRational] {
        &self.lambda
    }

    /// The exact (n-1)-dimensional volume of the projection to the first n-1 coordinates.
    ///
    /// ```
    /// use elbowroom_math::permutohedra::permutohedron::Permutohedron;
    /// use num_rational::BigRational;
    /// // the regular permutohedron λ = (n-1, ..., 0) has volume n^{n-2} (Postnikov; OEIS A000272)
    /// let l: Vec<BigRational> = (0..5).rev().map(|v: i64| BigRational::from_integer(v.into())).collect();
    /// assert_eq!(Permutohedron::new(&l).unwrap().volume().to_string(), "125");
    /// ```
    pub fn volume(&self) -> BigRational {
        let n = self.n();
        if n == 1 {
            return BigRational::one();
        }
        // over a common denominator L: Vol P_λ = Vol P_{Lλ} / L^{n-1}, and the
        // programme then runs on integers (no growing denominators to reduce)
        let common = common_denominator(&self.lambda);
        if !common.is_one() {
            let scaled: Vec<BigRational> = self
                .lambda
                .iter()
                .map(|l| l * BigRational::from_integer(common.clone()))
                .collect();
            let integral = Permutohedron { lambda: scaled }.volume();
            return integral / BigRational::from_integer(num_traits::pow(common, n - 1));
        }
        let top = n - 1;
        // weights[i][a] = λ_{i+1}^a / a!
        let weights: Vec<Vec<BigRational>> = self
            .lambda
            .iter()
            .map(|l| {
                let mut row = Vec::with_capacity(top + 1);
                let mut w = BigRational::one();
                row.push(w.clone());
                for a in 1..=top {
                    w = w * l / BigRational::from_integer(BigInt::from(a));
                    row.push(w.clone());
                }
                row
            })
            .collect();
        // state[p][j]: partial sum p = a_1 + ... + a_i, relative rank j (1..=i) of the i-th letter
        let mut state = vec![vec![BigRational::zero(); n + 1]; top + 1];
        for a in 0..=top {
            state[a][1] = weights[0][a].clone();
        }
        for (i, weights_i) in weights.iter().enumerate().skip(1) {
            let mut next = vec![vec![BigRational::zero(); n + 1]; top + 1];
            for p in 0..=top {
                if state[p].iter().all(|v| v.is_zero()) {
                    continue;
                }
                let descent = p < i;
                // move the rank: a descent at i needs old rank >= new rank
                let mut moved = vec![BigRational::zero(); i + 2];
                if descent {
                    let mut suffix = BigRational::zero();
                    for j in (1..=i + 1).rev() {
                        if j <= i {
                            suffix += &state[p][j];
                        }
                        moved[j] = -suffix.clone();
                    }
                } else {
                    let mut prefix = BigRational::zero();
                    for j in 1..=i + 1 {
                        moved[j] = prefix.clone();
                        if j <= i {
                            prefix += &state[p][j];
                        }
                    }
                }
                for a in 0..=top - p {
                    let w = &weights_i[a];
                    if w.is_zero() {
                        continue;
                    }
                    for j in 1..=i + 1 {
                        if !moved[j].is_zero() {
                            next[p + a][j] += &moved[j] * w;
                        }
                    }
                }
            }
            state = next;
        }
        let mut total = BigRational::zero();
        for v in &state[top] {
            total += v;
        }
        total
    }

    /// About how many decimal digits the numbers of [`Self::volume`] reach:
    /// (n − 1) times the digits of the largest entry of λ over a common
    /// denominator (the volume is homogeneous of degree n − 1 in λ).
    pub fn volume_digit_estimate(&self) -> u64 {
        let common = BigRational::from_integer(common_denominator(&self.lambda));
        let largest = self
            .lambda
            .iter()
            .map(|l| (l * &common).to_integer().bits())
            .max()
            .unwrap_or(0);
        (self.n() as u64 - 1).max(1) * (largest * 3 / 10 + 1)
    }

    /// The number of distinct vertices, n! / Π (multiplicity of each value)!.
    pub fn vertex_count(&self) -> BigUint {
        let mut count = factorial(self.n());
        let mut k = 0;
        while k < self.lambda.len() {
            let mut m = 1;
            while k + m < self.lambda.len() && self.lambda[k + m] == self.lambda[k] {
                m += 1;
            }
            count /= factorial(m);
            k += m;
        }
        count
    }

    /// The distinct vertices (the distinct rearrangements of λ), in decreasing lexicographic
    /// order; refused when there are more than `limit`.
    pub fn vertices(&self, limit: usize) -> MathResult<Vec<Vec<BigRational>>> {
        if self.vertex_count() > BigUint::from(limit) {
            return Err(MathError::OutOfRange(format!(
                "P_λ has {} vertices; at most {limit} are listed",
                self.vertex_count()
            )));
        }
        // walk the rearrangements of the ranks of λ in decreasing lexicographic order
        let mut current = self.lambda.clone();
        let mut out = vec![current.clone()];
        while prev_arrangement(&mut current) {
            out.push(current.clone());
        }
        Ok(out)
    }

    /// The edges between `vertices`: two vertices are adjacent iff one comes from the other
    /// by swapping two values that are adjacent among the distinct values of λ.
    pub fn edges(&self, vertices: &[Vec<BigRational>]) -> Vec<(usize, usize)> {
        let mut distinct = self.lambda.clone();
        distinct.dedup();
        let rank = |v: &BigRational| distinct.iter().position(|d| d == v).unwrap_or(0);
        let mut out = Vec::new();
        for (a, u) in vertices.iter().enumerate() {
            for (b, v) in vertices.iter().enumerate().skip(a + 1) {
                let diff: Vec<usize> = (0..u.len()).filter(|&k| u[k] != v[k]).collect();
                if diff.len() == 2 {
                    let (p, q) = (diff[0], diff[1]);
                    if u[p] == v[q] && u[q] == v[p] && rank(&u[p]).abs_diff(rank(&u[q])) == 1 {
                        out.push((a, b));
                    }
                }
            }
        }
        out
    }

    /// Coordinates for drawing (floats, for pictures only): the vertices in an orthonormal
    /// basis of the hyperplane Σ x_i = Σ λ_i, centred at the centroid (n = 3 gives the plane,
    /// n = 4 space); the basis vectors are (1, ..., 1, -k, 0, ..., 0)/√(k(k+1)).
    pub fn drawing_coordinates(vertices: &[Vec<BigRational>]) -> Vec<Vec<f64>> {
        vertices
            .iter()
            .map(|v| {
                let x: Vec<f64> = v.iter().map(rational_to_f64).collect();
                let n = x.len();
                (1..n)
                    .map(|k| {
                        let s: f64 = x[..k].iter().sum::<f64>() - (k as f64) * x[k];
                        s / ((k * (k + 1)) as f64).sqrt()
                    })
                    .collect()
            })
            .collect()
    }
}

/// A rational as the nearest float (for drawing only).
pub fn rational_to_f64(v: &BigRational) -> f64 {
    use num_traits::ToPrimitive;
    v.to_f64().unwrap_or(f64::NAN)
}

/// Vol P_λ as a polynomial in λ_1, ..., λ_n (written x1..xn), valid on the chamber
/// λ_1 >= ... >= λ_n: Σ_a (-1)^{|S_a|} β_n(S_a) λ^a / a!.
///
/// ```
/// use elbowroom_math::permutohedra::permutohedron::volume_polynomial;
/// // n = 2: the segment from (λ1, λ2) to (λ2, λ1) projects to [λ2, λ1]
/// assert_eq!(volume_polynomial(2).unwrap().to_text(), "x1 - x2");
/// ```
pub fn volume_polynomial(n: usize) -> MathResult<RatPoly> {
    if n == 0 || n > POLYNOMIAL_MAX_N {
        return Err(MathError::OutOfRange(format!(
            "the volume polynomial is built for 1 <= n <= {POLYNOMIAL_MAX_N}"
        )));
    }
    let ds = PostnikovFunctional::new(n);
    let mut b = PolyBuilder::new(n);
    let facts: Vec<BigInt> = (0..n).map(|k| BigInt::from(factorial(k))).collect();
    for a in weak_compositions((n - 1) as u32, n) {
        let Some(m) = Mono::from_exps(&a) else {
            continue;
        };
        let v = ds.value(m);
        if v == 0 {
            continue;
        }
        let mut den = BigInt::one();
        for &e in &a {
            den *= &facts[e as usize];
        }
        b.add_term(m, &BigRational::new(BigInt::from(v), den));
    }
    Ok(b.build())
}

/// n! as a big integer.
pub fn factorial(n: usize) -> BigUint {
    (1..=n).fold(BigUint::one(), |acc, k| acc * BigUint::from(k))
}

/// The least common multiple of the denominators of `values`.
fn common_denominator(values: &[BigRational]) -> BigInt {
    values.iter().fold(BigInt::one(), |acc, v| {
        num_integer::Integer::lcm(&acc, v.denom())
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    fn q(v: i64) -> BigRational {
        BigRational::from_integer(BigInt::from(v))
    }

    #[test]
    fn hexagon_and_its_edges() {
        let p = Permutohedron::new(&[q(0), q(2), q(1)]).unwrap();
        assert_eq!(p.volume(), q(3));
        let v = p.vertices(100).unwrap();
        assert_eq!(v.len(), 6);
        assert_eq!(p.edges(&v).len(), 6);
        // λ = (1,1,0,0): the octahedron, 6 vertices and 12 edges
        let o = Permutohedron::new(&[q(1), q(1), q(0), q(0)]).unwrap();
        let ov = o.vertices(100).unwrap();
        assert_eq!(ov.len(), 6);
        assert_eq!(o.edges(&ov).len(), 12);
        assert_eq!(o.vertex_count(), BigUint::from(6u32));
    }

    #[test]
    fn the_polynomial_and_the_programme_agree() {
        let lambda = [q(7), q(3), q(2), q(-1), q(-4)];
        let p = Permutohedron::new(&lambda).unwrap();
        let poly = volume_polynomial(5).unwrap();
        assert_eq!(poly.eval(&lambda), p.volume());
    }
}
