//! The permutohedron P_λ: λ typed as exact rationals (or set with sliders), its
//! exact volume, the volume along a segment from λ_a to λ_b (sampled exactly,
//! plotted as floats), the mixed Eulerian numbers of n, and a drawing of P_λ
//! (the polygon for n = 3, a projection turned by dragging for n = 4).

use super::{figure_look, show_progress};
use crate::engine::requests::Output;
use crate::engine::{Engine, Fetch, JobKey, Slot};
use crate::figure::look::Look;
use crate::figure::permutohedron::polytope_scene;
use crate::figure::volume::{tick_step, volume_plot_scene};
use crate::figure::{Scene, Tag};
use crate::gui::AppCtx;
use crate::gui::scene_painter::{self, PaintOptions};
use crate::gui::table_source::TableSource;
use crate::gui::typeset::{self, Typeset};
use crate::math::MAX_N;
use crate::math::permutohedra::permutohedron::rational_to_f64;
use crate::session::model::PermutohedronPlace;
use crate::tables::table::Table;
use eframe::egui;
use egui_plot::{Line, Plot, Points};
use num_bigint::BigInt;
use num_rational::BigRational;
use num_traits::{Signed, ToPrimitive};
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
    /// The λ fields as typed.
    pub lambda_typing: Typing,
    /// The λ_a fields as typed.
    pub from_typing: Typing,
    /// The λ_b fields as typed.
    pub to_typing: Typing,
}

/// Reads an exact rational with the commands' reader (`3`, `-2`, `3/2`,
/// `1.25`), its message as the error.
fn parse_rational(text: &str) -> Result<BigRational, String> {
    crate::math::poly::rational::parse_rational(text).map_err(|e| e.to_string())
}

fn parse_rationals(v: &[String]) -> Result<Vec<BigRational>, String> {
    v.iter().map(|s| parse_rational(s)).collect()
}

/// The text shown in a row of λ fields while it is typed. The session holds
/// the entries last read (so a save never meets a half-typed `1/`); a field
/// that does not read keeps its text on screen, in red, until it does.
#[derive(Clone, Debug, Default)]
pub struct Typing {
    /// The text in each field.
    pub shown: Vec<String>,
    /// The session's entries when the fields last agreed with them.
    synced: Vec<String>,
}

impl Typing {
    /// Takes over each entry of `v` that changed outside the fields (a new n,
    /// a session opened, a slider).
    fn sync(&mut self, v: &[String]) {
        self.shown.resize(v.len(), String::new());
        self.synced.resize(v.len(), String::new());
        for (k, e) in v.iter().enumerate() {
            if self.synced[k] != *e {
                self.shown[k] = e.clone();
                self.synced[k] = e.clone();
            }
        }
    }

    /// Writes each field the user changed and that reads into `v` (an entry
    /// nobody touched stays exactly as the session had it).
    fn commit(&mut self, v: &mut [String]) {
        for (k, text) in self.shown.iter().enumerate() {
            let touched = self.synced.get(k) != Some(text);
            if k < v.len() && touched && parse_rational(text).is_ok() {
                v[k] = text.trim().to_string();
            }
        }
        self.synced = v.to_vec();
    }
}

/// One row of fields for exact rationals (red while one does not read),
/// with a slider under each if `sliders`; returns whether something changed.
fn rational_fields(
    ui: &mut egui::Ui,
    id: &str,
    typing: &mut Typing,
    v: &mut [String],
    sliders: bool,
) -> bool {
    typing.sync(v);
    let mut changed = false;
    let read: Vec<Option<BigRational>> = v.iter().map(|s| parse_rational(s).ok()).collect();
    // as many fields to a row as fit (the fields wrap: n goes up to 16)
    let item = if sliders {
        ui.spacing().slider_width.max(54.0)
    } else {
        54.0
    } + 2.0 * ui.spacing().item_spacing.x;
    let per_row = ((ui.available_width() / item).floor() as usize).max(1);
    for row in (0..v.len()).collect::<Vec<_>>().chunks(per_row) {
        ui.horizontal(|ui| {
            for &k in row {
                ui.vertical(|ui| {
                    let s = &mut typing.shown[k];
                    let bad = parse_rational(s).is_err();
                    let mut edit = egui::TextEdit::singleline(s)
                        .id_salt((id, k))
                        .desired_width(54.0);
                    if bad {
                        edit = edit.text_color(crate::gui::theme::alert());
                    }
                    changed |= ui.add(edit).changed();
                    if sliders && let Some(h) = half_step_slider(ui, k, &read) {
                        let text = halves_text(h);
                        typing.shown[k] = text;
                        changed = true;
                    }
                });
            }
        });
    }
    typing.commit(v);
    changed
}

/// The largest λ a slider reaches, in halves (λ = 10).
const SLIDER_TOP_HALVES: i64 = 20;

/// The range of the slider of λ_{k+1} (0-based `k`) in halves: within 0 to
/// 10 and between its neighbours, λ_k ≥ λ_{k+1} ≥ λ_{k+2} (the view's λ is
/// weakly decreasing); `None` when no multiple of 1/2 lies between them.
pub fn slider_range(k: usize, lambda: &[Option<BigRational>]) -> Option<(i64, i64)> {
    let two = BigRational::from_integer(BigInt::from(2));
    let halves = |r: &BigRational, up: bool| -> i64 {
        let h = r * &two;
        let h = if up { h.ceil() } else { h.floor() };
        h.to_integer()
            .to_i64()
            .unwrap_or(if h.is_negative() { i64::MIN } else { i64::MAX })
    };
    let mut lo = 0i64;
    let mut hi = SLIDER_TOP_HALVES;
    if let Some(Some(right)) = lambda.get(k + 1) {
        lo = lo.max(halves(right, true));
    }
    if k > 0
        && let Some(Some(left)) = lambda.get(k - 1)
    {
        hi = hi.min(halves(left, false));
    }
    (lo <= hi).then_some((lo, hi))
}

/// A number of halves as an exact rational's text: `3`, `7/2`, `-1/2`.
pub fn halves_text(h: i64) -> String {
    if h % 2 == 0 {
        (h / 2).to_string()
    } else {
        format!("{h}/2")
    }
}

/// The slider of λ_{k+1} in steps of exactly 1/2, clamped to its neighbours
/// (see [`slider_range`]); the halves it was moved to, if it moved.
fn half_step_slider(ui: &mut egui::Ui, k: usize, lambda: &[Option<BigRational>]) -> Option<i64> {
    let Some((lo, hi)) = slider_range(k, lambda) else {
        ui.add_enabled(false, egui::Slider::new(&mut 0i64, 0..=1).show_value(false))
            .on_disabled_hover_text("no multiple of 1/2 lies between the neighbours of this entry");
        return None;
    };
    let two = BigRational::from_integer(BigInt::from(2));
    let mut h = lambda
        .get(k)
        .and_then(|r| r.as_ref())
        .and_then(|r| (r * &two).floor().to_integer().to_i64())
        .unwrap_or(lo)
        .clamp(lo, hi);
    let r = ui.add(
        egui::Slider::new(&mut h, lo..=hi)
            .show_value(false)
            .clamping(egui::SliderClamping::Always),
    );
    r.changed().then_some(h.clamp(lo, hi))
}

/// The heading and n; a new n resets λ to (n-1, ..., 1, 0) and the segment
/// to run from (1, 0, ..., 0) to it. Returns n.
fn heading_with_n(ui: &mut egui::Ui, place: &mut PermutohedronPlace) -> Option<usize> {
    let len = place.lambda.len();
    let fits = (2..=MAX_N).contains(&len) && place.from.len() == len && place.to.len() == len;
    let mut n = len.clamp(2, MAX_N);
    let mut chosen = false;
    ui.horizontal(|ui| {
        typeset::heading(ui, &Typeset::new().symbol("Permutohedron P_λ"));
        ui.separator();
        ui.label("n");
        chosen = ui
            .add(
                egui::DragValue::new(&mut n)
                    .range(2..=MAX_N)
                    .update_while_editing(false),
            )
            .changed();
        if !fits {
            chosen |= ui.button(format!("start over at n = {n}")).clicked();
        }
    });
    if chosen {
        let regular: Vec<String> = (0..n).rev().map(|k| k.to_string()).collect();
        place.lambda = regular.clone();
        place.to = regular;
        place.from = (0..n)
            .map(|k| if k == 0 { "1" } else { "0" }.to_string())
            .collect();
        return Some(n);
    }
    if !fits {
        ui.colored_label(
            crate::gui::theme::alert(),
            format!(
                "The session's λ, λ_a and λ_b have {len}, {} and {} entries; this view shows one n from 2 to {MAX_N} for all three. They are kept as they are (and saved unchanged) until you choose an n here.",
                place.from.len(),
                place.to.len()
            ),
        );
        return None;
    }
    Some(len)
}

/// Why the view does not list the mixed Eulerian numbers of n, if it does
/// not: the work is over the limit the `eulerian` command has.
fn eulerian_refusal(n: usize) -> Option<String> {
    use crate::math::limits::{EULERIAN_WORK_LIMIT, binomial, monomials_of_degree};
    let m = n as u64;
    let compositions = binomial(2 * m - 3, m - 2);
    let work = compositions.saturating_mul(monomials_of_degree(m - 1, m));
    (work > EULERIAN_WORK_LIMIT).then(|| {
        format!(
            "mixed Eulerian numbers at n = {n}: {compositions} compositions, each over {} monomials of degree {}, is {work} steps; at most {EULERIAN_WORK_LIMIT} are accepted (n <= 10)",
            monomials_of_degree(m - 1, m),
            m - 1
        )
    })
}

/// A decimal approximation: six decimals, or six significant digits with an
/// exponent for a large or tiny value.
fn approx(v: &BigRational) -> String {
    let x = rational_to_f64(v);
    if x != 0.0 && !(1e-3..1e7).contains(&x.abs()) {
        format!("{x:.6e}")
    } else {
        format!("{x:.6}")
    }
}

/// The exact volume of P_λ, with a decimal approximation.
fn volume_line(ui: &mut egui::Ui, slot: &mut Slot, engine: &Engine, lambda: &[BigRational]) {
    match slot.fetch(engine, JobKey::Volume(lambda.to_vec())) {
        Fetch::Ready(out) => {
            if let Some(v) = out.rational() {
                let exact = v.to_string();
                typeset::math_label(
                    ui,
                    &Typeset::new()
                        .symbol("Vol P_λ")
                        .plain(format!(
                            " = {}  (≈ {})",
                            super::super::typeset::grouped(&exact),
                            approx(v)
                        ))
                        .strong(),
                    &exact,
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
    let y_label = Typeset::new().symbol("Vol P_λ(t)").job(ui);
    let plot = Plot::new("volume_segment")
        .height(200.0)
        .x_axis_label("t")
        .y_axis_label(y_label)
        .y_grid_spacer(decimal_grid)
        .allow_scroll(false)
        .show(ui, |p| {
            p.line(Line::new("volume", pts.clone()).width(2.0));
            p.points(Points::new("exact samples", pts).radius(2.5));
            p.pointer_coordinate()
        });
    // the readout under the pointer: the exact sample nearest in t
    let hovered = plot.response.hovered();
    let nearest = plot.inner.filter(|_| hovered).and_then(|at| {
        samples.iter().min_by(|a, b| {
            let da = (rational_to_f64(&a.0) - at.x).abs();
            let db = (rational_to_f64(&b.0) - at.x).abs();
            da.total_cmp(&db)
        })
    });
    if let Some((t, v)) = nearest {
        typeset::label(
            ui,
            &Typeset::new().symbol(format!(
                "under the pointer: t = {t}, Vol P_λ(t) = {v} (≈ {:.4})",
                rational_to_f64(v)
            )),
        );
    } else if let (Some(first), Some(last)) = (samples.first(), samples.last()) {
        ui.weak(format!(
            "exact: Vol at t = 0 is {}, at t = 1 is {}",
            first.1, last.1
        ));
    }
}

/// Grid lines for the volume axis: ticks every [`tick_step`] (at most four
/// intervals on the axis, so each tick is labelled) and fainter lines at a
/// fifth of it.
fn decimal_grid(input: egui_plot::GridInput) -> Vec<egui_plot::GridMark> {
    let (lo, hi) = input.bounds;
    let step = tick_step(hi - lo, 4);
    let mut marks = Vec::new();
    for (size, fine) in [(step, false), (step / 5.0, true)] {
        let first = (lo / size).ceil() as i64;
        let last = (hi / size).floor() as i64;
        if last - first > 200 {
            continue;
        }
        for k in first..=last {
            if fine && k % 5 == 0 {
                continue;
            }
            marks.push(egui_plot::GridMark {
                value: k as f64 * size,
                step_size: size,
            });
        }
    }
    marks
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
    fn show(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx) {
        let look = figure_look(ctx.session);
        let place = &mut ctx.session.solid;
        let Some(n) = heading_with_n(ui, place) else {
            return;
        };
        typeset::label(
            ui,
            &Typeset::new().symbol(
                "λ (exact rationals: 3, 3/2, 1.25; the sliders step by 1/2 and keep λ_1 ≥ λ_2 ≥ … ≥ λ_n)",
            ),
        );
        rational_fields(
            ui,
            "lambda",
            &mut self.lambda_typing,
            &mut place.lambda,
            true,
        );
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
        typeset::label(
            ui,
            &Typeset::new().symbol("Volume along the segment from λ_a to λ_b"),
        );
        ui.horizontal_top(|ui| {
            typeset::label(ui, &Typeset::new().symbol("λ_a"));
            ui.vertical(|ui| {
                rational_fields(ui, "from", &mut self.from_typing, &mut place.from, false)
            });
        });
        ui.horizontal_top(|ui| {
            typeset::label(ui, &Typeset::new().symbol("λ_b"));
            ui.vertical(|ui| rational_fields(ui, "to", &mut self.to_typing, &mut place.to, false));
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
            typeset::label(
                ui,
                &Typeset::new()
                    .symbol("P_λ is drawn for n = 3 (the polygon) and n = 4 (a projection)."),
            );
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
        typeset::label(
            ui,
            &Typeset::new().symbol(format!("Mixed Eulerian numbers A_c of n = {n}")),
        )
        .on_hover_text("Ctrl+E exports them as CSV or as a LaTeX tabular");
        if let Some(why) = eulerian_refusal(n) {
            self.eulerian.clear();
            ui.add(
                egui::Label::new(egui::RichText::new(why).color(crate::gui::theme::alert())).wrap(),
            );
            return;
        }
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

impl super::View for PermutohedronView {
    fn kind(&self) -> crate::session::model::View {
        crate::session::model::View::Permutohedron
    }

    fn title(&self) -> &'static str {
        "Permutohedra"
    }

    fn ui(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx) {
        self.show(ui, ctx);
    }

    fn exports(&mut self, _session: &crate::session::Session) -> crate::gui::files::Exports {
        super::exports_of(self.figures(), self.tables())
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

    fn lam(v: &[&str]) -> Vec<Option<BigRational>> {
        v.iter().map(|s| parse_rational(s).ok()).collect()
    }

    #[test]
    fn a_slider_stays_between_its_neighbours() {
        // λ = (7/2, 2, 1): the slider of λ_2 runs from 1 to 7/2 (2 to 7 halves),
        // so λ_2 can no longer pass λ_1 = 7/2 (λ weakly decreasing, as in
        // Postnikov's P_λ with λ_1 ≥ ... ≥ λ_n)
        let l = lam(&["7/2", "2", "1"]);
        assert_eq!(slider_range(1, &l), Some((2, 7)));
        assert_eq!(halves_text(7), "7/2");
        assert_eq!(parse_rational(&halves_text(7)).ok(), l[0]);
        // the first slider is bounded by λ_2 below and 10 above, the last by λ_{n-1} above and 0 below
        assert_eq!(slider_range(0, &l), Some((4, SLIDER_TOP_HALVES)));
        assert_eq!(slider_range(2, &l), Some((0, 4)));
        // neighbours 1/3 and 1/4 have no multiple of 1/2 between them
        assert_eq!(slider_range(1, &lam(&["1/3", "0", "1/4"])), None);
        // a neighbour being typed does not bound the slider
        assert_eq!(
            slider_range(1, &lam(&["1/", "2", "1"])),
            Some((2, SLIDER_TOP_HALVES))
        );
    }

    #[test]
    fn the_slider_values_are_exact_halves() {
        for h in -3..=21 {
            let r = parse_rational(&halves_text(h)).unwrap();
            assert_eq!(
                r,
                BigRational::new(BigInt::from(h), BigInt::from(2)),
                "{h} halves"
            );
        }
    }

    #[test]
    fn ticks_are_one_two_or_five_times_a_power_of_ten() {
        // Vol P_λ from 2/3 to 16 along the demo's segment: ticks 0, 5, 10, 15
        assert_eq!(tick_step(16.0, 4), 5.0);
        assert_eq!(tick_step(1.0, 4), 0.5);
        assert_eq!(tick_step(250.0, 4), 100.0);
        assert_eq!(tick_step(20.0, 4), 5.0);
        for span in [0.7, 3.0, 42.0, 1234.5, 1e-5] {
            let s = tick_step(span, 4);
            assert!(span / s <= 4.0 && span / s >= 1.6, "{span}: {s}");
        }
        assert_eq!(tick_step(0.0, 4), 1.0);
    }

    #[test]
    fn a_half_typed_field_keeps_its_text_and_the_last_value_read() {
        let mut v = vec!["3".to_string(), "2".to_string()];
        let mut t = Typing::default();
        t.sync(&v);
        t.shown[0] = "1/".into();
        t.commit(&mut v);
        assert_eq!(v[0], "3");
        assert_eq!(t.shown[0], "1/");
        t.sync(&v);
        assert_eq!(t.shown[0], "1/");
        t.shown[0] = "1/2".into();
        t.commit(&mut v);
        assert_eq!(v[0], "1/2");
        // an entry changed elsewhere (a new n, a file opened) is shown
        v[1] = "5".into();
        t.sync(&v);
        assert_eq!(t.shown, ["1/2", "5"]);
    }
}
