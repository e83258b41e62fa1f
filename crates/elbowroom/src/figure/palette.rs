//! The house palette: a colour scale for pipe, wire and variable labels, and
//! the neutral colours of grids, text and backgrounds.
//!
//! The scale is chosen in CIELAB by farthest points: each next label gets the
//! colour of medium lightness farthest from every label before it, so
//! consecutive labels (x3 and x4) are clearly apart, and label k has one
//! colour whatever the number of labels.

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

/// How many label colours the scale holds; label k > [`LABELS`] reuses label
/// k − [`LABELS`].
pub const LABELS: usize = 24;

/// The colour of label k (1-based) among `count` labels. Label k has the same
/// colour whatever `count` is, so x3 keeps its colour from one n to the next.
pub fn label_color(k: usize, _count: usize) -> Color {
    let scale = label_scale();
    scale[(k.max(1) - 1) % scale.len()]
}

/// The scale: from a warm ochre, each next colour the one farthest in CIELAB
/// (ΔE*ab, D65) from every colour before it, among the sRGB colours of medium
/// lightness (L* 42 to 68, readable on paper and on slate) and clear chroma
/// (C*ab from 40 to 75, strong but not glaring). So consecutive labels, and any two of the first few,
/// are far apart; the test below measures every pair in use.
fn label_scale() -> &'static [Color] {
    static SCALE: std::sync::OnceLock<Vec<Color>> = std::sync::OnceLock::new();
    SCALE.get_or_init(|| {
        let levels: Vec<u8> = (0..=17).map(|i| (i * 15) as u8).collect();
        let mut candidates: Vec<(Color, [f64; 3])> = Vec::new();
        for &r in &levels {
            for &g in &levels {
                for &b in &levels {
                    let c = Color::rgb(r, g, b);
                    let lab = cielab(c);
                    let chroma = lab[1].hypot(lab[2]);
                    if (42.0..=68.0).contains(&lab[0]) && (40.0..=75.0).contains(&chroma) {
                        candidates.push((c, lab));
                    }
                }
            }
        }
        let ochre = cielab(Color::rgb(0xb4, 0x7d, 0x1e));
        let first = candidates
            .iter()
            .min_by(|x, y| delta_e(x.1, ochre).total_cmp(&delta_e(y.1, ochre)))
            .copied();
        let Some(first) = first else {
            return vec![INK];
        };
        let mut chosen = vec![first];
        // the distance from each candidate to the nearest colour chosen
        let mut nearest: Vec<f64> = candidates.iter().map(|c| delta_e(c.1, first.1)).collect();
        while chosen.len() < LABELS {
            let Some((i, _)) = nearest.iter().enumerate().max_by(|x, y| x.1.total_cmp(y.1)) else {
                break;
            };
            let pick = candidates[i];
            chosen.push(pick);
            for (d, c) in nearest.iter_mut().zip(&candidates) {
                *d = d.min(delta_e(c.1, pick.1));
            }
        }
        chosen.into_iter().map(|(c, _)| c).collect()
    })
}

/// CIELAB (L*, a*, b*) of an sRGB colour, white point D65.
pub fn cielab(c: Color) -> [f64; 3] {
    let lin = |v: u8| {
        let x = f64::from(v) / 255.0;
        if x <= 0.040_45 {
            x / 12.92
        } else {
            ((x + 0.055) / 1.055).powf(2.4)
        }
    };
    let (r, g, b) = (lin(c.r), lin(c.g), lin(c.b));
    let x = 0.412_456_4 * r + 0.357_576_1 * g + 0.180_437_5 * b;
    let y = 0.212_672_9 * r + 0.715_152_2 * g + 0.072_175_0 * b;
    let z = 0.019_333_9 * r + 0.119_192_0 * g + 0.950_304_1 * b;
    let f = |t: f64| {
        if t > 216.0 / 24389.0 {
            t.cbrt()
        } else {
            (24389.0 / 27.0 * t + 16.0) / 116.0
        }
    };
    let (fx, fy, fz) = (f(x / 0.950_47), f(y), f(z / 1.088_83));
    [116.0 * fy - 16.0, 500.0 * (fx - fy), 200.0 * (fy - fz)]
}

/// The CIE 1976 colour difference ΔE*ab: the distance in CIELAB.
pub fn delta_e(a: [f64; 3], b: [f64; 3]) -> f64 {
    ((a[0] - b[0]).powi(2) + (a[1] - b[1]).powi(2) + (a[2] - b[2]).powi(2)).sqrt()
}

#[cfg(test)]
mod tests {
    use super::*;

    /// Every pair of labels in use (n up to 16) is at least 20 apart in
    /// CIELAB (ΔE*ab; a difference of about 2.3 is just noticeable, Sharma,
    /// "Digital Color Imaging Handbook", 2003, from memory), consecutive labels
    /// at least 35; and each keeps a lightness readable on paper and on slate.
    #[test]
    fn labels_in_use_are_far_apart_in_cielab() {
        let mut closest = f64::MAX;
        for n in 2..=16 {
            let labs: Vec<[f64; 3]> = (1..=n).map(|k| cielab(label_color(k, n))).collect();
            for i in 0..n {
                assert!((42.0..=68.0).contains(&labs[i][0]), "L* of label {}", i + 1);
                for j in i + 1..n {
                    let d = delta_e(labs[i], labs[j]);
                    closest = closest.min(d);
                    assert!(
                        d >= 20.0,
                        "labels {} and {} of {n}: ΔE = {d:.1}",
                        i + 1,
                        j + 1
                    );
                    if j == i + 1 {
                        assert!(
                            d >= 35.0,
                            "consecutive labels {} and {j}: ΔE = {d:.1}",
                            i + 1
                        );
                    }
                }
            }
        }
        let hex: Vec<String> = (1..=16)
            .map(|k| label_color(k, 16))
            .map(|c| format!("{:02x}{:02x}{:02x}", c.r, c.g, c.b))
            .collect();
        eprintln!("the closest two labels of 16 are ΔE = {closest:.1} apart: {hex:?}");
        // the conversion itself: sRGB white is L* = 100, a* = b* = 0; pure red is
        // (53.24, 80.09, 67.20) (the CIELAB values of sRGB red, from memory)
        let white = cielab(Color::rgb(255, 255, 255));
        assert!((white[0] - 100.0).abs() < 0.01 && white[1].abs() < 0.01 && white[2].abs() < 0.01);
        let red = cielab(Color::rgb(255, 0, 0));
        assert!(delta_e(red, [53.24, 80.09, 67.20]) < 0.1, "{red:?}");
    }

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
