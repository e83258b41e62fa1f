//! The PNG writer: the scene's SVG rasterized by resvg, with the font shipped
//! in `assets/fonts/` loaded explicitly, so text renders the same on a machine
//! with no fonts installed.

use super::export::{ExportError, ExportOptions};
use super::scene::Scene;
use super::svg;
use resvg::{tiny_skia, usvg};
use std::sync::{Arc, OnceLock};

/// The figure font (DejaVu Sans; licence in `assets/fonts/DejaVuSans-LICENSE.txt`).
pub const FONT_BYTES: &[u8] = include_bytes!("../../../../assets/fonts/DejaVuSans.ttf");

/// Largest width or height of an exported PNG, in pixels.
pub const MAX_SIDE: u32 = 16_384;

fn fonts() -> Arc<usvg::fontdb::Database> {
    static FONTS: OnceLock<Arc<usvg::fontdb::Database>> = OnceLock::new();
    FONTS
        .get_or_init(|| {
            let mut db = usvg::fontdb::Database::new();
            db.load_font_data(FONT_BYTES.to_vec());
            db.set_sans_serif_family(svg::FONT_FAMILY);
            Arc::new(db)
        })
        .clone()
}

/// The pixel size of the scene at the options' scale.
pub fn pixel_size(scene: &Scene, opts: &ExportOptions) -> Result<(u32, u32), ExportError> {
    let scale = opts.scale;
    if !(scale.is_finite() && scale > 0.0) {
        return Err(ExportError::Options(format!(
            "scale {scale} is not accepted; use a positive number of pixels per point"
        )));
    }
    let side = |units: f32| -> Result<u32, ExportError> {
        let px = (units * scale).ceil();
        if !(px.is_finite() && px >= 1.0 && px <= MAX_SIDE as f32) {
            return Err(ExportError::Options(format!(
                "the image would be {px} pixels wide or high; the limit is 1 to {MAX_SIDE}: lower the scale"
            )));
        }
        Ok(px as u32)
    };
    Ok((side(scene.width)?, side(scene.height)?))
}

/// The scene as PNG bytes: `ceil(width × scale)` by `ceil(height × scale)`
/// pixels, on the scene's background or on a transparent one.
pub fn to_png(scene: &Scene, opts: &ExportOptions) -> Result<Vec<u8>, ExportError> {
    let (w, h) = pixel_size(scene, opts)?;
    let text = svg::document_in_units(scene, !opts.transparent, "");
    let options = usvg::Options {
        fontdb: fonts(),
        font_family: svg::FONT_FAMILY.into(),
        ..usvg::Options::default()
    };
    let tree = usvg::Tree::from_str(&text, &options)
        .map_err(|e| ExportError::Render(format!("the figure's SVG did not parse: {e}")))?;
    let Some(mut pixmap) = tiny_skia::Pixmap::new(w, h) else {
        return Err(ExportError::Render(format!(
            "cannot allocate a {w}×{h} image"
        )));
    };
    let transform = tiny_skia::Transform::from_scale(opts.scale, opts.scale);
    resvg::render(&tree, transform, &mut pixmap.as_mut());
    pixmap
        .encode_png()
        .map_err(|e| ExportError::Render(format!("PNG encoding failed: {e}")))
}
