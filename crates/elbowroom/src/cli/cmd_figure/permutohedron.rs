//! `figure permutohedron`: P_λ drawn from its vertices, edges and labels.

use super::Figure;
use crate::cli::args::FigureArgs;
use crate::cli::error::CliError;
use crate::figure::look::Look;
use crate::figure::permutohedron::polytope_scene;
use crate::math::permutohedra::drawing::{MAX_DRAWN_N, PolytopeDrawing};
use crate::math::permutohedra::permutohedron::Permutohedron;

/// The one figure of P_λ for `--lambda` (n <= [`MAX_DRAWN_N`]).
pub fn drawing(args: &FigureArgs, look: &Look) -> Result<Vec<Figure>, CliError> {
    let Some(lambda) = &args.lambda else {
        return Err(CliError::Input(
            "figure permutohedron needs --lambda, for example --lambda 3,2,1,0".into(),
        ));
    };
    let p = Permutohedron::new(lambda)?;
    if p.n() > MAX_DRAWN_N {
        return Err(CliError::Input(format!(
            "P_λ is drawn for n <= {MAX_DRAWN_N}; --lambda has {} entries",
            p.n()
        )));
    }
    // the labels are drawn only when `look.labels` is set
    let d = PolytopeDrawing::of(&p)?;
    let scene = polytope_scene(&d.coords, &d.edges, &d.labels, args.yaw, args.pitch, look);
    Ok(vec![(0, args.kind.name().to_string(), scene)])
}
