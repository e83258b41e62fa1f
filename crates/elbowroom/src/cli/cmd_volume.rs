//! `elbowroom volume --lambda l1,...,ln [--polynomial]`: the exact volume of P_λ.

use super::args::VolumeArgs;
use super::error::CliError;
use super::inputs::check_volume_size;
use super::json;
use crate::math::permutohedra::permutohedron::{
    POLYNOMIAL_MAX_N, Permutohedron, volume_polynomial,
};
use serde_json::{Value, json};

/// Vertices are listed (exactly, and for drawing) up to this many.
pub const VERTEX_LIST_LIMIT: usize = 720;

/// Runs the command.
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
        let mut v = json!({
            "n": n,
            "lambda": p.lambda().iter().map(json::exact).collect::<Vec<Value>>(),
            "volume": json::exact(&volume),
            "vertices": json::exact(&count),
        });
        let Some(obj) = v.as_object_mut() else {
            return Err(CliError::Failed("could not build the output".into()));
        };
        if let Some(poly) = &polynomial {
            obj.insert("polynomial".into(), json::poly(poly));
        }
        if let Some(vs) = &listed {
            let exact: Vec<Value> = vs
                .iter()
                .map(|v| Value::Array(v.iter().map(json::exact).collect()))
                .collect();
            obj.insert("vertex_list".into(), Value::Array(exact));
            if n == 3 || n == 4 {
                let points = Permutohedron::drawing_coordinates(vs);
                let edges: Vec<Value> = p.edges(vs).iter().map(|(a, b)| json!([a, b])).collect();
                obj.insert(
                    "drawing".into(),
                    json!({"dimension": n - 1, "points": points, "edges": edges}),
                );
            }
        }
        return Ok(json::render(&v));
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
