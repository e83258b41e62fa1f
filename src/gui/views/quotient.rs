//! The quasisymmetric quotient: the normal form of the current permutation's
//! reversed Schubert polynomial (or of a typed polynomial) modulo J_n, drawn as
//! a grid of lattice-path diagrams of the standard monomials with their
//! coefficients (negatives marked), and the Hilbert series of Q[x]/J_n; or the
//! positivity survey over all of S_n (`survey.rs`).

use super::computing;
use super::survey::SurveyPanel;
use super::workbench::show_parse_error;
use crate::engine::requests::{Output, QuotientInput};
use crate::engine::{Fetch, JobKey, Slot};
use crate::figure::Tag;
use crate::figure::look::Look;
use crate::figure::paths::{PathPanel, path_grid_scene};
use crate::gui::AppCtx;
use crate::gui::scene_painter::{self, PaintOptions};
use crate::math::quotient::groebner::MAX_QUOTIENT_N;
use crate::math::quotient::lattice_path::LatticePath;
use eframe::egui;
use num_traits::Signed;
use std::sync::Arc;

/// The quotient view's UI state.
#[derive(Default)]
pub struct QuotientView {
    slot: Slot,
    scene: Option<(JobKey, Look, Arc<crate::figure::Scene>)>,
    /// The survey over all of S_n.
    pub survey: SurveyPanel,
}

impl QuotientView {
    /// The figures this view can export: the grid of lattice paths.
    pub fn figures(&self) -> Vec<(String, Arc<crate::figure::Scene>)> {
        self.scene
            .iter()
            .map(|(_, _, s)| ("the lattice-path normal form".to_string(), s.clone()))
            .collect()
    }

    /// Draws the view.
    pub fn ui(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx) {
        let w = ctx.perm();
        ui.heading("Normal form in Q[x1..xn]/J_n (lex order x1 > x2 > ... > xn)");
        let place = &mut ctx.session.quotient;
        ui.horizontal(|ui| {
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
            if ui
                .radio(
                    place.survey,
                    format!("positivity survey of all of S_{}", w.n()),
                )
                .clicked()
            {
                place.survey = true;
            }
        });
        let n = w.n();
        if place.survey {
            if self.survey.ui(ui, ctx, n) {
                ctx.session.quotient.survey = false;
                ctx.session.quotient.use_typed = false;
            }
            return;
        }
        if n > MAX_QUOTIENT_N {
            ui.colored_label(
                crate::gui::theme::alert(),
                format!("the quotient is computed for n <= {MAX_QUOTIENT_N}"),
            );
            return;
        }
        let input = if place.use_typed {
            if place.typed.is_empty() {
                place.typed = "x1^2 x2 + x2 x3".into();
            }
            ui.add(
                egui::TextEdit::singleline(&mut place.typed)
                    .id_salt("quotient_poly")
                    .font(egui::TextStyle::Monospace)
                    .desired_width(f32::INFINITY),
            );
            if let Err(e) = crate::math::poly::parse::parse_poly(&place.typed, Some(n)) {
                show_parse_error(ui, &e);
                return;
            }
            QuotientInput::Typed(place.typed.clone(), n)
        } else {
            QuotientInput::ReversedSchubert(w.clone())
        };
        let key = JobKey::NormalForm(input);
        let out = match self.slot.fetch(ctx.engine, key.clone()) {
            Fetch::Ready(out) => out.clone(),
            Fetch::Running(f, _) => {
                computing(ui, "reducing", f, &self.slot);
                return;
            }
            Fetch::Failed(e) => {
                let e = e.clone();
                show_parse_error(ui, &e);
                return;
            }
        };
        let Output::Reduced(r) = out.as_ref() else {
            return;
        };
        // long polynomials (S_w has hundreds of terms at n = 8) scroll in a few
        // lines instead of pushing the diagrams off the screen
        egui::ScrollArea::vertical()
            .id_salt("quotient_polynomials")
            .max_height(96.0)
            .show(ui, |ui| {
                ui.label(egui::RichText::new(format!("f = {}", r.input)).monospace());
                ui.label(
                    egui::RichText::new(format!("NF(f) = {}", r.normal.poly.to_text()))
                        .monospace()
                        .strong(),
                );
            });
        let hs: Vec<String> = r
            .hilbert
            .iter()
            .enumerate()
            .map(|(k, c)| match k {
                0 => c.to_string(),
                1 => format!("{c}t"),
                _ => format!("{c}t^{k}"),
            })
            .collect();
        let dim: usize = r.hilbert.iter().sum();
        let negatives = r
            .normal
            .coefficients
            .iter()
            .filter(|c| c.2.is_negative())
            .count();
        ui.label(format!(
            "Hilbert series of Q[x]/J_{}: {}  (dimension {dim}, the Catalan number);  {} basis terms, {} negative, coefficient sum {}",
            r.n,
            hs.join(" + "),
            r.normal.coefficients.len(),
            negatives,
            r.normal.coefficient_sum()
        ));
        let look = Look {
            dark: ctx.session.dark,
            labels: ctx.session.figure.labels,
        };
        let scene = match &self.scene {
            Some((k, l, s)) if *k == key && *l == look => s.clone(),
            _ => {
                let panels: Vec<PathPanel> = r
                    .normal
                    .coefficients
                    .iter()
                    .filter_map(|(_, m, c)| {
                        let path = LatticePath::of_monomial(&m.exps(r.n)).ok()?;
                        Some(PathPanel {
                            path,
                            monomial: m.text(r.n),
                            coefficient: c.to_string(),
                            negative: c.is_negative(),
                        })
                    })
                    .collect();
                let cols = ((ui.available_width() / 150.0) as usize).clamp(2, 10);
                let s = Arc::new(path_grid_scene(&panels, r.n, cols, &look));
                self.scene = Some((key, look, s.clone()));
                s
            }
        };
        if r.normal.coefficients.is_empty() {
            ui.label("NF(f) = 0: f lies in J_n.");
            return;
        }
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
                let resp = scene_painter::show(ui, &scene, &opts);
                if let Some(Tag::Panel(k)) = resp.hovered_where(|t| matches!(t, Tag::Panel(_)))
                    && let Some((_, m, c)) = r.normal.coefficients.get(k)
                {
                    resp.response
                        .on_hover_text(format!("{c} · {}", m.text(r.n)));
                }
            });
    }
}
