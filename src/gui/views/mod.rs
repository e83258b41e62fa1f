//! The views of the central area, one file each, and their tab names.

pub mod dreams;
pub mod hessenberg;
pub mod quotient;
pub mod solid;
pub mod survey;
pub mod words;
pub mod workbench;

use crate::session::model::View;

/// The tab title of a view (what it does, in a few words).
pub fn title(v: View) -> &'static str {
    match v {
        View::Dreams => "Pipe dreams",
        View::Words => "Reduced words & wiring",
        View::Hessenberg => "Hessenberg classes",
        View::Quotient => "Quotient by J_n",
        View::Permutohedron => "Permutohedra",
        View::Workbench => "Polynomial workbench",
    }
}

/// The views in tab order.
pub const ORDER: [View; 6] = [
    View::Dreams,
    View::Words,
    View::Hessenberg,
    View::Quotient,
    View::Permutohedron,
    View::Workbench,
];

/// Whether arrow keys belong to the view (no text field has the keyboard).
pub fn arrows_free(ui: &eframe::egui::Ui) -> bool {
    ui.ctx().memory(|m| m.focused().is_none())
}

/// -1, +1, or 0 for the arrow keys pressed this frame (left/up back, right/down forward).
pub fn arrow_step(ui: &eframe::egui::Ui) -> isize {
    use eframe::egui::Key;
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
pub fn computing(ui: &mut eframe::egui::Ui, what: &str, fraction: f32, slot: &crate::engine::Slot) {
    ui.horizontal(|ui| {
        ui.spinner();
        ui.label(what);
        ui.add(
            eframe::egui::ProgressBar::new(fraction)
                .desired_width(200.0)
                .show_percentage(),
        );
        if ui.button("cancel").clicked() {
            slot.cancel();
        }
    });
}

/// Shows a failure with a retry button; true if retry was clicked.
pub fn failed(ui: &mut eframe::egui::Ui, e: &crate::math::MathError) -> bool {
    let mut retry = false;
    ui.horizontal(|ui| {
        ui.colored_label(super::theme::alert(), e.to_string());
        retry = ui.button("retry").clicked();
    });
    retry
}
