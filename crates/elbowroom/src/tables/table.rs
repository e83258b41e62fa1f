//! Tables for papers and spreadsheets: a header and rows of strings, written
//! as CSV (RFC 4180 quoting) or as a LaTeX `tabular` that needs no package.
//!
//! Columns are either text (escaped, left-aligned) or mathematics (set in
//! math mode, right-aligned): permutations, coefficients and other values.
//! A header cell written as `$...$` is copied into LaTeX unchanged, so headers
//! can use real notation (`$\mathrm{DS}_h(\mathfrak{S}_w)$`); in CSV the
//! dollar signs are dropped.
//!
//! ```
//! use elbowroom::tables::{Column, Table};
//! let mut t = Table::new(vec![Column::math("$w$"), Column::math("$A_c$")]);
//! t.push(vec!["312".into(), "-3/2".into()]);
//! assert_eq!(t.to_csv(), "w,A_c\n312,-3/2\n");
//! assert!(t.to_latex().contains("$312$ & $-3/2$ \\\\"));
//! ```

/// How a column's cells are set.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum ColumnKind {
    /// Plain text, escaped, left-aligned.
    Text,
    /// Mathematics (numbers, permutations, compositions): math mode, right-aligned.
    Math,
}

/// A column: its header and kind.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct Column {
    /// The header (a `$...$` header goes to LaTeX as it is).
    pub header: String,
    /// The CSV header, when it differs from the header without its dollars.
    pub key: Option<String>,
    /// How the cells are set.
    pub kind: ColumnKind,
}

impl Column {
    /// A text column.
    pub fn text(header: &str) -> Column {
        Column {
            header: header.into(),
            key: None,
            kind: ColumnKind::Text,
        }
    }

    /// A mathematics column.
    pub fn math(header: &str) -> Column {
        Column {
            header: header.into(),
            key: None,
            kind: ColumnKind::Math,
        }
    }

    /// The same column with a CSV header of its own (`perm` for `$w$`).
    pub fn keyed(mut self, key: &str) -> Column {
        self.key = Some(key.into());
        self
    }
}

/// One cell: its plain text (CSV, and LaTeX after escaping), and optionally a
/// LaTeX form set as it is (already math-mode content for a math column), for
/// values whose best LaTeX differs from their text (`1432` for the CSV's
/// `1,4,3,2`, `x_{1}^{2}` for `x1^2`).
#[derive(Clone, Debug, Default, PartialEq, Eq)]
pub struct Cell {
    /// The plain text.
    pub text: String,
    /// The LaTeX form, if it is not the escaped text.
    pub latex: Option<String>,
}

impl Cell {
    /// A cell with a LaTeX form of its own.
    pub fn with_latex(text: impl Into<String>, latex: impl Into<String>) -> Cell {
        Cell {
            text: text.into(),
            latex: Some(latex.into()),
        }
    }
}

impl From<String> for Cell {
    fn from(text: String) -> Cell {
        Cell { text, latex: None }
    }
}

impl From<&str> for Cell {
    fn from(text: &str) -> Cell {
        Cell::from(text.to_string())
    }
}

/// A header and rows of cells (rows shorter than the header are padded with
/// empty cells; longer ones are cut).
#[derive(Clone, Debug, Default, PartialEq, Eq)]
pub struct Table {
    /// The columns.
    pub columns: Vec<Column>,
    /// The rows, each a list of cells.
    pub rows: Vec<Vec<Cell>>,
    /// Lines written above a LaTeX table as `%` comments (what the table is);
    /// CSV has no comments, so they are left out there unless a caption is set.
    pub comments: Vec<String>,
    /// What the table is, in words (which object, its parameters, the order of
    /// the rows, how many), for a file that must say so by itself: the
    /// explorer's exports set it, the command line's `--csv`/`--latex` never
    /// do. When set, CSV starts with it and the comments as `# ` lines, and
    /// LaTeX with it as `% ` lines before the comments.
    pub caption: Vec<String>,
}

impl Table {
    /// An empty table with these columns.
    pub fn new(columns: Vec<Column>) -> Table {
        Table {
            columns,
            rows: Vec::new(),
            comments: Vec::new(),
            caption: Vec::new(),
        }
    }

    /// Appends a row of plain cells.
    pub fn push(&mut self, row: Vec<String>) {
        self.rows.push(row.into_iter().map(Cell::from).collect());
    }

    /// Appends a row of cells, some with LaTeX forms of their own.
    pub fn push_cells(&mut self, row: Vec<Cell>) {
        self.rows.push(row);
    }

    /// Adds a comment line (LaTeX only).
    pub fn comment(&mut self, line: impl Into<String>) {
        self.comments.push(line.into());
    }

    /// Sets the caption (see [`Table::caption`]).
    pub fn with_caption(mut self, lines: Vec<String>) -> Table {
        self.caption = lines;
        self
    }

    /// The same table with its rows in `order` (indices into the rows; an
    /// index out of range is skipped, so the result never has more rows).
    pub fn reordered(&self, order: &[usize]) -> Table {
        Table {
            columns: self.columns.clone(),
            rows: order
                .iter()
                .filter_map(|&i| self.rows.get(i).cloned())
                .collect(),
            comments: self.comments.clone(),
            caption: self.caption.clone(),
        }
    }

    /// The caption's lines, then (for CSV) the comments', each after `mark`.
    fn preamble(&self, mark: &str, with_comments: bool) -> String {
        let mut out = String::new();
        let comments = if with_comments && !self.caption.is_empty() {
            &self.comments[..]
        } else {
            &[]
        };
        for line in self.caption.iter().chain(comments) {
            for part in line.lines() {
                out.push_str(mark);
                out.push_str(part);
                out.push('\n');
            }
        }
        out
    }

    fn cells<'a>(&'a self, row: &'a [Cell]) -> impl Iterator<Item = Option<&'a Cell>> + 'a {
        (0..self.columns.len()).map(move |i| row.get(i))
    }

    /// The table as CSV: a header line, then one line per row, `\n` line ends;
    /// with a caption, `# ` lines before the header say what the table is.
    pub fn to_csv(&self) -> String {
        let mut out = self.preamble("# ", true);
        let header: Vec<String> = self
            .columns
            .iter()
            .map(|c| csv_field(c.key.as_deref().unwrap_or(strip_dollars(&c.header))))
            .collect();
        out.push_str(&header.join(","));
        out.push('\n');
        for row in &self.rows {
            let fields: Vec<String> = self
                .cells(row)
                .map(|c| csv_field(c.map(|c| c.text.as_str()).unwrap_or("")))
                .collect();
            out.push_str(&fields.join(","));
            out.push('\n');
        }
        out
    }

    /// The table as a LaTeX `tabular` environment (no package needed).
    pub fn to_latex(&self) -> String {
        let spec: String = self
            .columns
            .iter()
            .map(|c| match c.kind {
                ColumnKind::Text => 'l',
                ColumnKind::Math => 'r',
            })
            .collect();
        let mut out = self.preamble("% ", false);
        for line in &self.comments {
            for part in line.lines() {
                out.push_str(&format!("% {part}\n"));
            }
        }
        out.push_str(&format!("\\begin{{tabular}}{{{spec}}}\n\\hline\n"));
        let header: Vec<String> = self
            .columns
            .iter()
            .map(|c| {
                if is_dollar_math(&c.header) {
                    c.header.clone()
                } else {
                    latex_escape(&c.header)
                }
            })
            .collect();
        out.push_str(&header.join(" & "));
        out.push_str(" \\\\\n\\hline\n");
        for row in &self.rows {
            let cells: Vec<String> = self
                .cells(row)
                .zip(&self.columns)
                .map(|(cell, col)| {
                    let Some(cell) = cell else {
                        return String::new();
                    };
                    let body = cell
                        .latex
                        .clone()
                        .unwrap_or_else(|| latex_escape(&cell.text));
                    match col.kind {
                        ColumnKind::Text => body,
                        ColumnKind::Math if body.is_empty() => body,
                        ColumnKind::Math => format!("${body}$"),
                    }
                })
                .collect();
            out.push_str(&cells.join(" & "));
            out.push_str(" \\\\\n");
        }
        out.push_str("\\hline\n\\end{tabular}\n");
        out
    }
}

/// One CSV field, quoted when it holds a comma, quote, line break or edge space.
pub fn csv_field(s: &str) -> String {
    let needs = s.contains([',', '"', '\n', '\r']) || s.starts_with(' ') || s.ends_with(' ');
    if needs {
        format!("\"{}\"", s.replace('"', "\"\""))
    } else {
        s.to_string()
    }
}

fn is_dollar_math(s: &str) -> bool {
    s.len() >= 2 && s.starts_with('$') && s.ends_with('$')
}

fn strip_dollars(s: &str) -> &str {
    if is_dollar_math(s) {
        &s[1..s.len() - 1]
    } else {
        s
    }
}

/// Escapes the ten LaTeX specials so a string sets as it reads.
pub fn latex_escape(s: &str) -> String {
    let mut out = String::with_capacity(s.len());
    for ch in s.chars() {
        match ch {
            '\\' => out.push_str("\\textbackslash{}"),
            '{' => out.push_str("\\{"),
            '}' => out.push_str("\\}"),
            '#' => out.push_str("\\#"),
            '$' => out.push_str("\\$"),
            '%' => out.push_str("\\%"),
            '&' => out.push_str("\\&"),
            '_' => out.push_str("\\_"),
            '^' => out.push_str("\\^{}"),
            '~' => out.push_str("\\~{}"),
            c => out.push(c),
        }
    }
    out
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn csv_quotes_what_needs_quoting() {
        assert_eq!(csv_field("1,2"), "\"1,2\"");
        assert_eq!(csv_field("say \"hi\""), "\"say \"\"hi\"\"\"");
        assert_eq!(csv_field("two\nlines"), "\"two\nlines\"");
        assert_eq!(csv_field(" pad"), "\" pad\"");
        assert_eq!(csv_field("-3/2"), "-3/2");
    }

    #[test]
    fn latex_escapes_and_sets_math() {
        let mut t = Table::new(vec![
            Column::text("class"),
            Column::math("$h$"),
            Column::math("count"),
        ]);
        t.push(vec![
            "fully_commutative".into(),
            "(2,3,3)".into(),
            "14".into(),
        ]);
        t.push(vec!["50% & more".into()]);
        let tex = t.to_latex();
        assert!(tex.starts_with("\\begin{tabular}{lrr}\n\\hline\nclass & $h$ & count \\\\\n"));
        assert!(tex.contains("fully\\_commutative & $(2,3,3)$ & $14$ \\\\\n"));
        assert!(tex.contains("50\\% \\& more &  &  \\\\\n"));
        assert!(tex.ends_with("\\end{tabular}\n"));
    }

    #[test]
    fn a_caption_leads_both_formats_and_nothing_changes_without_one() {
        let mut t = Table::new(vec![Column::math("$w$"), Column::math("$a^h_w$")]);
        t.comment("two rows");
        t.push(vec!["12".into(), "1".into()]);
        t.push(vec!["21".into(), "2".into()]);
        assert_eq!(t.to_csv(), "w,a^h_w\n12,1\n21,2\n");
        let t = t
            .with_caption(vec!["n = 2, largest first".into()])
            .reordered(&[1, 0, 7]);
        assert_eq!(
            t.to_csv(),
            "# n = 2, largest first\n# two rows\nw,a^h_w\n21,2\n12,1\n"
        );
        assert!(
            t.to_latex()
                .starts_with("% n = 2, largest first\n% two rows\n\\begin{tabular}{rr}\n")
        );
    }

    #[test]
    fn csv_drops_header_dollars_and_pads_rows() {
        let mut t = Table::new(vec![Column::math("$c$"), Column::math("$A_c$")]);
        t.push(vec!["(1,1,1)".into()]);
        assert_eq!(t.to_csv(), "c,A_c\n\"(1,1,1)\",\n");
    }
}
