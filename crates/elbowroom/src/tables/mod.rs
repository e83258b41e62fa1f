//! Tables for papers and spreadsheets, written as CSV or as a LaTeX tabular:
//! the command line's `--csv`/`--latex` and the explorer's table export.
//!
//! - [`table`]: [`Table`], its columns and cells, and the two writers.
//! - [`results`]: the tables built from results (Hessenberg coefficients,
//!   positivity surveys, mixed Eulerian numbers), the same for both callers.
//! - [`write`]: a table to a `.csv` or `.tex` file, written atomically.

pub mod results;
pub(crate) mod table;

pub use table::{Cell, Column, ColumnKind, Table};

use crate::atomic_write;
use std::path::{Path, PathBuf};

/// Why a table was not written.
#[derive(Debug, thiserror::Error)]
pub enum TableWriteError {
    /// The file name has neither `.csv` nor `.tex`.
    #[error("cannot tell the table format of {}: use .csv or .tex (a LaTeX tabular)", .0.display())]
    UnknownFormat(PathBuf),
    /// The file could not be written.
    #[error("cannot write {}: {reason}", path.display())]
    Write {
        /// The file.
        path: PathBuf,
        /// What went wrong.
        reason: String,
    },
}

/// Writes a table to `path`: CSV for `.csv`, a LaTeX tabular for `.tex` (any
/// case), atomically (see [`crate::atomic_write`]).
pub fn write(table: &Table, path: &Path) -> Result<(), TableWriteError> {
    let ext = path
        .extension()
        .and_then(|e| e.to_str())
        .map(|e| e.to_ascii_lowercase());
    let text = match ext.as_deref() {
        Some("csv") => table.to_csv(),
        Some("tex") => table.to_latex(),
        _ => return Err(TableWriteError::UnknownFormat(path.to_path_buf())),
    };
    atomic_write::write(path, "writing", text.as_bytes()).map_err(|e| TableWriteError::Write {
        path: path.to_path_buf(),
        reason: e.to_string(),
    })
}
