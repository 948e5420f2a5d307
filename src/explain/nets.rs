//! Values of the internal nets of a design's netlist as written, for one input vector: each
//! gate is evaluated from its inputs (an explicit stack, no recursion on depth). Only nets that
//! follow from the port inputs through gates get a value; the values are used only when every
//! output the netlist reaches agrees with the design's own evaluation.

use crate::design::{CellKind, Design, Netlist};

/// Every netlist signal's value under `inputs` (one per design input), `None` where it does
/// not follow from the inputs through gates; `None` overall when there is no netlist or an
/// output the netlist computes disagrees with the design's evaluation.
pub fn net_values(d: &Design, inputs: &[bool]) -> Option<Vec<Option<bool>>> {
    let nl = d.netlist.as_ref()?;
    let mut val: Vec<Option<bool>> = vec![None; nl.signals.len()];
    for &s in &nl.inputs {
        if let Some(k) = d.input_index(&nl.signals[s as usize]) {
            val[s as usize] = Some(inputs[k]);
        }
    }
    let driver = drivers(nl);
    // 0: not visited, 1: on the stack, 2: done.
    let mut state = vec![0u8; nl.signals.len()];
    for s in 0..nl.signals.len() {
        if state[s] != 0 {
            continue;
        }
        let mut stack = vec![s as u32];
        while let Some(&t) = stack.last() {
            let t = t as usize;
            if state[t] == 2 {
                stack.pop();
                continue;
            }
            let Some(ci) = driver[t] else {
                state[t] = 2;
                stack.pop();
                continue;
            };
            let cell = &nl.cells[ci as usize];
            if state[t] == 0 {
                state[t] = 1;
                for &i in &cell.inputs {
                    if state[i as usize] == 0 {
                        stack.push(i);
                    }
                }
                continue;
            }
            // All inputs are done (or on the stack: a loop, left unknown).
            let ins: Option<Vec<bool>> = cell.inputs.iter().map(|&i| val[i as usize]).collect();
            val[t] = ins.map(|v| gate(cell.kind, &v));
            state[t] = 2;
            stack.pop();
        }
    }
    let outs = d.eval(inputs);
    if nl.outputs.len() == d.outputs.len() {
        for (&s, &o) in nl.outputs.iter().zip(&outs) {
            if val[s as usize].is_some_and(|v| v != o) {
                return None;
            }
        }
    }
    Some(val)
}

/// The driving cell of each signal.
pub fn drivers(nl: &Netlist) -> Vec<Option<u32>> {
    let mut driver = vec![None; nl.signals.len()];
    for (i, c) in nl.cells.iter().enumerate() {
        driver[c.output as usize] = Some(i as u32);
    }
    driver
}

/// The signals in the transitive fan-in of `roots` (the roots included), ascending.
pub fn cone_signals(nl: &Netlist, roots: &[u32]) -> Vec<u32> {
    let driver = drivers(nl);
    let mut seen = vec![false; nl.signals.len()];
    let mut stack: Vec<u32> = roots.to_vec();
    while let Some(s) = stack.pop() {
        if std::mem::replace(&mut seen[s as usize], true) {
            continue;
        }
        if let Some(c) = driver[s as usize] {
            stack.extend(nl.cells[c as usize].inputs.iter().copied());
        }
    }
    (0..nl.signals.len() as u32)
        .filter(|&s| seen[s as usize])
        .collect()
}

/// The value of one gate.
pub fn gate(kind: CellKind, v: &[bool]) -> bool {
    let ones = v.iter().filter(|&&b| b).count();
    match kind {
        CellKind::And => ones == v.len(),
        CellKind::Nand => ones != v.len(),
        CellKind::Or => ones > 0,
        CellKind::Nor => ones == 0,
        CellKind::Xor => ones % 2 == 1,
        CellKind::Xnor => ones % 2 == 0,
        CellKind::Not => !v[0],
        CellKind::Buf => v[0],
        CellKind::Mux2 => {
            if v[0] {
                v[1]
            } else {
                v[2]
            }
        }
    }
}
