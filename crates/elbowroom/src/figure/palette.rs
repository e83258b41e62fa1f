//! The house palette: a perceptual colour scale for pipe and wire labels, and
//! the neutral colours of grids, text and backgrounds.
//!
//! The scale runs through evenly spaced hues at fixed lightness and chroma in
//! the OKLCh space, so neighbouring labels stay distinguishable and no label
//! dominates; colours are computed, then rounded to sRGB bytes.

use super::scene::Color;

/// Background of light figures.
pub const PAPER: Color = Color::rgb(0xfb, 0xfa, 0xf7);
/// Background of dark figures.
pub const SLATE: Color = Color::rgb(0x1f, 0x23, 0x2a);
/// Grid lines and frames.
pub const GRID: Color = Color::rgb(0xc9, 0xc6, 0xbf);
/// Text on light backgrounds.
pub const INK: Color = Color::rgb(0x2b, 0x2d, 0x31);
/// Marks for negative values and errors.
pub const ALERT: Color = Color::rgb(0xc0, 0x39, 0x2b);

/// The colour of label k (1-based) among `count` labels.
pub fn label_color(k: usize, count: usize) -> Color {
    let count = count.max(1) as f32;
    let t = ((k.max(1) - 1) as f32) / count;
    // hue sweep starting at a warm ochre, 300 degrees wide so the ends differ
    let hue = (70.0 + 300.0 * t).to_radians();
    oklch_to_srgb(0.62, 0.14, hue)
}

fn oklch_to_srgb(l: f32, c: f32, h: f32) -> Color {
    let (a, b) = (c * h.cos(), c * h.sin());
    let l_ = l + 0.396_337_78 * a + 0.215_803_76 * b;
    let m_ = l - 0.105_561_346 * a - 0.063_854_17 * b;
    let s_ = l - 0.089_484_18 * a - 1.291_485_5 * b;
    let (l3, m3, s3) = (l_ * l_ * l_, m_ * m_ * m_, s_ * s_ * s_);
    let r = 4.076_741_7 * l3 - 3.307_711_6 * m3 + 0.230_969_94 * s3;
    let g = -1.268_438 * l3 + 2.609_757_4 * m3 - 0.341_319_38 * s3;
    let bl = -0.004_196_086_3 * l3 - 0.703_418_6 * m3 + 1.707_614_7 * s3;
    Color::rgb(encode(r), encode(g), encode(bl))
}

fn encode(linear: f32) -> u8 {
    let x = linear.clamp(0.0, 1.0);
    let s = if x <= 0.003_130_8 {
        12.92 * x
    } else {
        1.055 * x.powf(1.0 / 2.4) - 0.055
    };
    (s * 255.0).round() as u8
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn labels_get_distinct_colours() {
        for n in 2..=16 {
            let mut seen: Vec<Color> = (1..=n).map(|k| label_color(k, n)).collect();
            seen.sort_by_key(|c| (c.r, c.g, c.b));
            seen.dedup();
            assert_eq!(seen.len(), n, "n = {n}");
        }
    }
}
