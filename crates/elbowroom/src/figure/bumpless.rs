//! The figure of a bumpless pipe dream: the n×n grid of tiles, each pipe drawn
//! as one path (entering at the bottom of its column, leaving at the right of
//! its row), straight through crosses and along straight tiles, with
//! quarter-circle elbows; pipes are labelled by the row they leave.

use super::dream::{passage_cmd, side_mid};
use super::look::Look;
use super::palette::label_color;
use super::scene::{Anchor, ItemKind, PathCmd, Pt, Scene, Stroke, Tag};
use crate::math::pipes::bumpless::{BumplessDream, Tile};
use crate::math::pipes::trace::Side;

const CELL: f32 = 28.0;
const MARGIN: f32 = 24.0;

fn origin(row: usize, col: usize) -> Pt {
    Pt::new(
        MARGIN + (col as f32 - 1.0) * CELL,
        MARGIN + (row as f32 - 1.0) * CELL,
    )
}

/// Where a pipe goes next from a tile it entered through `enters`, if the tile lets it.
fn exit(tile: Tile, enters: Side) -> Option<Side> {
    match (tile, enters) {
        (Tile::Cross, Side::Bottom) | (Tile::Vertical, Side::Bottom) => Some(Side::Top),
        (Tile::Cross, Side::Left) | (Tile::Horizontal, Side::Left) => Some(Side::Right),
        (Tile::ElbowDownRight, Side::Bottom) => Some(Side::Right),
        (Tile::ElbowUpLeft, Side::Left) => Some(Side::Top),
        _ => None,
    }
}

/// One pipe's route: the row it leaves from on the right and its path.
fn route(d: &BumplessDream, col: usize) -> Option<(usize, Vec<PathCmd>)> {
    let n = d.n();
    let (mut i, mut j, mut enters) = (n, col, Side::Bottom);
    let start = side_mid(origin(i, j), CELL, Side::Bottom);
    let mut cmds = vec![
        PathCmd::MoveTo(Pt::new(start.x, start.y + CELL * 0.25)),
        PathCmd::LineTo(start),
    ];
    for _ in 0..2 * n + 2 {
        let leaves = exit(d.tile(i, j), enters)?;
        cmds.push(passage_cmd(origin(i, j), CELL, enters, leaves));
        match leaves {
            Side::Top => {
                if i == 1 {
                    return None;
                }
                i -= 1;
                enters = Side::Bottom;
            }
            _ => {
                if j == n {
                    let end = side_mid(origin(i, j), CELL, Side::Right);
                    cmds.push(PathCmd::LineTo(Pt::new(end.x + CELL * 0.25, end.y)));
                    return Some((i, cmds));
                }
                j += 1;
                enters = Side::Left;
            }
        }
    }
    None
}

/// Builds the figure of a bumpless pipe dream.
pub fn bumpless_scene(d: &BumplessDream, look: &Look) -> Scene {
    let n = d.n();
    let size = 2.0 * MARGIN + n as f32 * CELL;
    let mut scene = Scene::new(size, size, look.background());
    let grid = Stroke {
        width: 0.8,
        color: look.grid(),
    };
    for i in 1..=n {
        for j in 1..=n {
            let o = origin(i, j);
            let blank = d.tile(i, j) == Tile::Blank;
            scene.push(
                ItemKind::Path {
                    cmds: vec![
                        PathCmd::MoveTo(o),
                        PathCmd::LineTo(Pt::new(o.x + CELL, o.y)),
                        PathCmd::LineTo(Pt::new(o.x + CELL, o.y + CELL)),
                        PathCmd::LineTo(Pt::new(o.x, o.y + CELL)),
                        PathCmd::Close,
                    ],
                    stroke: Some(grid),
                    fill: Some(if blank { look.grid() } else { look.tile() }),
                },
                Tag::Cell(i, j),
            );
        }
    }
    for col in 1..=n {
        let Some((row, cmds)) = route(d, col) else {
            continue;
        };
        scene.push(
            ItemKind::Path {
                cmds,
                stroke: Some(Stroke {
                    width: CELL * 0.2,
                    color: label_color(row, n),
                }),
                fill: None,
            },
            Tag::Pipe(row),
        );
    }
    if look.labels {
        for i in 1..=n {
            let o = origin(i, n);
            scene.label(
                Pt::new(o.x + CELL * 1.45, o.y + CELL / 2.0),
                i.to_string(),
                CELL * 0.42,
                look.ink(),
                Anchor::Left,
            );
            let o = origin(n, i);
            scene.label(
                Pt::new(o.x + CELL / 2.0, o.y + CELL * 1.55),
                i.to_string(),
                CELL * 0.42,
                look.ink(),
                Anchor::Center,
            );
        }
    }
    scene
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::math::Perm;
    use crate::math::pipes::bumpless::bumpless_dreams;

    #[test]
    fn every_pipe_is_traced_for_every_dream_of_1432() {
        let w = Perm::parse("1432").unwrap();
        for d in bumpless_dreams(&w) {
            let scene = bumpless_scene(&d, &Look::light());
            assert_eq!(scene.pipe_labels(), vec![1, 2, 3, 4]);
        }
    }
}
