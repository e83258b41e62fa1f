//! Pipe dreams in both models: reduced pipe dreams with their ladder and
//! chute moves and the traces of their pipes, and bumpless pipe dreams.

pub mod dream;
pub mod moves;
pub mod trace;

pub mod bumpless;
