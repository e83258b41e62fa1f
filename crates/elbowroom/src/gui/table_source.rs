//! A result on screen and its table for export: views note the result each
//! frame (an `Arc`, no copy) and the CSV/LaTeX table is built from it only
//! when the export window asks, once per result.

use crate::engine::requests::Output;
use crate::tables::table::Table;
use std::sync::Arc;

/// The result a view shows, keyed by its inputs, and its export table once built.
pub struct TableSource<K> {
    shown: Option<(K, Arc<Output>)>,
    built: Option<(K, Arc<Table>)>,
}

impl<K> Default for TableSource<K> {
    fn default() -> Self {
        TableSource {
            shown: None,
            built: None,
        }
    }
}

impl<K: Clone + PartialEq> TableSource<K> {
    /// Notes the result on screen.
    pub fn note_shown(&mut self, key: &K, out: &Arc<Output>) {
        if self.shown.as_ref().is_none_or(|(k, _)| k != key) {
            self.shown = Some((key.clone(), out.clone()));
        }
    }

    /// The export table of the result on screen, built by `build` on the first
    /// call after the result changed; `None` while nothing is shown.
    pub fn table(
        &mut self,
        build: impl FnOnce(&K, &Output) -> Option<Table>,
    ) -> Option<(K, Arc<Table>)> {
        let (key, out) = self.shown.as_ref()?;
        if self.built.as_ref().is_none_or(|(k, _)| k != key) {
            let table = build(key, out)?;
            self.built = Some((key.clone(), Arc::new(table)));
        }
        self.built.clone()
    }
}
