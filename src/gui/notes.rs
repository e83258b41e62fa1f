//! The notes kept with an exploration: a panel on the right of the window,
//! opened and closed by the status line's "notes" button or Ctrl+Shift+N,
//! with the session's title and its free-text notes. Both are part of the
//! session, so they are saved with it and an edit is an unsaved change (the
//! close guard asks). The notes hold at most [`TYPED_TEXT_LIMIT`] characters
//! and the title [`TITLE_LIMIT`]: typing or pasting past the limit is cut
//! there, with a line saying so, and a longer text from a file is shortened
//! to the limit (also said), so the editor never lays out an unbounded text.

use crate::math::limits::TYPED_TEXT_LIMIT;
use crate::session::Session;
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

/// Shortens `text` to at most `limit` characters; the number it had, if it had more.
fn cut_to(text: &mut String, limit: usize) -> Option<usize> {
    // a byte length within the limit is a character count within it too
    if text.len() <= limit {
        return None;
    }
    let count = text.chars().count();
    if count <= limit {
        return None;
    }
    let end = text
        .char_indices()
        .nth(limit)
        .map_or(text.len(), |(at, _)| at);
    text.truncate(end);
    Some(count)
}

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
        if let Some(had) = cut_to(&mut session.notes, TYPED_TEXT_LIMIT) {
            self.notice = Some(format!(
                "the notes had {had} characters; they are kept to the first {TYPED_TEXT_LIMIT}"
            ));
        }
        if let Some(had) = cut_to(&mut session.title, TITLE_LIMIT) {
            self.notice = Some(format!(
                "the title had {had} characters; it is kept to the first {TITLE_LIMIT}"
            ));
        }
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
                let title = ui.add(
                    egui::TextEdit::singleline(&mut session.title)
                        .id_salt("session_title")
                        .char_limit(TITLE_LIMIT)
                        .desired_width(f32::INFINITY),
                );
                if title.changed() {
                    ui.ctx().send_viewport_cmd(egui::ViewportCommand::Title(
                        crate::gui::files::window_title(session),
                    ));
                }
                ui.label("notes (saved with the session)");
                let edit = egui::ScrollArea::vertical()
                    .id_salt("notes_scroll")
                    .max_height(ui.available_height() - 40.0)
                    .show(ui, |ui| {
                        ui.add(
                            egui::TextEdit::multiline(&mut session.notes)
                                .id_salt("session_notes")
                                .char_limit(TYPED_TEXT_LIMIT)
                                .desired_rows(12)
                                .desired_width(f32::INFINITY),
                        )
                    })
                    .inner;
                if edit.changed() && at_limit(&session.notes, TYPED_TEXT_LIMIT) {
                    self.notice = Some(format!(
                        "the notes hold at most {TYPED_TEXT_LIMIT} characters; what went past that was not taken"
                    ));
                }
                if title.changed() && at_limit(&session.title, TITLE_LIMIT) {
                    self.notice = Some(format!(
                        "a title holds at most {TITLE_LIMIT} characters; what went past that was not taken"
                    ));
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
    fn a_long_text_is_cut_at_a_character_boundary() {
        let mut t = "ℓ(w) = 3; ".repeat(30);
        let had = t.chars().count();
        assert_eq!(cut_to(&mut t, 25), Some(had));
        assert_eq!(t.chars().count(), 25);
        assert!(t.starts_with("ℓ(w) = 3; ℓ(w)"));
        let mut short = "σ_w".to_string();
        assert_eq!(cut_to(&mut short, 3), None);
        assert_eq!(short, "σ_w");
        assert!(at_limit("σ_w", 3));
        assert!(!at_limit("σ_", 3));
    }
}
