//! The look of a figure: light or dark, with or without labels, and the
//! neutral colours that follow from it.

use super::palette;
use super::scene::Color;

/// How a figure is drawn.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Default)]
pub struct Look {
    /// Light ink on a dark background.
    pub dark: bool,
    /// Draw row and column labels.
    pub labels: bool,
}

impl Look {
    /// A light figure with labels.
    pub fn light() -> Look {
        Look {
            dark: false,
            labels: true,
        }
    }

    /// The background.
    pub fn background(&self) -> Color {
        if self.dark {
            palette::SLATE
        } else {
            palette::PAPER
        }
    }

    /// Text and strong lines.
    pub fn ink(&self) -> Color {
        if self.dark {
            Color::rgb(0xe4, 0xe2, 0xdc)
        } else {
            palette::INK
        }
    }

    /// Grid lines and frames.
    pub fn grid(&self) -> Color {
        if self.dark {
            Color::rgb(0x4a, 0x50, 0x5a)
        } else {
            palette::GRID
        }
    }

    /// The faint fill of a cell.
    pub fn tile(&self) -> Color {
        if self.dark {
            Color::rgb(0x27, 0x2c, 0x34)
        } else {
            Color::rgb(0xf3, 0xf1, 0xec)
        }
    }

    /// Marks for negative values and errors.
    pub fn alert(&self) -> Color {
        if self.dark {
            Color::rgb(0xf0, 0x7a, 0x6a)
        } else {
            palette::ALERT
        }
    }
}
