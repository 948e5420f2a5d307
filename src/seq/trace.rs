//! Traces: counterexamples of clocked designs. A [`Trace`] lists, for each clock cycle from the
//! reset state, the value of every per-cycle input by name, plus how the run started (inputs held
//! at a value, initial values of registers without a reset) and the first cycle where an output
//! pair differs. [`replay`] steps one original design through a trace; every trace shown is
//! replayed on both designs first.
//!
//! The shape (text and JSON) is public: cycles x named inputs, the reset used, the first
//! differing cycle and outputs. Cycle 0 is the first clock cycle after reset: its inputs are
//! applied with the registers in the reset state; outputs are read before the clock edge that
//! ends the cycle.

use super::product::{port_name_on, HeldInput, Side};
use crate::design::{Design, InputKind};
use serde::{Deserialize, Serialize};
use std::collections::BTreeMap;

/// How a trace's run starts.
#[derive(Clone, Debug, PartialEq, Eq, Serialize, Deserialize)]
pub struct TraceReset {
    /// In words.
    pub description: String,
    /// Port bits held at one value in every cycle (resets inactive, clocks at 0).
    pub held: Vec<HeldInput>,
    /// Initial values of registers without a reset, per design.
    pub initial: Vec<InitialValue>,
}

/// The initial value of one register without a reset.
#[derive(Clone, Debug, PartialEq, Eq, Serialize, Deserialize)]
pub struct InitialValue {
    /// Whose register.
    pub side: Side,
    /// The register bit.
    pub register: String,
    /// Its value in cycle 0.
    pub value: bool,
}

/// One input bit's value in one cycle.
#[derive(Clone, Debug, PartialEq, Eq, Serialize, Deserialize)]
pub struct TraceInput {
    /// The bit's name (the reference's, for a paired bit).
    pub name: String,
    /// `both` for a paired port bit; otherwise the design it belongs to.
    pub side: Side,
    /// Its value.
    pub value: bool,
    /// The candidate's name of a paired bit that a port map renames.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub candidate_name: Option<String>,
}

impl TraceInput {
    /// The bit's name in the design of side `side` (`None`: that design does not have it).
    pub fn name_on(&self, side: Side) -> Option<&str> {
        port_name_on(&self.name, self.side, self.candidate_name.as_deref(), side)
    }
}

/// One clock cycle of a trace.
#[derive(Clone, Debug, PartialEq, Eq, Serialize, Deserialize)]
pub struct TraceCycle {
    /// The cycle number from reset (0 first).
    pub cycle: usize,
    /// Every per-cycle input.
    pub inputs: Vec<TraceInput>,
}

/// One output pair that differs.
#[derive(Clone, Debug, PartialEq, Eq, Serialize, Deserialize)]
pub struct OutputDifference {
    /// The reference output bit.
    pub reference: String,
    /// The candidate output bit.
    pub candidate: String,
    /// The reference's value.
    pub reference_value: bool,
    /// The candidate's value.
    pub candidate_value: bool,
}

/// Where the designs first differ.
#[derive(Clone, Debug, PartialEq, Eq, Serialize, Deserialize)]
pub struct FirstDifference {
    /// The cycle.
    pub cycle: usize,
    /// The output pairs that differ in it.
    pub outputs: Vec<OutputDifference>,
}

/// A counterexample of clocked designs, re-simulated on both.
#[derive(Clone, Debug, PartialEq, Eq, Serialize, Deserialize)]
pub struct Trace {
    /// How the run starts.
    pub reset: TraceReset,
    /// The cycles, from reset.
    pub cycles: Vec<TraceCycle>,
    /// The first difference (the last cycle of the trace).
    pub first_difference: Option<FirstDifference>,
    /// Output bits paired under different names (by a port map): reference bit -> candidate
    /// bit. The other outputs pair by name.
    #[serde(default, skip_serializing_if = "BTreeMap::is_empty")]
    pub renamed_outputs: BTreeMap<String, String>,
}

impl Trace {
    /// The output pairs of `r` and `c` along this trace (reference index, candidate index):
    /// renamed ones as [`Trace::renamed_outputs`] says, the others by name.
    pub fn output_pairs(&self, r: &Design, c: &Design) -> Vec<(usize, usize)> {
        let renamed_to: std::collections::BTreeSet<&str> =
            self.renamed_outputs.values().map(String::as_str).collect();
        r.outputs
            .iter()
            .enumerate()
            .filter_map(|(i, o)| {
                let n = match self.renamed_outputs.get(&o.name) {
                    Some(n) => n.as_str(),
                    None if renamed_to.contains(o.name.as_str()) => return None,
                    None => o.name.as_str(),
                };
                c.output_index(n).map(|j| (i, j))
            })
            .collect()
    }

    /// The input bits paired under different names (by a port map): reference bit ->
    /// candidate bit, from the held inputs and the first cycle.
    pub fn renamed_inputs(&self) -> BTreeMap<String, String> {
        let held = self
            .reset
            .held
            .iter()
            .filter_map(|h| Some((h.name.clone(), h.candidate_name.clone()?)));
        let free = self.cycles.first().into_iter().flat_map(|c| {
            c.inputs
                .iter()
                .filter_map(|i| Some((i.name.clone(), i.candidate_name.clone()?)))
        });
        held.chain(free).collect()
    }
}

/// What a design does along a trace: its output values in every cycle.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct Replay {
    /// Per cycle, one value per output of the design.
    pub outputs: Vec<Vec<bool>>,
}

/// Step design `d` (the trace's side `side`) through `trace`. Errors name what the trace lacks.
pub fn replay(d: &Design, side: Side, trace: &Trace) -> Result<Replay, String> {
    let mut held: BTreeMap<&str, bool> = BTreeMap::new();
    for h in &trace.reset.held {
        if let Some(n) = h.name_on(side) {
            held.insert(n, h.value);
        }
    }
    let mut state: Vec<bool> = Vec::with_capacity(d.registers.len());
    for r in &d.registers {
        let v = match r.init {
            Some(v) => v,
            None => trace
                .reset
                .initial
                .iter()
                .find(|i| i.register == r.name && (i.side == side || i.side == Side::Both))
                .map(|i| i.value)
                .ok_or_else(|| {
                    format!(
                        "the trace gives no initial value for register `{}`, which has no reset",
                        r.name
                    )
                })?,
        };
        state.push(v);
    }
    let mut reg_of = vec![usize::MAX; d.inputs.len()];
    for (i, r) in d.registers.iter().enumerate() {
        reg_of[r.input] = i;
    }
    let mut roots: Vec<crate::aig::Lit> = d.outputs.iter().map(|o| o.lit).collect();
    roots.extend(d.registers.iter().map(|r| r.next));
    let mut outputs = Vec::with_capacity(trace.cycles.len());
    for c in &trace.cycles {
        let mut given: BTreeMap<&str, bool> = BTreeMap::new();
        for i in &c.inputs {
            if let Some(n) = i.name_on(side) {
                given.insert(n, i.value);
            }
        }
        let mut ins = Vec::with_capacity(d.inputs.len());
        for (k, b) in d.inputs.iter().enumerate() {
            let v = match b.kind {
                InputKind::Register => state[reg_of[k]],
                _ => match held.get(b.name.as_str()).or(given.get(b.name.as_str())) {
                    Some(&v) => v,
                    None => {
                        return Err(format!(
                            "cycle {} of the trace gives no value for input `{}`",
                            c.cycle, b.name
                        ))
                    }
                },
            };
            ins.push(v);
        }
        let vals = crate::aig::eval(&d.aig, &ins, &roots);
        let n = d.outputs.len();
        outputs.push(vals[..n].to_vec());
        state = vals[n..].to_vec();
    }
    Ok(Replay { outputs })
}

/// The first cycle where the paired outputs (`pairs`: reference index, candidate index) differ.
pub fn first_difference(
    r: &Design,
    c: &Design,
    pairs: &[(usize, usize)],
    rr: &Replay,
    cr: &Replay,
) -> Option<FirstDifference> {
    for (cycle, (ro, co)) in rr.outputs.iter().zip(&cr.outputs).enumerate() {
        let outputs: Vec<OutputDifference> = pairs
            .iter()
            .filter(|&&(i, j)| ro[i] != co[j])
            .map(|&(i, j)| OutputDifference {
                reference: r.outputs[i].name.clone(),
                candidate: c.outputs[j].name.clone(),
                reference_value: ro[i],
                candidate_value: co[j],
            })
            .collect();
        if !outputs.is_empty() {
            return Some(FirstDifference { cycle, outputs });
        }
    }
    None
}
