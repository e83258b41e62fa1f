//! The TikZ writer: a standalone LaTeX document (`\documentclass[tikz]{standalone}`)
//! that compiles with pdflatex and no other package. Colours are declared once
//! with `\definecolor`; each path or circle of the scene is one `\draw`
//! command, followed by a comment naming its tag (`% pipe 3`).
//!
//! Coordinates are the scene's own: the picture is drawn with `x=1pt, y=-1pt`,
//! so one figure unit is one point and y points down as in the scene.

use super::math_text::{self, Level};
use super::scene::{Anchor, Color, Item, ItemKind, PathCmd, Pt, Scene, Stroke, Tag};
use super::svg::num;
use std::collections::BTreeSet;
use std::fmt::Write;

/// The scene as a standalone LaTeX document, with its background.
pub fn to_tikz(scene: &Scene) -> String {
    document(scene, true)
}

/// The scene as a standalone LaTeX document, with or without its background.
pub fn document(scene: &Scene, with_background: bool) -> String {
    let mut out = String::new();
    out.push_str("\\documentclass[tikz]{standalone}\n");
    define_colors(&mut out, scene, with_background);
    out.push_str("\\begin{document}\n\\begin{tikzpicture}[x=1pt, y=-1pt]\n");
    let (w, h) = (num(scene.width), num(scene.height));
    if with_background {
        let _ = writeln!(
            out,
            "\\fill[{}] (0,0) rectangle ({w},{h});",
            color_name(scene.background)
        );
    }
    let _ = writeln!(out, "\\useasboundingbox (0,0) rectangle ({w},{h});");
    for item in &scene.items {
        item_line(&mut out, item);
    }
    out.push_str("\\end{tikzpicture}\n\\end{document}\n");
    out
}

/// One `\definecolor` per colour the scene uses, in a fixed order.
fn define_colors(out: &mut String, scene: &Scene, with_background: bool) {
    let mut colors: BTreeSet<(u8, u8, u8)> = BTreeSet::new();
    if with_background {
        colors.insert(rgb(scene.background));
    }
    for item in &scene.items {
        match &item.kind {
            ItemKind::Path { stroke, fill, .. } | ItemKind::Circle { stroke, fill, .. } => {
                colors.extend(stroke.map(|s| rgb(s.color)));
                colors.extend(fill.map(rgb));
            }
            ItemKind::Text { color, .. } => {
                colors.insert(rgb(*color));
            }
        }
    }
    for &(r, g, b) in &colors {
        let _ = writeln!(
            out,
            "\\definecolor{{{}}}{{HTML}}{{{:02X}{:02X}{:02X}}}",
            color_name(Color::rgb(r, g, b)),
            r,
            g,
            b
        );
    }
}

/// The line of one item: a `\draw` for a path or a circle, a `\node` for text.
fn item_line(out: &mut String, item: &Item) {
    let comment = tag_comment(item.tag);
    match &item.kind {
        ItemKind::Path { cmds, stroke, fill } => {
            if cmds.is_empty() {
                return;
            }
            let _ = writeln!(
                out,
                "\\draw[{}] {};{comment}",
                style(*stroke, *fill),
                path(cmds)
            );
        }
        ItemKind::Circle {
            center,
            radius,
            stroke,
            fill,
        } => {
            let _ = writeln!(
                out,
                "\\draw[{}] {} circle[radius={}];{comment}",
                style(*stroke, *fill),
                point(*center),
                num(*radius)
            );
        }
        ItemKind::Text {
            pos,
            text,
            size,
            color,
            anchor,
        } => {
            let anchor = match anchor {
                Anchor::Center => "center",
                Anchor::Left => "west",
                Anchor::Right => "east",
            };
            let s = num(*size);
            let leading = num(size * 1.2);
            let _ = writeln!(
                out,
                "\\node[anchor={anchor}, inner sep=0pt, text={}, font=\\fontsize{{{s}}}{{{leading}}}\\selectfont\\sffamily] at {} {{{}}};{comment}",
                color_name(*color),
                point(*pos),
                label_latex(text)
            );
        }
    }
}

fn rgb(c: Color) -> (u8, u8, u8) {
    (c.r, c.g, c.b)
}

/// The xcolor name of an opaque colour: `er` and its hex digits.
fn color_name(c: Color) -> String {
    format!("er{:02X}{:02X}{:02X}", c.r, c.g, c.b)
}

fn style(stroke: Option<Stroke>, fill: Option<Color>) -> String {
    let mut parts: Vec<String> = Vec::new();
    match stroke {
        Some(s) => {
            parts.push(format!("draw={}", color_name(s.color)));
            parts.push(format!("line width={}pt", num(s.width)));
            parts.push("line cap=round".into());
            parts.push("line join=round".into());
            if s.color.a < 255 {
                parts.push(format!(
                    "draw opacity={}",
                    num(f32::from(s.color.a) / 255.0)
                ));
            }
        }
        None => parts.push("draw=none".into()),
    }
    if let Some(f) = fill {
        parts.push(format!("fill={}", color_name(f)));
        if f.a < 255 {
            parts.push(format!("fill opacity={}", num(f32::from(f.a) / 255.0)));
        }
    }
    parts.join(", ")
}

fn point(p: Pt) -> String {
    format!("({},{})", num(p.x), num(p.y))
}

fn path(cmds: &[PathCmd]) -> String {
    let mut s = String::new();
    for (i, cmd) in cmds.iter().enumerate() {
        match cmd {
            PathCmd::MoveTo(p) => {
                if i > 0 {
                    s.push(' ');
                }
                s.push_str(&point(*p));
            }
            PathCmd::LineTo(p) => {
                let _ = write!(s, " -- {}", point(*p));
            }
            PathCmd::CubicTo(a, b, p) => {
                let _ = write!(
                    s,
                    " .. controls {} and {} .. {}",
                    point(*a),
                    point(*b),
                    point(*p)
                );
            }
            PathCmd::Close => s.push_str(" -- cycle"),
        }
    }
    s
}

fn tag_comment(tag: Tag) -> String {
    match tag {
        Tag::None => String::new(),
        Tag::Pipe(k) => format!(" % pipe {k}"),
        Tag::Cell(r, c) => format!(" % cell {r} {c}"),
        Tag::Crossing(k) => format!(" % crossing {k}"),
        Tag::Panel(k) => format!(" % panel {k}"),
        Tag::Vertex(k) => format!(" % vertex {k}"),
        Tag::Node(k) => format!(" % node {k}"),
        Tag::Label => " % label".into(),
    }
}

/// A figure label as LaTeX: with indices or exponents (see [`math_text`])
/// it is set as one formula, `$x_{2}^{2}x_{3}$`, `$a^{h}_{w}$`, words in
/// `\mathrm`; any other label as text by [`latex_text`].
pub fn label_latex(text: &str) -> String {
    let Some(how) = math_text::label_reading(text) else {
        return latex_text(text);
    };
    let mut out = String::from("$");
    for (k, p) in math_text::pieces(text, how).into_iter().enumerate() {
        let body = math_mode(&p.text, how);
        match p.level {
            Level::Base => out.push_str(&body),
            Level::Sub | Level::Sup => {
                if k == 0 {
                    out.push_str("{}");
                }
                out.push(if p.level == Level::Sub { '_' } else { '^' });
                out.push('{');
                out.push_str(&body);
                out.push('}');
            }
        }
    }
    out.push('$');
    out
}

/// A run of a label in math mode: runs of two or more letters upright
/// (`\mathrm{Vol}`), spaces kept (`\ `) except in a polynomial, symbols
/// by their commands, specials escaped.
fn math_mode(text: &str, how: math_text::MathText) -> String {
    let chars: Vec<char> = text.chars().collect();
    let mut out = String::new();
    let mut i = 0;
    while i < chars.len() {
        let c = chars[i];
        if c.is_ascii_alphabetic() {
            let mut j = i;
            while j < chars.len() && chars[j].is_ascii_alphabetic() {
                j += 1;
            }
            let word: String = chars[i..j].iter().collect();
            if j - i >= 2 {
                let _ = write!(out, "\\mathrm{{{word}}}");
            } else {
                out.push_str(&word);
            }
            i = j;
            continue;
        }
        let piece = match c {
            ' ' if how == math_text::MathText::Poly => "",
            ' ' => "\\ ",
            '\\' => "\\backslash ",
            '{' => "\\{",
            '}' => "\\}",
            '#' => "\\#",
            '$' => "\\$",
            '%' => "\\%",
            '&' => "\\&",
            '_' => "\\_",
            '^' => "\\hat{}",
            '~' => "\\sim ",
            '−' => "-",
            '…' => "\\dots ",
            c if c.is_ascii() && !c.is_control() => {
                out.push(c);
                i += 1;
                continue;
            }
            c if c.is_control() => "",
            c => {
                // the symbols latex_text sets in math mode, without the dollars
                let t = latex_text(&c.to_string());
                let t = t.trim_matches('$');
                out.push_str(t);
                if t.starts_with('\\') && t.chars().last().is_some_and(|l| l.is_alphabetic()) {
                    out.push(' ');
                }
                i += 1;
                continue;
            }
        };
        out.push_str(piece);
        i += 1;
    }
    out
}

/// Plain scene text as LaTeX that pdflatex accepts with no extra package:
/// specials escaped, the Greek and mathematical symbols the figures use in
/// math mode, anything else unknown replaced by `?`.
pub fn latex_text(text: &str) -> String {
    let mut out = String::new();
    for ch in text.chars() {
        let piece: &str = match ch {
            '\\' => "\\textbackslash{}",
            '{' => "\\{",
            '}' => "\\}",
            '#' => "\\#",
            '$' => "\\$",
            '%' => "\\%",
            '&' => "\\&",
            '_' => "\\_",
            '^' => "\\^{}",
            '~' => "\\~{}",
            '<' => "$<$",
            '>' => "$>$",
            '|' => "$|$",
            'σ' => "$\\sigma$",
            'λ' => "$\\lambda$",
            'ℓ' => "$\\ell$",
            '∂' => "$\\partial$",
            'π' => "$\\pi$",
            'α' => "$\\alpha$",
            'β' => "$\\beta$",
            'μ' => "$\\mu$",
            'Σ' => "$\\Sigma$",
            '·' => "$\\cdot$",
            '×' => "$\\times$",
            '≤' => "$\\leq$",
            '≥' => "$\\geq$",
            '−' => "$-$",
            '→' => "$\\to$",
            '…' => "\\dots{}",
            '–' => "--",
            '—' => "---",
            '₀' => "$_0$",
            '₁' => "$_1$",
            '₂' => "$_2$",
            '₃' => "$_3$",
            '₄' => "$_4$",
            '₅' => "$_5$",
            '₆' => "$_6$",
            '₇' => "$_7$",
            '₈' => "$_8$",
            '₉' => "$_9$",
            c if c.is_ascii() && !c.is_control() => {
                out.push(c);
                continue;
            }
            c if c.is_control() => continue,
            _ => "?",
        };
        out.push_str(piece);
    }
    out
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn specials_are_escaped() {
        assert_eq!(latex_text("a_1 & 50%"), "a\\_1 \\& 50\\%");
        assert_eq!(latex_text("σ₂"), "$\\sigma$$_2$");
    }

    #[test]
    fn labels_with_indices_are_formulas() {
        assert_eq!(label_latex("x2^2*x3"), "$x_{2}^{2}x_{3}$");
        assert_eq!(label_latex("x2^2 x3"), "$x_{2}^{2}x_{3}$");
        assert_eq!(label_latex("a^h_w"), "$a^{h}_{w}$");
        assert_eq!(label_latex("σ_{w0 w}"), "$\\sigma _{w0w}$");
        assert_eq!(
            label_latex("Vol P_λ(t)"),
            "$\\mathrm{Vol}\\ P_{\\lambda }(t)$"
        );
        // nothing to lower or raise: text as before
        assert_eq!(label_latex("-3/2"), "-3/2");
        assert_eq!(label_latex("a & b"), "a \\& b");
    }
}
