//! The progress line of a proof run (candidate classes left, node pairs proved, output pairs
//! done), drawn with `indicatif` where the host says (`crate::host`) and only when the caller
//! asks for it; counters are atomic so that every worker thread can update them.

use indicatif::{ProgressBar, ProgressStyle};
use std::sync::atomic::{AtomicI64, AtomicUsize, Ordering};
use std::time::Duration;

/// Shared progress counters and the optional line that shows them.
pub(crate) struct Progress {
    bar: Option<ProgressBar>,
    classes: AtomicI64,
    proved: AtomicUsize,
    done: AtomicUsize,
    total: usize,
}

impl Progress {
    /// Counters for `total` output pairs; a line where the host draws progress when `show`.
    pub(crate) fn new(show: bool, total: usize) -> Progress {
        let target = show.then(crate::host::progress_target).flatten();
        let bar = target.map(|target| {
            let b = ProgressBar::with_draw_target(None, target);
            b.set_style(
                ProgressStyle::with_template("{spinner} {elapsed} {msg}")
                    .unwrap_or_else(|_| ProgressStyle::default_spinner()),
            );
            b.enable_steady_tick(Duration::from_millis(200));
            b
        });
        let p = Progress {
            bar,
            classes: AtomicI64::new(0),
            proved: AtomicUsize::new(0),
            done: AtomicUsize::new(0),
            total,
        };
        p.redraw();
        p
    }

    fn redraw(&self) {
        if let Some(b) = &self.bar {
            b.set_message(format!(
                "classes left {}, node pairs proved {}, output pairs done {}/{}",
                self.classes.load(Ordering::Relaxed).max(0),
                self.proved.load(Ordering::Relaxed),
                self.done.load(Ordering::Relaxed),
                self.total
            ));
        }
    }

    /// Candidate classes appeared (positive) or went away (negative).
    pub(crate) fn add_classes(&self, delta: i64) {
        self.classes.fetch_add(delta, Ordering::Relaxed);
        self.redraw();
    }

    /// Node pairs proved and merged.
    pub(crate) fn proved(&self, k: usize) {
        let n = self.proved.fetch_add(k, Ordering::Relaxed) + k;
        if n.is_multiple_of(256) {
            self.redraw();
        }
    }

    /// Output pairs decided.
    pub(crate) fn outputs_done(&self, k: usize) {
        if k > 0 {
            self.done.fetch_add(k, Ordering::Relaxed);
            self.redraw();
        }
    }

    /// Remove the line.
    pub(crate) fn finish(&self) {
        if let Some(b) = &self.bar {
            b.finish_and_clear();
        }
    }
}
