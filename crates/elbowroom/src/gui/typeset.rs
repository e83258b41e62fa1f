//! Mathematics set in the window as a mathematician writes it: our plain
//! notation (`x2^2*x3`, `a^h_w`, `σ_{w0 w}`, read by
//! [`crate::figure::math_text`]) becomes an egui [`LayoutJob`] whose indices
//! are smaller and lowered and whose exponents are smaller and raised, and a
//! typeset result carries a "copy" button that puts its plain text on the
//! clipboard. The accessible name of a typeset line is its plain notation
//! (a screen reader reads `x2^2 x3`, not the run of glyphs `x22x3`).

use crate::figure::math_text::{Level, MathText, Piece, pieces};
use eframe::egui::{self, Align, Color32, FontId, TextFormat, text::LayoutJob};

/// The size of a sub- or superscript relative to the text around it.
pub const SCRIPT_SCALE: f32 = 0.7;

/// A line of text mixing words and mathematics, built part by part.
#[derive(Clone, Debug, Default)]
pub struct Typeset {
    parts: Vec<(String, Option<MathText>)>,
    strong: bool,
    color: Option<Color32>,
}

impl Typeset {
    /// An empty line.
    pub fn new() -> Typeset {
        Typeset::default()
    }

    /// Words, set as they are.
    pub fn plain(mut self, text: impl Into<String>) -> Typeset {
        self.parts.push((text.into(), None));
        self
    }

    /// A polynomial as `Poly` prints it (`x2^2*x3`, `-3/2 x1`).
    pub fn poly(mut self, text: impl Into<String>) -> Typeset {
        self.parts.push((text.into(), Some(MathText::Poly)));
        self
    }

    /// An indexed symbol or formula (`a^h_w`, `σ_{w0 w}`, `DS_h(f)`).
    pub fn symbol(mut self, text: impl Into<String>) -> Typeset {
        self.parts.push((text.into(), Some(MathText::Symbol)));
        self
    }

    /// Set in the strong (brighter) text colour.
    pub fn strong(mut self) -> Typeset {
        self.strong = true;
        self
    }

    /// Set in `color` instead of the text colour.
    pub fn color(mut self, color: Color32) -> Typeset {
        self.color = Some(color);
        self
    }

    /// The line in our plain notation, as typed (`f = x2^2 x3`).
    pub fn plain_text(&self) -> String {
        self.parts.iter().map(|(t, _)| t.as_str()).collect()
    }

    /// The runs of the whole line.
    pub fn pieces(&self) -> Vec<Piece> {
        let mut out: Vec<Piece> = Vec::new();
        for (text, how) in &self.parts {
            let runs = match how {
                Some(how) => pieces(text, *how),
                None => vec![Piece {
                    text: text.clone(),
                    level: Level::Base,
                }],
            };
            for r in runs {
                match out.last_mut() {
                    Some(p) if p.level == r.level => p.text.push_str(&r.text),
                    _ => out.push(r),
                }
            }
        }
        out
    }

    /// The layout in `ui`'s body font and text colour.
    pub fn job(&self, ui: &egui::Ui) -> LayoutJob {
        let font = egui::TextStyle::Body.resolve(ui.style());
        let color = if let Some(c) = self.color {
            c
        } else if self.strong {
            ui.visuals().strong_text_color()
        } else {
            ui.visuals().text_color()
        };
        let row = ui.fonts_mut(|f| f.row_height(&font));
        layout(&self.pieces(), &font, row, color)
    }
}

/// The runs laid out: scripts at [`SCRIPT_SCALE`] of `font`, superscripts
/// towards the top of the row (raised), subscripts lowered below the
/// baseline by an explicit line height (egui centres a glyph in its line
/// height, so a short line height at the row's bottom sets it lower);
/// `row_height` is the height of a line of `font`.
pub fn layout(runs: &[Piece], font: &FontId, row_height: f32, color: Color32) -> LayoutJob {
    let mut job = LayoutJob::default();
    let small = FontId::new(font.size * SCRIPT_SCALE, font.family.clone());
    for run in runs {
        let format = match run.level {
            Level::Base => TextFormat {
                font_id: font.clone(),
                color,
                valign: Align::BOTTOM,
                ..Default::default()
            },
            Level::Sup => TextFormat {
                font_id: small.clone(),
                color,
                valign: Align::TOP,
                // at the row's top a script floats above the letters; a line
                // a quarter of the font size taller than its own centres it
                // an eighth lower, its foot about a third of the size up
                line_height: Some(row_height * SCRIPT_SCALE + font.size * 0.25),
                ..Default::default()
            },
            Level::Sub => TextFormat {
                font_id: small.clone(),
                color,
                valign: Align::BOTTOM,
                // centred in a line of this height at the row's bottom: its
                // baseline sits about a fifth of the font size below the text's
                line_height: Some((row_height * 0.82 - font.size * 0.4).max(1.0)),
                ..Default::default()
            },
        };
        job.append(&run.text, 0.0, format);
    }
    job
}

/// The line, wrapping at the right edge, then a small "copy" button putting
/// `plain` on the clipboard; the label's response.
pub fn math_label(ui: &mut egui::Ui, line: &Typeset, plain: &str) -> egui::Response {
    let job = line.job(ui);
    let response = ui
        .horizontal_wrapped(|ui| {
            let r = ui.add(egui::Label::new(job).wrap());
            named(&r, egui::Role::Label, line);
            copy_button(ui, plain);
            r
        })
        .inner;
    response.context_menu(|ui| {
        if ui.button("copy as text").clicked() {
            ui.ctx().copy_text(plain.to_string());
            ui.close();
        }
    });
    response
}

/// Paints a figure label at `pos` as `painter.text` would, its indices and
/// exponents typeset when it has any (see [`crate::figure::math_text::label_reading`]),
/// so that the canvas shows what the SVG and TikZ files show.
pub fn paint_label(
    painter: &egui::Painter,
    pos: egui::Pos2,
    anchor: egui::Align2,
    text: &str,
    font: FontId,
    color: Color32,
) {
    let Some(how) = crate::figure::math_text::label_reading(text) else {
        painter.text(pos, anchor, text, font, color);
        return;
    };
    let row = painter.fonts_mut(|f| f.row_height(&font));
    let galley = painter.layout_job(layout(&pieces(text, how), &font, row, color));
    let rect = anchor.anchor_size(pos, galley.size());
    painter.galley(rect.min, galley, color);
}

/// A small "copy" button putting `plain` on the clipboard.
pub fn copy_button(ui: &mut egui::Ui, plain: &str) {
    if ui
        .small_button("copy")
        .on_hover_text(format!("copy as text: {}", shorten(plain)))
        .clicked()
    {
        ui.ctx().copy_text(plain.to_string());
    }
}

/// Names the widget of `response` by the line's plain notation.
pub fn named(response: &egui::Response, kind: egui::Role, line: &Typeset) {
    let plain = line.plain_text();
    response.widget_info(|| egui::WidgetInfo::labeled(kind, true, plain.clone()));
}

/// A typeset line on its own, no copy button (headings, column headers).
pub fn label(ui: &mut egui::Ui, line: &Typeset) -> egui::Response {
    let job = line.job(ui);
    let r = ui.add(egui::Label::new(job).wrap());
    named(&r, egui::Role::Label, line);
    r
}

/// A radio button choosing `value` for `current`, its text typeset.
pub fn radio<V: PartialEq>(
    ui: &mut egui::Ui,
    current: &mut V,
    value: V,
    line: &Typeset,
) -> egui::Response {
    let selected = *current == value;
    let mut r = radio_flag(ui, selected, line);
    if r.clicked() && !selected {
        *current = value;
        r.mark_changed();
    }
    r
}

/// A radio button shown `selected`, its text typeset (the caller acts on a click).
pub fn radio_flag(ui: &mut egui::Ui, selected: bool, line: &Typeset) -> egui::Response {
    let job = line.job(ui);
    let r = ui.radio(selected, job);
    let plain = line.plain_text();
    r.widget_info(|| {
        egui::WidgetInfo::selected(egui::Role::RadioButton, true, selected, plain.clone())
    });
    r
}

/// A heading: the line in the heading font.
pub fn heading(ui: &mut egui::Ui, line: &Typeset) -> egui::Response {
    let font = egui::TextStyle::Heading.resolve(ui.style());
    let row = ui.fonts_mut(|f| f.row_height(&font));
    let job = layout(&line.pieces(), &font, row, ui.visuals().strong_text_color());
    let r = ui.add(egui::Label::new(job).wrap());
    named(&r, egui::Role::Label, line);
    r
}

fn shorten(plain: &str) -> String {
    const MAX: usize = 60;
    if plain.chars().count() <= MAX {
        plain.to_string()
    } else {
        let head: String = plain.chars().take(MAX).collect();
        format!("{head}…")
    }
}

/// A whole number written with its digits in groups of three, separated by
/// thin spaces (`50388` as `50 388`, `-1234567` as `-1 234 567`), when it
/// has more than four digits; other text (a fraction, a word) as it is.
pub fn grouped(number: &str) -> String {
    let (sign, digits) = match number.strip_prefix('-') {
        Some(rest) => ("-", rest),
        None => ("", number),
    };
    if digits.len() <= 4 || !digits.bytes().all(|b| b.is_ascii_digit()) {
        return number.to_string();
    }
    let mut out = String::from(sign);
    for (k, c) in digits.chars().enumerate() {
        if k > 0 && (digits.len() - k) % 3 == 0 {
            out.push('\u{2009}');
        }
        out.push(c);
    }
    out
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Lays out `line` in a fresh context's fonts; the y of each glyph's
    /// baseline and its size, by character.
    fn glyphs(line: &Typeset) -> Vec<(char, f32, f32)> {
        let ctx = egui::Context::default();
        let mut seen = Vec::new();
        let mut out = ctx.run_ui(egui::RawInput::default(), |ui| {
            let font = FontId::proportional(14.0);
            let row = ui.fonts_mut(|f| f.row_height(&font));
            let job = layout(&line.pieces(), &font, row, Color32::BLACK);
            let galley = ui.fonts_mut(|f| f.layout_job(job));
            let text: Vec<char> = galley.job.text.chars().collect();
            for row in &galley.rows {
                for g in &row.glyphs {
                    seen.push((g.chr, g.pos.y, g.font_height));
                }
            }
            assert_eq!(seen.len(), text.len());
        });
        // the font atlas is drawn by no renderer here
        out.textures_delta.clear();
        seen
    }

    #[test]
    fn a_monomial_has_its_index_lowered_and_its_exponent_raised() {
        // x2^2*x3 is x₂²x₃: x, 2 lowered, 2 raised, x, 3 lowered
        let g = glyphs(&Typeset::new().poly("x2^2*x3"));
        let chars: String = g.iter().map(|t| t.0).collect();
        assert_eq!(chars, "x22x3");
        let base = g[0].1;
        assert!(g[1].1 > base, "the index 2 is lowered: {g:?}");
        assert!(g[2].1 < base, "the exponent 2 is raised: {g:?}");
        assert_eq!(g[3].1, base);
        assert!(g[4].1 > base);
        assert!(g[1].2 < g[0].2, "scripts are smaller: {g:?}");
    }

    #[test]
    fn a_h_w_has_h_raised_and_w_lowered() {
        let g = glyphs(&Typeset::new().plain("value ").symbol("a^h_w"));
        let chars: String = g.iter().map(|t| t.0).collect();
        assert_eq!(chars, "value ahw");
        let base = g[6].1;
        assert_eq!(g[0].1, base);
        assert!(g[7].1 < base, "h raised: {g:?}");
        assert!(g[8].1 > base, "w lowered: {g:?}");
    }

    #[test]
    fn sections_carry_the_script_sizes() {
        let font = FontId::proportional(20.0);
        let job = layout(
            &Typeset::new().symbol("σ_{w0 w}").pieces(),
            &font,
            24.0,
            Color32::BLACK,
        );
        assert_eq!(job.text, "σw0w");
        assert_eq!(job.sections.len(), 2);
        assert_eq!(job.sections[0].format.font_id.size, 20.0);
        assert_eq!(job.sections[1].format.font_id.size, 20.0 * SCRIPT_SCALE);
        assert_eq!(job.sections[1].format.valign, Align::BOTTOM);
    }

    #[test]
    fn long_numbers_are_grouped_by_three() {
        assert_eq!(grouped("50388"), "50\u{2009}388");
        assert_eq!(grouped("-1234567"), "-1\u{2009}234\u{2009}567");
        assert_eq!(grouped("1234"), "1234");
        assert_eq!(grouped("3/2"), "3/2");
    }
}
