//! The SVG writer: one element per scene item, in painting order, with the
//! item's tag as classes and `data-` attributes (`class="pipe pipe-3"
//! data-pipe="3"`), so a figure can be restyled or inspected after export.
//!
//! One figure unit is one SVG user unit; the document's `width` and `height`
//! are in points, so the figure prints at the size it has on screen.

use super::math_text::{self, Level};
use super::scene::{Anchor, Color, Item, ItemKind, PathCmd, Scene, Stroke, Tag};
use std::fmt::Write;

/// The font family written on text; the PNG writer loads this font explicitly.
pub const FONT_FAMILY: &str = "DejaVu Sans";

/// The scene as a standalone SVG document, with its background.
pub fn to_svg(scene: &Scene) -> String {
    document(scene, true)
}

/// The scene as an SVG document, with or without its background rectangle.
pub fn document(scene: &Scene, with_background: bool) -> String {
    document_in_units(scene, with_background, "pt")
}

/// The document with `width` and `height` in the given unit (`""` for user
/// units, which the rasterizer maps one to one onto pixels).
pub(crate) fn document_in_units(scene: &Scene, with_background: bool, unit: &str) -> String {
    let (w, h) = (num(scene.width), num(scene.height));
    let mut out = String::new();
    let _ = writeln!(
        out,
        "<svg xmlns=\"http://www.w3.org/2000/svg\" version=\"1.1\" width=\"{w}{unit}\" height=\"{h}{unit}\" viewBox=\"0 0 {w} {h}\">"
    );
    if with_background {
        let _ = writeln!(
            out,
            "  <rect class=\"background\" x=\"0\" y=\"0\" width=\"{w}\" height=\"{h}\"{}/>",
            paint("fill", Some(scene.background))
        );
    }
    for item in &scene.items {
        write_item(&mut out, item);
    }
    out.push_str("</svg>\n");
    out
}

fn write_item(out: &mut String, item: &Item) {
    let tag = tag_attributes(item.tag);
    match &item.kind {
        ItemKind::Path { cmds, stroke, fill } => {
            let _ = writeln!(
                out,
                "  <path{tag} d=\"{}\"{}{}/>",
                path_data(cmds),
                paint("fill", *fill),
                stroke_attributes(*stroke)
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
                "  <circle{tag} cx=\"{}\" cy=\"{}\" r=\"{}\"{}{}/>",
                num(center.x),
                num(center.y),
                num(*radius),
                paint("fill", *fill),
                stroke_attributes(*stroke)
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
                Anchor::Center => "middle",
                Anchor::Left => "start",
                Anchor::Right => "end",
            };
            let _ = writeln!(
                out,
                "  <text{tag} x=\"{}\" y=\"{}\" font-family=\"{FONT_FAMILY}\" font-size=\"{}\" text-anchor=\"{anchor}\" dominant-baseline=\"central\"{}>{}</text>",
                num(pos.x),
                num(pos.y),
                num(*size),
                paint("fill", Some(*color)),
                text_content(text, *size)
            );
        }
    }
}

/// The SVG path data of a list of path commands.
pub fn path_data(cmds: &[PathCmd]) -> String {
    let mut d = String::new();
    for cmd in cmds {
        if !d.is_empty() {
            d.push(' ');
        }
        match cmd {
            PathCmd::MoveTo(p) => {
                let _ = write!(d, "M{} {}", num(p.x), num(p.y));
            }
            PathCmd::LineTo(p) => {
                let _ = write!(d, "L{} {}", num(p.x), num(p.y));
            }
            PathCmd::CubicTo(a, b, p) => {
                let _ = write!(
                    d,
                    "C{} {} {} {} {} {}",
                    num(a.x),
                    num(a.y),
                    num(b.x),
                    num(b.y),
                    num(p.x),
                    num(p.y)
                );
            }
            PathCmd::Close => d.push('Z'),
        }
    }
    d
}

/// ` class="..." data-...="..."` for a tag (empty for decoration).
fn tag_attributes(tag: Tag) -> String {
    match tag {
        Tag::None => String::new(),
        Tag::Pipe(k) => format!(" class=\"pipe pipe-{k}\" data-pipe=\"{k}\""),
        Tag::Cell(r, c) => format!(" class=\"cell\" data-row=\"{r}\" data-col=\"{c}\""),
        Tag::Crossing(k) => format!(" class=\"crossing\" data-crossing=\"{k}\""),
        Tag::Panel(k) => format!(" class=\"panel\" data-panel=\"{k}\""),
        Tag::Vertex(k) => format!(" class=\"vertex\" data-vertex=\"{k}\""),
        Tag::Node(k) => format!(" class=\"node\" data-node=\"{k}\""),
        Tag::Label => " class=\"label\"".into(),
    }
}

/// ` fill="#rrggbb"` (with an opacity when translucent), or ` fill="none"`.
fn paint(attr: &str, color: Option<Color>) -> String {
    match color {
        None => format!(" {attr}=\"none\""),
        Some(c) if c.a == 255 => format!(" {attr}=\"{}\"", c.hex()),
        Some(c) => format!(
            " {attr}=\"{}\" {attr}-opacity=\"{}\"",
            c.hex(),
            num(f32::from(c.a) / 255.0)
        ),
    }
}

fn stroke_attributes(stroke: Option<Stroke>) -> String {
    match stroke {
        None => String::new(),
        Some(s) => format!(
            "{} stroke-width=\"{}\" stroke-linecap=\"round\" stroke-linejoin=\"round\"",
            paint("stroke", Some(s.color)),
            num(s.width)
        ),
    }
}

/// A coordinate with at most three decimals and no trailing zeros.
pub(crate) fn num(x: f32) -> String {
    if !x.is_finite() {
        return "0".into();
    }
    let mut s = format!("{:.3}", x);
    if s.contains('.') {
        while s.ends_with('0') {
            s.pop();
        }
        if s.ends_with('.') {
            s.pop();
        }
    }
    if s == "-0" {
        s = "0".into();
    }
    s
}

/// The content of a `<text>` of font size `size`: the label escaped, its
/// indices and exponents (see [`math_text`]) in `<tspan>`s at 70 % of the
/// size, lowered or raised by a `baseline-shift` in user units. (The text is
/// centred on its anchor with `dominant-baseline="central"`, which a smaller
/// tspan inherits and which alone lifts it by about a tenth of the size; the
/// shifts, -0.3 and +0.25 of the size, leave indices about 0.2 of the size
/// below the baseline and exponents about 0.35 above it.)
pub fn text_content(text: &str, size: f32) -> String {
    let Some(how) = math_text::label_reading(text) else {
        return escape(text);
    };
    let small = num(size * 0.7);
    let mut out = String::new();
    for p in math_text::pieces(text, how) {
        let shift = match p.level {
            Level::Base => {
                out.push_str(&escape(&p.text));
                continue;
            }
            Level::Sub => num(-0.3 * size),
            Level::Sup => num(0.25 * size),
        };
        let _ = write!(
            out,
            "<tspan baseline-shift=\"{shift}\" font-size=\"{small}\">{}</tspan>",
            escape(&p.text)
        );
    }
    out
}

/// Escapes text for XML content and attributes.
fn escape(text: &str) -> String {
    let mut out = String::with_capacity(text.len());
    for ch in text.chars() {
        match ch {
            '&' => out.push_str("&amp;"),
            '<' => out.push_str("&lt;"),
            '>' => out.push_str("&gt;"),
            '"' => out.push_str("&quot;"),
            '\'' => out.push_str("&apos;"),
            c if c.is_control() => {}
            c => out.push(c),
        }
    }
    out
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn numbers_are_compact() {
        assert_eq!(num(3.0), "3");
        assert_eq!(num(2.5), "2.5");
        assert_eq!(num(-0.0001), "0");
        assert_eq!(num(1.23456), "1.235");
        assert_eq!(num(f32::NAN), "0");
    }

    #[test]
    fn indices_and_exponents_are_tspans() {
        assert_eq!(
            text_content("x2^2 x3", 10.0),
            "x<tspan baseline-shift=\"-3\" font-size=\"7\">2</tspan>\
             <tspan baseline-shift=\"2.5\" font-size=\"7\">2</tspan>\
             x<tspan baseline-shift=\"-3\" font-size=\"7\">3</tspan>"
        );
        assert_eq!(
            text_content("a^h_w", 10.0),
            "a<tspan baseline-shift=\"2.5\" font-size=\"7\">h</tspan>\
             <tspan baseline-shift=\"-3\" font-size=\"7\">w</tspan>"
        );
        // labels with nothing to lower or raise are written as they are
        assert_eq!(text_content("-3/2 & <1>", 10.0), "-3/2 &amp; &lt;1&gt;");
    }

    #[test]
    fn text_is_escaped() {
        assert_eq!(escape("a<b & \"c\""), "a&lt;b &amp; &quot;c&quot;");
    }
}
