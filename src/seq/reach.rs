//! The structural cone of a clocked design across registers: per output, the inputs that reach
//! it through any number of clock cycles, each with the fewest cycles of latency at which it
//! first can matter (0: in the same cycle), the registers on the way, and the registers that
//! reach no output at all (dead state). Structural: a path through the logic, not a proof
//! that the value matters (the one-cycle audit of `cone` decides that within a cycle).

use crate::aig::{Lit, Marks, Node};
use crate::bitrun::{input_list, join_runs, run_label, run_name};
use crate::design::{Design, InputKind};
use serde::Serialize;
use std::collections::{BTreeMap, VecDeque};

/// One output's cone across cycles.
#[derive(Clone, Debug, Serialize, PartialEq, Eq)]
pub struct CycleCone {
    /// The output bit.
    pub output: String,
    /// Inputs (port bits and unknown-value sources) with their first latency, by name.
    pub inputs: BTreeMap<String, usize>,
    /// Registers in the cone with the latency from their current value to the output.
    pub registers: BTreeMap<String, usize>,
}

/// Every output's cone across cycles and the dead registers.
#[derive(Clone, Debug, Serialize, PartialEq, Eq)]
pub struct CycleCones {
    /// Per output bit, in output order.
    pub outputs: Vec<CycleCone>,
    /// Registers that reach no output through any number of cycles.
    pub dead_registers: Vec<String>,
    /// The exact cones across cycles (`cone --cycles K`), when built.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub exact: Option<super::exact::ExactCones>,
    /// Why the exact cones were not built, when asked for.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub exact_not_built: Option<String>,
}

/// AIG inputs in the structural cone of `root` (ascending), visiting only the cone.
fn cone_inputs(d: &Design, marks: &mut Marks, root: Lit) -> Vec<u32> {
    marks.start(d.aig.len());
    let mut out = Vec::new();
    let mut stack = vec![root.node()];
    while let Some(n) = stack.pop() {
        if !marks.mark(n as usize) {
            continue;
        }
        match d.aig.node(n) {
            Node::And(a, b) => {
                stack.push(a.node());
                stack.push(b.node());
            }
            Node::Input(k) => out.push(k),
            Node::Const => {}
        }
    }
    out.sort_unstable();
    out
}

/// The cones across cycles of every output of `d`.
pub fn cycle_cones(d: &Design) -> CycleCones {
    let mut marks = Marks::new();
    let reg_of: BTreeMap<usize, usize> = d
        .registers
        .iter()
        .enumerate()
        .map(|(k, r)| (r.input, k))
        .collect();
    // The inputs each register's next value reads, computed once.
    let mut next_inputs: Vec<Option<Vec<u32>>> = vec![None; d.registers.len()];
    let mut live = vec![false; d.registers.len()];
    let mut outputs = Vec::new();
    for o in &d.outputs {
        let mut inputs = BTreeMap::new();
        let mut registers = BTreeMap::new();
        let mut seen = vec![false; d.registers.len()];
        let mut queue: VecDeque<(Vec<u32>, usize)> = VecDeque::new();
        queue.push_back((cone_inputs(d, &mut marks, o.lit), 0));
        // Breadth first by latency: the first visit of a register is its least latency.
        while let Some((ins, lat)) = queue.pop_front() {
            for k in ins {
                let bit = &d.inputs[k as usize];
                match bit.kind {
                    InputKind::Register => {
                        let Some(&r) = reg_of.get(&(k as usize)) else {
                            continue;
                        };
                        if seen[r] {
                            continue;
                        }
                        seen[r] = true;
                        live[r] = true;
                        registers.insert(d.registers[r].name.clone(), lat);
                        let next = next_inputs[r]
                            .get_or_insert_with(|| cone_inputs(d, &mut marks, d.registers[r].next))
                            .clone();
                        queue.push_back((next, lat + 1));
                    }
                    InputKind::Port | InputKind::Unknown { .. } => {
                        inputs.entry(bit.name.clone()).or_insert(lat);
                    }
                }
            }
        }
        outputs.push(CycleCone {
            output: o.name.clone(),
            inputs,
            registers,
        });
    }
    let dead_registers = d
        .registers
        .iter()
        .zip(&live)
        .filter(|(_, &l)| !l)
        .map(|(r, _)| r.name.clone())
        .collect();
    CycleCones {
        outputs,
        dead_registers,
        exact: None,
        exact_not_built: None,
    }
}

impl std::fmt::Display for CycleCones {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        writeln!(
            f,
            "across clock cycles (structural): per output, each input with the fewest cycles after which it can matter"
        )?;
        let lines: Vec<(String, String)> = self
            .outputs
            .iter()
            .map(|c| {
                let ins = c.inputs.iter().map(|(n, l)| (n.clone(), format!("@{l}")));
                let rhs = input_list(ins.collect());
                let n = c.registers.len();
                (
                    c.output.clone(),
                    format!(": {rhs} (through {n} register bit{})", plural(n)),
                )
            })
            .collect();
        for line in join_runs(&lines, run_label) {
            writeln!(f, "  {line}")?;
        }
        if self.dead_registers.is_empty() {
            writeln!(f, "dead registers: none")?;
        } else {
            // In the design's register order (a bus from its lowest bit).
            let dead: Vec<(String, String)> = self
                .dead_registers
                .iter()
                .map(|r| (r.clone(), String::new()))
                .collect();
            writeln!(
                f,
                "dead registers ({}, reach no output in any cycle): {}",
                self.dead_registers.len(),
                join_runs(&dead, run_name).join(", ")
            )?;
        }
        match (&self.exact, &self.exact_not_built) {
            (Some(e), _) => write!(f, "{e}"),
            (None, Some(why)) => writeln!(f, "across clock cycles (exact): {why}"),
            (None, None) => Ok(()),
        }
    }
}

/// `s` for counts other than one.
pub(super) fn plural(n: usize) -> &'static str {
    if n == 1 {
        ""
    } else {
        "s"
    }
}

#[cfg(test)]
mod tests {
    use super::cycle_cones;
    use std::sync::Arc;

    #[test]
    fn latencies_and_dead_registers_of_a_small_pipeline() {
        // a -> r1 -> r2 -> y, b -> y directly, c -> r3 (read by nothing).
        let src = "module m(input clk, a, b, c, output y);
  reg r1, r2, r3;
  always @(posedge clk) begin r1 <= a; r2 <= r1; r3 <= c; end
  assign y = r2 ^ b;
endmodule";
        let d = crate::front::verilog::read_verilog(&[(Arc::from("m.v"), src.to_string())], None)
            .unwrap();
        let c = cycle_cones(&d);
        let y = &c.outputs[0];
        let ins: Vec<(&str, usize)> = y.inputs.iter().map(|(n, &l)| (n.as_str(), l)).collect();
        assert_eq!(ins, [("a", 2), ("b", 0)]);
        assert_eq!(y.registers.get("r1"), Some(&1));
        assert_eq!(c.dead_registers, ["r3"]);
    }
}
