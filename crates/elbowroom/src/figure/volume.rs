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

/// The step between ticks for values spread over `span`: 1, 2 or 5 times a
/// power of ten, the smallest giving at most `ticks` intervals (so that each
/// tick keeps room for its label).
pub fn tick_step(span: f64, ticks: usize) -> f64 {
    if !(span.is_finite() && span > 0.0) {
        return 1.0;
    }
    let raw = span / ticks.max(1) as f64;
    let power = 10f64.powf(raw.log10().floor());
    [1.0, 2.0, 5.0, 10.0]
        .into_iter()
        .map(|m| m * power)
        .find(|s| *s >= raw * (1.0 - 1e-12))
        .unwrap_or(10.0 * power)
}

/// A tick value written with as many decimals as a step of [`tick_step`]
/// needs (`5`, `2.5`, `0.02`).
pub fn tick_text(v: f64, step: f64) -> String {
    let decimals = if step >= 1.0 {
        0
    } else {
        (-step.log10()).ceil().clamp(0.0, 12.0) as usize
    };
    format!("{v:.decimals$}")
}

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
    }
    // the volume axis at 1, 2 or 5 times a power of ten, at most four intervals
    let step = tick_step(ymax, 4);
    let mut k = 0u32;
    while f64::from(k) * step <= ymax * (1.0 + 1e-9) && k <= 10 {
        let v = f64::from(k) * step;
        text(
            &mut scene,
            Pt::new(LEFT - 6.0, py(v)),
            tick_text(v, step),
            Anchor::Right,
        );
        k += 1;
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
    fn volume_ticks_are_round_numbers() {
        // the regular permutohedron of n = 4 has volume 4^2 = 16 (Postnikov 2009):
        // ticks 0, 5, 10, 15
        let s: Vec<(f64, f64)> = (0..=4)
            .map(|k| (k as f64 / 4.0, 16.0 * (k * k) as f64 / 16.0))
            .collect();
        let scene = volume_plot_scene(&s, &Look::light());
        let right: Vec<String> = scene
            .items
            .iter()
            .filter_map(|i| match &i.kind {
                ItemKind::Text {
                    text,
                    anchor: Anchor::Right,
                    ..
                } => Some(text.clone()),
                _ => None,
            })
            .collect();
        assert_eq!(right, ["0", "5", "10", "15"]);
        assert_eq!(tick_text(0.4, 0.2), "0.4");
        assert_eq!(tick_text(0.02, 0.02), "0.02");
        assert_eq!(tick_text(2.5, 0.5), "2.5");
    }

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
