//! The tables researchers paste into papers, built once from the results so
//! the command line (`--csv`, `--latex`) and the explorer's export write the
//! same thing: Hessenberg coefficients, positivity-survey results and mixed
//! Eulerian numbers.

use super::table::{Cell, Column, Table};
use crate::math::hessenberg::sweep::SweepRow;
use crate::math::hessenberg::table::HessenbergTable;
use crate::math::quotient::survey::SurveyEntry;
use crate::math::{IntPoly, Perm};
use num_bigint::BigInt;

/// A permutation: `1,4,3,2` as text (safe for any n), `1432` in LaTeX for n <= 9.
pub fn perm_cell(w: &Perm) -> Cell {
    let parts: Vec<String> = w.one_line().iter().map(|v| v.to_string()).collect();
    Cell::with_latex(parts.join(","), w.to_string())
}

/// The coefficients a^h_w of a Hessenberg class: columns `perm`, `length`,
/// `value` (CSV headers), set as $w$, $\ell(w)$, $a^h_w$ in LaTeX.
///
/// ```
/// use elbowroom::tables::results::hessenberg_table;
/// use elbowroom::math::hessenberg::function::HessenbergFn;
/// use elbowroom::math::{Progress, hessenberg::coefficients::coefficient_table as compute};
/// // h = (2,3,3): a^h_231 = DS_3(x1 x2) = 1 and a^h_312 = DS_3(x1^2) = 1
/// let t = compute(&HessenbergFn::new(&[2, 3, 3]).unwrap(), &|_| true, &Progress::new(0)).unwrap();
/// let csv = hessenberg_table(&t).to_csv();
/// assert_eq!(csv, "perm,length,value\n\"2,3,1\",2,1\n\"3,1,2\",2,1\n");
/// assert!(hessenberg_table(&t).to_latex().contains("$231$ & $2$ & $1$ \\\\"));
/// ```
pub fn hessenberg_table(table: &HessenbergTable) -> Table {
    let mut t = Table::new(vec![
        Column::math("$w$").keyed("perm"),
        Column::math("$\\ell(w)$").keyed("length"),
        Column::math("$a^h_w$").keyed("value"),
    ]);
    t.comment(format!(
        "a^h_w = DS_h(S_w) for h = {}, n = {}: total {}, nonzero {}, max {}",
        table.h,
        table.h.n(),
        table.total(),
        table.nonzero(),
        table.max()
    ));
    let len = table.h.dimension();
    for e in &table.entries {
        t.push_cells(vec![
            perm_cell(&e.perm),
            len.to_string().into(),
            e.value.to_string().into(),
        ]);
    }
    t
}

/// The sweep over every Hessenberg function of n: columns `h`, `dimension`,
/// `total`, `nonzero`, `max`, `negative` (CSV headers), set as $h$, $|h|$,
/// $\sum_w a^h_w$, ... in LaTeX.
pub fn every_h_table(n: usize, rows: &[SweepRow]) -> Table {
    let mut t = Table::new(vec![
        Column::math("$h$").keyed("h"),
        Column::math("$|h|$").keyed("dimension"),
        Column::math("$\\sum_w a^h_w$").keyed("total"),
        Column::text("nonzero"),
        Column::math("$\\max_w a^h_w$").keyed("max"),
        Column::text("negative"),
    ]);
    let with_negative = rows.iter().filter(|r| r.negative > 0).count();
    t.comment(format!(
        "the tables a^h_w = DS_h(S_w) of every Hessenberg function of n = {n}: {} functions, {with_negative} with a negative entry",
        rows.len()
    ));
    for r in rows {
        let h: Vec<String> = r.h.values().iter().map(|v| v.to_string()).collect();
        t.push(vec![
            format!("({})", h.join(",")),
            r.dimension.to_string(),
            r.total.to_string(),
            r.nonzero.to_string(),
            r.max.to_string(),
            r.negative.to_string(),
        ]);
    }
    t
}

/// The mixed Eulerian numbers A_c: columns `c` (as `(c1,...,c_{n-1})`) and `value`.
pub fn eulerian_table(n: usize, numbers: &[(Vec<u32>, BigInt)]) -> Table {
    let mut t = Table::new(vec![
        Column::math("$c$").keyed("c"),
        Column::math("$A_c$").keyed("value"),
    ]);
    let sum: BigInt = numbers.iter().map(|(_, v)| v).sum();
    t.comment(format!(
        "mixed Eulerian numbers A_c, n = {n}: Vol P_lambda = sum_c A_c u^c / c!, sum of all A_c = {sum}"
    ));
    for (c, v) in numbers {
        let parts: Vec<String> = c.iter().map(|x| x.to_string()).collect();
        t.push(vec![format!("({})", parts.join(",")), v.to_string()]);
    }
    t
}

/// A positivity survey of normal forms modulo J_n: columns `perm`, `length`,
/// `nonnegative`, `terms`, `sum`, `negative_coefficients` and, unless
/// `summary`, `normal_form` (text in CSV, LaTeX in LaTeX).
pub fn survey_table(n: usize, entries: &[SurveyEntry], summary: bool) -> Table {
    let mut columns = vec![
        Column::math("$w$").keyed("perm"),
        Column::math("$\\ell(w)$").keyed("length"),
        Column::text("nonnegative"),
        Column::math("terms"),
        Column::math("sum"),
        Column::math("negative coefficients").keyed("negative_coefficients"),
    ];
    if !summary {
        columns.push(Column::math("normal form").keyed("normal_form"));
    }
    let mut t = Table::new(columns);
    t.comment(format!(
        "normal forms of S_w(x_{n}, ..., x_1) modulo J_{n} (lex order x_1 > ... > x_{n}), {} permutations",
        entries.len()
    ));
    for e in entries {
        let negatives = e.negatives();
        let neg_text: Vec<String> = negatives
            .iter()
            .map(|(m, c)| format!("{c}*{}", m.text(n)))
            .collect();
        let neg_latex: Vec<String> = negatives
            .iter()
            .map(|(m, c)| format!("{c}\\,{}", IntPoly::monomial(n, *m, 1.into()).to_latex()))
            .collect();
        let mut row = vec![
            perm_cell(&e.perm),
            e.perm.length().to_string().into(),
            e.nonnegative().to_string().into(),
            e.terms().to_string().into(),
            e.sum().to_string().into(),
            Cell::with_latex(neg_text.join(" "), neg_latex.join(",\\ ")),
        ];
        if !summary {
            row.push(Cell::with_latex(
                e.normal_form.poly.to_text(),
                e.normal_form.poly.to_latex(),
            ));
        }
        t.push_cells(row);
    }
    t
}
