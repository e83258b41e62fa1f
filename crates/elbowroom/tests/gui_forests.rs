//! The forest view driven headlessly: the leading forest of S_w, a click on a
//! terminal node trims it (T_i P_F = P_{F/i}), a row of the forest expansion
//! opens its forest, and the quotient view's forest basis.
#![cfg(feature = "gui")]
#![allow(clippy::unwrap_used)]

mod window_harness;
use eframe::egui;
use egui_kittest::Harness;
use egui_kittest::kittest::Queryable;
use elbowroom::engine::forest_jobs::forest_class;
use elbowroom::engine::requests::QuotientInput;
use elbowroom::figure::forest::node_center;
use elbowroom::gui::Explorer;
use elbowroom::gui::views::forests::ForestView;
use elbowroom::gui::views::quotient::QuotientView;
use elbowroom::math::forest::indexed::{Forest, code_text};
use elbowroom::math::{Perm, Progress};
use window_harness::{ViewOf, harness, has, settle};

fn go_to(h: &mut Harness<'static, Explorer>, text: &str) {
    h.state_mut().picker.text = text.to_string();
    h.step();
    h.get_by_label("go").click();
    h.step();
    h.step();
}

fn click(h: &mut Harness<'static, Explorer>, pos: egui::Pos2) {
    h.hover_at(pos);
    h.step();
    for pressed in [true, false] {
        h.event(egui::Event::PointerButton {
            pos,
            button: egui::PointerButton::Primary,
            pressed,
            modifiers: egui::Modifiers::NONE,
        });
        h.step();
    }
    h.step();
}

/// S_1432 = P_(1,2) + P_(0,2,1) (Nadeau–Tewari's example, checked by hand);
/// the view opens on the forest of code(1432) = (0,2,1), whose one terminal
/// node (3 4) sits at 3: trimming it leaves (0,2).
#[test]
fn the_forest_view_trims_and_opens_forests() {
    let mut h = harness();
    go_to(&mut h, "1432");
    h.get_by_label("Forest polynomials").click();
    settle(&mut h, |h| {
        h.state().view::<ForestView>().code() == Some(&[0, 2, 1][..])
    });
    settle(&mut h, |h| has(h, "(1,2)  (1((2 3)4))"));
    assert!(has(&h, "(0,2,1)  1((2(3 4))5)"));
    settle(&mut h, |h| h.state().view::<ForestView>().canvas.is_some());
    let forest = Forest::from_code(&[0, 2, 1]).unwrap();
    let k = forest.nodes().iter().position(|v| v.is_terminal()).unwrap();
    let (rect, scale) = h.state().view::<ForestView>().canvas.unwrap();
    let c = node_center(&forest, k).unwrap();
    click(&mut h, rect.min + egui::vec2(c.x * scale, c.y * scale));
    assert_eq!(h.state().view::<ForestView>().code(), Some(&[0, 2][..]));
    // P_(0,2) = x1^2 + x1 x2 + x2^2: three terms, three labelings
    settle(&mut h, |h| has(h, "3 terms, 3 labelings"));
    h.get_by_label_contains("(1,2)  (1((2 3)4))").click();
    h.step();
    h.step();
    assert_eq!(h.state().view::<ForestView>().code(), Some(&[1, 2][..]));
}

/// The class of S_w(x5, …, x1) modulo J_5 in the forest basis, as the
/// command `reduce --forest` computes it (the same function): every row shown.
#[test]
fn the_quotient_view_offers_the_forest_basis() {
    let mut h = harness();
    go_to(&mut h, "1432");
    let w = Perm::from_one_line(&h.state().session.current).unwrap();
    let rows = forest_class(&QuotientInput::ReversedSchubert(w), &Progress::default()).unwrap();
    assert!(!rows.is_empty());
    h.get_by_label("Quotient by J_n").click();
    h.step();
    h.get_by_label_contains("forest basis").click();
    h.step();
    assert!(h.state().view::<QuotientView>().forest_basis);
    for (code, _) in &rows {
        let f = Forest::from_code(code).unwrap();
        let label = format!("{}  {f}", code_text(code));
        settle(&mut h, |h| has(h, &label));
    }
}
