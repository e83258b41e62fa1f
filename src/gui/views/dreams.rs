//! The pipe-dream canvas: the staircase with pipes coloured by label, "k of N"
//! with arrow-key stepping, hover to follow a pipe, click a cell to apply a
//! ladder (or chute) move there, the dream's monomial and reading word; and a
//! switch to bumpless pipe dreams.

use super::{arrow_step, computing, failed};
use crate::engine::requests::DREAM_LIMIT;
use crate::engine::{Fetch, JobKey, Output, Slot};
use crate::figure::bumpless::bumpless_scene;
use crate::figure::dream::dream_scene;
use crate::figure::look::Look;
use crate::figure::{Scene, Tag};
use crate::gui::AppCtx;
use crate::gui::scene_painter::{self, PaintOptions};
use crate::math::pipes::dream::PipeDream;
use crate::math::poly::mono::exponents_text;
use crate::math::{MathError, Perm};
use eframe::egui;
use std::sync::Arc;

/// The dream view's UI state.
#[derive(Default)]
pub struct DreamsView {
    list: Slot,
    bumpless: Slot,
    /// A dream reached by a move (shown instead of the indexed one).
    moved: Option<PipeDream>,
    scene: Option<(SceneKey, Arc<Scene>)>,
    hover_pipe: Option<usize>,
    /// What the last click did.
    pub note: Option<String>,
    /// The dream drawn in the last frame.
    pub shown: Option<PipeDream>,
    /// Where the canvas was drawn in the last frame: its rectangle and screen points per figure unit.
    pub canvas: Option<(egui::Rect, f32)>,
}

#[derive(Clone, PartialEq)]
enum SceneKey {
    Dream(PipeDream, Look),
    Bumpless(Perm, usize, Look),
}

impl DreamsView {
    /// The figures this view can export: the dream on screen.
    pub fn figures(&self) -> Vec<(String, Arc<Scene>)> {
        self.scene
            .iter()
            .map(|(_, s)| ("the pipe dream shown".to_string(), s.clone()))
            .collect()
    }

    /// Draws the view.
    pub fn ui(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx) {
        let w = ctx.perm();
        ui.horizontal(|ui| {
            ui.heading(format!("Reduced pipe dreams of w = {w}"));
            ui.separator();
            let mut b = ctx.session.dreams.bumpless;
            if ui
                .checkbox(&mut b, "bumpless model")
                .on_hover_text("show bumpless pipe dreams (Lam–Lee–Shimozono) instead")
                .changed()
            {
                ctx.session.dreams.bumpless = b;
                ctx.session.dreams.index = 0;
            }
        });
        if ctx.session.dreams.bumpless {
            self.bumpless_ui(ui, ctx, &w);
        } else {
            self.dreams_ui(ui, ctx, &w);
        }
    }

    fn look(ctx: &AppCtx) -> Look {
        Look {
            dark: ctx.session.dark,
            labels: ctx.session.figure.labels,
        }
    }

    fn stepper(ui: &mut egui::Ui, index: &mut usize, total: usize, moved: &mut Option<PipeDream>) {
        let step = arrow_step(ui);
        let mut target: Option<usize> = None;
        ui.horizontal(|ui| {
            if ui.button("|<").on_hover_text("first").clicked() {
                target = Some(0);
            }
            if ui
                .button("<")
                .on_hover_text("previous (left arrow)")
                .clicked()
                || step < 0
            {
                target = Some(index.saturating_sub(1));
            }
            ui.label(egui::RichText::new(format!("{} of {total}", *index + 1)).strong());
            if ui.button(">").on_hover_text("next (right arrow)").clicked() || step > 0 {
                target = Some((*index + 1).min(total.saturating_sub(1)));
            }
            if ui.button(">|").on_hover_text("last").clicked() {
                target = Some(total.saturating_sub(1));
            }
        });
        if let Some(t) = target {
            *index = t;
            *moved = None;
        }
    }

    fn dreams_ui(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx, w: &Perm) {
        let out = match self.list.fetch(ctx.engine, JobKey::PipeDreams(w.clone())) {
            Fetch::Ready(out) => out.clone(),
            Fetch::Running(f, _) => {
                computing(ui, "enumerating pipe dreams", f, &self.list);
                return;
            }
            Fetch::Failed(e) => {
                let e: MathError = e.clone();
                if failed(ui, &e) {
                    self.list.retry();
                }
                return;
            }
        };
        let Some(dreams) = out.dreams() else { return };
        if dreams.is_empty() {
            return;
        }
        let total = dreams.len();
        let place = &mut ctx.session.dreams;
        place.index = place.index.min(total - 1);
        if self.moved.as_ref().is_some_and(|m| m.permutation() != *w) {
            self.moved = None;
        }
        Self::stepper(ui, &mut place.index, total, &mut self.moved);
        if total == DREAM_LIMIT {
            ui.weak(format!("only the first {DREAM_LIMIT} dreams are listed"));
        }
        let dream = self.moved.unwrap_or(dreams[place.index]);
        let look = Self::look(ctx);
        let key = SceneKey::Dream(dream, look);
        let scene = match &self.scene {
            Some((k, s)) if *k == key => s.clone(),
            _ => {
                let hints: Vec<(usize, usize)> = {
                    let mut v: Vec<(usize, usize)> = dream
                        .available_moves()
                        .iter()
                        .filter(|m| {
                            matches!(
                                m.kind,
                                crate::math::pipes::moves::MoveKind::Ladder
                                    | crate::math::pipes::moves::MoveKind::Chute
                            )
                        })
                        .map(|m| m.from)
                        .collect();
                    v.dedup();
                    v
                };
                let s = Arc::new(dream_scene(&dream, &look, &hints));
                self.scene = Some((key, s.clone()));
                s
            }
        };
        ui.horizontal_top(|ui| {
            let side = (ui.available_height() - 8.0).min(ui.available_width() - 300.0).max(160.0);
            let opts = PaintOptions {
                highlight: self.hover_pipe.map(Tag::Pipe).into_iter().collect(),
                max_scale: 4.0,
                size: Some(egui::vec2(side, side)),
            };
            let r = scene_painter::show(ui, &scene, &opts);
            self.canvas = Some((r.response.rect, r.scale));
            self.shown = Some(dream);
            self.hover_pipe = match r.hovered_where(|t| matches!(t, Tag::Pipe(_))) {
                Some(Tag::Pipe(k)) => Some(k),
                _ => None,
            };
            if let Some(k) = self.hover_pipe {
                r.response.clone().on_hover_text(format!(
                    "pipe {k}: enters row {k}, leaves column {}",
                    w.at(k)
                ));
            }
            if let Some(Tag::Cell(i, j)) = r.clicked_where(|t| matches!(t, Tag::Cell(..))) {
                let shift = ui.input(|inp| inp.modifiers.shift);
                let next = if shift {
                    dream
                        .ladder_back_at(i, j)
                        .map(|d| (d, "inverse ladder"))
                        .or_else(|| dream.chute_back_at(i, j).map(|d| (d, "inverse chute")))
                } else {
                    dream
                        .ladder_move_at(i, j)
                        .map(|d| (d, "ladder"))
                        .or_else(|| dream.chute_move_at(i, j).map(|d| (d, "chute")))
                };
                match next {
                    Some((d, kind)) => {
                        self.note = Some(format!("{kind} move at ({i}, {j})"));
                        // find the new dream in the list so stepping continues from it
                        if let Some(k) = dreams.iter().position(|e| *e == d) {
                            ctx.session.dreams.index = k;
                            self.moved = None;
                        } else {
                            self.moved = Some(d);
                        }
                    }
                    None => self.note = Some(format!("no move at ({i}, {j})")),
                }
            }
            ui.vertical(|ui| {
                ui.label(egui::RichText::new("weight").weak());
                ui.label(egui::RichText::new(exponents_text(&dream.monomial())).monospace().strong());
                ui.add_space(6.0);
                ui.label(egui::RichText::new("reading word").weak());
                let word: Vec<String> = dream.reading_word().iter().map(|a| a.to_string()).collect();
                ui.label(egui::RichText::new(word.join(" ")).monospace());
                ui.add_space(6.0);
                ui.label(egui::RichText::new("crosses").weak());
                let crosses: Vec<String> =
                    dream.crosses().iter().map(|(i, j)| format!("({i},{j})")).collect();
                ui.label(crosses.join(" "));
                ui.add_space(6.0);
                ui.weak("Click a cell with a dot: ladder move (or chute).\nShift-click: the inverse move.\nLeft/Right arrow keys step through the dreams.");
                if let Some(n) = &self.note {
                    ui.add_space(6.0);
                    ui.label(n);
                }
            });
        });
    }

    fn bumpless_ui(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx, w: &Perm) {
        let out = match self.bumpless.fetch(ctx.engine, JobKey::Bumpless(w.clone())) {
            Fetch::Ready(out) => out.clone(),
            Fetch::Running(f, _) => {
                computing(ui, "enumerating bumpless pipe dreams", f, &self.bumpless);
                return;
            }
            Fetch::Failed(e) => {
                let e = e.clone();
                if failed(ui, &e) {
                    self.bumpless.retry();
                }
                return;
            }
        };
        let Output::Bumpless(list) = out.as_ref() else {
            return;
        };
        if list.is_empty() {
            return;
        }
        let total = list.len();
        let look = Self::look(ctx);
        let place = &mut ctx.session.dreams;
        place.index = place.index.min(total - 1);
        let mut none = None;
        Self::stepper(ui, &mut place.index, total, &mut none);
        let d = &list[place.index];
        let key = SceneKey::Bumpless(w.clone(), place.index, look);
        let scene = match &self.scene {
            Some((k, s)) if *k == key => s.clone(),
            _ => {
                let s = Arc::new(bumpless_scene(d, &look));
                self.scene = Some((key, s.clone()));
                s
            }
        };
        ui.horizontal_top(|ui| {
            let side = (ui.available_height() - 8.0)
                .min(ui.available_width() - 300.0)
                .max(160.0);
            let opts = PaintOptions {
                highlight: self.hover_pipe.map(Tag::Pipe).into_iter().collect(),
                max_scale: 4.0,
                size: Some(egui::vec2(side, side)),
            };
            let r = scene_painter::show(ui, &scene, &opts);
            self.hover_pipe = match r.hovered_where(|t| matches!(t, Tag::Pipe(_))) {
                Some(Tag::Pipe(k)) => Some(k),
                _ => None,
            };
            ui.vertical(|ui| {
                ui.label(egui::RichText::new("weight (blank tiles)").weak());
                ui.label(
                    egui::RichText::new(exponents_text(&d.monomial()))
                        .monospace()
                        .strong(),
                );
                ui.add_space(6.0);
                let blanks: Vec<String> = d
                    .blanks()
                    .iter()
                    .map(|(i, j)| format!("({i},{j})"))
                    .collect();
                ui.label(egui::RichText::new("blank tiles").weak());
                ui.label(blanks.join(" "));
                ui.add_space(6.0);
                if *d == crate::math::pipes::bumpless::BumplessDream::rothe(w) {
                    ui.label(
                        "This is the Rothe dream: its blank tiles form the Rothe diagram of w.",
                    );
                }
                ui.weak("Left/Right arrow keys step through the dreams.");
            });
        });
    }
}
