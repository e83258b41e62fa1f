//! The explorer's files, driven headlessly (egui_kittest, no display): an
//! exported table says what it is and keeps the order on screen, an exported
//! figure leaves out the canvas's marks unless asked, the Hessenberg view
//! exports the staircase of h, the notes are edited and saved with the
//! session, and a new exploration starts untitled.
#![cfg(feature = "gui")]
#![allow(clippy::unwrap_used)]

mod window_harness;
use eframe::egui;
use egui::accesskit::Role;
use egui_kittest::Harness;
use egui_kittest::kittest::Queryable;
use elbowroom::gui::Explorer;
use elbowroom::gui::views::dreams::DreamsView;
use std::path::{Path, PathBuf};
use window_harness::{ViewOf, harness, has, settle, survey_of_s5};

/// A fresh directory for one test's files.
fn scratch(name: &str) -> PathBuf {
    let dir = std::env::temp_dir().join(format!("elbowroom-files-{name}-{}", std::process::id()));
    let _ = std::fs::remove_dir_all(&dir);
    std::fs::create_dir_all(&dir).unwrap();
    dir
}

/// Opens the export window, picks the item named `item`, and exports it to `path`.
fn export_to(h: &mut Harness<'static, Explorer>, item: &str, path: &Path) {
    h.key_press_modifiers(egui::Modifiers::COMMAND, egui::Key::E);
    h.step();
    h.step();
    h.get_by_label(item).click();
    h.step();
    h.state_mut().files.path = path.display().to_string();
    h.step();
    h.get_by_label("export").click();
    settle(h, |_| path.exists());
}

/// The data rows of an exported CSV: the lines after the `#` lines and the header.
fn csv_rows(text: &str) -> Vec<Vec<String>> {
    text.lines()
        .filter(|l| !l.starts_with("# "))
        .skip(1)
        .map(|l| {
            // perm is quoted ("1,4,3,2"), length and value are plain
            let (perm, rest) = l.trim_start_matches('"').split_once("\",").unwrap();
            let mut v = vec![perm.replace(',', "")];
            v.extend(rest.split(',').map(str::to_string));
            v
        })
        .collect()
}

#[test]
fn an_exported_hessenberg_table_names_n_and_h_and_keeps_the_order_on_screen() {
    let mut h = harness();
    h.get_by_label("Hessenberg classes").click();
    h.step();
    h.state_mut().session.hessenberg.h = vec![2, 3, 4, 4];
    settle(&mut h, |h| has(h, "6 permutations of length 3"));
    // a click on the a^h_w header sorts by it, largest first
    h.get_by_label("a^h_w").click();
    settle(&mut h, |h| has(h, "a^h_w (desc)"));
    settle(&mut h, |h| has(h, "6 permutations of length 3"));
    let dir = scratch("hessenberg");
    let path = dir.join("sorted.csv");
    export_to(&mut h, "the table of a^h_w", &path);
    let text = std::fs::read_to_string(&path).unwrap();
    let first = text.lines().next().unwrap();
    assert!(first.starts_with("# Schubert coefficients a^h_w"), "{text}");
    assert!(first.contains("n = 4"), "{text}");
    assert!(first.contains("h = (2,3,4,4)"), "{text}");
    assert!(first.contains("largest first"), "{text}");
    assert!(first.contains("6 rows"), "{text}");
    assert!(text.contains("\nperm,length,value\n"), "{text}");
    let rows = csv_rows(&text);
    assert_eq!(rows.len(), 6, "{text}");
    // h(i) = i + 1: a_w = DS_4(S_w) = (1/3!) Σ_{a in R(w)} A_{content(a)} (Nadeau–Tewari,
    // from memory, as in tests/hessenberg_classes.rs), with A_{(1,1,1)} = (n-1)! = 6
    // (Postnikov, IMRN 2009, mixed Eulerian numbers, from memory). 2413 has the reduced
    // words 132, 312 and 3142 has 213, 231, all of content (1,1,1): a = 12/6 = 2;
    // 2341 (word 123) and 4123 (word 321): a = 6/6 = 1.
    let value = |w: &str| rows.iter().find(|r| r[0] == w).map(|r| r[2].clone());
    assert_eq!(value("2413").as_deref(), Some("2"));
    assert_eq!(value("3142").as_deref(), Some("2"));
    assert_eq!(value("2341").as_deref(), Some("1"));
    assert_eq!(value("4123").as_deref(), Some("1"));
    // the order on screen: largest first, the whole order reversed (ties reverse-lexicographic)
    let order: Vec<&str> = rows.iter().map(|r| r[0].as_str()).collect();
    assert_eq!(order[..2], ["3142", "2413"], "{text}");
    assert!(
        rows.windows(2)
            .all(|p| p[0][2].parse::<i64>().unwrap() >= p[1][2].parse::<i64>().unwrap()),
        "{text}"
    );
    // the same order as the rows on the screen, top to bottom
    let shown: Vec<f32> = order
        .iter()
        .map(|w| h.get_all_by_label(w).last().unwrap().rect().min.y)
        .collect();
    assert!(shown.windows(2).all(|p| p[0] < p[1]), "{shown:?}");
    std::fs::remove_dir_all(&dir).ok();
}

#[test]
fn a_latex_export_of_the_default_h_of_s3_says_what_it_is_before_the_tabular() {
    let mut h = harness();
    h.get_by_label("Hessenberg classes").click();
    h.step();
    h.state_mut().session.hessenberg.h = vec![2, 3, 3];
    settle(&mut h, |h| has(h, "2 permutations of length 2"));
    // a second click on w turns its order round: lexicographically last first
    h.get_by_label("w (asc)").click();
    settle(&mut h, |h| has(h, "w (desc)"));
    let dir = scratch("latex");
    let path = dir.join("s3.tex");
    export_to(&mut h, "the table of a^h_w", &path);
    let text = std::fs::read_to_string(&path).unwrap();
    let (preamble, tabular) = text.split_once("\\begin{tabular}").unwrap();
    assert!(preamble.lines().all(|l| l.starts_with("% ")), "{text}");
    assert!(preamble.contains("n = 3, h = (2,3,3)"), "{text}");
    assert!(preamble.contains("lexicographically last first"), "{text}");
    // h = (2,3,3): a^h_231 = DS_3(x1 x2) = 1 and a^h_312 = DS_3(x1^2) = 1 (the worked
    // example of tables::results::hessenberg_table), listed 312 before 231
    let at_312 = tabular.find("$312$ & $2$ & $1$").unwrap();
    let at_231 = tabular.find("$231$ & $2$ & $1$").unwrap();
    assert!(at_312 < at_231, "{text}");
    std::fs::remove_dir_all(&dir).ok();
}

#[test]
fn an_exported_survey_lists_its_rows_under_a_caption() {
    let mut h = harness();
    survey_of_s5(&mut h);
    let dir = scratch("survey");
    let path = dir.join("survey.csv");
    export_to(&mut h, "the positivity survey of S_5", &path);
    let text = std::fs::read_to_string(&path).unwrap();
    let first = text.lines().next().unwrap();
    assert!(first.starts_with("# Positivity survey in S_5"), "{text}");
    assert!(first.contains("all 120 permutations"), "{text}");
    // 5! = 120 rows, lexicographic (no counterexample to put first, as the window says)
    let rows: Vec<&str> = text
        .lines()
        .filter(|l| !l.starts_with("# "))
        .skip(1)
        .collect();
    assert_eq!(rows.len(), 120);
    assert!(rows[0].starts_with("\"1,2,3,4,5\""), "{text}");
    assert!(rows[119].starts_with("\"5,4,3,2,1\""), "{text}");
    std::fs::remove_dir_all(&dir).ok();
}

#[test]
fn a_pipe_dream_exports_without_its_move_dots_unless_asked() {
    let mut h = harness();
    settle(&mut h, |h| h.state().view::<DreamsView>().shown.is_some());
    let dream = h.state().view::<DreamsView>().shown.unwrap();
    // the cells where a ladder or chute move starts, each drawn as one dot
    let mut dots: Vec<(usize, usize)> = dream
        .available_moves()
        .iter()
        .filter(|m| {
            matches!(
                m.kind,
                elbowroom::math::pipes::moves::MoveKind::Ladder
                    | elbowroom::math::pipes::moves::MoveKind::Chute
            )
        })
        .map(|m| m.from)
        .collect();
    dots.dedup();
    assert!(
        !dots.is_empty(),
        "the bottom dream of 15432 has a ladder move"
    );
    let dir = scratch("dream");
    let clean = dir.join("clean.svg");
    // the export is named after the dream: its place in the list and w
    // (15432 has 14 reduced pipe dreams)
    export_to(&mut h, "the pipe dream 1 of 14 of w = 15432", &clean);
    assert!(h.state().files.path.ends_with("clean.svg"));
    let text = std::fs::read_to_string(&clean).unwrap();
    // a reduced pipe dream is drawn with paths and labels only; the dots are circles
    assert_eq!(text.matches("<circle").count(), 0, "{text}");
    assert!(text.contains("<path"));
    let marked = dir.join("marked.svg");
    h.key_press_modifiers(egui::Modifiers::COMMAND, egui::Key::E);
    h.step();
    h.step();
    h.get_by_label("include the on-screen marks (move dots, the lit pipe)")
        .click();
    h.step();
    assert!(h.state().files.include_marks);
    h.state_mut().files.path = marked.display().to_string();
    h.step();
    h.get_by_label("export").click();
    settle(&mut h, |_| marked.exists());
    let text = std::fs::read_to_string(&marked).unwrap();
    assert_eq!(text.matches("<circle").count(), dots.len(), "{text}");
    std::fs::remove_dir_all(&dir).ok();
}

#[test]
fn the_hessenberg_view_exports_the_staircase_of_h() {
    let mut h = harness();
    h.get_by_label("Hessenberg classes").click();
    h.step();
    h.state_mut().session.hessenberg.h = vec![3, 3, 4, 4];
    settle(&mut h, |h| has(h, "the staircase of h"));
    let dir = scratch("staircase");
    let path = dir.join("staircase.svg");
    export_to(&mut h, "the staircase of h = (3,3,4,4)", &path);
    let text = std::fs::read_to_string(&path).unwrap();
    // n² = 16 boxes and the bounding path are paths; the n = 4 diagonal dots are circles
    assert_eq!(text.matches("<circle").count(), 4, "{text}");
    assert_eq!(text.matches("<path").count(), 17, "{text}");
    std::fs::remove_dir_all(&dir).ok();
}

#[test]
fn a_note_typed_in_the_panel_is_saved_and_opened_again() {
    let mut h = harness();
    h.step();
    assert!(!h.state().closing.unsaved(&h.state().session));
    h.get_by_label("notes").click();
    h.step();
    assert!(h.state().notes.open);
    let before = h.state().session.notes.clone();
    let notes = h.get_by_role(Role::MultilineTextInput);
    notes.click();
    h.step();
    h.get_by_role(Role::MultilineTextInput)
        .type_text("S_15432 has 14 pipe dreams");
    h.step();
    h.step();
    let typed = h.state().session.notes.clone();
    assert!(typed.contains("S_15432 has 14 pipe dreams"), "{typed:?}");
    assert_ne!(typed, before);
    // a note is a change: the close guard would ask
    assert!(h.state().closing.unsaved(&h.state().session));
    let dir = scratch("notes");
    let path = dir.join("with-notes.ron");
    h.key_press_modifiers(
        egui::Modifiers::COMMAND | egui::Modifiers::SHIFT,
        egui::Key::S,
    );
    h.step();
    h.state_mut().files.path = path.display().to_string();
    h.step();
    h.get_by_label("save").click();
    settle(&mut h, |_| path.exists());
    h.step();
    assert!(!h.state().closing.unsaved(&h.state().session));
    // a second window opens the file: the note is there
    let mut other = harness();
    other.key_press_modifiers(egui::Modifiers::COMMAND, egui::Key::O);
    other.step();
    other.state_mut().files.path = path.display().to_string();
    other.step();
    // the window's button (the status line has one of the same name, drawn first)
    other.get_all_by_label("open").last().unwrap().click();
    other.step();
    assert_eq!(other.state().session.notes, typed);
    std::fs::remove_dir_all(&dir).ok();
}

#[test]
fn notes_past_the_editing_limit_are_kept_whole_and_shown_in_part() {
    // notes longer than the panel edits (as a file may hold) are never shortened
    let limit = elbowroom::math::limits::NOTES_TEXT_LIMIT;
    let mut h = harness();
    let long = "x".repeat(limit + 10);
    h.state_mut().session.notes = long.clone();
    h.state_mut().notes.open = true;
    h.run();
    assert_eq!(h.state().session.notes, long);
    assert!(has(
        &h,
        &format!("these notes have {} characters", limit + 10)
    ));
    assert!(h.query_by_role(Role::MultilineTextInput).is_none());
}

#[test]
fn a_new_exploration_has_its_own_title_and_no_notes_or_pins() {
    let mut h = harness();
    h.step();
    // the fixture is a demo: a title, pins and a history of its own
    assert_eq!(h.state().session.title, "pipe dreams in S_5");
    assert!(!h.state().session.pins.is_empty());
    h.state_mut().session.notes = "demo notes".into();
    h.key_press_modifiers(egui::Modifiers::COMMAND, egui::Key::O);
    h.step();
    h.get_by_label("start a new exploration").click();
    h.step();
    h.step();
    // the notes were changed and are in no file: asked first
    assert!(has(&h, "changes that are not in a session file"));
    assert_eq!(h.state().session.title, "pipe dreams in S_5");
    h.get_by_label("start the new one anyway").click();
    h.step();
    h.step();
    let s = &h.state().session;
    assert_eq!(s.title, "untitled exploration");
    assert!(s.notes.is_empty());
    assert!(s.pins.is_empty());
    assert_eq!(s.history, vec![s.current.clone()]);
    assert!(h.state().files.session_path.is_none());
    // nothing new to save yet: closing does not ask
    assert!(!h.state().closing.unsaved(&h.state().session));
}

#[test]
fn a_wiring_diagram_exports_without_the_lit_crossing_unless_asked() {
    let mut h = harness();
    h.get_by_label("Reduced words & wiring").click();
    // 15432 = w0 of {2, ..., 5}: 16 reduced words (Stanley 1984, the staircase of size 4,
    // OEIS A005118), each of length 6
    settle(&mut h, |h| has(h, "16 reduced words"));
    settle(&mut h, |h| {
        h.query_all_by_label_contains("braid ").next().is_some()
    });
    // hovering a move's button lights the crossing where it starts
    h.query_all_by_label_contains("braid ")
        .next()
        .unwrap()
        .hover();
    h.step();
    h.step();
    let dir = scratch("wiring");
    let clean = dir.join("clean.svg");
    export_to(&mut h, "the wiring diagram of word 1 of w = 15432", &clean);
    let text = std::fs::read_to_string(&clean).unwrap();
    // one marker per letter of the word, none emphasised
    assert_eq!(text.matches("<circle").count(), 6, "{text}");
    assert!(!text.contains("fill-opacity"), "{text}");
    let marked = dir.join("marked.svg");
    h.key_press_modifiers(egui::Modifiers::COMMAND, egui::Key::E);
    h.step();
    h.step();
    h.get_by_label("include the on-screen marks (the lit crossing)")
        .click();
    h.step();
    h.state_mut().files.path = marked.display().to_string();
    h.step();
    h.get_by_label("export").click();
    settle(&mut h, |_| marked.exists());
    let text = std::fs::read_to_string(&marked).unwrap();
    // the lit crossing gets a faint halo under it, as on the canvas
    assert_eq!(text.matches("<circle").count(), 7, "{text}");
    assert_eq!(text.matches("fill-opacity").count(), 1, "{text}");
    std::fs::remove_dir_all(&dir).ok();
}

/// The words view's panel "a_w from the words of w" exports as a table figure,
/// in each figure format: for w = 1432 the rows (0,2,1) and (0,1,2) with
/// N_w(c) = 1, A_021 = 4, A_012 = 2 and the sum 6/3! = 1 (Nadeau–Tewari, IMRN
/// 2023, the worked example of the reduced-word formula).
#[test]
fn the_panel_of_a_w_exports_as_a_table_figure() {
    let mut h = harness();
    h.state_mut().session.n = 4;
    h.state_mut().session.current = vec![1, 4, 3, 2];
    h.step();
    h.get_by_label("Reduced words & wiring").click();
    settle(&mut h, |h| has(h, "sum 6/3! = 1"));
    let dir = scratch("panel");
    let item = "the reduced-word formula for a_1432 as a figure";
    let svg = dir.join("a1432.svg");
    export_to(&mut h, item, &svg);
    let text = std::fs::read_to_string(&svg).unwrap();
    for cell in [
        "(0,2,1)",
        "(0,1,2)",
        "content c",
        "share",
        "sum 6/3! = 1 = a",
    ] {
        assert!(text.contains(cell), "{cell}: {text}");
    }
    // A_021 = 4 and A_012 = 2 in the A_c column, set flush right
    assert!(text.contains(">4<") && text.contains(">2<"), "{text}");
    let tex = dir.join("a1432.tex");
    export_to(&mut h, item, &tex);
    let text = std::fs::read_to_string(&tex).unwrap();
    assert!(
        text.starts_with("\\documentclass[tikz]{standalone}"),
        "{text}"
    );
    assert!(
        text.contains("(0,2,1)") && text.contains("(0,1,2)"),
        "{text}"
    );
    let png = dir.join("a1432.png");
    export_to(&mut h, item, &png);
    let bytes = std::fs::read(&png).unwrap();
    assert!(bytes.starts_with(b"\x89PNG"));
    std::fs::remove_dir_all(&dir).ok();
}
