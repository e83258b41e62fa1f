//! The figure of a permutohedron P_λ from its drawing coordinates: for n = 3 the
//! hexagon (or triangle) in the plane Σ x_i = Σ λ_i, filled; for n = 4 an
//! orthographic projection of the solid turned by a yaw and a pitch, edges
//! shaded by depth (for n = 5 the same, of the first three of its four
//! drawing coordinates). Vertices are tagged `Vertex(k)` and labelled.

use super::look::Look;
use super::palette::label_color;
use super::scene::{Anchor, Color, ItemKind, PathCmd, Pt, Scene, Stroke, Tag};

/// Side of the square the figure fits in, in figure units.
const SIZE: f32 = 320.0;
const PAD: f32 = 46.0;

/// Turns 3-dimensional coordinates by `yaw` (about the vertical axis) then
/// `pitch` (about the horizontal axis); returns (x, y, depth).
pub fn rotate(p: &[f64], yaw: f32, pitch: f32) -> (f64, f64, f64) {
    let x = p.first().copied().unwrap_or(0.0);
    let y = p.get(1).copied().unwrap_or(0.0);
    let z = p.get(2).copied().unwrap_or(0.0);
    let (sy, cy) = (yaw as f64).sin_cos();
    let (sp, cp) = (pitch as f64).sin_cos();
    let x1 = cy * x + sy * z;
    let z1 = -sy * x + cy * z;
    let y2 = cp * y - sp * z1;
    let z2 = sp * y + cp * z1;
    (x1, y2, z2)
}

/// Builds the figure from vertex coordinates (n - 1 per vertex), edges and labels.
pub fn polytope_scene(
    coords: &[Vec<f64>],
    edges: &[(usize, usize)],
    labels: &[String],
    yaw: f32,
    pitch: f32,
    look: &Look,
) -> Scene {
    let mut scene = Scene::new(SIZE, SIZE, look.background());
    if coords.is_empty() {
        return scene;
    }
    let dim = coords[0].len();
    let projected = project(coords, dim, yaw, pitch);
    let view = View::fitting(&projected);
    if dim == 2 && projected.len() >= 3 {
        fill_polygon(&mut scene, &projected, &view);
    }
    draw_edges(&mut scene, &projected, edges, &view, look);
    draw_vertices(&mut scene, &projected, labels, dim == 2, &view, look);
    scene
}

/// (x, y, depth) of each vertex: turned when there are three or more
/// coordinates, flat (depth 0) in the plane.
fn project(coords: &[Vec<f64>], dim: usize, yaw: f32, pitch: f32) -> Vec<(f64, f64, f64)> {
    coords
        .iter()
        .map(|c| {
            if dim >= 3 {
                rotate(c, yaw, pitch)
            } else {
                (
                    c.first().copied().unwrap_or(0.0),
                    c.get(1).copied().unwrap_or(0.0),
                    0.0,
                )
            }
        })
        .collect()
}

/// The scale that fits the projection in the square, and its range of depths.
struct View {
    k: f64,
    zmin: f64,
    zmax: f64,
}

impl View {
    fn fitting(projected: &[(f64, f64, f64)]) -> View {
        let extent = projected
            .iter()
            .map(|(x, y, _)| x.abs().max(y.abs()))
            .fold(0.0f64, f64::max)
            .max(1e-9);
        let (zmin, zmax) = projected
            .iter()
            .fold((f64::MAX, f64::MIN), |(a, b), p| (a.min(p.2), b.max(p.2)));
        View {
            k: ((SIZE / 2.0 - PAD) as f64) / extent,
            zmin,
            zmax,
        }
    }

    fn pt(&self, (x, y, _): (f64, f64, f64)) -> Pt {
        Pt::new(
            SIZE / 2.0 + (x * self.k) as f32,
            SIZE / 2.0 - (y * self.k) as f32,
        )
    }
}

/// The convex polygon of a plane figure, filled: its vertices ordered by
/// angle about the centroid.
fn fill_polygon(scene: &mut Scene, projected: &[(f64, f64, f64)], view: &View) {
    let cx = projected.iter().map(|p| p.0).sum::<f64>() / projected.len() as f64;
    let cy = projected.iter().map(|p| p.1).sum::<f64>() / projected.len() as f64;
    let mut order: Vec<usize> = (0..projected.len()).collect();
    order.sort_by(|&a, &b| {
        let ta = (projected[a].1 - cy).atan2(projected[a].0 - cx);
        let tb = (projected[b].1 - cy).atan2(projected[b].0 - cx);
        ta.total_cmp(&tb)
    });
    let mut cmds = PathCmd::polyline(order.iter().map(|&v| view.pt(projected[v])));
    cmds.push(PathCmd::Close);
    let fill = label_color(3, 6);
    scene.push(
        ItemKind::Path {
            cmds,
            stroke: None,
            fill: Some(Color { a: 60, ..fill }),
        },
        Tag::None,
    );
}

/// The edges, back to front, nearer ones darker and thicker.
fn draw_edges(
    scene: &mut Scene,
    projected: &[(f64, f64, f64)],
    edges: &[(usize, usize)],
    view: &View,
    look: &Look,
) {
    let mut sorted_edges: Vec<&(usize, usize)> = edges.iter().collect();
    let depth = |e: &(usize, usize)| {
        let (a, b) = (projected.get(e.0), projected.get(e.1));
        a.map_or(0.0, |p| p.2) + b.map_or(0.0, |p| p.2)
    };
    sorted_edges.sort_by(|a, b| depth(a).total_cmp(&depth(b)));
    let (zmin, zmax) = (view.zmin, view.zmax);
    for e in sorted_edges {
        let (Some(&a), Some(&b)) = (projected.get(e.0), projected.get(e.1)) else {
            continue;
        };
        let t = if zmax > zmin {
            (((a.2 + b.2) / 2.0 - zmin) / (zmax - zmin)) as f32
        } else {
            1.0
        };
        let ink = look.ink();
        let grid = look.grid();
        let mix = |u: u8, v: u8| (u as f32 * t + v as f32 * (1.0 - t)).round() as u8;
        scene.push(
            ItemKind::Path {
                cmds: vec![PathCmd::MoveTo(view.pt(a)), PathCmd::LineTo(view.pt(b))],
                stroke: Some(Stroke {
                    width: 1.0 + 1.2 * t,
                    color: Color::rgb(mix(ink.r, grid.r), mix(ink.g, grid.g), mix(ink.b, grid.b)),
                }),
                fill: None,
            },
            Tag::None,
        );
    }
}

/// A dot per vertex, tagged `Vertex(k)`; in the plane, its label outside the polygon.
fn draw_vertices(
    scene: &mut Scene,
    projected: &[(f64, f64, f64)],
    labels: &[String],
    plane: bool,
    view: &View,
    look: &Look,
) {
    for (v, p) in projected.iter().enumerate() {
        let at = view.pt(*p);
        scene.push(
            ItemKind::Circle {
                center: at,
                radius: 3.2,
                stroke: None,
                fill: Some(look.ink()),
            },
            Tag::Vertex(v),
        );
        if look.labels && plane {
            let out_x = at.x - SIZE / 2.0;
            let out_y = at.y - SIZE / 2.0;
            let len = (out_x * out_x + out_y * out_y).sqrt().max(1e-3);
            let pos = Pt::new(at.x + out_x / len * 14.0, at.y + out_y / len * 12.0);
            let anchor = if out_x > 8.0 {
                Anchor::Left
            } else if out_x < -8.0 {
                Anchor::Right
            } else {
                Anchor::Center
            };
            let text = labels.get(v).cloned().unwrap_or_default();
            scene.label(pos, text, 9.0, look.ink(), anchor);
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a_turn_keeps_lengths() {
        let (x, y, z) = rotate(&[1.0, 2.0, 3.0], 0.7, -0.4);
        assert!(((x * x + y * y + z * z) - 14.0).abs() < 1e-9);
    }

    #[test]
    fn every_vertex_is_tagged() {
        let hexagon: Vec<Vec<f64>> = (0..6)
            .map(|k| {
                let t = k as f64 * std::f64::consts::PI / 3.0;
                vec![t.cos(), t.sin()]
            })
            .collect();
        let edges: Vec<(usize, usize)> = (0..6).map(|k| (k, (k + 1) % 6)).collect();
        let labels: Vec<String> = (0..6).map(|k| k.to_string()).collect();
        let s = polytope_scene(&hexagon, &edges, &labels, 0.0, 0.0, &Look::light());
        let tagged = s
            .items
            .iter()
            .filter(|i| matches!(i.tag, Tag::Vertex(_)))
            .count();
        assert_eq!(tagged, 6);
    }
}
