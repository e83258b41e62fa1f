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

/// How many running jobs get a line of their own; the rest are counted.
const JOBS_LISTED: usize = 4;

/// The end of the controls' row: "idle" or how many jobs run, and the frame
/// times. [`rows_ui`] draws the rows below it.
pub fn ui(ui: &mut egui::Ui, engine: &Engine, times: &FrameTimes) {
    let running = engine.running();
    if running.is_empty() {
        ui.weak("idle");
    } else {
        let live = running.iter().filter(|r| !r.progress.is_canceled()).count();
        ui.label(match (running.len(), live) {
            (1, 1) => "1 job running".to_string(),
            (k, l) if l == k => format!("{k} jobs running"),
            (k, l) => format!("{k} jobs running ({} stopping)", k - l),
        });
    }
    let dt = ui.input(|i| i.unstable_dt) * 1e3;
    if let Some((median, max)) = times.summary() {
        ui.separator();
        ui.weak(format!(
            "frame: build {median:.1} ms median, {max:.1} ms max; interval {dt:.0} ms"
        ))
        .on_hover_text("time spent building the last 240 frames on the UI thread");
    }
}

/// The rows below the controls: one per running job (cancel, progress,
/// label with seconds), then the last message on a wrapping line of its own,
/// so that no text is drawn over another.
pub fn rows_ui(ui: &mut egui::Ui, engine: &Engine, message: &mut Option<String>) {
    let running = engine.running();
    for job in running.iter().take(JOBS_LISTED) {
        ui.horizontal(|ui| {
            let canceled = job.progress.is_canceled();
            if canceled {
                ui.weak("stopping");
            } else if ui
                .small_button("cancel")
                .on_hover_text("stop this computation")
                .clicked()
            {
                job.progress.cancel();
            }
            ui.add(
                egui::ProgressBar::new(job.progress.fraction())
                    .desired_width(120.0)
                    .show_percentage(),
            );
            let secs = job.started.elapsed().as_secs_f32();
            ui.add(
                egui::Label::new(format!(
                    "{} ({})",
                    job.label,
                    super::views::elapsed_text(secs)
                ))
                .truncate(),
            );
        });
    }
    if running.len() > JOBS_LISTED {
        ui.weak(format!("and {} more", running.len() - JOBS_LISTED));
    }
    if let Some(text) = message.clone() {
        ui.horizontal(|ui| {
            if ui.small_button("dismiss").clicked() {
                *message = None;
            }
            let color = if is_notice(&text) {
                ui.visuals().text_color()
            } else {
                super::theme::alert()
            };
            ui.add(egui::Label::new(egui::RichText::new(text).color(color)).wrap());
        });
    }
}

/// Whether a message reports something done rather than something wrong
/// (shown in the text colour, not the alert colour).
pub fn is_notice(text: &str) -> bool {
    ["saved ", "exported ", "wrote ", "opened ", "loaded "]
        .iter()
        .any(|p| text.starts_with(p))
}
