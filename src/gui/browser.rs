//! The list of all of S_n, filtered by length and class and sorted, drawn
//! virtually (only the visible rows); the list and the pipe-dream counts of the
//! visible rows are computed by the engine.

use super::app_ctx::AppCtx;
use crate::engine::{BrowseKey, Fetch, JobKey, Slot};
use crate::math::Perm;
use crate::math::perms::class::PermClass;
use eframe::egui;
use std::collections::HashMap;

/// Rows per block of pipe-dream counts asked of the engine.
const PAGE: usize = 48;

/// The browser's UI state.
#[derive(Default)]
pub struct Browser {
    list: Slot,
    pages: HashMap<usize, Slot>,
    pages_for: Option<BrowseKey>,
}

impl Browser {
    /// The filter the session asks for.
    fn key(ctx: &AppCtx) -> BrowseKey {
        let n = ctx.session.n.clamp(1, 9);
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
        if self.pages_for.as_ref() != Some(&key) {
            self.pages.clear();
            self.pages_for = Some(key.clone());
        }
        let perms = match self.list.fetch(ctx.engine, JobKey::Browse(key)) {
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
            "{} permutations; w, ℓ(w), number of pipe dreams",
            perms.len()
        ));
        let row_h = ui
            .text_style_height(&egui::TextStyle::Monospace)
            .max(ui.spacing().interact_size.y);
        let mut chosen = None;
        egui::ScrollArea::vertical()
            .id_salt("perm_list")
            .auto_shrink([false, false])
            .show_rows(ui, row_h, perms.len(), |ui, rows| {
                let first_page = rows.start / PAGE;
                let last_page = rows.end.saturating_sub(1) / PAGE;
                // forget unfinished blocks that scrolled away (dropping cancels them)
                self.pages
                    .retain(|p, s| (first_page..=last_page).contains(p) || !s.is_running());
                let mut counts: HashMap<usize, Option<std::sync::Arc<crate::engine::Output>>> =
                    HashMap::new();
                for page in first_page..=last_page {
                    let block: Vec<Perm> =
                        perms.iter().skip(page * PAGE).take(PAGE).cloned().collect();
                    let slot = self.pages.entry(page).or_default();
                    let got = match slot.fetch(ctx.engine, JobKey::Counts(block)) {
                        Fetch::Ready(out) => Some(out.clone()),
                        _ => None,
                    };
                    counts.insert(page, got);
                }
                for row in rows {
                    let Some(w) = perms.get(row) else { continue };
                    let page = row / PAGE;
                    let count = counts
                        .get(&page)
                        .and_then(|o| o.as_ref())
                        .and_then(|out| out.counts())
                        .and_then(|c| c.get(row - page * PAGE))
                        .map_or("...".to_string(), |c| c.to_string());
                    ui.horizontal(|ui| {
                        let text = egui::RichText::new(w.to_string()).monospace();
                        if ui.selectable_label(w == current, text).clicked() {
                            chosen = Some(w.clone());
                        }
                        ui.label(format!("{:>3}", w.length()));
                        ui.weak(count);
                    });
                }
            });
        if let Some(w) = chosen {
            ctx.go_to(w);
        }
    }
}
