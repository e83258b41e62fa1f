//! The notes kept with an exploration: a panel on the right of the window,
//! opened and closed by the status line's "notes" button or Ctrl+Shift+N,
//! with the session's title and its free-text notes. Both are part of the
//! session, so they are saved with it and an edit is an unsaved change (the
//! close guard asks). The panel edits notes of at most [`NOTES_TEXT_LIMIT`]
//! characters and a title of at most [`TITLE_LIMIT`]: typing or pasting past
//! the limit is not taken, with a line saying so. Longer notes or a longer
//! title read from a file are never shortened: they are shown as an excerpt,
//! not edited, and saved as they are, so the editor never lays out an
//! unbounded text and nothing of the file is lost.

use crate::math::limits::NOTES_TEXT_LIMIT;
use crate::session::Session;
use crate::session::model::excerpt;
use eframe::egui;

/// The most characters a title may have.
pub const TITLE_LIMIT: usize = 200;

/// The notes panel's state.
#[derive(Default)]
pub struct NotesPanel {
    /// Whether the panel is shown.
    pub open: bool,
    /// What was refused or shortened last, if anything.
    pub notice: Option<String>,
}

/// The number of characters of `text` when it has more than `limit`.
fn over(text: &str, limit: usize) -> Option<usize> {
    // a byte length within the limit is a character count within it too
    if text.len() <= limit {
        return None;
    }
    let count = text.chars().count();
    (count > limit).then_some(count)
}

/// How much of a text too long to edit is shown.
const EXCERPT: usize = 2_000;

/// Whether `text` has `limit` characters or more.
fn at_limit(text: &str, limit: usize) -> bool {
    text.len() >= limit && text.chars().count() >= limit
}

impl NotesPanel {
    /// Opens or closes the panel on Ctrl+Shift+N.
    pub fn shortcut(&mut self, ctx: &egui::Context) {
        let cmd = egui::Modifiers::COMMAND | egui::Modifiers::SHIFT;
        if ctx.input_mut(|i| i.consume_key(cmd, egui::Key::N)) {
            self.open = !self.open;
        }
    }

    /// Draws the panel (when open) on the right of `ui`: the title, the
    /// notes, and a notice when a limit was reached.
    pub fn ui(&mut self, ui: &mut egui::Ui, session: &mut Session) {
        self.shortcut(ui.ctx());
        if !self.open {
            return;
        }
        let long_notes = over(&session.notes, NOTES_TEXT_LIMIT);
        let long_title = over(&session.title, TITLE_LIMIT);
        egui::Panel::right("notes")
            .resizable(true)
            .default_size(320.0)
            .show(ui, |ui| {
                ui.horizontal(|ui| {
                    ui.heading("Notes");
                    if ui.small_button("close").on_hover_text("Ctrl+Shift+N").clicked() {
                        self.open = false;
                    }
                });
                ui.label("title");
                let mut title_changed = false;
                if let Some(had) = long_title {
                    ui.label(excerpt(&session.title, TITLE_LIMIT));
                    ui.colored_label(
                        crate::gui::theme::alert(),
                        format!(
                            "this title has {had} characters, more than the {TITLE_LIMIT} edited here; it is kept as it is"
                        ),
                    );
                } else {
                    let title = ui.add(
                        egui::TextEdit::singleline(&mut session.title)
                            .id_salt("session_title")
                            .char_limit(TITLE_LIMIT)
                            .desired_width(f32::INFINITY),
                    );
                    title_changed = title.changed();
                }
                if title_changed && at_limit(&session.title, TITLE_LIMIT) {
                    self.notice = Some(format!(
                        "a title holds at most {TITLE_LIMIT} characters; what went past that was not taken"
                    ));
                }
                ui.label("notes (saved with the session)");
                if let Some(had) = long_notes {
                    ui.colored_label(
                        crate::gui::theme::alert(),
                        format!(
                            "these notes have {had} characters, more than the {NOTES_TEXT_LIMIT} edited here; they are kept as they are and saved unchanged (the first {EXCERPT} are shown)"
                        ),
                    );
                    egui::ScrollArea::vertical()
                        .id_salt("notes_scroll")
                        .max_height(ui.available_height() - 40.0)
                        .show(ui, |ui| ui.label(excerpt(&session.notes, EXCERPT)));
                } else {
                    let edit = egui::ScrollArea::vertical()
                        .id_salt("notes_scroll")
                        .max_height(ui.available_height() - 40.0)
                        .show(ui, |ui| {
                            ui.add(
                                egui::TextEdit::multiline(&mut session.notes)
                                    .id_salt("session_notes")
                                    .char_limit(NOTES_TEXT_LIMIT)
                                    .desired_rows(12)
                                    .desired_width(f32::INFINITY),
                            )
                        })
                        .inner;
                    if edit.changed() && at_limit(&session.notes, NOTES_TEXT_LIMIT) {
                        self.notice = Some(format!(
                            "the notes hold at most {NOTES_TEXT_LIMIT} characters; what went past that was not taken"
                        ));
                    }
                }
                if let Some(n) = &self.notice {
                    ui.colored_label(crate::gui::theme::alert(), n);
                }
                ui.weak("Ctrl+S saves the notes with the session.");
            });
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a_long_text_is_measured_and_shown_in_part_never_cut() {
        let t = "ℓ(w) = 3; ".repeat(30);
        assert_eq!(over(&t, 25), Some(t.chars().count()));
        assert_eq!(over("σ_w", 3), None);
        assert_eq!(excerpt(&t, 4), "ℓ(w)…");
        assert_eq!(excerpt("σ_w", 3), "σ_w");
        assert!(at_limit("σ_w", 3));
        assert!(!at_limit("σ_", 3));
    }
}
