//! Synchronous resets written into the logic rather than as a block's leading `if`
//! (`q <= rst ? 8'd0 : d;`, `q <= d & ~rst;`): a register without a reset branch whose next
//! value is a constant while a reset port is active gets that constant as its reset state.
//!
//! Without this, such a register would start at a free value while a simulator, after one
//! clock edge with the reset asserted, holds the constant: a trace could then differ only
//! through an initial value that no reset can give. The reset ports tried are those other
//! registers of the design already reset from, and ports named like a reset (`rst`, `reset`;
//! active low when the name ends in `n`, as in `rst_n`, `rstn`, `reset_n`), the same naming
//! rule as the leading-`if` form. The test is a cofactor by structural hashing: the next value
//! with the port tied to its active value must fold to a constant; anything else stays free,
//! which is the cautious reading.

use super::super::resolve::Resolver;
use crate::aig::{Aig, Lit};
use crate::design::{InputKind, Register, RegisterReset};

/// Whether a signal's name reads as a reset (`rst`, `reset`, any case, anywhere in the last
/// component of a hierarchical name): the one naming rule for resets, used here and for a
/// clocked block's leading `if` (`clocked.rs`).
pub(super) fn is_reset_name(name: &str) -> bool {
    let name = name.to_ascii_lowercase();
    let base = name.rsplit('.').next().unwrap_or(&name);
    base.contains("rst") || base.contains("reset")
}

/// The reset ports to try: (port input, active value), in input order, without repeats.
fn reset_ports(r: &Resolver, regs: &[Register]) -> Vec<(usize, bool)> {
    let mut ports: Vec<(usize, bool)> = Vec::new();
    for g in regs {
        if let Some(rs) = &g.reset {
            if !ports.iter().any(|p| p.0 == rs.input) {
                ports.push((rs.input, rs.active));
            }
        }
    }
    for (k, bit) in r.inputs.iter().enumerate() {
        if !matches!(bit.kind, InputKind::Port) || bit.index.is_some() {
            continue;
        }
        if !is_reset_name(&bit.name) || ports.iter().any(|p| p.0 == k) {
            continue;
        }
        let active_low = bit.name.to_ascii_lowercase().ends_with('n');
        ports.push((k, !active_low));
    }
    ports.sort_unstable();
    ports
}

/// Give registers without a reset the constant their next value takes under an active reset port.
pub(super) fn infer_sync_resets(r: &Resolver, regs: &mut [Register]) {
    for (port, active) in reset_ports(r, regs) {
        let open: Vec<usize> = (0..regs.len())
            .filter(|&i| regs[i].init.is_none() && regs[i].reset.is_none())
            .collect();
        if open.is_empty() {
            return;
        }
        let mut scratch = Aig::new();
        let map: Vec<Lit> = (0..r.design_aig.num_inputs())
            .map(|k| {
                if k == port {
                    if active {
                        Lit::TRUE
                    } else {
                        Lit::FALSE
                    }
                } else {
                    scratch.add_input()
                }
            })
            .collect();
        let roots: Vec<Lit> = open.iter().map(|&i| regs[i].next).collect();
        let under_reset = scratch.import(&r.design_aig, &map, &roots);
        for (&i, &l) in open.iter().zip(&under_reset) {
            if l == Lit::TRUE || l == Lit::FALSE {
                regs[i].init = Some(l == Lit::TRUE);
                regs[i].reset = Some(RegisterReset {
                    input: port,
                    active,
                    asynchronous: false,
                });
            }
        }
    }
}
