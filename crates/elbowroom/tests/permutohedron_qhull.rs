//! Permutohedron volumes against a general-purpose geometry library in every
//! dimension up to 5: SciPy's `scipy.spatial.ConvexHull` (which wraps Qhull)
//! computes the volume of the convex hull of the vertices, as floats, for
//! random rational λ with n = 3, ..., 6.
//!
//! The library runs in a Python process (`ELBOWROOM_PYTHON`, default `python3`).
//! Where SciPy is missing the test says so and passes, unless
//! `ELBOWROOM_REQUIRE_SCIPY=1` is set, as `.ci/run` does: there a missing
//! SciPy is a failure, so CI cannot skip the check silently.

use elbowroom::math::permutohedra::permutohedron::{Permutohedron, rational_to_f64};
use num_rational::BigRational;
use std::io::Write;
use std::process::{Command, Stdio};

/// The Python program: reads one case per line, `n` then the vertex
/// coordinates (the first n-1 of each vertex), prints one volume per line.
const HULL_SCRIPT: &str = r#"
import sys
from scipy.spatial import ConvexHull
for line in sys.stdin:
    parts = line.split()
    if not parts:
        continue
    d = int(parts[0]) - 1
    xs = [float(t) for t in parts[1:]]
    pts = [xs[i:i + d] for i in range(0, len(xs), d)]
    print(repr(ConvexHull(pts).volume))
"#;

fn python() -> String {
    std::env::var("ELBOWROOM_PYTHON").unwrap_or_else(|_| "python3".to_string())
}

fn scipy_available() -> bool {
    Command::new(python())
        .args(["-c", "import scipy.spatial"])
        .stdout(Stdio::null())
        .stderr(Stdio::null())
        .status()
        .map(|s| s.success())
        .unwrap_or(false)
}

/// A small deterministic generator (64-bit LCG), so the cases are the same on every run.
struct Lcg(u64);

impl Lcg {
    fn next(&mut self, bound: u64) -> u64 {
        self.0 = self
            .0
            .wrapping_mul(6364136223846793005)
            .wrapping_add(1442695040888963407);
        (self.0 >> 33) % bound
    }
}

/// λ with n distinct rational entries p/q, |p| <= 20, 1 <= q <= 4 (a full-dimensional hull).
fn random_lambda(rng: &mut Lcg, n: usize) -> Vec<BigRational> {
    loop {
        let lambda: Vec<BigRational> = (0..n)
            .map(|_| {
                let p = rng.next(41) as i64 - 20;
                let q = rng.next(4) as i64 + 1;
                BigRational::new(p.into(), q.into())
            })
            .collect();
        let mut distinct = lambda.clone();
        distinct.sort();
        distinct.dedup();
        if distinct.len() == n {
            return lambda;
        }
    }
}

#[test]
fn scipy_convex_hull_volumes_agree_for_n_up_to_6() {
    if !scipy_available() {
        let required = std::env::var("ELBOWROOM_REQUIRE_SCIPY").is_ok_and(|v| v == "1");
        assert!(
            !required,
            "ELBOWROOM_REQUIRE_SCIPY=1 but `{} -c 'import scipy.spatial'` failed: install SciPy (pip install scipy)",
            python()
        );
        eprintln!(
            "skipped: SciPy is not importable by `{}`; install it (pip install scipy) to run the convex-hull check for n <= 6",
            python()
        );
        return;
    }
    let mut rng = Lcg(20261202);
    let mut cases = Vec::new();
    for n in 3..=6 {
        for _ in 0..6 {
            cases.push(random_lambda(&mut rng, n));
        }
    }
    // the regular permutohedron too: volume n^{n-2} (Postnikov, IMRN 2009)
    cases.push(
        (1..=6)
            .map(|k| BigRational::from_integer(k.into()))
            .collect(),
    );

    let mut input = String::new();
    for lambda in &cases {
        let verts = Permutohedron::new(lambda).unwrap().vertices(1000).unwrap();
        input.push_str(&lambda.len().to_string());
        for v in &verts {
            for c in &v[..v.len() - 1] {
                input.push(' ');
                input.push_str(&rational_to_f64(c).to_string());
            }
        }
        input.push('\n');
    }
    let mut child = Command::new(python())
        .args(["-c", HULL_SCRIPT])
        .stdin(Stdio::piped())
        .stdout(Stdio::piped())
        .spawn()
        .unwrap();
    child
        .stdin
        .take()
        .unwrap()
        .write_all(input.as_bytes())
        .unwrap();
    let out = child.wait_with_output().unwrap();
    assert!(out.status.success(), "the SciPy script failed");
    let volumes: Vec<f64> = String::from_utf8(out.stdout)
        .unwrap()
        .lines()
        .map(|l| l.trim().parse().unwrap())
        .collect();
    assert_eq!(volumes.len(), cases.len());
    for (lambda, hull) in cases.iter().zip(&volumes) {
        let exact = rational_to_f64(&Permutohedron::new(lambda).unwrap().volume());
        assert!(
            (exact - hull).abs() <= 1e-9 * exact.abs().max(1.0),
            "λ = {lambda:?}: exact {exact}, Qhull {hull}"
        );
    }
    assert!((volumes.last().unwrap() - 1296.0).abs() < 1e-6, "6^4");
}
