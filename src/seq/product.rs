//! The product machine of two clocked designs: both designs' logic in one AIG over shared
//! per-cycle inputs (port bits paired by name) and the state bits of both (the state cut).
//!
//! AIG inputs `0..free.len()` are the per-cycle inputs; the next `state.len()` inputs are the
//! state bits. Reset ports are held at their inactive value and clock ports at 0 in every
//! cycle: a run starts in the reset state and reset is not asserted again.

use crate::aig::{Aig, Lit};
use crate::design::{Design, InputKind};
use crate::diag::{Diagnostic, InputError};
pub use crate::engine::Side;
use crate::portmap::BitMap;
use serde::{Deserialize, Serialize};
use std::collections::{BTreeMap, BTreeSet};

/// One per-cycle input of the product machine.
#[derive(Clone, Debug)]
pub struct FreeInput {
    /// The bit's name (a port bit, or an unknown-value source); the reference's for a
    /// paired bit.
    pub name: String,
    /// Whose input it is.
    pub side: Side,
    /// The candidate's name of a paired bit, when a port map renames it.
    pub candidate_name: Option<String>,
}

/// The initial value of a state bit.
#[derive(Copy, Clone, Debug, PartialEq, Eq, PartialOrd, Ord)]
pub enum Init {
    /// Set by reset (or `--init-unset 0|1`).
    Const(bool),
    /// A free initial value; the number identifies it (each register without a reset has its own,
    /// except that a register and its same-named or port-map partner share one), and `true`
    /// starts the register at its complement (a port-map pair written `~q`).
    Free(u32, bool),
}

/// One state bit: a register of one design.
#[derive(Clone, Debug)]
pub struct StateBit {
    /// Whose register.
    pub side: Side,
    /// Index into that design's `registers`.
    pub register: usize,
    /// The register bit's name.
    pub name: String,
    /// Its current value (an AIG input of the product).
    pub current: Lit,
    /// Its next value.
    pub next: Lit,
    /// Its initial value.
    pub init: Init,
}

/// One output pair of the product.
#[derive(Clone, Debug)]
pub struct OutPair {
    /// Index into the reference's outputs.
    pub reference: usize,
    /// Index into the candidate's outputs.
    pub candidate: usize,
    /// The reference output in the product.
    pub lit_r: Lit,
    /// The candidate output in the product.
    pub lit_c: Lit,
}

/// A port bit held at one value in every cycle (a reset at its inactive value, a clock at 0).
#[derive(Clone, Debug, PartialEq, Eq, PartialOrd, Ord, Serialize, Deserialize)]
pub struct HeldInput {
    /// The port bit.
    pub name: String,
    /// Whose port (both when both designs have it).
    pub side: Side,
    /// The value held.
    pub value: bool,
    /// `reset` or `clock`.
    pub role: String,
    /// The candidate's name of a port bit both designs have under different names (a port
    /// map renames it); `name` is then the reference's.
    #[serde(default, skip_serializing_if = "Option::is_none")]
    pub candidate_name: Option<String>,
}

impl HeldInput {
    /// The bit's name in the design of side `side` (`None`: that design does not have it).
    pub fn name_on(&self, side: Side) -> Option<&str> {
        port_name_on(&self.name, self.side, self.candidate_name.as_deref(), side)
    }
}

/// The name of a trace or held bit (`name`, of side `of`, the candidate calling it
/// `candidate_name` when renamed) in the design of side `side`.
pub fn port_name_on<'a>(
    name: &'a str,
    of: Side,
    candidate_name: Option<&'a str>,
    side: Side,
) -> Option<&'a str> {
    match (of, side) {
        (Side::Both, Side::Candidate) => Some(candidate_name.unwrap_or(name)),
        (Side::Both, _) => Some(name),
        (o, s) if o == s => Some(name),
        _ => None,
    }
}

/// How registers without a reset start.
#[derive(Copy, Clone, Debug, PartialEq, Eq, Default)]
pub enum InitUnset {
    /// Each starts at its own free value (reported).
    #[default]
    Free,
    /// Each starts at this value (for ISCAS-89 files, all zeros is the usual convention).
    Value(bool),
}

/// Both designs in one AIG, with their registers cut.
#[derive(Clone, Debug)]
pub struct Product {
    /// The logic of both designs.
    pub aig: Aig,
    /// Per-cycle inputs (AIG inputs `0..free.len()`).
    pub free: Vec<FreeInput>,
    /// State bits (AIG inputs from `free.len()` on), reference registers first.
    pub state: Vec<StateBit>,
    /// Output pairs, in the reference's output order.
    pub outputs: Vec<OutPair>,
    /// Inputs held constant.
    pub held: Vec<HeldInput>,
    /// Register pairs of the port map without a reset that start equal (or, inverted,
    /// complementary): an assumption of the check, reported.
    pub start_equal: Vec<StartEqual>,
}

/// A reference register and its port-map partner in the candidate, both without a reset,
/// assumed to start at the same value (the candidate at its complement when `inverted`).
#[derive(Clone, Debug, PartialEq, Eq, PartialOrd, Ord, Serialize, Deserialize)]
pub struct StartEqual {
    /// The reference register bit.
    pub reference: String,
    /// The candidate register bit.
    pub candidate: String,
    /// The candidate starts at the complement.
    pub inverted: bool,
}

/// The role of each AIG input of one design in a run: held at a value, or free.
fn held_inputs(d: &Design) -> BTreeMap<usize, (bool, &'static str)> {
    let mut held = BTreeMap::new();
    for r in &d.registers {
        if let Some(reset) = &r.reset {
            held.insert(reset.input, (!reset.active, "reset"));
        }
    }
    let clocks: BTreeSet<&str> = d
        .registers
        .iter()
        .filter_map(|r| r.clock.as_deref())
        .collect();
    for (k, b) in d.inputs.iter().enumerate() {
        if matches!(b.kind, InputKind::Port) && clocks.contains(b.name.as_str()) {
            held.entry(k).or_insert((false, "clock"));
        }
    }
    held
}

/// Every register of a design must sample on the same clock and edge (one clock domain). The
/// error points at the first register of the second domain and lists every domain with its
/// register count and first register.
fn check_one_clock(d: &Design) -> Result<(), InputError> {
    // (clock, edge) -> (register count, first register)
    let mut seen: BTreeMap<(Option<&str>, &str), (usize, usize)> = BTreeMap::new();
    let mut order: Vec<(Option<&str>, &str)> = Vec::new();
    for (k, r) in d.registers.iter().enumerate() {
        let edge = match r.edge {
            crate::design::ClockEdge::Rising => "posedge",
            crate::design::ClockEdge::Falling => "negedge",
        };
        let key = (r.clock.as_deref(), edge);
        let e = seen.entry(key).or_insert_with(|| {
            order.push(key);
            (0, k)
        });
        e.0 += 1;
    }
    if order.len() <= 1 {
        return Ok(());
    }
    let list: Vec<String> = order
        .iter()
        .map(|key| {
            let (n, first) = seen[key];
            format!(
                "{} {}: {n} register bit{} ({}{})",
                key.1,
                key.0.unwrap_or("(implicit)"),
                if n == 1 { "" } else { "s" },
                d.registers[first].name,
                if n > 1 { ", ..." } else { "" }
            )
        })
        .collect();
    let second = &d.registers[seen[&order[1]].1];
    Err(InputError::one(
        Diagnostic::error(
            second.pos.clone(),
            format!(
                "{}: unsupported: registers on {} clocks or edges ({}); equicone compares designs with one clock domain",
                d.name,
                order.len(),
                list.join("; ")
            ),
        )
        .with_help(
            "check each clock domain as its own module (its registers, the other domains' signals as inputs); if the clocks are one clock under two names, clock every register from one port and edge",
        ),
    ))
}

impl Product {
    /// How many free initial values the first `nreg` state bits use (one more than the largest
    /// number of an [`Init::Free`]; zero when every one of them starts at a constant).
    pub fn free_init_count(&self, nreg: usize) -> usize {
        self.state[..nreg]
            .iter()
            .filter_map(|s| match s.init {
                Init::Free(k, _) => Some(k as usize + 1),
                Init::Const(_) => None,
            })
            .max()
            .unwrap_or(0)
    }

    /// Build the product of `r` and `c`; port bits pair by name. `free_extra` leaves port bits
    /// that only one design has free instead of refusing them. The register pairs of `map`
    /// (a port map) without a reset start at one shared free value.
    pub fn build(
        r: &Design,
        c: &Design,
        init_unset: InitUnset,
        free_extra: bool,
        map: Option<&BitMap>,
    ) -> Result<Product, InputError> {
        check_one_clock(r)?;
        check_one_clock(c)?;
        let held_r = held_inputs(r);
        let held_c = held_inputs(c);
        let mut aig = Aig::new();
        let mut free: Vec<FreeInput> = Vec::new();
        let mut map_r = vec![Lit::FALSE; r.inputs.len()];
        let mut map_c = vec![Lit::FALSE; c.inputs.len()];
        let mut held: Vec<HeldInput> = Vec::new();
        let cand_ports: BTreeMap<&str, usize> = c
            .inputs
            .iter()
            .enumerate()
            .filter(|(_, b)| matches!(b.kind, InputKind::Port))
            .map(|(k, b)| (b.name.as_str(), k))
            .collect();
        let mut used_c = vec![false; c.inputs.len()];
        let mut only_r = Vec::new();
        // A port map renames ports: a reference bit pairs with its mapped partner, else with
        // the candidate bit of the same name (unless the map gives that name to another bit).
        let partner = |n: &'_ str| -> Option<String> {
            match map {
                Some(m) => m.partner(n).map(str::to_string),
                None => Some(n.to_string()),
            }
        };
        for (k, b) in r.inputs.iter().enumerate() {
            match b.kind {
                InputKind::Register => {}
                InputKind::Unknown { .. } => {
                    map_r[k] = aig.add_input();
                    free.push(FreeInput {
                        name: b.name.clone(),
                        side: Side::Reference,
                        candidate_name: None,
                    });
                }
                InputKind::Port => {
                    let other = partner(&b.name)
                        .and_then(|n| cand_ports.get(n.as_str()).copied())
                        .filter(|&j| !used_c[j]);
                    if let Some(j) = other {
                        used_c[j] = true;
                    }
                    let renamed = other
                        .map(|j| &c.inputs[j].name)
                        .filter(|n| **n != b.name)
                        .cloned();
                    let hr = held_r.get(&k);
                    let hc = other.and_then(|j| held_c.get(&j));
                    if let (Some(&(vr, rr)), Some(&(vc, rc))) = (hr, hc) {
                        if vr != vc {
                            let cn = other.map_or("", |j| c.inputs[j].name.as_str());
                            return Err(InputError::one(
                                Diagnostic::error(
                                    None,
                                    format!(
                                        "input {} is a {rr} held at {} in the reference, but its partner {cn} is a {rc} held at {} in the candidate",
                                        b.name, vr as u8, vc as u8
                                    ),
                                )
                                .with_help(
                                    "a paired port must be read alike by both designs (both resets active high or both active low); pair each reset with one of the same polarity",
                                ),
                            ));
                        }
                    }
                    if let Some(&(v, role)) = hr.or(hc) {
                        map_r[k] = Lit::constant(v);
                        if let Some(j) = other {
                            map_c[j] = Lit::constant(v);
                        }
                        let side = if other.is_some() {
                            Side::Both
                        } else {
                            Side::Reference
                        };
                        held.push(HeldInput {
                            name: b.name.clone(),
                            side,
                            value: v,
                            role: role.to_string(),
                            candidate_name: renamed,
                        });
                        continue;
                    }
                    if other.is_none() && !free_extra {
                        only_r.push(b.name.clone());
                        continue;
                    }
                    let l = aig.add_input();
                    map_r[k] = l;
                    if let Some(j) = other {
                        map_c[j] = l;
                    }
                    free.push(FreeInput {
                        name: b.name.clone(),
                        side: if other.is_some() {
                            Side::Both
                        } else {
                            Side::Reference
                        },
                        candidate_name: renamed,
                    });
                }
            }
        }
        let mut only_c = Vec::new();
        for (k, b) in c.inputs.iter().enumerate() {
            if used_c[k] || matches!(b.kind, InputKind::Register) {
                continue;
            }
            if matches!(b.kind, InputKind::Port) {
                if let Some(&(v, role)) = held_c.get(&k) {
                    map_c[k] = Lit::constant(v);
                    held.push(HeldInput {
                        name: b.name.clone(),
                        side: Side::Candidate,
                        value: v,
                        role: role.to_string(),
                        candidate_name: None,
                    });
                    continue;
                }
                if !free_extra {
                    only_c.push(b.name.clone());
                    continue;
                }
            }
            map_c[k] = aig.add_input();
            free.push(FreeInput {
                name: b.name.clone(),
                side: Side::Candidate,
                candidate_name: None,
            });
        }
        if !only_r.is_empty() || !only_c.is_empty() {
            let mut parts = Vec::new();
            if !only_r.is_empty() {
                parts.push(format!("only the reference has {}", only_r.join(", ")));
            }
            if !only_c.is_empty() {
                parts.push(format!("only the candidate has {}", only_c.join(", ")));
            }
            return Err(InputError::one(
                Diagnostic::error(
                    None,
                    format!("input bits without a partner: {}", parts.join("; ")),
                )
                .with_help(
                    "rename the ports to match, pair them in a port map (--port-map), or pass --free-extra-inputs to leave them free",
                ),
            ));
        }
        // State bits: reference registers, then candidate registers.
        let mut state = Vec::new();
        let mut next_free = 0u32;
        // Same-named registers without a reset share one free initial value, and so do the
        // register pairs of the port map (which then do not share by name).
        let mut free_of: BTreeMap<String, u32> = BTreeMap::new();
        let mapped: BTreeMap<&str, &str> = map
            .map(|m| {
                m.registers
                    .iter()
                    .filter_map(|rn| m.pairs.get(rn).map(|cn| (rn.as_str(), cn.as_str())))
                    .collect()
            })
            .unwrap_or_default();
        let mapped_c: BTreeSet<&str> = mapped.values().copied().collect();
        // Candidate register -> (the shared value, its reference partner).
        let mut free_of_map: BTreeMap<&str, (u32, &str)> = BTreeMap::new();
        let mut start_equal = Vec::new();
        for (side, d, imap) in [
            (Side::Reference, r, &mut map_r),
            (Side::Candidate, c, &mut map_c),
        ] {
            for (i, reg) in d.registers.iter().enumerate() {
                let cur = aig.add_input();
                imap[reg.input] = cur;
                let init = match (reg.init, init_unset) {
                    (Some(v), _) => Init::Const(v),
                    (None, InitUnset::Value(v)) => Init::Const(v),
                    (None, InitUnset::Free) if side == Side::Candidate => {
                        let inverted = map.is_some_and(|m| m.inverted.contains(&reg.name));
                        if let Some((k, rn)) = free_of_map.remove(reg.name.as_str()) {
                            start_equal.push(StartEqual {
                                reference: rn.to_string(),
                                candidate: reg.name.clone(),
                                inverted,
                            });
                            Init::Free(k, inverted)
                        } else {
                            let key = super::names::normalize(&reg.name);
                            let shared = (!mapped_c.contains(reg.name.as_str()))
                                .then(|| free_of.remove(&key))
                                .flatten();
                            Init::Free(
                                shared.unwrap_or_else(|| {
                                    next_free += 1;
                                    next_free - 1
                                }),
                                false,
                            )
                        }
                    }
                    (None, InitUnset::Free) => {
                        next_free += 1;
                        match mapped.get(reg.name.as_str()) {
                            Some(cn) => {
                                free_of_map.insert(cn, (next_free - 1, reg.name.as_str()));
                            }
                            None => {
                                free_of.insert(super::names::normalize(&reg.name), next_free - 1);
                            }
                        }
                        Init::Free(next_free - 1, false)
                    }
                };
                state.push(StateBit {
                    side,
                    register: i,
                    name: reg.name.clone(),
                    current: cur,
                    next: Lit::FALSE,
                    init,
                });
            }
        }
        // Outputs pair by name (renamed ones by the port map); the next-state functions come
        // with them.
        let mut outputs = Vec::new();
        let mut unpaired = Vec::new();
        let mut used_out = vec![false; c.outputs.len()];
        for (i, o) in r.outputs.iter().enumerate() {
            match partner(&o.name).and_then(|n| c.output_index(&n)) {
                Some(j) if !used_out[j] => {
                    used_out[j] = true;
                    outputs.push((i, j));
                }
                _ => unpaired.push(format!("reference output {}", o.name)),
            }
        }
        for (j, o) in c.outputs.iter().enumerate() {
            if !used_out[j] {
                unpaired.push(format!("candidate output {}", o.name));
            }
        }
        if !unpaired.is_empty() {
            return Err(InputError::one(
                Diagnostic::error(
                    None,
                    format!("output bits without a partner: {}", unpaired.join(", ")),
                )
                .with_help("outputs pair by name; rename them to match, or pair them in a port map (--port-map)"),
            ));
        }
        let roots_r: Vec<Lit> = outputs
            .iter()
            .map(|&(i, _)| r.outputs[i].lit)
            .chain(r.registers.iter().map(|g| g.next))
            .collect();
        let roots_c: Vec<Lit> = outputs
            .iter()
            .map(|&(_, j)| c.outputs[j].lit)
            .chain(c.registers.iter().map(|g| g.next))
            .collect();
        let lr = aig.import(&r.aig, &map_r, &roots_r);
        let lc = aig.import(&c.aig, &map_c, &roots_c);
        let n = outputs.len();
        for (k, s) in state.iter_mut().enumerate() {
            s.next = if k < r.registers.len() {
                lr[n + k]
            } else {
                lc[n + k - r.registers.len()]
            };
        }
        let outputs = outputs
            .iter()
            .enumerate()
            .map(|(k, &(i, j))| OutPair {
                reference: i,
                candidate: j,
                lit_r: lr[k],
                lit_c: lc[k],
            })
            .collect();
        held.sort();
        held.dedup();
        start_equal.sort();
        Ok(Product {
            aig,
            free,
            state,
            outputs,
            held,
            start_equal,
        })
    }
}
