//! The report of a clocked check: register pairs with how each was found, constants, unpaired
//! registers, refuted name matches with their evidence, output pairs, and the trace; its text
//! form (a trace is a table, one row per cycle, buses by value) and its JSON form.

use super::correspond::Classes;
use super::names::normalize;
use super::product::{HeldInput, Init, InitUnset, Product, Side};
use super::simulate::SimRun;
use super::trace::{replay, Trace};
use crate::design::Design;
use crate::engine::Verdict;
use crate::portmap::BitMap;
use crate::sat::StopReason;
use serde::{Deserialize, Serialize};
use std::collections::BTreeMap;

/// A reference register bit paired with a candidate register bit.
#[derive(Clone, Debug, Serialize)]
pub struct RegisterPair {
    /// The reference register bit.
    pub reference: String,
    /// The candidate register bit.
    pub candidate: String,
    /// The candidate holds the complement.
    pub inverted: bool,
    /// `port map` (a register line of `--port-map`), `name` (the names agree up to synthesis
    /// renamings) or `behaviour`.
    pub found_by: &'static str,
}

/// A register bit with no partner in the other design.
#[derive(Clone, Debug, Serialize)]
pub struct UnpairedRegister {
    /// Whose register.
    pub side: Side,
    /// The register bit.
    pub register: String,
    /// `constant 0`/`constant 1` when it never changes from reset, `duplicate of X` when it always
    /// equals another register of its own design, else `no partner`.
    pub note: String,
}

/// Registers whose names match but that are not paired, with the evidence.
#[derive(Clone, Debug, Serialize)]
pub struct NameMismatch {
    /// The reference register bit.
    pub reference: String,
    /// The candidate register bit.
    pub candidate: String,
    /// Why they are not a pair.
    pub evidence: String,
}

/// The status of one output pair.
#[derive(Copy, Clone, Debug, PartialEq, Eq)]
pub enum OutputStatus {
    /// Equal in every reachable state; the method (`structure` or `induction`).
    Equivalent(&'static str),
    /// Differs on the trace.
    Different,
    /// Neither.
    Undecided,
}

/// One output pair in the report.
#[derive(Clone, Debug, Serialize)]
pub struct OutputLine {
    /// The reference output bit.
    pub reference: String,
    /// The candidate output bit.
    pub candidate: String,
    /// `equivalent`, `different` or `undecided`.
    pub status: &'static str,
    /// How it was decided.
    pub method: &'static str,
}

/// The report of a clocked check.
#[derive(Clone, Debug, Serialize)]
pub struct SeqReport {
    /// Schema of this JSON form.
    pub schema: u32,
    /// `clocked`.
    pub kind: &'static str,
    /// The verdict.
    pub verdict: &'static str,
    /// The reference.
    pub reference: String,
    /// The candidate.
    pub candidate: String,
    /// Register bits of each design.
    pub registers: [usize; 2],
    /// Inputs held at a value in every cycle.
    pub held: Vec<HeldInput>,
    /// Registers without a reset and how they start.
    pub without_reset: Vec<String>,
    /// `free` or the value given by `--init-unset`.
    pub init_unset: String,
    /// Register pairs (inductive from reset).
    pub pairs: Vec<RegisterPair>,
    /// Registers without a partner.
    pub unpaired: Vec<UnpairedRegister>,
    /// Name matches that did not become pairs.
    pub name_mismatches: Vec<NameMismatch>,
    /// The port map file (`--port-map`), when one was given.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub port_map: Option<String>,
    /// The port bits a port map pairs under different names, as runs by bus (inputs, held
    /// inputs among them, then outputs).
    #[serde(skip_serializing_if = "Vec::is_empty")]
    pub paired: Vec<crate::engine::pair_runs::PairedRun>,
    /// Register pairs of the port map that did not become pairs (or not with the inversion
    /// the map states), with the evidence.
    #[serde(skip_serializing_if = "Vec::is_empty")]
    pub map_mismatches: Vec<NameMismatch>,
    /// The assumption a port map adds: its register pairs without a reset start equal (the
    /// candidate at the complement for `~`), so the verdict holds for runs that start so.
    #[serde(skip_serializing_if = "Vec::is_empty")]
    pub assumed_start_equal: Vec<super::product::StartEqual>,
    /// How the pairing was found and proved.
    pub pairing_evidence: String,
    /// Induction counterexamples that refined the pairing.
    pub refinements: usize,
    /// The output pairs.
    pub outputs: Vec<OutputLine>,
    /// What the verdict covers.
    pub scope: crate::engine::Scope,
    /// Output pairs not proved under the pairing (before the unrolling).
    pub open_under_cut: Vec<String>,
    /// Cycles from reset checked without a difference by the unrolling.
    pub cycles_checked: usize,
    /// Cycles asked for (`--cycles`).
    pub cycles_asked: usize,
    /// k-induction on the output pairs left open, when it ran.
    #[serde(skip_serializing_if = "Option::is_none")]
    pub k_induction: Option<KInductionLine>,
    /// Why a limit stopped part of the check.
    pub stopped: Option<StopReason>,
    /// The trace, for `different`.
    pub trace: Option<Trace>,
    /// Output values along the trace: per cycle, (reference, candidate) values of the outputs that
    /// differ at the first difference.
    #[serde(skip)]
    pub trace_outputs: Vec<Vec<(bool, bool)>>,
    /// Seconds taken.
    pub seconds: f64,
}

/// What k-induction on the open output pairs gave.
#[derive(Clone, Debug, PartialEq, Eq, Serialize, Deserialize)]
pub struct KInductionLine {
    /// The deepest step tried (at most the cycles the unrolling checked, its base case).
    pub bound: usize,
    /// The depth at which the step held (the pairs are then proved), if one did.
    pub proved_at: Option<usize>,
}

/// A name match found before the pairing is proved.
pub struct NameMatch {
    r: usize,
    c: usize,
    sim: Option<String>,
    /// From a register line of the port map, with the inversion it states.
    by_map: Option<bool>,
}

/// Register bits of the two designs whose names agree after `normalize`, and the register pairs
/// of the port map `map` (whose registers do not match by name), with the simulation's evidence
/// when their sequences differ.
pub fn name_matches(p: &Product, sim: &SimRun, map: Option<&BitMap>) -> Vec<NameMatch> {
    let mut by_name: BTreeMap<String, usize> = BTreeMap::new();
    let mut ref_at: BTreeMap<&str, usize> = BTreeMap::new();
    let in_map = |side: Side, name: &str| {
        map.is_some_and(|m| match side {
            Side::Candidate => m
                .registers
                .iter()
                .any(|r| m.pairs.get(r).is_some_and(|c| c == name)),
            _ => m.registers.contains(name),
        })
    };
    for (k, s) in p.state.iter().enumerate() {
        if s.side == Side::Reference {
            ref_at.insert(&s.name, k);
            if !in_map(s.side, &s.name) {
                by_name.entry(normalize(&s.name)).or_insert(k);
            }
        }
    }
    let evidence = |j: usize, k: usize, inverted: Option<bool>| {
        let (a, b) = (&sim.signatures[j], &sim.signatures[k]);
        let differ = |inv: u64| a.iter().zip(b).position(|(x, y)| x ^ y ^ inv != 0);
        let w = match inverted {
            None => differ(0).zip(differ(!0)).map(|(w, _)| w),
            Some(inv) => differ(if inv { !0 } else { 0 }),
        };
        w.map(|w| {
            format!(
                "their values {}differ in simulated cycle {} from reset",
                if inverted == Some(true) {
                    "(one inverted) "
                } else {
                    ""
                },
                w / sim.words
            )
        })
    };
    let mut out = Vec::new();
    for (k, s) in p.state.iter().enumerate() {
        if s.side != Side::Candidate {
            continue;
        }
        if in_map(s.side, &s.name) {
            continue;
        }
        if let Some(&j) = by_name.get(&normalize(&s.name)) {
            out.push(NameMatch {
                r: j,
                c: k,
                sim: evidence(j, k, None),
                by_map: None,
            });
        }
    }
    if let Some(m) = map {
        let cand_at: BTreeMap<&str, usize> = p
            .state
            .iter()
            .enumerate()
            .filter(|(_, s)| s.side == Side::Candidate)
            .map(|(k, s)| (s.name.as_str(), k))
            .collect();
        for rn in &m.registers {
            let Some(cn) = m.pairs.get(rn) else { continue };
            if let (Some(&j), Some(&k)) = (ref_at.get(rn.as_str()), cand_at.get(cn.as_str())) {
                let inv = m.inverted.contains(cn);
                out.push(NameMatch {
                    r: j,
                    c: k,
                    sim: evidence(j, k, Some(inv)),
                    by_map: Some(inv),
                });
            }
        }
    }
    out
}

/// What [`build`] needs.
#[allow(missing_docs)]
pub struct Parts<'a> {
    pub r: &'a Design,
    pub c: &'a Design,
    pub p: &'a Product,
    pub classes: &'a Classes,
    pub name_checks: Vec<NameMatch>,
    pub status: Vec<OutputStatus>,
    pub open_under_cut: Vec<usize>,
    pub refinements: usize,
    /// The pairing is the one inductive by structure alone (no SAT refinement).
    pub structural: bool,
    pub verdict: Verdict,
    pub trace: Option<Trace>,
    pub cycles_checked: usize,
    pub cycles_asked: usize,
    pub k_induction: Option<KInductionLine>,
    pub stopped: Option<StopReason>,
    pub init_unset: InitUnset,
    pub port_map: Option<&'a BitMap>,
    pub sim_runs: usize,
    pub sim_cycles: usize,
    pub seconds: f64,
}

/// Assemble the report.
pub fn build(x: Parts<'_>) -> SeqReport {
    let p = x.p;
    let at: BTreeMap<u32, usize> = p
        .state
        .iter()
        .enumerate()
        .map(|(k, s)| (s.current.node(), k))
        .collect();
    let mut group_of: BTreeMap<usize, usize> = BTreeMap::new();
    let mut phase_of: BTreeMap<usize, bool> = BTreeMap::new();
    let mut pairs = Vec::new();
    let mut note: BTreeMap<usize, String> = BTreeMap::new();
    for (gi, g) in x.classes.groups.iter().enumerate() {
        let refs: Vec<(usize, bool)> = g
            .iter()
            .filter(|m| !m.is_const())
            .map(|m| (at[&m.node()], m.is_complemented()))
            .collect();
        for &(k, inv) in &refs {
            group_of.insert(k, gi);
            phase_of.insert(k, inv);
        }
        if g[0].is_const() {
            for &(k, inv) in &refs {
                note.insert(k, format!("constant {}", inv as u8));
            }
            continue;
        }
        let first_r = refs
            .iter()
            .find(|(k, _)| p.state[*k].side == Side::Reference);
        let first_c = refs
            .iter()
            .find(|(k, _)| p.state[*k].side == Side::Candidate);
        for &(k, inv) in &refs {
            let s = &p.state[k];
            match (s.side, first_r, first_c) {
                (Side::Candidate, Some(&(j, jinv)), _) => {
                    let rn = &p.state[j].name;
                    let by_map = x.port_map.is_some_and(|m| {
                        m.registers.contains(rn)
                            && m.pairs.get(rn) == Some(&s.name)
                            && m.inverted.contains(&s.name) == (inv != jinv)
                    });
                    pairs.push(RegisterPair {
                        reference: rn.clone(),
                        candidate: s.name.clone(),
                        inverted: inv != jinv,
                        found_by: if by_map {
                            "port map"
                        } else if normalize(rn) == normalize(&s.name) {
                            "name"
                        } else {
                            "behaviour"
                        },
                    });
                }
                (Side::Reference, _, Some(_)) => {}
                (_, _, _) => {
                    let (j, _) = refs[0];
                    if j != k {
                        note.insert(k, format!("duplicate of {}", p.state[j].name));
                    }
                }
            }
        }
    }
    let order: BTreeMap<&str, usize> = p
        .state
        .iter()
        .enumerate()
        .filter(|(_, s)| s.side == Side::Reference)
        .map(|(k, s)| (s.name.as_str(), k))
        .collect();
    pairs.sort_by_key(|x: &RegisterPair| {
        (
            order.get(x.reference.as_str()).copied(),
            x.candidate.clone(),
        )
    });
    let unpaired = p
        .state
        .iter()
        .enumerate()
        .filter(|(k, s)| {
            let paired = group_of.get(k).is_some_and(|&g| {
                let grp = &x.classes.groups[g];
                !grp[0].is_const()
                    && grp
                        .iter()
                        .any(|m| !m.is_const() && p.state[at[&m.node()]].side != s.side)
            });
            !paired
        })
        .map(|(k, s)| UnpairedRegister {
            side: s.side,
            register: s.name.clone(),
            note: note
                .get(&k)
                .cloned()
                .unwrap_or_else(|| "no partner".to_string()),
        })
        .collect();
    let apart = |m: &&NameMatch| {
        !group_of.contains_key(&m.r)
            || group_of.get(&m.r) != group_of.get(&m.c)
            || m.by_map.is_some_and(|inv| {
                phase_of.get(&m.r).copied().unwrap_or(false)
                    ^ phase_of.get(&m.c).copied().unwrap_or(false)
                    != inv
            })
    };
    let mismatch = |m: &NameMatch| NameMismatch {
        reference: p.state[m.r].name.clone(),
        candidate: p.state[m.c].name.clone(),
        evidence: m.sim.clone().unwrap_or_else(|| {
            let (a, b) = (p.state[m.r].init, p.state[m.c].init);
            let shared = match (a, b) {
                (Init::Free(i, _), Init::Free(j, _)) => i == j,
                _ => false,
            };
            if !shared && (a != b || matches!(a, Init::Free(..))) {
                "their initial values may differ".to_string()
            } else {
                "equal in simulation, but an induction counterexample separated them".to_string()
            }
        }),
    };
    let name_mismatches = x
        .name_checks
        .iter()
        .filter(|m| m.by_map.is_none())
        .filter(apart)
        .map(mismatch)
        .collect();
    let map_mismatches = x
        .name_checks
        .iter()
        .filter(|m| m.by_map.is_some())
        .filter(apart)
        .map(mismatch)
        .collect();
    let without_reset: Vec<String> = p
        .state
        .iter()
        .filter(|s| {
            let d = if s.side == Side::Reference { x.r } else { x.c };
            d.registers[s.register].init.is_none()
        })
        .map(|s| format!("{} {}", s.side.word(), s.name))
        .collect();
    let outputs: Vec<OutputLine> = p
        .outputs
        .iter()
        .zip(&x.status)
        .map(|(o, st)| OutputLine {
            reference: x.r.outputs[o.reference].name.clone(),
            candidate: x.c.outputs[o.candidate].name.clone(),
            status: match st {
                OutputStatus::Equivalent(_) => "equivalent",
                OutputStatus::Different => "different",
                OutputStatus::Undecided => "undecided",
            },
            method: match st {
                OutputStatus::Equivalent(m) => m,
                OutputStatus::Different => "unrolling",
                OutputStatus::Undecided => "none",
            },
        })
        .collect();
    let mut trace_outputs = Vec::new();
    if let Some(t) = &x.trace {
        if let (Ok(rr), Ok(cr), Some(fd)) = (
            replay(x.r, Side::Reference, t),
            replay(x.c, Side::Candidate, t),
            &t.first_difference,
        ) {
            for (ro, co) in rr.outputs.iter().zip(&cr.outputs) {
                trace_outputs.push(
                    fd.outputs
                        .iter()
                        .map(|d| {
                            let i = x.r.output_index(&d.reference).unwrap_or(0);
                            let j = x.c.output_index(&d.candidate).unwrap_or(0);
                            (ro[i], co[j])
                        })
                        .collect(),
                );
            }
        }
    }
    SeqReport {
        schema: 1,
        kind: "clocked",
        verdict: x.verdict.word(),
        reference: x.r.name.clone(),
        candidate: x.c.name.clone(),
        registers: [x.r.registers.len(), x.c.registers.len()],
        held: p.held.clone(),
        without_reset,
        init_unset: match x.init_unset {
            InitUnset::Free => "free".to_string(),
            InitUnset::Value(v) => (v as u8).to_string(),
        },
        pairs,
        unpaired,
        name_mismatches,
        port_map: x.port_map.map(|m| m.file.clone()),
        paired: renamed_runs(p, x.r, x.c),
        map_mismatches,
        assumed_start_equal: p.start_equal.clone(),
        pairing_evidence: if x.structural {
            format!(
                "grouped by equal or complementary values in {} simulated runs of {} cycles from reset, kept where the initial values agree, then split until every member's next value is its representative's as logic (inductive by structure, without SAT) after {} round(s)",
                x.sim_runs, x.sim_cycles,
                x.refinements
            )
        } else {
            format!(
                "grouped by equal or complementary values in {} simulated runs of {} cycles from reset, kept where the initial values agree, then proved inductive by SAT after {} refinement(s)",
                x.sim_runs, x.sim_cycles,
                x.refinements
            )
        },
        refinements: x.refinements,
        outputs,
        scope: crate::engine::Scope::ClockedFromReset,
        open_under_cut: x
            .open_under_cut
            .iter()
            .map(|&k| x.r.outputs[p.outputs[k].reference].name.clone())
            .collect(),
        cycles_checked: x.cycles_checked,
        cycles_asked: x.cycles_asked,
        k_induction: x.k_induction,
        stopped: x.stopped,
        trace: x.trace,
        trace_outputs,
        seconds: x.seconds,
    }
}

/// The port bits of the product paired under different names (a port map's renamed ports),
/// as runs by bus: inputs (held ones too) in the reference's order, then outputs.
fn renamed_runs(p: &Product, r: &Design, c: &Design) -> Vec<crate::engine::pair_runs::PairedRun> {
    use crate::engine::pair_runs::{runs, Bit};
    let renamed: BTreeMap<&str, &str> = p
        .free
        .iter()
        .filter_map(|f| Some((f.name.as_str(), f.candidate_name.as_deref()?)))
        .chain(
            p.held
                .iter()
                .filter_map(|h| Some((h.name.as_str(), h.candidate_name.as_deref()?))),
        )
        .collect();
    let mut inputs: Vec<(Bit, Bit)> = Vec::new();
    for b in &r.inputs {
        if let Some(j) = renamed.get(b.name.as_str()).and_then(|n| c.input_index(n)) {
            let cb = &c.inputs[j];
            inputs.push(((b.port.as_str(), b.index), (cb.port.as_str(), cb.index)));
        }
    }
    let outputs: Vec<(Bit, Bit)> = p
        .outputs
        .iter()
        .map(|o| (&r.outputs[o.reference], &c.outputs[o.candidate]))
        .filter(|(a, b)| a.name != b.name)
        .map(|(a, b)| ((a.port.as_str(), a.index), (b.port.as_str(), b.index)))
        .collect();
    let mut out = runs("input", &inputs);
    out.extend(runs("output", &outputs));
    out
}
