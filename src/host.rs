//! What the library asks of the program that hosts it. The library itself touches no
//! standard stream and reads no operating-system file: the command line installs a memory
//! probe ([`set_memory_probe`], asked by the engine's debug log and its memory figure) and a
//! place to draw progress lines ([`set_progress_target`]); without them, as in tests, the
//! figures are "not measured" and no progress is drawn.

use indicatif::{ProgressBar, ProgressDrawTarget, ProgressStyle};
use std::sync::OnceLock;
use std::time::Duration;

/// Resident memory of the process.
#[derive(Copy, Clone, Debug, PartialEq, Eq)]
pub struct MemoryUse {
    /// Resident set size now, in bytes.
    pub resident_bytes: u64,
    /// Peak resident set size so far, in bytes.
    pub peak_bytes: u64,
}

/// A function reporting the process's memory, where the system tells it.
pub type MemoryProbe = fn() -> Option<MemoryUse>;

/// Where progress lines go: a draw target, or `None` for none (e.g. standard error is not a
/// terminal).
pub type ProgressTarget = fn() -> Option<ProgressDrawTarget>;

static PROBE: OnceLock<MemoryProbe> = OnceLock::new();
static PROGRESS: OnceLock<ProgressTarget> = OnceLock::new();

/// Install the memory probe (the first call wins).
pub fn set_memory_probe(probe: MemoryProbe) {
    let _ = PROBE.set(probe);
}

/// Install where progress lines are drawn (the first call wins).
pub fn set_progress_target(target: ProgressTarget) {
    let _ = PROGRESS.set(target);
}

/// Where to draw a progress line now, if anywhere.
pub(crate) fn progress_target() -> Option<ProgressDrawTarget> {
    PROGRESS.get().and_then(|target| target())
}

/// A bar of `len` steps counted in `unit` (`{msg} [====>   ] 12/40 unit`), drawn where the
/// host draws progress when `enabled`; a hidden bar otherwise (its calls then cost nothing).
pub(crate) fn counted_bar(enabled: bool, what: &str, unit: &str, len: u64) -> ProgressBar {
    let Some(target) = enabled.then(progress_target).flatten() else {
        return ProgressBar::hidden();
    };
    let bar = ProgressBar::with_draw_target(Some(len), target).with_message(what.to_string());
    let template = format!("{{msg}} [{{bar:40}}] {{pos}}/{{len}} {unit} ({{eta}} left)");
    match ProgressStyle::with_template(&template) {
        Ok(style) => bar.with_style(style.progress_chars("=> ")),
        Err(_) => bar,
    }
}

/// A spinner with the time so far and `what` (a phase: `reading ...`, `writing ...`), drawn
/// where the host draws progress when `enabled`; change the phase with `set_message` and
/// remove it with `finish_and_clear`.
pub(crate) fn spinner(enabled: bool, what: &str) -> ProgressBar {
    let Some(target) = enabled.then(progress_target).flatten() else {
        return ProgressBar::hidden();
    };
    let bar = ProgressBar::with_draw_target(None, target).with_message(what.to_string());
    if let Ok(style) = ProgressStyle::with_template("{spinner} {elapsed} {msg}") {
        bar.set_style(style);
    }
    bar.enable_steady_tick(Duration::from_millis(200));
    bar
}

/// The process's memory now, when a probe is installed and the system reports it.
pub(crate) fn measure() -> Option<MemoryUse> {
    PROBE.get().and_then(|probe| probe())
}

/// Current and peak resident memory in MiB, for the debug log of each phase.
pub(crate) fn now_note() -> String {
    match measure() {
        Some(m) => format!(
            "{} MiB resident, {} MiB peak",
            m.resident_bytes >> 20,
            m.peak_bytes >> 20
        ),
        None => "not measured".to_string(),
    }
}

/// Peak resident memory and per node of a graph of `nodes` nodes, for the debug log.
pub(crate) fn peak_note(nodes: usize) -> String {
    match measure() {
        Some(m) => format!(
            "{:.1} MiB, {:.1} bytes per shared AIG node ({} nodes)",
            m.peak_bytes as f64 / (1u64 << 20) as f64,
            m.peak_bytes as f64 / nodes.max(1) as f64,
            nodes
        ),
        None => "not measured".to_string(),
    }
}
