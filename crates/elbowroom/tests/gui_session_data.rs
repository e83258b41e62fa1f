//! The explorer and the data of a session file, driven headlessly
//! (egui_kittest, no display): what `session check` accepts the window opens
//! (a title with control characters reaches the window system escaped), a
//! refused file is explained in the window, the title marks unsaved changes,
//! and values the window cannot show are kept and saved back unchanged.
#![cfg(feature = "gui")]
#![allow(clippy::unwrap_used)]

mod window_harness;
use eframe::egui;
use egui_kittest::Harness;
use elbowroom::engine::Engine;
use elbowroom::gui::Explorer;
use elbowroom::session::{Session, store};
use std::path::{Path, PathBuf};
use window_harness::{harness, has, settle};

/// A fresh directory for one test's files.
fn scratch(name: &str) -> PathBuf {
    let dir = std::env::temp_dir().join(format!("elbowroom-data-{name}-{}", std::process::id()));
    let _ = std::fs::remove_dir_all(&dir);
    std::fs::create_dir_all(&dir).unwrap();
    dir
}

/// The text of the first demo session.
fn demo_text() -> String {
    let dir = elbowroom::session::demo::demo_dir();
    std::fs::read_to_string(dir.join(elbowroom::session::demo::DEFAULT_DEMO_NAME)).unwrap()
}

/// The explorer at 1280×800 on `session`.
fn harness_on(session: Session) -> Harness<'static, Explorer> {
    Harness::builder()
        .with_size(egui::vec2(1280.0, 800.0))
        .with_accessibility_check(false)
        .allow_missing_glyphs()
        .build_ui_state(
            |ui, app: &mut Explorer| app.show(ui),
            Explorer::new(session, Engine::quiet()),
        )
}

/// `text` written to `dir/name` and read back by the explorer's own reader
/// (the one `session check` and `elbowroom FILE` use).
fn through_the_reader(dir: &Path, name: &str, text: &str) -> Session {
    let path = dir.join(name);
    std::fs::write(&path, text).unwrap();
    store::load(&path).unwrap()
}

#[test]
fn a_title_with_a_nul_and_an_escape_opens_and_reaches_the_window_system_escaped() {
    let dir = scratch("nul-title");
    let text = demo_text();
    let start = text.find("title: \"").unwrap() + "title: \"".len();
    let end = start + text[start..].find('"').unwrap();
    let hostile = format!(
        "{}a\\u{{0}}b\\u{{1b}}[31mred\\nline{}",
        &text[..start],
        &text[end..]
    );
    let s = through_the_reader(&dir, "nul.ron", &hostile);
    assert_eq!(s.title, "a\0b\u{1b}[31mred\nline");
    let mut h = harness_on(s);
    h.step();
    h.step();
    let title = h.state().title_shown.clone();
    assert!(!title.chars().any(char::is_control), "{title:?}");
    assert!(title.contains("a\\u{0}b\\u{1b}[31mred\\nline"), "{title:?}");
}

#[test]
fn a_long_title_is_shown_in_the_title_bar_as_an_excerpt() {
    let s = Session {
        title: "x".repeat(5000),
        ..Session::default()
    };
    let title = elbowroom::gui::files::window_title(&s, false);
    assert!(title.chars().count() < 100, "{}", title.len());
    assert!(title.ends_with('…'));
}

#[test]
fn the_window_title_marks_unsaved_changes() {
    let mut h = harness();
    h.step();
    assert!(!h.state().title_shown.starts_with('•'));
    h.state_mut().session.notes.push_str("a thought");
    h.step();
    assert!(
        h.state().title_shown.starts_with("• elbowroom"),
        "{}",
        h.state().title_shown
    );
    let dir = scratch("unsaved-mark");
    h.state_mut().files.session_path = Some(dir.join("s.ron"));
    h.key_press_modifiers(egui::Modifiers::COMMAND, egui::Key::S);
    h.step();
    h.step();
    assert!(dir.join("s.ron").is_file());
    assert!(
        h.state().title_shown.starts_with("elbowroom"),
        "{}",
        h.state().title_shown
    );
}

#[test]
fn a_refused_session_file_is_explained_in_the_open_window() {
    let dir = scratch("refused");
    let bad = dir.join("damaged.ron");
    std::fs::write(
        &bad,
        "(format: \"elbowroom-session\", version: 1, session: (n: 40))",
    )
    .unwrap();
    let why = store::load(&bad).unwrap_err().to_string();
    assert!(why.contains("n = 40 is out of range"), "{why}");
    let mut h = harness();
    h.state_mut().show_refused(&bad, why.clone());
    h.step();
    h.step();
    assert!(has(&h, "Open a session"));
    assert!(has(&h, "n = 40 is out of range"));
    assert_eq!(h.state().files.path, bad.display().to_string());
    // a demo session picked from the same window opens
    settle(&mut h, |h| has(h, "01-seminar-pipe-dreams.ron"));
}
