//! Case splitting (Shannon expansion) for an output pair whose XOR query the solver cannot decide
//! within a small budget: fix one input to 0 and to 1, rebuild both cofactor cones with
//! structural hashing (constants propagate, so each side shrinks), and decide each cofactor on
//! its own, splitting again where needed. The pair is equal exactly when it is equal in every
//! cofactor; a model in one cofactor, with the fixed inputs, is a counterexample.
//!
//! The split input is the open input with the most fan-out in the cofactor's cone: for selectors
//! these are the select bits, after which each cofactor is a selector half the size.

use crate::aig::{Aig, Lit, Node};
use crate::cnf::Tseitin;
use crate::sat::{ClauseSink, Limits, Sat, SatResult, SatStats, StopReason};
use std::sync::Arc;

/// Conflicts allowed per cofactor query before it is split further.
const LEAF_BUDGET: u64 = 300;
/// Cofactors with more nodes than this are split without a SAT query first.
const SPLIT_WITHOUT_SAT: usize = 1_500;
/// Cofactors examined at most before giving up on splitting.
const MAX_LEAVES: usize = 1 << 20;
/// Nodes rebuilt over all cofactors at most, as a multiple of the pair's graph (plus a floor).
const WORK_FACTOR: usize = 48;
const WORK_FLOOR: usize = 4 << 20;
/// A cofactor that shrank to at most this share (in tenths) of its parent is split again
/// without a query: splitting is still paying (a selector halves at every select bit).
const SHRINK_TENTHS: usize = 7;
/// Cofactors this small go to the solver even while splitting pays.
const SPLIT_FLOOR: usize = 64;
/// Pairs with more AND nodes than this in their cones are split before any whole query when an
/// input drives a large share of them (see [`split_first`]).
const SPLIT_FIRST_ANDS: usize = 20_000;
/// Designs with more output pairs than this are not examined for [`split_first`] (each look
/// costs a pass over the graph; wide selectors have one output per data bit).
pub(crate) const SPLIT_FIRST_MAX_PAIRS: usize = 64;
/// "A large share": at least one AND node in this many.
const SPLIT_FIRST_SHARE: usize = 20;
/// Inputs fixed at most along one branch.
const MAX_DEPTH: usize = 24;

/// What splitting found.
#[derive(Clone, Debug, PartialEq, Eq)]
pub(crate) enum SplitResult {
    /// Equal in every cofactor.
    Equal,
    /// Different under these values of the graph's inputs.
    Differ(Vec<bool>),
    /// The time ran out.
    TimedOut,
    /// Splitting gave up: its cofactor budget (cofactors examined, nodes rebuilt, inputs fixed
    /// along one branch) was spent. The caller may go on another way.
    BudgetSpent,
}

/// One cofactor to examine: the parent graph with its roots, the inputs fixed so far (positions
/// in the original graph), and one more to fix. `orig[k]` is the position in the original graph
/// of the parent's input k (cofactors keep only the inputs of their cones); `fix` is the
/// parent's input position to fix, with its value.
struct Item {
    parent: Arc<Aig>,
    orig: Arc<Vec<usize>>,
    roots: [Lit; 3],
    fixed: Vec<(usize, bool)>,
    fix: Option<(usize, bool)>,
}

/// What examining one cofactor gave.
enum Step {
    /// Equal in this cofactor.
    Equal,
    /// Different under these values of the original graph's inputs.
    Differ(Vec<bool>),
    /// The time ran out.
    TimedOut,
    /// Too deep, or nothing left to split on.
    BudgetSpent,
    /// Split again: its two cofactors, the one to examine first last.
    Split(Item, Item),
}

/// Limits of one worklist: cofactors and nodes rebuilt.
#[derive(Clone, Copy)]
struct Budget {
    leaves: usize,
    work: usize,
}

/// Decide whether `a == b` wherever `constraint` holds, by case splitting. Each cofactor is
/// built from its parent cofactor, so the graphs shrink as inputs are fixed. The two halves of
/// the first split are examined in parallel (`rayon::join`, on the caller's pool), each with
/// half the budget: the answer depends only on the graph, never on the number of threads (when
/// both halves find a counterexample, the one of the half examined first alone is returned).
/// Also returns the figures of the cofactor queries' solvers.
pub(crate) fn decide(
    aig: &Aig,
    a: Lit,
    b: Lit,
    constraint: Lit,
    limits: &Limits,
) -> (SplitResult, SatStats) {
    let n = aig.num_inputs();
    let budget = Budget {
        leaves: MAX_LEAVES,
        work: WORK_FLOOR.saturating_add(WORK_FACTOR.saturating_mul(aig.len())),
    };
    let root = Item {
        parent: Arc::new(aig.clone()),
        orig: Arc::new((0..n).collect()),
        roots: [a, b, constraint],
        fixed: Vec::new(),
        fix: None,
    };
    if limits.expired() {
        return (SplitResult::TimedOut, SatStats::default());
    }
    let mut stats = SatStats::default();
    let (result, leaves) = match step(root, n, limits, &mut stats) {
        Step::Equal => (SplitResult::Equal, 1),
        Step::Differ(v) => (SplitResult::Differ(v), 1),
        Step::TimedOut => (SplitResult::TimedOut, 1),
        Step::BudgetSpent => (SplitResult::BudgetSpent, 1),
        Step::Split(later, first) => {
            let half = Budget {
                leaves: budget.leaves / 2,
                work: budget.work / 2,
            };
            let ((rf, lf, sf), (rl, ll, sl)) = rayon::join(
                || run(vec![first], n, limits, half),
                || run(vec![later], n, limits, half),
            );
            stats.add(&sf);
            stats.add(&sl);
            let result = match (rf, rl) {
                (d @ SplitResult::Differ(_), _) | (_, d @ SplitResult::Differ(_)) => d,
                (s @ (SplitResult::TimedOut | SplitResult::BudgetSpent), _)
                | (_, s @ (SplitResult::TimedOut | SplitResult::BudgetSpent)) => s,
                _ => SplitResult::Equal,
            };
            (result, 1 + lf + ll)
        }
    };
    match result {
        SplitResult::Equal => log::debug!("split: equal in all {leaves} cofactors"),
        SplitResult::BudgetSpent => log::debug!("split: cofactor budget spent after {leaves}"),
        _ => {}
    }
    (result, stats)
}

/// Examine cofactors depth first from `stack` until one differs, the budget or the time runs
/// out, or all are equal; also returns the number examined and the solvers' figures.
fn run(
    mut stack: Vec<Item>,
    n: usize,
    limits: &Limits,
    budget: Budget,
) -> (SplitResult, usize, SatStats) {
    let mut leaves = 0usize;
    let mut work = 0usize;
    let mut stats = SatStats::default();
    while let Some(item) = stack.pop() {
        if limits.expired() {
            return (SplitResult::TimedOut, leaves, stats);
        }
        leaves += 1;
        work += item.parent.len();
        if leaves > budget.leaves || work > budget.work {
            return (SplitResult::BudgetSpent, leaves, stats);
        }
        match step(item, n, limits, &mut stats) {
            Step::Equal => {}
            Step::Differ(v) => return (SplitResult::Differ(v), leaves, stats),
            Step::TimedOut => return (SplitResult::TimedOut, leaves, stats),
            Step::BudgetSpent => return (SplitResult::BudgetSpent, leaves, stats),
            Step::Split(later, first) => {
                stack.push(later);
                stack.push(first);
            }
        }
    }
    (SplitResult::Equal, leaves, stats)
}

/// Build one cofactor from its parent and decide it, or split it; its solver's figures go
/// into `stats`.
fn step(item: Item, n: usize, limits: &Limits, stats: &mut SatStats) -> Step {
    let Item {
        parent,
        orig: porig,
        roots,
        fixed,
        fix,
    } = item;
    let parent_ands = parent.num_ands();
    let mut g = Aig::new();
    let in_cone = parent.cone_mask(&roots);
    let mut orig = Vec::new();
    let map: Vec<Lit> = parent
        .inputs()
        .iter()
        .enumerate()
        .map(|(k, &node)| match fix {
            Some((f, v)) if f == k => Lit::constant(v),
            _ if in_cone[node as usize] => {
                orig.push(porig[k]);
                g.add_input()
            }
            _ => Lit::FALSE,
        })
        .collect();
    let r = g.import(&parent, &map, &roots);
    drop(parent);
    let orig = Arc::new(orig);
    let (x, y, c) = (r[0], r[1], r[2]);
    if c == Lit::FALSE || x == y {
        return Step::Equal;
    }
    let children = |g: Aig, k: usize| {
        let g = Arc::new(g);
        let child = |v: bool| {
            let mut f = fixed.clone();
            f.push((orig[k], v));
            Item {
                parent: g.clone(),
                orig: orig.clone(),
                roots: [x, y, c],
                fixed: f,
                fix: Some((k, v)),
            }
        };
        // Depth first, the 0 branch first.
        Step::Split(child(true), child(false))
    };
    let shrinking = fix.is_some()
        && g.num_ands() > SPLIT_FLOOR
        && g.num_ands() * 10 <= parent_ands * SHRINK_TENTHS;
    if (g.num_ands() > SPLIT_WITHOUT_SAT || shrinking) && fixed.len() < MAX_DEPTH {
        // Large cofactors are split at once: a query on them mostly wastes its budget.
        if let Some(k) = busiest_input(&g, &[x, y, c]) {
            return children(g, k);
        }
    }
    let mut sat = Sat::new(limits);
    let mut ts = Tseitin::new();
    let cx = ts.lit(&g, &mut sat, x);
    let cy = ts.lit(&g, &mut sat, y);
    let cc = ts.lit(&g, &mut sat, c);
    sat.clause(&[cc]);
    crate::cnf::xor_true(&mut sat, cx, cy);
    let answer = sat.solve_within(&[], Some(LEAF_BUDGET));
    stats.add(&sat.stats());
    match answer {
        SatResult::Unsat => Step::Equal,
        SatResult::Sat => {
            let mut values = vec![false; n];
            for (k, &o) in orig.iter().enumerate() {
                values[o] = ts.var_of(g.inputs()[k]).is_some_and(|v| sat.value(v));
            }
            for &(k, v) in &fixed {
                values[k] = v;
            }
            Step::Differ(values)
        }
        SatResult::Stopped(
            StopReason::Timeout | StopReason::EngineLimit | StopReason::AfterDifference,
        ) => Step::TimedOut,
        SatResult::Stopped(StopReason::ConflictLimit) => {
            if fixed.len() >= MAX_DEPTH {
                return Step::BudgetSpent;
            }
            drop(sat);
            drop(ts);
            match busiest_input(&g, &[x, y, c]) {
                Some(k) => children(g, k),
                None => Step::BudgetSpent,
            }
        }
    }
}

/// Whether the pair `roots` is better split before any whole query: its cones are large and one
/// input drives a large share of their AND nodes (the select bits of a wide selector); a single
/// query on such a miter mostly spends its budget.
pub(crate) fn split_first(g: &Aig, roots: &[Lit]) -> bool {
    if g.num_ands() <= SPLIT_FIRST_ANDS {
        return false;
    }
    let mask = g.cone_mask(roots);
    let ands = g
        .nodes()
        .iter()
        .enumerate()
        .filter(|(i, n)| mask[*i] && matches!(n, Node::And(..)))
        .count();
    if ands <= SPLIT_FIRST_ANDS {
        return false;
    }
    let fanout = input_fanout(g, &mask);
    let most = g
        .inputs()
        .iter()
        .map(|&n| fanout[n as usize])
        .max()
        .unwrap_or(0) as usize;
    most * SPLIT_FIRST_SHARE >= ands
}

/// Fan-out of every node inside the cone `mask`.
fn input_fanout(g: &Aig, mask: &[bool]) -> Vec<u32> {
    let mut fanout = vec![0u32; g.len()];
    for (i, node) in g.nodes().iter().enumerate() {
        if let (true, Node::And(p, q)) = (mask[i], node) {
            fanout[p.index()] += 1;
            fanout[q.index()] += 1;
        }
    }
    fanout
}

/// The input (by position) with the most fan-out inside the cones of `roots`.
fn busiest_input(g: &Aig, roots: &[Lit]) -> Option<usize> {
    let mask = g.cone_mask(roots);
    let fanout = input_fanout(g, &mask);
    g.inputs()
        .iter()
        .enumerate()
        .filter(|(_, &node)| fanout[node as usize] > 0)
        .max_by_key(|(k, &node)| (fanout[node as usize], std::cmp::Reverse(*k)))
        .map(|(k, _)| k)
}

#[cfg(test)]
mod tests {
    use super::*;

    /// A selector as a decoder of the select bits `s` ANDed with the data `d`, then ORed.
    fn decoder_selector(g: &mut Aig, s: &[Lit], d: &[Lit]) -> Lit {
        let mut terms = Vec::new();
        for (v, &dv) in d.iter().enumerate() {
            let lits: Vec<Lit> = (0..s.len())
                .map(|j| s[j].xor_complement((v >> j) & 1 == 0))
                .collect();
            let dec = g.and_all(&lits);
            terms.push(g.and(dec, dv));
        }
        g.or_all(&terms)
    }

    /// A 16:1 selector as a decoder AND-OR against a 2:1 tree: equal by splitting; with two data
    /// lines crossed, a counterexample that really separates them.
    #[test]
    fn selector_styles_by_splitting() {
        let mut g = Aig::new();
        let s: Vec<Lit> = (0..4).map(|_| g.add_input()).collect();
        let d: Vec<Lit> = (0..16).map(|_| g.add_input()).collect();
        let tree = |g: &mut Aig, d: &[Lit]| {
            let mut layer = d.to_vec();
            for bit in &s {
                layer = layer.chunks(2).map(|p| g.mux(*bit, p[1], p[0])).collect();
            }
            layer[0]
        };
        let t = tree(&mut g, &d);
        let o = decoder_selector(&mut g, &s, &d);
        assert_eq!(
            decide(&g, t, o, Lit::TRUE, &Limits::none()).0,
            SplitResult::Equal
        );
        let mut crossed = d.clone();
        crossed.swap(5, 9);
        let t2 = tree(&mut g, &crossed);
        match decide(&g, t2, o, Lit::TRUE, &Limits::none()).0 {
            SplitResult::Differ(values) => {
                let r = crate::aig::eval(&g, &values, &[t2, o]);
                assert_ne!(r[0], r[1]);
            }
            other => panic!("expected a difference, got {other:?}"),
        }
    }

    /// A 256:1 selector (large enough to be split without a query first) against a tree with
    /// data lines crossed in both halves of any first split: the same counterexample whatever
    /// the number of threads.
    #[test]
    fn split_answer_does_not_depend_on_threads() {
        let mut g = Aig::new();
        let s: Vec<Lit> = (0..8).map(|_| g.add_input()).collect();
        let d: Vec<Lit> = (0..256).map(|_| g.add_input()).collect();
        let o = decoder_selector(&mut g, &s, &d);
        let mut crossed = d.clone();
        for (x, y) in [(0, 255), (1, 254), (7, 200), (64, 190), (3, 129), (130, 17)] {
            crossed.swap(x, y);
        }
        let mut layer = crossed;
        for bit in &s {
            layer = layer.chunks(2).map(|p| g.mux(*bit, p[1], p[0])).collect();
        }
        let t = layer[0];
        assert!(g.num_ands() > SPLIT_WITHOUT_SAT);
        let answers: Vec<SplitResult> = [1, 2, 3]
            .into_iter()
            .map(|threads| {
                let pool = rayon::ThreadPoolBuilder::new()
                    .num_threads(threads)
                    .build()
                    .expect("a pool");
                pool.install(|| decide(&g, t, o, Lit::TRUE, &Limits::none()).0)
            })
            .collect();
        match &answers[0] {
            SplitResult::Differ(values) => {
                let r = crate::aig::eval(&g, values, &[t, o]);
                assert_ne!(r[0], r[1]);
            }
            other => panic!("expected a difference, got {other:?}"),
        }
        assert_eq!(answers[0], answers[1]);
        assert_eq!(answers[0], answers[2]);
    }
}
