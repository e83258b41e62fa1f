//! The volume of P_λ along a segment λ(t) = (1 - t) λ_a + t λ_b as a figure
//! (axes, ticks, the sampled curve), so that the plot can be exported; the
//! explorer shows the same samples with an interactive plot.

use super::look::Look;
use super::palette::label_color;
use super::scene::{Anchor, ItemKind, PathCmd, Pt, Scene, Stroke, Tag};

const W: f32 = 420.0;
const H: f32 = 260.0;
const LEFT: f32 = 62.0;
const BOTTOM: f32 = 36.0;
const TOP: f32 = 20.0;
const RIGHT: f32 = 16.0;

/// Builds the plot of the samples (t, Vol P_λ(t)), values as floats for drawing.
pub fn volume_plot_scene(samples: &[(f64, f64)], look: &Look) -> Scene {
    let mut scene = Scene::new(W, H, look.background());
    let ymax = samples
        .iter()
        .map(|s| s.1)
        .fold(0.0f64, f64::max)
        .max(1e-12);
    let px = |t: f64| LEFT + (t as f32) * (W - LEFT - RIGHT);
    let py = |v: f64| H - BOTTOM - ((v / ymax) as f32) * (H - BOTTOM - TOP);
    let axis = Stroke {
        width: 1.0,
        color: look.ink(),
    };
    scene.push(
        ItemKind::Path {
            cmds: vec![
                PathCmd::MoveTo(Pt::new(LEFT, TOP)),
                PathCmd::LineTo(Pt::new(LEFT, H - BOTTOM)),
                PathCmd::LineTo(Pt::new(W - RIGHT, H - BOTTOM)),
            ],
            stroke: Some(axis),
            fill: None,
        },
        Tag::None,
    );
    let text = |scene: &mut Scene, pos: Pt, t: String, anchor| {
        scene.label(pos, t, 10.0, look.ink(), anchor);
    };
    for k in 0..=4 {
        let t = k as f64 / 4.0;
        text(
            &mut scene,
            Pt::new(px(t), H - BOTTOM + 12.0),
            format!("{t}"),
            Anchor::Center,
        );
        let v = ymax * t;
        text(
            &mut scene,
            Pt::new(LEFT - 6.0, py(v)),
            format!("{v:.3}"),
            Anchor::Right,
        );
    }
    text(
        &mut scene,
        Pt::new((W + LEFT) / 2.0, H - 8.0),
        "t".into(),
        Anchor::Center,
    );
    text(
        &mut scene,
        Pt::new(LEFT + 6.0, TOP - 8.0),
        "Vol P_λ(t)".into(),
        Anchor::Left,
    );
    let color = label_color(5, 8);
    let cmds = PathCmd::polyline(samples.iter().map(|&(t, v)| Pt::new(px(t), py(v))));
    scene.push(
        ItemKind::Path {
            cmds,
            stroke: Some(Stroke { width: 2.0, color }),
            fill: None,
        },
        Tag::None,
    );
    for (k, &(t, v)) in samples.iter().enumerate() {
        scene.push(
            ItemKind::Circle {
                center: Pt::new(px(t), py(v)),
                radius: 2.5,
                stroke: None,
                fill: Some(color),
            },
            Tag::Vertex(k),
        );
    }
    scene
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn one_marker_per_sample() {
        let s: Vec<(f64, f64)> = (0..=8).map(|k| (k as f64 / 8.0, (k * k) as f64)).collect();
        let scene = volume_plot_scene(&s, &Look::light());
        let marks = scene
            .items
            .iter()
            .filter(|i| matches!(i.tag, Tag::Vertex(_)))
            .count();
        assert_eq!(marks, 9);
    }
}
