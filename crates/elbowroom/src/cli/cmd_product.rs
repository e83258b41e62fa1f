//! `elbowroom product U V [--n N] [--json]`: the structure constants of
//! S_u · S_v = Σ_w c^w_{uv} S_w, stably (w in the smallest S_m that holds it)
//! or, with `--n N`, in H*(Fl_N) (w written with N entries). Terms by length,
//! then lexicographically.

use super::args::ProductArgs;
use super::error::CliError;
use super::expansion_text::{TermRecord, sum_text, terms_json};
use super::interrupt;
use super::json;
use crate::math::Perm;
use crate::math::schubert::product::schubert_product;
use crate::math::schubert::vector::Space;
use serde::Serialize;

/// The JSON of `product`; `"n"` in H*(Fl_n).
#[derive(Serialize)]
struct ProductRecord {
    u: Vec<usize>,
    v: Vec<usize>,
    terms: Vec<TermRecord>,
    #[serde(skip_serializing_if = "Option::is_none")]
    n: Option<usize>,
}

pub fn run(args: &ProductArgs) -> Result<String, CliError> {
    let u = args.u.clone();
    let v = args.v.clone();
    // the library checks that u and v lie in S_N and names the one that does not
    let space = match args.n {
        None => Space::Stable,
        Some(n) => Space::flag(n)?,
    };
    let product = interrupt::run_interruptible("the product", "steps", 0, |progress| {
        schubert_product(&u, &v, space, progress)
    })?;
    let terms = product.sorted_terms();
    let written = |w: &Perm| match args.n {
        Some(n) => w.embed(n).unwrap_or_else(|_| w.clone()),
        None => w.restrict(w.support_size()).unwrap_or_else(|| w.clone()),
    };
    let (u, v) = (written(&u), written(&v));
    if args.output.json {
        return json::text(&ProductRecord {
            u: u.one_line(),
            v: v.one_line(),
            terms: terms_json(&terms),
            n: args.n,
        });
    }
    Ok(format!("S_{u} · S_{v} = {}", sum_text(&terms)))
}
