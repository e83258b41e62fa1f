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
    if ctx.theme() != want {
        ctx.set_theme(want);
    }
}
