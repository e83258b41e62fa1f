//! The wiring diagram of a word a_1 ... a_l: n horizontal wires at heights
//! 1..n (top to bottom); the k-th letter a crosses the wires at heights a and
//! a + 1. Each wire is one path, coloured by the value it carries (wire p
//! starts at height p, so at the right end height i carries w(i)); each
//! crossing gets a marker tagged `Crossing(k)`.

use super::look::Look;
use super::palette::label_color;
use super::scene::{Anchor, ItemKind, PathCmd, Pt, Scene, Stroke, Tag};

const STEP: f32 = 30.0;
const GAP: f32 = 24.0;
const MARGIN: f32 = 26.0;

/// Builds the wiring diagram of `word` in S_n, marking crossing `selected`.
pub fn wiring_scene(word: &[usize], n: usize, look: &Look, selected: Option<usize>) -> Scene {
    let l = word.len();
    let width = 2.0 * MARGIN + (l as f32 + 1.0) * STEP;
    let height = 2.0 * MARGIN + (n.max(1) as f32 - 1.0) * GAP;
    let mut scene = Scene::new(width, height, look.background());
    let (paths, wire_at) = wires(word, n, width);
    for (wire, cmds) in paths.into_iter().enumerate().skip(1) {
        scene.push(
            ItemKind::Path {
                cmds,
                stroke: Some(Stroke {
                    width: 3.2,
                    color: label_color(wire, n),
                }),
                fill: None,
            },
            Tag::Pipe(wire),
        );
    }
    crossings(&mut scene, word, n, height, look, selected);
    if look.labels {
        end_labels(&mut scene, &wire_at, width, look);
    }
    scene
}

/// The height of wire level h (1 at the top).
fn y(h: usize) -> f32 {
    MARGIN + (h as f32 - 1.0) * GAP
}

/// Where the k-th letter's crossing starts.
fn x(k: usize) -> f32 {
    MARGIN + STEP * 0.5 + k as f32 * STEP
}

/// The path of each wire (indexed by its starting height; index 0 unused) and,
/// at the right end, the wire at each height.
fn wires(word: &[usize], n: usize, width: f32) -> (Vec<Vec<PathCmd>>, Vec<usize>) {
    // wire_at[h] = the wire (its starting height) at height h
    let mut wire_at: Vec<usize> = (0..=n).collect();
    let mut paths: Vec<Vec<PathCmd>> = (0..=n)
        .map(|h| vec![PathCmd::MoveTo(Pt::new(MARGIN, y(h.max(1))))])
        .collect();
    for (k, &a) in word.iter().enumerate() {
        if a == 0 || a >= n {
            continue;
        }
        let (x0, x1) = (x(k), x(k) + STEP);
        for (h, &wire) in wire_at.iter().enumerate().skip(1) {
            let target = if h == a {
                a + 1
            } else if h == a + 1 {
                a
            } else {
                h
            };
            let path = &mut paths[wire];
            path.push(PathCmd::LineTo(Pt::new(x0, y(h))));
            if target == h {
                path.push(PathCmd::LineTo(Pt::new(x1, y(h))));
            } else {
                let mid = (x0 + x1) / 2.0;
                path.push(PathCmd::CubicTo(
                    Pt::new(mid, y(h)),
                    Pt::new(mid, y(target)),
                    Pt::new(x1, y(target)),
                ));
            }
        }
        wire_at.swap(a, a + 1);
    }
    let end = width - MARGIN;
    for (h, &wire) in wire_at.iter().enumerate().skip(1) {
        paths[wire].push(PathCmd::LineTo(Pt::new(end, y(h))));
    }
    (paths, wire_at)
}

/// A marker per crossing, tagged `Crossing(k)`, and its letter under the diagram.
fn crossings(
    scene: &mut Scene,
    word: &[usize],
    n: usize,
    height: f32,
    look: &Look,
    selected: Option<usize>,
) {
    for (k, &a) in word.iter().enumerate() {
        if a == 0 || a >= n {
            continue;
        }
        let centre = Pt::new(x(k) + STEP / 2.0, (y(a) + y(a + 1)) / 2.0);
        let chosen = selected == Some(k);
        scene.push(
            ItemKind::Circle {
                center: centre,
                radius: GAP * 0.32,
                stroke: Some(Stroke {
                    width: if chosen { 2.0 } else { 0.8 },
                    color: if chosen { look.ink() } else { look.grid() },
                }),
                fill: None,
            },
            Tag::Crossing(k),
        );
        if look.labels {
            scene.label(
                Pt::new(centre.x, height - MARGIN * 0.35),
                a.to_string(),
                11.0,
                if chosen { look.ink() } else { look.grid() },
                Anchor::Center,
            );
        }
    }
}

/// The heights at the left end and the wires arriving at the right end.
fn end_labels(scene: &mut Scene, wire_at: &[usize], width: f32, look: &Look) {
    let end = width - MARGIN;
    for (h, &wire) in wire_at.iter().enumerate().skip(1) {
        scene.label(
            Pt::new(MARGIN - 8.0, y(h)),
            h.to_string(),
            11.0,
            look.ink(),
            Anchor::Right,
        );
        scene.label(
            Pt::new(end + 8.0, y(h)),
            wire.to_string(),
            11.0,
            look.ink(),
            Anchor::Left,
        );
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::math::Perm;

    #[test]
    fn wires_end_at_the_one_line_values() {
        // 1 3 2 3 is a word of 2431: at the right end, height i carries w(i)
        let word = [1, 3, 2, 3];
        let w = Perm::from_word(&word, Some(4)).unwrap();
        let scene = wiring_scene(&word, 4, &Look::light(), Some(2));
        let right: Vec<String> = scene
            .items
            .iter()
            .filter_map(|i| match &i.kind {
                ItemKind::Text {
                    text,
                    anchor: Anchor::Left,
                    ..
                } => Some(text.clone()),
                _ => None,
            })
            .collect();
        let expect: Vec<String> = w.one_line().iter().map(|v| v.to_string()).collect();
        assert_eq!(right, expect);
        let crossings = scene
            .items
            .iter()
            .filter(|i| matches!(i.tag, Tag::Crossing(_)))
            .count();
        assert_eq!(crossings, 4);
    }
}
