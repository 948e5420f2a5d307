//! k-induction on the miter of the product machine (Sheeran, Singh, Stalmarck, "Checking
//! safety properties using induction and a SAT-solver", FMCAD 2000), for designs whose state
//! encodings differ so that no register pairing is inductive (a one-hot against a binary state
//! machine, a counter whose rewrite differs only in unreachable states).
//!
//! The step at depth k: frames 0..=k from a free state, the proved register groups holding in
//! every frame (they hold in every reachable state), the watched output pairs equal in frames
//! 0..k-1, the k+1 states pairwise distinct (a loop-free path), and some watched pair differing
//! in frame k. UNSAT, together with the bounded unrolling from reset finding no difference in
//! cycles 0..k-1, proves the pairs equal in every cycle of every run from reset: the shortest
//! run to a difference is loop-free, so either it is shorter than k or its last k + 1 frames
//! satisfy the step.

use super::correspond::Classes;
use super::product::Product;
use crate::aig::Lit;
use crate::cnf::Tseitin;
use crate::sat::{CLit, ClauseSink, Limits, Sat, SatResult, StopReason};

/// The answer of k-induction.
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub enum KInduction {
    /// The step holds at this depth.
    Proved(usize),
    /// No depth up to the bound made the step hold.
    NotInductive(usize),
    /// A limit stopped it at this depth.
    Stopped(StopReason, usize),
}

/// Try depths 1..=`max_depth` for the output pairs `watch`, with `classes` (an inductive
/// grouping) assumed in every frame.
pub fn prove(
    p: &mut Product,
    classes: &Classes,
    watch: &[usize],
    max_depth: usize,
    limits: &Limits,
) -> KInduction {
    let xors: Vec<Lit> = watch
        .iter()
        .map(|&k| (p.outputs[k].lit_r, p.outputs[k].lit_c))
        .collect::<Vec<_>>()
        .into_iter()
        .map(|(a, b)| p.aig.xor(a, b))
        .collect();
    let miter = p.aig.or_all(&xors);
    if miter == Lit::FALSE {
        return KInduction::Proved(0);
    }
    for depth in 1..=max_depth {
        match step(p, classes, miter, depth, limits) {
            SatResult::Unsat => return KInduction::Proved(depth),
            SatResult::Sat => {}
            SatResult::Stopped(r) => return KInduction::Stopped(r, depth),
        }
    }
    KInduction::NotInductive(max_depth)
}

/// The step query at one depth.
fn step(p: &Product, classes: &Classes, miter: Lit, depth: usize, limits: &Limits) -> SatResult {
    let mut sat = Sat::new(limits);
    let mut state: Vec<CLit> = p.state.iter().map(|_| sat.fresh()).collect();
    let mut states: Vec<Vec<CLit>> = Vec::new();
    let mut last = None;
    for frame in 0..=depth {
        let mut ts = Tseitin::new();
        for k in 0..p.free.len() {
            let v = sat.fresh();
            ts.bind(p.aig.input_lit(k).node(), v);
        }
        for (s, &v) in p.state.iter().zip(&state) {
            ts.bind(s.current.node(), v);
        }
        // The groups hold in every frame.
        for g in &classes.groups {
            let r = ts.lit(&p.aig, &mut sat, g[0]);
            for &m in &g[1..] {
                let l = ts.lit(&p.aig, &mut sat, m);
                sat.clause(&[!r, l]);
                sat.clause(&[r, !l]);
            }
        }
        let m = ts.lit(&p.aig, &mut sat, miter);
        if frame < depth {
            sat.clause(&[!m]);
        } else {
            last = Some(m);
        }
        // Distinct from every earlier state.
        for earlier in &states {
            let mut any = Vec::new();
            for (&a, &b) in earlier.iter().zip(&state) {
                if a == b {
                    continue;
                }
                let d = sat.fresh();
                crate::cnf::xor_if(&mut sat, d, a, b);
                any.push(d);
            }
            sat.clause(&any);
        }
        let next: Vec<CLit> = if frame < depth {
            p.state
                .iter()
                .map(|s| ts.lit(&p.aig, &mut sat, s.next))
                .collect()
        } else {
            Vec::new()
        };
        states.push(std::mem::replace(&mut state, next));
    }
    match last {
        Some(m) => sat.solve(&[m]),
        None => SatResult::Unsat,
    }
}
