//! Equivalence of clocked designs: both designs cut at their registers (the state cut) into one
//! product machine (`product.rs`), register bits paired by name and by simulated behaviour from
//! the reset state (`simulate.rs`, `names.rs`), the pairing refined until it is inductive
//! (`correspond.rs`, signal correspondence), the output pairs proved under it, and otherwise a
//! bounded unrolling from reset (`bmc.rs`) for a trace that both designs replay (`trace.rs`),
//! then k-induction on what is still open (`kinduct.rs`).
//!
//! **Invariant:** `equivalent` only when the pairing is inductive from the reset state and every
//! output pair is equal under it (UNSAT or equal literals), or, for the pairs it leaves open, the
//! k-induction step at some depth k is UNSAT (`kinduct.rs`) and the unrolling from reset found no
//! difference in its first k cycles; `different` only with a trace that both
//! original designs replay to the reported first difference.

mod bmc;
mod correspond;
mod exact;
mod exact_text;
mod kinduct;
mod names;
mod product;
mod reach;
mod report;
mod simulate;
mod text;
mod trace;

pub use exact::{
    exact_cones, Claim, DeadRegister, Decide, Decided, ExactCone, ExactCones, ExactInput,
    ExactOptions, Influence, InfluenceEvidence, AUTO_EXACT_NODES, AUTO_EXACT_REGISTERS,
    DEFAULT_EXACT_CYCLES,
};
pub use product::{HeldInput, InitUnset, Side, StartEqual};
pub use reach::{cycle_cones, CycleCone, CycleCones};
pub use report::{
    ClockLine, KInductionLine, NameMismatch, OutputStatus, RegisterPair, SeqReport,
    UnpairedRegister,
};
pub use trace::{
    after_edge, first_difference, registers_ticking, replay, FirstDifference, InitialValue,
    OutputDifference, Replay, Trace, TraceCycle, TraceInput, TraceReset,
};

use crate::design::Design;
use crate::diag::InputError;
use crate::engine::Verdict;
use crate::sat::Limits;
use correspond::{Classes, Constrained};
use product::{Init, Product};
use std::collections::BTreeMap;

/// The clocks of `r` against `c` when either design has several (paired by name, as a trace
/// lists them); empty when each has at most one clock or the clocks do not pair.
pub fn clock_names(r: &Design, c: &Design) -> Vec<String> {
    product::paired_clocks(r, c, None)
        .ok()
        .flatten()
        .map(|v| v.into_iter().map(|k| k.name).collect())
        .unwrap_or_default()
}

/// Settings of a clocked check.
#[derive(Clone, Debug)]
pub struct SeqOptions {
    /// Cycles from reset the bounded unrolling checks (`--cycles`).
    pub cycles: usize,
    /// How registers without a reset start.
    pub init_unset: InitUnset,
    /// Leave port bits that one design lacks free.
    pub free_extra_inputs: bool,
    /// Simulated cycles for the pairing by behaviour.
    pub sim_cycles: usize,
    /// Simulated runs, in 64-run words.
    pub sim_words: usize,
    /// Time and conflict limits.
    pub limits: Limits,
    /// Deepest k-induction step tried on the output pairs the pairing leaves open (`0`: none;
    /// `None`: [`AUTO_K_INDUCTION`] when the product has at most [`AUTO_K_STATE`] state bits).
    pub k_induction: Option<usize>,
    /// A port map whose register lines pair registers (`--port-map`; its other lines must name
    /// the same port on both sides). Its pairs without a reset start equal (an assumption,
    /// reported); every pair is still proved inductive like any other.
    pub port_map: Option<std::sync::Arc<crate::portmap::BitMap>>,
    /// Products with more state bits than this (both designs) try the pairing that is
    /// inductive by structure alone before the SAT refinement ([`STRUCTURAL_FIRST_STATE`]).
    pub structural_first: usize,
}

/// Products with more state bits than this (both designs) try the pairing that is inductive by
/// structure alone before the solver's refinement by default (see [`check`]); smaller ones go straight to
/// the refinement, so their reports list every constant and duplicate register it proves.
pub const STRUCTURAL_FIRST_STATE: usize = 8192;

/// The depth k-induction tries by default.
pub const AUTO_K_INDUCTION: usize = 8;
/// The most state bits (both designs) for which k-induction runs by default.
pub const AUTO_K_STATE: usize = 4096;

impl Default for SeqOptions {
    fn default() -> Self {
        SeqOptions {
            cycles: 20,
            init_unset: InitUnset::Free,
            free_extra_inputs: false,
            sim_cycles: 64,
            sim_words: 4,
            limits: Limits::none(),
            k_induction: None,
            port_map: None,
            structural_first: STRUCTURAL_FIRST_STATE,
        }
    }
}

/// Why a clocked check could not give a verdict at all.
#[derive(Debug)]
pub enum SeqError {
    /// The designs cannot be paired (exit code 2).
    Input(InputError),
    /// An internal check failed: a trace did not replay (exit code 4).
    Internal(String),
}

/// Check two clocked designs (either may have no registers).
pub fn check(r: &Design, c: &Design, o: &SeqOptions) -> Result<SeqReport, SeqError> {
    let start = std::time::Instant::now();
    let mut p = Product::build(
        r,
        c,
        o.init_unset,
        o.free_extra_inputs,
        o.port_map.as_deref(),
    )
    .map_err(SeqError::Input)?;
    log::debug!(
        "clocked: product of {} nodes, {} state bits built in {:.2?}, memory {}",
        p.aig.len(),
        p.state.len(),
        start.elapsed(),
        crate::host::now_note()
    );
    let sim = simulate::simulate(&p, o.sim_cycles.max(1), o.sim_words.max(1), 0x5E9_0001);
    log::debug!("clocked: simulated by {:.2?}", start.elapsed());
    let mut classes = Classes::from_signatures(&p, &sim.signatures);
    classes.refine_by_init(&p);
    classes.refine_by_clock(&p);
    let name_checks = report::name_matches(&p, &sim, o.port_map.as_deref());
    let mut stopped = None;
    // A large product first tries the pairing that is inductive by structure alone (no solver):
    // when every output pair holds under it, or the unrolling finds a trace under it, the
    // solver's refinement to the greatest pairing is not needed for the verdict.
    let mut early = None;
    if p.state.len() > o.structural_first {
        let mut cs = classes.clone();
        let rounds = correspond::keep_structural(&mut p, &mut cs);
        let under = outputs_under(&mut p, &cs, &o.limits);
        log::debug!(
            "clocked: structural pairing after {rounds} round(s), {} output pair(s) open, by {:.2?}",
            under.1.len(),
            start.elapsed()
        );
        if under.1.is_empty() && under.2.is_none() {
            early = Some((cs, rounds, under, None));
        } else if let Some(f) = sim_found(&sim).filter(|f| f.cycle < o.cycles) {
            // The random runs already met a difference within the cycles asked: that run is
            // the trace (re-simulated on both designs below); unrolling a product this large
            // only to look for a shorter one costs more than the rest of the check.
            early = Some((cs, rounds, under, Some(f)));
        } else if under.2.is_none() {
            if let bmc::Bmc::Found(f) = bmc::unroll(&mut p, &cs, &under.1, o.cycles, &o.limits) {
                early = Some((cs, rounds, under, Some(f)));
            }
        }
    }
    let structural = early.is_some();
    let (classes, refinements, (mut status, pending, stop), mut found) = match early {
        Some(e) => e,
        None => {
            let refinements = match correspond::make_inductive(&mut p, &mut classes, &o.limits) {
                Ok(n) => n,
                Err(reason) => {
                    // Without an inductive pairing nothing is proved: keep no groups.
                    stopped = Some(reason);
                    classes.groups.clear();
                    0
                }
            };
            let under = outputs_under(&mut p, &classes, &o.limits);
            (classes, refinements, under, None)
        }
    };
    if let Some(reason) = stop {
        stopped.get_or_insert(reason);
    }
    log::debug!(
        "clocked: pairing inductive after {refinements} refinement(s), output pairs under it, by {:.2?}",
        start.elapsed()
    );
    let open_under_cut: Vec<usize> = pending.clone();
    let mut trace = None;
    let mut cycles_checked = 0;
    let mut clean = false;
    if !pending.is_empty() {
        let answer = match found.take() {
            Some(f) => bmc::Bmc::Found(f),
            None => bmc::unroll(&mut p, &classes, &pending, o.cycles, &o.limits),
        };
        match answer {
            bmc::Bmc::Found(f) => {
                let t = build_trace(r, c, &p, &f.free, &f.init, o.init_unset);
                trace = Some(confirm(r, c, &p, t, f.cycle)?);
                cycles_checked = f.cycle;
            }
            bmc::Bmc::Clean => {
                cycles_checked = o.cycles;
                clean = true;
            }
            bmc::Bmc::Stopped(reason, k) => {
                stopped.get_or_insert(reason);
                cycles_checked = k;
                if let Some(f) = sim_found(&sim) {
                    let t = build_trace(r, c, &p, &f.free, &f.init, o.init_unset);
                    trace = Some(confirm(r, c, &p, t, f.cycle)?);
                }
            }
        }
    }
    log::debug!(
        "clocked: unrolling done by {:.2?}, memory {}",
        start.elapsed(),
        crate::host::now_note()
    );
    // k-induction on what the pairing left open; the unrolling is its base case.
    let mut k_induction = None;
    if clean {
        let auto = if p.state.len() <= AUTO_K_STATE {
            AUTO_K_INDUCTION
        } else {
            0
        };
        let bound = o.k_induction.unwrap_or(auto).min(cycles_checked);
        if bound > 0 {
            let r = kinduct::prove(&mut p, &classes, &pending, bound, &o.limits);
            let proved_at = match r {
                kinduct::KInduction::Proved(d) => {
                    for &k in &pending {
                        status[k] = OutputStatus::Equivalent("k-induction");
                    }
                    Some(d)
                }
                kinduct::KInduction::NotInductive(_) => None,
                kinduct::KInduction::Stopped(reason, _) => {
                    stopped.get_or_insert(reason);
                    None
                }
            };
            k_induction = Some(KInductionLine { bound, proved_at });
        }
    }
    if let Some(t) = &trace {
        let fd = t.first_difference.as_ref().expect("confirmed");
        for d in &fd.outputs {
            if let Some(k) = p.outputs.iter().position(|op| {
                r.outputs[op.reference].name == d.reference
                    && c.outputs[op.candidate].name == d.candidate
            }) {
                status[k] = OutputStatus::Different;
            }
        }
    }
    let verdict = if trace.is_some() {
        Verdict::Different
    } else if status
        .iter()
        .all(|s| matches!(s, OutputStatus::Equivalent(_)))
    {
        Verdict::Equivalent
    } else {
        Verdict::Undecided
    };
    Ok(report::build(report::Parts {
        r,
        c,
        p: &p,
        classes: &classes,
        name_checks,
        status,
        open_under_cut,
        refinements,
        structural,
        verdict,
        trace,
        cycles_checked,
        cycles_asked: o.cycles,
        k_induction,
        stopped,
        init_unset: o.init_unset,
        port_map: o.port_map.as_deref(),
        sim_runs: o.sim_words.max(1) * 64,
        sim_cycles: o.sim_cycles.max(1),
        seconds: start.elapsed().as_secs_f64(),
    }))
}

/// The first output difference the random simulation met, as the inputs of its run in each
/// cycle up to it and its free initial values (to be re-simulated before it is reported).
fn sim_found(sim: &simulate::SimRun) -> Option<bmc::Found> {
    let (cycle, run) = sim.first_difference?;
    let free = sim.inputs[..=cycle]
        .iter()
        .map(|ws| ws.iter().map(|w| simulate::SimRun::bit(w, run)).collect())
        .collect();
    let init = sim
        .init
        .iter()
        .enumerate()
        .map(|(k, w)| (k as u32, simulate::SimRun::bit(w, run)))
        .collect();
    Some(bmc::Found { cycle, free, init })
}

/// Each output pair's status under the pairing `classes` (inductive, holding from reset), the
/// pairs it leaves open and why a query stopped, if one did. Checked on the reduced logic (each
/// paired register read through its group's representative).
fn outputs_under(
    p: &mut Product,
    classes: &Classes,
    limits: &Limits,
) -> (
    Vec<OutputStatus>,
    Vec<usize>,
    Option<crate::sat::StopReason>,
) {
    let mut status = vec![OutputStatus::Undecided; p.outputs.len()];
    let mut pending = Vec::new();
    let mut stopped = None;
    let roots: Vec<_> = p
        .outputs
        .iter()
        .flat_map(|op| [op.lit_r, op.lit_c])
        .collect();
    let reduced = correspond::reduce(p, classes, &roots);
    let xors: Vec<_> = p
        .outputs
        .iter()
        .zip(reduced.chunks(2))
        .map(|(op, red)| (op.lit_r == op.lit_c, p.aig.xor(red[0], red[1])))
        .collect();
    let mut cs = Constrained::new(p, classes, limits);
    for (k, &(same, x)) in xors.iter().enumerate() {
        if same {
            status[k] = OutputStatus::Equivalent("structure");
            continue;
        }
        if x == crate::aig::Lit::FALSE {
            status[k] = OutputStatus::Equivalent("induction");
            continue;
        }
        let l = cs.ts.lit(&p.aig, &mut cs.sat, x);
        match cs.sat.solve(&[l]) {
            crate::sat::SatResult::Unsat => status[k] = OutputStatus::Equivalent("induction"),
            crate::sat::SatResult::Sat => pending.push(k),
            crate::sat::SatResult::Stopped(reason) => {
                stopped.get_or_insert(reason);
                pending.push(k);
            }
        }
    }
    (status, pending, stopped)
}

/// A trace from per-cycle input values and free initial values.
fn build_trace(
    r: &Design,
    c: &Design,
    p: &Product,
    free: &[Vec<bool>],
    init: &BTreeMap<u32, bool>,
    init_unset: InitUnset,
) -> Trace {
    let mut initial = Vec::new();
    for s in &p.state {
        let d = if s.side == Side::Reference { r } else { c };
        if d.registers[s.register].init.is_some() {
            continue;
        }
        let value = match s.init {
            Init::Const(v) => v,
            Init::Free(k, inv) => init.get(&k).copied().unwrap_or(false) ^ inv,
        };
        initial.push(InitialValue {
            side: s.side,
            register: s.name.clone(),
            value,
        });
    }
    let others = match init_unset {
        InitUnset::Free => "the others at the values listed",
        InitUnset::Value(false) => "the others at 0 (--init-unset 0)",
        InitUnset::Value(true) => "the others at 1 (--init-unset 1)",
    };
    // Power-on values (`initial`, `reg q = 0;`) are named only where a design has them.
    let power_on = r
        .registers
        .iter()
        .chain(&c.registers)
        .any(|g| g.init.is_some() && g.reset.is_none());
    let start = if power_on {
        format!("registers with a reset start at their reset value, those with an initial value at it, {others}")
    } else {
        format!("registers with a reset start at their reset value, {others}")
    };
    let description = if p.clocks.is_empty() {
        format!("{start}; reset ports are held inactive and clocks at 0 in every cycle")
    } else {
        format!("{start}; reset ports are held inactive; clocks are at 0 and each cycle lists the clocks with an active edge at its end (the others' registers keep their values)")
    };
    let cycles = free
        .iter()
        .enumerate()
        .map(|(cycle, vals)| TraceCycle {
            cycle,
            inputs: p
                .free
                .iter()
                .zip(vals)
                .filter(|(f, _)| !f.tick)
                .map(|(f, &value)| TraceInput {
                    name: f.name.clone(),
                    side: f.side,
                    value,
                    candidate_name: f.candidate_name.clone(),
                })
                .collect(),
            ticked: (!p.clocks.is_empty()).then(|| {
                p.free
                    .iter()
                    .zip(vals)
                    .filter(|(f, &v)| f.tick && v)
                    .map(|(f, _)| f.name.clone())
                    .collect()
            }),
        })
        .collect();
    Trace {
        reset: TraceReset {
            description,
            held: p.held.clone(),
            initial,
            clocks: p.clocks.iter().map(|k| k.name.clone()).collect(),
        },
        cycles,
        first_difference: None,
        renamed_outputs: p
            .outputs
            .iter()
            .map(|o| (&r.outputs[o.reference].name, &c.outputs[o.candidate].name))
            .filter(|(a, b)| a != b)
            .map(|(a, b)| (a.clone(), b.clone()))
            .collect(),
    }
}

/// Replay `t` on both designs; its first difference must be in cycle `cycle`.
fn confirm(
    r: &Design,
    c: &Design,
    p: &Product,
    mut t: Trace,
    cycle: usize,
) -> Result<Trace, SeqError> {
    let rr = replay(r, Side::Reference, &t).map_err(SeqError::Internal)?;
    let cr = replay(c, Side::Candidate, &t).map_err(SeqError::Internal)?;
    let pairs: Vec<(usize, usize)> = p
        .outputs
        .iter()
        .map(|o| (o.reference, o.candidate))
        .collect();
    match first_difference(r, c, &pairs, &rr, &cr) {
        Some(fd) if fd.cycle == cycle => {
            t.first_difference = Some(fd);
            Ok(t)
        }
        other => Err(SeqError::Internal(format!(
            "a trace found for cycle {cycle} replays to {}",
            match other {
                Some(fd) => format!("a first difference in cycle {}", fd.cycle),
                None => "no difference".to_string(),
            }
        ))),
    }
}
