//! `figure wiring`: wiring diagrams of the reduced words of w, or of the word
//! given with `--word`.

use super::Figure;
use super::pick::{compact, named, perm_arg, pick};
use crate::cli::args::FigureArgs;
use crate::cli::error::CliError;
use crate::figure::look::Look;
use crate::figure::wiring::wiring_scene;
use crate::math::Perm;
use crate::math::perms::words::reduced_words;

/// The diagrams picked (in lexicographic order of the words), or the one of `--word`.
pub fn diagrams(args: &FigureArgs, look: &Look) -> Result<Vec<Figure>, CliError> {
    let kind = args.kind.name();
    if let Some(word) = &args.word {
        let (word, n) = parse_word(word, args.perm.as_deref())?;
        let name = word
            .iter()
            .map(|a| a.to_string())
            .collect::<Vec<_>>()
            .join("");
        return Ok(vec![(
            0,
            format!("{kind}-{name}"),
            wiring_scene(&word, n, look, None),
        )]);
    }
    let w = perm_arg(args)?;
    let picked = pick(
        args,
        reduced_words(&w),
        &format!("reduced words of {}", compact(&w)),
    )?;
    Ok(named(kind, &w, picked, |word| {
        wiring_scene(word, w.n(), look, None)
    }))
}

/// Reads `--word` (letters 1..n-1 as `121` or `1,2,1`), checks that it is
/// reduced, and gives it with its n (at least that of `perm`, when given).
fn parse_word(text: &str, perm: Option<&str>) -> Result<(Vec<usize>, usize), CliError> {
    let parts: Vec<&str> = if text.contains([',', ' ']) {
        text.split([',', ' ']).filter(|s| !s.is_empty()).collect()
    } else {
        text.split("").filter(|s| !s.is_empty()).collect()
    };
    let mut word = Vec::with_capacity(parts.len());
    for p in parts {
        let Ok(a) = p.parse::<usize>() else {
            return Err(CliError::Input(format!(
                "--word {text:?}: {p:?} is not a letter; give letters 1..n-1 like 121 or 1,2,1"
            )));
        };
        word.push(a);
    }
    if word.contains(&0) {
        return Err(CliError::Input(format!(
            "--word {text:?}: letters start at 1"
        )));
    }
    let needed = word.iter().max().map_or(1, |m| m + 1);
    let n = match perm {
        Some(p) => Perm::parse(p)?.n().max(needed),
        None => needed,
    };
    let w = Perm::from_word(&word, Some(n))?;
    if w.length() != word.len() {
        return Err(CliError::Input(format!(
            "--word {text:?} is not reduced: its product has length {} < {}",
            w.length(),
            word.len()
        )));
    }
    Ok((word, n))
}
