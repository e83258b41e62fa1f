//! The normal form in the quasisymmetric quotient as a grid of small
//! lattice-path diagrams: one panel per standard monomial with a nonzero
//! coefficient, the path N^{e_1} E N^{e_2} E ... in the n×n square (staying
//! weakly below the diagonal, drawn dashed), the monomial and its coefficient
//! under it; negative coefficients in the alert colour with a red frame.

use super::look::Look;
use super::palette::label_color;
use super::scene::{Anchor, Color, ItemKind, PathCmd, Pt, Scene, Stroke, Tag};
use crate::math::quotient::lattice_path::{LatticePath, Step};

/// One panel: the path, the monomial as text, the coefficient as text, and its sign.
pub struct PathPanel {
    /// The lattice path of the standard monomial.
    pub path: LatticePath,
    /// The monomial, e.g. `x2 x3^2`.
    pub monomial: String,
    /// The exact coefficient, e.g. `-3/2`.
    pub coefficient: String,
    /// Whether the coefficient is negative.
    pub negative: bool,
}

const PANEL: f32 = 96.0;
const GAP: f32 = 14.0;
const CAPTION: f32 = 30.0;

/// Builds the grid, `columns` panels per row.
pub fn path_grid_scene(panels: &[PathPanel], n: usize, columns: usize, look: &Look) -> Scene {
    let columns = columns.max(1);
    let rows = panels.len().div_ceil(columns).max(1);
    let width = GAP + columns.min(panels.len().max(1)) as f32 * (PANEL + GAP);
    let height = GAP + rows as f32 * (PANEL + CAPTION + GAP);
    let mut scene = Scene::new(width, height, look.background());
    let n = n.max(1);
    let unit = (PANEL - 12.0) / n as f32;
    for (k, panel) in panels.iter().enumerate() {
        let x0 = GAP + (k % columns) as f32 * (PANEL + GAP);
        let y0 = GAP + (k / columns) as f32 * (PANEL + CAPTION + GAP);
        let frame = if panel.negative {
            look.alert()
        } else {
            look.grid()
        };
        scene.push(
            ItemKind::Path {
                cmds: vec![
                    PathCmd::MoveTo(Pt::new(x0, y0)),
                    PathCmd::LineTo(Pt::new(x0 + PANEL, y0)),
                    PathCmd::LineTo(Pt::new(x0 + PANEL, y0 + PANEL + CAPTION)),
                    PathCmd::LineTo(Pt::new(x0, y0 + PANEL + CAPTION)),
                    PathCmd::Close,
                ],
                stroke: Some(Stroke {
                    width: if panel.negative { 1.6 } else { 0.8 },
                    color: frame,
                }),
                fill: Some(look.tile()),
            },
            Tag::Panel(k),
        );
        // lattice point (a, b) -> the square's lower-left corner is (0, 0)
        let ox = x0 + 6.0;
        let oy = y0 + 6.0 + n as f32 * unit;
        let at = |a: usize, b: usize| Pt::new(ox + a as f32 * unit, oy - b as f32 * unit);
        let faint = Stroke {
            width: 0.5,
            color: look.grid(),
        };
        for t in 0..=n {
            scene.push(
                ItemKind::Path {
                    cmds: vec![PathCmd::MoveTo(at(t, 0)), PathCmd::LineTo(at(t, n))],
                    stroke: Some(faint),
                    fill: None,
                },
                Tag::None,
            );
            scene.push(
                ItemKind::Path {
                    cmds: vec![PathCmd::MoveTo(at(0, t)), PathCmd::LineTo(at(n, t))],
                    stroke: Some(faint),
                    fill: None,
                },
                Tag::None,
            );
        }
        // the diagonal, dashed
        let mut dash = Vec::new();
        for t in 0..n * 2 {
            if t % 2 == 0 {
                let a = t as f32 / 2.0;
                let p = Pt::new(ox + a * unit, oy - a * unit);
                let q = Pt::new(ox + (a + 0.5) * unit, oy - (a + 0.5) * unit);
                dash.push(PathCmd::MoveTo(p));
                dash.push(PathCmd::LineTo(q));
            }
        }
        scene.push(
            ItemKind::Path {
                cmds: dash,
                stroke: Some(Stroke {
                    width: 0.8,
                    color: look.ink(),
                }),
                fill: None,
            },
            Tag::None,
        );
        // the path, north steps coloured by their variable
        let vertices = panel.path.vertices();
        let cmds = PathCmd::polyline(vertices.iter().map(|&(a, b)| at(a, b)));
        scene.push(
            ItemKind::Path {
                cmds,
                stroke: Some(Stroke {
                    width: 2.2,
                    color: look.ink(),
                }),
                fill: None,
            },
            Tag::Panel(k),
        );
        for (s, step) in panel.path.steps.iter().enumerate() {
            if let Step::North { var: Some(v) } = step {
                let (a, b) = vertices[s];
                let (c, d) = vertices[s + 1];
                scene.push(
                    ItemKind::Path {
                        cmds: vec![PathCmd::MoveTo(at(a, b)), PathCmd::LineTo(at(c, d))],
                        stroke: Some(Stroke {
                            width: 2.6,
                            color: label_color(*v, n),
                        }),
                        fill: None,
                    },
                    Tag::Panel(k),
                );
            }
        }
        let text_color: Color = if panel.negative {
            look.alert()
        } else {
            look.ink()
        };
        scene.label(
            Pt::new(x0 + PANEL / 2.0, y0 + PANEL + 6.0),
            panel.coefficient.clone(),
            11.0,
            text_color,
            Anchor::Center,
        );
        scene.label(
            Pt::new(x0 + PANEL / 2.0, y0 + PANEL + 20.0),
            panel.monomial.clone(),
            9.0,
            look.ink(),
            Anchor::Center,
        );
    }
    scene
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn one_framed_panel_per_term_and_negatives_in_red() {
        let panels = vec![
            PathPanel {
                path: LatticePath::of_monomial(&[0, 1, 1]).unwrap(),
                monomial: "x2 x3".into(),
                coefficient: "2".into(),
                negative: false,
            },
            PathPanel {
                path: LatticePath::of_monomial(&[0, 0, 2]).unwrap(),
                monomial: "x3^2".into(),
                coefficient: "-1".into(),
                negative: true,
            },
        ];
        let look = Look::light();
        let scene = path_grid_scene(&panels, 3, 4, &look);
        let red_text = scene
            .items
            .iter()
            .filter(|i| matches!(&i.kind, ItemKind::Text { color, text, .. } if *color == look.alert() && text == "-1"))
            .count();
        assert_eq!(red_text, 1);
        let frames = scene
            .items
            .iter()
            .filter(|i| {
                matches!(i.tag, Tag::Panel(_))
                    && matches!(&i.kind, ItemKind::Path { fill: Some(_), .. })
            })
            .count();
        assert_eq!(frames, 2);
    }
}
