//! A table drawn as a figure: a title, a header row over a rule, the rows on
//! alternate light bands with their numbers set flush right, and a closing
//! line under a second rule (a sum, say). The figure writers set the indices
//! of the labels (`N_w(c)`, `A_c`) as they do everywhere.

use super::look::Look;
use super::scene::{Anchor, ItemKind, PathCmd, Pt, Scene, Stroke, Tag};

/// The font size of the cells, in figure units.
const SIZE: f32 = 12.0;
/// The height of a row.
const ROW: f32 = 20.0;
/// The space around the table and between columns.
const PAD: f32 = 14.0;
/// The width of a character, as a share of the font size (an estimate that
/// errs wide, so no column runs into the next).
const CHAR: f32 = 0.62;

/// What a table figure shows.
#[derive(Clone, Debug, PartialEq)]
pub struct TableFigure {
    /// The line above the table.
    pub title: String,
    /// The column headers.
    pub headers: Vec<String>,
    /// The rows, cell by cell (as many cells as headers).
    pub rows: Vec<Vec<String>>,
    /// The line under the table, if any.
    pub footer: Option<String>,
}

/// The width a text takes at `size`, estimated from its characters (an index
/// or exponent counts as a character: the estimate errs wide).
fn text_width(text: &str, size: f32) -> f32 {
    text.chars().filter(|c| *c != '_' && *c != '^').count() as f32 * size * CHAR
}

/// The scene of a table: cells tagged `Cell(row, column)` (1-based; row 0 is
/// the header), the rest `Label` or `None`.
///
/// ```
/// use elbowroom::figure::look::Look;
/// use elbowroom::figure::table_figure::{TableFigure, table_scene};
/// use elbowroom::figure::Tag;
/// let t = TableFigure {
///     title: "two rows".into(),
///     headers: vec!["c".into(), "N".into()],
///     rows: vec![vec!["(0,2,1)".into(), "1".into()], vec!["(0,1,2)".into(), "1".into()]],
///     footer: None,
/// };
/// let scene = table_scene(&t, &Look::light());
/// let cells = scene.items.iter().filter(|i| matches!(i.tag, Tag::Cell(r, _) if r > 0));
/// assert_eq!(cells.count(), 4);
/// ```
pub fn table_scene(t: &TableFigure, look: &Look) -> Scene {
    let columns = t.headers.len();
    let mut widths: Vec<f32> = t.headers.iter().map(|h| text_width(h, SIZE)).collect();
    for row in &t.rows {
        for (k, cell) in row.iter().enumerate().take(columns) {
            widths[k] = widths[k].max(text_width(cell, SIZE));
        }
    }
    let table_width: f32 = widths.iter().sum::<f32>() + PAD * columns.saturating_sub(1) as f32;
    let title_width = text_width(&t.title, SIZE + 1.0);
    let footer_width = t.footer.as_deref().map_or(0.0, |f| text_width(f, SIZE));
    let inner = table_width.max(title_width).max(footer_width);
    let footer_rows = if t.footer.is_some() { 1.0 } else { 0.0 };
    let height = PAD * 2.0 + ROW * (2.0 + t.rows.len() as f32 + footer_rows) + 6.0;
    let mut scene = Scene::new(inner + 2.0 * PAD, height, look.background());
    let ink = look.ink();
    let rule = Stroke {
        width: 1.0,
        color: look.grid(),
    };
    let left = PAD;
    let right = PAD + table_width;
    let mut y = PAD + ROW / 2.0;
    scene.label(
        Pt::new(left, y),
        t.title.clone(),
        SIZE + 1.0,
        ink,
        Anchor::Left,
    );
    y += ROW;
    // x of each column's left edge
    let mut starts = Vec::with_capacity(columns);
    let mut x = left;
    for w in &widths {
        starts.push(x);
        x += w + PAD;
    }
    let cell = |scene: &mut Scene, r: usize, k: usize, text: &str, y: f32| {
        // the first column (a label) flush left, the numbers flush right
        let (pos, anchor) = if k == 0 {
            (Pt::new(starts[k], y), Anchor::Left)
        } else {
            (Pt::new(starts[k] + widths[k], y), Anchor::Right)
        };
        scene.push(
            ItemKind::Text {
                pos,
                text: text.to_string(),
                size: SIZE,
                color: ink,
                anchor,
            },
            Tag::Cell(r, k + 1),
        );
    };
    for (k, h) in t.headers.iter().enumerate() {
        cell(&mut scene, 0, k, h, y);
    }
    let line = |scene: &mut Scene, y: f32| {
        scene.push(
            ItemKind::Path {
                cmds: PathCmd::polyline([Pt::new(left, y), Pt::new(right, y)]),
                stroke: Some(rule),
                fill: None,
            },
            Tag::None,
        );
    };
    line(&mut scene, y + ROW / 2.0);
    for (r, row) in t.rows.iter().enumerate() {
        y += ROW;
        if r % 2 == 1 {
            let top = y - ROW / 2.0;
            scene.push(
                ItemKind::Path {
                    cmds: vec![
                        PathCmd::MoveTo(Pt::new(left - 4.0, top)),
                        PathCmd::LineTo(Pt::new(right + 4.0, top)),
                        PathCmd::LineTo(Pt::new(right + 4.0, top + ROW)),
                        PathCmd::LineTo(Pt::new(left - 4.0, top + ROW)),
                        PathCmd::Close,
                    ],
                    stroke: None,
                    fill: Some(look.tile()),
                },
                Tag::None,
            );
        }
        for (k, text) in row.iter().enumerate().take(columns) {
            cell(&mut scene, r + 1, k, text, y);
        }
    }
    if let Some(footer) = &t.footer {
        line(&mut scene, y + ROW / 2.0);
        y += ROW + 4.0;
        scene.label(Pt::new(left, y), footer.clone(), SIZE, ink, Anchor::Left);
    }
    scene
}
