//! Per-output-pair XOR miter queries (Brand 1993) on one incremental solver: the final phase of
//! the sweep engine and the whole of the `pairs` engine. A proved pair's equality is kept as
//! clauses to help later queries; a model is checked against the other open pairs at once.

use super::pair_cost::PairCost;
use super::progress::Progress;
use super::split::{self, SplitResult};
use super::{Finding, Method};
use std::time::Instant;

/// Conflicts for an output pair's query before case splitting is tried.
const FIRST_BUDGET: u64 = 1_000;
use crate::aig::{eval, Aig, Lit};
use crate::cnf::Tseitin;
use crate::sat::{ClauseSink, Limits, Sat, SatResult, SatStats, StopReason};

/// One output pair as literals of the graph being queried.
#[derive(Copy, Clone, Debug, PartialEq, Eq)]
pub(crate) struct PairQuery {
    /// The reference output.
    pub reference: Lit,
    /// The candidate output.
    pub candidate: Lit,
}

/// Decide the pairs `open` (indices into `pairs`) in order under `constraint`; the findings
/// of the other pairs stay `None`. Each decided pair's own cost goes into `costs` (indexed like
/// `pairs`); returns the figures of the case-splitting solvers (apart from `sat`'s).
#[allow(clippy::too_many_arguments)]
pub(crate) fn decide_open_pairs(
    aig: &Aig,
    pairs: &[PairQuery],
    constraint: Lit,
    open: &[usize],
    sat: &mut Sat<'_>,
    ts: &mut Tseitin,
    limits: &Limits,
    progress: &Progress,
    costs: &mut [PairCost],
) -> (Vec<Option<Finding>>, SatStats) {
    let sub: Vec<PairQuery> = open.iter().map(|&p| pairs[p]).collect();
    let mut found = vec![None; sub.len()];
    let mut own = vec![PairCost::default(); sub.len()];
    let q = Queries {
        aig,
        pairs: &sub,
        constraint,
        limits,
        progress,
    };
    let split = decide_pairs(&q, sat, ts, &mut found, &mut own);
    let mut findings = vec![None; pairs.len()];
    for ((&p, f), c) in open.iter().zip(found).zip(own) {
        findings[p] = f;
        costs[p].add(c);
    }
    (findings, split)
}

/// The output pairs to decide in one graph, with the run's limits.
pub(crate) struct Queries<'a> {
    pub aig: &'a Aig,
    pub pairs: &'a [PairQuery],
    pub constraint: Lit,
    pub limits: &'a Limits,
    pub progress: &'a Progress,
}

/// Decide every pair whose finding is still `None`, in order, under the constraint; each
/// queried pair's seconds and conflicts (its miter query and any case split) are added to
/// `costs`. Returns the figures of the case-splitting solvers, which `sat`'s do not count.
pub(crate) fn decide_pairs(
    q: &Queries<'_>,
    sat: &mut Sat<'_>,
    ts: &mut Tseitin,
    findings: &mut [Option<Finding>],
    costs: &mut [PairCost],
) -> SatStats {
    let mut split = SatStats::default();
    if findings.iter().all(Option::is_some) {
        return split;
    }
    if q.constraint != Lit::TRUE {
        let k = ts.lit(q.aig, sat, q.constraint);
        sat.clause(&[k]);
    }
    for p in 0..q.pairs.len() {
        if findings[p].is_some() {
            continue;
        }
        if q.limits.expired() {
            findings[p] = Some(Finding::Stopped(StopReason::Timeout));
            continue;
        }
        let t = Instant::now();
        let before = sat.stats().conflicts;
        let s = decide_one(q, sat, ts, findings, p);
        costs[p].add(PairCost {
            seconds: t.elapsed().as_secs_f64(),
            conflicts: sat.stats().conflicts - before + s.conflicts,
        });
        split.add(&s);
    }
    split
}

/// Decide pair `p`: straight to case splitting for a wide selector, else its XOR query under a
/// small budget, then splitting, then the query without a budget. Returns the figures of the
/// splitting solvers.
fn decide_one(
    q: &Queries<'_>,
    sat: &mut Sat<'_>,
    ts: &mut Tseitin,
    findings: &mut [Option<Finding>],
    p: usize,
) -> SatStats {
    let (aig, pairs, constraint, limits, progress) =
        (q.aig, q.pairs, q.constraint, q.limits, q.progress);
    let mut stats = SatStats::default();
    let roots = [pairs[p].reference, pairs[p].candidate, constraint];
    let mut split_tried = false;
    if limits.conflicts_per_query.is_none()
        && pairs.len() <= split::SPLIT_FIRST_MAX_PAIRS
        && split::split_first(aig, &roots)
    {
        // A wide selector: straight to case splitting, before even encoding the miter.
        split_tried = true;
        let (answer, s) = split::decide(aig, roots[0], roots[1], constraint, limits);
        stats.add(&s);
        match answer {
            SplitResult::Equal => {
                findings[p] = Some(Finding::Equal(Method::Split));
                progress.outputs_done(1);
                return stats;
            }
            SplitResult::Differ(values) => {
                mark_separated(aig, pairs, &values, findings, progress);
                if findings[p].is_none() {
                    findings[p] = Some(Finding::Differ(Method::Split, values));
                }
                return stats;
            }
            SplitResult::TimedOut => {
                findings[p] = Some(Finding::Stopped(StopReason::Timeout));
                return stats;
            }
            // Out of cofactors: the whole query below decides instead.
            SplitResult::BudgetSpent => {}
        }
    }
    let a = ts.lit(aig, sat, pairs[p].reference);
    let b = ts.lit(aig, sat, pairs[p].candidate);
    let act = sat.fresh();
    crate::cnf::xor_if(sat, act, a, b);
    // Decide only within the pair's cones (and the constraint's): the solver also holds
    // the cones of earlier pairs, which this query does not need to assign.
    let mut scope = ts.cone_vars(aig, &roots);
    scope.push(act);
    sat.set_scope(Some(&scope));
    let mut answer = if split_tried {
        sat.solve(&[act])
    } else {
        sat.solve_within(&[act], Some(FIRST_BUDGET))
    };
    if answer == SatResult::Stopped(StopReason::ConflictLimit)
        && limits.conflicts_per_query.is_none()
    {
        // Hard for the solver as a whole: split on inputs, then, failing that, solve on.
        let (split_answer, s) = split::decide(
            aig,
            pairs[p].reference,
            pairs[p].candidate,
            constraint,
            limits,
        );
        stats.add(&s);
        match split_answer {
            SplitResult::Equal => {
                findings[p] = Some(Finding::Equal(Method::Split));
                progress.outputs_done(1);
                // Proved equal: `a == b` helps the later queries.
                crate::cnf::xor_true(sat, !a, b);
                sat.clause(&[!act]);
                return stats;
            }
            SplitResult::Differ(values) => {
                mark_separated(aig, pairs, &values, findings, progress);
                if findings[p].is_none() {
                    findings[p] = Some(Finding::Differ(Method::Split, values));
                }
                sat.clause(&[!act]);
                return stats;
            }
            SplitResult::TimedOut => {
                findings[p] = Some(Finding::Stopped(StopReason::Timeout));
                sat.clause(&[!act]);
                return stats;
            }
            // Out of cofactors: solve on without a conflict budget.
            SplitResult::BudgetSpent => answer = sat.solve(&[act]),
        }
    } else if answer == SatResult::Stopped(StopReason::ConflictLimit) {
        answer = sat.solve(&[act]);
    }
    match answer {
        SatResult::Unsat => {
            findings[p] = Some(Finding::Equal(Method::Sat));
            progress.outputs_done(1);
            crate::cnf::xor_true(sat, !a, b);
        }
        SatResult::Sat => {
            let values: Vec<bool> = aig
                .inputs()
                .iter()
                .map(|&n| ts.var_of(n).is_some_and(|v| sat.value(v)))
                .collect();
            mark_separated(aig, pairs, &values, findings, progress);
            debug_assert!(findings[p].is_some(), "a model must separate its own pair");
            if findings[p].is_none() {
                findings[p] = Some(Finding::Differ(Method::Sat, values));
            }
        }
        SatResult::Stopped(s) => findings[p] = Some(Finding::Stopped(s)),
    }
    sat.clause(&[!act]);
    stats
}

/// Mark every open pair that `values` separates as different (found by SAT).
pub(crate) fn mark_separated(
    aig: &Aig,
    pairs: &[PairQuery],
    values: &[bool],
    findings: &mut [Option<Finding>],
    progress: &Progress,
) {
    let open: Vec<usize> = (0..pairs.len())
        .filter(|&q| findings[q].is_none())
        .collect();
    let roots: Vec<Lit> = open
        .iter()
        .flat_map(|&q| [pairs[q].reference, pairs[q].candidate])
        .collect();
    let v = eval(aig, values, &roots);
    for (j, &q) in open.iter().enumerate() {
        if v[2 * j] != v[2 * j + 1] {
            findings[q] = Some(Finding::Differ(Method::Sat, values.to_vec()));
            progress.outputs_done(1);
        }
    }
}
