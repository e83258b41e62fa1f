//! The explorer window (eframe, glow renderer): one file per view or panel.
//!
//! Views keep UI state only; the inputs of the exploration live in the
//! [`crate::session::Session`] and every result comes from the [`crate::engine`],
//! so a frame never waits for mathematics.

pub mod app;
pub mod app_ctx;
pub mod autosave;
pub mod browser;
pub mod closing;
pub mod files;
pub mod notes;
pub mod picker;
pub mod scene_painter;
pub mod status;
pub mod table_source;
pub mod theme;
pub mod typeset;
pub mod views;

pub use app::{Explorer, run, run_file, run_refused};
pub use app_ctx::AppCtx;
