//! Forest polynomials: an indexed forest drawn standing on the number line
//! (terminal nodes filled, each node's label range on hover, a click on a
//! terminal node trims it: T_i P_F = P_{F/i}), its polynomial P_F typeset, and
//! the forest expansion of the current S_w as rows (c_{w,F}, the forest drawn
//! small, its code; a click opens it). [`small_forest`] draws a small forest
//! from a code for any view; [`forest_rows`] lists forest terms.

use super::{fetch_or_explain, figure_look};
use crate::engine::forest_jobs::ForestRows;
use crate::engine::{JobKey, Slot};
use crate::figure::forest::forest_scene;
use crate::figure::look::Look;
use crate::figure::{Scene, Tag};
use crate::gui::AppCtx;
use crate::gui::scene_painter::{self, PaintOptions};
use crate::gui::typeset::{self, Typeset};
use crate::math::Perm;
use crate::math::forest::indexed::{Forest, code_text};
use crate::math::forest::polynomial::label_bounds;
use eframe::egui;
use num_traits::Signed;
use std::sync::Arc;

/// The forest view's UI state.
#[derive(Default)]
pub struct ForestView {
    /// The code of the forest shown (None until the view first opens: then
    /// the code of the current w, the leading forest of S_w).
    code: Option<Vec<usize>>,
    /// The code field, as typed.
    typed: String,
    /// Why the typed code was not taken.
    typed_error: Option<String>,
    /// The last trim, as a sentence.
    last_trim: Option<String>,
    poly: Slot,
    expansion: Slot,
    /// The scene on screen, keyed by code and look.
    figure: Option<(Vec<usize>, Look, Arc<Scene>)>,
    /// Where the forest was drawn last frame and at what scale (screen points per figure unit).
    pub canvas: Option<(egui::Rect, f32)>,
}

/// Reads a code typed as `1,0,2` or `1 0 2` (empty: the empty forest).
pub fn read_code(text: &str) -> Result<Forest, String> {
    let mut code = Vec::new();
    for piece in text
        .split(|c: char| c == ',' || c.is_whitespace())
        .filter(|p| !p.is_empty())
    {
        let v = piece
            .parse::<usize>()
            .map_err(|_| format!("\"{piece}\" is not a whole number; type a code like 1,0,2"))?;
        code.push(v);
    }
    Forest::from_code(&code).map_err(|e| e.to_string())
}

/// The code of w without trailing zeros: the leading forest of S_w.
fn code_of(w: &Perm) -> Vec<usize> {
    let mut c = w.code();
    while c.last() == Some(&0) {
        c.pop();
    }
    c
}

/// Draws the forest of `code` small (no labels), `height` points high at
/// most; the response is hovered and clicked as one widget. An invalid code
/// draws nothing but a `?`.
pub fn small_forest(ui: &mut egui::Ui, code: &[usize], height: f32, look: &Look) -> egui::Response {
    let Ok(forest) = Forest::from_code(code) else {
        return ui.label("?");
    };
    let look = Look {
        labels: false,
        ..*look
    };
    let scene = forest_scene(&forest, &look);
    let scale = (height / scene.height).min(1.0);
    let opts = PaintOptions {
        highlight: Vec::new(),
        max_scale: scale,
        size: Some(egui::vec2(scene.width * scale, scene.height * scale)),
    };
    scene_painter::show(ui, &scene, &opts).response
}

/// Forest terms as rows: the coefficient (negatives marked), the forest drawn
/// small, its code and one-line notation; the code clicked, if any.
pub fn forest_rows(
    ui: &mut egui::Ui,
    id: &str,
    rows: &ForestRows,
    heading: &str,
    look: &Look,
) -> Option<Vec<usize>> {
    const ROW: f32 = 48.0;
    let mut chosen = None;
    ui.horizontal(|ui| {
        typeset::label(ui, &Typeset::new().symbol(heading).strong());
        ui.weak(format!(
            "({} forest{})",
            rows.len(),
            if rows.len() == 1 { "" } else { "s" }
        ));
    });
    egui::ScrollArea::vertical()
        .id_salt(id)
        .auto_shrink([false, true])
        .max_height(ui.available_height().max(ROW * 3.0))
        .show_rows(ui, ROW, rows.len(), |ui, range| {
            for r in range {
                let Some((code, c)) = rows.get(r) else {
                    continue;
                };
                ui.horizontal(|ui| {
                    ui.set_height(ROW - ui.spacing().item_spacing.y);
                    let text = egui::RichText::new(format!("{c:>6}")).monospace();
                    let text = if c.is_negative() {
                        text.color(crate::gui::theme::alert())
                    } else {
                        text
                    };
                    ui.label(text);
                    let drawn = small_forest(ui, code, ROW - 8.0, look);
                    let plain =
                        Forest::from_code(code).map_or_else(|_| "?".into(), |f| f.to_string());
                    let b = ui
                        .add(egui::Button::new(
                            egui::RichText::new(format!("{}  {plain}", code_text(code)))
                                .monospace(),
                        ))
                        .on_hover_text("open this forest");
                    if b.clicked() || drawn.clicked() {
                        chosen = Some(code.clone());
                    }
                });
            }
        });
    chosen
}

impl ForestView {
    /// The code of the forest shown (None before the view first opens).
    pub fn code(&self) -> Option<&[usize]> {
        self.code.as_deref()
    }

    /// The figures this view can export: the forest shown.
    pub fn figures(&self) -> Vec<(String, Arc<Scene>)> {
        self.figure
            .iter()
            .map(|(code, _, s)| (format!("the forest of code {}", code_text(code)), s.clone()))
            .collect()
    }

    /// Opens the forest of `code`.
    fn open(&mut self, code: Vec<usize>) {
        self.typed = code
            .iter()
            .map(|c| c.to_string())
            .collect::<Vec<_>>()
            .join(",");
        self.typed_error = None;
        self.code = Some(code);
    }

    /// The forest's scene in `look`, built again only when either changed.
    fn scene_for(&mut self, forest: &Forest, look: Look) -> Arc<Scene> {
        if let Some((c, l, s)) = &self.figure
            && c == forest.code()
            && *l == look
        {
            return s.clone();
        }
        let s = Arc::new(forest_scene(forest, &look));
        self.figure = Some((forest.code().to_vec(), look, s.clone()));
        s
    }

    /// Draws the view.
    pub fn ui(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx) {
        let w = ctx.perm();
        if self.code.is_none() {
            self.open(code_of(&w));
        }
        typeset::heading(
            ui,
            &Typeset::new()
                .plain("Forest polynomials ")
                .symbol("P_F")
                .plain(" (indexed forests on the leaves 1, 2, 3, …)"),
        );
        self.code_field(ui, &w);
        let code = self.code.clone().unwrap_or_default();
        let Ok(forest) = Forest::from_code(&code) else {
            return;
        };
        let look = figure_look(ctx.session);
        ui.horizontal_top(|ui| {
            let half = (ui.available_width() * 0.55).max(240.0);
            ui.vertical(|ui| {
                ui.set_width(half);
                self.forest_panel(ui, ctx, &forest, look);
            });
            ui.vertical(|ui| {
                let rows_key = JobKey::ForestExpansion(w.clone());
                typeset::label(
                    ui,
                    &Typeset::new()
                        .symbol(format!("S_{{{w}}} = Σ c_{{w,F}} P_F"))
                        .plain(" (all coefficients nonnegative)"),
                );
                let Some(out) = fetch_or_explain(
                    ui,
                    &mut self.expansion,
                    ctx.engine,
                    rows_key,
                    "expanding S_w in forest polynomials",
                ) else {
                    return;
                };
                let Some(rows) = out.forests() else {
                    return;
                };
                if let [(_, c)] = rows.as_slice()
                    && c == &num_rational::BigRational::from_integer(1.into())
                {
                    ui.label("S_w is a single forest polynomial.");
                }
                if let Some(c) = forest_rows(ui, "forest_expansion", rows, "c_{w,F}, F", &look) {
                    self.last_trim = None;
                    self.open(c);
                }
            });
        });
    }

    /// The code field, with buttons for the forest of w and the empty forest.
    fn code_field(&mut self, ui: &mut egui::Ui, w: &Perm) {
        ui.horizontal(|ui| {
            ui.label("code");
            let edit = ui.add(
                egui::TextEdit::singleline(&mut self.typed)
                    .id_salt("forest_code")
                    .font(egui::TextStyle::Monospace)
                    .desired_width(160.0),
            );
            let enter = edit.lost_focus() && ui.input(|i| i.key_pressed(egui::Key::Enter));
            if ui.button("show").clicked() || enter {
                match read_code(&self.typed) {
                    Ok(f) => {
                        self.last_trim = None;
                        self.open(f.code().to_vec());
                    }
                    Err(e) => self.typed_error = Some(e),
                }
            }
            if ui
                .button(format!("the forest of code(w), w = {w}"))
                .clicked()
            {
                self.last_trim = None;
                self.open(code_of(w));
            }
        });
        if let Some(e) = &self.typed_error {
            ui.colored_label(crate::gui::theme::alert(), e);
        }
    }

    /// The forest drawn (hover: label ranges; click a terminal node: trim),
    /// its notation and P_F.
    fn forest_panel(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx, forest: &Forest, look: Look) {
        let terminals: Vec<String> = forest.terminals().iter().map(|i| i.to_string()).collect();
        typeset::math_label(
            ui,
            &Typeset::new().plain(format!(
                "F = {forest}   code {}   |F| = {}   terminal nodes at {}",
                code_text(forest.code()),
                forest.size(),
                if terminals.is_empty() {
                    "none".to_string()
                } else {
                    terminals.join(", ")
                }
            )),
            &forest.to_string(),
        );
        let scene = self.scene_for(forest, look);
        let width = ui.available_width();
        let opts = PaintOptions {
            highlight: Vec::new(),
            max_scale: 2.0,
            size: Some(egui::vec2(width, 260.0)),
        };
        let resp = scene_painter::show(ui, &scene, &opts);
        self.canvas = Some((resp.response.rect, resp.scale));
        if let Some(Tag::Node(k)) = resp.clicked_where(|t| matches!(t, Tag::Node(_)))
            && let Some(v) = forest.nodes().get(k)
            && v.is_terminal()
            && let Some(g) = forest.trim(v.lo)
        {
            self.last_trim = Some(format!(
                "T_{} P_{{{}}} = P_{{{}}}",
                v.lo,
                code_text(forest.code()),
                code_text(g.code())
            ));
            self.open(g.code().to_vec());
        } else if let Some(Tag::Node(k)) = resp.hovered_where(|t| matches!(t, Tag::Node(_)))
            && let Some(v) = forest.nodes().get(k)
        {
            let top = label_bounds(forest).get(k).copied().unwrap_or(v.rho);
            let mut line = format!(
                "node over the leaves {}..{}: κ(v) ≤ ρ(v) = {}; in the labelings κ(v) takes the values 1..{top}",
                v.lo, v.hi, v.rho
            );
            if v.is_terminal() {
                line.push_str(&format!(
                    "; terminal at {}: click to trim (T_{})",
                    v.lo, v.lo
                ));
            }
            resp.response.on_hover_ui(|ui| {
                typeset::label(ui, &Typeset::new().symbol(line));
            });
        }
        ui.weak("Click a filled (terminal) node to trim it; Ctrl+E exports the forest.");
        if let Some(t) = &self.last_trim {
            typeset::label(ui, &Typeset::new().symbol(t.clone()));
        }
        let key = JobKey::ForestPolynomial(forest.code().to_vec());
        let Some(out) = fetch_or_explain(ui, &mut self.poly, ctx.engine, key, "computing P_F")
        else {
            return;
        };
        let Some(p) = out.poly() else {
            return;
        };
        let text = p.to_text();
        egui::ScrollArea::vertical()
            .id_salt("forest_poly")
            .max_height(140.0)
            .show(ui, |ui| {
                typeset::math_label(ui, &Typeset::new().symbol("P_F = ").poly(&text), &text);
            });
        ui.weak(format!(
            "{} terms, {} labelings",
            p.len(),
            p.coefficient_sum()
        ));
    }
}

impl super::View for ForestView {
    fn kind(&self) -> crate::session::model::View {
        crate::session::model::View::Forests
    }

    fn title(&self) -> &'static str {
        "Forest polynomials"
    }

    fn ui(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx) {
        ForestView::ui(self, ui, ctx);
    }

    fn exports(&mut self, _session: &crate::session::Session) -> crate::gui::files::Exports {
        super::exports_of(self.figures(), Vec::new())
    }
}
