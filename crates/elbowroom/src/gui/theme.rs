//! Light and dark looks, and conversions from the figure palette to egui colours.

use crate::figure::Color;
use crate::figure::palette;
use eframe::egui;

/// An egui colour from a figure colour.
pub fn color(c: Color) -> egui::Color32 {
    egui::Color32::from_rgba_unmultiplied(c.r, c.g, c.b, c.a)
}

/// The colour for negative values and errors.
pub fn alert() -> egui::Color32 {
    color(palette::ALERT)
}

/// The background of the window's panels in the light or dark look.
pub fn panel_color(dark: bool) -> egui::Color32 {
    if dark {
        egui::Visuals::dark().panel_fill
    } else {
        egui::Visuals::light().panel_fill
    }
}

/// The colour of hint text (`ui.weak`) in the light or dark look: opaque
/// greys chosen so that hints keep a contrast of at least 4.5:1 against the
/// panel background (WCAG 2.1 level AA for normal text), a step fainter than
/// the body text. egui's own hint colour is the text colour at 60 % opacity,
/// about 3:1 on the dark panel.
pub fn weak_text_color(dark: bool) -> egui::Color32 {
    if dark {
        egui::Color32::from_gray(132)
    } else {
        egui::Color32::from_gray(108)
    }
}

/// The relative luminance of an opaque sRGB colour, WCAG 2.1 (definition of
/// "relative luminance", https://www.w3.org/TR/WCAG21/#dfn-relative-luminance):
/// each channel c/255 is linearised as c/12.92 when c <= 0.04045 and
/// ((c + 0.055)/1.055)^2.4 otherwise, then L = 0.2126 R + 0.7152 G + 0.0722 B.
pub fn relative_luminance(c: egui::Color32) -> f64 {
    let lin = |v: u8| {
        let c = f64::from(v) / 255.0;
        if c <= 0.04045 {
            c / 12.92
        } else {
            ((c + 0.055) / 1.055).powf(2.4)
        }
    };
    0.2126 * lin(c.r()) + 0.7152 * lin(c.g()) + 0.0722 * lin(c.b())
}

/// The WCAG 2.1 contrast ratio (L1 + 0.05) / (L2 + 0.05), L1 the lighter
/// (definition of "contrast ratio", https://www.w3.org/TR/WCAG21/#dfn-contrast-ratio).
pub fn contrast_ratio(a: egui::Color32, b: egui::Color32) -> f64 {
    let (la, lb) = (relative_luminance(a), relative_luminance(b));
    let (hi, lo) = if la >= lb { (la, lb) } else { (lb, la) };
    (hi + 0.05) / (lo + 0.05)
}

/// Applies the light or dark look (only when it changes).
///
/// The panels are left unfilled: the window is cleared to the panel colour
/// instead (see `Explorer::clear_color`), which looks the same and spares a
/// software renderer (no GPU) from shading every pixel of the window a second
/// time each frame.
pub fn apply(ctx: &egui::Context, dark: bool) {
    let want = if dark {
        egui::Theme::Dark
    } else {
        egui::Theme::Light
    };
    if ctx.style_of(egui::Theme::Light).visuals.panel_fill != egui::Color32::TRANSPARENT {
        ctx.all_styles_mut(|s| s.visuals.panel_fill = egui::Color32::TRANSPARENT);
    }
    for (theme, dark) in [(egui::Theme::Light, false), (egui::Theme::Dark, true)] {
        let weak = Some(weak_text_color(dark));
        if ctx.style_of(theme).visuals.weak_text_color != weak {
            ctx.style_mut_of(theme, |s| s.visuals.weak_text_color = weak);
        }
    }
    if ctx.theme() != want {
        ctx.set_theme(want);
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn hint_text_meets_wcag_aa_in_both_looks() {
        for dark in [false, true] {
            let ratio = contrast_ratio(weak_text_color(dark), panel_color(dark));
            assert!(ratio >= 4.5, "dark = {dark}: {ratio:.2}");
            // the body text stays the stronger of the two
            let text = if dark {
                egui::Visuals::dark().text_color()
            } else {
                egui::Visuals::light().text_color()
            };
            assert!(
                contrast_ratio(text, panel_color(dark)) > ratio,
                "dark = {dark}"
            );
        }
    }

    #[test]
    fn the_luminance_formula_at_known_points() {
        // WCAG 2.1: white on black is 21:1, and a colour against itself 1:1
        let ratio = contrast_ratio(egui::Color32::WHITE, egui::Color32::BLACK);
        assert!((ratio - 21.0).abs() < 1e-9, "{ratio}");
        assert!((contrast_ratio(egui::Color32::RED, egui::Color32::RED) - 1.0).abs() < 1e-12);
        // #767676 on white is the well-known lightest grey passing AA, 4.54:1 (from memory)
        let grey = egui::Color32::from_gray(0x76);
        let r = contrast_ratio(grey, egui::Color32::WHITE);
        assert!((r - 4.54).abs() < 0.01, "{r}");
    }
}
