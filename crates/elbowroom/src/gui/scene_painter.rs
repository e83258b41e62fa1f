//! Draws a figure [`Scene`] with egui's painter: Béziers are flattened, figure
//! units are mapped to the screen, and the pointer is hit-tested against the
//! tagged items so a view can highlight a pipe end to end or react to a click
//! on a cell. [`with_highlight`] bakes the same emphasis into a scene, for an
//! export that keeps the on-screen marks.

use super::theme::color;
use crate::figure::{self, Anchor, Item, ItemKind, PathCmd, Pt, Scene, Tag};
use eframe::egui::{self, Align2, Color32, FontId, Pos2, Sense, Shape, Stroke, Vec2};

/// How to draw a scene.
pub struct PaintOptions {
    /// Items with these tags are drawn emphasised.
    pub highlight: Vec<Tag>,
    /// The largest number of screen points per figure unit.
    pub max_scale: f32,
    /// The space to fit into (defaults to the space available).
    pub size: Option<Vec2>,
}

impl Default for PaintOptions {
    fn default() -> Self {
        PaintOptions {
            highlight: Vec::new(),
            max_scale: 3.0,
            size: None,
        }
    }
}

/// What the pointer did on the scene this frame.
pub struct SceneResponse {
    /// The widget's response (for drags and tooltips).
    pub response: egui::Response,
    /// Tags under the pointer, topmost first.
    pub hovered: Vec<Tag>,
    /// Tags under a click this frame, topmost first.
    pub clicked: Vec<Tag>,
    /// Screen points per figure unit.
    pub scale: f32,
}

impl SceneResponse {
    /// The first hovered tag matching `f`.
    pub fn hovered_where(&self, f: impl Fn(&Tag) -> bool) -> Option<Tag> {
        self.hovered.iter().copied().find(|t| f(t))
    }

    /// The first clicked tag matching `f`.
    pub fn clicked_where(&self, f: impl Fn(&Tag) -> bool) -> Option<Tag> {
        self.clicked.iter().copied().find(|t| f(t))
    }
}

/// The screen geometry of one item.
enum Geometry {
    Lines(Vec<Vec<Pos2>>),
    Circle(Pos2, f32),
    Text,
}

/// Splits a path into polylines, flattening cubic Béziers.
pub fn flatten(cmds: &[PathCmd], map: impl Fn(Pt) -> Pos2) -> Vec<Vec<Pos2>> {
    let mut out: Vec<Vec<Pos2>> = Vec::new();
    let mut cur: Vec<Pos2> = Vec::new();
    for cmd in cmds {
        match *cmd {
            PathCmd::MoveTo(p) => {
                if cur.len() > 1 {
                    out.push(std::mem::take(&mut cur));
                }
                cur.clear();
                cur.push(map(p));
            }
            PathCmd::LineTo(p) => cur.push(map(p)),
            PathCmd::CubicTo(c1, c2, p) => {
                let Some(&p0) = cur.last() else {
                    cur.push(map(p));
                    continue;
                };
                let (q1, q2, q3) = (map(c1), map(c2), map(p));
                let rough = p0.distance(q1) + q1.distance(q2) + q2.distance(q3);
                // about one segment per 8 pixels of control polygon: the chord
                // error stays under a quarter pixel for the quarter-circle elbows
                let steps = ((rough / 8.0).ceil() as usize).clamp(2, 24);
                for k in 1..=steps {
                    let t = k as f32 / steps as f32;
                    let u = 1.0 - t;
                    let b = |a: f32, b: f32, c: f32, d: f32| {
                        u * u * u * a + 3.0 * u * u * t * b + 3.0 * u * t * t * c + t * t * t * d
                    };
                    cur.push(Pos2::new(
                        b(p0.x, q1.x, q2.x, q3.x),
                        b(p0.y, q1.y, q2.y, q3.y),
                    ));
                }
            }
            PathCmd::Close => {
                if let Some(&first) = cur.first() {
                    cur.push(first);
                }
            }
        }
    }
    if cur.len() > 1 {
        out.push(cur);
    }
    out
}

fn distance_to_segment(p: Pos2, a: Pos2, b: Pos2) -> f32 {
    let ab = b - a;
    let len2 = ab.length_sq();
    if len2 <= f32::EPSILON {
        return p.distance(a);
    }
    let t = ((p - a).dot(ab) / len2).clamp(0.0, 1.0);
    p.distance(a + ab * t)
}

fn inside_polygon(p: Pos2, poly: &[Pos2]) -> bool {
    let mut odd = false;
    let n = poly.len();
    if n < 3 {
        return false;
    }
    let mut j = n - 1;
    for i in 0..n {
        let (a, b) = (poly[i], poly[j]);
        if (a.y > p.y) != (b.y > p.y) && p.x < (b.x - a.x) * (p.y - a.y) / (b.y - a.y) + a.x {
            odd = !odd;
        }
        j = i;
    }
    odd
}

fn anchor(a: Anchor) -> Align2 {
    match a {
        Anchor::Center => Align2::CENTER_CENTER,
        Anchor::Left => Align2::LEFT_CENTER,
        Anchor::Right => Align2::RIGHT_CENTER,
    }
}

/// Draws `scene` fitted into the available space and hit-tests the pointer.
pub fn show(ui: &mut egui::Ui, scene: &Scene, opts: &PaintOptions) -> SceneResponse {
    let avail = opts.size.unwrap_or_else(|| ui.available_size());
    let sw = scene.width.max(1.0);
    let sh = scene.height.max(1.0);
    let scale = (avail.x / sw)
        .min(avail.y / sh)
        .min(opts.max_scale)
        .max(0.05);
    let (rect, response) =
        ui.allocate_exact_size(Vec2::new(sw * scale, sh * scale), Sense::click_and_drag());
    let origin = rect.min;
    let geometry = screen_geometry(scene, origin, scale);
    let hovered = match response.hover_pos() {
        Some(p) => tags_at(p, scene, &geometry, scale),
        None => Vec::new(),
    };
    let clicked = if response.clicked() {
        hovered.clone()
    } else {
        Vec::new()
    };
    let painter = ui.painter_at(rect.expand(2.0));
    painter.rect_filled(rect, 0.0, color(scene.background));
    let halo = ui.visuals().text_color().gamma_multiply(0.35);
    paint_scene(&painter, scene, &geometry, opts, scale, halo, origin);
    SceneResponse {
        response,
        hovered,
        clicked,
        scale,
    }
}

/// The screen geometry of every item of `scene`, drawn from `origin` at `scale`.
fn screen_geometry(scene: &Scene, origin: Pos2, scale: f32) -> Vec<Geometry> {
    let map = |p: Pt| Pos2::new(origin.x + p.x * scale, origin.y + p.y * scale);
    scene
        .items
        .iter()
        .map(|item| match &item.kind {
            ItemKind::Path { cmds, .. } => Geometry::Lines(flatten(cmds, map)),
            ItemKind::Circle { center, radius, .. } => {
                Geometry::Circle(map(*center), radius * scale)
            }
            ItemKind::Text { .. } => Geometry::Text,
        })
        .collect()
}

/// The tags of the items under `p`, topmost first, each once (untagged items and labels never).
fn tags_at(p: Pos2, scene: &Scene, geometry: &[Geometry], scale: f32) -> Vec<Tag> {
    let mut hovered = Vec::new();
    for (item, geo) in scene.items.iter().zip(geometry).rev() {
        if matches!(item.tag, Tag::None | Tag::Label) || hovered.contains(&item.tag) {
            continue;
        }
        if hits(p, item, geo, scale) {
            hovered.push(item.tag);
        }
    }
    hovered
}

/// Whether `p` is on the item: inside a filled path, near a stroked one
/// (at least 4 points), or within 3 points of a circle.
fn hits(p: Pos2, item: &Item, geo: &Geometry, scale: f32) -> bool {
    match (geo, &item.kind) {
        (Geometry::Lines(lines), ItemKind::Path { stroke, fill, .. }) => {
            let tol = stroke.map_or(0.0, |s| s.width * scale / 2.0).max(4.0);
            let near = |l: &Vec<Pos2>| {
                l.windows(2)
                    .any(|s| distance_to_segment(p, s[0], s[1]) <= tol)
            };
            (fill.is_some() && lines.iter().any(|l| inside_polygon(p, l)))
                || (stroke.is_some() && lines.iter().any(near))
        }
        (Geometry::Circle(c, r), _) => p.distance(*c) <= r + 3.0,
        _ => false,
    }
}

/// How much wider a highlighted item is drawn.
const WIDEN: f32 = 1.6;

/// The halo around a highlighted item, in figure units (4 points on a canvas
/// at 3 points per unit).
const HALO: f32 = 4.0 / 3.0;

/// `scene` as the canvas paints it with the items tagged in `highlight`
/// emphasised: those items moved to the end, their lines and circles
/// [`WIDEN`] times wider, each over a halo of `halo`. With nothing to
/// highlight the scene is returned as it is.
pub fn with_highlight(scene: &Scene, highlight: &[Tag], halo: figure::Color) -> Scene {
    let lit = |item: &Item| highlight.contains(&item.tag) && !matches!(item.tag, Tag::None);
    let mut out = Scene::new(scene.width, scene.height, scene.background);
    out.items = scene.items.iter().filter(|i| !lit(i)).cloned().collect();
    for item in scene.items.iter().filter(|i| lit(i)) {
        match &item.kind {
            ItemKind::Path { cmds, stroke, fill } => {
                let wide = stroke.map(|s| figure::Stroke {
                    width: s.width * WIDEN,
                    ..s
                });
                if let Some(s) = wide {
                    out.push(
                        ItemKind::Path {
                            cmds: cmds.clone(),
                            stroke: Some(figure::Stroke {
                                width: s.width + HALO,
                                color: halo,
                            }),
                            fill: None,
                        },
                        item.tag,
                    );
                }
                out.push(
                    ItemKind::Path {
                        cmds: cmds.clone(),
                        stroke: wide,
                        fill: *fill,
                    },
                    item.tag,
                );
            }
            ItemKind::Circle {
                center,
                radius,
                stroke,
                fill,
            } => {
                out.push(
                    ItemKind::Circle {
                        center: *center,
                        radius: radius * WIDEN + HALO / 2.0,
                        stroke: None,
                        fill: Some(halo),
                    },
                    item.tag,
                );
                out.push(
                    ItemKind::Circle {
                        center: *center,
                        radius: radius * WIDEN,
                        stroke: *stroke,
                        fill: *fill,
                    },
                    item.tag,
                );
            }
            ItemKind::Text { .. } => out.items.push(item.clone()),
        }
    }
    out
}

/// The halo colour of a figure drawn in `look`: its ink, faint (as the
/// canvas's halo is the text colour, faint).
pub fn halo_color(look: &crate::figure::look::Look) -> figure::Color {
    figure::Color {
        a: 89,
        ..look.ink()
    }
}

/// Paints the items in order, those with a highlighted tag last, wider and with a halo.
fn paint_scene(
    painter: &egui::Painter,
    scene: &Scene,
    geometry: &[Geometry],
    opts: &PaintOptions,
    scale: f32,
    halo: Color32,
    origin: Pos2,
) {
    let mut emphasised = Vec::new();
    for (k, (item, geo)) in scene.items.iter().zip(geometry).enumerate() {
        if opts.highlight.contains(&item.tag) && !matches!(item.tag, Tag::None) {
            emphasised.push(k);
            continue;
        }
        paint_item(painter, item, geo, scale, 1.0, None, origin);
    }
    for k in emphasised {
        paint_item(
            painter,
            &scene.items[k],
            &geometry[k],
            scale,
            WIDEN,
            Some(halo),
            origin,
        );
    }
}

fn paint_item(
    painter: &egui::Painter,
    item: &Item,
    geo: &Geometry,
    scale: f32,
    widen: f32,
    halo: Option<Color32>,
    origin: Pos2,
) {
    match (&item.kind, geo) {
        (ItemKind::Path { stroke, fill, .. }, Geometry::Lines(lines)) => {
            if let Some(f) = fill {
                for l in lines {
                    painter.add(Shape::convex_polygon(l.clone(), color(*f), Stroke::NONE));
                }
            }
            if let Some(s) = stroke {
                let width = (s.width * scale * widen).max(1.0);
                for l in lines {
                    if let Some(h) = halo {
                        painter.add(Shape::line(l.clone(), Stroke::new(width + 4.0, h)));
                    }
                    painter.add(Shape::line(l.clone(), Stroke::new(width, color(s.color))));
                }
            }
        }
        (ItemKind::Circle { stroke, fill, .. }, Geometry::Circle(c, r)) => {
            if let Some(h) = halo {
                painter.circle_filled(*c, r * widen + 2.0, h);
            }
            if let Some(f) = fill {
                painter.circle_filled(*c, r * widen, color(*f));
            }
            if let Some(s) = stroke {
                painter.circle_stroke(
                    *c,
                    r * widen,
                    Stroke::new((s.width * scale).max(1.0), color(s.color)),
                );
            }
        }
        (
            ItemKind::Text {
                pos,
                text,
                size,
                color: c,
                anchor: a,
            },
            _,
        ) => {
            let screen = Pos2::new(origin.x + pos.x * scale, origin.y + pos.y * scale);
            super::typeset::paint_label(
                painter,
                screen,
                anchor(*a),
                text,
                FontId::proportional((size * scale).max(6.0)),
                color(*c),
            );
        }
        _ => {}
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::figure::look::Look;
    use crate::figure::wiring::wiring_scene;

    #[test]
    fn a_baked_highlight_draws_the_lit_items_last_over_a_halo() {
        let look = Look::light();
        let scene = wiring_scene(&[1, 2, 1], 3, &look, Some(1));
        assert_eq!(with_highlight(&scene, &[], halo_color(&look)), scene);
        let lit = with_highlight(&scene, &[Tag::Crossing(1)], halo_color(&look));
        // one crossing marker: a halo and the marker itself, both at the end
        assert_eq!(lit.items.len(), scene.items.len() + 1);
        let tail: Vec<&Item> = lit.items.iter().rev().take(2).collect();
        assert!(tail.iter().all(|i| i.tag == Tag::Crossing(1)));
        let radius = |i: &Item| match i.kind {
            ItemKind::Circle { radius, .. } => radius,
            _ => 0.0,
        };
        let before = scene
            .items
            .iter()
            .find(|i| i.tag == Tag::Crossing(1))
            .map(radius)
            .unwrap_or(0.0);
        assert!((radius(tail[0]) - before * WIDEN).abs() < 1e-4);
        assert!(radius(tail[1]) > radius(tail[0]));
    }
}
