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
        (Some(typed), n) => typed.for_n(n)?,
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

#[cfg(test)]
mod tests {
    use crate::cli::args::{Cli, Command};
    use crate::cli::error::CliError;
    use clap::Parser;

    fn run(args: &[&str]) -> Result<String, CliError> {
        let cli = Cli::try_parse_from(args).map_err(|e| CliError::Input(e.to_string()))?;
        let Some(Command::Figure(a)) = cli.command else {
            return Err(CliError::Input("not a figure command".into()));
        };
        super::super::run(&a)
    }

    #[test]
    fn the_command_draws_the_boxes_of_h_and_refuses_what_is_not_a_hessenberg_function() {
        let dir = std::env::temp_dir().join(format!("elbowroom-figure-h-{}", std::process::id()));
        let out = dir.join("h.svg");
        let out_text = out.display().to_string();
        let said = run(&[
            "elbowroom",
            "figure",
            "hessenberg",
            "--h",
            "2,3,3",
            "--out",
            &out_text,
        ]);
        assert!(said.is_ok_and(|s| s.starts_with("wrote ")));
        let svg = std::fs::read_to_string(&out).unwrap_or_default();
        // n² = 9 boxes, tagged by cell, and n = 3 diagonal dots; Σ (h(i) − i) = 2 of the
        // boxes shaded (De Mari–Procesi–Shayman, 1992: the dimension of Hess(N, h))
        assert_eq!(svg.matches("<circle").count(), 3);
        assert_eq!(svg.matches("class=\"cell\"").count(), 9, "{svg}");
        let shade = format!("fill=\"{}\"", crate::figure::hessenberg::shade().hex());
        assert_eq!(svg.matches(&shade).count(), 2, "{svg}");
        for bad in ["2,1,3", "2,3", "4,4,4"] {
            let refused = run(&[
                "elbowroom",
                "figure",
                "hessenberg",
                "--h",
                bad,
                "--n",
                "3",
                "--out",
                &out_text,
            ]);
            assert!(
                matches!(
                    refused,
                    Err(CliError::Math(crate::math::MathError::InvalidInput(_)))
                ),
                "{bad}: {refused:?}"
            );
        }
        let _ = std::fs::remove_dir_all(&dir);
    }
}
