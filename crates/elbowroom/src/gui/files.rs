//! Saving and opening sessions and exporting figures and tables (Ctrl+S,
//! Ctrl+O, Ctrl+E): a small window with a typed path (and the desktop's file
//! dialog where one runs; the typed path always works), the demo sessions and
//! the recent ones to pick from, a new empty exploration, and the figures and
//! tables the current view can export.
//!
//! An exported figure leaves out the marks the canvas adds for interaction
//! (move dots, a lit pipe or crossing) unless "include the on-screen marks" is
//! ticked; an exported table starts with lines saying what it is (the view's
//! caption: n, h, the order of the rows; at least its name and row count).

use crate::figure::Scene;
use crate::figure::export::{self, ExportOptions};
use crate::session::{Session, demo, recent, store};
use crate::tables::table::Table;
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
    /// Export a figure or a table.
    Export,
}

/// Something a view can export: a figure (PNG, SVG, TikZ) or a table (CSV, LaTeX).
#[derive(Clone)]
pub enum Exportable {
    /// A figure scene, drawn as on screen.
    Figure(Arc<Scene>),
    /// A figure the canvas draws with marks for interaction: exported clean,
    /// or as on screen when the user asks for the marks.
    Marked {
        /// The figure without the marks.
        clean: Arc<Scene>,
        /// The figure as on screen, marks included.
        marked: Arc<Scene>,
        /// Which marks these are, in a few words (`move dots, the lit pipe`).
        marks: &'static str,
    },
    /// A table of results.
    Table(Arc<Table>),
}

impl Exportable {
    fn is_figure(&self) -> bool {
        !matches!(self, Exportable::Table(_))
    }

    fn extensions(&self) -> &'static [&'static str] {
        if self.is_figure() {
            &["png", "svg", "tex"]
        } else {
            &["csv", "tex"]
        }
    }

    fn hint(&self) -> &'static str {
        match self {
            Exportable::Figure(_) | Exportable::Marked { .. } => {
                "The extension chooses the format: .png, .svg or .tex (TikZ)."
            }
            Exportable::Table(_) => {
                "The extension chooses the format: .csv or .tex (a LaTeX tabular)."
            }
        }
    }
}

/// A view's exportable items, each with a name for the list.
pub type Exports = Vec<(String, Exportable)>;

/// The table as exported: with its caption, or, for a table that has none,
/// one made of its name in the list and its number of rows.
pub fn described(name: &str, table: &Table) -> Table {
    let mut t = table.clone();
    if t.caption.is_empty() {
        let mut what = name.trim_start_matches("the ").to_string();
        if let Some(first) = what.get(..1) {
            what = first.to_uppercase() + &what[1..];
        }
        t.caption = vec![format!(
            "{what}, in the order the explorer lists them; {} rows",
            t.rows.len()
        )];
    }
    t
}

/// A fresh exploration: the default session (its own title, no notes, no
/// pins, no history but its permutation), keeping only the theme and how
/// figures are exported.
pub fn fresh_session(from: &Session) -> Session {
    Session {
        dark: from.dark,
        figure: from.figure.clone(),
        ..Session::default()
    }
}

/// The window title for a session: its title as [`crate::session::model::shown_text`]
/// shows it (control characters escaped, at most the quoted length), after a
/// mark while it has changes in no file.
pub fn window_title(session: &Session, unsaved: bool) -> String {
    let mark = if unsaved { "• " } else { "" };
    format!(
        "{mark}elbowroom — {}",
        crate::session::model::shown_text(&session.title, crate::math::limits::QUOTE_LIMIT)
    )
}

/// The file window's state.
#[derive(Default)]
pub struct FilePanel {
    /// The open window, if any.
    pub action: Option<FileAction>,
    /// The typed path.
    pub path: String,
    /// The session just saved or opened, for the close guard to take.
    pub stored: Option<Session>,
    /// A file that an export or save would replace, waiting for a yes.
    pub replacing: Option<PathBuf>,
    /// The file the user agreed to replace.
    replace_ok: Option<PathBuf>,
    /// The last path the window proposed (renamed with the item while untouched).
    proposed: String,
    /// The file the session was last saved to or opened from.
    pub session_path: Option<PathBuf>,
    /// Which of the view's figures or tables to export (an index into the list).
    pub chosen: usize,
    /// Whether the typed path's extension was fitted to the first item yet.
    fitted: bool,
    /// Export figures with the marks the canvas adds (move dots, highlights).
    pub include_marks: bool,
    /// Whether the session has changes in no file (kept up to date by the
    /// window while this one is open), so a new exploration asks first.
    pub unsaved: bool,
    /// A new exploration was asked for over unsaved changes: waiting for a yes.
    asking_new: bool,
    /// Why the last open or save failed, shown in the window until the next try.
    pub error: Option<String>,
    /// Another session replaced the one shown (opened, or a new one started)
    /// since the explorer last looked.
    pub replaced: bool,
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
        self.chosen = 0;
        self.fitted = false;
        self.replacing = None;
        self.replace_ok = None;
        self.asking_new = false;
        self.error = None;
        self.action = Some(action);
    }

    /// Replaces the session by a fresh one (see [`fresh_session`]); the
    /// session file is forgotten, so Ctrl+S then asks where to save.
    pub fn start_new(&mut self, session: &mut Session) {
        *session = fresh_session(session);
        self.session_path = None;
        self.stored = Some(session.clone());
        self.asking_new = false;
        self.replaced = true;
    }

    /// Saves to the file the session came from or was last saved to, if there
    /// is one; returns whether there was (the outcome is in `message`).
    pub fn save_to_known_file(&mut self, session: &Session, message: &mut Option<String>) -> bool {
        let Some(path) = self.session_path.clone() else {
            return false;
        };
        *message = Some(match store::save(&path, session) {
            Ok(()) => {
                let _ = recent::push(&path);
                self.stored = Some(session.clone());
                format!("saved {}", path.display())
            }
            Err(e) => e.to_string(),
        });
        true
    }

    /// Draws the window (if open); `exports` are the current view's exportable
    /// figures and tables.
    pub fn ui(
        &mut self,
        ctx: &egui::Context,
        session: &mut Session,
        exports: &[(String, Exportable)],
        message: &mut Option<String>,
    ) {
        let Some(action) = self.action else { return };
        let title = match action {
            FileAction::Save => "Save the session",
            FileAction::Open => "Open a session",
            FileAction::Export => "Export a figure or a table",
        };
        let mut open = true;
        let mut done = false;
        egui::Window::new(title)
            .open(&mut open)
            .collapsible(false)
            .resizable(false)
            .show(ctx, |ui| {
                if action == FileAction::Export && !self.export_choice(ui, session, exports) {
                    return;
                }
                if let Some(e) = &self.error {
                    ui.add(
                        egui::Label::new(egui::RichText::new(e).color(crate::gui::theme::alert()))
                            .wrap(),
                    );
                }
                if self.path_row(ui, action, exports, message) {
                    done = self.perform(action, session, exports, message);
                }
                if let Some(path) = self.replacing.clone() {
                    ui.colored_label(
                        crate::gui::theme::alert(),
                        format!("{} exists already.", path.display()),
                    );
                    ui.horizontal(|ui| {
                        if ui.button("replace it").clicked() {
                            self.replace_ok = Some(path.clone());
                            self.replacing = None;
                            done = self.perform(action, session, exports, message);
                        }
                        if ui.button("choose another name").clicked() {
                            self.replacing = None;
                        }
                    });
                }
                if action == FileAction::Open {
                    if let Some(p) = session_to_open(ui) {
                        self.path = p.display().to_string();
                        done = self.perform(action, session, exports, message);
                    }
                    if self.new_exploration(ui, session) {
                        *message = Some(format!("started \"{}\"", session.title));
                        done = true;
                    }
                }
            });
        if !open || done {
            self.action = None;
        }
    }

    /// The button for a new, empty exploration (asking first when the
    /// current one has unsaved changes); true once it is started.
    fn new_exploration(&mut self, ui: &mut egui::Ui, session: &mut Session) -> bool {
        ui.separator();
        if !self.asking_new {
            let new = ui
                .button("start a new exploration")
                .on_hover_text("an untitled exploration: no notes, no pins, S_4");
            if !new.clicked() {
                return false;
            }
            if self.unsaved {
                self.asking_new = true;
                return false;
            }
        } else {
            ui.colored_label(
                crate::gui::theme::alert(),
                "This exploration has changes that are not in a session file.",
            );
            let mut go = false;
            ui.horizontal(|ui| {
                go = ui.button("start the new one anyway").clicked();
                if ui.button("keep this one").clicked() {
                    self.asking_new = false;
                }
            });
            if !go {
                return false;
            }
        }
        self.start_new(session);
        true
    }

    /// Names the file after `item` while the path is still the one proposed
    /// (a typed path whose extension fits `item` is the user's and stays).
    fn propose(&mut self, name: &str, item: &Exportable) {
        let untouched = self.path == self.proposed;
        self.path = if untouched {
            with_name_of(&self.path, name, item)
        } else {
            with_fitting_extension(&self.path, item)
        };
        self.proposed = if untouched {
            self.path.clone()
        } else {
            String::new()
        };
    }

    /// The list of the view's figures and tables to choose from (the path's
    /// extension follows the choice), the PNG settings for a figure, and the
    /// formats; false (after saying so) when there is nothing to export.
    fn export_choice(
        &mut self,
        ui: &mut egui::Ui,
        session: &mut Session,
        exports: &[(String, Exportable)],
    ) -> bool {
        if exports.is_empty() {
            ui.label("This view has nothing to export yet.");
            return false;
        }
        for (k, (name, _)) in exports.iter().enumerate() {
            if ui.radio_value(&mut self.chosen, k, name).changed() {
                self.propose(name, &exports[k].1);
                self.replacing = None;
            }
        }
        let chosen = &exports[self.chosen.min(exports.len() - 1)].1;
        if !self.fitted {
            let name = &exports[self.chosen.min(exports.len() - 1)].0;
            self.proposed = self.path.clone();
            self.propose(name, chosen);
            self.fitted = true;
        }
        if chosen.is_figure() {
            ui.horizontal(|ui| {
                ui.label("PNG scale");
                ui.add(egui::DragValue::new(&mut session.figure.scale).range(1.0..=12.0));
                ui.checkbox(&mut session.figure.transparent, "transparent background");
            });
        }
        if let Exportable::Marked { marks, .. } = chosen {
            ui.checkbox(
                &mut self.include_marks,
                format!("include the on-screen marks ({marks})"),
            );
        }
        ui.weak(chosen.hint());
        true
    }

    /// The typed path, the action's button and "browse…" (the desktop's
    /// dialog); true when the action should go ahead (button, Enter, or a
    /// path chosen in the dialog).
    fn path_row(
        &mut self,
        ui: &mut egui::Ui,
        action: FileAction,
        exports: &[(String, Exportable)],
        message: &mut Option<String>,
    ) -> bool {
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
        let mut go = false;
        ui.horizontal(|ui| {
            go = ui.button(verb).clicked() || enter;
            if ui
                .button("browse…")
                .on_hover_text("the system's file dialog, where a dialog service runs")
                .clicked()
            {
                let extensions = exports
                    .get(self.chosen)
                    .map(|(_, e)| e.extensions())
                    .unwrap_or(&["png", "svg", "tex"]);
                match native_dialog(action, &self.path, extensions) {
                    Some(p) => {
                        self.path = p.display().to_string();
                        go = true;
                    }
                    None => {
                        *message = Some(
                            "no file chosen (or no file dialog service here); type the path instead".into(),
                        );
                    }
                }
            }
        });
        go
    }

    fn perform(
        &mut self,
        action: FileAction,
        session: &mut Session,
        exports: &[(String, Exportable)],
        message: &mut Option<String>,
    ) -> bool {
        let path = PathBuf::from(self.path.trim());
        let replaces = action != FileAction::Open
            && path.exists()
            && self
                .session_path
                .as_ref()
                .filter(|_| action == FileAction::Save)
                != Some(&path)
            && self.replace_ok.as_ref() != Some(&path);
        if replaces {
            self.replacing = Some(path);
            return false;
        }
        match action {
            FileAction::Save => match store::save(&path, session) {
                Ok(()) => {
                    let _ = recent::push(&path);
                    self.stored = Some(session.clone());
                    *message = Some(format!("saved {}", path.display()));
                    self.session_path = Some(path);
                    true
                }
                Err(e) => {
                    *message = Some(e.to_string());
                    self.error = Some(e.to_string());
                    false
                }
            },
            FileAction::Open => match store::load(&path) {
                Ok(s) => {
                    self.stored = Some(s.clone());
                    *session = s;
                    self.replaced = true;
                    let _ = recent::push(&path);
                    *message = Some(format!("opened {}", path.display()));
                    self.session_path = Some(path);
                    true
                }
                Err(e) => {
                    *message = Some(e.to_string());
                    self.error = Some(e.to_string());
                    false
                }
            },
            FileAction::Export => {
                let Some((name, item)) = exports.get(self.chosen).or_else(|| exports.first())
                else {
                    return false;
                };
                let opts = ExportOptions {
                    scale: session.figure.scale,
                    transparent: session.figure.transparent,
                };
                let written = match item {
                    Exportable::Figure(scene) => {
                        export::write(scene, &path, &opts).map_err(|e| e.to_string())
                    }
                    Exportable::Marked { clean, marked, .. } => {
                        let scene = if self.include_marks { marked } else { clean };
                        export::write(scene, &path, &opts).map_err(|e| e.to_string())
                    }
                    Exportable::Table(table) => {
                        crate::tables::write(&described(name, table), &path)
                            .map_err(|e| e.to_string())
                    }
                };
                match written {
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

/// The demo sessions and the recent ones, as links; the one clicked, if any.
fn session_to_open(ui: &mut egui::Ui) -> Option<PathBuf> {
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
    pick
}

/// Asks the desktop's file dialog (through the XDG portal) for a path; `None`
/// when the user cancels or no dialog service is running, so the typed path stays
/// the way in.
fn native_dialog(action: FileAction, current: &str, extensions: &[&str]) -> Option<PathBuf> {
    let current = Path::new(current);
    let mut dialog = rfd::FileDialog::new();
    if let Some(dir) = current.parent().filter(|d| d.is_dir()) {
        dialog = dialog.set_directory(dir);
    }
    if let Some(name) = current.file_name() {
        dialog = dialog.set_file_name(name.to_string_lossy());
    }
    match action {
        FileAction::Open => dialog.add_filter("elbowroom session", &["ron"]).pick_file(),
        FileAction::Save => dialog.add_filter("elbowroom session", &["ron"]).save_file(),
        FileAction::Export => dialog.add_filter("figure or table", extensions).save_file(),
    }
}

/// The typed path with its extension changed to one the item can be written
/// as, when it has none of those (`figure.svg` becomes `table.csv` for a table).
/// A file name of its own for each item a view exports, made from its name
/// ("the positivity survey of S_5" -> `positivity-survey-of-S_5`), so two
/// views never propose the same file.
pub fn file_stem_of(name: &str) -> String {
    let mut stem = String::new();
    for c in name.trim_start_matches("the ").chars() {
        if c.is_ascii_alphanumeric() || c == '_' {
            stem.push(c);
        } else if !stem.ends_with('-') && !stem.is_empty() {
            stem.push('-');
        }
    }
    let stem = stem.trim_end_matches('-');
    if stem.is_empty() {
        "export".to_string()
    } else {
        stem.to_string()
    }
}

/// The path's directory with the item's own file name, keeping the path's
/// extension when it fits the item (SVG for a figure, CSV for a table
/// otherwise).
fn with_name_of(path: &str, name: &str, item: &Exportable) -> String {
    let p = Path::new(path);
    let ext = p
        .extension()
        .and_then(|e| e.to_str())
        .map(|e| e.to_ascii_lowercase())
        .filter(|e| item.extensions().contains(&e.as_str()))
        .unwrap_or_else(|| {
            if item.is_figure() {
                "svg".into()
            } else {
                "csv".into()
            }
        });
    let file = format!("{}.{ext}", file_stem_of(name));
    match p.parent().filter(|d| !d.as_os_str().is_empty()) {
        Some(dir) => dir.join(file).display().to_string(),
        None => file,
    }
}

fn with_fitting_extension(path: &str, item: &Exportable) -> String {
    let p = Path::new(path);
    let ext = p
        .extension()
        .and_then(|e| e.to_str())
        .map(|e| e.to_ascii_lowercase());
    let fits = ext
        .as_deref()
        .is_some_and(|e| item.extensions().contains(&e));
    if fits {
        return path.to_string();
    }
    let stem = if item.is_figure() {
        "figure.svg"
    } else {
        "table.csv"
    };
    match p.parent().filter(|d| !d.as_os_str().is_empty()) {
        Some(dir) => dir.join(stem).display().to_string(),
        None => stem.to_string(),
    }
}
