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
//! `merge` reads back), [`shard`], [`interrupt`], [`json`], [`output`] (the buffered sink
//! the output goes through) and [`error`].

pub mod args;
pub mod class_file;
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
pub mod json_reader;
pub mod merge_survey;
pub mod open_file;
pub mod output;
pub mod shard;

pub use args::{Cli, Command};
pub use error::CliError;
pub use output::Sink;

use clap::Parser;
use std::ffi::OsString;
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
    let stdout = std::io::stdout();
    let mut buffered = std::io::BufWriter::with_capacity(output::BUFFER, stdout.lock());
    let mut sink = Sink::new(&mut buffered, "standard output");
    let result = execute(&command, &mut sink).and_then(|()| sink.flush());
    match result {
        Ok(()) => ExitCode::SUCCESS,
        // a closed pipe (for example `| head`) means the reader has what it wanted
        Err(_) if sink.closed_pipe() => ExitCode::SUCCESS,
        Err(e) => {
            // what was produced before the failure still goes out, then the reason
            let _ = sink.flush();
            eprintln!("elbowroom: {}", e.message());
            ExitCode::from(e.exit_code())
        }
    }
}

/// Runs a parsed command, writing what it prints to `sink`. Commands with long
/// listings (`hessenberg`, `words`, `dreams`, `survey`) write their rows as they come; the
/// others return one string, written whole and ended with a newline.
pub fn execute(command: &Command, sink: &mut Sink<'_>) -> Result<(), CliError> {
    let whole = match command {
        Command::Words(a) => return cmd_words::run(a, sink),
        Command::Dreams(a) => return cmd_dreams::run(a, sink),
        Command::Hessenberg(a) => return cmd_hessenberg::run(a, sink),
        Command::Perm(a) => cmd_perm::run(a),
        Command::Schubert(a) => cmd_schubert::run(a),
        Command::Divsym(a) => cmd_divsym::run(a),
        Command::Volume(a) => cmd_volume::run(a),
        Command::Eulerian(a) => cmd_eulerian::run(a),
        Command::Expand(a) => return cmd_expand::run(a, sink),
        Command::Product(a) => cmd_product::run(a),
        Command::Merge(a) => return cmd_merge::run(a, sink),
        Command::Quotient(a) => cmd_quotient::run(a),
        Command::Reduce(a) => cmd_reduce::run(a),
        Command::Survey(a) => return cmd_survey::run(a, sink),
        Command::Session(a) => cmd_session::run(a),
        Command::Figure(a) => cmd_figure::run(a),
    }?;
    sink.whole(&whole)
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
