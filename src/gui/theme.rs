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

/// Applies the light or dark look (only when it changes).
pub fn apply(ctx: &egui::Context, dark: bool) {
    let want = if dark {
        egui::Theme::Dark
    } else {
        egui::Theme::Light
    };
    if ctx.theme() != want {
        ctx.set_theme(want);
    }
}
