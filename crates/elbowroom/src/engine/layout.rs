//! A Hessenberg table arranged for the explorer: its summary line, the widths
//! of its longest entries and the order of its rows by a column. For millions
//! of rows this takes a noticeable fraction of a second, so it runs on the
//! engine like every other computation.

use crate::math::hessenberg::table::{HessenbergTable, TableEntry};
use crate::math::{MathResult, Progress};
use num_traits::Signed;

/// What the Hessenberg view draws besides the entries themselves.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct TableLayout {
    /// Size, Σ a^h_w, nonzero, largest and negative entries, in one line.
    pub summary: String,
    /// The length of the longest w written out.
    pub perm_chars: usize,
    /// The length of the longest a^h_w written out.
    pub value_chars: usize,
    /// Indices into the entries, in the order shown.
    pub rows: Vec<usize>,
}

/// The summary of a table: its size, Σ a^h_w, and how many entries are nonzero or negative.
pub fn summary_text(table: &HessenbergTable) -> String {
    let negatives = table
        .entries
        .iter()
        .filter(|e| e.value.is_negative())
        .count();
    let noun = if table.listed == 1 {
        "permutation"
    } else {
        "permutations"
    };
    format!(
        "{} {noun} of length {}; Σ a^h_w = {}; nonzero {}; largest {}; negative {}",
        table.listed,
        table.h.dimension(),
        table.total(),
        table.nonzero(),
        table.max(),
        negatives
    )
}

/// The indices of `entries` sorted by `column` (`value`, `length`, otherwise the permutation).
pub fn sorted_rows(entries: &[TableEntry], column: &str, descending: bool) -> Vec<usize> {
    let mut idx: Vec<usize> = (0..entries.len()).collect();
    let e = entries;
    match column {
        "value" => idx.sort_by(|&a, &b| e[a].value.cmp(&e[b].value).then(a.cmp(&b))),
        "length" => idx.sort_by_key(|&a| (e[a].perm.length(), a)),
        _ => idx.sort_by(|&a, &b| e[a].perm.cmp(&e[b].perm)),
    }
    if descending {
        idx.reverse();
    }
    idx
}

/// The table's layout for sorting by `column` (see [`sorted_rows`]).
pub fn table_layout(
    table: &HessenbergTable,
    column: &str,
    descending: bool,
    progress: &Progress,
) -> MathResult<TableLayout> {
    progress.set_total(2);
    let perm_chars = table
        .entries
        .first()
        .map_or(1, |e| e.perm.to_string().len());
    // the widest value is the largest or the most negative one
    let least = table.entries.iter().map(|e| &e.value).min().cloned();
    let value_chars = [Some(table.max()), least]
        .into_iter()
        .flatten()
        .map(|v| v.to_string().len())
        .max()
        .unwrap_or(1);
    let summary = summary_text(table);
    progress.advance(1);
    progress.check()?;
    let rows = sorted_rows(&table.entries, column, descending);
    progress.advance(1);
    Ok(TableLayout {
        summary,
        perm_chars,
        value_chars,
        rows,
    })
}
