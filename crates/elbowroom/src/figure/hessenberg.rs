//! The staircase diagram of a Hessenberg function h: the n×n grid of boxes
//! (i, j) (row i from the top, column j from the left), the boxes
//! i < j <= h(i) shaded — one for each factor x_i − x_j of the denominator
//! D_h, so Σ_i (h(i) − i) of them, the dimension of the regular Hessenberg
//! variety — the diagonal boxes (i, i) marked, and the lattice path that bounds
//! the region j <= h(i): east along the top to h(1), then in row i down one
//! box and east to h(i + 1), ending at the corner (n, n). It never crosses the
//! diagonal, since h(i) >= i (a Dyck path of length 2n).

use super::look::Look;
use super::scene::{Anchor, Color, ItemKind, PathCmd, Pt, Scene, Stroke, Tag};
use crate::math::hessenberg::function::HessenbergFn;

/// Side of a box in figure units.
pub const BOX: f32 = 24.0;
/// Space for the row and column labels.
const MARGIN: f32 = 22.0;
/// Space under the grid for the caption `h = (...)`.
const CAPTION: f32 = 8.0;

/// The top-left corner of box (row, col), 1-based.
pub fn box_origin(row: usize, col: usize) -> Pt {
    Pt::new(
        MARGIN + (col as f32 - 1.0) * BOX,
        MARGIN + (row as f32 - 1.0) * BOX,
    )
}

/// The fill of the boxes i < j <= h(i): the first colour of the label scale.
pub fn shade() -> Color {
    super::palette::label_color(1, 3)
}

/// The figure of `h`: boxes tagged `Cell(i, j)` (shaded for i < j <= h(i)),
/// a dot in each diagonal box, and the bounding path (tagged `None`).
///
/// ```
/// use elbowroom::figure::hessenberg::{hessenberg_scene, shade};
/// use elbowroom::figure::look::Look;
/// use elbowroom::figure::{ItemKind, Tag};
/// use elbowroom::math::hessenberg::function::HessenbergFn;
/// let h = HessenbergFn::new(&[2, 3, 3]).unwrap();
/// let scene = hessenberg_scene(&h, &Look::light());
/// // Σ (h(i) − i) = 1 + 1 + 0 = 2 shaded boxes, (1,2) and (2,3)
/// let shaded: Vec<Tag> = scene
///     .items
///     .iter()
///     .filter(|it| matches!(it.kind, ItemKind::Path { fill: Some(f), .. } if f == shade()))
///     .map(|it| it.tag)
///     .collect();
/// assert_eq!(shaded, vec![Tag::Cell(1, 2), Tag::Cell(2, 3)]);
/// ```
pub fn hessenberg_scene(h: &HessenbergFn, look: &Look) -> Scene {
    let n = h.n();
    let side = n as f32 * BOX;
    let caption = if look.labels { CAPTION } else { 0.0 };
    let mut scene = Scene::new(
        2.0 * MARGIN + side,
        2.0 * MARGIN + side + caption,
        look.background(),
    );
    boxes(&mut scene, h, look);
    diagonal(&mut scene, n, look);
    scene.push(
        ItemKind::Path {
            cmds: PathCmd::polyline(boundary(h)),
            stroke: Some(Stroke {
                width: 2.4,
                color: look.ink(),
            }),
            fill: None,
        },
        Tag::None,
    );
    if look.labels {
        labels(&mut scene, h, look);
    }
    scene
}

/// The corners of the bounding path, from the top-left corner of the grid to
/// its bottom-right one: (0, 0), (h(1), 0), (h(1), 1), (h(2), 1), ..., (n, n)
/// in box units, as figure points.
pub fn boundary(h: &HessenbergFn) -> Vec<Pt> {
    let at = |x: usize, y: usize| Pt::new(MARGIN + x as f32 * BOX, MARGIN + y as f32 * BOX);
    let mut points = vec![at(0, 0)];
    for (k, &v) in h.values().iter().enumerate() {
        points.push(at(v, k));
        points.push(at(v, k + 1));
    }
    points
}

/// Every box of the grid, tagged `Cell(i, j)`: shaded when i < j <= h(i),
/// faint below the diagonal, plain otherwise.
fn boxes(scene: &mut Scene, h: &HessenbergFn, look: &Look) {
    let n = h.n();
    let grid = Stroke {
        width: 0.8,
        color: look.grid(),
    };
    let shaded = shade();
    for i in 1..=n {
        for j in 1..=n {
            let o = box_origin(i, j);
            let fill = if i < j && j <= h.at(i) {
                shaded
            } else if j < i {
                look.tile()
            } else {
                look.background()
            };
            scene.push(
                ItemKind::Path {
                    cmds: vec![
                        PathCmd::MoveTo(o),
                        PathCmd::LineTo(Pt::new(o.x + BOX, o.y)),
                        PathCmd::LineTo(Pt::new(o.x + BOX, o.y + BOX)),
                        PathCmd::LineTo(Pt::new(o.x, o.y + BOX)),
                        PathCmd::Close,
                    ],
                    stroke: Some(grid),
                    fill: Some(fill),
                },
                Tag::Cell(i, j),
            );
        }
    }
}

/// A dot in each diagonal box (i, i).
fn diagonal(scene: &mut Scene, n: usize, look: &Look) {
    for i in 1..=n {
        let o = box_origin(i, i);
        scene.push(
            ItemKind::Circle {
                center: Pt::new(o.x + BOX / 2.0, o.y + BOX / 2.0),
                radius: BOX * 0.12,
                stroke: None,
                fill: Some(look.ink()),
            },
            Tag::None,
        );
    }
}

/// Row numbers on the left, column numbers on top, and `h = (...)` underneath.
fn labels(scene: &mut Scene, h: &HessenbergFn, look: &Look) {
    let n = h.n();
    for k in 1..=n {
        let o = box_origin(k, k);
        scene.label(
            Pt::new(MARGIN - 6.0, o.y + BOX / 2.0),
            k.to_string(),
            10.0,
            look.ink(),
            Anchor::Right,
        );
        scene.label(
            Pt::new(o.x + BOX / 2.0, MARGIN - 9.0),
            k.to_string(),
            10.0,
            look.ink(),
            Anchor::Center,
        );
    }
    let values: Vec<String> = h.values().iter().map(|v| v.to_string()).collect();
    scene.label(
        Pt::new(
            MARGIN + n as f32 * BOX / 2.0,
            MARGIN + n as f32 * BOX + MARGIN / 2.0 + 4.0,
        ),
        format!("h = ({}), |h| = {}", values.join(","), h.dimension()),
        11.0,
        look.ink(),
        Anchor::Center,
    );
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::figure::ItemKind;

    fn shaded(scene: &Scene, look: &Look) -> Vec<(usize, usize)> {
        let plain = [look.background(), look.tile()];
        scene
            .items
            .iter()
            .filter_map(|it| match (&it.kind, it.tag) {
                (ItemKind::Path { fill: Some(f), .. }, Tag::Cell(i, j)) if !plain.contains(f) => {
                    Some((i, j))
                }
                _ => None,
            })
            .collect()
    }

    #[test]
    fn the_shaded_boxes_are_the_factors_of_d_h_and_count_the_dimension() {
        // De Mari, Procesi, Shayman (Trans. AMS 1992): the regular Hessenberg variety of h
        // has dimension Σ_i (h(i) − i), one for each box i < j <= h(i)
        let look = Look::light();
        for n in 1..=6 {
            for h in HessenbergFn::all(n) {
                let scene = hessenberg_scene(&h, &look);
                let boxes = shaded(&scene, &look);
                let dim: usize = h
                    .values()
                    .iter()
                    .enumerate()
                    .map(|(k, &v)| v - (k + 1))
                    .sum();
                assert_eq!(boxes.len(), dim, "h = {h}");
                assert!(boxes.iter().all(|&(i, j)| i < j && j <= h.at(i)), "h = {h}");
                let cells = scene
                    .items
                    .iter()
                    .filter(|it| matches!(it.tag, Tag::Cell(..)))
                    .count();
                assert_eq!(cells, n * n);
                let dots = scene
                    .items
                    .iter()
                    .filter(|it| matches!(it.kind, ItemKind::Circle { .. }))
                    .count();
                assert_eq!(dots, n, "one dot per diagonal box");
            }
        }
    }

    #[test]
    fn the_bounding_paths_are_the_dyck_paths_one_for_each_h() {
        // Hessenberg functions of n and Dyck paths of length 2n are in bijection; there
        // are Catalan(n) of each (OEIS A000108: 1, 2, 5, 14, 42, 132)
        let catalan = [1, 2, 5, 14, 42, 132];
        for n in 1..=6 {
            let mut paths: Vec<Vec<(i32, i32)>> = HessenbergFn::all(n)
                .iter()
                .map(|h| {
                    boundary(h)
                        .iter()
                        .map(|p| {
                            (
                                ((p.x - MARGIN) / BOX).round() as i32,
                                ((p.y - MARGIN) / BOX).round() as i32,
                            )
                        })
                        .collect()
                })
                .collect();
            for p in &paths {
                assert_eq!(p.first(), Some(&(0, 0)));
                assert_eq!(p.last(), Some(&(n as i32, n as i32)));
                // unit steps east or south (a repeated corner is a step of length 0),
                // never below the diagonal
                assert!(p.windows(2).all(|s| (s[1].0 >= s[0].0 && s[1].1 == s[0].1)
                    || (s[1].0 == s[0].0 && s[1].1 == s[0].1 + 1)));
                assert!(p.iter().all(|&(x, y)| x >= y));
            }
            paths.sort();
            paths.dedup();
            assert_eq!(paths.len(), catalan[n - 1], "n = {n}");
        }
    }
}
