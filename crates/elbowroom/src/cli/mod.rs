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

pub(crate) mod args;
pub(crate) mod class_file;
pub(crate) mod cmd_coefficient;
pub(crate) mod cmd_divsym;
pub(crate) mod cmd_dreams;
pub(crate) mod cmd_eulerian;
pub(crate) mod cmd_expand;
pub(crate) mod cmd_figure;
pub(crate) mod cmd_forest;
pub(crate) mod cmd_hessenberg;
pub(crate) mod cmd_merge;
pub(crate) mod cmd_perm;
pub(crate) mod cmd_product;
pub(crate) mod cmd_quotient;
pub(crate) mod cmd_reduce;
pub(crate) mod cmd_schubert;
pub(crate) mod cmd_session;
pub mod cmd_survey;
pub(crate) mod cmd_volume;
pub(crate) mod cmd_words;
pub mod cut_short;
pub mod documents;
pub mod error;
pub(crate) mod expansion_text;
pub(crate) mod inputs;
pub mod interrupt;
pub mod json;
pub(crate) mod merge_survey;
pub mod open_file;
pub mod output;
pub(crate) mod piece_reader;
pub mod shard;
pub(crate) mod survey_piece;

pub use args::{Cli, Command};
pub use error::CliError;
pub use output::Sink;

use clap::{CommandFactory, FromArgMatches};
use std::ffi::OsString;
use std::process::ExitCode;

/// Writes one line `elbowroom: LINE` on standard error; when standard error
/// cannot be written (a full device, a closed pipe) the line is dropped,
/// never a panic.
pub fn report(line: &str) {
    use std::io::Write;
    let mut line = crate::math::excerpt::escape_controls(line);
    // a message quoting too much of an input is cut in the middle
    if line.chars().count() > 1000 {
        let head: String = line.chars().take(600).collect();
        let tail: Vec<char> = line.chars().rev().take(300).collect();
        let tail: String = tail.into_iter().rev().collect();
        line = format!("{head} … {tail}");
    }
    let mut err = std::io::stderr().lock();
    let _ = writeln!(err, "elbowroom: {line}");
    let _ = err.flush();
}

/// Whether standard output is open. A descriptor closed by the caller (`>&-`)
/// is reopened on `/dev/null` (read and write) by the Rust runtime before
/// `main`, where every write would vanish; such a start is taken as closed,
/// so that the command says so instead of succeeding with nothing written.
/// (A shell's `> /dev/null` opens it write-only and is left alone.)
pub fn stdout_is_open() -> bool {
    #[cfg(target_os = "linux")]
    {
        let target = std::fs::read_link("/proc/self/fd/1");
        if target.is_ok_and(|t| t == std::path::Path::new("/dev/null"))
            && let Ok(info) = std::fs::read_to_string("/proc/self/fdinfo/1")
            && let Some(flags) = info.lines().find_map(|l| l.strip_prefix("flags:"))
            && let Ok(flags) = u32::from_str_radix(flags.trim(), 8)
        {
            // O_ACCMODE = 3, O_RDWR = 2
            return flags & 3 != 2;
        }
        true
    }
    #[cfg(not(target_os = "linux"))]
    true
}

/// Runs one headless command and prints its output; returns the exit status.
pub fn run(argv: Vec<OsString>) -> ExitCode {
    let format = cut_short::Format::of_arguments(&argv);
    let matches = match Cli::command().try_get_matches_from(argv) {
        Ok(m) => m,
        Err(e) => return report_usage_error(e),
    };
    let cli = match Cli::from_arg_matches(&matches) {
        Ok(cli) => cli,
        Err(e) => return report_usage_error(e),
    };
    let Some(command) = cli.command else {
        report("no command given; see 'elbowroom --help'");
        return ExitCode::from(2);
    };
    let name = matches.subcommand_name().unwrap_or("the command");
    if let Some(("figure", sub)) = matches.subcommand()
        && let Err(e) = cmd_figure::foreign_flags(sub)
    {
        report(&e.message());
        return ExitCode::from(e.exit_code());
    }
    interrupt::install(name);
    let result = match command.out_file() {
        Some(path) => run_to_file(&command, path),
        None => run_to_stdout(&command, format),
    };
    match result {
        Ok(()) => ExitCode::SUCCESS,
        Err(e) => {
            report(&e.message());
            ExitCode::from(e.exit_code())
        }
    }
}

/// Runs a command whose output goes to standard output; an output that stops
/// before it is complete ends with the cut marker of `format`.
fn run_to_stdout(command: &Command, format: cut_short::Format) -> Result<(), CliError> {
    if !stdout_is_open() {
        return Err(CliError::Failed(
            "cannot write standard output: it is closed".into(),
        ));
    }
    let stdout = std::io::stdout();
    let mut buffered = std::io::BufWriter::with_capacity(output::BUFFER, stdout.lock());
    let mut sink = Sink::new(&mut buffered, "standard output").with_cut_marker(format);
    let result = execute(command, &mut sink).and_then(|()| sink.flush());
    match result {
        Ok(()) => {
            sink.finished();
            Ok(())
        }
        // a closed pipe (for example `| head`) means the reader has what it wanted
        Err(_) if sink.closed_pipe() => Ok(()),
        Err(e) => {
            // what was produced before the failure still goes out, ended by a
            // line no reader can take for the end of a complete output
            sink.cut_short();
            let _ = sink.flush();
            Err(e)
        }
    }
}

/// Runs a command whose output goes to `--out FILE`: written to a temporary
/// file beside it, renamed to FILE only when the command has succeeded.
fn run_to_file(command: &Command, path: &std::path::Path) -> Result<(), CliError> {
    let shown = crate::math::excerpt::excerpt(&path.display().to_string());
    let failed = |e: crate::atomic_write::WriteFailure| {
        CliError::Failed(format!("cannot write {shown}: {e}"))
    };
    let mut staged = crate::atomic_write::Staged::create(path).map_err(failed)?;
    let mut sink = Sink::new(&mut staged, &shown);
    execute(command, &mut sink).and_then(|()| sink.flush())?;
    drop(sink);
    staged.commit().map_err(failed)
}

/// Prints a completion script for `shell`.
fn completions(shell: args::ShellArg) -> Result<String, CliError> {
    use clap_complete::Shell;
    let shell = match shell {
        args::ShellArg::Bash => Shell::Bash,
        args::ShellArg::Zsh => Shell::Zsh,
        args::ShellArg::Fish => Shell::Fish,
    };
    let mut bytes = Vec::new();
    clap_complete::generate(shell, &mut Cli::command(), "elbowroom", &mut bytes);
    String::from_utf8(bytes)
        .map_err(|_| CliError::Failed("the completion script is not text".into()))
}

/// Prints the manual page (roff).
fn manual_page() -> Result<String, CliError> {
    let mut bytes = Vec::new();
    clap_mangen::Man::new(Cli::command())
        .render(&mut bytes)
        .map_err(|e| CliError::Failed(format!("cannot render the manual page: {e}")))?;
    String::from_utf8(bytes).map_err(|_| CliError::Failed("the manual page is not text".into()))
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
        Command::Coefficient(a) => cmd_coefficient::run(a),
        Command::Expand(a) => return cmd_expand::run(a, sink),
        Command::Product(a) => cmd_product::run(a),
        Command::Merge(a) => return cmd_merge::run(a, sink),
        Command::Quotient(a) => cmd_quotient::run(a),
        Command::Reduce(a) => cmd_reduce::run(a),
        Command::Survey(a) => return cmd_survey::run(a, sink),
        Command::Session(a) => cmd_session::run(a),
        Command::Figure(a) => cmd_figure::run(a),
        Command::Completions(a) => completions(a.shell),
        Command::Man => manual_page(),
        Command::Forest(a) => cmd_forest::run(a),
    }?;
    sink.whole(&whole)
}

fn report_usage_error(e: clap::Error) -> ExitCode {
    use clap::error::ErrorKind;
    match e.kind() {
        ErrorKind::DisplayHelp
        | ErrorKind::DisplayVersion
        | ErrorKind::DisplayHelpOnMissingArgumentOrSubcommand => {
            use std::io::Write;
            // help and version are the output: a failed write is a failure
            let written = if stdout_is_open() {
                e.print().and_then(|()| std::io::stdout().flush())
            } else {
                Err(std::io::Error::other("it is closed"))
            };
            match written {
                Ok(()) => ExitCode::SUCCESS,
                Err(err) => {
                    report(&format!("cannot write standard output: {err}"));
                    ExitCode::FAILURE
                }
            }
        }
        _ => {
            // a typed reader's refusal is already the one line to print
            if let Some(v) =
                std::error::Error::source(&e).and_then(|s| s.downcast_ref::<args::Verbatim>())
            {
                report(&v.0);
                return ExitCode::from(2);
            }
            let rendered = e.to_string();
            let summary: Vec<&str> = rendered
                .lines()
                .take_while(|l| !l.starts_with("Usage:"))
                .map(|l| l.trim())
                .filter(|l| !l.is_empty() && !l.starts_with("tip:") && !l.starts_with("For more"))
                .collect();
            let text = summary.join(" ");
            let text = text.trim_start_matches("error: ");
            report(&format!(
                "{text}; see 'elbowroom --help' for what is accepted"
            ));
            ExitCode::from(2)
        }
    }
}
