//! `elbowroom volume --lambda l1,...,ln [--polynomial]`: the exact volume of P_λ.

use super::args::VolumeArgs;
use super::error::CliError;
use super::inputs::check_volume_size;
use super::json;
use super::json::PolyRecord;
use crate::math::permutohedra::permutohedron::{
    POLYNOMIAL_MAX_N, Permutohedron, volume_polynomial,
};
use serde::Serialize;

/// Vertices are listed (exactly, and for drawing) up to this many.
pub const VERTEX_LIST_LIMIT: usize = 720;

/// The picture of P_λ for n = 3, 4: projected points and the edges between them.
#[derive(Serialize)]
struct Drawing {
    dimension: usize,
    points: Vec<Vec<f64>>,
    edges: Vec<(usize, usize)>,
}

/// The JSON of `volume`; the polynomial with `--polynomial`, the vertices
/// when there are few enough.
#[derive(Serialize)]
struct VolumeRecord {
    n: usize,
    lambda: Vec<String>,
    volume: String,
    vertices: String,
    #[serde(skip_serializing_if = "Option::is_none")]
    polynomial: Option<PolyRecord>,
    #[serde(skip_serializing_if = "Option::is_none")]
    vertex_list: Option<Vec<Vec<String>>>,
    #[serde(skip_serializing_if = "Option::is_none")]
    drawing: Option<Drawing>,
}

pub fn run(args: &VolumeArgs) -> Result<String, CliError> {
    let lambda = args.lambda.clone();
    let p = Permutohedron::new(&lambda)?;
    check_volume_size(&p, 0, "the volume")?;
    let n = p.n();
    let volume = p.volume();
    let count = p.vertex_count();
    let polynomial = if args.polynomial {
        if n > POLYNOMIAL_MAX_N {
            return Err(CliError::Input(format!(
                "--polynomial is available for n <= {POLYNOMIAL_MAX_N} (it has C(2n-2, n-1) terms); λ has {n} entries"
            )));
        }
        Some(volume_polynomial(n)?)
    } else {
        None
    };
    let listed = if count <= num_bigint::BigUint::from(VERTEX_LIST_LIMIT) {
        Some(p.vertices(VERTEX_LIST_LIMIT)?)
    } else {
        None
    };
    if args.output.json {
        let texts =
            |v: &[num_rational::BigRational]| v.iter().map(|x| x.to_string()).collect::<Vec<_>>();
        return json::text(&VolumeRecord {
            n,
            lambda: texts(p.lambda()),
            volume: volume.to_string(),
            vertices: count.to_string(),
            polynomial: polynomial.as_ref().map(PolyRecord::of),
            vertex_list: listed
                .as_ref()
                .map(|vs| vs.iter().map(|v| texts(v)).collect()),
            drawing: listed
                .as_ref()
                .filter(|_| n == 3 || n == 4)
                .map(|vs| Drawing {
                    dimension: n - 1,
                    points: Permutohedron::drawing_coordinates(vs),
                    edges: p.edges(vs),
                }),
        });
    }
    let shown: Vec<String> = p.lambda().iter().map(|v| v.to_string()).collect();
    let mut out = format!(
        "λ (sorted)  ({})\nvolume      {volume}\nvertices    {count}\n",
        shown.join(", ")
    );
    if let Some(poly) = &polynomial {
        out.push_str(&format!(
            "polynomial  {poly}\n            (x_i stands for λ_i; valid for λ_1 >= ... >= λ_n)\n"
        ));
    }
    if let Some(vs) = &listed
        && n <= 4
    {
        let edges = p.edges(vs);
        out.push_str(&format!("edges       {}\n", edges.len()));
        for (k, v) in vs.iter().enumerate() {
            let c: Vec<String> = v.iter().map(|x| x.to_string()).collect();
            out.push_str(&format!("  v{:<3} ({})\n", k, c.join(", ")));
        }
    }
    Ok(out)
}
