//! The quasisymmetric quotient: the normal form of the current permutation's
//! reversed Schubert polynomial (or of a typed polynomial) modulo J_n, drawn as
//! a grid of lattice-path diagrams of the standard monomials with their
//! coefficients (negatives marked), and the Hilbert series of Q[x]/J_n; or the
//! positivity survey over all of S_n (`survey.rs`).

use super::survey::SurveyPanel;
use super::{fetch_or_explain, figure_look, typed_poly_fits};
use crate::engine::requests::{Output, QuotientInput, Reduced};
use crate::engine::{JobKey, Slot};
use crate::figure::look::Look;
use crate::figure::paths::{PathPanel, panels_of_normal_form, path_grid_scene, with_legend};
use crate::figure::{Scene, Tag};
use crate::gui::AppCtx;
use crate::gui::scene_painter::{self, PaintOptions};
use crate::gui::typeset::{self, Typeset};
use crate::math::Perm;
use crate::math::quotient::normal_form::NormalForm;
use crate::math::quotient::reduction::MAX_NORMAL_FORM_N;
use crate::session::model::QuotientPlace;
use eframe::egui;
use num_traits::Signed;
use std::sync::Arc;

/// The quotient view's UI state.
#[derive(Default)]
pub struct QuotientView {
    normal_form: Slot,
    /// The grid of lattice paths on screen, keyed by the normal form asked
    /// for and the look, and the same grid with its legend, for export.
    paths_scene: Option<(JobKey, Look, Arc<Scene>, Arc<Scene>)>,
    /// Export the grid without its legend.
    pub figure_without_legend: bool,
    /// The survey over all of S_n.
    pub survey: SurveyPanel,
    /// The permutation last picked from the survey's rows, while its normal form is shown.
    picked_from_survey: Option<Perm>,
    /// Show the class in the forest basis instead of the lattice paths.
    pub forest_basis: bool,
    forest_class: Slot,
}

/// The lattice-path panels of a normal form in `n` variables: one per
/// standard monomial with a nonzero coefficient, in basis order.
fn path_panels(normal: &NormalForm, n: usize) -> Vec<PathPanel> {
    // every monomial of a normal form is standard, so each has its path
    panels_of_normal_form(normal, n).unwrap_or_default()
}

/// The Hilbert series 1 + a t + b t^2 + ... as text.
fn hilbert_series_text(hilbert: &[usize]) -> String {
    let hs: Vec<String> = hilbert
        .iter()
        .enumerate()
        .map(|(k, c)| match k {
            0 => c.to_string(),
            1 => format!("{c}t"),
            _ => format!("{c}t^{k}"),
        })
        .collect();
    hs.join(" + ")
}

/// The radio buttons choosing what the view shows: the reversed Schubert
/// polynomial of w, a typed polynomial, or the survey of S_n.
fn source_choice(ui: &mut egui::Ui, place: &mut QuotientPlace, w: &Perm) {
    ui.horizontal_wrapped(|ui| {
        if ui
            .radio(
                !place.survey && !place.use_typed,
                format!("reversed Schubert polynomial of w = {w}"),
            )
            .clicked()
        {
            place.survey = false;
            place.use_typed = false;
        }
        if ui
            .radio(!place.survey && place.use_typed, "a typed polynomial")
            .clicked()
        {
            place.survey = false;
            place.use_typed = true;
        }
        let survey = Typeset::new().symbol(format!("positivity survey of all of S_{}", w.n()));
        if typeset::radio_flag(ui, place.survey, &survey).clicked() {
            place.survey = true;
        }
    });
}

/// The polynomial to reduce: the typed one (with its field, `None` while it is
/// too long to send) or the reversed Schubert polynomial of w.
fn quotient_input(ui: &mut egui::Ui, place: &mut QuotientPlace, w: &Perm) -> Option<QuotientInput> {
    let n = w.n();
    if !place.use_typed {
        return Some(QuotientInput::ReversedSchubert(w.clone()));
    }
    if place.typed.is_empty() {
        place.typed = "x1^2 x2 + x2 x3".into();
    }
    ui.add(
        egui::TextEdit::singleline(&mut place.typed)
            .id_salt("quotient_poly")
            .font(egui::TextStyle::Monospace)
            .desired_width(f32::INFINITY),
    );
    // read on the engine with the reduction (its mistakes are shown there)
    if !typed_poly_fits(ui, &place.typed) {
        return None;
    }
    Some(QuotientInput::Typed(place.typed.clone(), n))
}

/// f and NF(f); long polynomials (S_w has hundreds of terms at n = 8) scroll
/// in a few lines instead of pushing the diagrams off the screen.
fn polynomials(ui: &mut egui::Ui, r: &Reduced) {
    egui::ScrollArea::vertical()
        .id_salt("quotient_polynomials")
        .max_height(96.0)
        .show(ui, |ui| {
            typeset::math_label(ui, &Typeset::new().plain("f = ").poly(&r.input), &r.input);
            let normal = r.normal.poly.to_text();
            typeset::math_label(
                ui,
                &Typeset::new().plain("NF(f) = ").poly(&normal).strong(),
                &normal,
            );
        });
}

/// The Hilbert series of the quotient and the counts of the normal form's terms.
fn summary(ui: &mut egui::Ui, r: &Reduced) {
    let dim: usize = r.hilbert.iter().sum();
    let negatives = r
        .normal
        .coefficients
        .iter()
        .filter(|c| c.2.is_negative())
        .count();
    let series = hilbert_series_text(&r.hilbert);
    typeset::math_label(
        ui,
        &Typeset::new()
            .plain("Hilbert series of Q[x]/")
            .symbol(format!("J_{}", r.n))
            .plain(": ")
            .symbol(&series)
            .plain(format!(
                "  (dimension {dim}, the Catalan number);  {} basis terms, {} negative, coefficient sum {}",
                r.normal.coefficients.len(),
                negatives,
                r.normal.coefficient_sum()
            )),
        &series,
    );
}

/// The legend beside the panels: how x^e becomes its path, and a swatch of
/// the colour of each x_i (the same words as in the exported figure).
fn legend(ui: &mut egui::Ui, n: usize, without_in_figure: &mut bool) {
    ui.strong("How to read the paths");
    let weak = ui.visuals().weak_text_color();
    for paragraph in crate::figure::paths::legend_paragraphs() {
        typeset::label(ui, &Typeset::new().symbol(paragraph).color(weak));
        ui.add_space(4.0);
    }
    ui.horizontal_wrapped(|ui| {
        for v in 2..=n.max(2) {
            let (rect, _) = ui.allocate_exact_size(egui::vec2(16.0, 10.0), egui::Sense::hover());
            ui.painter().line_segment(
                [rect.left_center(), rect.right_center()],
                egui::Stroke::new(
                    3.0,
                    crate::gui::theme::color(crate::figure::palette::label_color(v, n)),
                ),
            );
            typeset::label(ui, &Typeset::new().poly(format!("x{v}")));
        }
    });
    let mut with = !*without_in_figure;
    if ui
        .checkbox(&mut with, "legend in the exported figure")
        .changed()
    {
        *without_in_figure = !with;
    }
}

/// The grid of lattice paths, scrolled, with the hovered panel's term as a tooltip.
fn show_paths(ui: &mut egui::Ui, scene: &Scene, r: &Reduced) {
    egui::ScrollArea::vertical()
        .id_salt("paths")
        .show(ui, |ui| {
            let width = ui.available_width();
            let scale = (width / scene.width).min(1.6);
            let opts = PaintOptions {
                highlight: Vec::new(),
                max_scale: scale,
                size: Some(egui::vec2(width, scene.height * scale)),
            };
            let resp = scene_painter::show(ui, scene, &opts);
            if let Some(Tag::Panel(k)) = resp.hovered_where(|t| matches!(t, Tag::Panel(_)))
                && let Some((_, m, c)) = r.normal.coefficients.get(k)
            {
                let line = Typeset::new().plain(format!("{c} · ")).poly(m.text(r.n));
                resp.response.on_hover_ui(|ui| {
                    typeset::label(ui, &line);
                });
            }
        });
}

impl QuotientView {
    /// The figures this view can export: the grid of lattice paths.
    pub fn figures(&self) -> Vec<(String, Arc<Scene>)> {
        self.paths_scene
            .iter()
            .map(|(_, _, bare, with)| {
                let s = if self.figure_without_legend {
                    bare
                } else {
                    with
                };
                ("the lattice-path normal form".to_string(), s.clone())
            })
            .collect()
    }

    /// After a click on a survey row: says so, with a way back to the survey
    /// (until another permutation or source is chosen).
    fn back_to_survey(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx, w: &Perm) {
        let place = &ctx.session.quotient;
        if place.use_typed || self.picked_from_survey.as_ref() != Some(w) {
            self.picked_from_survey = None;
            return;
        }
        ui.horizontal(|ui| {
            ui.label(format!(
                "the normal form of w = {w}, picked from the survey of S_{}",
                w.n()
            ));
            if ui.button("back to the survey").clicked() {
                ctx.session.quotient.survey = true;
                self.picked_from_survey = None;
            }
        });
    }

    /// Draws the view.
    fn show(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx) {
        let w = ctx.perm();
        typeset::heading(
            ui,
            &Typeset::new()
                .plain("Normal form in Q[")
                .symbol("x_1, …, x_n")
                .plain("]/")
                .symbol("J_n (lex order x_1 > x_2 > … > x_n)"),
        );
        source_choice(ui, &mut ctx.session.quotient, &w);
        let n = w.n();
        if ctx.session.quotient.survey {
            if self.survey.ui(ui, ctx, n) {
                ctx.session.quotient.survey = false;
                ctx.session.quotient.use_typed = false;
                self.picked_from_survey = Some(ctx.perm());
            }
            return;
        }
        self.back_to_survey(ui, ctx, &w);
        if n > MAX_NORMAL_FORM_N {
            ui.colored_label(
                crate::gui::theme::alert(),
                format!("normal forms modulo J_n are computed for n <= {MAX_NORMAL_FORM_N}"),
            );
            return;
        }
        let Some(input) = quotient_input(ui, &mut ctx.session.quotient, &w) else {
            return;
        };
        ui.horizontal(|ui| {
            ui.label("basis:");
            ui.radio_value(
                &mut self.forest_basis,
                false,
                "lattice paths (standard monomials)",
            );
            ui.radio_value(
                &mut self.forest_basis,
                true,
                "forest basis (forests with leaves in 1..n)",
            );
        });
        if self.forest_basis {
            self.forest_basis_rows(ui, ctx, input);
            return;
        }
        let key = JobKey::NormalForm(input);
        let Some(out) = fetch_or_explain(
            ui,
            &mut self.normal_form,
            ctx.engine,
            key.clone(),
            "reducing",
        ) else {
            return;
        };
        let Output::Reduced(r) = out.as_ref() else {
            return;
        };
        polynomials(ui, r);
        summary(ui, r);
        let scene = self.paths_scene(ui, key, figure_look(ctx.session), r);
        if r.normal.coefficients.is_empty() {
            typeset::label(ui, &Typeset::new().symbol("NF(f) = 0: f lies in J_n."));
            return;
        }
        ui.horizontal_top(|ui| {
            // the legend takes up to 300 points, less in a narrow (zoomed) window
            let avail = ui.available_width();
            let legend_width = (avail * 0.32).clamp(160.0, 300.0);
            let paths_width = (avail - legend_width - 12.0).max(120.0);
            ui.vertical(|ui| {
                ui.set_width(paths_width);
                show_paths(ui, &scene, r);
            });
            ui.vertical(|ui| {
                ui.set_width(legend_width);
                egui::ScrollArea::vertical()
                    .id_salt("paths_legend")
                    .show(ui, |ui| legend(ui, r.n, &mut self.figure_without_legend));
            });
        });
    }

    /// The class modulo J_n in the forest basis: P_F over the forests whose
    /// nontrivial trees have their leaves in [n] (computed by trimming, with no
    /// Gröbner basis).
    fn forest_basis_rows(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx, input: QuotientInput) {
        let key = JobKey::ForestClass(input);
        let Some(out) = fetch_or_explain(
            ui,
            &mut self.forest_class,
            ctx.engine,
            key,
            "expanding in the forest basis",
        ) else {
            return;
        };
        let Some(rows) = out.forests() else {
            return;
        };
        if rows.is_empty() {
            typeset::label(ui, &Typeset::new().symbol("The class is 0: f lies in J_n."));
            return;
        }
        let look = figure_look(ctx.session);
        super::forests::forest_rows(
            ui,
            "quotient_forests",
            rows,
            "the class of f: Σ c_F P_F",
            &look,
        );
    }

    /// The grid of lattice paths of `r`, built again only when the normal form
    /// asked for or the look changed.
    fn paths_scene(&mut self, ui: &egui::Ui, key: JobKey, look: Look, r: &Reduced) -> Arc<Scene> {
        match &self.paths_scene {
            Some((k, l, s, _)) if *k == key && *l == look => s.clone(),
            _ => {
                let panels = path_panels(&r.normal, r.n);
                // the legend takes up to 300 points beside the grid
                let legend = (ui.available_width() * 0.32).clamp(160.0, 300.0);
                let cols = (((ui.available_width() - legend - 12.0) / 150.0) as usize).clamp(2, 10);
                let s = Arc::new(path_grid_scene(&panels, r.n, cols, &look));
                let with = Arc::new(with_legend(&s, r.n, &look));
                self.paths_scene = Some((key, look, s.clone(), with));
                s
            }
        }
    }
}

impl super::View for QuotientView {
    fn kind(&self) -> crate::session::model::View {
        crate::session::model::View::Quotient
    }

    fn title(&self) -> &'static str {
        "Quotient by J_n"
    }

    fn ui(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx) {
        self.show(ui, ctx);
    }

    fn session_replaced(&mut self) {
        self.picked_from_survey = None;
    }

    fn exports(&mut self, session: &crate::session::Session) -> crate::gui::files::Exports {
        if session.quotient.survey {
            super::exports_of(Vec::new(), self.survey.tables())
        } else {
            super::exports_of(self.figures(), Vec::new())
        }
    }
}
