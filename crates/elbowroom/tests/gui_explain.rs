//! The words view's panel "a_w from the words of w", driven headlessly: the contents
//! of 1432 with the sum (A_021 + A_012)/3! = (4 + 2)/6 = 1 (Nadeau–Tewari, IMRN 2023),
//! a content filtering the word list, the cyclic orbit going to 3214, and A_c opening
//! the permutohedra view at u = c.
#![cfg(feature = "gui")]
#![allow(clippy::unwrap_used)]

mod window_harness;
use egui_kittest::Harness;
use egui_kittest::kittest::Queryable;
use elbowroom::gui::Explorer;
use elbowroom::gui::views::explain_panel::open_eulerian;
use elbowroom::session::model::View;
use window_harness::{harness, has, settle};

fn type_and_go(h: &mut Harness<'static, Explorer>, text: &str) {
    h.state_mut().picker.text = text.to_string();
    h.step();
    h.get_by_label("go").click();
    h.step();
    h.step();
}

#[test]
fn the_panel_explains_a_1432() {
    let mut h = harness();
    h.state_mut().session.n = 4;
    h.state_mut().session.current = vec![1, 2, 3, 4];
    h.step();
    type_and_go(&mut h, "1432");
    assert_eq!(h.state().session.current, vec![1, 4, 3, 2]);
    h.get_by_label("Reduced words & wiring").click();
    settle(&mut h, |h| has(h, "[0, 2, 1]"));
    assert!(has(&h, "[0, 1, 2]"));
    assert!(has(&h, "sum 6/3! = 1"));
    // a_w by trees (Nadeau–Tewari 2024): S_1432 = P_(0,2,1) + P_(1,2), and only
    // (1,2) is one tree on the leaves 1..4, with one labeling: 1·1 = a_1432
    assert!(has(
        &h,
        "a_w by trees: Σ_T c_(w,T)·(n−1)!/Π h_v over 1 tree"
    ));
    assert!(has(&h, "1 · 1"));
    assert!(has(&h, "(1,2)"));
    // a_w(q) = q^2 and S_w(1, q, q^2, …) = q + 2q^2 + q^3 + q^4 (Macdonald's S_1432)
    assert!(has(&h, "q + 2q^2 + q^3 + q^4"));
    // both words are listed; a click on the content (0, 2, 1) keeps only 2 3 2
    settle(&mut h, |h| has(h, "3 2 3"));
    h.get_by_label("[0, 2, 1]").click();
    settle(&mut h, |h| !has(h, "3 2 3") && has(h, "2 3 2"));
    assert!(has(
        &h,
        "the list shows the 1 reduced words of content [0, 2, 1] (of 2 in all)"
    ));
    // the braid move 232 -> 323 leaves the content: the list is the whole one again,
    // with 3 2 3 (the second word in lexicographic order) selected
    h.get_by_label("braid 2 3 2 at 1").click();
    settle(&mut h, |h| {
        has(h, "3 2 3") && has(h, "2 3 2") && h.state().session.words.index == 1
    });
    assert!(!has(&h, "the list shows the"));
    // filtered again, then "show all"
    h.get_by_label("[0, 2, 1]").click();
    settle(&mut h, |h| !has(h, "3 2 3") && has(h, "2 3 2"));
    h.get_by_label("show all").click();
    settle(&mut h, |h| has(h, "3 2 3"));
    // the cyclic orbit: 3214 (a = 1)
    h.get_all_by_label("3214 (1)").next().unwrap().click();
    settle(&mut h, |h| h.state().session.current == vec![3, 2, 1, 4]);
    settle(&mut h, |h| has(h, "Reduced words of w = 3214"));
    // 3214 = s1 s2 s1 = s2 s1 s2: contents (2,1,0) and (1,2,0), A = 2 and 4
    settle(&mut h, |h| has(h, "[2, 1, 0]"));
    assert!(has(&h, "[1, 2, 0]"));
    // a click on A_c opens the permutohedra view at λ with λ_i − λ_{i+1} = c_i
    open_eulerian(&mut h.state_mut().session, &[2, 1, 0]);
    h.step();
    assert_eq!(h.state().session.view, View::Permutohedron);
    assert_eq!(h.state().session.solid.lambda, vec!["3", "1", "0", "0"]);
}

/// The label of a word in the list: its letters, then its content.
fn row_label(word: &[usize], n: usize) -> String {
    let letters: Vec<String> = word.iter().map(|a| a.to_string()).collect();
    let c: Vec<String> = elbowroom::math::perms::words::content(word, n)
        .iter()
        .map(|x| x.to_string())
        .collect();
    format!("{}   ({})", letters.join(" "), c.join(","))
}

/// A click on a content filters the whole list of reduced words of w, not the
/// page shown: w = 432165879 (ℓ(w) = 8 = n − 1) has 896 reduced words, 448 of
/// them of content (2,2,2,0,1,0,1,0) (the counts by content of the math crate),
/// so the filtered list has three pages of 200, 200 and 48; each page is the
/// one the lazy lexicographic listing of all the words gives, kept to that content.
#[test]
fn a_content_filters_the_whole_list_of_words_page_by_page() {
    let n = 9;
    let mut h = harness();
    h.state_mut().session.n = n;
    h.state_mut().session.current = (1..=n).collect();
    h.step();
    type_and_go(&mut h, "432165879");
    assert_eq!(h.state().session.current, vec![4, 3, 2, 1, 6, 5, 8, 7, 9]);
    h.get_by_label("Reduced words & wiring").click();
    let c = [2usize, 2, 2, 0, 1, 0, 1, 0];
    settle(&mut h, |h| has(h, "[2, 2, 2, 0, 1, 0, 1, 0]"));
    let w = elbowroom::math::Perm::parse("432165879").unwrap();
    let expected: Vec<Vec<usize>> = elbowroom::math::perms::words::reduced_words(&w)
        .filter(|a| elbowroom::math::perms::words::content(a, n) == c)
        .collect();
    assert_eq!(expected.len(), 448);
    // unfiltered, the first page starts with 1 2 1 3 2 1 5 7, of content (3,2,1,0,1,0,1,0)
    settle(&mut h, |h| has(h, "words 1–200 (lexicographic)"));
    assert!(!has(&h, &row_label(&expected[0], n)));
    h.get_by_label("[2, 2, 2, 0, 1, 0, 1, 0]").click();
    settle(&mut h, |h| {
        has(
            h,
            "the list shows the 448 reduced words of content [2, 2, 2, 0, 1, 0, 1, 0]",
        )
    });
    for (page, first, last) in [(0, 1, 200), (1, 201, 400), (2, 401, 448)] {
        let bar = format!("words {first}–{last} of the 448 of content [2, 2, 2, 0, 1, 0, 1, 0]");
        settle(&mut h, |h| has(h, &bar));
        // the first word of the page is the listing's, and it is selected
        settle(&mut h, |h| has(h, &row_label(&expected[first - 1], n)));
        assert_eq!(h.state().session.n, n);
        if page < 2 {
            h.get_by_label("page >").click();
            h.step();
        }
    }
    // "show all" gives the whole list back
    h.get_by_label("show all").click();
    settle(&mut h, |h| has(h, "(lexicographic); selected"));
    settle(&mut h, |h| !has(h, "of the 448 of content"));
}
