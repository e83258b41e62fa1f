//! The left panel: choose n, type a permutation (one-line, `code: ...` or
//! `word: ...`), step back and forward, pin favourites, move to w·s_i or s_i·w,
//! and browse all of S_n.

use super::app_ctx::{AppCtx, step_history};
use super::browser::Browser;
use super::typeset::{self, Typeset};
use crate::engine::{Fetch, JobKey, Slot};
use crate::math::perms::class::classes_of;
use crate::math::{MathError, MathResult, Perm};
use eframe::egui;

/// The picker's UI state.
#[derive(Default)]
pub struct Picker {
    /// The text in the permutation field.
    pub text: String,
    /// Why the last typed entry was refused.
    pub error: Option<String>,
    /// What to know about the last entry read (a word that is not reduced).
    pub note: Option<String>,
    /// The permutation (one-line) whose text the field was last set to.
    text_for: Vec<usize>,
    dream_count: Slot,
    browser: Browser,
}

/// Reads a typed permutation: one-line (`31524`, `3 1 5 2 4`, `3,1,5,2,4`),
/// `code: 2,0,2,0` (a Lehmer code) or `word: 1 3 2 3` (the product s_1 s_3 s_2 s_3).
/// A code or word giving a permutation smaller than `n` is embedded in S_n;
/// a one-line permutation keeps its own n (`31524` is in S_5 whatever n was).
pub fn parse_entry(text: &str, n: usize) -> MathResult<Perm> {
    let t = text.trim();
    let numbers = |rest: &str| -> MathResult<Vec<usize>> {
        rest.split([',', ' ', '\t'])
            .filter(|s| !s.is_empty())
            .map(|s| {
                s.parse::<usize>().map_err(|_| {
                    MathError::InvalidPermutation(format!("'{s}' is not a non-negative integer"))
                })
            })
            .collect()
    };
    let w = if let Some(rest) = t.strip_prefix("code:") {
        Perm::from_code(&numbers(rest)?, None)?
    } else if let Some(rest) = t.strip_prefix("word:") {
        let word = numbers(rest)?;
        let needed = word.iter().copied().max().map_or(1, |m| m + 1);
        Perm::from_word(&word, Some(needed.max(n)))?
    } else {
        return Perm::parse(t);
    };
    if w.n() < n { w.embed(n) } else { Ok(w) }
}

/// What to say about an entry that was read: a `word:` that is not reduced
/// (more letters than ℓ(w)) gives its product, which the user should know.
pub fn entry_note(text: &str, w: &Perm) -> Option<String> {
    let rest = text.trim().strip_prefix("word:")?;
    let letters = rest
        .split([',', ' ', '\t'])
        .filter(|s| !s.is_empty())
        .count();
    (letters != w.length()).then(|| {
        format!(
            "the word has {letters} letters but ℓ(w) = {}: it is not reduced, and w = {w} is its product",
            w.length()
        )
    })
}

impl Picker {
    /// Draws the panel.
    pub fn ui(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx) {
        let w = ctx.perm();
        if self.text_for != w.one_line() {
            if !self.text_for.is_empty() {
                // another w: the note about the last entry is about an old one
                self.note = None;
            }
            self.text_for = w.one_line();
            self.text = w.to_string();
            self.error = None;
        }
        ui.heading("Permutation");
        size_and_history(ui, ctx, &w);
        self.entry(ui, ctx);
        ui.separator();
        self.summary(ui, ctx, &w);
        ui.separator();
        self.neighbours(ui, ctx, &w);
        ui.separator();
        self.pins(ui, ctx, &w);
        ui.separator();
        self.browser.ui(ui, ctx, &w);
    }

    /// The field for a typed permutation, "go" (or Enter), and why the last entry was refused.
    fn entry(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx) {
        let edit = ui.add(
            egui::TextEdit::singleline(&mut self.text)
                .id_salt("perm_entry")
                .hint_text("31524, code: 2,0,2,0, word: 1 3 2 3")
                .desired_width(f32::INFINITY),
        );
        let submitted = edit.lost_focus() && ui.input(|i| i.key_pressed(egui::Key::Enter));
        ui.horizontal(|ui| {
            if ui.button("go").clicked() || submitted {
                match parse_entry(&self.text, ctx.session.n) {
                    Ok(v) => {
                        self.error = None;
                        self.note = entry_note(&self.text, &v);
                        self.text_for = v.one_line();
                        self.text = v.to_string();
                        ctx.go_to(v);
                    }
                    Err(e) => {
                        self.error = Some(e.to_string());
                        self.note = None;
                    }
                }
            }
            ui.weak("one-line, code: or word:");
        });
        if let Some(e) = &self.error {
            ui.colored_label(super::theme::alert(), e);
        }
        if let Some(note) = &self.note {
            ui.add(egui::Label::new(egui::RichText::new(note).weak()).wrap());
        }
    }

    /// w, ℓ(w), its code and classes, and its number of pipe dreams.
    fn summary(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx, w: &Perm) {
        ui.horizontal(|ui| {
            ui.label(egui::RichText::new(format!("w = {w}")).strong().monospace());
            ui.label(format!("ℓ(w) = {}", w.length()));
        });
        let code: Vec<String> = w.code().iter().map(|c| c.to_string()).collect();
        ui.label(format!("code ({})", code.join(",")));
        let classes: Vec<&str> = classes_of(w).into_iter().map(|c| c.label()).collect();
        if !classes.is_empty() {
            ui.weak(classes.join(", "));
        }
        match self
            .dream_count
            .fetch(ctx.engine, JobKey::Counts(vec![w.clone()]))
        {
            Fetch::Ready(out) => {
                if let Some(c) = out.counts().and_then(|c| c.first()) {
                    typeset::label(
                        ui,
                        &Typeset::new().symbol(format!("pipe dreams S_w(1, …, 1) = {c}")),
                    );
                }
            }
            Fetch::Running(..) => {
                ui.horizontal(|ui| {
                    ui.spinner();
                    ui.weak("counting pipe dreams");
                });
            }
            Fetch::Failed(e) => {
                ui.colored_label(super::theme::alert(), e.to_string());
            }
        }
    }

    /// Buttons to w·s_i and s_i·w.
    fn neighbours(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx, w: &Perm) {
        let n = w.n();
        if n < 2 {
            return;
        }
        for (left, title) in [
            (false, "w·s_i (swap positions; + longer, - shorter)"),
            (true, "s_i·w (swap values)"),
        ] {
            ui.weak(title);
            ui.horizontal_wrapped(|ui| {
                for i in 1..n {
                    let next = if left { w.s_times(i) } else { w.times_s(i) };
                    let Ok(next) = next else { continue };
                    let arrow = if next.length() > w.length() { "+" } else { "-" };
                    let label = if left {
                        format!("s{i}·{arrow}")
                    } else {
                        format!("·s{i}{arrow}")
                    };
                    if ui
                        .small_button(label)
                        .on_hover_text(format!("go to {next} (ℓ = {})", next.length()))
                        .clicked()
                    {
                        ctx.go_to(next);
                    }
                }
            });
        }
    }

    /// Pin or unpin w, and the pinned permutations to go to.
    fn pins(&mut self, ui: &mut egui::Ui, ctx: &mut AppCtx, w: &Perm) {
        let line = w.one_line();
        let pinned = ctx.session.pins.contains(&line);
        ui.horizontal(|ui| {
            ui.label("Pinned");
            let label = if pinned { "unpin w" } else { "pin w" };
            if ui.small_button(label).clicked() {
                if pinned {
                    ctx.session.pins.retain(|p| p != &line);
                } else {
                    ctx.session.pins.push(line.clone());
                }
            }
        });
        let mut go = None;
        ui.horizontal_wrapped(|ui| {
            for p in &ctx.session.pins {
                let Ok(v) = Perm::from_one_line(p) else {
                    continue;
                };
                if ui
                    .selectable_label(p == &line, egui::RichText::new(v.to_string()).monospace())
                    .clicked()
                {
                    go = Some(v);
                }
            }
        });
        if let Some(v) = go {
            ctx.go_to(v);
        }
    }
}

/// n (a new n keeps w when it fits, else goes to the identity and says so), back and forward.
fn size_and_history(ui: &mut egui::Ui, ctx: &mut AppCtx, w: &Perm) {
    ui.horizontal(|ui| {
        ui.label("n");
        let mut n = ctx.session.n.clamp(1, crate::math::MAX_N);
        let changed = ui
            .add(
                egui::DragValue::new(&mut n)
                    .range(1..=crate::math::MAX_N)
                    .update_while_editing(false),
            )
            .on_hover_text("the size of S_n")
            .changed();
        if changed && n != w.n() {
            let (next, note) = resized(w, n);
            if let Some(note) = note {
                ctx.report(note);
            }
            ctx.go_to(next);
        }
        if ui
            .add_enabled(ctx.session.history_pos > 0, egui::Button::new("< back"))
            .clicked()
        {
            step_history(ctx.session, -1);
        }
        let can_forward = ctx.session.history_pos + 1 < ctx.session.history.len();
        if ui
            .add_enabled(can_forward, egui::Button::new("forward >"))
            .clicked()
        {
            step_history(ctx.session, 1);
        }
    });
}

/// What a new n makes current: w itself in S_n when it fixes every number above
/// n, else the identity of S_n, with a note saying why w was left.
fn resized(w: &Perm, n: usize) -> (Perm, Option<String>) {
    let kept = if w.support_size() <= n {
        w.restrict(n).or_else(|| w.embed(n).ok())
    } else {
        None
    };
    match kept {
        Some(v) => (v, None),
        None => (
            Perm::identity(n),
            Some(format!(
                "{w} does not fix {}, so it is not in S_{n}; the identity of S_{n} is shown (< back returns to {w})",
                w.support_size()
            )),
        ),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn entries_in_three_notations() {
        // the code (2,0,2,0) is that of 31524 (c_1 = #{j > 1 : w(j) < 3} = 2, ...)
        assert_eq!(
            parse_entry("code: 2,0,2,0", 5).unwrap().to_string(),
            "31524"
        );
        // s1 s3 s2 s3 = s1 s2 s3 s2 ; one-line 2431
        assert_eq!(parse_entry("word: 1 3 2 3", 4).unwrap().to_string(), "2431");
        // a one-line permutation keeps its own n
        assert_eq!(parse_entry("213", 5).unwrap().to_string(), "213");
        assert_eq!(parse_entry("31524", 8).unwrap().to_string(), "31524");
        // s1 s2 s1 s2 = s2 s1 (the braid relation s1 s2 s1 = s2 s1 s2): 312, length 2
        // (positions swapped left to right, as word: 1 3 2 3 gives 2431 above)
        let w = parse_entry("word: 1 2 1 2", 3).unwrap();
        assert_eq!(w.to_string(), "312");
        assert!(
            entry_note("word: 1 2 1 2", &w)
                .unwrap()
                .contains("not reduced")
        );
        let v = parse_entry("word: 1 2 1", 3).unwrap();
        assert!(entry_note("word: 1 2 1", &v).is_none());
        assert!(parse_entry("3124 x", 4).is_err());
        assert!(parse_entry("1224", 4).is_err());
    }

    #[test]
    fn a_new_n_keeps_w_when_it_fits_and_says_so_when_not() {
        // 2143 fixes nothing above 4: it lives in S_4, S_5, ... (as 2143, 21435)
        let w = Perm::from_one_line(&[2, 1, 4, 3]).unwrap();
        assert_eq!(resized(&w, 5).0.to_string(), "21435");
        assert!(resized(&w, 5).1.is_none());
        let v = Perm::from_one_line(&[2, 1, 3, 4]).unwrap();
        assert_eq!(resized(&v, 2).0.to_string(), "21");
        // 1432 moves 4, so it is not in S_3
        let u = Perm::from_one_line(&[1, 4, 3, 2]).unwrap();
        let (next, note) = resized(&u, 3);
        assert_eq!(next, Perm::identity(3));
        assert!(note.unwrap().contains("1432 does not fix 4"));
    }
}
