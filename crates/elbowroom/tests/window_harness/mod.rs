//! The explorer driven headlessly (egui_kittest, no display), shared by the
//! window tests: a harness on the demo session, stepping until a state is
//! reached, and a look for a text on screen.
#![allow(dead_code, clippy::unwrap_used)]

use eframe::egui;
use egui_kittest::Harness;
use egui_kittest::kittest::Queryable;
use elbowroom::engine::Engine;
use elbowroom::gui::Explorer;
use elbowroom::gui::app::demo_session;
use elbowroom::gui::views::View;
use std::time::{Duration, Instant};

/// A view of the explorer by its type (every view is there from the start).
pub trait ViewOf {
    /// The view of type `V`.
    fn view<V: View>(&self) -> &V;
    /// The view of type `V`, to change.
    fn view_mut<V: View>(&mut self) -> &mut V;
}

impl ViewOf for Explorer {
    fn view<V: View>(&self) -> &V {
        self.find_view::<V>().unwrap()
    }

    fn view_mut<V: View>(&mut self) -> &mut V {
        self.find_view_mut::<V>().unwrap()
    }
}

/// The explorer at 1280×800 on the demo session, computing with a quiet engine.
pub fn harness() -> Harness<'static, Explorer> {
    Harness::builder()
        .with_size(egui::vec2(1280.0, 800.0))
        .with_accessibility_check(false)
        .allow_missing_glyphs()
        .build_ui_state(
            |ui, app: &mut Explorer| app.show(ui),
            Explorer::new(demo_session(), Engine::quiet()),
        )
}

/// Steps frames until `done` holds (the engine works on other threads).
pub fn settle(
    h: &mut Harness<'static, Explorer>,
    done: impl Fn(&Harness<'static, Explorer>) -> bool,
) {
    let start = Instant::now();
    while start.elapsed() < Duration::from_secs(60) {
        h.step();
        if done(h) {
            return;
        }
        std::thread::sleep(Duration::from_millis(5));
    }
    panic!("the explorer did not reach the expected state in time");
}

/// Whether some text on screen contains `text`.
pub fn has(h: &Harness<'static, Explorer>, text: &str) -> bool {
    h.query_all_by_label_contains(text).next().is_some()
}

/// Opens the quotient view and runs the positivity survey of S_5 (the demo's
/// n) until its 120 normal forms are in: none has a negative coefficient, as
/// the headless survey finds for every n <= 11.
pub fn survey_of_s5(h: &mut Harness<'static, Explorer>) {
    h.get_by_label("Quotient by J_n").click();
    h.step();
    h.get_by_label("positivity survey of all of S_5").click();
    settle(h, |h| {
        has(
            h,
            "120 permutations: every normal form has nonnegative coefficients",
        )
    });
}
