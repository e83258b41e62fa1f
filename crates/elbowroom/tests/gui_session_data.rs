//! The explorer and the data of a session file, driven headlessly
//! (egui_kittest, no display): what `session check` accepts the window opens
//! (a title with control characters reaches the window system escaped), a
//! refused file is explained in the window, the title marks unsaved changes,
//! and values the window cannot show are kept and saved back unchanged.
#![cfg(feature = "gui")]
#![allow(clippy::unwrap_used)]

mod window_harness;
use eframe::egui;
use egui_kittest::Harness;
use egui_kittest::kittest::Queryable;
use elbowroom::engine::Engine;
use elbowroom::gui::Explorer;
use elbowroom::session::{Session, store};
use std::path::{Path, PathBuf};
use window_harness::{harness, has, settle};

/// A fresh directory for one test's files.
fn scratch(name: &str) -> PathBuf {
    let dir = std::env::temp_dir().join(format!("elbowroom-data-{name}-{}", std::process::id()));
    let _ = std::fs::remove_dir_all(&dir);
    std::fs::create_dir_all(&dir).unwrap();
    dir
}

/// The text of the first demo session.
fn demo_text() -> String {
    let dir = elbowroom::session::demo::demo_dir();
    std::fs::read_to_string(dir.join(elbowroom::session::demo::DEFAULT_DEMO_NAME)).unwrap()
}

/// The explorer at 1280×800 on `session`.
fn harness_on(session: Session) -> Harness<'static, Explorer> {
    Harness::builder()
        .with_size(egui::vec2(1280.0, 800.0))
        .with_accessibility_check(false)
        .allow_missing_glyphs()
        .build_ui_state(
            |ui, app: &mut Explorer| app.show(ui),
            Explorer::new(session, Engine::quiet()),
        )
}

/// `text` written to `dir/name` and read back by the explorer's own reader
/// (the one `session check` and `elbowroom FILE` use).
fn through_the_reader(dir: &Path, name: &str, text: &str) -> Session {
    let path = dir.join(name);
    std::fs::write(&path, text).unwrap();
    store::load(&path).unwrap()
}

#[test]
fn a_title_with_a_nul_and_an_escape_opens_and_reaches_the_window_system_escaped() {
    let dir = scratch("nul-title");
    let text = demo_text();
    let start = text.find("title: \"").unwrap() + "title: \"".len();
    let end = start + text[start..].find('"').unwrap();
    let hostile = format!(
        "{}a\\u{{0}}b\\u{{1b}}[31mred\\nline{}",
        &text[..start],
        &text[end..]
    );
    let s = through_the_reader(&dir, "nul.ron", &hostile);
    assert_eq!(s.title, "a\0b\u{1b}[31mred\nline");
    let mut h = harness_on(s);
    h.step();
    h.step();
    let title = h.state().title_shown.clone();
    assert!(!title.chars().any(char::is_control), "{title:?}");
    assert!(title.contains("a\\u{0}b\\u{1b}[31mred\\nline"), "{title:?}");
}

#[test]
fn a_long_title_is_shown_in_the_title_bar_as_an_excerpt() {
    let s = Session {
        title: "x".repeat(5000),
        ..Session::default()
    };
    let title = elbowroom::gui::files::window_title(&s, false);
    assert!(title.chars().count() < 100, "{}", title.len());
    assert!(title.ends_with('…'));
}

#[test]
fn the_window_title_marks_unsaved_changes() {
    let mut h = harness();
    h.step();
    assert!(!h.state().title_shown.starts_with('•'));
    h.state_mut().session.notes.push_str("a thought");
    h.step();
    assert!(
        h.state().title_shown.starts_with("• elbowroom"),
        "{}",
        h.state().title_shown
    );
    let dir = scratch("unsaved-mark");
    h.state_mut().files.session_path = Some(dir.join("s.ron"));
    h.key_press_modifiers(egui::Modifiers::COMMAND, egui::Key::S);
    h.step();
    h.step();
    assert!(dir.join("s.ron").is_file());
    assert!(
        h.state().title_shown.starts_with("elbowroom"),
        "{}",
        h.state().title_shown
    );
}

#[test]
fn a_refused_session_file_is_explained_in_the_open_window() {
    let dir = scratch("refused");
    let bad = dir.join("damaged.ron");
    std::fs::write(
        &bad,
        "(format: \"elbowroom-session\", version: 1, session: (n: 40))",
    )
    .unwrap();
    let why = store::load(&bad).unwrap_err().to_string();
    assert!(why.contains("n = 40 is out of range"), "{why}");
    let mut h = harness();
    h.state_mut().show_refused(&bad, why.clone());
    h.step();
    h.step();
    assert!(has(&h, "Open a session"));
    assert!(has(&h, "n = 40 is out of range"));
    assert_eq!(h.state().files.path, bad.display().to_string());
    // a demo session picked from the same window opens
    settle(&mut h, |h| has(h, "01-seminar-pipe-dreams.ron"));
}

/// The session after every view was shown for a few frames.
fn after_every_view(s: Session) -> Session {
    let front = s.view;
    let mut h = harness_on(s);
    for v in elbowroom::gui::views::all() {
        h.state_mut().session.view = v.kind();
        for _ in 0..4 {
            h.step();
        }
    }
    h.state_mut().session.view = front;
    h.state().session.clone()
}

#[test]
fn values_the_window_cannot_show_are_kept_and_saved_back_unchanged() {
    let dir = scratch("kept");
    let sixteen: Vec<String> = (0..16).rev().map(|k| k.to_string()).collect();
    let mut odd = Session::default();
    // λ, λ_a and λ_b with 16 entries (session check accepts up to 16), an
    // entry written with spaces, h of length 16, and the h of n = 1
    odd.solid.lambda = sixteen.clone();
    odd.solid.from = sixteen.clone();
    odd.solid.to = sixteen;
    odd.solid.lambda[3] = " 12 ".into();
    odd.hessenberg.h = (2..=16).chain([16]).collect();
    for s in [
        odd.clone(),
        Session {
            hessenberg: elbowroom::session::model::HessenbergPlace {
                h: vec![1],
                ..Default::default()
            },
            ..odd.clone()
        },
    ] {
        let path = dir.join("odd.ron");
        store::save(&path, &s).unwrap();
        let before = std::fs::read_to_string(&path).unwrap();
        let loaded = store::load(&path).unwrap();
        let shown = after_every_view(loaded.clone());
        assert_eq!(shown, loaded, "the explorer changed the session");
        store::save(&path, &shown).unwrap();
        assert_eq!(std::fs::read_to_string(&path).unwrap(), before);
    }
    // the demo sessions, with h left empty, come back unchanged too
    for path in elbowroom::session::demo::demo_paths() {
        let loaded = store::load(&path).unwrap();
        assert_eq!(
            after_every_view(loaded.clone()),
            loaded,
            "{}",
            path.display()
        );
    }
}

#[test]
fn the_views_say_which_values_they_keep_without_showing_them() {
    let mut s = Session::default();
    s.hessenberg.h = vec![1];
    s.solid.lambda = (0..16).map(|k| k.to_string()).collect();
    let mut h = harness_on(s);
    h.state_mut().session.view = elbowroom::session::model::View::Hessenberg;
    h.step();
    h.step();
    assert!(has(&h, "h = (1) has n = 1"));
    assert!(has(&h, "kept as it is"));
    h.state_mut().session.view = elbowroom::session::model::View::Permutohedron;
    h.step();
    h.step();
    assert!(has(&h, "have 16, 4 and 4 entries"));
    // the user's own choice of n does change them
    h.get_by_label("start over at n = 16").click();
    h.step();
    h.step();
    assert_eq!(h.state().session.solid.to.len(), 16);
}

#[test]
fn the_products_view_is_saved_and_reopened() {
    let dir = scratch("products");
    let mut h = harness();
    h.state_mut().session.view = elbowroom::session::model::View::Products;
    h.step();
    {
        let p = &mut h.state_mut().session.products;
        p.u = "2143".into();
        p.v = "1432".into();
        p.stable = false;
        p.n = 6;
        p.poly = "x1 x3 - x2^2".into();
        p.poly_stable = true;
        p.poly_n = 7;
    }
    h.step();
    let path = dir.join("p.ron");
    h.state_mut().files.session_path = Some(path.clone());
    h.key_press_modifiers(egui::Modifiers::COMMAND, egui::Key::S);
    h.step();
    let back = store::load(&path).unwrap();
    assert_eq!(back.products, h.state().session.products);
    assert_eq!(back.products.poly_n, 7);
    assert_eq!(back.products.u, "2143");
    assert!(!back.products.stable);
}

#[test]
fn the_expansion_uses_its_own_n_not_the_left_panels() {
    let mut h = harness();
    h.state_mut().session.view = elbowroom::session::model::View::Products;
    h.state_mut().session.products.poly = "x2".into();
    h.state_mut().session.products.poly_n = 3;
    // the demo's left panel is at n = 5; in H*(Fl_3), x2 = S_132 − S_213
    // (S_132 = x1 + x2, S_213 = x1; Macdonald's table)
    settle(&mut h, |h| has(h, "some coefficients are negative"));
    assert!(h.query_by_label("132").is_some());
    assert!(h.query_by_label("213").is_some());
    // (the left panel's list of S_5 has no three-letter rows)
    assert!(has(&h, "Fl_3"));
    assert_eq!(h.state().session.n, 5);
}

#[test]
fn the_left_panel_reaches_s_11_from_a_row_of_an_n_11_table() {
    let mut s = Session::default();
    let w: Vec<usize> = vec![2, 1, 3, 4, 5, 6, 7, 8, 9, 11, 10];
    s.n = 11;
    s.current = w.clone();
    s.history = vec![w];
    let mut h = harness_on(s);
    h.step();
    h.step();
    assert!(has(&h, "All of S_11"), "the panel stopped below n = 11");
    assert!(has(&h, "39\u{2009}916\u{2009}800 permutations"));
}

#[test]
fn a_syntax_error_in_the_workbench_is_said_once_with_the_caret_under_its_column() {
    let mut h = harness();
    h.state_mut().session.view = elbowroom::session::model::View::Workbench;
    h.state_mut().session.workbench.poly = "x1 + * x2".into();
    settle(&mut h, |h| has(h, "column 6"));
    for _ in 0..10 {
        h.step();
    }
    assert_eq!(h.query_all_by_label_contains("column 6").count(), 1);
    // the caret line: five spaces, then ^ under the *
    assert!(has(&h, "x1 + * x2\n     ^"));
}

#[test]
fn choosing_ds_h_keeps_the_normal_form_and_expansions_at_the_workbenchs_n() {
    let mut h = harness();
    h.state_mut().session.view = elbowroom::session::model::View::Workbench;
    h.state_mut().session.workbench.poly = "x1^2 x2".into();
    h.state_mut().session.hessenberg.h = vec![2, 3, 4, 5, 6, 7, 8, 8];
    settle(&mut h, |h| has(h, "normal form modulo"));
    h.state_mut().session.workbench.use_h = true;
    settle(&mut h, |h| has(h, "DS_h(f)"));
    // the demo's n is 5: the normal form is still modulo J_5 and the
    // expansion in H*(Fl_5), not at the n = 8 of h
    let running: Vec<String> = h
        .state()
        .engine
        .running()
        .into_iter()
        .map(|r| r.label)
        .collect();
    assert!(running.iter().all(|l| !l.contains("J_8")), "{running:?}");
    assert!(h.query_all_by_label_contains("J_8").next().is_none());
}

#[test]
fn the_export_proposes_a_file_named_after_w_and_the_dream_shown() {
    let mut h = harness();
    settle(&mut h, |h| has(h, "1 of 14"));
    h.key_press(egui::Key::ArrowRight);
    h.step();
    h.step();
    h.key_press_modifiers(egui::Modifiers::COMMAND, egui::Key::E);
    h.step();
    h.step();
    let proposed = h.state().files.path.clone();
    assert!(
        proposed.ends_with("pipe-dream-2-of-14-of-w-15432.svg"),
        "{proposed}"
    );
}

#[test]
fn an_old_message_goes_when_the_user_moves_on() {
    let mut h = harness();
    h.step();
    h.state_mut().message = Some("cannot save /nowhere/x.ron: no such directory".into());
    h.step();
    h.step();
    assert!(has(&h, "cannot save /nowhere"));
    // another view: the message was about what was in front before
    h.state_mut().session.view = elbowroom::session::model::View::Words;
    h.step();
    h.step();
    assert!(h.state().message.is_none());
    assert!(!has(&h, "cannot save /nowhere"));
}

#[test]
fn the_default_turn_of_the_permutohedron_keeps_its_vertices_apart() {
    use elbowroom::math::permutohedra::permutohedron::Permutohedron;
    use num_bigint::BigInt;
    use num_rational::BigRational;
    let place = Session::default().solid;
    let lambda: Vec<BigRational> = place
        .lambda
        .iter()
        .map(|t| BigRational::from_integer(t.parse::<BigInt>().unwrap()))
        .collect();
    let p = Permutohedron::new(&lambda).unwrap();
    let vertices = p.vertices(24).unwrap();
    assert_eq!(vertices.len(), 24, "P_(3,2,1,0) has 4! vertices");
    let coords = Permutohedron::drawing_coordinates(&vertices);
    let shown: Vec<(f64, f64)> = coords
        .iter()
        .map(|c| {
            let (x, y, _) = elbowroom::figure::permutohedron::rotate(c, place.yaw, place.pitch);
            (x, y)
        })
        .collect();
    // its edges have length √2 (λ has unit gaps); no two vertices on screen
    // closer than a third of that (the old turn (0.6, 0.35) put pairs 0.105 apart)
    let mut closest = f64::INFINITY;
    for a in 0..shown.len() {
        for b in a + 1..shown.len() {
            let d = ((shown[a].0 - shown[b].0).powi(2) + (shown[a].1 - shown[b].1).powi(2)).sqrt();
            closest = closest.min(d);
        }
    }
    assert!(closest > 2f64.sqrt() / 3.0, "{closest}");
}

#[test]
fn the_volume_plot_reads_out_the_exact_sample_under_the_pointer() {
    let mut h = harness();
    h.state_mut().session.view = elbowroom::session::model::View::Permutohedron;
    settle(&mut h, |h| has(h, "exact: Vol at t = 0"));
    let below = h
        .query_all_by_label_contains("exact: Vol at t = 0")
        .next()
        .unwrap()
        .rect();
    // away from the plot: no readout
    h.input_mut()
        .events
        .push(egui::Event::PointerMoved(egui::pos2(10.0, 790.0)));
    h.step();
    h.step();
    assert!(!has(&h, "under the pointer: t = "));
    // the plot is the 200 points above that line
    let at = egui::pos2(below.min.x + 150.0, below.min.y - 100.0);
    h.input_mut().events.push(egui::Event::PointerMoved(at));
    h.step();
    h.step();
    assert!(
        has(&h, "under the pointer: t = "),
        "no readout under the pointer"
    );
}

#[test]
fn the_pipe_dream_keeps_its_size_at_150_percent_with_the_notes_open() {
    use elbowroom::gui::views::dreams::DreamsView;
    let mut h = harness();
    h.ctx.set_zoom_factor(1.5);
    h.state_mut().notes.open = true;
    settle(&mut h, |h| {
        h.state()
            .find_view::<DreamsView>()
            .is_some_and(|d| d.canvas.is_some())
    });
    h.step();
    let (rect, _) = h.state().find_view::<DreamsView>().unwrap().canvas.unwrap();
    // 1280×800 at 150 % is 853×533 points; with the left panel and the notes
    // open the drawing had shrunk to its floor of 160 points
    assert!(rect.width() > 200.0, "{rect:?}");
}

/// The third route to DS_n (Postnikov, IMRN 2009, from memory): for a monomial
/// x^c of degree n − 1, DS_n(x^c) = (−1)^{|S|} β_n(S) with
/// S = {i : c_1 + ⋯ + c_i < i}. For x2^2 x4^2 at n = 5, S = {1, 3}; β_5({1, 3})
/// is counted here by listing S_5, and the workbench's DS_5 says the same.
#[test]
fn the_workbench_shows_ds_of_a_monomial_by_descent_sets() {
    let beta = permutations_with_descent_set(5, &[1, 3]);
    assert_eq!(beta, 16);
    let mut h = harness();
    h.state_mut().session.view = elbowroom::session::model::View::Workbench;
    h.state_mut().session.n = 5;
    h.state_mut().session.workbench.use_h = false;
    h.state_mut().session.workbench.poly = "x2^2 x4^2".into();
    settle(&mut h, |h| has(h, "by descent sets"));
    assert!(has(&h, "< i} = {1, 3}, "));
    assert!(has(&h, &format!("β_5(S) = {beta}, so the value is {beta}")));
    settle(&mut h, |h| has(h, &format!("DS_n(f) = {beta}")));
    // a polynomial that is not one monomial gets no such line
    h.state_mut().session.workbench.poly = "x2^2 x4^2 + x1^4".into();
    settle(&mut h, |h| !has(h, "by descent sets"));
}

/// The permutations of [n] whose descent set is exactly `set`, by listing them.
fn permutations_with_descent_set(n: usize, set: &[usize]) -> usize {
    let mut count = 0;
    let mut p: Vec<usize> = (1..=n).collect();
    loop {
        let d: Vec<usize> = (1..n).filter(|&i| p[i - 1] > p[i]).collect();
        if d == set {
            count += 1;
        }
        // next permutation in lexicographic order
        let Some(i) = (0..n - 1).rev().find(|&i| p[i] < p[i + 1]) else {
            return count;
        };
        let j = (i + 1..n).rev().find(|&j| p[j] > p[i]).unwrap();
        p.swap(i, j);
        p[i + 1..].reverse();
    }
}
