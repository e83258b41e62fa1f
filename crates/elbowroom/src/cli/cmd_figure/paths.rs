//! `figure paths`: the normal form modulo J_n of the reversed Schubert
//! polynomial of w (or of `--poly` in `--n` variables) as lattice-path panels.

use super::Figure;
use super::pick::{compact, perm_arg};
use crate::cli::args::FigureArgs;
use crate::cli::error::CliError;
use crate::cli::interrupt;
use crate::figure::Scene;
use crate::figure::look::Look;
use crate::figure::paths::{panels_of_normal_form, path_grid_scene, with_legend};
use crate::math::RatPoly;
use crate::math::poly::parse::parse_poly;
use crate::math::quotient::normal_form::normal_form_by;
use crate::math::quotient::reduction::MAX_NORMAL_FORM_N;
use crate::math::schubert::polynomial::schubert;

/// The one figure of panels, named `paths-W` or `paths-poly`.
pub fn panels(args: &FigureArgs, look: &Look) -> Result<Vec<Figure>, CliError> {
    let kind = args.kind.name();
    let (f, n, name) = match &args.poly {
        Some(text) => {
            let Some(n) = args.n else {
                return Err(CliError::Input(format!(
                    "figure paths --poly needs --n, the number of variables (1 to {MAX_NORMAL_FORM_N})"
                )));
            };
            (parse_poly(text, Some(n))?, n, format!("{kind}-poly"))
        }
        None => {
            let w = perm_arg(args)?;
            let s = schubert(&w).reverse_vars();
            (s.to_rational(), w.n(), format!("{kind}-{}", compact(&w)))
        }
    };
    let grid = paths_scene(&f, n, args.columns, look)?;
    let scene = if args.legend {
        with_legend(&grid, n, look)
    } else {
        grid
    };
    Ok(vec![(0, name, scene)])
}

fn paths_scene(
    f: &RatPoly,
    n: usize,
    columns: Option<usize>,
    look: &Look,
) -> Result<Scene, CliError> {
    if n == 0 || n > MAX_NORMAL_FORM_N {
        return Err(CliError::Input(format!(
            "n = {n} is out of range; normal forms modulo J_n are computed for n from 1 to {MAX_NORMAL_FORM_N}"
        )));
    }
    let q = interrupt::run_interruptible(&format!("the basis of J_{n}"), "steps", 0, |progress| {
        crate::basis_cache::reducer_with(n, progress)
    })?;
    let nf = normal_form_by(q.as_ref(), f)?;
    let panels = panels_of_normal_form(&nf, n).map_err(|e| CliError::Failed(e.to_string()))?;
    let columns = columns.unwrap_or_else(|| (panels.len() as f64).sqrt().ceil().max(1.0) as usize);
    if columns == 0 {
        return Err(CliError::Input("--columns must be at least 1".into()));
    }
    Ok(path_grid_scene(&panels, n, columns, look))
}
