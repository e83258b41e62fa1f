//! The session: the inputs of an exploration (never its results), so that it can
//! be saved and reopened as it was left.
//!
//! - [`model`]: what a session holds ([`Session`]).
//! - [`format`]: the versioned RON file format and its migrations.
//! - [`validate`]: the checks a loaded session must pass.
//! - [`store`]: atomic save with a `.bak` backup, and load ([`store::save`], [`store::load`]).
//! - [`recovery`]: the autosave written while the explorer runs.
//! - [`recent`]: the recently opened sessions.
//! - [`demo`]: the demo sessions shipped in `sessions/`.

pub mod config_dir;
pub mod demo;
pub(crate) mod error;
pub mod format;
pub mod model;
pub mod recent;
pub mod recovery;
pub mod store;
pub(crate) mod validate;

pub use error::SessionError;
pub use model::Session;
pub use recovery::{clear_recovery, recovery_path, take_recovery, write_recovery};
