//! The polynomial workbench: type a polynomial, see parse errors marked at
//! their column, and its divided symmetrization DS_n (or DS_h for the
//! Hessenberg view's h), exactly, with its expansion in monomial symmetric
//! functions.

use super::computing;
use crate::engine::requests::Output;
use crate::engine::{Fetch, JobKey, Slot};
use crate::gui::AppCtx;
use crate::math::MathError;
use crate::math::poly::parse::parse_poly;
use eframe::egui;

/// The workbench's UI state.
#[derive(Default)]
pub struct WorkbenchView {
    divsym: Slot,
    normal: Slot,
    parsed: Option<(String, usize, Result<String, MathError>)>,
}

/// Shows a parse error: the message and the input with a caret under the column.
pub fn show_parse_error(ui: &mut egui::Ui, e: &MathError) {
    let alert = crate::gui::theme::alert();
    match e {
        MathError::Syntax {
            input,
            column,
            expected,
            ..
        } => {
            ui.colored_label(alert, format!("column {column}: {expected}"));
            let caret = format!("{}^", " ".repeat(column.saturating_sub(1)));
            ui.label(
                egui::RichText::new(format!("{input}\n{caret}"))
                    .monospace()
                    .color(alert),
            );
        }
        other => {
            ui.colored_label(alert, other.to_string());
        }
    }
}

impl WorkbenchView {
    /// Draws the view.
    pub fn ui(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx) {
        ui.heading("Polynomial workbench");
        ui.weak("Type a polynomial in x1..xn: + - * ^ /, implicit products, parentheses, rational constants (e.g. x1^2 x2 - 3/2 x3).");
        if ctx.session.workbench.poly.is_empty() {
            ctx.session.workbench.poly = "x1^2 x2 + x1 x2 x3".into();
        }
        ui.add(
            egui::TextEdit::singleline(&mut ctx.session.workbench.poly)
                .id_salt("workbench_poly")
                .font(egui::TextStyle::Monospace)
                .desired_width(f32::INFINITY),
        );
        let hview = &ctx.session.hessenberg.h;
        let n = ctx.session.n.max(2);
        ui.horizontal(|ui| {
            ui.radio_value(
                &mut ctx.session.workbench.use_h,
                false,
                format!("DS_n with n = {n} (the current S_n)"),
            );
            let htext: Vec<String> = hview.iter().map(|v| v.to_string()).collect();
            ui.add_enabled_ui(!hview.is_empty(), |ui| {
                let label = if hview.is_empty() {
                    "DS_h with the h chosen in the Hessenberg view (none chosen yet)".to_string()
                } else {
                    format!(
                        "DS_h with h = ({}) from the Hessenberg view",
                        htext.join(",")
                    )
                };
                ui.radio_value(&mut ctx.session.workbench.use_h, true, label);
            });
        });
        let h: Vec<usize> = if ctx.session.workbench.use_h && !hview.is_empty() {
            hview.clone()
        } else {
            crate::math::hessenberg::function::default_values(n)
        };
        let text = ctx.session.workbench.poly.clone();
        let stale = self
            .parsed
            .as_ref()
            .is_none_or(|(t, m, _)| *t != text || *m != h.len());
        if stale {
            let r = parse_poly(&text, Some(h.len())).map(|p| p.to_text());
            self.parsed = Some((text.clone(), h.len(), r));
        }
        let Some((_, _, parsed)) = &self.parsed else {
            return;
        };
        match parsed {
            Err(e) => {
                show_parse_error(ui, e);
                return;
            }
            Ok(p) => {
                ui.label(egui::RichText::new(format!("f = {p}")).monospace());
            }
        }
        ui.separator();
        match self
            .divsym
            .fetch(ctx.engine, JobKey::DivSym(text, h.clone()))
        {
            Fetch::Ready(out) => {
                if let Output::DivSym(d) = out.as_ref() {
                    let name = if ctx.session.workbench.use_h {
                        "DS_h(f)"
                    } else {
                        "DS_n(f)"
                    };
                    ui.label(
                        egui::RichText::new(format!("{name} = {}", d.value.to_text()))
                            .monospace()
                            .strong(),
                    );
                    if !d.symmetric.is_empty() {
                        let parts: Vec<String> = d
                            .symmetric
                            .iter()
                            .map(|(lam, c)| {
                                let l: Vec<String> = lam.iter().map(|x| x.to_string()).collect();
                                format!("{c}·m({})", l.join(","))
                            })
                            .collect();
                        ui.label(format!(
                            "in monomial symmetric functions: {}",
                            parts.join(" + ")
                        ));
                    }
                }
            }
            Fetch::Running(f, _) => computing(ui, "divided symmetrization", f, &self.divsym),
            Fetch::Failed(e) => {
                let e = e.clone();
                show_parse_error(ui, &e);
            }
        }
        ui.separator();
        let m = h.len();
        if m > crate::math::quotient::groebner::MAX_QUOTIENT_N {
            return;
        }
        let key = JobKey::NormalForm(crate::engine::requests::QuotientInput::Typed(
            ctx.session.workbench.poly.clone(),
            m,
        ));
        match self.normal.fetch(ctx.engine, key) {
            Fetch::Ready(out) => {
                if let Output::Reduced(r) = out.as_ref() {
                    ui.label(
                        egui::RichText::new(format!(
                            "normal form modulo J_{m}: {}",
                            r.normal.poly.to_text()
                        ))
                        .monospace(),
                    );
                    ui.weak(format!(
                        "{} standard monomials with nonzero coefficient; the Quotient tab draws them as lattice paths",
                        r.normal.coefficients.len()
                    ));
                }
            }
            Fetch::Running(f, _) => computing(ui, "normal form", f, &self.normal),
            Fetch::Failed(e) => {
                let e = e.clone();
                show_parse_error(ui, &e);
            }
        }
    }
}
