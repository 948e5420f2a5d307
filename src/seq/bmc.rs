//! Bounded unrolling of the product machine from the reset state (bounded model checking:
//! Biere, Cimatti, Clarke, Zhu, TACAS 1999): frame `k` is a copy of the logic whose state bits are
//! the next-state values of frame `k - 1` (frame 0: the initial values). It asks, frame by frame,
//! whether some output pair can differ in that cycle, so the first answer is a shortest trace.

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

/// Unroll `cycles` frames looking for a difference of the output pairs `watch`.
pub fn unroll(p: &mut Product, watch: &[usize], cycles: usize, limits: &Limits) -> Bmc {
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
    if miter == Lit::FALSE {
        return Bmc::Clean;
    }
    let mut sat = Sat::new(limits);
    let t = sat.fresh();
    sat.clause(&[t]);
    let mut init: BTreeMap<u32, CLit> = BTreeMap::new();
    let mut state: Vec<CLit> = p
        .state
        .iter()
        .map(|s| match s.init {
            Init::Const(v) => {
                if v {
                    t
                } else {
                    !t
                }
            }
            Init::Free(k) => *init.entry(k).or_insert_with(|| sat.fresh()),
        })
        .collect();
    let mut frames: Vec<Vec<CLit>> = Vec::new();
    for cycle in 0..cycles {
        let mut ts = Tseitin::new();
        let free: Vec<CLit> = p.free.iter().map(|_| sat.fresh()).collect();
        for (k, &v) in free.iter().enumerate() {
            ts.bind(p.aig.input_lit(k).node(), v);
        }
        for (s, &v) in p.state.iter().zip(&state) {
            ts.bind(s.current.node(), v);
        }
        frames.push(free);
        let m = ts.lit(&p.aig, &mut sat, miter);
        match sat.solve(&[m]) {
            SatResult::Sat => {
                let free = frames
                    .iter()
                    .map(|f| f.iter().map(|&v| sat.value(v)).collect())
                    .collect();
                let init = init.iter().map(|(&k, &v)| (k, sat.value(v))).collect();
                return Bmc::Found(Found { cycle, free, init });
            }
            SatResult::Stopped(r) => return Bmc::Stopped(r, cycle),
            SatResult::Unsat => sat.clause(&[!m]),
        }
        state = p
            .state
            .iter()
            .map(|s| ts.lit(&p.aig, &mut sat, s.next))
            .collect();
    }
    Bmc::Clean
}
