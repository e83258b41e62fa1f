//! Hessenberg classes: pick h by clicking boxes of an n×n grid (only valid
//! Hessenberg functions can be made), compute the table a^h_w = DS_h(S_w) on
//! the engine with progress and cancel, and browse it sorted by any column;
//! clicking a row makes w current everywhere.

use super::computing;
use crate::engine::{Fetch, JobKey, Slot};
use crate::gui::AppCtx;
use crate::gui::table_source::TableSource;
use crate::math::Perm;
use crate::math::hessenberg::function::{default_values, set_value};
use crate::math::hessenberg::table::TableEntry;
use crate::session::model::SortColumn;
use crate::tables::results::hessenberg_table;
use crate::tables::table::Table;
use eframe::egui::{self, Rect, Sense, Stroke, Vec2};
use num_traits::{Signed, Zero};
use std::sync::Arc;

/// Tables up to this n start as soon as h changes; larger ones wait for the button.
const AUTO_N: usize = 7;

/// The Hessenberg view's UI state.
#[derive(Default)]
pub struct HessenbergView {
    slot: Slot,
    /// The h whose table was asked for.
    pub wanted: Option<Vec<usize>>,
    order: Option<(Vec<usize>, String, bool, Vec<usize>)>,
    /// The summary line of the result shown (totals over every row, so kept).
    summary: Option<(Vec<usize>, String)>,
    /// The table shown (keyed by h), for export.
    export: TableSource<Vec<usize>>,
}

impl HessenbergView {
    /// The tables this view can export: the coefficients a^h_w on screen.
    pub fn tables(&mut self) -> Vec<(String, Arc<Table>)> {
        self.export
            .table(|_, out| out.hessenberg().map(hessenberg_table))
            .map(|(_, t)| ("the table of a^h_w".to_string(), t))
            .into_iter()
            .collect()
    }

    /// Draws the view.
    pub fn ui(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx) {
        let place = &mut ctx.session.hessenberg;
        if place.h.is_empty() {
            place.h = default_values(ctx.session.n.clamp(2, 12));
        }
        let mut n = place.h.len();
        ui.horizontal(|ui| {
            ui.heading("Hessenberg classes");
            ui.separator();
            ui.label("n");
            if ui.add(egui::DragValue::new(&mut n).range(2..=12)).changed() {
                place.h = default_values(n);
            }
            let text: Vec<String> = place.h.iter().map(|v| v.to_string()).collect();
            ui.label(format!("h = ({})", text.join(", ")));
            let dim: usize = place.h.iter().enumerate().map(|(k, v)| v - (k + 1)).sum();
            ui.label(format!("|h| = {dim}"));
            if ui.button("h(i) = i + 1").clicked() {
                place.h = default_values(n);
            }
            if ui.button("h(i) = n").clicked() {
                place.h = vec![n; n];
            }
        });
        ui.weak("Click a box (i, j) above the diagonal to set h(i) = j; click the last box of a row to shrink it. The class of the Hessenberg variety is Σ a^h_w σ_{w0 w}, a^h_w = DS_h(S_w) over ℓ(w) = |h|.");
        ui.horizontal_top(|ui| {
            self.grid(ui, &mut ctx.session.hessenberg.h);
            ui.vertical(|ui| self.table(ui, ctx));
        });
    }

    fn grid(&mut self, ui: &mut egui::Ui, h: &mut [usize]) {
        let n = h.len();
        let cell = (220.0 / n as f32).clamp(18.0, 34.0);
        let (rect, response) =
            ui.allocate_exact_size(Vec2::splat(cell * n as f32 + 2.0), Sense::click());
        let painter = ui.painter_at(rect);
        let visuals = ui.visuals();
        let on = visuals.selection.bg_fill;
        let off = visuals.extreme_bg_color;
        let line = Stroke::new(1.0, visuals.widgets.noninteractive.bg_stroke.color);
        let hover = response.hover_pos();
        for i in 1..=n {
            for j in 1..=n {
                let min =
                    rect.min + Vec2::new((j - 1) as f32 * cell + 1.0, (i - 1) as f32 * cell + 1.0);
                let r = Rect::from_min_size(min, Vec2::splat(cell));
                let inside = j <= h[i - 1];
                let fill = if j < i {
                    visuals.faint_bg_color
                } else if inside {
                    on
                } else {
                    off
                };
                painter.rect_filled(r.shrink(1.0), 2.0, fill);
                painter.rect_stroke(r.shrink(1.0), 2.0, line, egui::StrokeKind::Inside);
                if j == i {
                    painter.circle_filled(r.center(), cell * 0.12, visuals.text_color());
                }
                if hover.is_some_and(|p| r.contains(p)) && j >= i {
                    painter.rect_stroke(
                        r.shrink(1.0),
                        2.0,
                        Stroke::new(2.0, visuals.strong_text_color()),
                        egui::StrokeKind::Inside,
                    );
                }
                if response.clicked()
                    && let Some(p) = response.hover_pos()
                    && r.contains(p)
                    && j >= i
                {
                    if j == h[i - 1] && j > i {
                        set_value(h, i, j - 1);
                    } else {
                        set_value(h, i, j);
                    }
                }
            }
        }
    }

    fn table(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx) {
        let h = ctx.session.hessenberg.h.clone();
        let n = h.len();
        ui.horizontal(|ui| {
            if ui.button("compute the table").clicked() {
                self.wanted = Some(h.clone());
                self.slot.retry();
            }
            if n <= AUTO_N {
                ui.weak("(computed as h changes for n <= 7)");
            }
        });
        if n <= AUTO_N {
            self.wanted = Some(h.clone());
        }
        let Some(wanted) = self.wanted.clone() else {
            ui.weak("press the button to compute");
            return;
        };
        if wanted != h {
            ui.weak(format!(
                "showing h = {wanted:?}; press the button for the new h"
            ));
        }
        let out = match self
            .slot
            .fetch(ctx.engine, JobKey::Hessenberg(wanted.clone()))
        {
            Fetch::Ready(out) => out.clone(),
            Fetch::Running(f, secs) => {
                computing(ui, &format!("computing a^h_w ({secs:.0} s)"), f, &self.slot);
                return;
            }
            Fetch::Failed(e) => {
                let e = e.clone();
                if super::failed(ui, &e) {
                    self.slot.retry();
                }
                return;
            }
        };
        let Some(table) = out.hessenberg() else {
            return;
        };
        self.export.show(&wanted, &out);
        if self.summary.as_ref().is_none_or(|(k, _)| *k != wanted) {
            let negatives = table
                .entries
                .iter()
                .filter(|e| e.value.is_negative())
                .count();
            let text = format!(
                "{} permutations of length {}; Σ a^h_w = {}; nonzero {}; largest {}; negative {}",
                table.listed,
                table.h.dimension(),
                table.total(),
                table.nonzero(),
                table.max(),
                negatives
            );
            self.summary = Some((wanted.clone(), text));
        }
        if let Some((_, text)) = &self.summary {
            ui.label(text.as_str());
        }
        ui.weak("Ctrl+E exports this table as CSV or as a LaTeX tabular.");
        // sort order, cached per (h, column, direction)
        let current = ctx.perm();
        let place = &mut ctx.session.hessenberg;
        let col = place.sort_by.unwrap_or_default().key().to_string();
        let needs = self
            .order
            .as_ref()
            .is_none_or(|(hh, c, d, _)| *hh != wanted || *c != col || *d != place.descending);
        if needs {
            let mut idx: Vec<usize> = (0..table.entries.len()).collect();
            let e = &table.entries;
            match col.as_str() {
                "value" => idx.sort_by(|&a, &b| e[a].value.cmp(&e[b].value).then(a.cmp(&b))),
                "length" => idx.sort_by_key(|&a| (e[a].perm.length(), a)),
                _ => idx.sort_by(|&a, &b| e[a].perm.cmp(&e[b].perm)),
            }
            if place.descending {
                idx.reverse();
            }
            self.order = Some((wanted.clone(), col.clone(), place.descending, idx));
        }
        let Some((_, _, _, idx)) = &self.order else {
            return;
        };
        let mut chosen: Option<Perm> = None;
        let widths = [120.0, 60.0, 140.0];
        ui.horizontal(|ui| {
            for (k, (key, name)) in [("perm", "w"), ("length", "ℓ(w)"), ("value", "a^h_w")]
                .into_iter()
                .enumerate()
            {
                let arrow = if col == key {
                    if place.descending {
                        " (desc)"
                    } else {
                        " (asc)"
                    }
                } else {
                    ""
                };
                let b = ui.add_sized(
                    [widths[k], ui.spacing().interact_size.y],
                    egui::Button::new(format!("{name}{arrow}")),
                );
                if b.clicked() {
                    if col == key {
                        place.descending = !place.descending;
                    } else {
                        place.sort_by = SortColumn::from_key(key);
                        place.descending = key == "value";
                    }
                }
            }
        });
        let row_h = ui.spacing().interact_size.y;
        egui::ScrollArea::vertical()
            .id_salt("hessenberg_rows")
            .auto_shrink([false, false])
            .show_rows(ui, row_h, idx.len(), |ui, rows| {
                for r in rows {
                    let Some(entry): Option<&TableEntry> =
                        idx.get(r).and_then(|&i| table.entries.get(i))
                    else {
                        continue;
                    };
                    ui.horizontal(|ui| {
                        let sel = ui.add_sized(
                            [widths[0], row_h],
                            egui::Button::selectable(
                                entry.perm == current,
                                egui::RichText::new(entry.perm.to_string()).monospace(),
                            ),
                        );
                        if sel.clicked() {
                            chosen = Some(entry.perm.clone());
                        }
                        ui.add_sized(
                            [widths[1], row_h],
                            egui::Label::new(entry.perm.length().to_string()),
                        );
                        let text = egui::RichText::new(entry.value.to_string()).monospace();
                        let text = if entry.value.is_negative() {
                            text.color(crate::gui::theme::alert())
                        } else if entry.value.is_zero() {
                            text.weak()
                        } else {
                            text
                        };
                        ui.add_sized([widths[2], row_h], egui::Label::new(text));
                    });
                }
            });
        if let Some(w) = chosen {
            ctx.go_to(w);
        }
    }
}
