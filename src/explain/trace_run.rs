//! Stepping one design of a clocked comparison along a trace, keeping every value the replay
//! files show (each cycle's full input vector: port bits, held bits and register values; the
//! outputs; the state after the last clock edge), and random traces for testbenches of
//! designs that do not differ. The semantics are those of `crate::seq::replay`: cycle 0
//! starts in the reset state, outputs are read before the clock edge that ends the cycle.

use crate::design::{Design, InputKind};
use crate::rng::SplitMix64;
use crate::seq::TraceReset;
use crate::seq::{HeldInput, InitUnset, InitialValue, Side, Trace, TraceCycle, TraceInput};
use std::collections::{BTreeMap, BTreeSet};

/// One design stepped along a trace.
#[derive(Clone, Debug, PartialEq, Eq)]
pub struct DesignRun {
    /// Per cycle, one value per design input (registers at their current value).
    pub inputs: Vec<Vec<bool>>,
    /// Per cycle, one value per design output.
    pub outputs: Vec<Vec<bool>>,
    /// Register values after the clock edge that ends the last cycle.
    pub last_state: Vec<bool>,
}

impl DesignRun {
    /// The register values in cycle `k` (`k == cycles` gives the state after the last edge).
    pub fn state(&self, d: &Design, k: usize) -> Vec<bool> {
        match self.inputs.get(k) {
            Some(v) => d.registers.iter().map(|r| v[r.input]).collect(),
            None => self.last_state.clone(),
        }
    }
}

/// Whether a trace entry of side `of` applies to the design of side `side`.
fn applies(of: Side, side: Side) -> bool {
    of == Side::Both || of == side
}

/// The initial value of every register of `d` (its reset value, else the trace's).
pub fn initial_state(d: &Design, side: Side, t: &Trace) -> Result<Vec<bool>, String> {
    d.registers
        .iter()
        .map(|r| match r.init {
            Some(v) => Ok(v),
            None => t
                .reset
                .initial
                .iter()
                .find(|i| i.register == r.name && applies(i.side, side))
                .map(|i| i.value)
                .ok_or_else(|| {
                    format!(
                        "the trace gives no initial value for register `{}` of {}, which has no reset",
                        r.name, d.name
                    )
                }),
        })
        .collect()
}

/// Step `d` (the trace's `side` design) through `t`.
pub fn run(d: &Design, side: Side, t: &Trace) -> Result<DesignRun, String> {
    let held: BTreeMap<&str, bool> = t
        .reset
        .held
        .iter()
        .filter(|h| applies(h.side, side))
        .map(|h| (h.name.as_str(), h.value))
        .collect();
    let mut state = initial_state(d, side, t)?;
    let mut reg_of = vec![usize::MAX; d.inputs.len()];
    for (i, r) in d.registers.iter().enumerate() {
        reg_of[r.input] = i;
    }
    let mut roots: Vec<crate::aig::Lit> = d.outputs.iter().map(|o| o.lit).collect();
    roots.extend(d.registers.iter().map(|r| r.next));
    let n = d.outputs.len();
    let mut run = DesignRun {
        inputs: Vec::with_capacity(t.cycles.len()),
        outputs: Vec::with_capacity(t.cycles.len()),
        last_state: Vec::new(),
    };
    for c in &t.cycles {
        let given: BTreeMap<&str, bool> = c
            .inputs
            .iter()
            .filter(|i| applies(i.side, side))
            .map(|i| (i.name.as_str(), i.value))
            .collect();
        let mut ins = Vec::with_capacity(d.inputs.len());
        for (k, b) in d.inputs.iter().enumerate() {
            ins.push(match b.kind {
                InputKind::Register => state[reg_of[k]],
                _ => *held
                    .get(b.name.as_str())
                    .or(given.get(b.name.as_str()))
                    .ok_or_else(|| {
                        format!(
                            "cycle {} of the trace gives no value for input `{}` of {}",
                            c.cycle, b.name, d.name
                        )
                    })?,
            });
        }
        let ticking = crate::seq::registers_ticking(d, t, c)?;
        let vals = crate::aig::eval(&d.aig, &ins, &roots);
        run.outputs.push(vals[..n].to_vec());
        state = crate::seq::after_edge(&state, &vals[n..], &ticking);
        run.inputs.push(ins);
    }
    run.last_state = state;
    Ok(run)
}

/// The inputs that get a value in every cycle of a run of `r` against `c`: port bits and
/// unknown-value bits that are not held, paired by name (as the clocked check pairs them).
pub fn free_inputs(r: &Design, c: &Design, held: &[HeldInput]) -> Vec<(String, Side)> {
    let is_held =
        |name: &str, side: Side| held.iter().any(|h| h.name == name && applies(h.side, side));
    let ports = |d: &Design| -> BTreeSet<String> {
        d.inputs
            .iter()
            .filter(|b| matches!(b.kind, InputKind::Port))
            .map(|b| b.name.clone())
            .collect()
    };
    let cand_ports = ports(c);
    let ref_ports = ports(r);
    let mut out = Vec::new();
    for b in &r.inputs {
        match b.kind {
            InputKind::Register => {}
            InputKind::Unknown { .. } => out.push((b.name.clone(), Side::Reference)),
            InputKind::Port => {
                if is_held(&b.name, Side::Reference) {
                    continue;
                }
                let side = if cand_ports.contains(&b.name) {
                    Side::Both
                } else {
                    Side::Reference
                };
                out.push((b.name.clone(), side));
            }
        }
    }
    for b in &c.inputs {
        match b.kind {
            InputKind::Register => {}
            InputKind::Unknown { .. } => out.push((b.name.clone(), Side::Candidate)),
            InputKind::Port => {
                if !ref_ports.contains(&b.name) && !is_held(&b.name, Side::Candidate) {
                    out.push((b.name.clone(), Side::Candidate));
                }
            }
        }
    }
    out
}

/// A trace of `cycles` random cycles for `r` against `c` (for testbenches of designs without
/// a difference): registers without a reset start at the `--init-unset` value, or at 0 when
/// free (a run that the clocked check's verdict covers).
pub fn random_trace(
    r: &Design,
    c: &Design,
    held: &[HeldInput],
    init_unset: InitUnset,
    cycles: usize,
    seed: u64,
) -> Trace {
    let free = free_inputs(r, c, held);
    let mut rng = SplitMix64::new(seed, 0x7ACE);
    let start = match init_unset {
        InitUnset::Value(v) => v,
        InitUnset::Free => false,
    };
    let mut initial = Vec::new();
    for (side, d) in [(Side::Reference, r), (Side::Candidate, c)] {
        for reg in d.registers.iter().filter(|g| g.init.is_none()) {
            initial.push(InitialValue {
                side,
                register: reg.name.clone(),
                value: start,
            });
        }
    }
    // Several clocks: each ticks at random (a clock without a partner makes no such trace;
    // the clocked check refuses the pair).
    let clocks = crate::seq::clock_names(r, c);
    let cycles = (0..cycles)
        .map(|cycle| TraceCycle {
            cycle,
            inputs: free
                .iter()
                .map(|(name, side)| TraceInput {
                    name: name.clone(),
                    side: *side,
                    value: rng.next_u64() & 1 == 1,
                })
                .collect(),
            ticked: (!clocks.is_empty()).then(|| {
                clocks
                    .iter()
                    .filter(|_| rng.next_u64() & 1 == 1)
                    .cloned()
                    .collect()
            }),
        })
        .collect();
    Trace {
        reset: TraceReset {
            description: format!(
                "random inputs; registers with a reset start at their reset value, the others at {}; reset ports are held inactive and clocks at 0 in every cycle{}",
                start as u8,
                if clocks.is_empty() { "" } else { ", each cycle lists the clocks with an active edge at its end" }
            ),
            held: held.to_vec(),
            initial,
            clocks,
        },
        cycles,
        first_difference: None,
    }
}
