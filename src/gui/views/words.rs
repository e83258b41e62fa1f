//! Reduced words: the exact count, a paged list with content vectors, the
//! selected word drawn as a wiring diagram whose crossings light up with the
//! letters, and the commutation and braid moves available from it.

use super::{arrow_step, computing, failed};
use crate::engine::requests::WORD_PAGE;
use crate::engine::{Fetch, JobKey, Slot};
use crate::figure::Tag;
use crate::figure::look::Look;
use crate::figure::wiring::wiring_scene;
use crate::gui::AppCtx;
use crate::gui::scene_painter::{self, PaintOptions};
use crate::math::perms::words::{WordMove, apply_word_move, content, word_moves};
use eframe::egui;

/// The word view's UI state.
#[derive(Default)]
pub struct WordsView {
    count: Slot,
    page: Slot,
    /// A word reached by a move (shown instead of the indexed one).
    moved: Option<Vec<usize>>,
    hover_crossing: Option<usize>,
    last: Option<std::sync::Arc<crate::figure::Scene>>,
}

fn word_text(word: &[usize]) -> String {
    let v: Vec<String> = word.iter().map(|a| a.to_string()).collect();
    v.join(" ")
}

impl WordsView {
    /// The figures this view can export: the wiring diagram on screen.
    pub fn figures(&self) -> Vec<(String, std::sync::Arc<crate::figure::Scene>)> {
        self.last
            .iter()
            .map(|s| ("the wiring diagram shown".to_string(), s.clone()))
            .collect()
    }

    /// Draws the view.
    pub fn ui(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx) {
        let w = ctx.perm();
        let n = w.n();
        ui.horizontal(|ui| {
            ui.heading(format!("Reduced words of w = {w}"));
            ui.separator();
            match self.count.fetch(ctx.engine, JobKey::WordCount(w.clone())) {
                Fetch::Ready(out) => {
                    if let Some(c) = out.count() {
                        ui.label(egui::RichText::new(format!("{c} reduced words")).strong());
                    }
                }
                Fetch::Running(..) => {
                    ui.spinner();
                }
                Fetch::Failed(e) => {
                    ui.colored_label(crate::gui::theme::alert(), e.to_string());
                }
            }
        });
        let total = self
            .count
            .latest()
            .and_then(|o| o.count())
            .and_then(|c| usize::try_from(c).ok());
        let index = &mut ctx.session.words.index;
        let step = arrow_step(ui);
        if step != 0 {
            self.moved = None;
            *index = index.saturating_add_signed(step);
            if let Some(t) = total {
                *index = (*index).min(t.saturating_sub(1));
            }
        }
        let page_no = *index / WORD_PAGE;
        let out = match self
            .page
            .fetch(ctx.engine, JobKey::Words(w.clone(), page_no))
        {
            Fetch::Ready(out) => out.clone(),
            Fetch::Running(f, _) => {
                computing(ui, "listing reduced words", f, &self.page);
                return;
            }
            Fetch::Failed(e) => {
                let e = e.clone();
                if failed(ui, &e) {
                    self.page.retry();
                }
                return;
            }
        };
        let Some(words) = out.words() else { return };
        if words.is_empty() {
            if *index > 0 {
                *index = 0;
            }
            return;
        }
        let in_page = (*index - page_no * WORD_PAGE).min(words.len() - 1);
        *index = page_no * WORD_PAGE + in_page;
        let word = self.moved.clone().unwrap_or_else(|| words[in_page].clone());
        let look = Look {
            dark: ctx.session.dark,
            labels: ctx.session.figure.labels,
        };
        ui.horizontal(|ui| {
            if ui
                .add_enabled(page_no > 0, egui::Button::new("< page"))
                .clicked()
            {
                *index = (page_no - 1) * WORD_PAGE;
                self.moved = None;
            }
            let shown_to = page_no * WORD_PAGE + words.len();
            ui.label(format!(
                "words {}–{} (lexicographic); selected {}",
                page_no * WORD_PAGE + 1,
                shown_to,
                *index + 1
            ));
            let more = words.len() == WORD_PAGE && total.is_none_or(|t| shown_to < t);
            if ui.add_enabled(more, egui::Button::new("page >")).clicked() {
                *index = (page_no + 1) * WORD_PAGE;
                self.moved = None;
            }
        });
        ui.separator();
        ui.horizontal_top(|ui| {
            // the list
            ui.vertical(|ui| {
                ui.set_width(260.0);
                ui.weak("word · content");
                let row_h = ui.spacing().interact_size.y;
                egui::ScrollArea::vertical()
                    .id_salt("word_list")
                    .max_height(ui.available_height() - 4.0)
                    .show_rows(ui, row_h, words.len(), |ui, rows| {
                        for r in rows {
                            let wd = &words[r];
                            let c: Vec<String> =
                                content(wd, n).iter().map(|c| c.to_string()).collect();
                            let text = egui::RichText::new(format!(
                                "{}   ({})",
                                word_text(wd),
                                c.join(",")
                            ))
                            .monospace();
                            if ui
                                .selectable_label(r == in_page && self.moved.is_none(), text)
                                .clicked()
                            {
                                *index = page_no * WORD_PAGE + r;
                                self.moved = None;
                            }
                        }
                    });
            });
            ui.separator();
            ui.vertical(|ui| {
                // the letters, in step with the crossings
                ui.horizontal_wrapped(|ui| {
                    ui.label("word");
                    for (k, a) in word.iter().enumerate() {
                        let lit = self.hover_crossing == Some(k);
                        let r = ui.selectable_label(
                            lit,
                            egui::RichText::new(a.to_string()).monospace().strong(),
                        );
                        if r.hovered() {
                            self.hover_crossing = Some(k);
                        }
                    }
                });
                let c: Vec<String> = content(&word, n).iter().map(|c| c.to_string()).collect();
                ui.label(format!("content ({})", c.join(", ")));
                let scene = wiring_scene(&word, n, &look, self.hover_crossing);
                self.last = Some(std::sync::Arc::new(wiring_scene(&word, n, &look, None)));
                let avail = ui.available_size();
                let opts = PaintOptions {
                    highlight: self.hover_crossing.map(Tag::Crossing).into_iter().collect(),
                    max_scale: 3.0,
                    size: Some(egui::vec2(avail.x, (avail.y * 0.6).max(120.0))),
                };
                let r = scene_painter::show(ui, &scene, &opts);
                if let Some(Tag::Crossing(k)) = r.hovered_where(|t| matches!(t, Tag::Crossing(_))) {
                    self.hover_crossing = Some(k);
                } else if r.response.hovered() {
                    self.hover_crossing = None;
                }
                ui.add_space(6.0);
                ui.label(egui::RichText::new("moves from this word").weak());
                let moves = word_moves(&word);
                if moves.is_empty() {
                    ui.weak("none: this is the only reduced word");
                }
                ui.horizontal_wrapped(|ui| {
                    for mv in moves {
                        let (label, at) = match mv {
                            WordMove::Commute { at } => (
                                format!("commute {} {} at {}", word[at], word[at + 1], at + 1),
                                at,
                            ),
                            WordMove::Braid { at } => (
                                format!(
                                    "braid {} {} {} at {}",
                                    word[at],
                                    word[at + 1],
                                    word[at + 2],
                                    at + 1
                                ),
                                at,
                            ),
                        };
                        let r = ui.button(label);
                        if r.hovered() {
                            self.hover_crossing = Some(at);
                        }
                        if r.clicked()
                            && let Ok(next) = apply_word_move(&word, mv)
                        {
                            // keep the list selection if the new word is on this page
                            match words.iter().position(|x| *x == next) {
                                Some(k) => {
                                    *index = page_no * WORD_PAGE + k;
                                    self.moved = None;
                                }
                                None => self.moved = Some(next),
                            }
                        }
                    }
                });
            });
        });
    }
}
