//! The explorer's typeset mathematics and its reach, driven headlessly
//! (egui_kittest): a typeset result copies as plain text, a half-typed λ
//! never stops a save, and every tab stays reachable when the window is zoomed.
#![cfg(feature = "gui")]
#![allow(clippy::unwrap_used)]

mod window_harness;
use eframe::egui;
use egui_kittest::kittest::Queryable;
use elbowroom::gui::app::demo_session;
use elbowroom::gui::views::permutohedra::PermutohedronView;
use elbowroom::gui::{Explorer, views};
use elbowroom::session::model::View;
use window_harness::{ViewOf, harness, has, settle};

/// The text the last frame put on the clipboard, if any.
fn copied(h: &egui_kittest::Harness<'static, Explorer>) -> Option<String> {
    h.output()
        .platform_output
        .commands
        .iter()
        .find_map(|c| match c {
            egui::OutputCommand::CopyText(t) => Some(t.clone()),
            _ => None,
        })
}

#[test]
fn the_workbench_result_is_typeset_and_copies_as_plain_text() {
    let mut h = harness();
    h.state_mut().session.workbench.poly = "x2^2*x3".into();
    h.get_by_label("Polynomial workbench").click();
    // the line is named by its plain notation, drawn with x₂²x₃ set in scripts
    settle(&mut h, |h| has(h, "f = x2^2 x3"));
    // DS_n(x2^2 x3) with n = 5 is 0 (degree 3 < n - 1 = 4: Postnikov 2009, Prop. 3.1, from memory)
    settle(&mut h, |h| has(h, "DS_n(f) = 0"));
    let copy = h.get_all_by_label("copy").next().unwrap();
    copy.click();
    h.step();
    assert_eq!(copied(&h).as_deref(), Some("x2^2 x3"));
}

#[test]
fn a_half_typed_lambda_does_not_stop_a_save() {
    let mut h = harness();
    h.get_by_label("Permutohedra").click();
    h.step();
    h.step();
    let before = h.state().session.solid.lambda.clone();
    assert_eq!(before, ["3", "2", "1", "0"]);
    h.state_mut()
        .view_mut::<PermutohedronView>()
        .lambda_typing
        .shown[0] = "1/".into();
    h.step();
    // the half-typed text stays on screen, the session keeps the last λ read
    assert_eq!(
        h.state().view::<PermutohedronView>().lambda_typing.shown[0],
        "1/"
    );
    assert_eq!(h.state().session.solid.lambda, before);
    let dir = std::env::temp_dir().join(format!("elbowroom-gui-lambda-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    let path = dir.join("half typed.ron");
    h.key_press_modifiers(egui::Modifiers::COMMAND, egui::Key::S);
    h.step();
    h.state_mut().files.path = path.display().to_string();
    h.step();
    h.get_by_label("save").click();
    settle(&mut h, |_| path.exists());
    let saved = elbowroom::session::store::load(&path).unwrap();
    assert_eq!(saved.solid.lambda, before);
    assert_eq!(
        h.state().view::<PermutohedronView>().lambda_typing.shown[0],
        "1/"
    );
    // once it reads, the field's value is the session's
    h.state_mut()
        .view_mut::<PermutohedronView>()
        .lambda_typing
        .shown[0] = "11/2".into();
    h.step();
    assert_eq!(h.state().session.solid.lambda[0], "11/2");
    std::fs::remove_dir_all(&dir).ok();
}

/// Every tab's title lies inside the window of `width` × `height` points.
fn tabs_inside(width: f32, height: f32) {
    let mut h = egui_kittest::Harness::builder()
        .with_size(egui::vec2(width, height))
        .with_accessibility_check(false)
        .allow_missing_glyphs()
        .build_ui_state(
            |ui, app: &mut Explorer| app.show(ui),
            Explorer::new(demo_session(), elbowroom::engine::Engine::quiet()),
        );
    h.state_mut().session.view = View::Products;
    h.step();
    h.step();
    for title in views::all().iter().map(|v| v.title()) {
        let node = h.get_by_label(title);
        let r = node.rect();
        assert!(
            r.max.x <= width + 0.5 && r.min.x >= 0.0 && r.max.y <= height,
            "the tab {title:?} at {r:?} is outside {width} × {height}",
        );
    }
}

#[test]
fn every_tab_is_reachable_at_120_and_150_percent() {
    // a 1280×800 window at zoom z has 1280/z × 800/z points
    for zoom in [1.0f32, 1.2, 1.5] {
        tabs_inside(1280.0 / zoom, 800.0 / zoom);
    }
}
