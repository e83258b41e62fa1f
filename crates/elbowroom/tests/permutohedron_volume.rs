//! Permutohedron volumes and mixed Eulerian numbers: published values, three
//! independent methods inside the crate, and a general convex-hull library.
#![allow(clippy::unwrap_used)]

use elbowroom::math::hessenberg::divsym::divided_symmetrize_at;
use elbowroom::math::hessenberg::function::HessenbergFn;
use elbowroom::math::permutohedra::mixed_eulerian::{
    mixed_eulerian_number, mixed_eulerian_numbers,
};
use elbowroom::math::permutohedra::permutohedron::{
    Permutohedron, factorial, rational_to_f64, volume_polynomial,
};
use elbowroom::math::{Progress, RatPoly};
use num_bigint::BigInt;
use num_rational::BigRational;
use num_traits::{One, Zero};
use proptest::prelude::*;

fn q(v: i64) -> BigRational {
    BigRational::from_integer(BigInt::from(v))
}

fn fact(n: usize) -> BigInt {
    BigInt::from(factorial(n))
}

#[test]
fn regular_permutohedron_has_volume_n_to_the_n_minus_2() {
    // Postnikov, Permutohedra, associahedra, and beyond (IMRN 2009): Vol P_{(n-1,...,0)} = n^{n-2},
    // the number of labelled trees (Cayley; OEIS A000272)
    for n in 1..=12usize {
        let lambda: Vec<BigRational> = (0..n as i64).rev().map(q).collect();
        let expected = if n == 1 {
            BigInt::one()
        } else {
            num_traits::pow(BigInt::from(n), n - 2)
        };
        assert_eq!(
            Permutohedron::new(&lambda).unwrap().volume(),
            BigRational::from_integer(expected)
        );
    }
}

#[test]
fn the_standard_simplex_has_volume_one_over_factorial() {
    // Common practice: conv(e_1, ..., e_n) projects to the simplex 0 <= x, Σ x_i <= 1 in R^{n-1}
    for n in 2..=10 {
        let mut lambda = vec![q(0); n];
        lambda[0] = q(1);
        let p = Permutohedron::new(&lambda).unwrap();
        assert_eq!(p.volume(), BigRational::new(BigInt::one(), fact(n - 1)));
        assert_eq!(p.vertex_count(), factorial(n) / factorial(n - 1));
    }
}

/// Vol P_λ by the definition of DS at one point: DS_n((λ·x)^{n-1})(p) / (n-1)!.
fn volume_by_definition(lambda: &[BigRational]) -> BigRational {
    let n = lambda.len();
    let mut sorted = lambda.to_vec();
    sorted.sort_by(|a, b| b.cmp(a));
    let mut lin = RatPoly::zero(n);
    for (i, l) in sorted.iter().enumerate() {
        lin = lin.add(&RatPoly::var_index(n, i).scale(l));
    }
    let f = lin.pow((n - 1) as u32).unwrap();
    let h = HessenbergFn::default_for(n).unwrap();
    let p: Vec<BigRational> = (0..n)
        .map(|i| BigRational::new(BigInt::from(3 * i * i + 1), BigInt::from(i + 2)))
        .collect();
    divided_symmetrize_at(&f, &h, &p).unwrap() / BigRational::from_integer(fact(n - 1))
}

/// Vol P_λ = Σ_c A_c u^c / c!, u_i = λ_i - λ_{i+1}.
fn volume_by_mixed_eulerian(lambda: &[BigRational]) -> BigRational {
    let n = lambda.len();
    let mut sorted = lambda.to_vec();
    sorted.sort_by(|a, b| b.cmp(a));
    let u: Vec<BigRational> = (0..n - 1).map(|i| &sorted[i] - &sorted[i + 1]).collect();
    let mut total = BigRational::zero();
    for (c, a) in mixed_eulerian_numbers(n, &Progress::new(0)).unwrap() {
        let mut t = BigRational::from_integer(a);
        for (i, &e) in c.iter().enumerate() {
            t *= num_traits::pow(u[i].clone(), e as usize);
            t /= BigRational::from_integer(fact(e as usize));
        }
        total += t;
    }
    total
}

/// The volume from a general-purpose convex hull library (floats): the vertices projected
/// to the first n-1 coordinates.
fn volume_by_convex_hull(lambda: &[BigRational]) -> f64 {
    let p = Permutohedron::new(lambda).unwrap();
    let verts = p.vertices(10_000).unwrap();
    let pts: Vec<Vec<f64>> = verts
        .iter()
        .map(|v| v[..v.len() - 1].iter().map(rational_to_f64).collect())
        .collect();
    let hull = chull::ConvexHullWrapper::try_new(&pts, None).unwrap();
    hull.volume().abs()
}

fn rational_lambda(n: usize) -> impl Strategy<Value = Vec<BigRational>> {
    prop::collection::vec((-20i64..=20, 1i64..=4), n).prop_map(|v| {
        v.into_iter()
            .map(|(a, b)| BigRational::new(a.into(), b.into()))
            .collect()
    })
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(10))]
    #[test]
    fn three_exact_methods_agree(n in 2usize..=5, seed in rational_lambda(5)) {
        let lambda = &seed[..n];
        let fast = Permutohedron::new(lambda).unwrap().volume();
        prop_assert_eq!(&fast, &volume_by_definition(lambda));
        prop_assert_eq!(&fast, &volume_by_mixed_eulerian(lambda));
        let mut sorted = lambda.to_vec();
        sorted.sort_by(|a, b| b.cmp(a));
        prop_assert_eq!(&fast, &volume_polynomial(n).unwrap().eval(&sorted));
    }

    #[test]
    fn a_general_convex_hull_library_agrees(n in 3usize..=4, seed in rational_lambda(4)) {
        // chull 0.2 computes hulls and volumes in dimensions up to 3, so n <= 4 here
        let lambda = &seed[..n];
        let exact = rational_to_f64(&Permutohedron::new(lambda).unwrap().volume());
        // a degenerate λ (all entries equal in too many places) gives a flat hull the library rejects
        let mut distinct = lambda.to_vec();
        distinct.sort();
        distinct.dedup();
        prop_assume!(distinct.len() == n);
        let float = volume_by_convex_hull(lambda);
        prop_assert!((exact - float).abs() <= 1e-7 * exact.abs().max(1.0), "exact {} hull {}", exact, float);
    }
}

#[test]
fn mixed_eulerian_numbers_have_postnikovs_properties() {
    // Postnikov, Permutohedra, associahedra, and beyond (IMRN 2009), §16 (from memory):
    let eulerian: [&[u64]; 8] = [
        // OEIS A008292, rows 1..8 (Eulerian numbers A(m, k), k = 1..m)
        &[1],
        &[1, 1],
        &[1, 4, 1],
        &[1, 11, 11, 1],
        &[1, 26, 66, 26, 1],
        &[1, 57, 302, 302, 57, 1],
        &[1, 120, 1191, 2416, 1191, 120, 1],
        &[1, 247, 4293, 15619, 15619, 4293, 247, 1],
    ];
    let catalan = [1u64, 1, 2, 5, 14, 42, 132, 429, 1430]; // OEIS A000108
    for n in 2..=9usize {
        let m = n - 1;
        let numbers = mixed_eulerian_numbers(n, &Progress::new(0)).unwrap();
        // the number of weak compositions of n-1 into n-1 parts is C(2n-3, n-1)
        let mut sum = BigInt::zero();
        let mut weighted = BigRational::zero();
        for (c, a) in &numbers {
            sum += a;
            let mut cf = BigInt::one();
            for &e in c {
                cf *= fact(e as usize);
            }
            weighted += BigRational::new(a.clone(), cf);
            // one part: A_{(0,..,n-1,..,0)} (n-1 in place k) is the Eulerian number A(n-1, k)
            if let Some(k) = c.iter().position(|&e| e as usize == m) {
                assert_eq!(*a, BigInt::from(eulerian[m - 1][k]), "c = {c:?}");
            }
            // all ones: (n-1)!
            if c.iter().all(|&e| e == 1) {
                assert_eq!(*a, fact(m));
            }
            // c = (k, 0, ..., 0, n-1-k): the binomial coefficient C(n-1, k)
            if m >= 2 && c[1..m - 1].iter().all(|&e| e == 0) {
                let k = c[0] as usize;
                assert_eq!(*a, fact(m) / (fact(k) * fact(m - k)), "c = {c:?}");
            }
            // c_1 + ... + c_i >= i for all i: A_c = 1^{c_1} 2^{c_2} ... (n-1)^{c_{n-1}}
            let mut prefix = 0u32;
            if c.iter().enumerate().all(|(i, &e)| {
                prefix += e;
                prefix as usize > i
            }) {
                let mut prod = BigInt::one();
                for (i, &e) in c.iter().enumerate() {
                    prod *= num_traits::pow(BigInt::from(i + 1), e as usize);
                }
                assert_eq!(*a, prod, "c = {c:?}");
            }
            assert!(*a > BigInt::zero(), "A_c is positive");
        }
        // Σ_c A_c = (n-1)! Catalan(n-1)
        assert_eq!(sum, fact(m) * BigInt::from(catalan[m]));
        // Σ_c A_c / c! = n^{n-2} (the regular permutohedron, OEIS A000272)
        assert_eq!(
            weighted,
            BigRational::from_integer(num_traits::pow(BigInt::from(n), n - 2))
        );
    }
}

#[test]
fn the_walk_agrees_with_expanding_each_product_up_to_n_6() {
    for n in 2..=6 {
        for (c, a) in mixed_eulerian_numbers(n, &Progress::new(0)).unwrap() {
            assert_eq!(mixed_eulerian_number(&c).unwrap(), a, "c = {c:?}");
        }
    }
}
