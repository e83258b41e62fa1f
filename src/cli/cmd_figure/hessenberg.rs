//! `figure hessenberg --h H` (or `--n N` for h(i) = i + 1): the staircase
//! diagram of a Hessenberg function, named `hessenberg-H`.

use super::Figure;
use crate::cli::args::FigureArgs;
use crate::cli::error::CliError;
use crate::figure::hessenberg::hessenberg_scene;
use crate::figure::look::Look;
use crate::math::hessenberg::function::HessenbergFn;

/// The one figure of h.
pub fn staircase(args: &FigureArgs, look: &Look) -> Result<Vec<Figure>, CliError> {
    let h = match (&args.h, args.n) {
        (Some(text), n) => HessenbergFn::parse(text, n)?,
        (None, Some(n)) => HessenbergFn::default_for(n)?,
        (None, None) => {
            return Err(CliError::Input(
                "figure hessenberg needs --h h(1),...,h(n) (for example --h 2,3,3) or --n N for h(i) = i + 1"
                    .into(),
            ));
        }
    };
    let name: Vec<String> = h.values().iter().map(|v| v.to_string()).collect();
    Ok(vec![(
        0,
        format!("hessenberg-{}", name.join("-")),
        hessenberg_scene(&h, look),
    )])
}
