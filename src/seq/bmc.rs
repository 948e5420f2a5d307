//! Bounded unrolling of the product machine from the reset state (bounded model checking:
//! Biere, Cimatti, Clarke, Zhu, TACAS 1999): frame `k` is a copy of the logic whose state bits are
//! the next-state values of frame `k - 1` (frame 0: the initial values). It asks, frame by frame,
//! whether some output pair can differ in that cycle, so the first answer is a shortest trace.
//!
//! The frames hold the logic reduced by the proved register pairing (each paired register read
//! through its group's representative: the groups hold in every state reachable from reset, so
//! the answers are the same), and frame `j` of the check of cycle `k` holds only the logic that
//! reaches the watched outputs in the `k - j` cycles that follow.

use super::correspond::{reduce, Classes};
use super::product::{Init, Product};
use crate::aig::Lit;
use crate::cnf::Tseitin;
use crate::sat::{CLit, ClauseSink, Limits, Sat, SatResult, StopReason};
use std::collections::BTreeMap;

/// A run found by the unrolling.
#[derive(Clone, Debug)]
pub struct Found {
    /// The cycle where an output pair differs.
    pub cycle: usize,
    /// Per cycle `0..=cycle`, the value of every per-cycle input.
    pub free: Vec<Vec<bool>>,
    /// The value of every free initial value, by number.
    pub init: BTreeMap<u32, bool>,
}

/// The answer of the unrolling.
#[derive(Clone, Debug)]
pub enum Bmc {
    /// A difference in cycle `found.cycle`.
    Found(Found),
    /// No difference in cycles `0..cycles`.
    Clean,
    /// Stopped by a limit after this many cycles were checked clean.
    Stopped(StopReason, usize),
}

/// Unroll `cycles` frames looking for a difference of the output pairs `watch`; `classes` must
/// hold in every state reachable from reset (an inductive pairing, or none).
pub fn unroll(
    p: &mut Product,
    classes: &Classes,
    watch: &[usize],
    cycles: usize,
    limits: &Limits,
) -> Bmc {
    let xors: Vec<Lit> = watch
        .iter()
        .map(|&k| {
            let o = &p.outputs[k];
            (o.lit_r, o.lit_c)
        })
        .collect::<Vec<_>>()
        .into_iter()
        .map(|(a, b)| p.aig.xor(a, b))
        .collect();
    let miter = p.aig.or_all(&xors);
    let miter = reduce(p, classes, &[miter])[0];
    if miter == Lit::FALSE {
        return Bmc::Clean;
    }
    let nexts: Vec<Lit> = p.state.iter().map(|s| s.next).collect();
    let nexts = reduce(p, classes, &nexts);
    let at: BTreeMap<u32, usize> = p
        .state
        .iter()
        .enumerate()
        .map(|(k, s)| (s.current.node(), k))
        .collect();
    let mut sat = Sat::new(limits);
    let t = sat.fresh();
    sat.clause(&[t]);
    let mut init: BTreeMap<u32, CLit> = BTreeMap::new();
    // Frame j: its encoder (per-cycle inputs bound up front) and its bound state bits.
    let mut frames: Vec<(Tseitin, Vec<CLit>, Vec<bool>)> = Vec::new();
    // Backward cones of the miter: back[i] = the state bits it reads i cycles before.
    let mut back: Vec<Vec<usize>> = vec![state_support(p, &at, &[miter])];
    for cycle in 0..cycles {
        let mut ts = Tseitin::new();
        let free: Vec<CLit> = p.free.iter().map(|_| sat.fresh()).collect();
        for (k, &v) in free.iter().enumerate() {
            ts.bind(p.aig.input_lit(k).node(), v);
        }
        frames.push((ts, free, vec![false; p.state.len()]));
        if cycle > 0 {
            let prev: Vec<Lit> = back[cycle - 1].iter().map(|&k| nexts[k]).collect();
            back.push(state_support(p, &at, &prev));
        }
        // Bind, frame by frame from reset, the state bits the check of this cycle reads.
        for j in 0..=cycle {
            for &k in &back[cycle - j] {
                if frames[j].2[k] {
                    continue;
                }
                let v = if j == 0 {
                    match p.state[k].init {
                        Init::Const(v) => {
                            if v {
                                t
                            } else {
                                !t
                            }
                        }
                        Init::Free(n, inv) => {
                            let v = *init.entry(n).or_insert_with(|| sat.fresh());
                            if inv {
                                !v
                            } else {
                                v
                            }
                        }
                    }
                } else {
                    frames[j - 1].0.lit(&p.aig, &mut sat, nexts[k])
                };
                let f = &mut frames[j];
                f.0.bind(p.state[k].current.node(), v);
                f.2[k] = true;
            }
        }
        let m = frames[cycle].0.lit(&p.aig, &mut sat, miter);
        match sat.solve(&[m]) {
            SatResult::Sat => {
                let free = frames
                    .iter()
                    .map(|f| f.1.iter().map(|&v| sat.value(v)).collect())
                    .collect();
                let init = init.iter().map(|(&k, &v)| (k, sat.value(v))).collect();
                return Bmc::Found(Found { cycle, free, init });
            }
            SatResult::Stopped(r) => return Bmc::Stopped(r, cycle),
            SatResult::Unsat => sat.clause(&[!m]),
        }
    }
    Bmc::Clean
}

/// The state bits (indices, ascending) in the combinational cone of `roots`.
fn state_support(p: &Product, at: &BTreeMap<u32, usize>, roots: &[Lit]) -> Vec<usize> {
    let mut out: Vec<usize> = p
        .aig
        .cone_inputs(roots)
        .into_iter()
        .filter_map(|k| at.get(&p.aig.inputs()[k as usize]).copied())
        .collect();
    out.sort_unstable();
    out
}
