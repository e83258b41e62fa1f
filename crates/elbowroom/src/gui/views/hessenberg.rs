//! Hessenberg classes: pick h by clicking boxes of an n×n grid (only valid
//! Hessenberg functions can be made), compute the table a^h_w = DS_h(S_w) on
//! the engine with progress and cancel, and browse it sorted by any column;
//! clicking a row makes w current everywhere. Beside the controls, the
//! staircase figure of h; both the figure and the table (in the order shown,
//! with a caption naming n, h and the order) export with Ctrl+E.

use super::fetch_ready;
use crate::engine::layout::{TableLayout, table_layout};
use crate::engine::requests::h_text;
use crate::engine::{Engine, Fetch, JobKey, Output, Slot};
use crate::figure::Scene;
use crate::figure::hessenberg::hessenberg_scene;
use crate::figure::look::Look;
use crate::gui::AppCtx;
use crate::gui::scene_painter::{self, PaintOptions};
use crate::gui::table_source::TableSource;
use crate::gui::typeset::{self, Typeset};
use crate::math::Perm;
use crate::math::hessenberg::function::{HessenbergFn, default_values, set_value};
use crate::math::hessenberg::table::{HessenbergTable, TABLE_MAX_N, TableEntry};
use crate::session::model::{HessenbergPlace, SortColumn};
use crate::tables::results::hessenberg_table;
use crate::tables::table::Table;
use eframe::egui::{self, Rect, Sense, Stroke, Vec2};
use num_traits::{Signed, Zero};
use std::sync::Arc;

/// Tables up to this n start as soon as h changes; larger ones wait for the button.
const AUTO_N: usize = 7;

/// The table's columns: the session's key for sorting by it, its header, and
/// its least width in characters (the w and a^h_w columns widen to the longest
/// entry, so that the columns stay aligned for n ≥ 10).
const COLUMNS: [(&str, &str, usize); 3] = [
    ("perm", "w", 12),
    ("length", "ℓ(w)", 6),
    ("value", "a^h_w", 14),
];

/// The widths of the columns in points, for a table whose longest w and
/// a^h_w are `perm_chars` and `value_chars` characters long.
fn column_widths(ui: &egui::Ui, perm_chars: usize, value_chars: usize) -> [f32; 3] {
    let font = egui::TextStyle::Monospace.resolve(ui.style());
    let glyph = ui.fonts_mut(|f| f.glyph_width(&font, '0'));
    let pad = 2.0 * ui.spacing().button_padding.x + 8.0;
    let [(_, _, p), (_, _, l), (_, _, v)] = COLUMNS;
    [
        glyph * perm_chars.max(p) as f32 + pad,
        glyph * l as f32 + pad,
        glyph * value_chars.max(v) as f32 + pad,
    ]
}

/// The Hessenberg view's UI state.
#[derive(Default)]
pub struct HessenbergView {
    table: Slot,
    /// The h whose table was asked for.
    pub wanted: Option<Vec<usize>>,
    /// The summary and row order of the table shown, arranged on the engine.
    layout: Slot,
    /// The table shown (keyed by h and its order on screen), for export.
    export: TableSource<OrderKey>,
    /// The row order shown, for the export to follow.
    order_shown: Option<(OrderKey, Arc<Output>)>,
    /// The staircase figure of h on screen, for export.
    figure: Option<(Vec<usize>, Look, Arc<Scene>)>,
}

/// A table in an order: h, the column sorted by, and whether descending.
type OrderKey = (Vec<usize>, String, bool);

/// How the rows are ordered, in words, for the caption of an export.
fn order_words(column: &str, descending: bool) -> &'static str {
    match (column, descending) {
        ("value", true) => "sorted by a^h_w, largest first",
        ("value", false) => "sorted by a^h_w, smallest first",
        ("length", true) => "sorted by the length l(w), longest first",
        ("length", false) => "sorted by the length l(w), shortest first",
        (_, true) => "sorted by w, lexicographically last first",
        (_, false) => "sorted by w, lexicographically",
    }
}

/// The caption of an exported table: what it is, n, h, the order and the count.
pub fn table_caption(table: &HessenbergTable, column: &str, descending: bool) -> Vec<String> {
    let tie = if descending {
        "ties in reverse lexicographic order of w"
    } else {
        "ties in lexicographic order of w"
    };
    vec![
        format!(
            "Schubert coefficients a^h_w of the Hessenberg class, n = {}, h = {}, {}; {} rows",
            table.h.n(),
            table.h,
            order_words(column, descending),
            table.entries.len()
        ),
        format!(
            "a^h_w = DS_h(S_w) is the coefficient of the Schubert class of w0 w, over l(w) = |h| = {}; rows in the order the explorer showed them ({tie})",
            table.h.dimension()
        ),
    ]
}

/// The header buttons: a click sorts by that column, a second click turns the order round.
fn sort_headers(ui: &mut egui::Ui, place: &mut HessenbergPlace, column: &str, widths: [f32; 3]) {
    ui.horizontal(|ui| {
        for ((key, name, _), width) in COLUMNS.into_iter().zip(widths) {
            let arrow = if column == key {
                if place.descending {
                    " (desc)"
                } else {
                    " (asc)"
                }
            } else {
                ""
            };
            let line = Typeset::new().symbol(name).plain(arrow).strong();
            let b = ui.add_sized(
                [width, ui.spacing().interact_size.y],
                egui::Button::new(line.job(ui)),
            );
            typeset::named(&b, egui::Role::Button, &line);
            if b.clicked() {
                if column == key {
                    place.descending = !place.descending;
                } else {
                    place.sort_by = SortColumn::from_key(key);
                    place.descending = key == "value";
                }
            }
        }
    });
}

/// One row of the table: w (a click picks it), ℓ(w), and a^h_w (negatives
/// alerted, zeros weak); true if w was clicked.
fn table_row(
    ui: &mut egui::Ui,
    entry: &TableEntry,
    current: &Perm,
    row_h: f32,
    widths: [f32; 3],
) -> (bool, bool) {
    let [perm_w, length_w, value_w] = widths;
    ui.horizontal(|ui| {
        let sel = ui.add_sized(
            [perm_w, row_h],
            egui::Button::selectable(
                entry.perm == *current,
                egui::RichText::new(entry.perm.to_string()).monospace(),
            ),
        );
        ui.add_sized(
            [length_w, row_h],
            egui::Label::new(entry.perm.length().to_string()),
        );
        let value = Typeset::new().poly(entry.value.to_string());
        let value = if entry.value.is_negative() {
            value.color(crate::gui::theme::alert())
        } else if entry.value.is_zero() {
            value.color(ui.visuals().weak_text_color())
        } else {
            value
        };
        let cell = ui.add_sized([value_w, row_h], egui::Label::new(value.job(ui)));
        typeset::named(&cell, egui::Role::Label, &value);
        let mut open_words = false;
        sel.context_menu(|ui| {
            if ui.button("open its words").clicked() {
                open_words = true;
                ui.close();
            }
        });
        (sel.clicked() || open_words, open_words)
    })
    .inner
}

impl HessenbergView {
    /// The tables this view can export: the coefficients a^h_w on screen.
    pub fn tables(&mut self) -> Vec<(String, Arc<Table>)> {
        let order = self.order_shown.clone();
        self.export
            .table(|key, out| {
                let table = out.hessenberg()?;
                let (_, layout) = order.as_ref().filter(|(k, _)| k == key)?;
                let Output::Layout(layout) = layout.as_ref() else {
                    return None;
                };
                let (_, column, descending) = key;
                Some(
                    hessenberg_table(table)
                        .reordered(&layout.rows)
                        .with_caption(table_caption(table, column, *descending)),
                )
            })
            .map(|(_, t)| ("the table of a^h_w".to_string(), t))
            .into_iter()
            .collect()
    }

    /// The figures this view can export: the staircase diagram of h.
    pub fn figures(&self) -> Vec<(String, Arc<Scene>)> {
        self.figure
            .iter()
            .map(|(h, _, s)| (format!("the staircase of h = {}", h_text(h)), s.clone()))
            .collect()
    }

    /// The staircase figure of `h` in `look`, drawn again only when either changed.
    fn figure_for(&mut self, h: &[usize], look: Look) -> Option<Arc<Scene>> {
        if let Some((k, l, s)) = &self.figure
            && k == h
            && *l == look
        {
            return Some(s.clone());
        }
        let f = HessenbergFn::new(h).ok()?;
        let s = Arc::new(hessenberg_scene(&f, &look));
        self.figure = Some((h.to_vec(), look, s.clone()));
        Some(s)
    }

    /// Draws the view.
    fn show(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx) {
        // an empty h means h(i) = i + 1 at the session's n: shown as that,
        // and left empty in the session until the user changes it
        let unset = ctx.session.hessenberg.h.is_empty();
        let default = default_values(ctx.session.n.clamp(2, TABLE_MAX_N));
        if unset {
            ctx.session.hessenberg.h = default.clone();
        }
        self.show_h(ui, ctx);
        if unset && ctx.session.hessenberg.h == default {
            ctx.session.hessenberg.h.clear();
        }
    }

    /// Draws the view for the session's h (not empty).
    fn show_h(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx) {
        let place = &mut ctx.session.hessenberg;
        if !(2..=TABLE_MAX_N).contains(&place.h.len()) {
            if kept_h(ui, place) {
                self.forget();
            }
            return;
        }
        if h_controls(ui, place) {
            // a new n: nothing of the old one stays asked for or shown
            self.forget();
        }
        typeset::label(
            ui,
            &Typeset::new()
                .plain("Click a box (i, j) above the diagonal to set h(i) = j; click the last box of a row to shrink it. The class of the Hessenberg variety is ")
                .symbol("Σ a^h_w σ_{w0 w}, a^h_w = DS_h(S_w)")
                .plain(" over ℓ(w) = |h|.")
                .color(ui.visuals().weak_text_color()),
        );
        let look = super::figure_look(ctx.session);
        ui.horizontal_top(|ui| {
            ui.vertical(|ui| {
                h_grid(ui, &mut ctx.session.hessenberg.h);
                ui.add_space(8.0);
                let h = ctx.session.hessenberg.h.clone();
                if let Some(scene) = self.figure_for(&h, look) {
                    ui.weak("the staircase of h (Ctrl+E exports it)");
                    // larger for a larger n, so that the labels stay readable
                    let side = (26.0 * h.len() as f32).max(200.0);
                    let opts = PaintOptions {
                        size: Some(egui::vec2(side, side)),
                        ..PaintOptions::default()
                    };
                    scene_painter::show(ui, &scene, &opts);
                }
            });
            ui.vertical(|ui| self.coefficient_table(ui, ctx));
        });
    }

    /// Forgets the table asked for and shown (dropping a running job cancels it).
    fn forget(&mut self) {
        self.wanted = None;
        self.table = Slot::default();
        self.layout = Slot::default();
    }

    /// The table of a^h_w for the h asked for: the button, the summary, the
    /// sortable rows (a click makes w current).
    fn coefficient_table(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx) {
        let h = ctx.session.hessenberg.h.clone();
        let Some(wanted) = self.wanted_h(ui, &h) else {
            ui.weak("press the button to compute");
            return;
        };
        if wanted != h {
            ui.weak(format!(
                "showing h = {}; press the button for the new h",
                h_text(&wanted)
            ));
        }
        let Some(out) = self.fetch_table(ui, ctx.engine, &wanted) else {
            return;
        };
        let Some(table) = out.hessenberg() else {
            return;
        };
        let place = &mut ctx.session.hessenberg;
        let column = place.sort_by.unwrap_or_default().key().to_string();
        let descending = place.descending;
        let key = JobKey::HessenbergLayout(wanted.clone(), column.clone(), descending);
        let shared = out.clone();
        let sort_by = column.clone();
        let arranged = self.layout.fetch_with(ctx.engine, key, move |p| {
            let Some(table) = shared.hessenberg() else {
                return Err(crate::math::MathError::InvalidInput(
                    "not a Hessenberg table".into(),
                ));
            };
            table_layout(table, &sort_by, descending, p).map(Output::Layout)
        });
        let layout = match arranged {
            Fetch::Ready(out) => out.clone(),
            Fetch::Running(..) => {
                ui.horizontal(|ui| {
                    ui.spinner();
                    ui.label("arranging the rows");
                });
                return;
            }
            Fetch::Failed(e) => {
                let e = e.clone();
                super::show_math_error(ui, &e);
                return;
            }
        };
        let Output::Layout(arranged) = layout.as_ref() else {
            return;
        };
        let order_key: OrderKey = (wanted.clone(), column.clone(), descending);
        self.export.note_shown(&order_key, &out);
        if self
            .order_shown
            .as_ref()
            .is_none_or(|(k, _)| *k != order_key)
        {
            self.order_shown = Some((order_key, layout.clone()));
        }
        let layout: &TableLayout = arranged;
        // "…; Σ a^h_w = 8; …" with a^h_w typeset
        let summary = match layout.summary.split_once("Σ a^h_w") {
            Some((before, after)) => Typeset::new().plain(before).symbol("Σ a^h_w").plain(after),
            None => Typeset::new().plain(layout.summary.as_str()),
        };
        typeset::label(ui, &summary);
        ui.weak("Ctrl+E exports this table as CSV or as a LaTeX tabular.");
        let current = ctx.perm();
        let place = &mut ctx.session.hessenberg;
        let widths = column_widths(ui, layout.perm_chars, layout.value_chars);
        sort_headers(ui, place, &column, widths);
        if let Some((w, open_words)) = rows_list(ui, table, &layout.rows, &current, widths) {
            ctx.go_to(w);
            if open_words {
                ctx.session.view = crate::session::model::View::Words;
            }
        }
    }

    /// The button "compute the table" (and the automatic start for small n);
    /// the h whose table was asked for, if any.
    fn wanted_h(&mut self, ui: &mut egui::Ui, h: &[usize]) -> Option<Vec<usize>> {
        let n = h.len();
        ui.horizontal(|ui| {
            if ui.button("compute the table").clicked() {
                self.wanted = Some(h.to_vec());
                self.table.retry();
            }
            if n <= AUTO_N {
                ui.weak("(computed as h changes for n <= 7)");
            }
        });
        if n <= AUTO_N {
            self.wanted = Some(h.to_vec());
        }
        self.wanted.clone()
    }

    /// The table for `h` once computed; until then its progress or failure is drawn.
    fn fetch_table(
        &mut self,
        ui: &mut egui::Ui,
        engine: &Engine,
        h: &[usize],
    ) -> Option<Arc<Output>> {
        fetch_ready(
            ui,
            &mut self.table,
            engine,
            JobKey::Hessenberg(h.to_vec()),
            |secs| format!("computing a^h_w ({})", super::elapsed_text(secs)),
        )
    }
}

/// The heading, n, h and |h|, and the buttons for the two extreme h; true
/// when n changed. A typed n counts once it is committed (Enter or leaving
/// the field), so typing "10" never asks for n = 1 on the way.
fn h_controls(ui: &mut egui::Ui, place: &mut HessenbergPlace) -> bool {
    let mut n = place.h.len();
    let mut n_changed = false;
    ui.horizontal_wrapped(|ui| {
        ui.heading("Hessenberg classes");
        ui.separator();
        ui.label("n");
        if ui
            .add(
                egui::DragValue::new(&mut n)
                    .range(2..=TABLE_MAX_N)
                    .update_while_editing(false),
            )
            .changed()
            && n != place.h.len()
        {
            place.h = default_values(n);
            n_changed = true;
        }
        ui.label(format!("h = {}", h_text(&place.h)));
        let dim: usize = place.h.iter().enumerate().map(|(k, v)| v - (k + 1)).sum();
        ui.label(format!("|h| = {dim}"));
        if ui.button("h(i) = i + 1").clicked() {
            place.h = default_values(n);
        }
        if ui.button("h(i) = n").clicked() {
            place.h = vec![n; n];
        }
    });
    n_changed
}

/// An h from the session that this view cannot show (n = 1, or n past the
/// tables' largest): said so, and kept as it is (saved unchanged) until the
/// user picks an n here; true once they do.
fn kept_h(ui: &mut egui::Ui, place: &mut HessenbergPlace) -> bool {
    let n = place.h.len().clamp(2, TABLE_MAX_N);
    ui.heading("Hessenberg classes");
    ui.colored_label(
        crate::gui::theme::alert(),
        format!(
            "The session's h = {} has n = {}; this view shows n from 2 to {TABLE_MAX_N}. It is kept as it is (and saved unchanged) until you choose an n here.",
            h_text(&place.h),
            place.h.len()
        ),
    );
    let go = ui.button(format!("start over at n = {n}")).clicked();
    if go {
        place.h = default_values(n);
    }
    go
}

/// The n×n grid of boxes picking h: box (i, j) is filled when j <= h(i);
/// a click on a box on or above the diagonal sets h(i) = j, or shrinks the
/// row when it is its last box.
fn h_grid(ui: &mut egui::Ui, h: &mut [usize]) {
    let n = h.len();
    let cell = (220.0 / n as f32).clamp(18.0, 34.0);
    let (rect, response) =
        ui.allocate_exact_size(Vec2::splat(cell * n as f32 + 2.0), Sense::click());
    let painter = ui.painter_at(rect);
    let hover = response.hover_pos();
    for i in 1..=n {
        for j in 1..=n {
            let min =
                rect.min + Vec2::new((j - 1) as f32 * cell + 1.0, (i - 1) as f32 * cell + 1.0);
            let r = Rect::from_min_size(min, Vec2::splat(cell));
            let hovered = hover.is_some_and(|p| r.contains(p));
            paint_box(ui, &painter, r, (i, j), j <= h[i - 1], hovered, cell);
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

/// One box (i, j) of the h grid: faint below the diagonal, filled inside h,
/// a dot on the diagonal, outlined strongly when hovered on or above it.
fn paint_box(
    ui: &egui::Ui,
    painter: &egui::Painter,
    r: Rect,
    (i, j): (usize, usize),
    inside: bool,
    hovered: bool,
    cell: f32,
) {
    let visuals = ui.visuals();
    let line = Stroke::new(1.0, visuals.widgets.noninteractive.bg_stroke.color);
    let fill = if j < i {
        visuals.faint_bg_color
    } else if inside {
        visuals.selection.bg_fill
    } else {
        visuals.extreme_bg_color
    };
    painter.rect_filled(r.shrink(1.0), 2.0, fill);
    painter.rect_stroke(r.shrink(1.0), 2.0, line, egui::StrokeKind::Inside);
    if j == i {
        painter.circle_filled(r.center(), cell * 0.12, visuals.text_color());
    }
    if hovered && j >= i {
        painter.rect_stroke(
            r.shrink(1.0),
            2.0,
            Stroke::new(2.0, visuals.strong_text_color()),
            egui::StrokeKind::Inside,
        );
    }
}

/// The rows of the table in `order`, drawn virtually; the w clicked, if any.
fn rows_list(
    ui: &mut egui::Ui,
    table: &HessenbergTable,
    order: &[usize],
    current: &Perm,
    widths: [f32; 3],
) -> Option<(Perm, bool)> {
    let mut chosen: Option<(Perm, bool)> = None;
    let row_h = ui.spacing().interact_size.y;
    egui::ScrollArea::vertical()
        .id_salt("hessenberg_rows")
        .auto_shrink([false, false])
        .show_rows(ui, row_h, order.len(), |ui, rows| {
            for r in rows {
                let Some(entry) = order.get(r).and_then(|&i| table.entries.get(i)) else {
                    continue;
                };
                let (clicked, open_words) = table_row(ui, entry, current, row_h, widths);
                if clicked {
                    chosen = Some((entry.perm.clone(), open_words));
                }
            }
        });
    chosen
}

impl super::View for HessenbergView {
    fn kind(&self) -> crate::session::model::View {
        crate::session::model::View::Hessenberg
    }

    fn title(&self) -> &'static str {
        "Hessenberg classes"
    }

    fn ui(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx) {
        self.show(ui, ctx);
    }

    fn exports(&mut self, _session: &crate::session::Session) -> crate::gui::files::Exports {
        // the table comes before the figure of h
        let mut v = super::exports_of(Vec::new(), self.tables());
        v.extend(super::exports_of(self.figures(), Vec::new()));
        v
    }
}
