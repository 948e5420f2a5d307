//! The memory probe of the command line: resident and peak memory from `/proc/self/status`
//! (Linux), installed into the library's debug log at start (`crate::memory::set_probe`).

use crate::memory::MemoryUse;

/// Resident and peak memory of this process, where `/proc/self/status` reports them.
pub fn proc_status() -> Option<MemoryUse> {
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
