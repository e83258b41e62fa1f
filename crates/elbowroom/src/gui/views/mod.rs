//! The views of the central area, one file each, their tab names, and the
//! pieces they share: progress and failure of a computation, errors of the
//! mathematics, the figures' look.

pub mod dreams;
pub mod explain_panel;
pub mod hessenberg;
pub mod permutohedra;
pub mod products;
pub mod quotient;
pub mod survey;
pub mod words;
pub mod workbench;

use crate::engine::{Engine, Fetch, JobKey, Output, Slot};
use crate::figure::look::Look;
use crate::math::MathError;
use crate::session::Session;
use crate::session::model::View;
use eframe::egui;
use std::sync::Arc;

/// The tab title of a view (what it does, in a few words).
pub fn title(v: View) -> &'static str {
    match v {
        View::Dreams => "Pipe dreams",
        View::Words => "Reduced words & wiring",
        View::Hessenberg => "Hessenberg classes",
        View::Quotient => "Quotient by J_n",
        View::Permutohedron => "Permutohedra",
        View::Workbench => "Polynomial workbench",
        View::Products => "Products & expansions",
    }
}

/// The views in tab order.
pub const ORDER: [View; 7] = [
    View::Dreams,
    View::Words,
    View::Hessenberg,
    View::Quotient,
    View::Permutohedron,
    View::Workbench,
    View::Products,
];

/// Whether arrow keys belong to the view (no text field has the keyboard).
pub fn arrows_free(ui: &egui::Ui) -> bool {
    ui.ctx().memory(|m| m.focused().is_none())
}

/// -1, +1, or 0 for the arrow keys pressed this frame (left/up back, right/down forward).
pub fn arrow_step(ui: &egui::Ui) -> isize {
    use egui::Key;
    if !arrows_free(ui) {
        return 0;
    }
    ui.input(|i| {
        let fwd = i.key_pressed(Key::ArrowRight) || i.key_pressed(Key::ArrowDown);
        let back = i.key_pressed(Key::ArrowLeft) || i.key_pressed(Key::ArrowUp);
        fwd as isize - back as isize
    })
}

/// Draws a progress bar with a cancel button for a slot that is computing.
pub fn show_progress(ui: &mut egui::Ui, what: &str, fraction: f32, slot: &Slot) {
    ui.horizontal(|ui| {
        ui.spinner();
        ui.label(what);
        ui.add(
            egui::ProgressBar::new(fraction)
                .desired_width(200.0)
                .show_percentage(),
        );
        if ui.button("cancel").clicked() {
            slot.cancel();
        }
    });
}

/// Shows a failure (wrapped to the width there is) with a retry button; true
/// if retry was clicked.
pub fn show_failure_with_retry(ui: &mut egui::Ui, e: &MathError) -> bool {
    ui.add(
        egui::Label::new(egui::RichText::new(e.to_string()).color(super::theme::alert())).wrap(),
    );
    ui.button("retry").clicked()
}

/// The slot's result for `key` once it is ready. Until then `None`, after
/// drawing the progress (labelled by `what` of the seconds elapsed) with a
/// cancel button, or the failure with a retry button (a click forgets it).
pub fn fetch_ready(
    ui: &mut egui::Ui,
    slot: &mut Slot,
    engine: &Engine,
    key: JobKey,
    what: impl FnOnce(f32) -> String,
) -> Option<Arc<Output>> {
    let failure = match slot.fetch(engine, key) {
        Fetch::Ready(out) => return Some(out.clone()),
        Fetch::Running(fraction, secs) => {
            show_progress(ui, &what(secs), fraction, slot);
            return None;
        }
        Fetch::Failed(e) => e.clone(),
    };
    if show_failure_with_retry(ui, &failure) {
        slot.retry();
    }
    None
}

/// A slot's result, or (while it is not there) its progress with cancel or its
/// error explained by [`show_math_error`] (a typed input's mistake, no retry).
pub fn fetch_or_explain(
    ui: &mut egui::Ui,
    slot: &mut Slot,
    engine: &Engine,
    key: JobKey,
    what: &str,
) -> Option<Arc<Output>> {
    let failure = match slot.fetch(engine, key) {
        Fetch::Ready(out) => return Some(out.clone()),
        Fetch::Running(fraction, _) => {
            show_progress(ui, what, fraction, slot);
            return None;
        }
        Fetch::Failed(e) => e.clone(),
    };
    show_math_error(ui, &failure);
    None
}

/// The longest typed polynomial a view sends to the engine. A text edit lays
/// its whole text out again on each change, and a polynomial typed by hand is
/// far shorter; the engine's own reading is bounded by `math::limits`.
pub const WINDOW_POLY_LIMIT: usize = 4000;

/// The one check of a typed polynomial on the window's thread: its length.
/// False (after saying so) when it is longer than [`WINDOW_POLY_LIMIT`].
pub fn typed_poly_fits(ui: &mut egui::Ui, text: &str) -> bool {
    if text.len() <= WINDOW_POLY_LIMIT {
        return true;
    }
    show_math_error(
        ui,
        &MathError::OutOfRange(format!(
            "the polynomial is {} characters long; at most {WINDOW_POLY_LIMIT} are read",
            text.len()
        )),
    );
    false
}

/// Shows an error of the mathematics: a syntax error as its message and the
/// input with a caret under the column, any other error as its text.
pub fn show_math_error(ui: &mut egui::Ui, e: &MathError) {
    let alert = super::theme::alert();
    match e {
        MathError::Syntax {
            input,
            column,
            expected,
            ..
        } => {
            ui.colored_label(alert, format!("column {column}: {expected}"));
            let caret = format!("{}^", " ".repeat(column.saturating_sub(1)));
            ui.label(
                egui::RichText::new(format!("{input}\n{caret}"))
                    .monospace()
                    .color(alert),
            );
        }
        other => {
            ui.add(egui::Label::new(egui::RichText::new(other.to_string()).color(alert)).wrap());
        }
    }
}

/// The look of the figures: the session's theme and label setting.
pub fn figure_look(session: &Session) -> Look {
    Look {
        dark: session.dark,
        labels: session.figure.labels,
    }
}
