//! The permutohedron P_λ: λ typed as exact rationals (or set with sliders), its
//! exact volume, the volume along a segment from λ_a to λ_b (sampled exactly,
//! plotted as floats), the mixed Eulerian numbers of n, and a drawing of P_λ
//! (the polygon for n = 3, a projection turned by dragging for n = 4).

use super::{figure_look, show_progress};
use crate::engine::requests::Output;
use crate::engine::{Engine, Fetch, JobKey, Slot};
use crate::figure::look::Look;
use crate::figure::permutohedron::polytope_scene;
use crate::figure::volume::volume_plot_scene;
use crate::figure::{Scene, Tag};
use crate::gui::AppCtx;
use crate::gui::scene_painter::{self, PaintOptions};
use crate::gui::table_source::TableSource;
use crate::math::permutohedra::permutohedron::rational_to_f64;
use crate::session::model::PermutohedronPlace;
use crate::tables::table::Table;
use eframe::egui;
use egui_plot::{Line, Plot, Points};
use num_bigint::BigInt;
use num_rational::BigRational;
use std::sync::Arc;

/// Samples along the segment.
const SAMPLES: usize = 24;

/// The permutohedron view's UI state.
#[derive(Default)]
pub struct PermutohedronView {
    volume: Slot,
    segment: Slot,
    eulerian: Slot,
    polytope: Slot,
    /// The drawing of P_λ on screen, for export.
    polytope_scene: Option<Arc<Scene>>,
    /// The volume along the segment on screen, drawn as a figure for export.
    segment_plot_scene: Option<Arc<Scene>>,
    /// The mixed Eulerian numbers shown (keyed by n), for export.
    eulerian_table: TableSource<usize>,
}

/// Reads an exact rational with the commands' reader (`3`, `-2`, `3/2`,
/// `1.25`), its message as the error.
fn parse_rational(text: &str) -> Result<BigRational, String> {
    crate::math::poly::rational::parse_rational(text).map_err(|e| e.to_string())
}

fn parse_rationals(v: &[String]) -> Result<Vec<BigRational>, String> {
    v.iter().map(|s| parse_rational(s)).collect()
}

/// One row of fields for exact rationals (red while one does not read),
/// with a slider under each if `sliders`; returns whether something changed.
fn rational_fields(ui: &mut egui::Ui, id: &str, v: &mut [String], sliders: bool) -> bool {
    let mut changed = false;
    ui.horizontal(|ui| {
        for (k, s) in v.iter_mut().enumerate() {
            ui.vertical(|ui| {
                let bad = parse_rational(s).is_err();
                let mut edit = egui::TextEdit::singleline(s)
                    .id_salt((id, k))
                    .desired_width(54.0);
                if bad {
                    edit = edit.text_color(crate::gui::theme::alert());
                }
                changed |= ui.add(edit).changed();
                if sliders {
                    changed |= half_step_slider(ui, s);
                }
            });
        }
    });
    changed
}

/// A slider from 0 to 10 in steps of 1/2 that writes its value into `s`
/// (`3` or `7/2`); returns whether it moved.
fn half_step_slider(ui: &mut egui::Ui, s: &mut String) -> bool {
    let mut x = parse_rational(s)
        .map(|r| rational_to_f64(&r))
        .unwrap_or(0.0);
    let r = ui.add(
        egui::Slider::new(&mut x, 0.0..=10.0)
            .step_by(0.5)
            .show_value(false),
    );
    if !r.changed() {
        return false;
    }
    let halves = (x * 2.0).round() as i64;
    *s = if halves % 2 == 0 {
        (halves / 2).to_string()
    } else {
        format!("{halves}/2")
    };
    true
}

/// The heading and n; a new n resets λ to (n-1, ..., 1, 0) and the segment
/// to run from (1, 0, ..., 0) to it. Returns n.
fn heading_with_n(ui: &mut egui::Ui, place: &mut PermutohedronPlace) -> usize {
    let mut n = place.lambda.len().clamp(2, 8);
    ui.horizontal(|ui| {
        ui.heading("Permutohedron P_λ");
        ui.separator();
        ui.label("n");
        if ui.add(egui::DragValue::new(&mut n).range(2..=8)).changed() {
            let regular: Vec<String> = (0..n).rev().map(|k| k.to_string()).collect();
            place.lambda = regular.clone();
            place.to = regular;
            place.from = (0..n)
                .map(|k| if k == 0 { "1" } else { "0" }.to_string())
                .collect();
        }
    });
    n
}

/// The exact volume of P_λ, with a decimal approximation.
fn volume_line(ui: &mut egui::Ui, slot: &mut Slot, engine: &Engine, lambda: &[BigRational]) {
    match slot.fetch(engine, JobKey::Volume(lambda.to_vec())) {
        Fetch::Ready(out) => {
            if let Some(v) = out.rational() {
                ui.label(
                    egui::RichText::new(format!("Vol P_λ = {v}  (≈ {:.6})", rational_to_f64(v)))
                        .strong(),
                );
            }
        }
        Fetch::Running(f, _) => show_progress(ui, "volume", f, slot),
        Fetch::Failed(e) => {
            ui.colored_label(crate::gui::theme::alert(), e.to_string());
        }
    }
}

/// The volume along the segment as a plot of the exact samples, and the exact end values.
fn segment_plot(ui: &mut egui::Ui, samples: &[(BigRational, BigRational)], pts: Vec<[f64; 2]>) {
    Plot::new("volume_segment")
        .height(200.0)
        .x_axis_label("t")
        .y_axis_label("Vol P_λ(t)")
        .allow_scroll(false)
        .show(ui, |p| {
            p.line(Line::new("volume", pts.clone()).width(2.0));
            p.points(Points::new("exact samples", pts).radius(2.5));
        });
    if let (Some(first), Some(last)) = (samples.first(), samples.last()) {
        ui.weak(format!(
            "exact: Vol at t = 0 is {}, at t = 1 is {}",
            first.1, last.1
        ));
    }
}

/// One row of the mixed Eulerian numbers: c and A_c.
fn eulerian_row(ui: &mut egui::Ui, c: &[u32], a: &BigInt) {
    let c: Vec<String> = c.iter().map(|x| x.to_string()).collect();
    ui.horizontal(|ui| {
        ui.add_sized(
            [140.0, 18.0],
            egui::Label::new(egui::RichText::new(format!("c = ({})", c.join(","))).monospace()),
        );
        ui.label(egui::RichText::new(a.to_string()).monospace());
    });
}

impl PermutohedronView {
    /// The figures this view can export: the drawing of P_λ and the volume plot.
    pub fn figures(&self) -> Vec<(String, Arc<Scene>)> {
        let mut v = Vec::new();
        if let Some(s) = &self.polytope_scene {
            v.push(("the drawing of P_λ".to_string(), s.clone()));
        }
        if let Some(s) = &self.segment_plot_scene {
            v.push(("the volume along the segment".to_string(), s.clone()));
        }
        v
    }

    /// The tables this view can export: the mixed Eulerian numbers of n.
    pub fn tables(&mut self) -> Vec<(String, Arc<Table>)> {
        self.eulerian_table
            .table(|n, out| match out {
                Output::Eulerian(rows) => Some(crate::tables::results::eulerian_table(*n, rows)),
                _ => None,
            })
            .map(|(n, t)| (format!("the mixed Eulerian numbers of n = {n}"), t))
            .into_iter()
            .collect()
    }

    /// Draws the view: λ, then its volume and drawing on the left, the
    /// segment and the mixed Eulerian numbers on the right.
    pub fn ui(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx) {
        let look = figure_look(ctx.session);
        let place = &mut ctx.session.solid;
        let n = heading_with_n(ui, place);
        for v in [&mut place.lambda, &mut place.from, &mut place.to] {
            v.resize(n, "0".into());
        }
        ui.label("λ (exact rationals: 3, 3/2, 1.25)");
        rational_fields(ui, "lambda", &mut place.lambda, true);
        let lambda = parse_rationals(&place.lambda);
        ui.horizontal_top(|ui| {
            ui.vertical(|ui| {
                ui.set_width((ui.available_width() * 0.5).max(300.0));
                match &lambda {
                    Err(e) => {
                        ui.colored_label(crate::gui::theme::alert(), e);
                    }
                    Ok(l) => {
                        volume_line(ui, &mut self.volume, ctx.engine, l);
                        self.polytope_drawing(ui, ctx.engine, l, &mut ctx.session.solid, &look);
                    }
                }
            });
            ui.vertical(|ui| {
                self.segment(ui, ctx.engine, &mut ctx.session.solid, &look);
                ui.separator();
                self.eulerian_list(ui, ctx.engine, n);
            });
        });
    }

    /// The segment from λ_a to λ_b (typed) and the volume along it.
    fn segment(
        &mut self,
        ui: &mut egui::Ui,
        engine: &Engine,
        place: &mut PermutohedronPlace,
        look: &Look,
    ) {
        ui.label("Volume along the segment from λ_a to λ_b");
        ui.horizontal(|ui| {
            ui.label("λ_a");
            rational_fields(ui, "from", &mut place.from, false);
        });
        ui.horizontal(|ui| {
            ui.label("λ_b");
            rational_fields(ui, "to", &mut place.to, false);
        });
        let (a, b) = match (parse_rationals(&place.from), parse_rationals(&place.to)) {
            (Ok(a), Ok(b)) => (a, b),
            (Err(e), _) | (_, Err(e)) => {
                ui.colored_label(crate::gui::theme::alert(), e);
                return;
            }
        };
        match self
            .segment
            .fetch(engine, JobKey::VolumeSegment(a, b, SAMPLES))
        {
            Fetch::Ready(out) => {
                if let Output::Samples(s) = out.as_ref() {
                    let pts: Vec<[f64; 2]> = s
                        .iter()
                        .map(|(t, v)| [rational_to_f64(t), rational_to_f64(v)])
                        .collect();
                    self.segment_plot_scene = Some(Arc::new(volume_plot_scene(
                        &pts.iter().map(|p| (p[0], p[1])).collect::<Vec<_>>(),
                        look,
                    )));
                    segment_plot(ui, s, pts);
                }
            }
            Fetch::Running(f, _) => show_progress(ui, "sampling", f, &self.segment),
            Fetch::Failed(e) => {
                ui.colored_label(crate::gui::theme::alert(), e.to_string());
            }
        }
    }

    /// The drawing of P_λ for n = 3 and 4 (dragging turns the solid at n = 4;
    /// hovering a vertex names it).
    fn polytope_drawing(
        &mut self,
        ui: &mut egui::Ui,
        engine: &Engine,
        lambda: &[BigRational],
        place: &mut PermutohedronPlace,
        look: &Look,
    ) {
        if lambda.len() > 4 {
            ui.weak("P_λ is drawn for n = 3 (the polygon) and n = 4 (a projection).");
            return;
        }
        let out = match self
            .polytope
            .fetch(engine, JobKey::Polytope(lambda.to_vec()))
        {
            Fetch::Ready(out) => out.clone(),
            Fetch::Running(f, _) => {
                show_progress(ui, "vertices", f, &self.polytope);
                return;
            }
            Fetch::Failed(e) => {
                ui.colored_label(crate::gui::theme::alert(), e.to_string());
                return;
            }
        };
        let Output::Polytope(p) = out.as_ref() else {
            return;
        };
        let scene = polytope_scene(&p.coords, &p.edges, &p.labels, place.yaw, place.pitch, look);
        self.polytope_scene = Some(Arc::new(scene.clone()));
        let side = ui
            .available_width()
            .min(ui.available_height() - 20.0)
            .max(200.0);
        let opts = PaintOptions {
            highlight: Vec::new(),
            max_scale: 3.0,
            size: Some(egui::vec2(side, side)),
        };
        let r = scene_painter::show(ui, &scene, &opts);
        if lambda.len() == 4 {
            let d = r.response.drag_delta();
            place.yaw += d.x * 0.01;
            place.pitch = (place.pitch + d.y * 0.01).clamp(-1.5, 1.5);
            ui.weak("drag to turn the solid");
        }
        if let Some(Tag::Vertex(k)) = r.hovered_where(|t| matches!(t, Tag::Vertex(_))) {
            r.response.on_hover_text(format!(
                "vertex {}",
                p.labels.get(k).cloned().unwrap_or_default()
            ));
        }
    }

    /// The mixed Eulerian numbers A_c of n, drawn virtually.
    fn eulerian_list(&mut self, ui: &mut egui::Ui, engine: &Engine, n: usize) {
        ui.label(format!("Mixed Eulerian numbers A_c of n = {n}"))
            .on_hover_text("Ctrl+E exports them as CSV or as a LaTeX tabular");
        match self.eulerian.fetch(engine, JobKey::Eulerian(n)) {
            Fetch::Ready(out) => {
                let Output::Eulerian(rows) = out.as_ref() else {
                    return;
                };
                self.eulerian_table.note_shown(&n, out);
                egui::ScrollArea::vertical()
                    .id_salt("eulerian")
                    .max_height(ui.available_height() - 4.0)
                    .show_rows(ui, ui.spacing().interact_size.y, rows.len(), |ui, range| {
                        for (c, a) in &rows[range] {
                            eulerian_row(ui, c, a);
                        }
                    });
            }
            Fetch::Running(f, _) => show_progress(ui, "mixed Eulerian numbers", f, &self.eulerian),
            Fetch::Failed(e) => {
                ui.colored_label(crate::gui::theme::alert(), e.to_string());
            }
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn rationals_in_three_spellings() {
        assert_eq!(parse_rational("3/2").unwrap().to_string(), "3/2");
        assert_eq!(parse_rational("1.25").unwrap().to_string(), "5/4");
        assert_eq!(parse_rational(" -2 ").unwrap().to_string(), "-2");
        assert!(parse_rational("x").is_err());
    }
}
