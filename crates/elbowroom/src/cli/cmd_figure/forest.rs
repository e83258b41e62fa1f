//! `figure forest --code C`: an indexed forest on the number line, named `forest-C`.

use super::Figure;
use crate::cli::args::FigureArgs;
use crate::cli::cmd_forest::parse_code;
use crate::cli::error::CliError;
use crate::figure::forest::forest_scene;
use crate::figure::look::Look;
use crate::math::forest::indexed::Forest;

/// The one figure of the forest of `--code`.
pub fn drawing(args: &FigureArgs, look: &Look) -> Result<Vec<Figure>, CliError> {
    let Some(text) = &args.code else {
        return Err(CliError::Input(
            "figure forest needs --code c1,c2,… (for example --code 2,0,1)".into(),
        ));
    };
    let forest = Forest::from_code(&parse_code(text)?)?;
    let name: Vec<String> = forest.code().iter().map(|v| v.to_string()).collect();
    let name = if name.is_empty() {
        "forest-empty".to_string()
    } else {
        format!("forest-{}", name.join("-"))
    };
    Ok(vec![(0, name, forest_scene(&forest, look))])
}
