//! The polynomial workbench: type a polynomial, see parse errors marked at
//! their column, and its divided symmetrization DS_n (or DS_h for the
//! Hessenberg view's h), exactly, with its expansion in monomial symmetric
//! functions.

use super::{show_math_error, show_progress};
use crate::engine::requests::{Output, QuotientInput};
use crate::engine::{Engine, Fetch, JobKey, Slot};
use crate::gui::AppCtx;
use crate::math::MathError;
use crate::math::poly::parse::parse_poly;
use crate::math::quotient::groebner::MAX_QUOTIENT_N;
use crate::session::Session;
use eframe::egui;

/// The workbench's UI state.
#[derive(Default)]
pub struct WorkbenchView {
    divsym: Slot,
    normal_form: Slot,
    /// The text last parsed, the number of variables, and the polynomial read (as text) or the error.
    parsed: Option<(String, usize, Result<String, MathError>)>,
}

/// The field for the polynomial (a first polynomial when it is empty).
fn poly_field(ui: &mut egui::Ui, session: &mut Session) {
    if session.workbench.poly.is_empty() {
        session.workbench.poly = "x1^2 x2 + x1 x2 x3".into();
    }
    ui.add(
        egui::TextEdit::singleline(&mut session.workbench.poly)
            .id_salt("workbench_poly")
            .font(egui::TextStyle::Monospace)
            .desired_width(f32::INFINITY),
    );
}

/// The radio buttons choosing DS_n (n of the current S_n) or DS_h (h of the
/// Hessenberg view, when one is chosen).
fn symmetrization_choice(ui: &mut egui::Ui, session: &mut Session, n: usize) {
    let hview = &session.hessenberg.h;
    let use_h = &mut session.workbench.use_h;
    ui.horizontal(|ui| {
        ui.radio_value(use_h, false, format!("DS_n with n = {n} (the current S_n)"));
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
            ui.radio_value(use_h, true, label);
        });
    });
}

/// The h to symmetrize by: the Hessenberg view's when chosen (and set), else
/// the default h of n, which gives DS_n.
fn chosen_h(session: &Session, n: usize) -> Vec<usize> {
    let hview = &session.hessenberg.h;
    if session.workbench.use_h && !hview.is_empty() {
        hview.clone()
    } else {
        crate::math::hessenberg::function::default_values(n)
    }
}

/// DS(f) and its expansion in monomial symmetric functions; `name` is `DS_n(f)` or `DS_h(f)`.
fn show_divsym(ui: &mut egui::Ui, out: &Output, name: &str) {
    let Output::DivSym(d) = out else {
        return;
    };
    ui.label(
        egui::RichText::new(format!("{name} = {}", d.value.to_text()))
            .monospace()
            .strong(),
    );
    if d.symmetric.is_empty() {
        return;
    }
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

/// The normal form modulo J_m and how many standard monomials it has.
fn show_normal_form(ui: &mut egui::Ui, out: &Output, m: usize) {
    let Output::Reduced(r) = out else {
        return;
    };
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

/// Draws what `slot` holds for `key`: the result by `show`, the progress
/// (labelled `what`) with cancel, or the error.
fn show_result(
    ui: &mut egui::Ui,
    slot: &mut Slot,
    engine: &Engine,
    key: JobKey,
    what: &str,
    show: impl FnOnce(&mut egui::Ui, &Output),
) {
    match slot.fetch(engine, key) {
        Fetch::Ready(out) => show(ui, out.as_ref()),
        Fetch::Running(f, _) => show_progress(ui, what, f, slot),
        Fetch::Failed(e) => {
            let e = e.clone();
            show_math_error(ui, &e);
        }
    }
}

impl WorkbenchView {
    /// Draws the view.
    pub fn ui(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx) {
        ui.heading("Polynomial workbench");
        ui.weak("Type a polynomial in x1..xn: + - * ^ /, implicit products, parentheses, rational constants (e.g. x1^2 x2 - 3/2 x3).");
        poly_field(ui, ctx.session);
        let n = ctx.session.n.max(2);
        symmetrization_choice(ui, ctx.session, n);
        let h = chosen_h(ctx.session, n);
        let text = ctx.session.workbench.poly.clone();
        match self.parse(&text, h.len()) {
            Err(e) => {
                show_math_error(ui, e);
                return;
            }
            Ok(p) => {
                ui.label(egui::RichText::new(format!("f = {p}")).monospace());
            }
        }
        ui.separator();
        let name = if ctx.session.workbench.use_h {
            "DS_h(f)"
        } else {
            "DS_n(f)"
        };
        let key = JobKey::DivSym(text.clone(), h.clone());
        show_result(
            ui,
            &mut self.divsym,
            ctx.engine,
            key,
            "divided symmetrization",
            |ui, out| show_divsym(ui, out, name),
        );
        ui.separator();
        let m = h.len();
        if m > MAX_QUOTIENT_N {
            return;
        }
        let key = JobKey::NormalForm(QuotientInput::Typed(text, m));
        show_result(
            ui,
            &mut self.normal_form,
            ctx.engine,
            key,
            "normal form",
            |ui, out| show_normal_form(ui, out, m),
        );
    }

    /// The polynomial `text` in `n` variables, read again only when the text or n changed.
    fn parse(&mut self, text: &str, n: usize) -> &Result<String, MathError> {
        let stale = self
            .parsed
            .as_ref()
            .is_none_or(|(t, m, _)| t != text || *m != n);
        if stale {
            self.parsed = None;
        }
        let (_, _, parsed) = self.parsed.get_or_insert_with(|| {
            let r = parse_poly(text, Some(n)).map(|p| p.to_text());
            (text.to_string(), n, r)
        });
        parsed
    }
}
