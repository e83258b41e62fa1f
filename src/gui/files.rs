//! Saving and opening sessions and exporting figures (Ctrl+S, Ctrl+O, Ctrl+E):
//! a small window with a typed path (no native dialog is needed), the demo
//! sessions and the recent ones to pick from, and the figures the current view
//! can export.

use crate::figure::Scene;
use crate::figure::export::{self, ExportOptions};
use crate::session::{Session, demo, recent, store};
use eframe::egui;
use std::path::{Path, PathBuf};
use std::sync::Arc;

/// What the file window is doing.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum FileAction {
    /// Save the session.
    Save,
    /// Open a session.
    Open,
    /// Export a figure.
    Export,
}

/// The file window's state.
#[derive(Default)]
pub struct FilePanel {
    /// The open window, if any.
    pub action: Option<FileAction>,
    /// The typed path.
    pub path: String,
    /// The file the session was last saved to or opened from.
    pub session_path: Option<PathBuf>,
    /// Which of the view's figures to export.
    pub figure: usize,
}

impl FilePanel {
    /// Opens the window for `action` with a sensible default path.
    pub fn start(&mut self, action: FileAction, session: &Session) {
        self.path = match action {
            FileAction::Save | FileAction::Open => self
                .session_path
                .as_ref()
                .map(|p| p.display().to_string())
                .unwrap_or_else(|| "exploration.ron".into()),
            FileAction::Export => {
                let dir = if session.figure.last_dir.is_empty() {
                    ".".to_string()
                } else {
                    session.figure.last_dir.clone()
                };
                Path::new(&dir).join("figure.svg").display().to_string()
            }
        };
        self.figure = 0;
        self.action = Some(action);
    }

    /// Draws the window (if open); `figures` are the current view's exportable figures.
    pub fn ui(
        &mut self,
        ctx: &egui::Context,
        session: &mut Session,
        figures: &[(String, Arc<Scene>)],
        message: &mut Option<String>,
    ) {
        let Some(action) = self.action else { return };
        let title = match action {
            FileAction::Save => "Save the session",
            FileAction::Open => "Open a session",
            FileAction::Export => "Export a figure",
        };
        let mut open = true;
        let mut done = false;
        egui::Window::new(title)
            .open(&mut open)
            .collapsible(false)
            .resizable(false)
            .show(ctx, |ui| {
                if action == FileAction::Export {
                    if figures.is_empty() {
                        ui.label("This view has no figure to export yet.");
                        return;
                    }
                    for (k, (name, _)) in figures.iter().enumerate() {
                        ui.radio_value(&mut self.figure, k, name);
                    }
                    ui.horizontal(|ui| {
                        ui.label("PNG scale");
                        ui.add(egui::DragValue::new(&mut session.figure.scale).range(1.0..=12.0));
                        ui.checkbox(&mut session.figure.transparent, "transparent background");
                    });
                    ui.weak("The extension chooses the format: .png, .svg or .tex (TikZ).");
                }
                let edit = ui.add(
                    egui::TextEdit::singleline(&mut self.path)
                        .id_salt("file_path")
                        .desired_width(420.0),
                );
                let enter = edit.lost_focus() && ui.input(|i| i.key_pressed(egui::Key::Enter));
                let verb = match action {
                    FileAction::Save => "save",
                    FileAction::Open => "open",
                    FileAction::Export => "export",
                };
                if ui.button(verb).clicked() || enter {
                    done = self.perform(action, session, figures, message);
                }
                if action == FileAction::Open {
                    let mut pick = None;
                    ui.separator();
                    ui.weak("demo sessions");
                    for p in demo::demo_paths() {
                        let name = p
                            .file_name()
                            .map(|n| n.to_string_lossy().to_string())
                            .unwrap_or_default();
                        if ui.link(name).clicked() {
                            pick = Some(p);
                        }
                    }
                    let recent = recent::load();
                    if !recent.is_empty() {
                        ui.weak("recent");
                        for p in recent.into_iter().take(8) {
                            if ui.link(p.display().to_string()).clicked() {
                                pick = Some(p);
                            }
                        }
                    }
                    if let Some(p) = pick {
                        self.path = p.display().to_string();
                        done = self.perform(action, session, figures, message);
                    }
                }
            });
        if !open || done {
            self.action = None;
        }
    }

    fn perform(
        &mut self,
        action: FileAction,
        session: &mut Session,
        figures: &[(String, Arc<Scene>)],
        message: &mut Option<String>,
    ) -> bool {
        let path = PathBuf::from(self.path.trim());
        match action {
            FileAction::Save => match store::save(&path, session) {
                Ok(()) => {
                    let _ = recent::push(&path);
                    *message = Some(format!("saved {}", path.display()));
                    self.session_path = Some(path);
                    true
                }
                Err(e) => {
                    *message = Some(e.to_string());
                    false
                }
            },
            FileAction::Open => match store::load(&path) {
                Ok(s) => {
                    *session = s;
                    let _ = recent::push(&path);
                    *message = Some(format!("opened {}", path.display()));
                    self.session_path = Some(path);
                    true
                }
                Err(e) => {
                    *message = Some(e.to_string());
                    false
                }
            },
            FileAction::Export => {
                let Some((_, scene)) = figures.get(self.figure).or_else(|| figures.first()) else {
                    return false;
                };
                let opts = ExportOptions {
                    scale: session.figure.scale,
                    transparent: session.figure.transparent,
                };
                match export::write(scene, &path, &opts) {
                    Ok(()) => {
                        if let Some(dir) = path.parent() {
                            session.figure.last_dir = dir.display().to_string();
                        }
                        *message = Some(format!("exported {}", path.display()));
                        true
                    }
                    Err(e) => {
                        *message = Some(e.to_string());
                        false
                    }
                }
            }
        }
    }
}
