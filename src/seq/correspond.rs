//! Signal correspondence on register bits (van Eijk, "Sequential equivalence checking based on
//! structural similarities", IEEE TCAD 2000): group state bits whose simulated value sequences
//! are equal or complementary, keep only groups that hold in the initial state, then prove the
//! grouping inductive: assuming every group holds now, each must hold after the clock edge. Every
//! SAT counterexample to that step splits the groups by the next-state values it gives, until
//! the grouping is inductive (it holds in every state reachable from reset).
//!
//! The step is checked on the speculatively reduced logic ([`reduce`]): every group member's
//! current value replaced by its representative's, so that logic the two designs share up to
//! register names and inversions folds into one cone by structural hashing and most step miters
//! are constant before the solver sees them. Sound because the step assumes the groups hold.

use super::product::{Init, Product};
use crate::aig::{eval, Lit, Node};
use crate::cnf::Tseitin;
use crate::sat::{Limits, Sat, SatResult, StopReason};
use std::collections::BTreeMap;

/// Groups of state literals (a state bit's current value, possibly complemented) that are equal
/// in every reachable state; the first literal of each group is its representative, and
/// `Lit::FALSE` as representative makes a group of constants.
#[derive(Clone, Debug, Default)]
pub struct Classes {
    /// The groups, each with at least two members.
    pub groups: Vec<Vec<Lit>>,
}

/// Where each state bit's current-value node sits: node index -> state index.
fn state_index(p: &Product) -> BTreeMap<u32, usize> {
    p.state
        .iter()
        .enumerate()
        .map(|(k, s)| (s.current.node(), k))
        .collect()
}

impl Classes {
    /// Groups from simulation signatures: equal or complementary sequences, all-zero ones with
    /// the constant.
    pub fn from_signatures(p: &Product, sigs: &[Vec<u64>]) -> Classes {
        let mut by_sig: BTreeMap<Vec<u64>, Vec<Lit>> = BTreeMap::new();
        for (k, sig) in sigs.iter().enumerate() {
            let phase = sig.first().is_some_and(|w| w & 1 == 1);
            let key: Vec<u64> = if phase {
                sig.iter().map(|w| !w).collect()
            } else {
                sig.clone()
            };
            by_sig
                .entry(key)
                .or_default()
                .push(p.state[k].current.xor_complement(phase));
        }
        let mut groups = Vec::new();
        for (key, mut members) in by_sig {
            if key.iter().all(|&w| w == 0) {
                members.insert(0, Lit::FALSE);
            }
            if members.len() > 1 {
                groups.push(members);
            }
        }
        Classes { groups }
    }

    /// Split every group by `key` of its members, keeping parts of two or more.
    fn refine_by<K: Ord>(&mut self, mut key: impl FnMut(Lit) -> K) {
        let mut out = Vec::new();
        for g in &self.groups {
            let mut parts: BTreeMap<K, Vec<Lit>> = BTreeMap::new();
            for &m in g {
                parts.entry(key(m)).or_default().push(m);
            }
            // Keep member order: the representative stays first in its part.
            let mut parts: Vec<Vec<Lit>> = parts.into_values().filter(|v| v.len() > 1).collect();
            parts.sort_by_key(|v| g.iter().position(|m| *m == v[0]));
            out.extend(parts);
        }
        self.groups = out;
    }

    /// Keep only what holds in the initial state: constants with their reset value, free initial
    /// values only with themselves.
    pub fn refine_by_init(&mut self, p: &Product) {
        let at = state_index(p);
        self.refine_by(|m| {
            if m.is_const() {
                return Init::Const(m.is_complemented());
            }
            match p.state[at[&m.node()]].init {
                Init::Const(v) => Init::Const(v ^ m.is_complemented()),
                // A free value only equals itself, in its own phase.
                Init::Free(k, inv) => Init::Free(k * 2 + (m.is_complemented() ^ inv) as u32, false),
            }
        });
    }
}

/// The next-state literal of a group member.
pub fn next_of(p: &Product, at: &BTreeMap<u32, usize>, m: Lit) -> Lit {
    if m.is_const() {
        return m;
    }
    p.state[at[&m.node()]]
        .next
        .xor_complement(m.is_complemented())
}

/// A solver over one copy of the product with every group asserted on the current state.
pub struct Constrained<'a> {
    /// The solver.
    pub sat: Sat<'a>,
    /// The AIG-to-CNF map.
    pub ts: Tseitin,
}

impl Constrained<'_> {
    /// A solver in which every group holds on the current state.
    pub fn new(p: &Product, classes: &Classes, limits: &Limits) -> Self {
        let mut sat = Sat::new(limits);
        let mut ts = Tseitin::new();
        for g in &classes.groups {
            let r = ts.lit(&p.aig, &mut sat, g[0]);
            for &m in &g[1..] {
                let l = ts.lit(&p.aig, &mut sat, m);
                crate::sat::ClauseSink::clause(&mut sat, &[!r, l]);
                crate::sat::ClauseSink::clause(&mut sat, &[r, !l]);
            }
        }
        Constrained { sat, ts }
    }

    /// The model's value of every AIG input of `p` (inputs outside the encoded cones: 0).
    pub fn inputs(&self, p: &Product) -> Vec<bool> {
        p.aig
            .inputs()
            .iter()
            .map(|&n| self.ts.var_of(n).is_some_and(|v| self.sat.value(v)))
            .collect()
    }
}

/// The literals of `roots` with every group member's current value replaced by its
/// representative (in the member's phase): equal to `roots` in every state where the groups
/// hold. New nodes go into `p.aig`; nodes outside the members' fan-out map to themselves.
pub fn reduce(p: &mut Product, classes: &Classes, roots: &[Lit]) -> Vec<Lit> {
    let mut subst: BTreeMap<u32, Lit> = BTreeMap::new();
    for g in &classes.groups {
        for &m in &g[1..] {
            if !m.is_const() {
                subst.insert(m.node(), g[0].xor_complement(m.is_complemented()));
            }
        }
    }
    if subst.is_empty() {
        return roots.to_vec();
    }
    let cone = p.aig.cone_mask(roots);
    let len = p.aig.len();
    let mut map: Vec<Lit> = (0..len as u32).map(|i| Lit::from_node(i, false)).collect();
    for i in 0..len {
        if !cone[i] {
            continue;
        }
        map[i] = match p.aig.node(i as u32) {
            Node::Const => Lit::FALSE,
            Node::Input(_) => subst
                .get(&(i as u32))
                .copied()
                .unwrap_or(Lit::from_node(i as u32, false)),
            Node::And(a, b) => {
                let fa = map[a.index()].xor_complement(a.is_complemented());
                let fb = map[b.index()].xor_complement(b.is_complemented());
                if fa == a && fb == b {
                    Lit::from_node(i as u32, false)
                } else {
                    p.aig.and(fa, fb)
                }
            }
        };
    }
    roots
        .iter()
        .map(|r| map[r.index()].xor_complement(r.is_complemented()))
        .collect()
}

/// Refine `classes` until they are inductive; returns the number of refinements.
pub fn make_inductive(
    p: &mut Product,
    classes: &mut Classes,
    limits: &Limits,
) -> Result<usize, StopReason> {
    let at = state_index(p);
    let mut refinements = 0;
    loop {
        // The step miters on the reduced logic, built before the solver borrows the graph.
        let members: Vec<Lit> = classes.groups.iter().flatten().copied().collect();
        let nexts: Vec<Lit> = members.iter().map(|&m| next_of(p, &at, m)).collect();
        let reduced = reduce(p, classes, &nexts);
        let mut miters = Vec::new();
        let mut at_member = 0;
        for g in &classes.groups {
            let r = reduced[at_member];
            for k in 1..g.len() {
                let n = reduced[at_member + k];
                let x = p.aig.xor(r, n);
                if x != Lit::FALSE {
                    miters.push((g[0], g[k], x));
                }
            }
            at_member += g.len();
        }
        if miters.is_empty() {
            return Ok(refinements);
        }
        // One round: every miter against the groups of the round's start. A counterexample is a
        // state where those groups hold, hence also the finer groups after a split, so the round
        // goes on splitting with each one and skips pairs already split apart; the next round
        // starts from the finer groups.
        let mut c = Constrained::new(p, classes, limits);
        let mut group_of = group_index(classes);
        let mut refined = false;
        for (r, m, x) in miters {
            if !group_of.contains_key(&r) || group_of.get(&r) != group_of.get(&m) {
                continue;
            }
            let l = c.ts.lit(&p.aig, &mut c.sat, x);
            match c.sat.solve(&[l]) {
                SatResult::Unsat => continue,
                SatResult::Stopped(r) => return Err(r),
                SatResult::Sat => {
                    let ins = c.inputs(p);
                    let members: Vec<Lit> = classes.groups.iter().flatten().copied().collect();
                    let nexts: Vec<Lit> = members.iter().map(|&m| next_of(p, &at, m)).collect();
                    let vals = eval(&p.aig, &ins, &nexts);
                    let value: BTreeMap<Lit, bool> = members.into_iter().zip(vals).collect();
                    classes.refine_by(|m| value[&m]);
                    group_of = group_index(classes);
                    refinements += 1;
                    refined = true;
                }
            }
        }
        if !refined {
            return Ok(refinements);
        }
    }
}

/// Member -> number of its group.
fn group_index(classes: &Classes) -> BTreeMap<Lit, usize> {
    classes
        .groups
        .iter()
        .enumerate()
        .flat_map(|(k, g)| g.iter().map(move |&m| (m, k)))
        .collect()
}
