//! The polynomial workbench: type a polynomial, see parse errors marked at
//! their column, its divided symmetrization DS_n (or DS_h for the Hessenberg
//! view's h), exactly, with its expansion in monomial symmetric functions, its
//! Schubert expansion in H*(Fl_n) and stably, and its normal form modulo J_n.
//! The window's thread only checks the length of the text; reading and every
//! computation run on the engine.

use super::products::{terms_list, terms_summary};
use super::{fetch_or_explain, typed_poly_fits};
use crate::engine::requests::{Output, QuotientInput};
use crate::engine::{Engine, Fetch, JobKey, Slot};
use crate::gui::AppCtx;
use crate::gui::typeset::{self, Typeset};
use crate::math::quotient::groebner::MAX_QUOTIENT_N;
use crate::session::Session;
use eframe::egui;

/// The workbench's UI state.
#[derive(Default)]
pub struct WorkbenchView {
    typed: Slot,
    divsym: Slot,
    monomial: Slot,
    normal_form: Slot,
    flag_expansion: Slot,
    stable_expansion: Slot,
}

/// The field for the polynomial (an example as its hint while it is empty).
fn poly_field(ui: &mut egui::Ui, session: &mut Session) {
    ui.add(
        egui::TextEdit::singleline(&mut session.workbench.poly)
            .id_salt("workbench_poly")
            .hint_text("x1^2 x2 + x1 x2 x3")
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
        typeset::radio(
            ui,
            use_h,
            false,
            &Typeset::new().symbol(format!("DS_n with n = {n} (the current S_n)")),
        );
        ui.add_enabled_ui(!hview.is_empty(), |ui| {
            let label = if hview.is_empty() {
                "DS_h with the h chosen in the Hessenberg view (none chosen yet)".to_string()
            } else {
                format!(
                    "DS_h with h = {} from the Hessenberg view",
                    crate::engine::requests::h_text(hview)
                )
            };
            typeset::radio(ui, use_h, true, &Typeset::new().symbol(label));
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
    let value = d.value.to_text();
    typeset::math_label(
        ui,
        &Typeset::new()
            .symbol(name)
            .plain(" = ")
            .poly(&value)
            .strong(),
        &value,
    );
    if d.symmetric.is_empty() {
        return;
    }
    let (line, plain) = symmetric_expansion(&d.symmetric);
    typeset::math_label(ui, &line, &plain);
}

/// DS_n(x^c) = (−1)^{|S(c)|} β_n(S(c)) (Postnikov, IMRN 2009): S(c) the i ≤ n − 1
/// with c_1 + ⋯ + c_i < i, β_n(S) the permutations of [n] with descent set S.
fn show_monomial_route(
    ui: &mut egui::Ui,
    v: &crate::math::explain::monomials::MonomialValue,
    n: usize,
) {
    let set: Vec<String> = v.descent_set.iter().map(|i| i.to_string()).collect();
    let set = format!("{{{}}}", set.join(", "));
    let sign = if v.descent_set.len() % 2 == 1 {
        "−"
    } else {
        ""
    };
    let line = Typeset::new()
        .plain("by descent sets: ")
        .symbol(format!("DS_{n}(x^c) = (−1)^|S| β_{n}(S)"))
        .plain(format!(", S = {{i : c_1 + ⋯ + c_i < i}} = {set}, "))
        .symbol(format!("β_{n}(S)"))
        .plain(format!(" = {}, so the value is {sign}{}", v.beta, v.beta));
    let plain = format!(
        "DS_{n}(x^c) = (-1)^|S| beta_{n}(S), S = {set}, beta_{n}(S) = {}, value {}",
        v.beta, v.value
    );
    typeset::math_label(ui, &line, &plain);
}

/// Σ c_λ m_λ, typeset and as plain text (`96·m(2,1,1)`), the terms joined by +.
fn symmetric_expansion<'a, C: std::fmt::Display + 'a>(
    terms: impl IntoIterator<Item = (&'a Vec<u32>, &'a C)>,
) -> (Typeset, String) {
    let mut line = Typeset::new().plain("in monomial symmetric functions: ");
    let mut plain = Vec::new();
    for (k, (lam, c)) in terms.into_iter().enumerate() {
        let l: Vec<String> = lam.iter().map(|x| x.to_string()).collect();
        let l = l.join(",");
        if k > 0 {
            line = line.plain(" + ");
        }
        line = line
            .poly(c.to_string())
            .plain("·")
            .symbol(format!("m_{{({l})}}"));
        plain.push(format!("{c}·m({l})"));
    }
    (line, plain.join(" + "))
}

/// The normal form modulo J_m and how many standard monomials it has.
fn show_normal_form(ui: &mut egui::Ui, out: &Output, m: usize) {
    let Output::Reduced(r) = out else {
        return;
    };
    let normal = r.normal.poly.to_text();
    typeset::math_label(
        ui,
        &Typeset::new()
            .plain("normal form modulo ")
            .symbol(format!("J_{m}"))
            .plain(": ")
            .poly(&normal),
        &normal,
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
    if let Some(out) = fetch_or_explain(ui, slot, engine, key, what) {
        show(ui, &out);
    }
}

/// A Schubert expansion: the summary and the rows (a click makes w current).
fn show_expansion(ui: &mut egui::Ui, slot: &mut Slot, ctx: &mut AppCtx, key: JobKey, id: &str) {
    let Some(out) = fetch_or_explain(ui, slot, ctx.engine, key, "Schubert expansion") else {
        return;
    };
    let Some(terms) = out.terms() else {
        return;
    };
    terms_summary(ui, terms);
    if let Some(w) = terms_list(ui, id, terms, ctx) {
        ctx.go_to(w);
    }
}

/// "f = …" for the text the engine wrote back: the polynomial typeset, and a
/// long one's count of terms ("… (50 388 terms in all)") as plain words.
fn read_back(t: &str) -> Typeset {
    let Some((head, rest)) = t.split_once(" … (") else {
        return Typeset::new().plain("f = ").poly(t);
    };
    let (count, words) = rest.split_once(' ').unwrap_or((rest, ""));
    Typeset::new()
        .plain("f = ")
        .poly(head)
        .plain(format!(" … ({} {words}", typeset::grouped(count)))
}

impl WorkbenchView {
    /// DS_n(f) (or DS_h(f)) and the normal form modulo J_n (n the
    /// workbench's, whichever h symmetrizes).
    fn divided_symmetrization_and_normal_form(
        &mut self,
        ui: &mut egui::Ui,
        ctx: &mut AppCtx,
        text: &str,
        h: &[usize],
        n: usize,
    ) {
        let name = if ctx.session.workbench.use_h {
            "DS_h(f)"
        } else {
            "DS_n(f)"
        };
        let key = JobKey::DivSym(text.to_string(), h.to_vec());
        show_result(
            ui,
            &mut self.divsym,
            ctx.engine,
            key,
            "divided symmetrization",
            |ui, out| show_divsym(ui, out, name),
        );
        if ctx.session.workbench.use_h {
            self.monomial.clear();
        } else {
            // a single monomial of degree n − 1: the third route, by descent sets
            let key = JobKey::MonomialRoute(text.to_string(), n);
            if let Fetch::Ready(out) = self.monomial.fetch(ctx.engine, key)
                && let Output::Monomial(v) = &**out
            {
                show_monomial_route(ui, v, n);
            }
        }
        let m = n;
        if m <= MAX_QUOTIENT_N {
            ui.separator();
            let key = JobKey::NormalForm(QuotientInput::Typed(text.to_string(), m));
            show_result(
                ui,
                &mut self.normal_form,
                ctx.engine,
                key,
                "normal form",
                |ui, out| show_normal_form(ui, out, m),
            );
        }
    }

    /// Draws the view.
    fn show(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx) {
        ui.heading("Polynomial workbench");
        ui.weak("Type a polynomial in x1..xn: + - * ^ /, implicit products, parentheses, rational constants (e.g. x1^2 x2 - 3/2 x3).");
        poly_field(ui, ctx.session);
        let n = ctx.session.n.max(2);
        symmetrization_choice(ui, ctx.session, n);
        let h = chosen_h(ctx.session, n);
        let text = ctx.session.workbench.poly.clone();
        // the one check on this thread: the length of the text
        if text.trim().is_empty() || !typed_poly_fits(ui, &text) {
            self.forget();
            return;
        }
        let read = fetch_or_explain(
            ui,
            &mut self.typed,
            ctx.engine,
            JobKey::Typed(text.clone(), h.len().max(n)),
            "reading the polynomial",
        );
        match read.as_ref().and_then(|o| o.text().map(str::to_string)) {
            Some(t) => {
                typeset::math_label(ui, &read_back(&t), &t);
                ui.separator();
                // DS and the normal form need f multiplied out: they start once it was read
                self.divided_symmetrization_and_normal_form(ui, ctx, &text, &h, n);
            }
            None if self.typed.is_running() => {
                self.divsym.clear();
                self.normal_form.clear();
            }
            None => {
                // the text does not read, said once above: nothing else is asked for
                self.forget();
                return;
            }
        }
        ui.separator();
        ui.columns(2, |cols| {
            typeset::label(
                &mut cols[0],
                &Typeset::new()
                    .plain("Schubert expansion in H*(")
                    .symbol(format!("Fl_{n}"))
                    .plain(")")
                    .strong(),
            );
            show_expansion(
                &mut cols[0],
                &mut self.flag_expansion,
                ctx,
                JobKey::Expansion(text.clone(), n, false),
                "workbench_flag_rows",
            );
            typeset::label(
                &mut cols[1],
                &Typeset::new()
                    .plain("stably, in Q[")
                    .symbol(format!("x1, …, x{n}"))
                    .plain("] over ")
                    .symbol("S_∞")
                    .strong(),
            );
            show_expansion(
                &mut cols[1],
                &mut self.stable_expansion,
                ctx,
                JobKey::Expansion(text, n, true),
                "workbench_stable_rows",
            );
        });
    }

    /// Asks for nothing beyond reading the text (a running job stops).
    fn forget(&mut self) {
        self.divsym.clear();
        self.monomial.clear();
        self.normal_form.clear();
        self.flag_expansion.clear();
        self.stable_expansion.clear();
    }
}

impl super::View for WorkbenchView {
    fn kind(&self) -> crate::session::model::View {
        crate::session::model::View::Workbench
    }

    fn title(&self) -> &'static str {
        "Polynomial workbench"
    }

    fn ui(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx) {
        self.show(ui, ctx);
    }
}
