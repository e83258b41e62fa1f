//! The headless commands behind `elbowroom <command>`.
//!
//! Every command prints readable text by default and exactly one JSON object
//! with `--json`. Exact values (counts, coefficients, rationals) are JSON
//! strings; small structural integers are JSON numbers. Bad input gives a
//! one-line message on stderr and exit status 2.
//!
//! Layout: [`args`] holds the whole grammar (every argument type) and imports
//! no command; each `cmd_*` module runs one command and imports no other
//! command module. What several commands share lives beside them:
//! [`inputs`] (reading `--n`/`--h` and λ), [`documents`] (the JSON kinds that
//! `merge` reads back), [`shard`], [`interrupt`], [`json`] and [`error`].

pub mod args;
pub mod cmd_divsym;
pub mod cmd_dreams;
pub mod cmd_eulerian;
pub mod cmd_expand;
pub mod cmd_figure;
pub mod cmd_hessenberg;
pub mod cmd_merge;
pub mod cmd_perm;
pub mod cmd_product;
pub mod cmd_quotient;
pub mod cmd_reduce;
pub mod cmd_schubert;
pub mod cmd_session;
pub mod cmd_survey;
pub mod cmd_volume;
pub mod cmd_words;
pub mod documents;
pub mod error;
pub mod expansion_text;
pub mod inputs;
pub mod interrupt;
pub mod json;
pub mod merge_survey;
pub mod open_file;
pub mod shard;

pub use args::{Cli, Command};
pub use error::CliError;

use clap::Parser;
use std::ffi::OsString;
use std::io::Write;
use std::process::ExitCode;

/// Runs one headless command and prints its output; returns the exit status.
pub fn run(argv: Vec<OsString>) -> ExitCode {
    let cli = match Cli::try_parse_from(argv) {
        Ok(cli) => cli,
        Err(e) => return report_usage_error(e),
    };
    let Some(command) = cli.command else {
        eprintln!("elbowroom: no command given; see 'elbowroom --help'");
        return ExitCode::from(2);
    };
    match execute(&command) {
        Ok(out) => match write_stdout(&out) {
            Ok(()) => ExitCode::SUCCESS,
            // a closed pipe (for example `| head`) means the reader has what it wanted
            Err(e) if e.kind() == std::io::ErrorKind::BrokenPipe => ExitCode::SUCCESS,
            Err(e) => {
                eprintln!("elbowroom: cannot write standard output: {e}");
                ExitCode::from(1)
            }
        },
        Err(e) => {
            eprintln!("elbowroom: {}", e.message());
            ExitCode::from(e.exit_code())
        }
    }
}

/// Writes the command's output, ending in a newline, and flushes it: a
/// failed write (a full disk, /dev/full) is an error, never a success.
fn write_stdout(out: &str) -> std::io::Result<()> {
    let mut stdout = std::io::stdout().lock();
    stdout.write_all(out.as_bytes())?;
    if !out.ends_with('\n') {
        stdout.write_all(b"\n")?;
    }
    stdout.flush()
}

/// Runs a parsed command and returns what it prints.
pub fn execute(command: &Command) -> Result<String, CliError> {
    match command {
        Command::Perm(a) => cmd_perm::run(a),
        Command::Schubert(a) => cmd_schubert::run(a),
        Command::Words(a) => cmd_words::run(a),
        Command::Dreams(a) => cmd_dreams::run(a),
        Command::Divsym(a) => cmd_divsym::run(a),
        Command::Hessenberg(a) => cmd_hessenberg::run(a),
        Command::Volume(a) => cmd_volume::run(a),
        Command::Eulerian(a) => cmd_eulerian::run(a),
        Command::Expand(a) => cmd_expand::run(a),
        Command::Product(a) => cmd_product::run(a),
        Command::Merge(a) => cmd_merge::run(a),
        Command::Quotient(a) => cmd_quotient::run(a),
        Command::Reduce(a) => cmd_reduce::run(a),
        Command::Survey(a) => cmd_survey::run(a),
        Command::Session(a) => cmd_session::run(a),
        Command::Figure(a) => cmd_figure::run(a),
    }
}

fn report_usage_error(e: clap::Error) -> ExitCode {
    use clap::error::ErrorKind;
    match e.kind() {
        ErrorKind::DisplayHelp
        | ErrorKind::DisplayVersion
        | ErrorKind::DisplayHelpOnMissingArgumentOrSubcommand => {
            let _ = e.print();
            ExitCode::SUCCESS
        }
        _ => {
            let rendered = e.to_string();
            let summary: Vec<&str> = rendered
                .lines()
                .take_while(|l| !l.starts_with("Usage:"))
                .map(|l| l.trim())
                .filter(|l| !l.is_empty() && !l.starts_with("tip:") && !l.starts_with("For more"))
                .collect();
            let text = summary.join(" ");
            let text = text.trim_start_matches("error: ");
            eprintln!("elbowroom: {text}; see 'elbowroom --help' for what is accepted");
            ExitCode::from(2)
        }
    }
}
