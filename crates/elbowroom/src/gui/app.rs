//! The explorer window: the permutation picker on the left, the views in tabs
//! in the middle, the status line at the bottom.

use super::app_ctx::AppCtx;
use super::autosave::Autosave;
use super::closing::CloseGuard;
use super::files::{Exportable, Exports, FileAction, FilePanel};
use super::notes::NotesPanel;
use super::picker::Picker;
use super::status::{self, FrameTimes};
use super::theme;
use super::views::{
    self, dreams::DreamsView, forests::ForestView, hessenberg::HessenbergView,
    permutohedra::PermutohedronView, products::ProductsView, quotient::QuotientView,
    words::WordsView, workbench::WorkbenchView,
};
use crate::engine::Engine;
use crate::session::Session;
use crate::session::model::View;
use eframe::egui;
use std::sync::Arc;
use std::time::{Duration, Instant};

/// The whole explorer: the session (inputs), the engine (results) and each
/// view's UI state.
pub struct Explorer {
    /// The exploration shown.
    pub session: Session,
    /// The computation service.
    pub engine: Engine,
    /// The last error or notice.
    pub message: Option<String>,
    /// The left panel.
    pub picker: Picker,
    /// The pipe-dream view.
    pub dreams: DreamsView,
    /// The reduced-word view.
    pub words: WordsView,
    /// The Hessenberg view.
    pub hessenberg: HessenbergView,
    /// The quotient view.
    pub quotient: QuotientView,
    /// The permutohedron view.
    pub permutohedron: PermutohedronView,
    /// The polynomial workbench.
    pub workbench: WorkbenchView,
    /// The products and expansions view.
    pub products: ProductsView,
    /// The forest polynomials view.
    pub forests: ForestView,
    /// The save / open / export window.
    pub files: FilePanel,
    /// The panel of the session's title and notes.
    pub notes: NotesPanel,
    /// The recovery-file timer and the offer of a recovered session.
    pub autosave: Autosave,
    /// Asks before a close would lose unsaved changes.
    pub closing: CloseGuard,
    /// A close asked by other means than the window's own button (tests).
    pub close_asked: bool,
    times: FrameTimes,
    frame_log: FrameLog,
}

/// What `ELBOWROOM_FRAME_LOG` asks for: nothing (unset), a line per frame on
/// stderr (any value), or that plus frames drawn back to back (`continuous`),
/// so that the interval between frames is the whole frame time.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
enum FrameLog {
    Off,
    Lines,
    Continuous,
}

impl FrameLog {
    fn from_env() -> FrameLog {
        match std::env::var_os("ELBOWROOM_FRAME_LOG") {
            None => FrameLog::Off,
            Some(v) if v == "continuous" => FrameLog::Continuous,
            Some(_) => FrameLog::Lines,
        }
    }
}

/// A small exploration of S_5 around the vexillary permutation 15432 (14
/// reduced pipe dreams), with a few pins: the fixture of the headless GUI
/// tests. (The window itself opens on `session::demo::default_demo`.)
pub fn demo_session() -> Session {
    let current = vec![1, 5, 4, 3, 2];
    Session {
        title: "pipe dreams in S_5".into(),
        n: 5,
        current: current.clone(),
        history: vec![vec![1, 4, 3, 2, 5], current],
        history_pos: 1,
        pins: vec![
            vec![1, 4, 3, 2, 5],
            vec![2, 1, 4, 3, 5],
            vec![1, 5, 4, 3, 2],
            vec![3, 1, 5, 2, 4],
            vec![5, 4, 3, 2, 1],
        ],
        ..Session::default()
    }
}

impl Explorer {
    /// An explorer over `session`, computing with `engine`.
    pub fn new(session: Session, engine: Engine) -> Self {
        let closing = CloseGuard::new(&session);
        Explorer {
            session,
            engine,
            message: None,
            picker: Picker::default(),
            dreams: DreamsView::default(),
            words: WordsView::default(),
            hessenberg: HessenbergView::default(),
            quotient: QuotientView::default(),
            permutohedron: PermutohedronView::default(),
            workbench: WorkbenchView::default(),
            products: ProductsView::default(),
            forests: ForestView::default(),
            files: FilePanel::default(),
            notes: NotesPanel::default(),
            autosave: Autosave::default(),
            closing,
            close_asked: false,
            times: FrameTimes::default(),
            frame_log: FrameLog::from_env(),
        }
    }

    /// Draws the whole window into `ui`.
    pub fn show(&mut self, ui: &mut egui::Ui) {
        let started = Instant::now();
        theme::apply(ui.ctx(), self.session.dark);
        self.shortcuts(ui);
        if let Some(a) = self.status_line(ui) {
            self.files.start(a, &self.session);
        }
        self.picker_panel(ui);
        self.view_tabs(ui);
        self.notes.ui(ui, &mut self.session);
        self.central_view(ui);
        // figures and tables are gathered (tables built) only while the export window is open
        let exports = if self.files.action == Some(FileAction::Export) {
            self.exports()
        } else {
            Vec::new()
        };
        if self.files.action.is_some() {
            self.files.unsaved = self.closing.unsaved(&self.session);
        }
        self.files
            .ui(ui.ctx(), &mut self.session, &exports, &mut self.message);
        if let Some(s) = self.files.stored.take() {
            self.closing.stored(s);
        }
        let requested = std::mem::take(&mut self.close_asked)
            || ui.ctx().input(|i| i.viewport().close_requested());
        self.closing.ui(
            ui.ctx(),
            requested,
            &self.session,
            &mut self.files,
            &mut self.message,
        );
        self.autosave.offer_ui(ui.ctx(), &mut self.session);
        if let Some(m) = self.autosave.tick(&self.session, ui.ctx()) {
            self.message = Some(m);
        }
        if !self.engine.running().is_empty() {
            ui.ctx().request_repaint_after(Duration::from_millis(50));
        }
        let took = started.elapsed();
        self.times.record(took);
        self.log_frame(ui, took);
    }

    /// The bottom panel: open, save as, export, the theme and label switches,
    /// then the status line; the file action clicked, if any.
    fn status_line(&mut self, ui: &mut egui::Ui) -> Option<FileAction> {
        let mut file_action = None;
        egui::Panel::bottom("status_line").show(ui, |ui| {
            ui.horizontal(|ui| {
                if ui.small_button("open").on_hover_text("Ctrl+O").clicked() {
                    file_action = Some(FileAction::Open);
                }
                if ui
                    .small_button("save as…")
                    .on_hover_text("choose where to save (Ctrl+Shift+S); Ctrl+S saves back to the session's file")
                    .clicked()
                {
                    file_action = Some(FileAction::Save);
                }
                if ui
                    .small_button("export…")
                    .on_hover_text(
                        "Ctrl+E: the view's figures (PNG, SVG, TikZ) and tables (CSV, LaTeX)",
                    )
                    .clicked()
                {
                    file_action = Some(FileAction::Export);
                }
                if ui
                    .selectable_label(self.notes.open, "notes")
                    .on_hover_text("the exploration's title and notes (Ctrl+Shift+N)")
                    .clicked()
                {
                    self.notes.open = !self.notes.open;
                }
                let label = if self.session.dark {
                    "light theme"
                } else {
                    "dark theme"
                };
                if ui.small_button(label).clicked() {
                    self.session.dark = !self.session.dark;
                }
                ui.checkbox(&mut self.session.figure.labels, "figure labels");
                ui.separator();
                status::ui(ui, &self.engine, &self.times);
            });
            status::rows_ui(ui, &self.engine, &mut self.message);
        });
        file_action
    }

    /// The left panel: the permutation picker.
    fn picker_panel(&mut self, ui: &mut egui::Ui) {
        egui::Panel::left("picker")
            .default_size(300.0)
            .show(ui, |ui| {
                let mut ctx = AppCtx {
                    session: &mut self.session,
                    engine: &self.engine,
                    message: &mut self.message,
                };
                self.picker.ui(ui, &mut ctx);
            });
    }

    /// The tab bar over the central area; the tabs wrap onto a second line
    /// when the window is too narrow for them (a large zoom), so each stays reachable.
    fn view_tabs(&mut self, ui: &mut egui::Ui) {
        egui::Panel::top("view_tabs").show(ui, |ui| {
            ui.horizontal_wrapped(|ui| {
                for v in views::ORDER {
                    let chosen = self.session.view == v;
                    if ui.selectable_label(chosen, views::title(v)).clicked() {
                        self.session.view = v;
                    }
                }
            });
        });
    }

    /// The central area: the view of the tab chosen.
    fn central_view(&mut self, ui: &mut egui::Ui) {
        egui::CentralPanel::default().show(ui, |ui| {
            let mut ctx = AppCtx {
                session: &mut self.session,
                engine: &self.engine,
                message: &mut self.message,
            };
            if !views::ORDER.contains(&ctx.session.view) {
                ctx.session.view = View::Dreams;
            }
            match ctx.session.view {
                View::Words => self.words.ui(ui, &mut ctx),
                View::Hessenberg => self.hessenberg.ui(ui, &mut ctx),
                View::Quotient => self.quotient.ui(ui, &mut ctx),
                View::Permutohedron => self.permutohedron.ui(ui, &mut ctx),
                View::Workbench => self.workbench.ui(ui, &mut ctx),
                View::Products => self.products.ui(ui, &mut ctx),
                View::Forests => self.forests.ui(ui, &mut ctx),
                _ => self.dreams.ui(ui, &mut ctx),
            }
        });
    }

    /// The line per frame on stderr that `ELBOWROOM_FRAME_LOG` asks for (and
    /// the next frame at once, for `continuous`).
    fn log_frame(&self, ui: &egui::Ui, took: Duration) {
        if self.frame_log == FrameLog::Off {
            return;
        }
        if self.frame_log == FrameLog::Continuous {
            ui.ctx().request_repaint();
        }
        eprintln!(
            "frame {:?} build {:.2} ms interval {:.2} ms",
            self.session.view,
            took.as_secs_f32() * 1e3,
            ui.input(|i| i.unstable_dt) * 1e3
        );
    }

    /// The current view's figures and tables, for the export window.
    fn exports(&mut self) -> Exports {
        let survey = self.session.quotient.survey;
        let figures = match self.session.view {
            View::Dreams => return self.dreams.figures(),
            View::Words => return self.words.figures(),
            View::Quotient if !survey => self.quotient.figures(),
            View::Permutohedron => self.permutohedron.figures(),
            View::Forests => self.forests.figures(),
            _ => Vec::new(),
        };
        let tables = match self.session.view {
            View::Hessenberg => self.hessenberg.tables(),
            View::Permutohedron => self.permutohedron.tables(),
            View::Quotient if survey => self.quotient.survey.tables(),
            _ => Vec::new(),
        };
        // the Hessenberg view's table comes before the figure of h
        let after = match self.session.view {
            View::Hessenberg => self.hessenberg.figures(),
            _ => Vec::new(),
        };
        figures
            .into_iter()
            .map(|(name, s)| (name, Exportable::Figure(s)))
            .chain(
                tables
                    .into_iter()
                    .map(|(name, t)| (name, Exportable::Table(t))),
            )
            .chain(
                after
                    .into_iter()
                    .map(|(name, s)| (name, Exportable::Figure(s))),
            )
            .collect()
    }

    fn shortcuts(&mut self, ui: &mut egui::Ui) {
        let (save_as, save, open, export) = ui.input_mut(|i| {
            let cmd = egui::Modifiers::COMMAND;
            (
                i.consume_key(cmd | egui::Modifiers::SHIFT, egui::Key::S),
                i.consume_key(cmd, egui::Key::S),
                i.consume_key(cmd, egui::Key::O),
                i.consume_key(cmd, egui::Key::E),
            )
        });
        // Ctrl+S saves straight back to the session's file when it has one
        // (opened or saved before); otherwise, and with Ctrl+Shift+S, it asks where
        if save
            && self
                .files
                .save_to_known_file(&self.session, &mut self.message)
        {
            return;
        }
        let action = if save || save_as {
            Some(FileAction::Save)
        } else if open {
            Some(FileAction::Open)
        } else if export {
            Some(FileAction::Export)
        } else {
            None
        };
        if let Some(a) = action {
            self.files.start(a, &self.session);
        }
    }
}

impl eframe::App for Explorer {
    fn ui(&mut self, ui: &mut egui::Ui, _frame: &mut eframe::Frame) {
        self.show(ui);
    }

    fn clear_color(&self, _visuals: &egui::Visuals) -> [f32; 4] {
        theme::panel_color(self.session.dark).to_normalized_gamma_f32()
    }

    fn on_exit(&mut self, _gl: Option<&eframe::glow::Context>) {
        self.autosave.finish();
    }
}

/// Opens the explorer window on `session` (or the demo exploration).
pub fn run(session: Option<Session>) -> eframe::Result {
    let session = session.unwrap_or_else(crate::session::demo::default_demo);
    launch(session, None)
}

/// Opens the explorer on a session read from `path`; Ctrl+S saves back to it.
pub fn run_file(session: Session, path: std::path::PathBuf) -> eframe::Result {
    launch(session, Some(path))
}

fn launch(session: Session, path: Option<std::path::PathBuf>) -> eframe::Result {
    let options = eframe::NativeOptions {
        viewport: egui::ViewportBuilder::default()
            .with_inner_size([1280.0, 800.0])
            .with_title(format!("elbowroom — {}", session.title)),
        // the window repaints only on input or while a job runs, so waiting for
        // the display's refresh buys nothing; without it a software renderer
        // (no GPU) shows each frame as soon as it is drawn
        glow_options: eframe::egui_glow::GlowConfiguration {
            vsync: std::env::var_os("ELBOWROOM_VSYNC").is_some(),
            ..Default::default()
        },
        dithering: std::env::var_os("ELBOWROOM_DITHER").is_some(),
        ..Default::default()
    };
    eframe::run_native(
        "elbowroom",
        options,
        Box::new(move |cc| {
            let ctx = cc.egui_ctx.clone();
            let engine = Engine::new(Arc::new(move || ctx.request_repaint()));
            let mut explorer = Explorer::new(session, engine);
            explorer.files.session_path = path;
            explorer.autosave = Autosave::enabled(crate::session::take_recovery());
            Ok(Box::new(explorer))
        }),
    )
}
