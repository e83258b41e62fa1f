//! Closing the window with unsaved changes: the close is held back and a small
//! window asks whether to save, to close without saving, or to keep working.
//!
//! "Unsaved" means the session differs from the one last saved or opened (or
//! the one the window started with). The recovery file written in the
//! background is a safety net, not a save, so it does not count.

use crate::gui::files::{FileAction, FilePanel};
use crate::session::Session;
use eframe::egui;

/// What the close guard remembers between frames.
pub struct CloseGuard {
    /// The session as last saved or opened.
    saved: Session,
    /// Whether the question is on screen.
    pub asking: bool,
    /// Set once the user chose to close; the next close goes through.
    confirmed: bool,
}

impl CloseGuard {
    /// A guard for a window that starts on `session` (nothing unsaved yet).
    pub fn new(session: &Session) -> Self {
        CloseGuard {
            saved: session.clone(),
            asking: false,
            confirmed: false,
        }
    }

    /// Records that `session` was just saved or opened.
    pub fn stored(&mut self, session: Session) {
        self.saved = session;
    }

    /// Whether `session` has changes not in a session file.
    pub fn unsaved(&self, session: &Session) -> bool {
        *session != self.saved
    }

    /// Holds back a close of the window while there are unsaved changes and
    /// asks what to do; `requested` is whether a close was asked this frame.
    pub fn ui(
        &mut self,
        ctx: &egui::Context,
        requested: bool,
        session: &Session,
        files: &mut FilePanel,
        message: &mut Option<String>,
    ) {
        if requested && !self.confirmed && self.unsaved(session) {
            ctx.send_viewport_cmd(egui::ViewportCommand::CancelClose);
            self.asking = true;
        }
        if !self.asking {
            return;
        }
        egui::Window::new("Unsaved changes")
            .collapsible(false)
            .resizable(false)
            .anchor(egui::Align2::CENTER_CENTER, egui::Vec2::ZERO)
            .show(ctx, |ui| {
                ui.label("This exploration has changes that are not in a session file.");
                if let Some(path) = &files.session_path {
                    ui.label(format!("Its file: {}", path.display()));
                }
                ui.horizontal(|ui| {
                    let save_label = if files.session_path.is_some() {
                        "save and close"
                    } else {
                        "save as…"
                    };
                    if ui.button(save_label).clicked() {
                        self.save(ctx, session, files, message);
                    }
                    if ui.button("close without saving").clicked() {
                        self.confirmed = true;
                        self.asking = false;
                        ctx.send_viewport_cmd(egui::ViewportCommand::Close);
                    }
                    if ui.button("keep working").clicked() {
                        self.asking = false;
                    }
                });
            });
    }

    /// Saves to the session's file and closes, or, with no file yet, opens the
    /// save window (the user closes again once it is saved).
    fn save(
        &mut self,
        ctx: &egui::Context,
        session: &Session,
        files: &mut FilePanel,
        message: &mut Option<String>,
    ) {
        self.asking = false;
        if !files.save_to_known_file(session, message) {
            files.start(FileAction::Save, session);
            *message = Some("choose where to save; then close the window again".into());
            return;
        }
        // the file window's save reports its outcome in `message`, and hands the
        // saved session over only when it succeeded
        if let Some(saved) = files.stored.take() {
            self.saved = saved;
            self.confirmed = true;
            ctx.send_viewport_cmd(egui::ViewportCommand::Close);
        }
    }
}
