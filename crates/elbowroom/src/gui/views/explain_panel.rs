//! The words view's panel "a_w from the words of w" (ℓ(w) = n − 1): the contents of
//! the reduced words as rows (c, N_w(c), A_c, share) summing to a_w, a click on a row
//! filtering the word list to that content and a click on A_c opening the
//! permutohedra view at u = c; the rules that apply (the standard tableaux of a
//! Grassmannian w drawn); a_{w^{-1}}, a_{w0 w w0} and the cyclic orbit as clickable
//! permutations; a_w(q) and S_w(1, q, …) typeset. Computed on the engine
//! (`JobKey::Explain`); the rows export as a table (CSV, LaTeX) and as a table
//! figure (PNG, SVG, TikZ).

use super::fetch_or_explain;
use crate::engine::requests::Explained;
use crate::engine::{Engine, JobKey, Output, Slot};
use crate::figure::Scene;
use crate::figure::look::Look;
use crate::figure::table_figure::{TableFigure, table_scene};
use crate::gui::typeset::{self, Typeset};
use crate::math::Perm;
use crate::math::explain::rules::Rule;
use crate::session::model::{Session, View};
use crate::tables::table::{Column, Table};
use eframe::egui;
use std::sync::Arc;

/// How many tableaux of a Grassmannian rule the panel draws.
const TABLEAUX_DRAWN: usize = 12;

/// The panel's state: its standing request and the content the word list is filtered to.
#[derive(Default)]
pub struct ExplainPanel {
    slot: Slot,
    /// Show only the words of this content (set by a click on a row).
    pub filter: Option<Vec<usize>>,
    /// The permutation the filter was chosen for.
    filter_for: Option<Perm>,
}

/// What a click in the panel asks the window to do.
pub enum PanelAction {
    /// Go to this permutation.
    GoTo(Perm),
    /// Open the permutohedra view at λ with λ_i − λ_{i+1} = c_i.
    Eulerian(Vec<usize>),
}

impl ExplainPanel {
    /// The rows of the formula as an export table, once computed.
    pub fn table(&self) -> Option<(String, Arc<Table>)> {
        let out = self.slot.latest()?;
        let Output::Explain(e) = out.as_ref() else {
            return None;
        };
        Some((
            format!(
                "the reduced-word formula for a_{}",
                e.explanation.formula.perm
            ),
            Arc::new(formula_table(e)),
        ))
    }

    /// N_w(c), the number of reduced words of w of content c, once the panel
    /// has computed the contents of w (`None` before, or for another w).
    pub fn words_with_content(&self, w: &Perm, c: &[usize]) -> Option<usize> {
        let out = self.slot.latest()?;
        let Output::Explain(e) = out.as_ref() else {
            return None;
        };
        let f = &e.explanation.formula;
        if f.perm != *w {
            return None;
        }
        let share = f.shares.iter().find(|s| s.content == c);
        share.map_or(Some(0), |s| usize::try_from(&s.words).ok())
    }

    /// The rows of the formula as a table figure (PNG, SVG, TikZ), once computed.
    pub fn figure(&self, look: &Look) -> Option<(String, Arc<Scene>)> {
        let out = self.slot.latest()?;
        let Output::Explain(e) = out.as_ref() else {
            return None;
        };
        Some((
            format!(
                "the reduced-word formula for a_{} as a figure",
                e.explanation.formula.perm
            ),
            Arc::new(table_scene(&formula_figure(e), look)),
        ))
    }

    /// Draws the panel for w (nothing but a note when ℓ(w) ≠ n − 1).
    pub fn ui(&mut self, ui: &mut egui::Ui, engine: &Engine, w: &Perm) -> Option<PanelAction> {
        if self.filter_for.as_ref() != Some(w) {
            self.filter = None;
            self.filter_for = Some(w.clone());
        }
        let n = w.n();
        if n < 2 || w.length() != n - 1 {
            ui.weak(format!(
                "a_w (the permutahedral class) is read from the words when ℓ(w) = n − 1 = {}; ℓ({w}) = {}",
                n.saturating_sub(1),
                w.length()
            ));
            return None;
        }
        let out = fetch_or_explain(
            ui,
            &mut self.slot,
            engine,
            JobKey::Explain(w.clone()),
            "explaining a_w by its reduced words",
        )?;
        let Output::Explain(e) = out.as_ref() else {
            return None;
        };
        let mut action = None;
        let look = crate::figure::look::Look {
            dark: ui.visuals().dark_mode,
            labels: false,
        };
        ui.horizontal_top(|ui| {
            ui.vertical(|ui| {
                ui.set_max_width(440.0);
                self.contents(ui, e, &mut action);
            });
            ui.add_space(24.0);
            ui.vertical(|ui| {
                rules(ui, e);
                relatives(ui, e, &mut action);
                q_values(ui, e);
                trees(ui, e, &look);
            });
        });
        action
    }

    fn contents(&mut self, ui: &mut egui::Ui, e: &Explained, action: &mut Option<PanelAction>) {
        let f = &e.explanation.formula;
        let n = f.perm.n();
        typeset::label(
            ui,
            &Typeset::new()
                .symbol(format!("a_w = (1/{}!) Σ_c N_w(c) A_c", n - 1))
                .plain(format!(
                    " over {} reduced words; click a content to filter the list, A_c to see it among the permutohedra",
                    f.reduced_words
                )),
        );
        egui::ScrollArea::vertical()
            .id_salt("explain_rows")
            .max_height(180.0)
            .show(ui, |ui| {
                egui::Grid::new("explain_grid")
                    .striped(true)
                    .num_columns(4)
                    .show(ui, |ui| {
                        ui.strong("content c");
                        ui.strong("N_w(c)");
                        ui.strong("A_c");
                        ui.strong("share");
                        ui.end_row();
                        for s in &f.shares {
                            let chosen = self.filter.as_ref() == Some(&s.content);
                            let text = egui::RichText::new(format!("{:?}", s.content)).monospace();
                            if ui.selectable_label(chosen, text).clicked() {
                                self.filter = if chosen {
                                    None
                                } else {
                                    Some(s.content.clone())
                                };
                            }
                            ui.label(s.words.to_string());
                            if ui
                                .link(s.eulerian.to_string())
                                .on_hover_text("open the permutohedra view at u = c")
                                .clicked()
                            {
                                *action = Some(PanelAction::Eulerian(s.content.clone()));
                            }
                            ui.label(s.share.to_string());
                            ui.end_row();
                        }
                    });
            });
        typeset::label(
            ui,
            &Typeset::new()
                .plain(format!("sum {}/{}! = {} = ", f.total, n - 1, f.value))
                .symbol("a_w")
                .strong(),
        );
        if let Some(c) = self.filter.clone() {
            let count = f
                .shares
                .iter()
                .find(|s| s.content == c)
                .map_or_else(|| "0".to_string(), |s| s.words.to_string());
            ui.horizontal_wrapped(|ui| {
                ui.weak(format!(
                    "the list shows the {count} reduced words of content {c:?} (of {} in all), {} a page",
                    f.reduced_words,
                    crate::engine::requests::WORD_PAGE
                ));
                if ui.small_button("show all").clicked() {
                    self.filter = None;
                }
            });
        }
    }
}

/// a_w by trees: Σ_T c_{w,T}·(n−1)!/Π_v h_v over the binary trees on the
/// leaves 1..n in the forest expansion of S_w, each tree drawn small.
fn trees(ui: &mut egui::Ui, e: &Explained, look: &crate::figure::look::Look) {
    match &e.trees {
        Err(why) => {
            ui.weak(format!("a_w by trees: not computed ({why})"));
        }
        Ok(trees) => {
            ui.label(format!(
                "a_w by trees: Σ_T c_(w,T)·(n−1)!/Π h_v over {} tree{}",
                trees.len(),
                if trees.len() == 1 { "" } else { "s" }
            ));
            for t in trees {
                ui.horizontal(|ui| {
                    ui.monospace(format!("{} · {}", t.coefficient, t.labelings));
                    super::forests::small_forest(ui, &t.code, 28.0, look);
                    ui.monospace(crate::math::forest::indexed::code_text(&t.code));
                });
            }
        }
    }
}

fn rules(ui: &mut egui::Ui, e: &Explained) {
    let rules = &e.explanation.rules;
    if rules.is_empty() {
        ui.weak("no rule (parking, Grassmannian, Coxeter) applies");
    }
    for r in rules {
        ui.label(format!("• {}", r.statement()));
        if let Rule::Grassmannian { tableaux, .. } = r {
            ui.horizontal_wrapped(|ui| {
                for t in tableaux.iter().take(TABLEAUX_DRAWN) {
                    draw_tableau(ui, t);
                }
                if tableaux.len() > TABLEAUX_DRAWN {
                    ui.weak(format!("… {} in all", tableaux.len()));
                }
            });
        }
    }
}

/// A standard tableau as boxes, rows top to bottom (English notation).
fn draw_tableau(ui: &mut egui::Ui, rows: &[Vec<usize>]) {
    let cell = 18.0;
    let width = rows.first().map_or(0, |r| r.len()) as f32 * cell;
    let (rect, _) = ui.allocate_exact_size(
        egui::vec2(width + 6.0, rows.len() as f32 * cell + 4.0),
        egui::Sense::hover(),
    );
    let painter = ui.painter_at(rect);
    let stroke = egui::Stroke::new(1.0, ui.visuals().text_color());
    for (i, row) in rows.iter().enumerate() {
        for (j, x) in row.iter().enumerate() {
            let min = rect.min + egui::vec2(j as f32 * cell + 1.0, i as f32 * cell + 1.0);
            let r = egui::Rect::from_min_size(min, egui::vec2(cell, cell));
            painter.rect_stroke(r, 0.0, stroke, egui::StrokeKind::Inside);
            painter.text(
                r.center(),
                egui::Align2::CENTER_CENTER,
                x.to_string(),
                egui::FontId::monospace(11.0),
                ui.visuals().text_color(),
            );
        }
    }
}

fn relatives(ui: &mut egui::Ui, e: &Explained, action: &mut Option<PanelAction>) {
    let x = &e.explanation;
    ui.horizontal_wrapped(|ui| {
        ui.label("a_w = a_(w^-1) = a_(w0 w w0):");
        for (u, v) in [&x.inverse, &x.conjugate] {
            if ui.link(format!("{u} ({v})")).clicked() {
                *action = Some(PanelAction::GoTo(u.clone()));
            }
        }
    });
    ui.horizontal_wrapped(|ui| {
        ui.label("cyclic orbit:");
        for (j, u, v) in &x.orbit {
            if ui
                .link(format!("{u} ({v})"))
                .on_hover_text(format!("letters shifted by {j} modulo n"))
                .clicked()
            {
                *action = Some(PanelAction::GoTo(u.clone()));
            }
        }
        ui.label(format!(
            "sum {} = |Red(w)| = {}",
            x.orbit_sum, x.formula.reduced_words
        ));
    });
}

fn q_values(ui: &mut egui::Ui, e: &Explained) {
    match &e.q {
        Ok(q) => match &q.value {
            Some(v) => {
                let line = Typeset::new()
                    .symbol("a_w(q)")
                    .plain(" = ")
                    .poly(v.to_string());
                typeset::math_label(ui, &line, &format!("a_w(q) = {v}"));
            }
            None => {
                ui.label(format!(
                    "a_w(q) = ({}) / [n−1]_q! is not a polynomial",
                    q.numerator
                ));
            }
        },
        Err(why) => {
            ui.weak(format!("a_w(q) not computed: {why}"));
        }
    }
    match &e.principal {
        Ok(p) => {
            let line = Typeset::new()
                .symbol("S_w(1, q, q^2, …)")
                .plain(" = ")
                .poly(p.to_string());
            typeset::math_label(ui, &line, &format!("S_w(1, q, q^2, …) = {p}"));
        }
        Err(why) => {
            ui.weak(format!("S_w(1, q, …) not computed: {why}"));
        }
    }
}

/// The rows of the formula: content, N_w(c), A_c, share, and the sum.
pub fn formula_table(e: &Explained) -> Table {
    let f = &e.explanation.formula;
    let n = f.perm.n();
    let mut t = Table::new(vec![
        Column::math("$c$").keyed("content"),
        Column::math("$N_w(c)$").keyed("words"),
        Column::math("$A_c$").keyed("eulerian"),
        Column::math("share").keyed("share"),
    ]);
    t.comment(format!(
        "a_w for w = {} by the reduced-word formula: a_w = (1/{}!) sum_c N_w(c) A_c = {}/{}! = {}",
        f.perm,
        n - 1,
        f.total,
        n - 1,
        f.value
    ));
    for s in &f.shares {
        let parts: Vec<String> = s.content.iter().map(|x| x.to_string()).collect();
        t.push(vec![
            format!("({})", parts.join(",")),
            s.words.to_string(),
            s.eulerian.to_string(),
            s.share.to_string(),
        ]);
    }
    t
}

/// The rows of the formula as a table figure: content, N_w(c), A_c and share,
/// the title naming w and the formula, the sum under the rows.
pub fn formula_figure(e: &Explained) -> TableFigure {
    let f = &e.explanation.formula;
    let m = f.perm.n() - 1;
    let rows = f
        .shares
        .iter()
        .map(|s| {
            let parts: Vec<String> = s.content.iter().map(|x| x.to_string()).collect();
            vec![
                format!("({})", parts.join(",")),
                s.words.to_string(),
                s.eulerian.to_string(),
                s.share.to_string(),
            ]
        })
        .collect();
    TableFigure {
        title: format!("a_w = (1/{m}!) Σ_c N_w(c) A_c for w = {}", f.perm),
        headers: vec![
            "content c".into(),
            "N_w(c)".into(),
            "A_c".into(),
            "share".into(),
        ],
        rows,
        footer: Some(format!(
            "sum {}/{m}! = {} = a_w ({} reduced words)",
            f.total, f.value, f.reduced_words
        )),
    }
}

/// Opens the permutohedra view at λ with λ_i − λ_{i+1} = c_i, λ_n = 0 (so u = c).
pub fn open_eulerian(session: &mut Session, c: &[usize]) {
    let n = c.len() + 1;
    let mut lambda = vec![0usize; n];
    for i in (0..n - 1).rev() {
        lambda[i] = lambda[i + 1] + c[i];
    }
    session.solid.lambda = lambda.iter().map(|x| x.to_string()).collect();
    session.view = View::Permutohedron;
}
