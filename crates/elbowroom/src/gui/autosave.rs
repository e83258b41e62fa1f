//! Autosave: while the window is open, the session is written to a recovery
//! file every 30 seconds when it has changed; a clean exit removes the file;
//! after a crash the next start offers the recovered session back.

use crate::session::{Session, recovery};
use eframe::egui;
use std::time::{Duration, Instant};

/// How often a changed session is written to the recovery file.
pub const INTERVAL: Duration = Duration::from_secs(30);

/// The autosave timer and the pending offer of a recovered session.
pub struct Autosave {
    enabled: bool,
    last_write: Instant,
    last_written: Option<Session>,
    /// A session recovered from a run that did not end cleanly, until the user decides.
    pub offer: Option<Session>,
}

impl Default for Autosave {
    /// Autosave off (headless tests, or no configuration directory).
    fn default() -> Self {
        Autosave {
            enabled: false,
            last_write: Instant::now(),
            last_written: None,
            offer: None,
        }
    }
}

impl Autosave {
    /// Autosave on, offering `recovered` (from `recovery::take_recovery`) if there was one.
    pub fn enabled(recovered: Option<Session>) -> Self {
        Autosave {
            enabled: recovery::recovery_path().is_some(),
            offer: recovered,
            ..Autosave::default()
        }
    }

    /// Writes the recovery file if autosave is on, 30 s have passed and the session changed.
    /// Returns a message when the write failed.
    pub fn tick(&mut self, session: &Session, ctx: &egui::Context) -> Option<String> {
        if !self.enabled {
            return None;
        }
        ctx.request_repaint_after(INTERVAL);
        if self.last_write.elapsed() < INTERVAL || self.last_written.as_ref() == Some(session) {
            return None;
        }
        self.last_write = Instant::now();
        self.last_written = Some(session.clone());
        recovery::write_recovery(session)
            .err()
            .map(|e| format!("autosave failed: {e}"))
    }

    /// On a clean exit: the recovery file is no longer needed.
    pub fn finish(&self) {
        if self.enabled {
            recovery::clear_recovery();
        }
    }

    /// Shows the offer of a recovered session, if any; restoring replaces
    /// `session` (and returns true).
    pub fn offer_ui(&mut self, ctx: &egui::Context, session: &mut Session) -> bool {
        let Some(recovered) = self.offer.as_ref() else {
            return false;
        };
        let mut restore = false;
        let mut dismiss = false;
        egui::Window::new("Recover the last exploration?")
            .collapsible(false)
            .resizable(false)
            .show(ctx, |ui| {
                ui.label(format!(
                    "elbowroom did not close cleanly last time. An autosaved copy of \"{}\" \
                     (n = {}, w = {}) is available.",
                    recovered.title,
                    recovered.n,
                    crate::gui::app_ctx::current_perm(recovered)
                ));
                ui.horizontal(|ui| {
                    restore = ui.button("restore it").clicked();
                    dismiss = ui.button("keep the current session").clicked();
                });
                ui.weak("The recovered copy stays on disk beside the recovery file either way.");
            });
        if restore && let Some(s) = self.offer.take() {
            *session = s;
            return true;
        }
        if dismiss {
            self.offer = None;
        }
        false
    }
}
