//! The views of the central area, one file each, their tab names, and the
//! pieces they share: progress and failure of a computation, errors of the
//! mathematics, the figures' look.

pub mod dreams;
pub mod explain_panel;
pub mod forests;
pub mod hessenberg;
pub mod permutohedra;
pub mod products;
pub mod quotient;
pub mod survey;
pub mod words;
pub mod workbench;

use crate::engine::{Engine, Fetch, JobKey, Output, Slot};
use crate::figure::look::Look;
use crate::gui::AppCtx;
use crate::gui::files::Exports;
use crate::math::MathError;
use crate::session::Session;
use crate::session::model::View as ViewKind;
use eframe::egui;
use std::any::Any;
use std::sync::Arc;

/// What every view of the central area is: a tab with a title, a `ui` drawn
/// each frame from the session and the engine, the figures and tables it can
/// export, and its own UI state, told when another session replaces the one
/// shown. The explorer holds the views in [`all`] and iterates over them.
pub trait View: Any {
    /// Which view this is in a session file (`view: Dreams`, …).
    fn kind(&self) -> ViewKind;

    /// The tab title (what the view does, in a few words).
    fn title(&self) -> &'static str;

    /// Draws the view.
    fn ui(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx);

    /// The figures and tables the view can export now, in the order the
    /// export window lists them.
    fn exports(&mut self, _session: &Session) -> Exports {
        Vec::new()
    }

    /// Another session was opened (or a new one started): forget the UI
    /// state that belonged to the one before.
    fn session_replaced(&mut self) {}
}

/// Every view, in tab order: a new view is one file and one line here.
pub fn all() -> Vec<Box<dyn View>> {
    vec![
        Box::new(dreams::DreamsView::default()),
        Box::new(words::WordsView::default()),
        Box::new(hessenberg::HessenbergView::default()),
        Box::new(quotient::QuotientView::default()),
        Box::new(permutohedra::PermutohedronView::default()),
        Box::new(workbench::WorkbenchView::default()),
        Box::new(products::ProductsView::default()),
        Box::new(forests::ForestView::default()),
    ]
}

/// Figures first, then tables, as the export window lists them.
pub fn exports_of(
    figures: Vec<(String, Arc<crate::figure::Scene>)>,
    tables: Vec<(String, Arc<crate::tables::table::Table>)>,
) -> Exports {
    use crate::gui::files::Exportable;
    figures
        .into_iter()
        .map(|(name, s)| (name, Exportable::Figure(s)))
        .chain(
            tables
                .into_iter()
                .map(|(name, t)| (name, Exportable::Table(t))),
        )
        .collect()
}

/// An elapsed time as every progress line writes it: tenths of a second
/// under a minute (`0.7 s`, `12.4 s`), then minutes and seconds (`2 min 05 s`).
pub fn elapsed_text(secs: f32) -> String {
    if secs < 60.0 {
        format!("{secs:.1} s")
    } else {
        let whole = secs as u64;
        format!("{} min {:02} s", whole / 60, whole % 60)
    }
}

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
        super::typeset::label(ui, &super::typeset::Typeset::new().symbol(what));
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
    if matches!(failure, MathError::Canceled) {
        if show_failure_with_retry(ui, &failure) {
            slot.retry();
        }
        return None;
    }
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
