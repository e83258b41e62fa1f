//! The explorer driven headlessly (egui_kittest, no display, no GPU): typing
//! permutations, refusing bad ones, stepping and moving pipe dreams, and
//! running and cancelling engine jobs.
#![cfg(feature = "gui")]
#![allow(clippy::unwrap_used)]

mod window_harness;
use eframe::egui;
use egui_kittest::Harness;
use egui_kittest::kittest::Queryable;
use elbowroom::figure::dream::{CELL, cell_origin};
use elbowroom::gui::Explorer;
use elbowroom::gui::views::dreams::DreamsView;
use elbowroom::math::Perm;
use elbowroom::math::pipes::dream::count_pipe_dreams;
use elbowroom::session::model::View;
use window_harness::{ViewOf, harness, has, settle, survey_of_s5};

fn type_and_go(h: &mut Harness<'static, Explorer>, text: &str) {
    h.state_mut().picker.text = text.to_string();
    h.step();
    h.get_by_label("go").click();
    h.step();
    h.step();
}

#[test]
fn a_typed_permutation_reaches_every_view() {
    let mut h = harness();
    settle(&mut h, |h| h.state().view::<DreamsView>().shown.is_some());
    type_and_go(&mut h, "code: 1,0,1");
    // the code (1,0,1) is that of 2143, embedded in S_5
    assert_eq!(h.state().session.current, vec![2, 1, 4, 3, 5]);
    settle(&mut h, |h| has(h, "Reduced pipe dreams of w = 21435"));
    // S_2143 = x1^2 + x1 x2 + x1 x3: three dreams (Macdonald's table for S_4)
    settle(&mut h, |h| has(h, "1 of 3"));
    h.get_by_label("Reduced words & wiring").click();
    settle(&mut h, |h| has(h, "Reduced words of w = 21435"));
    // s1 s3 = s3 s1: two reduced words
    settle(&mut h, |h| has(h, "2 reduced words"));
    // the quotient view reduces the reversed Schubert polynomial of the same w:
    // S_2143(x5, ..., x1) = x5^2 + x5 x4 + x5 x3, leading term first in lex order
    h.get_by_label("Quotient by J_n").click();
    settle(&mut h, |h| has(h, "f = x3 x5 + x4 x5 + x5^2"));
    type_and_go(&mut h, "word: 2 1 2");
    // S_321 = x1^2 x2 (Macdonald's table for S_3), reversed: x4 x5^2 in S_5
    settle(&mut h, |h| has(h, "f = x4 x5^2"));
    h.get_by_label("Reduced words & wiring").click();
    settle(&mut h, |h| has(h, "Reduced words of w = 32145"));
    assert!(has(&h, "w = 32145"));
}

#[test]
fn the_hessenberg_table_exports_as_csv_and_latex() {
    let mut h = harness();
    h.get_by_label("Hessenberg classes").click();
    h.step();
    h.state_mut().session.hessenberg.h = vec![2, 3, 4, 4];
    settle(&mut h, |h| has(h, "6 permutations of length 3"));
    let dir = std::env::temp_dir().join(format!("elbowroom-gui-table-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    for (file, expect) in [
        ("a.csv", "perm,length,value\n"),
        ("a.tex", "\\begin{tabular}"),
    ] {
        let path = dir.join(file);
        h.key_press_modifiers(egui::Modifiers::COMMAND, egui::Key::E);
        h.step();
        assert!(has(&h, "the table of a^h_w"));
        h.state_mut().files.path = path.display().to_string();
        h.step();
        h.get_by_label("export").click();
        settle(&mut h, |_| path.exists());
        let text = std::fs::read_to_string(&path).unwrap();
        assert!(text.contains(expect), "{text}");
        // h = (2,3,4,4): the six permutations of length 3 in S_4 (Mahonian numbers,
        // OEIS A008302), one row each
        let rows = text
            .lines()
            .filter(|l| l.contains("1,4,3,2") || l.contains("$1432$"))
            .count();
        assert_eq!(rows, 1, "{text}");
    }
    std::fs::remove_dir_all(&dir).ok();
}

#[test]
fn an_invalid_permutation_is_refused_and_nothing_changes() {
    let mut h = harness();
    let before = h.state().session.current.clone();
    type_and_go(&mut h, "1224");
    assert!(h.state().picker.error.is_some());
    assert!(has(&h, "invalid permutation"));
    assert_eq!(h.state().session.current, before);
    type_and_go(&mut h, "word: 0 1");
    assert!(h.state().picker.error.is_some());
    assert_eq!(h.state().session.current, before);
}

#[test]
fn the_arrow_keys_step_to_the_last_dream() {
    let mut h = harness();
    let w = Perm::from_one_line(&h.state().session.current).unwrap();
    let total: usize = count_pipe_dreams(&w).try_into().unwrap();
    settle(&mut h, |h| has(h, &format!("1 of {total}")));
    for _ in 1..total + 3 {
        h.key_press(egui::Key::ArrowRight);
        h.step();
    }
    assert!(has(&h, &format!("{total} of {total}")));
    assert_eq!(h.state().session.dreams.index, total - 1);
}

#[test]
fn clicking_a_cell_applies_a_ladder_move() {
    let mut h = harness();
    settle(&mut h, |h| h.state().view::<DreamsView>().shown.is_some());
    let dream = h.state().view::<DreamsView>().shown.unwrap();
    let w = dream.permutation();
    let (i, j) = dream
        .crosses()
        .into_iter()
        .find(|&(i, j)| dream.ladder_move_at(i, j).is_some())
        .unwrap();
    let expected = dream.ladder_move_at(i, j).unwrap();
    let (rect, scale) = h.state().view::<DreamsView>().canvas.unwrap();
    let o = cell_origin(i, j);
    // a corner of the cell, away from the pipes through its middle
    let pos = rect.min + egui::vec2((o.x + CELL * 0.12) * scale, (o.y + CELL * 0.12) * scale);
    h.hover_at(pos);
    h.step();
    for pressed in [true, false] {
        h.event(egui::Event::PointerButton {
            pos,
            button: egui::PointerButton::Primary,
            pressed,
            modifiers: egui::Modifiers::NONE,
        });
        h.step();
    }
    h.step();
    let shown = h.state().view::<DreamsView>().shown.unwrap();
    assert_ne!(shown, dream);
    assert_eq!(shown, expected);
    assert_eq!(shown.permutation(), w);
    assert!(h.state().view::<DreamsView>().click_note.is_some());
    // another permutation: the note about the click goes
    type_and_go(&mut h, "1432");
    settle(&mut h, |h| has(h, "1 of 5"));
    assert!(h.state().view::<DreamsView>().click_note.is_none());
}

#[test]
fn a_hessenberg_table_fills_in() {
    let mut h = harness();
    h.get_by_label("Hessenberg classes").click();
    h.step();
    assert_eq!(h.state().session.view, View::Hessenberg);
    // h = (2,3,4,5,5), |h| = 4: the 20 permutations of S_5 of length 4 (Mahonian numbers, OEIS A008302)
    settle(&mut h, |h| has(h, "20 permutations of length 4"));
    // the permutohedral variety: Σ_w a^h_w σ_{w0 w} with a_w = DS_5(S_w); the total is read from the table
    assert!(has(&h, "Σ a^h_w ="));
}

#[test]
fn cancelling_a_job_leaves_the_window_usable() {
    let mut h = harness();
    h.get_by_label("Hessenberg classes").click();
    h.step();
    // n = 11, |h| = 19 (1 073 227 rows): a table that takes seconds
    h.state_mut().session.hessenberg.h = vec![3, 4, 5, 6, 7, 8, 9, 10, 11, 11, 11];
    h.step();
    h.get_by_label("compute the table").click();
    settle(&mut h, |h| !h.state().engine.running().is_empty());
    h.get_all_by_label("cancel").next().unwrap().click();
    settle(&mut h, |h| has(h, "canceled"));
    assert!(
        h.state()
            .engine
            .running()
            .iter()
            .all(|r| r.progress.is_canceled())
    );
    // the window still answers: back to the pipe dreams of a new permutation
    h.get_by_label("Pipe dreams").click();
    type_and_go(&mut h, "1432");
    settle(&mut h, |h| has(h, "1 of 5"));
}

#[test]
fn ctrl_s_saves_back_to_the_sessions_file() {
    let mut h = harness();
    let dir = std::env::temp_dir().join(format!("elbowroom-gui-save-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    let path = dir.join("study.ron");
    // no file yet: Ctrl+S asks where, in the file window
    h.key_press_modifiers(egui::Modifiers::COMMAND, egui::Key::S);
    h.step();
    assert!(has(&h, "Save the session"));
    h.state_mut().files.path = path.display().to_string();
    h.step();
    h.get_by_label("save").click();
    settle(&mut h, |_| path.exists());
    // now the session has a file: change it, and Ctrl+S writes straight back
    type_and_go(&mut h, "2413");
    h.key_press_modifiers(egui::Modifiers::COMMAND, egui::Key::S);
    h.step();
    let saved = elbowroom::session::store::load(&path).unwrap();
    // a typed one-line permutation keeps its own n: 2413 is in S_4
    assert_eq!(saved.current, vec![2, 4, 1, 3]);
    assert_eq!(saved.n, 4);
    std::fs::remove_dir_all(&dir).ok();
}

#[test]
fn a_positivity_survey_runs_and_a_row_shows_its_normal_form() {
    let mut h = harness();
    // the demo explores S_5
    survey_of_s5(&mut h);
    // a click on the row of 12435 makes it current and shows its normal form:
    // S_12435 = S_{s3} = x1 + x2 + x3 (Macdonald's table), reversed in five
    // variables: x3 + x4 + x5 (the picker's list may show the same label, so the
    // survey's row, drawn after the left panel, is the last one)
    h.get_all_by_label("12435").last().unwrap().click();
    settle(&mut h, |h| has(h, "f = x3 + x4 + x5"));
    assert_eq!(h.state().session.current, vec![1, 2, 4, 3, 5]);
    assert!(
        !h.state().session.quotient.survey,
        "the survey's row was clicked"
    );
    // the view says where the permutation came from, and leads back
    assert!(has(&h, "picked from the survey of S_5"));
    h.get_by_label("back to the survey").click();
    h.step();
    assert!(h.state().session.quotient.survey);
}

#[test]
fn closing_with_unsaved_changes_asks_first() {
    let mut h = harness();
    h.step();
    // nothing changed: a close goes through without a question
    h.state_mut().close_asked = true;
    h.step();
    assert!(!h.state().closing.asking);
    assert!(h.query_by_label("close without saving").is_none());
    // a change to the exploration: the close is held back and the question shown
    h.state_mut().session.dark = !h.state().session.dark;
    h.state_mut().close_asked = true;
    h.step();
    h.step();
    assert!(h.state().closing.asking);
    assert!(h.state().closing.unsaved(&h.state().session));
    h.get_by_label("keep working").click();
    h.step();
    assert!(!h.state().closing.asking);
    // asked again, and this time closed without saving: no further question
    h.state_mut().close_asked = true;
    h.step();
    h.step();
    h.get_by_label("close without saving").click();
    h.step();
    assert!(!h.state().closing.asking);
    h.state_mut().close_asked = true;
    h.step();
    assert!(!h.state().closing.asking);
}

#[test]
fn a_session_saved_through_the_file_window_counts_as_saved() {
    let mut h = harness();
    h.step();
    let dir = std::env::temp_dir().join(format!("elbowroom-close-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    let path = dir.join("kept.ron");
    h.state_mut().session.dark = !h.state().session.dark;
    assert!(h.state().closing.unsaved(&h.state().session));
    // the same save the window's Ctrl+S does
    let session = h.state().session.clone();
    let mut message = None;
    h.state_mut().files.session_path = Some(path.clone());
    assert!(
        h.state_mut()
            .files
            .save_to_known_file(&session, &mut message)
    );
    h.step();
    assert!(
        !h.state().closing.unsaved(&h.state().session),
        "{message:?}"
    );
    h.state_mut().close_asked = true;
    h.step();
    assert!(!h.state().closing.asking);
    let _ = std::fs::remove_dir_all(&dir);
}

#[test]
fn an_export_is_named_after_its_table_and_asks_before_replacing_a_file() {
    let mut h = harness();
    h.get_by_label("Hessenberg classes").click();
    h.step();
    h.state_mut().session.hessenberg.h = vec![2, 3, 4, 4];
    settle(&mut h, |h| has(h, "6 permutations of length 3"));
    let dir = std::env::temp_dir().join(format!("elbowroom-gui-replace-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    h.state_mut().session.figure.last_dir = dir.display().to_string();
    h.key_press_modifiers(egui::Modifiers::COMMAND, egui::Key::E);
    h.step();
    h.step();
    // the proposal is the table's own name, not a name every view shares
    let proposed = h.state().files.path.clone();
    assert!(proposed.ends_with("table-of-a-h_w.csv"), "{proposed}");
    let path = dir.join("table-of-a-h_w.csv");
    std::fs::write(&path, "kept\n").unwrap();
    h.get_by_label("export").click();
    h.step();
    // the file exists: nothing is written until the user agrees
    assert!(h.state().files.replacing.is_some());
    assert!(has(&h, "exists already"));
    assert_eq!(std::fs::read_to_string(&path).unwrap(), "kept\n");
    h.get_by_label("replace it").click();
    settle(&mut h, |_| {
        std::fs::read_to_string(&path).is_ok_and(|t| {
            t.starts_with("# Schubert coefficients") && t.contains("\nperm,length,value\n")
        })
    });
    std::fs::remove_dir_all(&dir).ok();
}

#[test]
fn each_view_has_one_tab_and_a_click_on_it_shows_that_view() {
    let kinds: Vec<View> = elbowroom::gui::views::all()
        .iter()
        .map(|v| v.kind())
        .collect();
    let titles: Vec<&str> = elbowroom::gui::views::all()
        .iter()
        .map(|v| v.title())
        .collect();
    for k in 0..kinds.len() {
        assert!(!kinds[..k].contains(&kinds[k]), "{:?} twice", kinds[k]);
        assert!(!titles[..k].contains(&titles[k]), "{} twice", titles[k]);
    }
    let mut h = harness();
    for (kind, title) in kinds.iter().zip(&titles).rev() {
        h.get_by_label(title).click();
        h.step();
        h.step();
        assert_eq!(h.state().session.view, *kind, "after a click on {title}");
    }
}
