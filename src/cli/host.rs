//! What the command line gives the library (`crate::host`): resident and peak memory from
//! `/proc/self/status` (Linux), and standard error for progress lines when it is a terminal.

use crate::host::MemoryUse;
use indicatif::ProgressDrawTarget;
use std::io::IsTerminal;

/// Install both into the library.
pub fn install() {
    crate::host::set_memory_probe(proc_status);
    crate::host::set_progress_target(stderr_if_terminal);
}

/// Standard error, redrawn at most 5 times a second, when it is a terminal.
fn stderr_if_terminal() -> Option<ProgressDrawTarget> {
    std::io::stderr()
        .is_terminal()
        .then(|| ProgressDrawTarget::stderr_with_hz(5))
}

/// Resident and peak memory of this process, where `/proc/self/status` reports them.
fn proc_status() -> Option<MemoryUse> {
    let status = std::fs::read_to_string("/proc/self/status").ok()?;
    let kib = |field: &str| -> Option<u64> {
        let line = status.lines().find(|l| l.starts_with(field))?;
        line.split_whitespace().nth(1)?.parse().ok()
    };
    Some(MemoryUse {
        resident_bytes: kib("VmRSS:")? * 1024,
        peak_bytes: kib("VmHWM:")? * 1024,
    })
}
