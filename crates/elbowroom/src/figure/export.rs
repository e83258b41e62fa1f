//! Writing a figure to a file: the format follows the extension (`.png`,
//! `.svg`, `.tex`/`.tikz`), and the file is written atomically (see
//! [`crate::atomic_write`]), so a failed export never leaves half a figure
//! behind. Tables have their own writer, [`crate::tables::write`].

use super::scene::Scene;
use std::path::{Path, PathBuf};

pub use super::png::to_png;
pub use super::svg::to_svg;
pub use super::tikz::to_tikz;

/// A figure file format.
#[derive(Clone, Copy, Debug, PartialEq, Eq, Hash)]
pub enum Format {
    /// A raster image, rendered at the options' scale.
    Png,
    /// A standalone SVG document.
    Svg,
    /// A standalone LaTeX document with one TikZ picture.
    Tikz,
}

impl Format {
    /// The format of a file name's extension: `png`, `svg`, `tex` or `tikz` (any case).
    pub fn from_path(path: &Path) -> Result<Format, ExportError> {
        let ext = path
            .extension()
            .and_then(|e| e.to_str())
            .map(|e| e.to_ascii_lowercase());
        match ext.as_deref() {
            Some("png") => Ok(Format::Png),
            Some("svg") => Ok(Format::Svg),
            Some("tex") | Some("tikz") => Ok(Format::Tikz),
            _ => Err(ExportError::UnknownFormat(path.to_path_buf())),
        }
    }

    /// The usual extension of the format.
    pub fn extension(self) -> &'static str {
        match self {
            Format::Png => "png",
            Format::Svg => "svg",
            Format::Tikz => "tex",
        }
    }
}

/// How a figure is exported.
#[derive(Clone, Copy, Debug, PartialEq)]
pub struct ExportOptions {
    /// PNG pixels per figure unit (point); 4 gives about 288 dpi.
    pub scale: f32,
    /// Leave the background out (PNG: transparent pixels; SVG, TikZ: no background rectangle).
    pub transparent: bool,
}

impl Default for ExportOptions {
    fn default() -> Self {
        ExportOptions {
            scale: 4.0,
            transparent: false,
        }
    }
}

impl ExportOptions {
    /// Options for a PNG at a given resolution in dots per inch (72 dpi = scale 1).
    pub fn with_dpi(dpi: f32, transparent: bool) -> ExportOptions {
        ExportOptions {
            scale: dpi / 72.0,
            transparent,
        }
    }
}

/// Why a figure was not written.
#[derive(Debug, thiserror::Error)]
pub enum ExportError {
    /// The file name has no extension this writer knows.
    #[error("cannot tell the figure format of {}: use .png, .svg or .tex", .0.display())]
    UnknownFormat(PathBuf),
    /// Options out of range (a scale of zero, an image too large).
    #[error("{0}")]
    Options(String),
    /// Rasterizing failed.
    #[error("{0}")]
    Render(String),
    /// The file could not be written.
    #[error("cannot write {}: {reason}", path.display())]
    Write {
        /// The file.
        path: PathBuf,
        /// What the operating system said.
        reason: String,
    },
}

/// The figure's bytes in a format.
pub fn render(scene: &Scene, format: Format, opts: &ExportOptions) -> Result<Vec<u8>, ExportError> {
    let with_background = !opts.transparent;
    Ok(match format {
        Format::Png => to_png(scene, opts)?,
        Format::Svg => super::svg::document(scene, with_background).into_bytes(),
        Format::Tikz => super::tikz::document(scene, with_background).into_bytes(),
    })
}

/// Writes the figure to `path` in the format its extension names.
pub fn write(scene: &Scene, path: &Path, opts: &ExportOptions) -> Result<(), ExportError> {
    let format = Format::from_path(path)?;
    let bytes = render(scene, format, opts)?;
    write_atomically(path, &bytes)
}

/// Writes bytes through a temporary file `.NAME.writing` in the same directory and a rename.
fn write_atomically(path: &Path, bytes: &[u8]) -> Result<(), ExportError> {
    crate::atomic_write::write(path, "writing", bytes).map_err(|e| ExportError::Write {
        path: path.to_path_buf(),
        reason: e.to_string(),
    })
}
