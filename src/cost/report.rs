//! The `stats` report: plain data that serializes to the documented JSON schema
//! (`equicone.stats/1`, see docs/cone.md) and prints as text.

use crate::cone::SupportStats;
use serde::Serialize;
use std::collections::BTreeMap;
use std::fmt;

/// Statistics of one design.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct StatsReport {
    /// Schema name and version of the JSON form.
    pub schema: &'static str,
    /// The design's name.
    pub design: String,
    /// The cost model's name.
    pub cost_model: String,
    /// Input bits (unknown-value sources included).
    pub inputs: usize,
    /// Output bits.
    pub outputs: usize,
    /// Register bits of a clocked design (its state cut: their inputs are the rows after the
    /// outputs in `per_output`); 0 and left out of the JSON for a combinational one.
    #[serde(skip_serializing_if = "is_zero")]
    pub registers: usize,
    /// The netlist as written, when the front-end kept all of it.
    pub written: Option<WrittenStats>,
    /// The and-inverter graph.
    pub aig: AigStats,
    /// The fan-in `k` of the bounds.
    pub bound_fanin: u32,
    /// Per output bit, in declaration order; then, for a clocked design, per register bit
    /// its input (`register` set).
    pub per_output: Vec<OutputStats>,
    /// How the supports were decided.
    pub support_stats: SupportStats,
    /// Caveats (missing netlist, undecided supports, ...).
    pub notes: Vec<String>,
}

impl StatsReport {
    /// The schema tag of the JSON form.
    pub const SCHEMA: &'static str = "equicone.stats/1";

    /// Whether any support claim is undecided (the bounds may then be low).
    pub fn undecided(&self) -> bool {
        self.support_stats.undecided > 0
    }

    /// The report as pretty-printed JSON.
    pub fn to_json(&self) -> String {
        serde_json::to_string_pretty(self).expect("the report serializes")
    }
}

/// Gates of one type.
#[derive(Clone, Debug, Default, PartialEq, Eq, Serialize)]
pub struct TypeCount {
    /// All gates of the type.
    pub total: usize,
    /// Gates by number of inputs.
    pub by_fanin: BTreeMap<u32, usize>,
}

/// The netlist as written.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct WrittenStats {
    /// Gates.
    pub gates: usize,
    /// Gates by type (lower-case names).
    pub by_type: BTreeMap<String, TypeCount>,
    /// The largest fan-in of any gate.
    pub max_fanin: u32,
    /// Sum of the gate costs.
    pub total_cost: f64,
    /// The largest output arrival time (inputs arrive at 0).
    pub critical_delay: f64,
    /// The longest path in gates from an input to an output.
    pub depth: u32,
    /// Signals along a path of the critical delay, input first.
    pub critical_path: Vec<String>,
    /// Depth of every signal (report internals).
    #[serde(skip)]
    pub signal_depth: Vec<u32>,
    /// Arrival time of every signal (report internals).
    #[serde(skip)]
    pub signal_delay: Vec<f64>,
}

/// The and-inverter graph.
#[derive(Copy, Clone, Debug, PartialEq, Eq, Serialize)]
pub struct AigStats {
    /// Inputs.
    pub inputs: usize,
    /// AND nodes.
    pub ands: usize,
    /// AND nodes in some output's cone.
    pub ands_in_cones: usize,
    /// The largest output level.
    pub depth: u32,
}

/// One output bit: its size and depth against the bounds its support implies.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct OutputStats {
    /// Bit name (`next(REG)` for a register's input).
    pub name: String,
    /// The register bit whose input this row is (clocked designs, under the state cut).
    #[serde(skip_serializing_if = "Option::is_none")]
    pub register: Option<String>,
    /// Inputs proved in the support (`n`).
    pub support: u64,
    /// Cone inputs whose membership is undecided.
    pub undecided: u64,
    /// Gates in the structural cone, as written.
    pub gates: Option<u64>,
    /// Cost of those gates.
    pub cost: Option<f64>,
    /// Longest path in gates to the output, as written.
    pub depth: Option<u32>,
    /// Arrival time at the output under the cost model.
    pub delay: Option<f64>,
    /// `ceil((n-1)/(k-1))`.
    pub gate_bound: u64,
    /// `ceil(log_k n)`.
    pub depth_bound: u32,
    /// `gates - gate_bound`.
    pub gate_gap: Option<i64>,
    /// `depth - depth_bound`.
    pub depth_gap: Option<i64>,
    /// AND nodes in the output's AIG cone.
    pub aig_ands: u64,
    /// The output's AIG level.
    pub aig_depth: u32,
    /// `n - 1` (two-input AND nodes).
    pub aig_gate_bound: u64,
    /// `ceil(log2 n)`.
    pub aig_depth_bound: u32,
    /// `aig_ands - aig_gate_bound`.
    pub aig_gate_gap: i64,
    /// `aig_depth - aig_depth_bound`.
    pub aig_depth_gap: i64,
}

/// A number without a trailing `.0`, at most three decimals.
fn num(x: f64) -> String {
    if x.fract() == 0.0 && x.abs() < 1e15 {
        format!("{}", x as i64)
    } else {
        let s = format!("{x:.3}");
        s.trim_end_matches('0').trim_end_matches('.').to_string()
    }
}

fn is_zero(n: &usize) -> bool {
    *n == 0
}

fn opt<T: ToString>(x: Option<T>) -> String {
    x.map_or_else(|| "-".to_string(), |v| v.to_string())
}

impl fmt::Display for StatsReport {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        writeln!(
            f,
            "stats of {} (cost model: {})",
            self.design, self.cost_model
        )?;
        if self.registers > 0 {
            writeln!(
                f,
                "inputs {} ({} of them register outputs), outputs {}, register inputs {} (state cut)",
                self.inputs, self.registers, self.outputs, self.registers
            )?;
        } else {
            writeln!(f, "inputs {}, outputs {}", self.inputs, self.outputs)?;
        }
        if let Some(w) = &self.written {
            let types: Vec<String> = w
                .by_type
                .iter()
                .map(|(t, c)| {
                    let fan: Vec<String> =
                        c.by_fanin.iter().map(|(k, n)| format!("{n}x{k}")).collect();
                    format!("{t} {} ({})", c.total, fan.join(" "))
                })
                .collect();
            writeln!(f, "gates as written: {} = {}", w.gates, types.join(", "))?;
            writeln!(
                f,
                "  largest fan-in {}, depth {}, total cost {}, critical-path delay {}",
                w.max_fanin,
                w.depth,
                num(w.total_cost),
                num(w.critical_delay)
            )?;
            let p = &w.critical_path;
            if p.len() > 16 {
                writeln!(
                    f,
                    "  critical path ({} signals): {} -> ... -> {}",
                    p.len(),
                    p[..6].join(" -> "),
                    p[p.len() - 6..].join(" -> ")
                )?;
            } else if !p.is_empty() {
                writeln!(f, "  critical path: {}", p.join(" -> "))?;
            }
        }
        writeln!(
            f,
            "and-inverter graph: {} AND nodes ({} in output cones), depth {}",
            self.aig.ands, self.aig.ands_in_cones, self.aig.depth
        )?;
        let ks = if self.written.is_some() {
            format!("k = {} as written, k = 2 in the AIG", self.bound_fanin)
        } else {
            "k = 2 in the AIG".to_string()
        };
        writeln!(
            f,
            "bounds from each support of n inputs: at least ceil((n-1)/(k-1)) gates and depth ceil(log_k n), {ks}"
        )?;
        let header = [
            "output", "n", "gates", ">=", "gap", "depth", ">=", "gap", "delay", "ands", ">=",
            "gap", "levels", ">=", "gap",
        ];
        let mut rows: Vec<Vec<String>> = vec![header.iter().map(|s| s.to_string()).collect()];
        for o in &self.per_output {
            let n = if o.undecided > 0 {
                format!("{}+{}?", o.support, o.undecided)
            } else {
                o.support.to_string()
            };
            rows.push(vec![
                o.name.clone(),
                n,
                opt(o.gates),
                o.gate_bound.to_string(),
                opt(o.gate_gap),
                opt(o.depth),
                o.depth_bound.to_string(),
                opt(o.depth_gap),
                o.delay.map_or_else(|| "-".to_string(), num),
                o.aig_ands.to_string(),
                o.aig_gate_bound.to_string(),
                o.aig_gate_gap.to_string(),
                o.aig_depth.to_string(),
                o.aig_depth_bound.to_string(),
                o.aig_depth_gap.to_string(),
            ]);
        }
        let cols = header.len();
        let widths: Vec<usize> = (0..cols)
            .map(|c| rows.iter().map(|r| r[c].chars().count()).max().unwrap_or(0))
            .collect();
        for r in &rows {
            let mut line = String::from("  ");
            for (c, cell) in r.iter().enumerate() {
                if c == 0 {
                    line.push_str(&format!("{cell:<w$}", w = widths[c]));
                } else {
                    line.push_str(&format!("  {cell:>w$}", w = widths[c]));
                }
            }
            writeln!(f, "{}", line.trim_end())?;
        }
        let s = &self.support_stats;
        writeln!(
            f,
            "support claims: {} ({} by simulation, {} by SAT, {} by structure, {} undecided)",
            s.claims,
            s.by_simulation(),
            s.by_sat(),
            s.independent_by_structure,
            s.undecided
        )?;
        for n in &self.notes {
            writeln!(f, "note: {n}")?;
        }
        Ok(())
    }
}

#[cfg(test)]
mod tests {
    use super::num;

    #[test]
    fn numbers_print_plainly() {
        assert_eq!(num(6.0), "6");
        assert_eq!(num(0.1 + 0.2), "0.3");
        assert_eq!(num(2.25), "2.25");
    }
}
