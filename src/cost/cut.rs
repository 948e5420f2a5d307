//! The state cut of a clocked design for `stats`: register outputs are already inputs of the
//! logic; this adds each register's input (its next value) as an output row named
//! `next(REG)`, so the cost, delay and depth of the logic that loads every register stand
//! beside the lower bounds its support implies, as for ports.

use crate::design::{Design, OutputBit};

/// The row name of a register's input.
pub fn register_input_name(register: &str) -> String {
    format!("next({register})")
}

/// `d` with one output per register bit (its next value, after the ports' outputs), and the
/// number of such rows; the netlist as written gains the signals that load the registers, or,
/// when the front-end does not name them, is marked partial (the AIG columns stand).
pub fn state_cut(d: &Design) -> (Design, usize) {
    let mut cut = d.clone();
    for r in &d.registers {
        let name = register_input_name(&r.name);
        let mut bit = OutputBit::new(&name, None, r.next, r.pos.clone());
        bit.name = name;
        cut.outputs.push(bit);
    }
    if let Some(n) = &mut cut.netlist {
        if n.register_inputs.len() == d.registers.len() && n.outputs.len() == d.outputs.len() {
            let loads = n.register_inputs.clone();
            n.outputs.extend(loads);
        } else {
            n.complete = false;
        }
    }
    (cut, d.registers.len())
}
