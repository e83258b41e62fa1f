//! The file commands run as the real binary: `session check`, `elbowroom FILE`,
//! and (further down) `figure`.

#![allow(clippy::unwrap_used)]

use std::path::{Path, PathBuf};
use std::process::{Command, Output};

fn elbowroom(args: &[&str]) -> Output {
    Command::new(env!("CARGO_BIN_EXE_elbowroom"))
        .args(args)
        .env("XDG_CONFIG_HOME", scratch_root().join("config"))
        .env("XDG_STATE_HOME", scratch_root().join("state"))
        .env_remove("DISPLAY")
        .env_remove("WAYLAND_DISPLAY")
        .output()
        .unwrap()
}

fn scratch_root() -> PathBuf {
    Path::new(env!("CARGO_TARGET_TMPDIR")).join("cli-files")
}

fn scratch(name: &str) -> PathBuf {
    let dir = scratch_root().join(name);
    let _ = std::fs::remove_dir_all(&dir);
    std::fs::create_dir_all(&dir).unwrap();
    dir
}

fn demo(name: &str) -> String {
    Path::new(env!("CARGO_MANIFEST_DIR"))
        .join("../../sessions")
        .join(name)
        .display()
        .to_string()
}

fn stdout_json(out: &Output) -> serde_json::Value {
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let text = String::from_utf8(out.stdout.clone()).unwrap();
    assert_eq!(text.trim().lines().count(), 1, "one JSON object: {text}");
    serde_json::from_str(&text).unwrap()
}

#[test]
fn session_check_summarises_a_demo() {
    let v = stdout_json(&elbowroom(&[
        "session",
        "check",
        &demo("03-seminar-hessenberg-growth.ron"),
        "--json",
    ]));
    assert_eq!(v["ok"], true);
    assert_eq!(v["version"], 1);
    assert_eq!(v["n"], 4);
    assert_eq!(v["current"], serde_json::json!([2, 4, 3, 1]));
    assert_eq!(v["view"], "Hessenberg");
    assert_eq!(v["pins"], 3);
    assert_eq!(v["history"], 3);
    assert!(v["title"].as_str().unwrap().contains("Hessenberg"));
}

#[test]
fn session_check_text_names_the_file() {
    let out = elbowroom(&["session", "check", &demo("01-seminar-pipe-dreams.ron")]);
    assert!(out.status.success());
    let text = String::from_utf8(out.stdout).unwrap();
    assert!(
        text.contains("a valid session (format version 1)"),
        "{text}"
    );
    assert!(text.contains("current: 1432"), "{text}");
}

fn assert_refused(out: &Output, expected: &[&str]) {
    assert_eq!(out.status.code(), Some(2));
    assert!(out.stdout.is_empty(), "no partial output");
    let err = String::from_utf8(out.stderr.clone()).unwrap();
    assert_eq!(err.trim_end().lines().count(), 1, "one line: {err}");
    for e in expected {
        assert!(err.contains(e), "{e:?} in {err}");
    }
}

#[test]
fn session_check_refuses_bad_files_with_their_position() {
    let dir = scratch("bad");
    let text = std::fs::read_to_string(demo("02-seminar-reduced-words.ron")).unwrap();

    let truncated = dir.join("truncated.ron");
    std::fs::write(&truncated, &text[..text.len() * 2 / 3]).unwrap();
    let p = truncated.display().to_string();
    let out = elbowroom(&["session", "check", &p, "--json"]);
    assert_refused(&out, &[&format!("{p}:"), "truncated"]);

    let wrong = dir.join("wrong.ron");
    std::fs::write(
        &wrong,
        text.replacen("history_pos: 1", "history_pos: [1]", 1),
    )
    .unwrap();
    let line = text
        .lines()
        .position(|l| l.contains("history_pos: 1"))
        .unwrap()
        + 1;
    let p = wrong.display().to_string();
    let out = elbowroom(&["session", "check", &p, "--json"]);
    assert_refused(&out, &[&format!("{p}:{line}:"), "history_pos"]);

    let newer = dir.join("newer.ron");
    std::fs::write(&newer, text.replacen("version: 1", "version: 7", 1)).unwrap();
    let out = elbowroom(&["session", "check", &newer.display().to_string()]);
    assert_refused(&out, &["format version 7, this build reads up to 1"]);

    let out = elbowroom(&["session", "check", "/no/such/file.ron"]);
    assert_refused(&out, &["cannot read /no/such/file.ron"]);
    assert_eq!(
        std::fs::read_to_string(&truncated).unwrap(),
        text[..text.len() * 2 / 3],
        "checking never writes"
    );
}

#[test]
fn a_session_file_argument_is_validated_before_anything_opens() {
    let dir = scratch("open");
    let bad = dir.join("bad.ron");
    std::fs::write(
        &bad,
        "(format: \"elbowroom-session\", version: 1, session: (n: 40))",
    )
    .unwrap();
    let out = elbowroom(&[&bad.display().to_string()]);
    assert_refused(&out, &["n = 40 is out of range"]);
    let out = elbowroom(&["missing-session.ron"]);
    assert_refused(&out, &["cannot read missing-session.ron"]);
    // a command name is still a command
    let out = elbowroom(&["perm", "312", "--json"]);
    assert!(out.status.success());
}

fn decode_png(path: &Path) -> resvg::tiny_skia::Pixmap {
    resvg::tiny_skia::Pixmap::decode_png(&std::fs::read(path).unwrap()).unwrap()
}

#[test]
fn figure_dream_png_shows_every_pipe_in_its_colour() {
    use elbowroom::figure::palette::label_color;
    let dir = scratch("dream-png");
    let out = dir.join("d.png");
    let run = elbowroom(&[
        "figure",
        "dream",
        "31524",
        "--index",
        "2",
        "--scale",
        "2",
        "--out",
        &out.display().to_string(),
        "--json",
    ]);
    let v = stdout_json(&run);
    assert_eq!(v["count"], 1);
    let width = v["files"][0]["width"].as_f64().unwrap();
    let height = v["files"][0]["height"].as_f64().unwrap();
    let p = decode_png(&out);
    assert_eq!(p.width(), (width * 2.0).ceil() as u32);
    assert_eq!(p.height(), (height * 2.0).ceil() as u32);
    let n = 5;
    let present = (1..=n)
        .filter(|&k| {
            let c = label_color(k, n);
            p.pixels()
                .iter()
                .any(|px| px.red() == c.r && px.green() == c.g && px.blue() == c.b)
        })
        .count();
    assert_eq!(present, n, "each of the {n} pipes shows its label colour");
}

#[test]
fn figure_dream_svg_and_tikz_have_one_item_per_pipe() {
    let dir = scratch("dream-vector");
    let svg = dir.join("d.svg");
    let tex = dir.join("d.tex");
    for f in [&svg, &tex] {
        let out = elbowroom(&["figure", "dream", "1432", "--out", &f.display().to_string()]);
        assert!(
            out.status.success(),
            "{}",
            String::from_utf8_lossy(&out.stderr)
        );
    }
    let text = std::fs::read_to_string(&svg).unwrap();
    let doc = roxmltree::Document::parse(&text).unwrap();
    for k in 1..=4 {
        let class = format!("pipe pipe-{k}");
        let paths = doc
            .descendants()
            .filter(|e| e.has_tag_name("path") && e.attribute("class") == Some(class.as_str()))
            .count();
        assert_eq!(paths, 1, "pipe {k}");
    }
    let text = std::fs::read_to_string(&tex).unwrap();
    for k in 1..=4 {
        let draws = text
            .lines()
            .filter(|l| l.starts_with("\\draw") && l.ends_with(&format!("% pipe {k}")))
            .count();
        assert_eq!(draws, 1, "pipe {k}");
    }
}

#[test]
fn figure_all_writes_one_file_per_pipe_dream() {
    // S_1432 = x1^2 x2 + x1^2 x3 + x1 x2^2 + x1 x2 x3 + x2^2 x3 (Macdonald's table, from
    // memory): five monomials with coefficient 1, so five reduced pipe dreams
    let dir = scratch("dream-all");
    let v = stdout_json(&elbowroom(&[
        "figure",
        "dream",
        "1432",
        "--all",
        "--format",
        "svg",
        "--out",
        &dir.display().to_string(),
        "--json",
    ]));
    assert_eq!(v["count"], 5);
    let mut names: Vec<String> = std::fs::read_dir(&dir)
        .unwrap()
        .map(|e| e.unwrap().file_name().to_string_lossy().into_owned())
        .collect();
    names.sort();
    assert_eq!(
        names,
        (0..5)
            .map(|k| format!("dream-1432-{k:03}.svg"))
            .collect::<Vec<_>>()
    );
}

#[test]
fn figure_kinds_without_a_permutation() {
    let dir = scratch("other-kinds");
    let cases: [&[&str]; 5] = [
        &["figure", "permutohedron", "--lambda", "3,2,1,0"],
        &[
            "figure",
            "volume",
            "--from",
            "1,1,0,0",
            "--to",
            "3,2,1,0",
            "--samples",
            "6",
        ],
        &["figure", "paths", "1432"],
        &["figure", "paths", "--poly", "x1^2 + x2", "--n", "3"],
        &["figure", "wiring", "--word", "121"],
    ];
    for (i, args) in cases.iter().enumerate() {
        let out = dir.join(format!("f{i}.svg"));
        let mut all: Vec<&str> = args.to_vec();
        let o = out.display().to_string();
        all.extend(["--out", &o]);
        let run = elbowroom(&all);
        assert!(
            run.status.success(),
            "{args:?}: {}",
            String::from_utf8_lossy(&run.stderr)
        );
        let text = std::fs::read_to_string(&out).unwrap();
        assert!(roxmltree::Document::parse(&text).is_ok(), "{args:?}");
    }
}

#[test]
fn figure_refuses_bad_requests() {
    let dir = scratch("figure-bad").display().to_string();
    let f = format!("{dir}/f.svg");
    assert_refused(
        &elbowroom(&["figure", "dream", "1432", "--index", "5", "--out", &f]),
        &["--index 5 is out of range", "(5)"],
    );
    assert_refused(
        &elbowroom(&["figure", "dream", "1432", "--out", &format!("{dir}/f.pdf")]),
        &["end --out with .png, .svg or .tex"],
    );
    assert_refused(
        &elbowroom(&["figure", "dream", "1442", "--out", &f]),
        &["1442"],
    );
    assert_refused(
        &elbowroom(&["figure", "wiring", "--word", "11", "--out", &f]),
        &["not reduced"],
    );
    assert_refused(
        &elbowroom(&["figure", "permutohedron", "--out", &f]),
        &["needs --lambda"],
    );
    assert_refused(
        &elbowroom(&[
            "figure",
            "permutohedron",
            "--lambda",
            "6,5,4,3,2,1",
            "--out",
            &f,
        ]),
        &["n <= 5"],
    );
    assert_refused(
        &elbowroom(&["figure", "dream", "1432", "--scale", "0", "--out", &f]),
        &["scale"],
    );
    assert!(!Path::new(&f).exists(), "nothing written on refusal");
}
