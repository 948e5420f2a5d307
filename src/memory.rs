//! Memory figures for the debug log. The library reads no operating-system files: the
//! command line installs a probe ([`set_probe`]) that reports the process's resident memory,
//! and the engine's debug lines ask it; without one they say the figure is not measured.

use std::sync::OnceLock;

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

static PROBE: OnceLock<MemoryProbe> = OnceLock::new();

/// Install the probe the debug log asks (the first call wins).
pub fn set_probe(probe: MemoryProbe) {
    let _ = PROBE.set(probe);
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
