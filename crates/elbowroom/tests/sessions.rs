//! Session files: every field survives a save and a load, the demo sessions
//! load, damaged, newer and impossible files are refused with a message that
//! says where and what, and an interrupted save leaves the old file intact.

#![allow(clippy::unwrap_used)]

use elbowroom::session::model::{
    BrowserPlace, DreamPlace, FigureSettings, HessenbergPlace, PermutohedronPlace, ProductsPlace,
    QuotientPlace, SortColumn, View, WordPlace, WorkbenchPlace,
};
use elbowroom::session::{Session, SessionError, demo, format, recent, recovery, store};
use proptest::prelude::*;
use std::fs;
use std::path::{Path, PathBuf};

/// A fresh empty directory under the target directory.
fn scratch(name: &str) -> PathBuf {
    let dir = Path::new(env!("CARGO_TARGET_TMPDIR")).join(format!("sessions-{name}"));
    let _ = fs::remove_dir_all(&dir);
    fs::create_dir_all(&dir).unwrap();
    dir
}

fn perm(n: usize) -> impl Strategy<Value = Vec<usize>> {
    Just((1..=n).collect::<Vec<usize>>()).prop_shuffle()
}

fn any_perm() -> impl Strategy<Value = Vec<usize>> {
    (1usize..=16).prop_flat_map(perm)
}

fn view() -> impl Strategy<Value = View> {
    prop_oneof![
        Just(View::Dreams),
        Just(View::Words),
        Just(View::Quotient),
        Just(View::Permutohedron),
        Just(View::Hessenberg),
        Just(View::Workbench),
        Just(View::Products),
    ]
}

/// A Hessenberg function of length n: weakly increasing with i <= h(i) <= n.
fn hessenberg(n: usize) -> impl Strategy<Value = Vec<usize>> {
    proptest::collection::vec(0usize..=16, n).prop_map(move |raw| {
        let mut h = Vec::with_capacity(n);
        let mut prev = 0;
        for (i, r) in raw.iter().enumerate() {
            let lo = (i + 1).max(prev);
            let v = lo + r % (n - lo + 1);
            h.push(v);
            prev = v;
        }
        h
    })
}

fn angle() -> impl Strategy<Value = f32> {
    -10.0f32..10.0
}

fn session() -> impl Strategy<Value = Session> {
    (1usize..=9).prop_flat_map(|n| {
        let history = proptest::collection::vec(any_perm(), 0..6);
        let core = (
            any::<String>(),
            any::<String>(),
            perm(n),
            history,
            any::<usize>(),
            proptest::collection::vec(any_perm(), 0..5),
            view(),
            any::<bool>(),
        );
        let places = (
            (
                proptest::option::of(0usize..40),
                proptest::option::of(0usize..40),
                // the class filter is stored by its key (validation refuses other names)
                proptest::option::of(prop_oneof![
                    Just("dominant".to_string()),
                    Just("grassmannian".to_string()),
                    Just("vexillary".to_string()),
                    Just("fully_commutative".to_string()),
                    Just("coxeter".to_string()),
                ]),
                any::<bool>(),
            ),
            (0usize..=1_000_000, any::<bool>(), 0usize..=1_000_000),
            (any::<bool>(), any::<String>(), any::<bool>()),
            (
                proptest::collection::vec("-?[0-9]{1,3}(/[1-9])?", 0..6),
                proptest::collection::vec("-?[0-9]{1,3}(/[1-9])?|", 0..4),
                proptest::collection::vec("-?[0-9]{1,3}(\\.[0-9]{1,2})?", 0..4),
                angle(),
                angle(),
            ),
            (
                // the Hessenberg view has its own n, independent of the session's
                prop_oneof![Just(Vec::new()), (1usize..=12).prop_flat_map(hessenberg)],
                prop_oneof![
                    Just(None),
                    Just(Some(SortColumn::Perm)),
                    Just(Some(SortColumn::Length)),
                    Just(Some(SortColumn::Value)),
                ],
                any::<bool>(),
            ),
            (any::<String>(), any::<bool>()),
            (0.05f32..64.0, any::<bool>(), any::<bool>(), any::<String>()),
        );
        (Just(n), core, places).prop_map(|(n, core, places)| {
            let (title, notes, current, history, pos, pins, view, dark) = core;
            let (b, d, q, s, h, w, f) = places;
            let history_pos = if history.is_empty() {
                0
            } else {
                pos % history.len()
            };
            Session {
                title,
                notes,
                n,
                current,
                history,
                history_pos,
                pins,
                view,
                dark,
                browser: BrowserPlace {
                    min_length: b.0.min(b.1),
                    max_length: b.1.max(b.0),
                    class: b.2,
                    by_length: b.3,
                },
                dreams: DreamPlace {
                    index: d.0,
                    bumpless: d.1,
                },
                words: WordPlace { index: d.2 },
                quotient: QuotientPlace {
                    use_typed: q.0,
                    typed: q.1.clone(),
                    survey: q.2,
                },
                solid: PermutohedronPlace {
                    lambda: s.0,
                    from: s.1,
                    to: s.2,
                    yaw: s.3,
                    pitch: s.4,
                },
                hessenberg: HessenbergPlace {
                    h: h.0,
                    sort_by: h.1,
                    descending: h.2,
                },
                workbench: WorkbenchPlace {
                    poly: w.0.clone(),
                    use_h: w.1,
                },
                products: ProductsPlace {
                    u: q.1.chars().take(20).collect(),
                    v: String::new(),
                    stable: w.1,
                    n: 1 + d.0 % 16,
                    poly: w.0,
                    poly_stable: q.0,
                    poly_n: 1 + d.2 % 16,
                },
                figure: FigureSettings {
                    scale: f.0,
                    transparent: f.1,
                    labels: f.2,
                    last_dir: f.3,
                },
            }
        })
    })
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(96))]

    /// Every field, including strings with quotes, line breaks and any Unicode,
    /// comes back as it was saved.
    #[test]
    fn every_field_survives_save_and_load(s in session()) {
        let text = format::encode(&s).unwrap();
        let back = store::load_str(&text, Path::new("generated.ron"));
        prop_assert_eq!(back.ok(), Some(s));
    }
}

#[test]
fn a_save_goes_through_the_file_system_and_keeps_a_backup() {
    let dir = scratch("save");
    let path = dir.join("study.ron");
    let first = Session {
        title: "first".into(),
        ..Session::default()
    };
    store::save(&path, &first).unwrap();
    assert_eq!(store::load(&path).unwrap(), first);
    assert!(
        !store::backup_path(&path).exists(),
        "no backup of a file that did not exist"
    );

    let mut second = first.clone();
    second.title = "second".into();
    second.notes = "a line\nand \"another\"".into();
    store::save(&path, &second).unwrap();
    assert_eq!(store::load(&path).unwrap(), second);
    assert_eq!(store::load(&store::backup_path(&path)).unwrap(), first);
    assert!(
        !store::temp_path(&path).exists(),
        "the temporary file is renamed away"
    );
}

#[test]
fn every_demo_session_loads() {
    let demos = demo::demo_paths();
    assert!(demos.len() >= 3, "sessions/ holds {} demos", demos.len());
    for path in &demos {
        let s = store::load(path);
        assert!(s.is_ok(), "{}: {:?}", path.display(), s.err());
        let s = s.unwrap();
        assert!(!s.notes.trim().is_empty(), "{} has notes", path.display());
    }
    assert_eq!(
        demos
            .first()
            .and_then(|p| p.file_name())
            .and_then(|n| n.to_str()),
        Some(demo::DEFAULT_DEMO_NAME),
        "the default demo sorts first"
    );
    assert_eq!(demo::default_demo().current, vec![1, 4, 3, 2]);
}

fn demo_text() -> String {
    fs::read_to_string(demo::demo_dir().join(demo::DEFAULT_DEMO_NAME)).unwrap()
}

fn message_of(text: &str) -> (String, SessionError) {
    let e = store::load_str(text, Path::new("study.ron")).unwrap_err();
    (e.to_string(), e)
}

/// The table's sort key is stored as the text it always was: `""` when not
/// chosen, `"perm"`, `"length"` or `"value"`; an unknown key is refused with
/// the keys accepted (the explorer and `session check` read it the same way).
#[test]
fn the_sort_key_is_stored_as_text() {
    let saved = format::encode(&Session::default()).unwrap();
    assert!(saved.contains("sort_by: \"\","), "{saved}");
    let text = demo_text();
    assert!(text.contains("sort_by: \"perm\""));
    for (key, read) in [
        ("", None),
        ("perm", Some(SortColumn::Perm)),
        ("length", Some(SortColumn::Length)),
        ("value", Some(SortColumn::Value)),
    ] {
        let edited = text.replacen("sort_by: \"perm\"", &format!("sort_by: {key:?}"), 1);
        let s = store::load_str(&edited, Path::new("study.ron")).unwrap();
        assert_eq!(s.hessenberg.sort_by, read, "{key:?}");
        let again = format::encode(&s).unwrap();
        let expected = read.map_or("", SortColumn::key);
        assert!(again.contains(&format!("sort_by: {expected:?}")), "{again}");
    }
    let edited = text.replacen("sort_by: \"perm\"", "sort_by: \"by-colour\"", 1);
    let (msg, e) = message_of(&edited);
    assert!(matches!(e, SessionError::Syntax { .. }), "{msg}");
    assert!(
        msg.contains("\"by-colour\" is not known; accepted: \"perm\", \"length\", \"value\""),
        "{msg}"
    );
}

#[test]
fn a_truncated_file_names_its_line_and_column() {
    let text = demo_text();
    let cut = &text[..text.len() / 2];
    let (msg, e) = message_of(cut);
    assert!(matches!(e, SessionError::Syntax { .. }), "{msg}");
    assert!(msg.contains("truncated"), "{msg}");
    let cut_lines = cut.lines().count();
    let SessionError::Syntax { line, column, .. } = e else {
        unreachable!()
    };
    assert!(line >= 2 && line <= cut_lines, "line {line} of {cut_lines}");
    assert!(column >= 1);
    assert!(
        msg.starts_with(&format!("study.ron:{line}:{column}: ")),
        "{msg}"
    );
}

#[test]
fn a_field_of_the_wrong_type_is_named_with_its_position() {
    let text = demo_text().replacen("n: 4,", "n: \"four\",", 1);
    let line = text
        .lines()
        .position(|l| l.contains("n: \"four\""))
        .unwrap()
        + 1;
    let (msg, _) = message_of(&text);
    assert!(msg.starts_with(&format!("study.ron:{line}:")), "{msg}");
    assert!(msg.contains("expected integer"), "{msg}");
    assert!(msg.contains("field `n`"), "{msg}");
}

#[test]
fn a_newer_version_is_refused_with_both_versions() {
    // a later format may change the body entirely; only the header is read
    let text =
        "(format: \"elbowroom-session\", version: 3, session: (cells: {\"a\": [1.5, (x: 2)]}))";
    let (msg, e) = message_of(text);
    assert!(matches!(
        e,
        SessionError::NewerVersion {
            found: 3,
            supported: 1,
            ..
        }
    ));
    assert!(
        msg.contains("written by a newer elbowroom: format version 3, this build reads up to 1"),
        "{msg}"
    );
}

#[test]
fn other_files_are_not_taken_for_sessions() {
    let (msg, _) = message_of("(title: \"x\", n: 3)");
    assert!(msg.contains("is not an elbowroom session"), "{msg}");
    let (msg, _) = message_of("(format: \"something-else\", version: 1)");
    assert!(msg.contains("\"something-else\""), "{msg}");
    // a file that is not RON at all: the message says what a session looks like
    let (msg, _) = message_of("garbage(");
    assert!(
        msg.contains(":1:1:") && msg.contains("an elbowroom session `(format:"),
        "{msg}"
    );
}

#[test]
fn impossible_sessions_say_which_field_is_wrong() {
    let cases = [
        (
            "current: [1, 4, 3, 2]",
            "current: [1, 4, 4, 2]",
            "not a permutation",
        ),
        (
            "current: [1, 4, 3, 2]",
            "current: [1, 3, 2]",
            "has 3 entries but n = 4",
        ),
        ("n: 4,", "n: 17,", "1 <= n <= 16"),
        ("h: []", "h: [2, 1, 3, 4]", "h(2) = 1"),
        ("history_pos: 2", "history_pos: 7", "history_pos = 7"),
        ("pins: [[1, 4, 3, 2]", "pins: [[1, 5, 3, 2]", "pins[0]"),
    ];
    let text = demo_text();
    for (from, to, expected) in cases {
        assert!(text.contains(from), "{from}");
        let (msg, e) = message_of(&text.replacen(from, to, 1));
        assert!(matches!(e, SessionError::Invalid { .. }), "{msg}");
        assert!(msg.contains(expected), "{to}: {msg}");
    }
}

#[test]
fn loading_a_bad_file_never_changes_it() {
    let dir = scratch("bad");
    let path = dir.join("broken.ron");
    let text = "(format: \"elbowroom-session\", version: 1, session: (n: 4, current: [1,";
    fs::write(&path, text).unwrap();
    assert!(store::load(&path).is_err());
    assert_eq!(fs::read_to_string(&path).unwrap(), text);
    assert_eq!(
        fs::read_dir(&dir).unwrap().count(),
        1,
        "nothing else was written"
    );
}

#[test]
fn a_missing_file_is_a_read_error() {
    let e = store::load(Path::new("/nonexistent/dir/x.ron")).unwrap_err();
    assert!(
        e.to_string()
            .starts_with("cannot read /nonexistent/dir/x.ron"),
        "{e}"
    );
}

#[test]
fn a_save_interrupted_before_the_rename_leaves_the_old_file() {
    let dir = scratch("interrupted");
    let path = dir.join("study.ron");
    let old = demo::default_demo();
    store::save(&path, &old).unwrap();
    let before = fs::read(&path).unwrap();

    let mut new = old.clone();
    new.title = "half saved".into();
    let temp = store::save_stopping_before_rename(&path, &new).unwrap();
    assert!(temp.exists(), "the crash left the temporary file");
    assert_eq!(
        fs::read(&path).unwrap(),
        before,
        "the old file is byte for byte intact"
    );
    assert_eq!(store::load(&path).unwrap(), old);

    // the next save succeeds; it writes through a temporary file of its own
    // (unique names), so the crash's leftover is neither read nor overwritten
    store::save(&path, &new).unwrap();
    assert_eq!(store::load(&path).unwrap(), new);
    assert!(temp.exists());
    fs::remove_file(&temp).unwrap();
}

#[cfg(unix)]
#[test]
fn an_unwritable_directory_gives_a_clear_error_and_keeps_the_old_file() {
    use std::os::unix::fs::PermissionsExt;
    let dir = scratch("readonly");
    let path = dir.join("study.ron");
    let old = Session::default();
    store::save(&path, &old).unwrap();
    fs::set_permissions(&dir, fs::Permissions::from_mode(0o555)).unwrap();
    let probe = dir.join("probe");
    if fs::write(&probe, b"x").is_ok() {
        // running as root: permissions do not stop writes; use a path under a file instead
        let _ = fs::remove_file(&probe);
        fs::set_permissions(&dir, fs::Permissions::from_mode(0o755)).unwrap();
        let under_file = path.join("inside.ron");
        let e = store::save(&under_file, &old).unwrap_err();
        assert!(matches!(e, SessionError::Write { .. }));
        assert!(
            e.to_string()
                .starts_with(&format!("cannot save {}: ", under_file.display())),
            "{e}"
        );
    } else {
        let mut new = old.clone();
        new.title = "new".into();
        let e = store::save(&path, &new).unwrap_err();
        fs::set_permissions(&dir, fs::Permissions::from_mode(0o755)).unwrap();
        assert!(matches!(e, SessionError::Write { .. }));
        assert!(e.to_string().contains("ermission denied"), "{e}");
    }
    assert_eq!(store::load(&path).unwrap(), old);
}

#[test]
fn an_impossible_session_is_not_saved() {
    let dir = scratch("invalid-save");
    let path = dir.join("x.ron");
    let s = Session {
        current: vec![1, 1, 2, 3],
        ..Session::default()
    };
    let e = store::save(&path, &s).unwrap_err();
    assert!(e.to_string().contains("not a permutation"), "{e}");
    assert!(!path.exists());
}

#[test]
fn recovery_is_taken_once_and_kept_aside() {
    let dir = scratch("recovery");
    assert!(recovery::take_recovery_in(&dir).is_none());
    let s = Session {
        notes: "unsaved thoughts".into(),
        ..Session::default()
    };
    recovery::write_recovery_in(&dir, &s).unwrap();
    assert_eq!(recovery::take_recovery_in(&dir), Some(s));
    assert!(
        recovery::take_recovery_in(&dir).is_none(),
        "taken only once"
    );
    assert!(
        dir.join("recovery-taken.ron").is_file(),
        "moved aside, not deleted"
    );
    recovery::write_recovery_in(&dir, &Session::default()).unwrap();
    recovery::clear_recovery_in(&dir);
    assert!(recovery::take_recovery_in(&dir).is_none());
}

#[test]
fn recent_sessions_are_most_recent_first_without_repeats() {
    let dir = scratch("recent");
    let files: Vec<PathBuf> = (0..3).map(|i| dir.join(format!("s{i}.ron"))).collect();
    for f in &files {
        store::save(f, &Session::default()).unwrap();
    }
    let config = dir.join("config");
    for f in &files {
        recent::push_in(&config, f).unwrap();
    }
    recent::push_in(&config, &files[0]).unwrap();
    let list = recent::load_in(&config);
    let names: Vec<String> = list
        .iter()
        .map(|p| p.file_name().unwrap().to_string_lossy().into_owned())
        .collect();
    assert_eq!(names, ["s0.ron", "s2.ron", "s1.ron"]);
    fs::remove_file(&files[2]).unwrap();
    assert_eq!(
        recent::load_in(&config).len(),
        2,
        "missing files are dropped"
    );
}

#[test]
fn a_recent_list_in_the_old_configuration_directory_is_still_found_and_carried_over() {
    let dir = scratch("recent-legacy");
    let files: Vec<PathBuf> = (0..2).map(|i| dir.join(format!("t{i}.ron"))).collect();
    for f in &files {
        store::save(f, &Session::default()).unwrap();
    }
    let (old, new) = (dir.join("old"), dir.join("new"));
    recent::push_in(&old, &files[0]).unwrap();
    assert_eq!(recent::load_or_legacy_in(&new, Some(&old)).len(), 1);
    recent::push_or_legacy_in(&new, Some(&old), &files[1]).unwrap();
    let names: Vec<String> = recent::load_in(&new)
        .iter()
        .map(|p| p.file_name().unwrap().to_string_lossy().into_owned())
        .collect();
    assert_eq!(
        names,
        ["t1.ron", "t0.ron"],
        "the old list moved to the new place"
    );
    // once the new place has a list, the old one is no longer read
    fs::remove_file(&files[1]).unwrap();
    recent::push_in(&old, &files[0]).unwrap();
    assert_eq!(recent::load_or_legacy_in(&new, Some(&old)).len(), 1);
}

#[test]
fn the_autosave_is_state_not_configuration() {
    let state = recovery::recovery_path().unwrap();
    let config = elbowroom::session::config_dir::config_dir().unwrap();
    assert!(!state.starts_with(&config), "{state:?} under {config:?}");
    if cfg!(target_os = "linux") {
        assert!(
            state.to_string_lossy().contains("state"),
            "the XDG state directory on Linux: {state:?}"
        );
    }
}

#[test]
fn the_hessenberg_view_may_use_another_n_than_the_permutation() {
    // the demo explores S_4 while the Hessenberg view looks at n = 8
    let text = demo_text().replacen("h: []", "h: [2, 3, 4, 5, 6, 7, 8, 8]", 1);
    let dir = scratch("other-n");
    let path = dir.join("s.ron");
    std::fs::write(&path, &text).unwrap();
    let s = store::load(&path).unwrap();
    assert_eq!(s.n, 4);
    assert_eq!(s.hessenberg.h.len(), 8);
    store::save(&path, &s).unwrap();
    assert_eq!(store::load(&path).unwrap(), s);
}
