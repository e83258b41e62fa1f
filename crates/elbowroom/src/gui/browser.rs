//! The list of all of S_n, filtered by length and class and sorted, drawn
//! virtually (only the visible rows); the list and the pipe-dream counts of the
//! visible rows are computed by the engine.

use super::app_ctx::AppCtx;
use crate::engine::requests::BROWSE_MAX_N;
use crate::engine::{BrowseKey, Engine, Fetch, JobKey, Output, Slot};
use crate::math::Perm;
use crate::math::perms::class::PermClass;
use eframe::egui;
use std::collections::HashMap;
use std::ops::RangeInclusive;
use std::sync::Arc;

/// Rows per block of pipe-dream counts asked of the engine.
const COUNT_BLOCK: usize = 48;

/// The browser's UI state.
#[derive(Default)]
pub struct Browser {
    perms: Slot,
    /// The pipe-dream counts of the rows, one request per block of [`COUNT_BLOCK`] rows.
    count_blocks: HashMap<usize, Slot>,
    /// The filter the blocks were asked for.
    blocks_for: Option<BrowseKey>,
}

/// The range of lengths shown.
fn length_filter(ui: &mut egui::Ui, ctx: &mut AppCtx, key: &BrowseKey, top: usize) {
    ui.horizontal(|ui| {
        let mut lo = key.min_length;
        let mut hi = key.max_length;
        ui.label("ℓ from");
        if ui
            .add(egui::DragValue::new(&mut lo).range(0..=top))
            .changed()
        {
            ctx.session.browser.min_length = Some(lo);
        }
        ui.label("to");
        if ui
            .add(egui::DragValue::new(&mut hi).range(0..=top))
            .changed()
        {
            ctx.session.browser.max_length = Some(hi);
        }
    });
}

/// The class shown and the order of the list.
fn class_and_order(ui: &mut egui::Ui, ctx: &mut AppCtx, key: &BrowseKey) {
    ui.horizontal(|ui| {
        let shown = key.class.map_or("any class", |c| c.label());
        egui::ComboBox::from_id_salt("class_filter")
            .selected_text(shown)
            .show_ui(ui, |ui| {
                if ui
                    .selectable_label(key.class.is_none(), "any class")
                    .clicked()
                {
                    ctx.session.browser.class = None;
                }
                for c in PermClass::ALL {
                    if ui
                        .selectable_label(key.class == Some(c), c.label())
                        .clicked()
                    {
                        ctx.session.browser.class = Some(c.key().to_string());
                    }
                }
            });
        let order = if key.by_length {
            "by length"
        } else {
            "lexicographic"
        };
        egui::ComboBox::from_id_salt("sort_order")
            .selected_text(order)
            .show_ui(ui, |ui| {
                ui.selectable_value(&mut ctx.session.browser.by_length, false, "lexicographic");
                ui.selectable_value(&mut ctx.session.browser.by_length, true, "by length");
            });
    });
}

/// One row: w (a click picks it), ℓ(w) and its number of pipe dreams
/// (`...` until counted); true if w was clicked.
fn perm_row(ui: &mut egui::Ui, w: &Perm, current: &Perm, count: String) -> bool {
    ui.horizontal(|ui| {
        let text = egui::RichText::new(w.to_string()).monospace();
        let clicked = ui.selectable_label(w == current, text).clicked();
        ui.label(format!("{:>3}", w.length()));
        ui.weak(count);
        clicked
    })
    .inner
}

impl Browser {
    /// The filter the session asks for.
    fn key(ctx: &AppCtx) -> BrowseKey {
        let n = ctx.session.n.clamp(1, crate::math::MAX_N);
        let top = n * (n - 1) / 2;
        let place = &ctx.session.browser;
        BrowseKey {
            n,
            min_length: place.min_length.unwrap_or(0).min(top),
            max_length: place.max_length.unwrap_or(top).min(top),
            class: place.class.as_deref().and_then(PermClass::from_key),
            by_length: place.by_length,
        }
    }

    /// Draws the filter controls and the list.
    pub fn ui(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx, current: &Perm) {
        let key = Self::key(ctx);
        let top = key.n * (key.n - 1) / 2;
        ui.heading(format!("All of S_{}", key.n));
        if key.n > BROWSE_MAX_N {
            self.perms.clear();
            ui.weak(format!(
                "S_{} has {} permutations; the list is shown for n up to {BROWSE_MAX_N}. Type a permutation above, or step to w·s_i and s_i·w.",
                key.n,
                crate::gui::typeset::grouped(&(1..=key.n as u128).product::<u128>().to_string())
            ));
            return;
        }
        length_filter(ui, ctx, &key, top);
        class_and_order(ui, ctx, &key);
        if self.blocks_for.as_ref() != Some(&key) {
            self.count_blocks.clear();
            self.blocks_for = Some(key.clone());
        }
        let perms = match self.perms.fetch(ctx.engine, JobKey::Browse(key)) {
            Fetch::Ready(out) => out.clone(),
            Fetch::Running(f, _) => {
                ui.add(egui::ProgressBar::new(f).text("listing"));
                return;
            }
            Fetch::Failed(e) => {
                ui.colored_label(super::theme::alert(), e.to_string());
                return;
            }
        };
        let Some(perms) = perms.perms() else { return };
        ui.weak(format!(
            "{} permutation{}; w, ℓ(w), number of pipe dreams",
            perms.len(),
            if perms.len() == 1 { "" } else { "s" }
        ));
        if let Some(w) = self.rows(ui, ctx.engine, perms, current) {
            ctx.go_to(w);
        }
    }

    /// The list, drawn virtually, with the counts of the visible rows; the w clicked, if any.
    fn rows(
        &mut self,
        ui: &mut egui::Ui,
        engine: &Engine,
        perms: &[Perm],
        current: &Perm,
    ) -> Option<Perm> {
        let row_h = ui
            .text_style_height(&egui::TextStyle::Monospace)
            .max(ui.spacing().interact_size.y);
        let mut chosen = None;
        egui::ScrollArea::vertical()
            .id_salt("perm_list")
            .auto_shrink([false, false])
            .show_rows(ui, row_h, perms.len(), |ui, rows| {
                let first_block = rows.start / COUNT_BLOCK;
                let last_block = rows.end.saturating_sub(1) / COUNT_BLOCK;
                let counts = self.counts(engine, perms, first_block..=last_block);
                for row in rows {
                    let Some(w) = perms.get(row) else { continue };
                    let block = row / COUNT_BLOCK;
                    let count = counts
                        .get(&block)
                        .and_then(|o| o.as_ref())
                        .and_then(|out| out.counts())
                        .and_then(|c| c.get(row - block * COUNT_BLOCK))
                        .map_or("...".to_string(), |c| c.to_string());
                    if perm_row(ui, w, current, count) {
                        chosen = Some(w.clone());
                    }
                }
            });
        chosen
    }

    /// The pipe-dream counts of the blocks `visible`, as far as computed;
    /// unfinished blocks that scrolled away are forgotten (dropping cancels them).
    fn counts(
        &mut self,
        engine: &Engine,
        perms: &[Perm],
        visible: RangeInclusive<usize>,
    ) -> HashMap<usize, Option<Arc<Output>>> {
        self.count_blocks
            .retain(|b, s| visible.contains(b) || !s.is_running());
        let mut counts = HashMap::new();
        for block in visible {
            let perms: Vec<Perm> = perms
                .iter()
                .skip(block * COUNT_BLOCK)
                .take(COUNT_BLOCK)
                .cloned()
                .collect();
            let slot = self.count_blocks.entry(block).or_default();
            let got = match slot.fetch(engine, JobKey::Counts(perms)) {
                Fetch::Ready(out) => Some(out.clone()),
                _ => None,
            };
            counts.insert(block, got);
        }
        counts
    }
}
