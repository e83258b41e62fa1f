//! The documentation's command examples, run against the real binary.
//!
//! In README.md and every `docs/*.md`, a fenced block tagged `console` holds
//! examples: a line `$ elbowroom ARGS` (arguments split as a shell splits them:
//! single quotes, double quotes, backslashes), then exactly the standard
//! output the binary prints, up to the next `$` line or the end of the block
//! (one trailing blank line, which separates examples, is not part of it).
//! Each example runs in a fresh temporary directory holding a symbolic link
//! `sessions` to the repository's `sessions/`; the parent directories of an
//! `--out` path are created first. Its standard output must equal the text
//! shown byte for byte. Blocks tagged otherwise (`text`, `sh`) are not run.
#![allow(clippy::unwrap_used)]

use std::io::Read;
use std::path::{Path, PathBuf};
use std::process::{Command, Stdio};
use std::sync::atomic::{AtomicUsize, Ordering};
use std::time::{Duration, Instant};

/// How long one example may run before it counts as hung (the documented
/// examples take well under 2 s each on a debug build).
const EXAMPLE_DEADLINE: Duration = Duration::from_secs(120);

/// One `$ elbowroom ...` example and the output the documentation shows.
#[derive(Debug, PartialEq)]
struct Example {
    /// The documentation file, relative to the repository root.
    file: String,
    /// 1-based line of the `$` line in that file.
    line: usize,
    /// The arguments after `elbowroom`.
    args: Vec<String>,
    /// The expected standard output.
    expected: String,
}

/// Splits a command line as a POSIX shell splits words: whitespace separates,
/// single quotes keep everything, double quotes keep everything but `\"`,
/// `\\`, `\$` and `` \` ``, a backslash outside quotes keeps the next
/// character. Operators a shell would act on (`|`, `>`, `<`, `;`, `&`, `$`,
/// `` ` ``, `*`, `?`) outside quotes are refused: such an example belongs in
/// a `text` block.
fn shell_words(line: &str) -> Result<Vec<String>, String> {
    let mut words = Vec::new();
    let mut word = String::new();
    let mut in_word = false;
    let mut chars = line.chars();
    while let Some(c) = chars.next() {
        match c {
            ' ' | '\t' => {
                if in_word {
                    words.push(std::mem::take(&mut word));
                    in_word = false;
                }
            }
            '\'' => {
                in_word = true;
                loop {
                    match chars.next() {
                        Some('\'') => break,
                        Some(q) => word.push(q),
                        None => return Err("unclosed single quote".into()),
                    }
                }
            }
            '"' => {
                in_word = true;
                loop {
                    match chars.next() {
                        Some('"') => break,
                        Some('\\') => match chars.next() {
                            Some(e @ ('"' | '\\' | '$' | '`')) => word.push(e),
                            Some(other) => {
                                word.push('\\');
                                word.push(other);
                            }
                            None => return Err("unclosed double quote".into()),
                        },
                        Some('$' | '`') => {
                            return Err("expansion inside double quotes is not run".into());
                        }
                        Some(q) => word.push(q),
                        None => return Err("unclosed double quote".into()),
                    }
                }
            }
            '\\' => {
                in_word = true;
                match chars.next() {
                    Some(e) => word.push(e),
                    None => return Err("a backslash at the end of the line".into()),
                }
            }
            '|' | '>' | '<' | ';' | '&' | '$' | '`' | '*' | '?' => {
                return Err(format!(
                    "the shell character {c:?} is not run here (use a text block)"
                ));
            }
            other => {
                in_word = true;
                word.push(other);
            }
        }
    }
    if in_word {
        words.push(word);
    }
    Ok(words)
}

/// The examples of one Markdown text; `file` names it in the results.
fn examples_in(file: &str, text: &str) -> Result<Vec<Example>, String> {
    let lines: Vec<&str> = text.lines().collect();
    let mut examples = Vec::new();
    let mut i = 0;
    while i < lines.len() {
        let fence = lines[i].trim_start();
        if !fence.starts_with("```") {
            i += 1;
            continue;
        }
        let tag = fence.trim_start_matches('`').trim();
        let mut end = i + 1;
        while end < lines.len() && !lines[end].trim_start().starts_with("```") {
            end += 1;
        }
        if end == lines.len() {
            return Err(format!(
                "{file}:{}: a code block that is never closed",
                i + 1
            ));
        }
        if tag == "console" {
            examples.extend(examples_of_block(file, &lines, i + 1, end)?);
        }
        i = end + 1;
    }
    Ok(examples)
}

/// The examples of the console block whose body is `lines[start..end]`.
fn examples_of_block(
    file: &str,
    lines: &[&str],
    start: usize,
    end: usize,
) -> Result<Vec<Example>, String> {
    let mut examples = Vec::new();
    let mut k = start;
    while k < end {
        let line = lines[k];
        let Some(command) = line.strip_prefix("$ ") else {
            if line.trim().is_empty() {
                k += 1;
                continue;
            }
            return Err(format!(
                "{file}:{}: output before any `$ elbowroom` line: {line:?}",
                k + 1
            ));
        };
        let words = shell_words(command).map_err(|e| format!("{file}:{}: {e}", k + 1))?;
        let Some((program, args)) = words.split_first() else {
            return Err(format!("{file}:{}: an empty command", k + 1));
        };
        if program != "elbowroom" {
            return Err(format!(
                "{file}:{}: only `elbowroom` is run in a console block, not {program:?}",
                k + 1
            ));
        }
        let mut stop = k + 1;
        while stop < end && !lines[stop].starts_with("$ ") {
            stop += 1;
        }
        let mut output: Vec<&str> = lines[k + 1..stop].to_vec();
        if output.last().is_some_and(|last| last.is_empty()) {
            output.pop();
        }
        let expected = if output.is_empty() {
            String::new()
        } else {
            output.join("\n") + "\n"
        };
        examples.push(Example {
            file: file.to_string(),
            line: k + 1,
            args: args.to_vec(),
            expected,
        });
        k = stop;
    }
    Ok(examples)
}

/// The repository root (two levels above this crate).
fn repository() -> PathBuf {
    Path::new(env!("CARGO_MANIFEST_DIR"))
        .join("../..")
        .canonicalize()
        .unwrap()
}

/// README.md and the Markdown files of `docs/`, relative to the root, sorted.
fn documentation_files(root: &Path) -> Vec<String> {
    let mut files = vec!["README.md".to_string()];
    if let Ok(entries) = std::fs::read_dir(root.join("docs")) {
        let mut docs: Vec<String> = entries
            .filter_map(|e| e.ok())
            .map(|e| e.file_name().to_string_lossy().into_owned())
            .filter(|name| name.ends_with(".md"))
            .map(|name| format!("docs/{name}"))
            .collect();
        docs.sort();
        files.extend(docs);
    }
    files
}

/// A fresh, empty directory for one example, with `sessions` linked in.
fn scratch_dir(root: &Path) -> PathBuf {
    static NEXT: AtomicUsize = AtomicUsize::new(0);
    let dir = std::env::temp_dir().join(format!(
        "elbowroom-doc-example-{}-{}",
        std::process::id(),
        NEXT.fetch_add(1, Ordering::Relaxed)
    ));
    let _ = std::fs::remove_dir_all(&dir);
    std::fs::create_dir_all(&dir).unwrap();
    std::os::unix::fs::symlink(root.join("sessions"), dir.join("sessions")).unwrap();
    dir
}

/// Creates the parent directories of every `--out` path of an example.
fn prepare_out_dirs(dir: &Path, args: &[String]) {
    for (k, arg) in args.iter().enumerate() {
        let path = if arg == "--out" {
            args.get(k + 1).map(String::as_str)
        } else {
            arg.strip_prefix("--out=")
        };
        if let Some(parent) = path.and_then(|p| Path::new(p).parent()) {
            std::fs::create_dir_all(dir.join(parent)).unwrap();
        }
    }
}

/// What one run printed.
struct Ran {
    stdout: Vec<u8>,
    stderr: Vec<u8>,
    status: String,
}

/// Runs one example in a fresh directory; `Err` if it hung past the deadline.
fn run(root: &Path, example: &Example) -> Result<Ran, String> {
    let dir = scratch_dir(root);
    prepare_out_dirs(&dir, &example.args);
    let mut child = Command::new(env!("CARGO_BIN_EXE_elbowroom"))
        .args(&example.args)
        .current_dir(&dir)
        .env("XDG_CONFIG_HOME", dir.join(".config"))
        .env("XDG_CACHE_HOME", dir.join(".cache"))
        .stdin(Stdio::null())
        .stdout(Stdio::piped())
        .stderr(Stdio::piped())
        .spawn()
        .unwrap();
    let mut out_pipe = child.stdout.take().unwrap();
    let mut err_pipe = child.stderr.take().unwrap();
    let out_reader = std::thread::spawn(move || {
        let mut bytes = Vec::new();
        out_pipe.read_to_end(&mut bytes).map(|_| bytes)
    });
    let err_reader = std::thread::spawn(move || {
        let mut bytes = Vec::new();
        err_pipe.read_to_end(&mut bytes).map(|_| bytes)
    });
    let started = Instant::now();
    let status = loop {
        if let Some(status) = child.try_wait().unwrap() {
            break status;
        }
        if started.elapsed() > EXAMPLE_DEADLINE {
            let _ = child.kill();
            let _ = child.wait();
            let _ = std::fs::remove_dir_all(&dir);
            return Err(format!(
                "{}:{}: still running after {} s",
                example.file,
                example.line,
                EXAMPLE_DEADLINE.as_secs()
            ));
        }
        std::thread::sleep(Duration::from_millis(5));
    };
    let stdout = out_reader.join().unwrap().unwrap();
    let stderr = err_reader.join().unwrap().unwrap();
    let _ = std::fs::remove_dir_all(&dir);
    Ok(Ran {
        stdout,
        stderr,
        status: status.to_string(),
    })
}

#[test]
fn every_console_example_prints_what_the_documentation_shows() {
    let root = repository();
    let mut examples = Vec::new();
    for file in documentation_files(&root) {
        let text = std::fs::read_to_string(root.join(&file)).unwrap();
        examples.extend(examples_in(&file, &text).unwrap_or_else(|e| panic!("{e}")));
    }
    assert!(
        examples.iter().filter(|e| e.file == "README.md").count() >= 3,
        "the README shows a tour of at least three examples"
    );
    let mut failures = Vec::new();
    for example in &examples {
        match run(&root, example) {
            Err(hung) => failures.push(hung),
            Ok(ran) if ran.stdout != example.expected.as_bytes() => failures.push(format!(
                "{}:{}: $ elbowroom {}\n--- expected\n{}--- got ({})\n{}--- stderr\n{}",
                example.file,
                example.line,
                example.args.join(" "),
                example.expected,
                ran.status,
                String::from_utf8_lossy(&ran.stdout),
                String::from_utf8_lossy(&ran.stderr),
            )),
            Ok(_) => {}
        }
    }
    eprintln!(
        "{} documentation examples run, {} differ",
        examples.len(),
        failures.len()
    );
    assert!(failures.is_empty(), "\n{}", failures.join("\n"));
}

#[test]
fn words_are_split_as_a_shell_splits_them() {
    assert_eq!(
        shell_words(r#"divsym "x1^2 x2" --n 3"#).unwrap(),
        ["divsym", "x1^2 x2", "--n", "3"]
    );
    assert_eq!(
        shell_words(r#"reduce 'a "b"' c\ d "e\"f" """#).unwrap(),
        ["reduce", "a \"b\"", "c d", "e\"f", ""]
    );
    assert!(shell_words("hessenberg --n 16 --csv | tail -1").is_err());
    assert!(shell_words("perm 1432 > out.txt").is_err());
    assert!(shell_words("perm 'unclosed").is_err());
}

#[test]
fn examples_are_cut_at_the_next_dollar_line_and_one_separating_blank_line() {
    let text = "intro\n\n```console\n$ elbowroom perm 12\nw = 12\n\n  indented\n\n\
                $ elbowroom schubert 1\n\n$ elbowroom x 'a b'\nlast\n```\n\n\
                ```text\n$ elbowroom not run\n```\n";
    let examples = examples_in("doc.md", text).unwrap();
    assert_eq!(examples.len(), 3);
    assert_eq!(examples[0].line, 4);
    assert_eq!(examples[0].args, ["perm", "12"]);
    assert_eq!(examples[0].expected, "w = 12\n\n  indented\n");
    assert_eq!(examples[1].expected, "");
    assert_eq!(examples[2].args, ["x", "a b"]);
    assert_eq!(examples[2].expected, "last\n");
    assert!(examples_in("doc.md", "```console\n$ ls\n```\n").is_err());
    assert!(examples_in("doc.md", "```console\nstray\n```\n").is_err());
    assert!(examples_in("doc.md", "```console\n$ elbowroom perm 1\n").is_err());
}
