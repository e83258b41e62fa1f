//! Figures as small vector scenes. One scene per figure, built from math
//! objects; the explorer's canvas and every export (PNG, SVG, TikZ) draw the
//! same scene, so what is on screen is what lands in the file.

pub mod export;
pub mod palette;
pub mod png;
pub mod scene;
pub mod svg;
pub mod tikz;

pub use scene::{Anchor, Color, Item, ItemKind, PathCmd, Pt, Scene, Stroke, Tag};
pub mod bumpless;
pub mod dream;
pub mod forest;
pub mod hessenberg;
pub mod look;
pub mod math_text;
pub mod paths;
pub mod permutohedron;
pub mod table_figure;
pub mod volume;
pub mod wiring;
