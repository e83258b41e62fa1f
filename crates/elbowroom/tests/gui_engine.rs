//! The explorer's jobs driven headlessly (egui_kittest, no display): a cancel
//! leaves the window idle, a second request replaces the first, a fast job
//! finishes beside a slow one, a product's row makes w current, and a huge
//! typed power does not hold up the frames.
#![cfg(feature = "gui")]
#![allow(clippy::unwrap_used)]

mod window_harness;
use egui_kittest::Harness;
use egui_kittest::kittest::Queryable;
use elbowroom::gui::Explorer;
use std::time::{Duration, Instant};
use window_harness::{harness, has, settle, survey_of_s5};

/// n = 11, h = (3, 4, ..., 11, 11, 11): |h| = 19 (1 073 227 rows); its
/// table takes many seconds, so it is still running whenever the tests look.
const SLOW_H: [usize; 11] = [3, 4, 5, 6, 7, 8, 9, 10, 11, 11, 11];

/// Opens the Hessenberg view on `h` and presses the button (n = 11 does not start by itself).
fn start_table(h: &mut Harness<'static, Explorer>, values: &[usize]) {
    h.get_by_label("Hessenberg classes").click();
    h.step();
    h.state_mut().session.hessenberg.h = values.to_vec();
    h.step();
    h.get_by_label("compute the table").click();
    settle(h, |h| {
        h.state()
            .engine
            .running()
            .iter()
            .any(|r| r.progress.done() > 0)
    });
    // the status line is drawn before the view that started the job: one more frame
    h.step();
}

#[test]
fn a_cancel_stops_the_table_and_the_status_line_shows_idle() {
    let mut h = harness();
    start_table(&mut h, &SLOW_H);
    assert!(has(&h, "running"));
    assert!(has(
        &h,
        "Hessenberg table of h = (3,4,5,6,7,8,9,10,11,11,11)"
    ));
    let asked = Instant::now();
    // the view's cancel button (the status line has one too)
    h.get_all_by_label("cancel").last().unwrap().click();
    settle(&mut h, |h| h.state().engine.running().is_empty());
    eprintln!("the job ended {:?} after the click", asked.elapsed());
    h.step();
    assert!(has(&h, "idle"));
    assert!(has(&h, "canceled"));
}

#[test]
fn a_second_table_request_replaces_the_first() {
    let mut h = harness();
    start_table(&mut h, &SLOW_H);
    let first = h.state().engine.running()[0].progress.clone();
    // another h of n = 11, asked for with the button: the first job is dropped
    let other = [4, 5, 6, 7, 8, 9, 10, 11, 11, 11, 11];
    h.state_mut().session.hessenberg.h = other.to_vec();
    h.step();
    h.get_by_label("compute the table").click();
    h.step();
    assert!(first.is_canceled());
    settle(&mut h, |h| {
        let running = h.state().engine.running();
        running.len() == 1 && !running[0].progress.is_canceled()
    });
    assert!(has(
        &h,
        "Hessenberg table of h = (4,5,6,7,8,9,10,11,11,11,11)"
    ));
}

#[test]
fn the_survey_of_s5_finishes_while_a_slow_table_runs() {
    let mut h = harness();
    start_table(&mut h, &SLOW_H);
    let slow = h.state().engine.running()[0].progress.clone();
    survey_of_s5(&mut h);
    // the table was neither stopped nor finished meanwhile
    assert!(!slow.is_canceled());
    assert!(
        h.state()
            .engine
            .running()
            .iter()
            .any(|r| r.label.contains("Hessenberg"))
    );
}

#[test]
fn a_click_on_a_product_row_makes_w_current() {
    let mut h = harness();
    h.get_by_label("Products & expansions").click();
    h.step();
    h.state_mut().session.products.u = "132".into();
    h.state_mut().session.products.v = "132".into();
    h.state_mut().session.products.stable = true;
    // S_132 · S_132 = (x1 + x2)^2 = S_1423 + S_231 (Monk's rule; by hand,
    // S_231 = x1 x2 and S_1423 = x1^2 + x1 x2 + x2^2, Macdonald's table)
    settle(&mut h, |h| {
        has(h, "2 terms; every coefficient is nonnegative")
    });
    h.get_all_by_label("1423").last().unwrap().click();
    h.step();
    // the demo explores S_5, so 1423 is taken there
    assert_eq!(h.state().session.current, vec![1, 4, 2, 3, 5]);
}

#[test]
fn negative_coefficients_of_an_expansion_are_marked() {
    let mut h = harness();
    h.get_by_label("Products & expansions").click();
    h.step();
    // x2 = S_132 − S_21 stably (S_132 = x1 + x2, S_21 = x1); in H*(Fl_5) the same
    // with five entries (the expansion's own n)
    h.state_mut().session.products.poly = "x2".into();
    h.state_mut().session.products.poly_n = 5;
    settle(&mut h, |h| has(h, "some coefficients are negative"));
    assert!(has(&h, "negative"));
    assert!(has(&h, "-1"));
    assert!(has(&h, "21345"));
}

#[test]
fn a_huge_power_in_the_workbench_keeps_frames_flowing() {
    let mut h = harness();
    h.state_mut().session.n = 8;
    h.state_mut().session.current = (1..=8).collect();
    h.get_by_label("Polynomial workbench").click();
    h.step();
    // (x1 + ... + x8)^12 has C(19, 7) = 50 388 terms (stars and bars): reading it
    // takes about 2.2·10^6 coefficient products, seconds in the test build; its
    // expansion in H*(Fl_8) goes through Monk's rule without multiplying out, and is
    // 0 since x1 + ... + x8 = e_1 lies in the ideal I_8
    h.state_mut().session.workbench.poly = "(x1+x2+x3+x4+x5+x6+x7+x8)^12".into();
    let mut longest = Duration::ZERO;
    for _ in 0..40 {
        let t = Instant::now();
        h.step();
        longest = longest.max(t.elapsed());
        std::thread::sleep(Duration::from_millis(5));
    }
    eprintln!("longest of 40 frames while the power is read: {longest:?}");
    // still reading (the frames did not wait for it) and the flag expansion is there
    assert!(has(&h, "reading the polynomial"));
    assert!(has(&h, "the result is 0 (no terms)"));
    // a shorter text replaces the request: the reading of the power is canceled
    let reading = h
        .state()
        .engine
        .running()
        .into_iter()
        .find(|r| r.label.starts_with("reading"))
        .unwrap()
        .progress;
    h.state_mut().session.workbench.poly = "x1 x2".into();
    settle(&mut h, |h| has(h, "f = x1 x2"));
    assert!(reading.is_canceled());
}

#[test]
fn a_polynomial_typed_in_the_quotient_view_is_read_on_the_engine() {
    let mut h = harness();
    h.state_mut().session.n = 8;
    h.state_mut().session.current = (1..=8).collect();
    h.get_by_label("Quotient by J_n").click();
    h.step();
    h.state_mut().session.quotient.use_typed = true;
    // (x1 + ... + x8)^12, C(19, 7) = 50 388 terms: seconds of reading in the test
    // build, done with the reduction on the engine while the frames go on
    h.state_mut().session.quotient.typed = "(x1+x2+x3+x4+x5+x6+x7+x8)^12".into();
    for _ in 0..20 {
        h.step();
        std::thread::sleep(Duration::from_millis(5));
    }
    assert!(has(&h, "reducing"));
    // a mistake is reported by the engine's reading, with its column
    h.state_mut().session.quotient.typed = "x1 +* x2".into();
    settle(&mut h, |h| has(h, "column"));
}

/// The workbench's DS_8 refusal is the command's, word for word and number for
/// number: both call the one sizing check of the math crate. (x1 + ⋯ + x8)^9 has
/// C(16, 7) = 11 440 terms (stars and bars); DS_8 goes through the product of the
/// C(8, 2) − 7 = 21 factors x_i − x_j with j > i + 1, of up to
/// min(2^21, C(28, 7)) = 1 184 040 terms.
#[test]
fn the_workbench_refuses_ds_8_with_the_words_and_numbers_of_divsym() {
    let text = "(x1+x2+x3+x4+x5+x6+x7+x8)^9";
    let cli = std::process::Command::new(env!("CARGO_BIN_EXE_elbowroom"))
        .args(["divsym", text, "--n", "8"])
        .output()
        .unwrap();
    assert_eq!(cli.status.code(), Some(2));
    let stderr = String::from_utf8_lossy(&cli.stderr);
    let message = stderr
        .trim_end()
        .strip_prefix("elbowroom: ")
        .unwrap()
        .to_string();
    assert!(message.starts_with("DS_8(f) goes through f·Q"), "{message}");
    assert!(
        message.contains("11440 terms of f times up to 1184040 terms"),
        "{message}"
    );
    let mut h = harness();
    h.get_by_label("Polynomial workbench").click();
    h.step();
    h.state_mut().session.n = 8;
    h.state_mut().session.workbench.use_h = false;
    h.state_mut().session.workbench.poly = text.into();
    settle(&mut h, |h| has(h, &message));
    // the same refusal once, not once per panel
    assert_eq!(h.query_all_by_label_contains(&message).count(), 1);
}

/// The number of permutations of S_n with k inversions: the coefficient of q^k
/// in Π_{i=1..n} (1 + q + ⋯ + q^{i−1}) (the Mahonian numbers, OEIS A008302).
fn mahonian(n: usize, k: usize) -> u64 {
    let mut c = vec![1u64];
    for i in 1..=n {
        let mut next = vec![0u64; c.len() + i - 1];
        for (d, x) in c.iter().enumerate() {
            for e in 0..i {
                next[d + e] += x;
            }
        }
        c = next;
    }
    c.get(k).copied().unwrap_or(0)
}

/// Cancel, then retry: the table shown is the retry's, shown once it is
/// finished, and nothing starts again afterwards (no restart of a finished job).
#[test]
fn after_cancel_and_retry_the_table_is_shown_and_not_restarted() {
    let mut h = harness();
    start_table(&mut h, &SLOW_H);
    let first = h.state().engine.running()[0].id;
    h.get_all_by_label("cancel").last().unwrap().click();
    settle(&mut h, |h| h.state().engine.running().is_empty());
    settle(&mut h, |h| has(h, "retry"));
    h.get_by_label("retry").click();
    settle(&mut h, |h| !h.state().engine.running().is_empty());
    let running = h.state().engine.running();
    assert_eq!(running.len(), 1);
    let retry = running[0].id;
    assert_ne!(retry, first);
    // |h| = Σ (h(i) − i) = 8·2 + 2 + 1 = 19 for h = (3, 4, ..., 11, 11, 11): the rows
    // are the w of length 19 in S_11
    let count = mahonian(11, 19).to_string();
    let grouped = elbowroom::gui::typeset::grouped(&count);
    let shown = |h: &Harness<'static, Explorer>| {
        [&count, &grouped]
            .iter()
            .any(|c| has(h, &format!("{c} permutations of length 19")))
    };
    settle(&mut h, shown);
    for _ in 0..30 {
        h.step();
        assert!(h.state().engine.running().is_empty(), "a job started again");
        assert!(shown(&h));
        assert!(!has(&h, "canceled"));
    }
}
