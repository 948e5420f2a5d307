//! Stepping one design of a clocked comparison along a trace, keeping every value the replay
//! files show (each cycle's full input vector: port bits, held bits and register values; the
//! outputs; the state after the last clock edge), and random traces for testbenches of
//! designs that do not differ. The semantics are those of `crate::seq::replay`: cycle 0
//! starts in the reset state, outputs are read before the clock edge that ends the cycle.

use crate::design::{Design, InputKind};
use crate::portmap::BitMap;
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
        .filter_map(|h| Some((h.name_on(side)?, h.value)))
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
            .filter_map(|i| Some((i.name_on(side)?, i.value)))
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
        let ticking = crate::seq::registers_ticking(d, side, t, c)?;
        let vals = crate::aig::eval(&d.aig, &ins, &roots);
        run.outputs.push(vals[..n].to_vec());
        state = crate::seq::after_edge(&state, &vals[n..], &ticking);
        run.inputs.push(ins);
    }
    run.last_state = state;
    Ok(run)
}

/// The inputs that get a value in every cycle of a run of `r` against `c`: port bits and
/// unknown-value bits that are not held, paired by name or by the port map `map` (as the
/// clocked check pairs them): (name, side, the candidate's name of a renamed pair).
pub fn free_inputs(
    r: &Design,
    c: &Design,
    held: &[HeldInput],
    map: Option<&BitMap>,
) -> Vec<(String, Side, Option<String>)> {
    let is_held = |name: &str, side: Side| held.iter().any(|h| h.name_on(side) == Some(name));
    let ports = |d: &Design| -> BTreeSet<String> {
        d.inputs
            .iter()
            .filter(|b| matches!(b.kind, InputKind::Port))
            .map(|b| b.name.clone())
            .collect()
    };
    let cand_ports = ports(c);
    let mut paired_c: BTreeSet<String> = BTreeSet::new();
    let mut out = Vec::new();
    for b in &r.inputs {
        match b.kind {
            InputKind::Register => {}
            InputKind::Unknown { .. } => out.push((b.name.clone(), Side::Reference, None)),
            InputKind::Port => {
                let partner = match map {
                    Some(m) => m.partner(&b.name),
                    None => Some(b.name.as_str()),
                }
                .filter(|n| cand_ports.contains(*n) && !paired_c.contains(*n));
                if let Some(n) = partner {
                    paired_c.insert(n.to_string());
                }
                if is_held(&b.name, Side::Reference) {
                    continue;
                }
                match partner {
                    Some(n) => out.push((
                        b.name.clone(),
                        Side::Both,
                        (n != b.name).then(|| n.to_string()),
                    )),
                    None => out.push((b.name.clone(), Side::Reference, None)),
                }
            }
        }
    }
    for b in &c.inputs {
        match b.kind {
            InputKind::Register => {}
            InputKind::Unknown { .. } => out.push((b.name.clone(), Side::Candidate, None)),
            InputKind::Port => {
                if !paired_c.contains(&b.name) && !is_held(&b.name, Side::Candidate) {
                    out.push((b.name.clone(), Side::Candidate, None));
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
    random_trace_mapped(r, c, held, None, init_unset, cycles, seed)
}

/// [`random_trace`] of designs whose ports or registers a port map `map` pairs: renamed
/// ports get the candidate's names, a candidate register paired inverted (`~q`) without a
/// reset starts at the complement of its partner (as the check assumes), and renamed
/// outputs are listed.
pub fn random_trace_mapped(
    r: &Design,
    c: &Design,
    held: &[HeldInput],
    map: Option<&BitMap>,
    init_unset: InitUnset,
    cycles: usize,
    seed: u64,
) -> Trace {
    let free = free_inputs(r, c, held, map);
    let mut rng = SplitMix64::new(seed, 0x7ACE);
    let start = match init_unset {
        InitUnset::Value(v) => v,
        InitUnset::Free => false,
    };
    let mut initial = Vec::new();
    for (side, d) in [(Side::Reference, r), (Side::Candidate, c)] {
        for reg in d.registers.iter().filter(|g| g.init.is_none()) {
            let inverted = side == Side::Candidate
                && init_unset == InitUnset::Free
                && map.is_some_and(|m| {
                    m.inverted.contains(&reg.name)
                        && m.registers.iter().any(|rn| {
                            m.pairs.get(rn) == Some(&reg.name)
                                && r.registers
                                    .iter()
                                    .any(|g| g.name == *rn && g.init.is_none())
                        })
                });
            initial.push(InitialValue {
                side,
                register: reg.name.clone(),
                value: start ^ inverted,
            });
        }
    }
    // Several clocks: each ticks at random (a clock without a partner makes no such trace;
    // the clocked check refuses the pair). Clocks the port map renames pair through it.
    let clocks = crate::seq::clock_names(r, c, map);
    let cycles = (0..cycles)
        .map(|cycle| TraceCycle {
            cycle,
            inputs: free
                .iter()
                .map(|(name, side, cand)| TraceInput {
                    name: name.clone(),
                    side: *side,
                    value: rng.next_u64() & 1 == 1,
                    candidate_name: cand.clone(),
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
    let mut renamed_outputs = BTreeMap::new();
    if let Some(m) = map {
        for o in &r.outputs {
            if let Some(n) = m.partner(&o.name) {
                if n != o.name && c.output_index(n).is_some() {
                    renamed_outputs.insert(o.name.clone(), n.to_string());
                }
            }
        }
    }
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
        renamed_outputs,
    }
}
