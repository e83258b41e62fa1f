//! The figure of a reduced pipe dream: the staircase of cells (i, j), i + j <= n,
//! each pipe drawn as one path through its tiles — straight through a cross,
//! quarter-circle elbows (cubic Béziers) elsewhere — coloured by its label, with
//! row labels (pipe i enters row i) and column labels.

use super::look::Look;
use super::palette::label_color;
use super::scene::{Anchor, ItemKind, PathCmd, Pt, Scene, Stroke, Tag};
use crate::math::pipes::dream::PipeDream;
use crate::math::pipes::trace::{PipePath, PipeTrace, Side};

/// Side of a cell in figure units.
pub const CELL: f32 = 28.0;
/// Space for the labels around the grid.
const MARGIN: f32 = 24.0;
/// The ratio of a cubic Bézier's handle to the radius of the quarter circle it draws.
pub const KAPPA: f32 = 0.552_284_8;

/// The top-left corner of cell (row, col), 1-based.
pub fn cell_origin(row: usize, col: usize) -> Pt {
    Pt::new(
        MARGIN + (col as f32 - 1.0) * CELL,
        MARGIN + (row as f32 - 1.0) * CELL,
    )
}

/// The midpoint of a side of the cell with top-left corner `o` and side `s`.
pub fn side_mid(o: Pt, s: f32, side: Side) -> Pt {
    match side {
        Side::Left => Pt::new(o.x, o.y + s / 2.0),
        Side::Right => Pt::new(o.x + s, o.y + s / 2.0),
        Side::Top => Pt::new(o.x + s / 2.0, o.y),
        Side::Bottom => Pt::new(o.x + s / 2.0, o.y + s),
    }
}

/// The path command that carries a pipe across a tile from `enters` to `leaves`:
/// a straight line between opposite sides, a quarter circle about the shared
/// corner between adjacent sides.
pub fn passage_cmd(o: Pt, s: f32, enters: Side, leaves: Side) -> PathCmd {
    let a = side_mid(o, s, enters);
    let b = side_mid(o, s, leaves);
    let opposite = matches!(
        (enters, leaves),
        (Side::Left, Side::Right)
            | (Side::Right, Side::Left)
            | (Side::Top, Side::Bottom)
            | (Side::Bottom, Side::Top)
    );
    if opposite {
        return PathCmd::LineTo(b);
    }
    // the corner shared by the two sides is the centre of the arc
    let cx = if matches!(enters, Side::Right) || matches!(leaves, Side::Right) {
        o.x + s
    } else {
        o.x
    };
    // each handle starts at its end point and runs perpendicular to the radius
    let toward = |p: Pt, q: Pt| {
        // tangent at p points toward the other side: along the side the corner is not on
        if (p.x - cx).abs() < 1e-3 {
            // p on the vertical line through the centre: tangent is horizontal
            Pt::new(p.x + (q.x - p.x).signum() * KAPPA * s / 2.0, p.y)
        } else {
            Pt::new(p.x, p.y + (q.y - p.y).signum() * KAPPA * s / 2.0)
        }
    };
    PathCmd::CubicTo(toward(a, b), toward(b, a), b)
}

/// Builds the figure of `dream`. Cells listed in `hints` (those allowing a
/// move) get a small dot.
pub fn dream_scene(dream: &PipeDream, look: &Look, hints: &[(usize, usize)]) -> Scene {
    let n = dream.n();
    let trace = dream.trace();
    let size = 2.0 * MARGIN + n as f32 * CELL;
    let mut scene = Scene::new(size, size, look.background());
    tiles(&mut scene, &trace, look);
    for pipe in &trace.pipes {
        scene.push(
            ItemKind::Path {
                cmds: pipe_cmds(&trace, pipe),
                stroke: Some(Stroke {
                    width: CELL * 0.2,
                    color: label_color(pipe.label, n),
                }),
                fill: None,
            },
            Tag::Pipe(pipe.label),
        );
    }
    for &(i, j) in hints {
        let o = cell_origin(i, j);
        scene.push(
            ItemKind::Circle {
                center: Pt::new(o.x + CELL * 0.84, o.y + CELL * 0.84),
                radius: CELL * 0.07,
                stroke: None,
                fill: Some(look.ink()),
            },
            Tag::Cell(i, j),
        );
    }
    if look.labels {
        row_and_column_labels(&mut scene, n, look);
    }
    scene
}

/// The tile of each cell of the staircase, tagged `Cell(i, j)`.
fn tiles(scene: &mut Scene, trace: &PipeTrace, look: &Look) {
    let grid = Stroke {
        width: 0.8,
        color: look.grid(),
    };
    for t in &trace.tiles {
        if t.boundary {
            continue;
        }
        let o = cell_origin(t.row, t.col);
        let cmds = vec![
            PathCmd::MoveTo(o),
            PathCmd::LineTo(Pt::new(o.x + CELL, o.y)),
            PathCmd::LineTo(Pt::new(o.x + CELL, o.y + CELL)),
            PathCmd::LineTo(Pt::new(o.x, o.y + CELL)),
            PathCmd::Close,
        ];
        scene.push(
            ItemKind::Path {
                cmds,
                stroke: Some(grid),
                fill: Some(look.tile()),
            },
            Tag::Cell(t.row, t.col),
        );
    }
}

/// One pipe as one path: in from the left of its first cell, through each of
/// its passages, out at the top of its last.
fn pipe_cmds(trace: &PipeTrace, pipe: &PipePath) -> Vec<PathCmd> {
    let mut cmds = Vec::with_capacity(pipe.cells.len() + 2);
    for (k, &(i, j)) in pipe.cells.iter().enumerate() {
        let Some(tile) = trace.tile(i, j) else {
            continue;
        };
        let Some(p) = tile.passages.iter().find(|p| p.label == pipe.label) else {
            continue;
        };
        let o = cell_origin(i, j);
        if k == 0 {
            let start = side_mid(o, CELL, p.enters);
            cmds.push(PathCmd::MoveTo(Pt::new(start.x - CELL * 0.25, start.y)));
            cmds.push(PathCmd::LineTo(start));
        }
        cmds.push(passage_cmd(o, CELL, p.enters, p.leaves));
    }
    if let Some(PathCmd::LineTo(end) | PathCmd::CubicTo(_, _, end)) = cmds.last().copied() {
        cmds.push(PathCmd::LineTo(Pt::new(end.x, end.y - CELL * 0.25)));
    }
    cmds
}

/// Row numbers on the left and column numbers on top.
fn row_and_column_labels(scene: &mut Scene, n: usize, look: &Look) {
    let text = |scene: &mut Scene, pos: Pt, t: String, anchor| {
        scene.label(pos, t, CELL * 0.42, look.ink(), anchor);
    };
    for i in 1..=n {
        let o = cell_origin(i, 1);
        text(
            scene,
            Pt::new(o.x - CELL * 0.35, o.y + CELL / 2.0),
            i.to_string(),
            Anchor::Right,
        );
        let o = cell_origin(1, i);
        text(
            scene,
            Pt::new(o.x + CELL / 2.0, o.y - CELL * 0.5),
            i.to_string(),
            Anchor::Center,
        );
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::math::Perm;

    #[test]
    fn each_pipe_is_one_path_ending_at_its_column() {
        let w = Perm::parse("1432").unwrap();
        let d = PipeDream::bottom(&w);
        let scene = dream_scene(&d, &Look::light(), &[]);
        assert_eq!(scene.pipe_labels(), vec![1, 2, 3, 4]);
        for item in &scene.items {
            let Tag::Pipe(k) = item.tag else { continue };
            let ItemKind::Path { cmds, .. } = &item.kind else {
                panic!("a pipe is a path");
            };
            // the path ends above the top of column w(k)
            let Some(PathCmd::LineTo(end)) = cmds.last() else {
                panic!("a pipe ends with its exit stub");
            };
            let o = cell_origin(1, w.at(k));
            assert!((end.x - (o.x + CELL / 2.0)).abs() < 1e-3, "pipe {k}");
            assert!(end.y < o.y);
        }
        // one cell item per staircase cell i + j <= n
        let cells = scene
            .items
            .iter()
            .filter(|i| matches!(i.tag, Tag::Cell(..)))
            .count();
        assert_eq!(cells, 6);
    }

    #[test]
    fn elbows_are_quarter_circles() {
        // left side to top side of the unit cell: an arc about the top-left corner
        let PathCmd::CubicTo(c1, c2, end) =
            passage_cmd(Pt::new(0.0, 0.0), 2.0, Side::Left, Side::Top)
        else {
            panic!("an elbow is a curve");
        };
        assert_eq!(end, Pt::new(1.0, 0.0));
        assert!((c1.x - KAPPA).abs() < 1e-6 && (c1.y - 1.0).abs() < 1e-6);
        assert!((c2.x - 1.0).abs() < 1e-6 && (c2.y - KAPPA).abs() < 1e-6);
    }
}
