//! The pipe-dream canvas: the staircase with pipes coloured by label, "k of N"
//! with arrow-key stepping, hover to follow a pipe, click a cell to apply a
//! ladder (or chute) move there, the dream's monomial and reading word; and a
//! switch to bumpless pipe dreams. The dots of the moves and the lit pipe are
//! marks for the canvas: an export leaves them out unless asked for.

use super::{arrow_step, fetch_ready, figure_look};
use crate::engine::requests::DREAM_LIMIT;
use crate::engine::{JobKey, Output, Slot};
use crate::figure::bumpless::bumpless_scene;
use crate::figure::dream::dream_scene;
use crate::figure::look::Look;
use crate::figure::{Scene, Tag};
use crate::gui::AppCtx;
use crate::gui::files::{Exportable, Exports};
use crate::gui::scene_painter::{self, PaintOptions, SceneResponse, halo_color, with_highlight};
use crate::gui::typeset::{self, Typeset};
use crate::math::Perm;
use crate::math::pipes::bumpless::BumplessDream;
use crate::math::pipes::dream::PipeDream;
use crate::math::pipes::moves::MoveKind;
use crate::math::poly::mono::exponents_text;
use eframe::egui;
use std::sync::Arc;

/// The dream view's UI state.
#[derive(Default)]
pub struct DreamsView {
    reduced: Slot,
    bumpless: Slot,
    /// A dream reached by a move that is not in the list (shown instead of the indexed one).
    moved_off_list: Option<PipeDream>,
    /// The scene on screen and the same figure without the move dots.
    scene: Option<(SceneKey, Arc<Scene>, Arc<Scene>)>,
    hover_pipe: Option<usize>,
    /// What the last click on the canvas did.
    pub click_note: Option<String>,
    /// The dream shown after that click: the note goes once another is shown.
    note_for: Option<PipeDream>,
    /// The dream drawn in the last frame.
    pub shown: Option<PipeDream>,
    /// Where the canvas was drawn in the last frame: its rectangle and screen points per figure unit.
    pub canvas: Option<(egui::Rect, f32)>,
    /// Which dream is on screen, in words for the export's name
    /// ("pipe dream 3 of 14 of w = 15432").
    shown_name: String,
}

/// What the scene on screen draws.
#[derive(Clone, PartialEq)]
enum SceneKey {
    Dream(PipeDream, Look),
    Bumpless(Perm, usize, Look),
}

/// "|< < k of N > >|" with the arrow keys; a step forgets the dream reached by a move.
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

/// The cells where a ladder or chute move starts: the dots drawn on the dream.
fn move_hints(dream: &PipeDream) -> Vec<(usize, usize)> {
    let mut v: Vec<(usize, usize)> = dream
        .available_moves()
        .iter()
        .filter(|m| matches!(m.kind, MoveKind::Ladder | MoveKind::Chute))
        .map(|m| m.from)
        .collect();
    v.dedup();
    v
}

/// The dream a click on cell (i, j) moves to, and the move's name: a ladder
/// move, else a chute move; with `inverse`, the inverse moves.
fn move_at(
    dream: &PipeDream,
    i: usize,
    j: usize,
    inverse: bool,
) -> Option<(PipeDream, &'static str)> {
    if inverse {
        dream
            .ladder_back_at(i, j)
            .map(|d| (d, "inverse ladder"))
            .or_else(|| dream.chute_back_at(i, j).map(|d| (d, "inverse chute")))
    } else {
        dream
            .ladder_move_at(i, j)
            .map(|d| (d, "ladder"))
            .or_else(|| dream.chute_move_at(i, j).map(|d| (d, "chute")))
    }
}

/// Beside a reduced dream: its weight, reading word and crosses, how to use the canvas, the last click's note.
fn dream_facts(ui: &mut egui::Ui, dream: &PipeDream, note: Option<&String>) {
    ui.vertical(|ui| {
        ui.label(egui::RichText::new("weight").weak());
        let weight = exponents_text(&dream.monomial());
        typeset::math_label(ui, &Typeset::new().poly(&weight).strong(), &weight);
        ui.add_space(6.0);
        ui.label(egui::RichText::new("reading word").weak());
        let word: Vec<String> = dream.reading_word().iter().map(|a| a.to_string()).collect();
        ui.label(egui::RichText::new(word.join(" ")).monospace());
        ui.add_space(6.0);
        ui.label(egui::RichText::new("crosses").weak());
        let crosses: Vec<String> = dream
            .crosses()
            .iter()
            .map(|(i, j)| format!("({i},{j})"))
            .collect();
        ui.label(crosses.join(" "));
        ui.add_space(6.0);
        ui.weak("Click a cell with a dot: ladder move (or chute).\nShift-click: the inverse move.\nLeft/Right arrow keys step through the dreams.");
        if let Some(n) = note {
            ui.add_space(6.0);
            ui.label(n);
        }
    });
}

/// Beside a bumpless dream: its weight and blank tiles, and whether it is the Rothe dream of w.
fn bumpless_facts(ui: &mut egui::Ui, d: &BumplessDream, w: &Perm) {
    ui.vertical(|ui| {
        ui.label(egui::RichText::new("weight (blank tiles)").weak());
        let weight = exponents_text(&d.monomial());
        typeset::math_label(ui, &Typeset::new().poly(&weight).strong(), &weight);
        ui.add_space(6.0);
        let blanks: Vec<String> = d
            .blanks()
            .iter()
            .map(|(i, j)| format!("({i},{j})"))
            .collect();
        ui.label(egui::RichText::new("blank tiles").weak());
        ui.label(blanks.join(" "));
        ui.add_space(6.0);
        if *d == BumplessDream::rothe(w) {
            ui.label("This is the Rothe dream: its blank tiles form the Rothe diagram of w.");
        }
        ui.weak("Left/Right arrow keys step through the dreams.");
    });
}

impl DreamsView {
    /// The figures this view can export: the dream on screen, without the
    /// move dots and the lit pipe unless the export asks for them.
    pub fn figures(&self) -> Exports {
        self.scene
            .iter()
            .map(|(key, shown, clean)| {
                let (look, marks) = match key {
                    SceneKey::Dream(_, look) => (look, "move dots, the lit pipe"),
                    SceneKey::Bumpless(_, _, look) => (look, "the lit pipe"),
                };
                let lit: Vec<Tag> = self.hover_pipe.map(Tag::Pipe).into_iter().collect();
                let marked = if lit.is_empty() {
                    shown.clone()
                } else {
                    Arc::new(with_highlight(shown, &lit, halo_color(look)))
                };
                let item = Exportable::Marked {
                    clean: clean.clone(),
                    marked,
                    marks,
                };
                (format!("the {}", self.shown_name), item)
            })
            .collect()
    }

    /// Draws the view.
    fn show(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx) {
        let w = ctx.perm();
        ui.horizontal(|ui| {
            let model = if ctx.session.dreams.bumpless {
                "Bumpless pipe dreams"
            } else {
                "Reduced pipe dreams"
            };
            ui.heading(format!("{model} of w = {w}"));
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
            self.bumpless_dreams(ui, ctx, &w);
        } else {
            self.reduced_dreams(ui, ctx, &w);
        }
    }

    /// The reduced pipe dreams of w: the stepper, the canvas (hover a pipe,
    /// click a cell to move) and the dream's facts.
    fn reduced_dreams(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx, w: &Perm) {
        let Some(out) = fetch_ready(
            ui,
            &mut self.reduced,
            ctx.engine,
            JobKey::PipeDreams(w.clone()),
            |_| "enumerating pipe dreams".into(),
        ) else {
            return;
        };
        let Some(dreams) = out.dreams() else { return };
        if dreams.is_empty() {
            return;
        }
        let total = dreams.len();
        let look = figure_look(ctx.session);
        let place = &mut ctx.session.dreams;
        place.index = place.index.min(total - 1);
        if self
            .moved_off_list
            .as_ref()
            .is_some_and(|m| m.permutation() != *w)
        {
            self.moved_off_list = None;
        }
        stepper(ui, &mut place.index, total, &mut self.moved_off_list);
        if total == DREAM_LIMIT {
            ui.weak(format!("only the first {DREAM_LIMIT} dreams are listed"));
        }
        let dream = self.moved_off_list.unwrap_or(dreams[place.index]);
        self.shown_name = match self.moved_off_list {
            Some(_) => format!("pipe dream of w = {w} reached by a move"),
            None => format!("pipe dream {} of {total} of w = {w}", place.index + 1),
        };
        if self.note_for != Some(dream) {
            // another dream (a step, another permutation): the note was about an older one
            self.click_note = None;
        }
        let scene = self.scene_for(SceneKey::Dream(dream, look), || {
            (
                dream_scene(&dream, &look, &move_hints(&dream)),
                Some(dream_scene(&dream, &look, &[])),
            )
        });
        ui.horizontal_top(|ui| {
            let r = self.show_canvas(ui, &scene);
            self.canvas = Some((r.response.rect, r.scale));
            self.shown = Some(dream);
            let shift = ui.input(|inp| inp.modifiers.shift);
            let hovered_move = match r.hovered_where(|t| matches!(t, Tag::Cell(..))) {
                Some(Tag::Cell(i, j)) => move_at(&dream, i, j, shift).map(|(_, kind)| (i, j, kind)),
                _ => None,
            };
            if let Some((i, j, kind)) = hovered_move {
                r.response.clone().on_hover_text(format!(
                    "a click makes the {kind} move at ({i}, {j}){}",
                    if shift {
                        ""
                    } else {
                        "; Shift+click, the inverse move"
                    }
                ));
            } else if let Some(k) = self.hover_pipe {
                r.response.clone().on_hover_text(format!(
                    "pipe {k}: enters row {k}, leaves column {}",
                    w.at(k)
                ));
            }
            if let Some(Tag::Cell(i, j)) = r.clicked_where(|t| matches!(t, Tag::Cell(..))) {
                let inverse = ui.input(|inp| inp.modifiers.shift);
                self.click_cell(
                    &dream,
                    (i, j),
                    inverse,
                    dreams,
                    &mut ctx.session.dreams.index,
                );
            }
            dream_facts(ui, &dream, self.click_note.as_ref());
        });
    }

    /// Applies the move a click on cell (i, j) asks for, if there is one, and
    /// notes what it did; stepping continues from the new dream when it is in the list.
    fn click_cell(
        &mut self,
        dream: &PipeDream,
        (i, j): (usize, usize),
        inverse: bool,
        dreams: &[PipeDream],
        index: &mut usize,
    ) {
        match move_at(dream, i, j, inverse) {
            Some((d, kind)) => {
                self.click_note = Some(format!("{kind} move at ({i}, {j})"));
                self.note_for = Some(d);
                // find the new dream in the list so stepping continues from it
                if let Some(k) = dreams.iter().position(|e| *e == d) {
                    *index = k;
                    self.moved_off_list = None;
                } else {
                    self.moved_off_list = Some(d);
                }
            }
            None => {
                self.click_note = Some(format!("no move at ({i}, {j})"));
                self.note_for = Some(*dream);
            }
        }
    }

    /// The bumpless pipe dreams of w: the stepper, the canvas (hover a pipe) and the dream's facts.
    fn bumpless_dreams(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx, w: &Perm) {
        let Some(out) = fetch_ready(
            ui,
            &mut self.bumpless,
            ctx.engine,
            JobKey::Bumpless(w.clone()),
            |_| "enumerating bumpless pipe dreams".into(),
        ) else {
            return;
        };
        let Output::Bumpless(list) = out.as_ref() else {
            return;
        };
        if list.is_empty() {
            return;
        }
        let total = list.len();
        let look = figure_look(ctx.session);
        let place = &mut ctx.session.dreams;
        place.index = place.index.min(total - 1);
        let mut none = None;
        stepper(ui, &mut place.index, total, &mut none);
        let d = &list[place.index];
        self.shown_name = format!(
            "bumpless pipe dream {} of {total} of w = {w}",
            place.index + 1
        );
        let key = SceneKey::Bumpless(w.clone(), place.index, look);
        let scene = self.scene_for(key, || (bumpless_scene(d, &look), None));
        ui.horizontal_top(|ui| {
            self.show_canvas(ui, &scene);
            bumpless_facts(ui, d, w);
        });
    }

    /// The scene for `key`, drawn again by `draw` only when the key changed;
    /// `draw` gives the scene on screen and, if it has marks, the clean one.
    fn scene_for(
        &mut self,
        key: SceneKey,
        draw: impl FnOnce() -> (Scene, Option<Scene>),
    ) -> Arc<Scene> {
        match &self.scene {
            Some((k, s, _)) if *k == key => s.clone(),
            _ => {
                let (shown, clean) = draw();
                let shown = Arc::new(shown);
                let clean = clean.map_or_else(|| shown.clone(), Arc::new);
                self.scene = Some((key, shown.clone(), clean));
                shown
            }
        }
    }

    /// Draws the dream's canvas (square, beside room for the facts) with the
    /// hovered pipe lit, and notes which pipe the pointer is on.
    fn show_canvas(&mut self, ui: &mut egui::Ui, scene: &Scene) -> SceneResponse {
        // the facts beside the drawing take at most 300 points, less in a
        // narrow window (a large zoom, the notes open): the drawing keeps most
        let facts = (ui.available_width() * 0.3).min(300.0);
        let side = (ui.available_height() - 8.0)
            .min(ui.available_width() - facts)
            .max(160.0);
        let opts = PaintOptions {
            highlight: self.hover_pipe.map(Tag::Pipe).into_iter().collect(),
            max_scale: 4.0,
            size: Some(egui::vec2(side, side)),
        };
        let r = scene_painter::show(ui, scene, &opts);
        self.hover_pipe = match r.hovered_where(|t| matches!(t, Tag::Pipe(_))) {
            Some(Tag::Pipe(k)) => Some(k),
            _ => None,
        };
        r
    }
}

impl super::View for DreamsView {
    fn kind(&self) -> crate::session::model::View {
        crate::session::model::View::Dreams
    }

    fn title(&self) -> &'static str {
        "Pipe dreams"
    }

    fn ui(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx) {
        self.show(ui, ctx);
    }

    fn session_replaced(&mut self) {
        self.moved_off_list = None;
        self.click_note = None;
        self.note_for = None;
    }

    fn exports(&mut self, _session: &crate::session::Session) -> crate::gui::files::Exports {
        self.figures()
    }
}
