//! The session: the inputs of an exploration (never its results), so that it can
//! be saved and reopened as it was left.

pub mod model;

pub use model::Session;
