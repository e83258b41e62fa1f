//! An indexed forest standing on the number line: the leaves 1, 2, 3, … as
//! ticks on a horizontal axis, each internal node above the middle of its
//! leaf interval at the height of its subtree, joined to its two children.
//! Internal nodes are tagged [`Tag::Node`] (their index in the forest's node
//! list); terminal nodes (two leaves as children) are filled with the accent
//! colour, the others drawn hollow.

use super::look::Look;
use super::palette::label_color;
use super::scene::{Anchor, Color, ItemKind, PathCmd, Pt, Scene, Stroke, Tag};
use crate::math::forest::indexed::{Child, Forest, code_text};

/// Horizontal space between two leaves, in figure units.
pub const STEP: f32 = 28.0;
/// Vertical space between two levels of nodes.
pub const LEVEL: f32 = 24.0;
/// Radius of the node marks.
pub const NODE_RADIUS: f32 = 5.0;
const MARGIN: f32 = 16.0;
const LEAF_LABEL: f32 = 16.0;
const CAPTION: f32 = 16.0;

/// The fill of terminal nodes.
pub fn terminal_color() -> Color {
    label_color(1, 3)
}

/// The number of leaves drawn: one past the last leaf of a nontrivial tree
/// (and at least 2), so a terminal node can be seen to stand on its two leaves.
pub fn leaves_drawn(forest: &Forest) -> usize {
    (forest.last_leaf() + 1).max(2)
}

/// Height of each node's subtree (a node above two leaves has height 1).
fn heights(forest: &Forest) -> Vec<usize> {
    let mut h = Vec::with_capacity(forest.size());
    for v in forest.nodes() {
        let of = |c: Child, h: &Vec<usize>| match c {
            Child::Leaf(_) => 0,
            Child::Node(k) => h[k],
        };
        let hv = 1 + of(v.left, &h).max(of(v.right, &h));
        h.push(hv);
    }
    h
}

/// The scene's geometry: leaf positions on the axis and node positions.
struct Layout {
    base: f32,
    nodes: Vec<Pt>,
}

impl Layout {
    fn of(forest: &Forest) -> Layout {
        let h = heights(forest);
        let top = h.iter().copied().max().unwrap_or(0) as f32;
        let base = MARGIN + top * LEVEL + NODE_RADIUS;
        let nodes = forest
            .nodes()
            .iter()
            .zip(&h)
            .map(|(v, &hv)| {
                Pt::new(
                    (leaf_x(v.lo) + leaf_x(v.hi)) / 2.0,
                    base - hv as f32 * LEVEL,
                )
            })
            .collect();
        Layout { base, nodes }
    }

    fn child(&self, c: Child) -> Pt {
        match c {
            Child::Leaf(i) => Pt::new(leaf_x(i), self.base),
            Child::Node(k) => self.nodes[k],
        }
    }
}

fn leaf_x(i: usize) -> f32 {
    MARGIN + (i as f32 - 1.0) * STEP
}

/// The figure of `forest`: the axis with its leaves, the edges, the nodes
/// (tagged `Node(k)`), and with labels the leaf numbers and the code.
///
/// ```
/// use elbowroom::figure::forest::{forest_scene, terminal_color};
/// use elbowroom::figure::look::Look;
/// use elbowroom::figure::{ItemKind, Tag};
/// use elbowroom::math::forest::indexed::Forest;
/// // (2,0,1) is ((1 2)(3 4)): three nodes, the two terminal ones at 1 and 3
/// let f = Forest::from_code(&[2, 0, 1]).unwrap();
/// let scene = forest_scene(&f, &Look::light());
/// let terminal: Vec<Tag> = scene
///     .items
///     .iter()
///     .filter(|it| matches!(it.kind, ItemKind::Circle { fill: Some(c), .. } if c == terminal_color()))
///     .map(|it| it.tag)
///     .collect();
/// assert_eq!(terminal.len(), 2);
/// assert_eq!(scene.items.iter().filter(|it| matches!(it.tag, Tag::Node(_))).count(), 3);
/// ```
pub fn forest_scene(forest: &Forest, look: &Look) -> Scene {
    let leaves = leaves_drawn(forest);
    let layout = Layout::of(forest);
    let below = if look.labels {
        LEAF_LABEL + CAPTION
    } else {
        0.0
    };
    let width = 2.0 * MARGIN + (leaves as f32 - 1.0) * STEP;
    let mut scene = Scene::new(width, layout.base + MARGIN + below, look.background());
    let thin = Stroke {
        width: 1.0,
        color: look.grid(),
    };
    scene.push(
        ItemKind::Path {
            cmds: PathCmd::polyline([
                Pt::new(MARGIN * 0.4, layout.base),
                Pt::new(width - MARGIN * 0.4, layout.base),
            ]),
            stroke: Some(thin),
            fill: None,
        },
        Tag::None,
    );
    for i in 1..=leaves {
        let x = leaf_x(i);
        scene.push(
            ItemKind::Path {
                cmds: PathCmd::polyline([
                    Pt::new(x, layout.base - 3.0),
                    Pt::new(x, layout.base + 3.0),
                ]),
                stroke: Some(Stroke {
                    width: 1.2,
                    color: look.ink(),
                }),
                fill: None,
            },
            Tag::None,
        );
        if look.labels {
            scene.label(
                Pt::new(x, layout.base + LEAF_LABEL * 0.75),
                i.to_string(),
                10.0,
                look.ink(),
                Anchor::Center,
            );
        }
    }
    let edge = Stroke {
        width: 1.6,
        color: look.ink(),
    };
    for (k, v) in forest.nodes().iter().enumerate() {
        for c in [v.left, v.right] {
            scene.push(
                ItemKind::Path {
                    cmds: PathCmd::polyline([layout.nodes[k], layout.child(c)]),
                    stroke: Some(edge),
                    fill: None,
                },
                Tag::None,
            );
        }
    }
    for (k, v) in forest.nodes().iter().enumerate() {
        let fill = if v.is_terminal() {
            terminal_color()
        } else {
            look.background()
        };
        scene.push(
            ItemKind::Circle {
                center: layout.nodes[k],
                radius: NODE_RADIUS,
                stroke: Some(edge),
                fill: Some(fill),
            },
            Tag::Node(k),
        );
    }
    if look.labels {
        scene.label(
            Pt::new(MARGIN * 0.4, layout.base + LEAF_LABEL + CAPTION * 0.6),
            format!("code {}", code_text(forest.code())),
            10.0,
            look.ink(),
            Anchor::Left,
        );
    }
    scene
}

/// Where node k is drawn (figure units), for tests and hit checks.
pub fn node_center(forest: &Forest, k: usize) -> Option<Pt> {
    Layout::of(forest).nodes.get(k).copied()
}
