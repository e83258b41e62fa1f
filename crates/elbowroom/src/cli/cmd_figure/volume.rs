//! `figure volume`: Vol P_λ along the segment λ(t) = (1 - t)a + tb, plotted.

use super::Figure;
use crate::cli::args::FigureArgs;
use crate::cli::error::CliError;
use crate::cli::inputs::check_volume_size;
use crate::cli::interrupt;
use crate::figure::look::Look;
use crate::figure::volume::volume_plot_scene;
use crate::math::Progress;
use crate::math::permutohedra::permutohedron::Permutohedron;
use crate::math::permutohedra::permutohedron::rational_to_f64;
use crate::math::permutohedra::segment::volume_along_segment;
use std::sync::Arc;

/// The most intervals `--samples` takes.
const MAX_SAMPLES: usize = 400;

/// The one plot, for `--from A --to B [--samples M]`.
pub fn plot(args: &FigureArgs, look: &Look) -> Result<Vec<Figure>, CliError> {
    let (Some(a), Some(b)) = (&args.from, &args.to) else {
        return Err(CliError::Input(
            "figure volume needs --from and --to, for example --from 1,1,0,0 --to 3,2,1,0".into(),
        ));
    };
    if args.samples == 0 || args.samples > MAX_SAMPLES {
        return Err(CliError::Input(format!(
            "--samples {} is out of range; use 1 to {MAX_SAMPLES}",
            args.samples
        )));
    }
    let (a, b) = (a.clone(), b.clone());
    if a.len() != b.len() {
        return Err(CliError::Input(format!(
            "--from has {} entries and --to has {}; the two ends of the segment need the same number",
            a.len(),
            b.len()
        )));
    }
    if let (Ok(pa), Ok(pb)) = (Permutohedron::new(&a), Permutohedron::new(&b)) {
        // the points (1 − t)A + tB, t = k/M, have both ends and M in their digits
        let n = a.len() as u64;
        let extra =
            pb.volume_digit_estimate() + n.saturating_sub(1) * (args.samples.ilog10() as u64 + 1);
        check_volume_size(&pa, extra, "the volume along the segment")?;
    }
    // exact volumes, converted to floats only for drawing; Ctrl-C stops between samples
    let progress = Arc::new(Progress::new(0));
    let _watch = interrupt::watch(progress.clone());
    let samples = volume_along_segment(&a, &b, args.samples, &progress)?;
    let points: Vec<(f64, f64)> = samples
        .iter()
        .map(|(t, v)| (rational_to_f64(t), rational_to_f64(v)))
        .collect();
    Ok(vec![(
        0,
        args.kind.name().to_string(),
        volume_plot_scene(&points, look),
    )])
}
