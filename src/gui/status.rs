//! The status line: running jobs with their progress and a cancel control, the
//! last error, and how long the last frames took to build.

use crate::engine::Engine;
use eframe::egui;
use std::collections::VecDeque;
use std::time::Duration;

/// Timings of recent frames.
#[derive(Default)]
pub struct FrameTimes {
    build: VecDeque<Duration>,
}

impl FrameTimes {
    /// Records how long building one frame took.
    pub fn record(&mut self, d: Duration) {
        self.build.push_back(d);
        if self.build.len() > 240 {
            self.build.pop_front();
        }
    }

    /// Median and maximum build time of the recent frames, in milliseconds.
    pub fn summary(&self) -> Option<(f32, f32)> {
        if self.build.is_empty() {
            return None;
        }
        let mut v: Vec<f32> = self.build.iter().map(|d| d.as_secs_f32() * 1e3).collect();
        v.sort_by(f32::total_cmp);
        Some((v[v.len() / 2], v[v.len() - 1]))
    }
}

/// Draws the status line.
pub fn ui(ui: &mut egui::Ui, engine: &Engine, message: &mut Option<String>, times: &FrameTimes) {
    ui.horizontal(|ui| {
        let running = engine.running();
        if running.is_empty() {
            ui.weak("idle");
        }
        for job in running.iter().take(3) {
            ui.label(&job.label);
            let frac = job.progress.fraction();
            ui.add(
                egui::ProgressBar::new(frac)
                    .desired_width(120.0)
                    .show_percentage(),
            );
            if ui
                .small_button("cancel")
                .on_hover_text("stop this computation")
                .clicked()
            {
                job.progress.cancel();
            }
            ui.separator();
        }
        if running.len() > 3 {
            ui.weak(format!("and {} more", running.len() - 3));
        }
        if let Some(text) = message.clone() {
            ui.colored_label(super::theme::alert(), text);
            if ui.small_button("dismiss").clicked() {
                *message = None;
            }
        }
        ui.with_layout(egui::Layout::right_to_left(egui::Align::Center), |ui| {
            let dt = ui.input(|i| i.unstable_dt) * 1e3;
            if let Some((median, max)) = times.summary() {
                ui.weak(format!(
                    "frame: build {median:.1} ms median, {max:.1} ms max; interval {dt:.0} ms"
                ))
                .on_hover_text("time spent building the last 240 frames on the UI thread");
            }
        });
    });
}
