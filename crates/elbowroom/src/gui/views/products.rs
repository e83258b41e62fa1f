//! Products and expansions: the structure constants of S_u · S_v = Σ c^w_{uv} S_w
//! (stably or in H*(Fl_n)), and the Schubert expansion of a typed polynomial,
//! each computed on the engine by the functions the commands `product` and
//! `expand` use. The result is a list of rows (c_w, w, ℓ(w)); a click on a row
//! makes w current; negative coefficients are marked.

use super::{fetch_ready, typed_poly_fits};
use crate::engine::JobKey;
use crate::engine::Slot;
use crate::engine::requests::Terms;
use crate::gui::AppCtx;
use crate::gui::typeset::{self, Typeset};
use crate::math::{MAX_N, Perm};
use crate::session::model::ProductsPlace;
use eframe::egui;
use num_traits::Signed;

/// The longest text a field for a permutation accepts before it is read.
const PERM_TEXT_LIMIT: usize = 80;

/// The view's UI state: its inputs are in the session
/// ([`crate::session::model::ProductsPlace`]); results come from the engine.
#[derive(Default)]
pub struct ProductsView {
    product: Slot,
    expansion: Slot,
}

/// Reads a typed permutation (bounded text), or says what is wrong.
fn read_perm(text: &str) -> Result<Perm, String> {
    if text.len() > PERM_TEXT_LIMIT {
        return Err(format!(
            "{} characters; a permutation is typed in at most {PERM_TEXT_LIMIT}",
            text.len()
        ));
    }
    Perm::parse(text).map_err(|e| e.to_string())
}

/// A typed permutation's field with the buttons that fill it: the current
/// permutation and each pin.
fn factor_field(ui: &mut egui::Ui, name: &str, text: &mut String, current: &str, ctx: &AppCtx) {
    ui.horizontal(|ui| {
        ui.label(format!("{name} ="));
        ui.add(
            egui::TextEdit::singleline(text)
                .id_salt(("product_factor", name))
                .font(egui::TextStyle::Monospace)
                .hint_text(current)
                .desired_width(160.0),
        );
        if ui
            .small_button("current")
            .on_hover_text("the current permutation")
            .clicked()
        {
            *text = current.to_string();
        }
        ui.menu_button("pins", |ui| {
            if ctx.session.pins.is_empty() {
                ui.weak("no pins");
            }
            for pin in &ctx.session.pins {
                let Ok(w) = Perm::from_one_line(pin) else {
                    continue;
                };
                if ui.button(w.to_string()).clicked() {
                    *text = w.to_string();
                    ui.close();
                }
            }
        });
    });
}

/// The width a monospace text of `chars` characters takes.
fn mono_width(ui: &egui::Ui, chars: usize) -> f32 {
    let font = egui::TextStyle::Monospace.resolve(ui.style());
    let w = ui.fonts_mut(|f| f.glyph_width(&font, '0'));
    w * chars as f32 + 2.0 * ui.spacing().button_padding.x
}

/// A cell of a row: `add` drawn in a box `width` wide, against its right
/// edge (numbers) or its left edge.
fn cell<R>(
    ui: &mut egui::Ui,
    width: f32,
    height: f32,
    right: bool,
    add: impl FnOnce(&mut egui::Ui) -> R,
) -> R {
    let layout = if right {
        egui::Layout::right_to_left(egui::Align::Center)
    } else {
        egui::Layout::left_to_right(egui::Align::Center)
    };
    ui.allocate_ui_with_layout(egui::vec2(width, height), layout, |ui| {
        ui.set_min_size(egui::vec2(width, height));
        add(ui)
    })
    .inner
}

/// The permutation a row stands for, in the current S_n when it fits there.
fn as_current(w: &Perm, n: usize) -> Perm {
    let m = n.max(w.n()).min(MAX_N);
    w.embed(m).unwrap_or_else(|_| w.clone())
}

/// The terms as rows (coefficient, w, ℓ(w)), drawn virtually, negative
/// coefficients in the alert colour and marked "negative"; the w clicked
/// (written in the current S_n when it fits), if any.
pub fn terms_list(ui: &mut egui::Ui, id: &str, terms: &Terms, ctx: &AppCtx) -> Option<Perm> {
    if terms.terms.is_empty() {
        return None;
    }
    let current = ctx.perm();
    let n = ctx.session.n;
    let coef_chars = terms
        .terms
        .iter()
        .map(|(_, c)| c.to_string().len())
        .max()
        .unwrap_or(1)
        .max(6);
    let perm_chars = terms
        .terms
        .iter()
        .map(|(w, _)| w.to_string().len())
        .max()
        .unwrap_or(1)
        .max(4);
    let coef_w = mono_width(ui, coef_chars);
    let perm_w = mono_width(ui, perm_chars);
    let len_w = mono_width(ui, 5);
    let row_h = ui.spacing().interact_size.y;
    ui.horizontal(|ui| {
        cell(ui, coef_w, row_h, true, |ui| {
            typeset::label(ui, &Typeset::new().symbol("c_w").strong())
        });
        cell(ui, perm_w, row_h, false, |ui| ui.strong("w"));
        cell(ui, len_w, row_h, true, |ui| ui.strong("ℓ(w)"));
    });
    let mut chosen = None;
    egui::ScrollArea::vertical()
        .id_salt(id)
        .auto_shrink([false, true])
        .max_height(ui.available_height().max(row_h * 4.0))
        .show_rows(ui, row_h, terms.terms.len(), |ui, rows| {
            for r in rows {
                let Some((w, c)) = terms.terms.get(r) else {
                    continue;
                };
                ui.horizontal(|ui| {
                    let negative = c.is_negative();
                    let text = egui::RichText::new(c.to_string()).monospace();
                    let text = if negative {
                        text.color(crate::gui::theme::alert())
                    } else {
                        text
                    };
                    cell(ui, coef_w, row_h, true, |ui| ui.label(text));
                    let target = as_current(w, n);
                    let b = cell(ui, perm_w, row_h, false, |ui| {
                        ui.add(egui::Button::selectable(
                            target == current,
                            egui::RichText::new(w.to_string()).monospace(),
                        ))
                    })
                    .on_hover_text("make this permutation current");
                    cell(ui, len_w, row_h, true, |ui| {
                        ui.label(egui::RichText::new(w.length().to_string()).monospace())
                    });
                    if negative {
                        ui.colored_label(crate::gui::theme::alert(), "negative");
                    }
                    if b.clicked() {
                        chosen = Some(target);
                    }
                });
            }
        });
    chosen
}

/// One line about an expansion: how many terms, and whether some coefficient is negative.
pub fn terms_summary(ui: &mut egui::Ui, terms: &Terms) {
    let k = terms.terms.len();
    if k == 0 {
        ui.label("the result is 0 (no terms)");
        return;
    }
    let count = if k == 1 {
        "1 term".to_string()
    } else {
        format!("{} terms", typeset::grouped(&k.to_string()))
    };
    if terms.has_negative() {
        ui.colored_label(
            crate::gui::theme::alert(),
            format!("{count}; some coefficients are negative (marked)"),
        );
    } else {
        ui.label(format!("{count}; every coefficient is nonnegative"));
    }
}

impl ProductsView {
    /// Draws the view.
    fn show(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx) {
        ui.heading("Products and expansions");
        typeset::label(
            ui,
            &Typeset::new()
                .symbol("S_u · S_v = Σ c^w_{uv} S_w")
                .plain(" by transition and Monk's rule; a click on a row makes w current.")
                .color(ui.visuals().weak_text_color()),
        );
        ui.columns(2, |cols| {
            self.product_side(&mut cols[0], ctx);
            self.expansion_side(&mut cols[1], ctx);
        });
    }

    fn product_side(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx) {
        typeset::label(ui, &Typeset::new().symbol("S_u · S_v").strong());
        let current = ctx.perm().to_string();
        let mut place = ctx.session.products.clone();
        factor_field(ui, "u", &mut place.u, &current, ctx);
        factor_field(ui, "v", &mut place.v, &current, ctx);
        ui.horizontal(|ui| {
            typeset::radio(
                ui,
                &mut place.stable,
                true,
                &Typeset::new().symbol("stably (w in S_∞)"),
            );
            typeset::radio(
                ui,
                &mut place.stable,
                false,
                &Typeset::new().symbol("in H*(Fl_n)"),
            );
            if !place.stable {
                ui.label("n");
                ui.add(
                    egui::DragValue::new(&mut place.n)
                        .range(1..=MAX_N)
                        .update_while_editing(false),
                );
            }
        });
        if place != ctx.session.products {
            ctx.session.products = place;
        }
        let key = match product_key(&ctx.session.products, &current) {
            Ok(k) => k,
            Err(e) => {
                ui.add(
                    egui::Label::new(egui::RichText::new(e).color(crate::gui::theme::alert()))
                        .wrap(),
                );
                return;
            }
        };
        if let JobKey::Product(u, v, Some(n)) = &key
            && *n != ctx.session.products.n
        {
            ui.weak(format!(
                "in H*(Fl_{n}): n is raised from {} to hold u = {u} and v = {v}",
                ctx.session.products.n
            ));
        }
        ui.separator();
        let Some(out) = fetch_ready(ui, &mut self.product, ctx.engine, key, |secs| {
            format!("multiplying ({})", super::elapsed_text(secs))
        }) else {
            return;
        };
        let Some(terms) = out.terms() else {
            return;
        };
        terms_summary(ui, terms);
        if let Some(w) = terms_list(ui, "product_rows", terms, ctx) {
            ctx.go_to(w);
        }
    }

    fn expansion_side(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx) {
        ui.strong("Schubert expansion of a polynomial");
        let mut place = ctx.session.products.clone();
        ui.add(
            egui::TextEdit::singleline(&mut place.poly)
                .id_salt("product_poly")
                .font(egui::TextStyle::Monospace)
                .desired_width(f32::INFINITY),
        );
        let n = place.poly_n;
        ui.horizontal_wrapped(|ui| {
            ui.label("n");
            ui.add(
                egui::DragValue::new(&mut place.poly_n)
                    .range(1..=MAX_N)
                    .update_while_editing(false),
            )
            .on_hover_text("the expansion's own n (the left panel's n is not used)");
            typeset::radio(
                ui,
                &mut place.poly_stable,
                false,
                &Typeset::new().symbol(format!("in H*(Fl_{n})")),
            );
            typeset::radio(
                ui,
                &mut place.poly_stable,
                true,
                &Typeset::new().symbol(format!("stably, in Q[x1, …, x{n}] over S_∞")),
            );
        });
        if place != ctx.session.products {
            ctx.session.products = place;
        }
        let place = &ctx.session.products;
        if !typed_poly_fits(ui, &place.poly) {
            return;
        }
        ui.separator();
        let key = JobKey::Expansion(place.poly.clone(), place.poly_n, place.poly_stable);
        let Some(out) = fetch_ready(ui, &mut self.expansion, ctx.engine, key, |secs| {
            format!("expanding ({})", super::elapsed_text(secs))
        }) else {
            return;
        };
        let Some(terms) = out.terms() else {
            return;
        };
        terms_summary(ui, terms);
        if let Some(w) = terms_list(ui, "expansion_rows", terms, ctx) {
            ctx.go_to(w);
        }
    }
}

/// The key of the product the session asks for (an empty factor is the
/// current permutation, `current`), or the reason there is none. In
/// H*(Fl_n), n is raised to hold u and v.
pub fn product_key(place: &ProductsPlace, current: &str) -> Result<JobKey, String> {
    let text = |t: &str| {
        if t.trim().is_empty() {
            current.to_string()
        } else {
            t.to_string()
        }
    };
    let u = read_perm(&text(&place.u)).map_err(|e| format!("u: {e}"))?;
    let v = read_perm(&text(&place.v)).map_err(|e| format!("v: {e}"))?;
    if place.stable {
        return Ok(JobKey::Product(u, v, None));
    }
    let n = place.n.max(u.n()).max(v.n()).clamp(1, MAX_N);
    Ok(JobKey::Product(u, v, Some(n)))
}

impl super::View for ProductsView {
    fn kind(&self) -> crate::session::model::View {
        crate::session::model::View::Products
    }

    fn title(&self) -> &'static str {
        "Products & expansions"
    }

    fn ui(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx) {
        self.show(ui, ctx);
    }
}
