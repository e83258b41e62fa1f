//! The positivity survey inside the quotient view: the normal form modulo J_n
//! of S_w(x_n, ..., x_1) for every w in S_n, computed on the engine with
//! progress and cancel; a summary, the counterexamples (any negative
//! coefficient) first and marked, every row clickable to show that w's normal
//! form, and the table ready for export as CSV or LaTeX: the rows shown, in
//! the order shown, under a caption naming n and the listing.

use super::fetch_ready;
use crate::engine::requests::Output;
use crate::engine::{JobKey, Slot};
use crate::gui::AppCtx;
use crate::gui::table_source::TableSource;
use crate::gui::typeset::{self, Typeset};
use crate::math::Perm;
use crate::math::quotient::survey::HELD_SURVEY_MAX_N;
use crate::math::quotient::survey::SurveyEntry;
use crate::tables::results::survey_table;
use crate::tables::table::Table;
use eframe::egui;
use std::sync::Arc;

/// Surveys up to this n start as soon as the panel shows; S_8 waits for the button.
const AUTO_N: usize = 7;

/// The columns of the rows before the negative coefficients: header and width.
const COLUMNS: [(&str, f32); 5] = [
    ("w", 90.0),
    ("ℓ(w)", 40.0),
    ("terms", 50.0),
    ("sum", 60.0),
    ("≥ 0", 40.0),
];

/// The survey panel's UI state.
#[derive(Default)]
pub struct SurveyPanel {
    survey: Slot,
    /// The n whose survey was asked for.
    pub wanted: Option<usize>,
    /// Show only the counterexamples.
    pub only_counterexamples: bool,
    /// The summary line of the survey shown (a pass over every entry, so kept).
    summary: Option<(usize, String)>,
    /// The survey shown (keyed by n and "only counterexamples"), for export.
    export: TableSource<(usize, bool)>,
    /// Row order: counterexamples first, then lexicographic (indices into the
    /// entries), for the n and the "only counterexamples" setting it was made for.
    order: Option<(usize, bool, Vec<usize>)>,
}

/// The summary of a survey: how many permutations, and how many counterexamples.
fn summary_text(entries: &[SurveyEntry]) -> String {
    let bad = entries.iter().filter(|e| !e.nonnegative()).count();
    let count = match entries.len() {
        1 => "1 permutation".to_string(),
        k => format!("{k} permutations"),
    };
    if bad == 0 {
        format!("{count}: every normal form has nonnegative coefficients")
    } else {
        format!(
            "{count}: {bad} counterexample{} (a negative coefficient), listed first",
            if bad == 1 { "" } else { "s" }
        )
    }
}

/// The caption of an exported survey: what it is, n, which rows, their order.
pub fn survey_caption(n: usize, entries: &[SurveyEntry], only: bool, rows: usize) -> Vec<String> {
    let bad = entries.iter().filter(|e| !e.nonnegative()).count();
    let listing = if only {
        format!(
            "only the {bad} counterexamples (a negative coefficient) of the {} permutations",
            entries.len()
        )
    } else {
        format!(
            "all {} permutations, the {bad} counterexamples (a negative coefficient) first",
            entries.len()
        )
    };
    vec![format!(
        "Positivity survey in S_{n}: normal forms of S_w(x_{n}, ..., x_1) modulo J_{n} (lex order x_1 > ... > x_{n}), summary columns; {listing}, then lexicographic in w; {rows} rows"
    )]
}

/// The header of the rows.
fn header_row(ui: &mut egui::Ui) {
    ui.horizontal(|ui| {
        for (head, width) in COLUMNS {
            let line = Typeset::new().symbol(head).strong();
            let cell = ui.add_sized([width, 18.0], egui::Label::new(line.job(ui)));
            typeset::named(&cell, egui::Role::Label, &line);
        }
        ui.label(egui::RichText::new("negative coefficients").strong());
    });
}

/// One row: w (a click picks it), ℓ(w), the number of terms, the coefficient
/// sum, whether all are ≥ 0, and the negative terms, all alerted for a
/// counterexample; true if w was clicked.
fn survey_row(ui: &mut egui::Ui, e: &SurveyEntry, current: &Perm, n: usize) -> bool {
    let alert = !e.nonnegative();
    let text = |s: String| {
        let t = egui::RichText::new(s).monospace();
        if alert {
            t.color(crate::gui::theme::alert())
        } else {
            t
        }
    };
    let [perm_w, length_w, terms_w, sum_w, sign_w] = COLUMNS.map(|(_, width)| width);
    ui.horizontal(|ui| {
        let selected = e.perm == *current;
        let clicked = ui
            .add_sized(
                [perm_w, 18.0],
                egui::Button::selectable(selected, text(e.perm.to_string())),
            )
            .clicked();
        ui.add_sized(
            [length_w, 18.0],
            egui::Label::new(text(e.perm.length().to_string())),
        );
        ui.add_sized(
            [terms_w, 18.0],
            egui::Label::new(text(e.terms().to_string())),
        );
        ui.add_sized([sum_w, 18.0], egui::Label::new(text(e.sum().to_string())));
        let sign = if alert { "no" } else { "yes" };
        ui.add_sized([sign_w, 18.0], egui::Label::new(text(sign.to_string())));
        if alert {
            let mut line = Typeset::new().color(crate::gui::theme::alert());
            for (k, (m, c)) in e.negatives().iter().enumerate() {
                if k > 0 {
                    line = line.plain("  ");
                }
                line = line.plain(format!("{c}·")).poly(m.text(n));
            }
            typeset::label(ui, &line);
        }
        clicked
    })
    .inner
}

impl SurveyPanel {
    /// The tables this panel can export: the survey shown (without normal forms).
    pub fn tables(&mut self) -> Vec<(String, Arc<Table>)> {
        let order = &self.order;
        self.export
            .table(|&(n, only), out| {
                let Output::Survey(entries) = out else {
                    return None;
                };
                let (_, _, rows) = order.as_ref().filter(|(k, o, _)| *k == n && *o == only)?;
                Some(
                    survey_table(n, entries, true)
                        .reordered(rows)
                        .with_caption(survey_caption(n, entries, only, rows.len())),
                )
            })
            .map(|((n, _), t)| (format!("the positivity survey of S_{n}"), t))
            .into_iter()
            .collect()
    }

    /// Draws the panel for S_n; a click on a row makes that w current and
    /// returns true (the view then shows its normal form).
    pub fn ui(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx, n: usize) -> bool {
        if n > HELD_SURVEY_MAX_N {
            ui.colored_label(
                crate::gui::theme::alert(),
                format!(
                    "the window surveys n <= {HELD_SURVEY_MAX_N} (it keeps every normal form); for S_{n} run `elbowroom survey --n {n} --summary`"
                ),
            );
            return false;
        }
        let Some(wanted) = self.wanted_n(ui, n) else {
            ui.weak("press the button to survey");
            return false;
        };
        if wanted != n {
            ui.weak(format!("showing S_{wanted}; press the button for S_{n}"));
        }
        let Some(out) = fetch_ready(
            ui,
            &mut self.survey,
            ctx.engine,
            JobKey::Survey(wanted),
            |secs| {
                format!(
                    "reducing S_w(x{wanted}, ..., x1) over S_{wanted} ({})",
                    super::elapsed_text(secs)
                )
            },
        ) else {
            return false;
        };
        let Output::Survey(entries) = out.as_ref() else {
            return false;
        };
        if self.summary.as_ref().is_none_or(|(k, _)| *k != wanted) {
            self.summary = Some((wanted, summary_text(entries)));
        }
        if let Some((_, text)) = &self.summary {
            ui.label(egui::RichText::new(text.as_str()).strong());
        }
        ui.horizontal(|ui| {
            ui.checkbox(&mut self.only_counterexamples, "only counterexamples");
            ui.weak(
                "Click a row to see its normal form; Ctrl+E exports the table as CSV or LaTeX.",
            );
        });
        let order = self.order_for(wanted, entries);
        self.export
            .note_shown(&(wanted, self.only_counterexamples), &out);
        self.rows(ui, ctx, entries, &order, wanted)
    }

    /// The button "survey all of S_n" (and the automatic start for small n);
    /// the n whose survey was asked for, if any.
    fn wanted_n(&mut self, ui: &mut egui::Ui, n: usize) -> Option<usize> {
        ui.horizontal(|ui| {
            if ui.button(format!("survey all of S_{n}")).clicked() {
                self.wanted = Some(n);
                self.survey.retry();
            }
            if n <= AUTO_N {
                ui.weak(format!("(runs by itself for n <= {AUTO_N})"));
            }
        });
        if n <= AUTO_N {
            self.wanted = Some(n);
        }
        self.wanted
    }

    /// The rows to show in order: the counterexamples first (or only them),
    /// made again only when n or the setting changed.
    fn order_for(&mut self, n: usize, entries: &[SurveyEntry]) -> Vec<usize> {
        let only = self.only_counterexamples;
        if let Some((k, o, order)) = &self.order
            && *k == n
            && *o == only
        {
            return order.clone();
        }
        let bad = (0..entries.len()).filter(|&i| !entries[i].nonnegative());
        let order: Vec<usize> = if only {
            bad.collect()
        } else {
            bad.chain((0..entries.len()).filter(|&i| entries[i].nonnegative()))
                .collect()
        };
        self.order = Some((n, only, order.clone()));
        order
    }

    /// The header and the rows in `order`, drawn virtually; a click makes
    /// that w current and returns true.
    fn rows(
        &self,
        ui: &mut egui::Ui,
        ctx: &mut AppCtx,
        entries: &[SurveyEntry],
        order: &[usize],
        n: usize,
    ) -> bool {
        let mut picked = None;
        let current = ctx.perm();
        header_row(ui);
        egui::ScrollArea::vertical()
            .id_salt("survey_rows")
            .max_height(ui.available_height() - 4.0)
            .show_rows(
                ui,
                ui.spacing().interact_size.y,
                order.len(),
                |ui, range| {
                    for &i in &order[range] {
                        let e = &entries[i];
                        if survey_row(ui, e, &current, n) {
                            picked = Some(e.perm.clone());
                        }
                    }
                },
            );
        match picked {
            Some(w) => {
                ctx.go_to(w);
                true
            }
            None => false,
        }
    }
}
