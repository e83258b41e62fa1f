//! The command-line grammar (clap definitions), one struct per command.

use clap::{Args, Parser, Subcommand};

/// elbowroom: exact Schubert calculus. With no command, opens the explorer.
#[derive(Parser, Debug)]
#[command(name = "elbowroom", version, about, long_about = None)]
pub struct Cli {
    /// The headless command to run; none opens the explorer.
    #[command(subcommand)]
    pub command: Option<Command>,
}

/// The headless commands.
#[derive(Subcommand, Debug)]
pub enum Command {
    /// Facts about a permutation: length, code, inverse, descents, classes, counts.
    Perm(PermArgs),
    /// The Schubert polynomial S_w.
    Schubert(SchubertArgs),
    /// The reduced words of w in lexicographic order, and their number.
    Words(WordsArgs),
    /// The reduced pipe dreams of w (or its bumpless pipe dreams), and their number.
    Dreams(DreamsArgs),
}

/// Arguments of `elbowroom perm`.
#[derive(Args, Debug)]
pub struct PermArgs {
    /// The permutation: 31524, "3 1 5 2 4" or 3,1,5,2,4 (commas needed for n >= 10).
    pub perm: String,
    /// Print one JSON object instead of text.
    #[arg(long)]
    pub json: bool,
}

/// Arguments of `elbowroom schubert`.
#[derive(Args, Debug)]
pub struct SchubertArgs {
    /// The permutation: 31524, "3 1 5 2 4" or 3,1,5,2,4.
    pub perm: String,
    /// Print one JSON object instead of text.
    #[arg(long)]
    pub json: bool,
    /// Print the polynomial in LaTeX instead of plain text.
    #[arg(long, conflicts_with = "json")]
    pub latex: bool,
}

/// Arguments of `elbowroom words`.
#[derive(Args, Debug)]
pub struct WordsArgs {
    /// The permutation: 31524, "3 1 5 2 4" or 3,1,5,2,4.
    pub perm: String,
    /// List at most this many words (the first ones in lexicographic order).
    #[arg(long, default_value_t = 1000)]
    pub limit: usize,
    /// Only count; list no words.
    #[arg(long)]
    pub count: bool,
    /// Print one JSON object instead of text.
    #[arg(long)]
    pub json: bool,
}

/// Arguments of `elbowroom dreams`.
#[derive(Args, Debug)]
pub struct DreamsArgs {
    /// The permutation: 31524, "3 1 5 2 4" or 3,1,5,2,4.
    pub perm: String,
    /// List at most this many dreams.
    #[arg(long, default_value_t = 1000)]
    pub limit: usize,
    /// Only count; list no dreams.
    #[arg(long)]
    pub count: bool,
    /// Bumpless pipe dreams (n×n grids) instead of reduced pipe dreams.
    #[arg(long)]
    pub bumpless: bool,
    /// Print one JSON object instead of text.
    #[arg(long)]
    pub json: bool,
}
