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
use crate::aig::{random_words, simulate_prefix, Lit, Node, SimTable};
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

/// The part of `classes` that is inductive by structure alone, without a solver: each group is
/// split by its members' next-state literals on the reduced logic, until every member's next
/// value is the very literal of its representative's (so every step miter is constant false).
/// Smaller than the pairing [`make_inductive`] finds (a pair whose next values agree only as
/// functions is split apart), but inductive by construction; returns the number of rounds.
pub fn keep_structural(p: &mut Product, classes: &mut Classes) -> usize {
    let at = state_index(p);
    let mut rounds = 0;
    loop {
        let members: Vec<Lit> = classes.groups.iter().flatten().copied().collect();
        let nexts: Vec<Lit> = members.iter().map(|&m| next_of(p, &at, m)).collect();
        let reduced = reduce(p, classes, &nexts);
        let next: BTreeMap<Lit, Lit> = members.into_iter().zip(reduced).collect();
        // Splitting only adds groups or drops members: unchanged sizes mean unchanged groups.
        let size = |c: &Classes| (c.groups.len(), c.groups.iter().map(Vec::len).sum::<usize>());
        let before = size(classes);
        classes.refine_by(|m| next[&m]);
        let after = size(classes);
        log::debug!(
            "clocked: structural pairing round {rounds}: {} groups of {} members",
            after.0,
            after.1
        );
        if after == before {
            return rounds;
        }
        rounds += 1;
    }
}

/// Words of random states per simulation round of [`make_inductive`].
const SIM_WORDS: usize = 8;
/// Simulation rounds in a row without a split before the solver takes over.
const QUIET_ROUNDS: usize = 4;

/// Refine `classes` until they are inductive; returns the number of refinements.
///
/// Each round first splits the groups with random states in which every group holds (bit-
/// parallel simulation, no solver), until two rounds split nothing; then it asks the solver,
/// miter by miter on the reduced logic, for a state where the groups hold and a group's next
/// values differ. One solver serves every round: it holds only the definitions of the reduced
/// logic (which reads representatives, never the members they replace, so every assignment is
/// a state where the groups hold), plus the miters it proved constant. Each counterexample
/// splits the groups together with 63 variants of it that keep the values of the miter's cone.
pub fn make_inductive(
    p: &mut Product,
    classes: &mut Classes,
    limits: &Limits,
) -> Result<usize, StopReason> {
    let at = state_index(p);
    let n_inputs = p.aig.num_inputs();
    // Every next-state function lies in the first `upto` nodes; reductions add nodes after.
    let upto = p.aig.len();
    let mut table = SimTable::default();
    let mut sat = Sat::new(limits);
    let mut ts = Tseitin::new();
    let mut seed = 0x5E9_1000u64;
    let mut refinements = 0;
    let (mut sim_refinements, mut calls, mut ctis) = (0usize, 0usize, 0usize);
    let start = std::time::Instant::now();
    loop {
        let mut quiet = 0;
        while quiet < QUIET_ROUNDS && !classes.groups.is_empty() {
            if limits.expired() {
                return Err(StopReason::Timeout);
            }
            seed += 1;
            let ins = random_words(n_inputs, SIM_WORDS, seed);
            if refine_by_states(p, &at, classes, ins, SIM_WORDS, upto, &mut table) {
                refinements += 1;
                sim_refinements += 1;
                quiet = 0;
            } else {
                quiet += 1;
            }
        }
        // The step miters on the reduced logic.
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
        if log::log_enabled!(log::Level::Debug) {
            let side = |l: Lit| p.state[at[&l.node()]].side;
            let mut kinds: BTreeMap<&str, usize> = BTreeMap::new();
            for &(r, m, _) in &miters {
                let k = if r.is_const() {
                    "constant"
                } else if side(r) == side(m) {
                    "same design"
                } else {
                    "across designs"
                };
                *kinds.entry(k).or_default() += 1;
            }
            log::debug!("clocked: step miters by kind: {kinds:?}");
        }
        log::debug!(
            "clocked: {} groups of {} members, {} step miters left by structure, {} simulation refinements, {calls} SAT calls, {ctis} counterexamples, {:.2?}",
            classes.groups.len(),
            members.len(),
            miters.len(),
            sim_refinements,
            start.elapsed()
        );
        if miters.is_empty() {
            return Ok(refinements);
        }
        // A counterexample holds the groups of the round's start, hence also the finer groups
        // after a split, so the round goes on splitting with each one and skips pairs already
        // split apart; the next round starts from the finer groups.
        let mut group_of = group_index(classes);
        let mut refined = false;
        for (r, m, x) in miters {
            if !group_of.contains_key(&r) || group_of.get(&r) != group_of.get(&m) {
                continue;
            }
            let l = ts.lit(&p.aig, &mut sat, x);
            let scope = ts.cone_vars(&p.aig, &[x]);
            sat.set_scope(Some(&scope));
            calls += 1;
            match sat.solve(&[l]) {
                // False for every value of what the reduced logic reads: false in later rounds too.
                SatResult::Unsat => crate::sat::ClauseSink::clause(&mut sat, &[!l]),
                SatResult::Stopped(r) => return Err(r),
                SatResult::Sat => {
                    ctis += 1;
                    seed += 1;
                    // The model on the miter's cone in every run (so each run splits the
                    // miter's pair), random values elsewhere.
                    let mut ins = random_words(n_inputs, 1, seed);
                    for (k, w) in ins.iter_mut().enumerate() {
                        if let Some(v) = ts.var_of(p.aig.inputs()[k]) {
                            w[0] = if sat.value(v) { !0 } else { 0 };
                        }
                    }
                    if refine_by_states(p, &at, classes, ins, 1, upto, &mut table) {
                        group_of = group_index(classes);
                        refinements += 1;
                        refined = true;
                    }
                }
            }
        }
        if !refined {
            return Ok(refinements);
        }
    }
}

/// Split `classes` by the next-state values of the states `ins` (words per AIG input) after
/// setting every group member from its representative (constants to their value), so that
/// every group holds in every run: each run is then a state the step must keep the groups in.
/// Returns whether a group split.
#[allow(clippy::too_many_arguments)]
fn refine_by_states(
    p: &Product,
    at: &BTreeMap<u32, usize>,
    classes: &mut Classes,
    mut ins: Vec<Vec<u64>>,
    words: usize,
    upto: usize,
    table: &mut SimTable,
) -> bool {
    let pos_of = |n: u32| match p.aig.node(n) {
        Node::Input(k) => k as usize,
        _ => unreachable!("state bits are inputs"),
    };
    for g in &classes.groups {
        let rep: Vec<u64> = if g[0].is_const() {
            vec![if g[0] == Lit::TRUE { !0 } else { 0 }; words]
        } else {
            let m = g[0].complement_mask();
            ins[pos_of(g[0].node())].iter().map(|w| w ^ m).collect()
        };
        for &m in &g[1..] {
            if !m.is_const() {
                let k = pos_of(m.node());
                let mk = m.complement_mask();
                for (w, r) in ins[k].iter_mut().zip(&rep) {
                    *w = r ^ mk;
                }
            }
        }
    }
    simulate_prefix(&p.aig, &ins, words, upto, table);
    let next = |m: Lit| -> Vec<u64> {
        let n = next_of(p, at, m);
        (0..words).map(|w| table.lit_word(n, w)).collect()
    };
    let needs: Vec<bool> = classes
        .groups
        .iter()
        .map(|g| {
            let r = next(g[0]);
            g[1..].iter().any(|&m| next(m) != r)
        })
        .collect();
    if !needs.iter().any(|&b| b) {
        return false;
    }
    let mut out = Vec::new();
    for (g, need) in classes.groups.iter().zip(needs) {
        if !need {
            out.push(g.clone());
            continue;
        }
        let mut parts: BTreeMap<Vec<u64>, Vec<Lit>> = BTreeMap::new();
        for &m in g {
            parts.entry(next(m)).or_default().push(m);
        }
        let mut parts: Vec<Vec<Lit>> = parts.into_values().filter(|v| v.len() > 1).collect();
        parts.sort_by_key(|v| g.iter().position(|m| *m == v[0]));
        out.extend(parts);
    }
    classes.groups = out;
    true
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
