//! The engine portfolio (the default engine): a table of methods tried in order on the output
//! pairs still open, each with its own grouping and its own limits, each answer with its
//! evidence. Word polynomials take the output buses that look like arithmetic (equal
//! polynomials over Z / 2^n, [`super::words`]), exhaustive simulation the groups whose
//! combined support is small (every assignment enumerated), BDDs take what stays within a node limit (equal canonical edges),
//! and SAT sweeping takes the rest (UNSAT answers and sound merges). A method that declines a
//! group leaves it open for the next one; only the last method's stop reason reaches the
//! report. The choice and each method's time per group are recorded ([`GroupRecord`]) for the
//! JSON report and the debug log.
//!
//! Adding a method: one entry in [`TABLE`] (a name and a function from the open pairs to the
//! decided ones and the group records), one variant of [`Stage`].

use super::bdd;
use super::bdd_sweep;
use super::exhaustive;
use super::pair_cost::PairCost;
use super::parallel;
pub(crate) use super::stage::{Context, Reduced, StageOutput};
pub use super::stage::{GroupRecord, Stage};
use super::sweep::SweepStats;
use super::{Finding, Method};
use crate::aig::{Aig, Lit, Marks, Node};
use crate::sat::{Limits, SatStats, StopReason};
use std::time::Instant;

type Runner = fn(&Context<'_>, &[usize]) -> Result<StageOutput, String>;

/// The methods in the order they are tried.
pub(crate) const TABLE: &[(Stage, Runner)] = &[
    (Stage::Algebra, super::words::run_algebra),
    (Stage::Exhaustive, run_exhaustive),
    (Stage::Bdd, run_bdd),
    (Stage::BddSweep, run_bdd_sweep),
    (Stage::Sweep, run_sweep),
];

/// The portfolio's result: one finding per pair (`None` for pairs not in `open`).
pub(crate) struct PortfolioOutput {
    pub findings: Vec<Option<Finding>>,
    pub groups: Vec<GroupRecord>,
    pub sat: SatStats,
    pub sweep: Option<SweepStats>,
    /// What each pair cost, over every method that worked on it.
    pub costs: Vec<PairCost>,
}

/// Run the methods of `stages` (entries of [`TABLE`], in table order) on the `open` pairs. Pairs
/// no method decided are stopped with `StopReason::EngineLimit` (or the timeout). Once a method
/// finds a difference, the methods after it (and the deferred pairs) run within
/// [`Context::after_difference`]; pairs that time leaves open are stopped with
/// `StopReason::AfterDifference`.
pub(crate) fn run(
    cx: &Context<'_>,
    open: &[usize],
    stages: &[Stage],
) -> Result<PortfolioOutput, String> {
    let mut findings: Vec<Option<Finding>> = vec![None; cx.pairs.len()];
    let mut out = PortfolioOutput {
        findings: Vec::new(),
        groups: Vec::new(),
        sat: SatStats::default(),
        sweep: None,
        costs: vec![PairCost::default(); cx.pairs.len()],
    };
    let mut left: Vec<usize> = open.to_vec();
    let mut deferred: Vec<usize> = Vec::new();
    // The shortened limits once a difference has settled the verdict.
    let mut settled: Option<Limits> = None;
    let table: Vec<(Stage, Runner)> = TABLE
        .iter()
        .copied()
        .filter(|(s, _)| stages.contains(s))
        .collect();
    for (k, &(stage, runner)) in table.iter().enumerate() {
        if left.is_empty() {
            break;
        }
        let stage_cx = Context {
            limits: settled.as_ref().unwrap_or(cx.limits),
            ..*cx
        };
        if let Some(skip) = huge_skip(&stage_cx, stage, &left) {
            log::debug!(
                "portfolio: {} skipped on {} output pair(s): {}",
                stage.word(),
                left.len(),
                skip.note
            );
            out.groups.push(skip);
            continue;
        }
        let so = runner(&stage_cx, &left)?;
        for g in &so.groups {
            log::debug!(
                "portfolio: {} on {} output pair(s) (first {}): {} decided in {:.3} s; {}",
                stage.word(),
                g.pairs.len(),
                g.pairs.first().copied().unwrap_or(0),
                g.decided,
                g.seconds,
                g.note
            );
        }
        if settled.is_none()
            && so
                .findings
                .iter()
                .any(|(_, f)| matches!(f, Finding::Differ(..)))
        {
            settled = cx.after_difference.map(|grace| {
                let left = cx.limits.remaining().map_or(grace, |r| r.min(grace));
                log::debug!(
                    "portfolio: {} found a difference, which settles the verdict: the open pairs get {:.1} s more",
                    stage.word(),
                    left.as_secs_f64()
                );
                Limits::new(Some(left), cx.limits.conflicts_per_query)
            });
        }
        for (p, f) in so.findings {
            findings[p] = Some(f);
        }
        for (p, c) in so.costs {
            out.costs[p].add(c);
        }
        out.groups.extend(so.groups);
        out.sat.add(&so.sat);
        if let Some(w) = so.sweep {
            out.sweep.get_or_insert_with(SweepStats::default).add(&w);
        }
        deferred.extend(so.deferred);
        left.retain(|&p| findings[p].is_none() && !deferred.contains(&p));
        let later: Vec<Stage> = table[k + 1..].iter().map(|&(s, _)| s).collect();
        if let (Some(red), false, false) = (so.reduced, left.is_empty(), later.is_empty()) {
            // The later methods run on the reduced graph (same inputs, so their vectors
            // and verdicts carry over unchanged).
            let sub_cx = Context {
                aig: &red.aig,
                pairs: &red.pairs,
                constraint: red.constraint,
                limits: settled.as_ref().unwrap_or(cx.limits),
                // Once settled, the limits are the shortened ones already.
                after_difference: cx.after_difference.filter(|_| settled.is_none()),
                ..*cx
            };
            let sub = run(&sub_cx, &left, &later)?;
            for &p in &left {
                findings[p] = sub.findings[p].clone();
            }
            out.groups.extend(sub.groups);
            out.sat.add(&sub.sat);
            if let Some(w) = sub.sweep {
                out.sweep.get_or_insert_with(SweepStats::default).add(&w);
            }
            // What the later methods spent on each pair counts for it too (the pairs'
            // conflicts add up to the run's).
            for (c, s) in out.costs.iter_mut().zip(&sub.costs) {
                c.add(*s);
            }
            left.clear();
            break;
        }
    }
    let limits = settled.as_ref().unwrap_or(cx.limits);
    deferred.retain(|&p| findings[p].is_none());
    if !deferred.is_empty() {
        let later_cx = Context { limits, ..*cx };
        run_deferred(&later_cx, &deferred, stages, &mut findings, &mut out)?;
    }
    let reason = if limits.expired() {
        StopReason::Timeout
    } else {
        StopReason::EngineLimit
    };
    for p in left {
        findings[p] = Some(Finding::Stopped(reason));
    }
    // What the shortened time left open says so, unless the run's own deadline passed as well.
    if settled.is_some() && !cx.limits.expired() {
        for &p in open {
            if findings[p] == Some(Finding::Stopped(StopReason::Timeout)) {
                findings[p] = Some(Finding::Stopped(StopReason::AfterDifference));
            }
        }
    }
    out.findings = findings;
    Ok(out)
}

/// The later methods of `stages` on the `deferred` pairs (bits above a difference found), after
/// every other pair, within `cx.limits` (the time a difference leaves, unless `--decide-all`);
/// their findings and records go into `findings` and `out`. A pair left open is stopped by the
/// engine limit (by the timeout when the deadline has passed; a conflict limit stays one).
fn run_deferred(
    cx: &Context<'_>,
    deferred: &[usize],
    stages: &[Stage],
    findings: &mut [Option<Finding>],
    out: &mut PortfolioOutput,
) -> Result<(), String> {
    let later: Vec<Stage> = stages
        .iter()
        .copied()
        .filter(|&s| s != Stage::Algebra)
        .collect();
    // The verdict is settled already: no second after-difference bound.
    let sub_cx = Context {
        after_difference: None,
        ..*cx
    };
    let sub = run(&sub_cx, deferred, &later)?;
    let reason = if cx.limits.expired() {
        StopReason::Timeout
    } else {
        StopReason::EngineLimit
    };
    for &p in deferred {
        findings[p] = match sub.findings[p].clone() {
            None | Some(Finding::Stopped(StopReason::Timeout | StopReason::EngineLimit)) => {
                Some(Finding::Stopped(reason))
            }
            f => f,
        };
    }
    out.groups.extend(sub.groups.into_iter().map(|mut g| {
        g.note = format!("bits above a found difference, tried last: {}", g.note);
        g
    }));
    out.sat.add(&sub.sat);
    if let Some(w) = sub.sweep {
        out.sweep.get_or_insert_with(SweepStats::default).add(&w);
    }
    for (c, s) in out.costs.iter_mut().zip(&sub.costs) {
        c.add(*s);
    }
    Ok(())
}

/// AND nodes in the cone of the open pairs above which the BDD stages are skipped when the
/// sweep follows. Their node limits ([`bdd_limit`], [`bdd_sweep::limit`]: at most 1,000,000 and
/// 4,000,000) cannot give such a cone even a few BDD nodes per AND node, so they stop at the
/// limit having decided little, while the sweep's structural hashing scales with the graph.
/// Measured on the random 1,000,000-gate row (3,245,044 nodes, one run at load average 14):
/// the two BDD stages decided none of 1,000 pairs in 7.3 s before the sweep took them all.
pub(crate) const HUGE_CONE: usize = 1_000_000;

/// The record of a stage skipped because the open pairs' cone is huge ([`HUGE_CONE`]), or
/// `None` when the stage runs: only the BDD stages are skipped, only when the sweep follows
/// (a stage chosen alone with `--engine` always runs).
fn huge_skip(cx: &Context<'_>, stage: Stage, open: &[usize]) -> Option<GroupRecord> {
    if !cx.sweep_follows || !matches!(stage, Stage::Bdd | Stage::BddSweep) {
        return None;
    }
    let mut roots: Vec<Lit> = open
        .iter()
        .flat_map(|&p| [cx.pairs[p].reference, cx.pairs[p].candidate])
        .collect();
    roots.push(cx.constraint);
    let mask = cx.aig.cone_mask(&roots);
    let ands = cx
        .aig
        .nodes()
        .iter()
        .zip(&mask)
        .filter(|(n, &m)| m && matches!(n, Node::And(..)))
        .count();
    (ands > HUGE_CONE).then(|| GroupRecord {
        method: stage,
        pairs: open.to_vec(),
        decided: 0,
        seconds: 0.0,
        note: format!(
            "skipped: {ands} AND nodes in the cone, more than {HUGE_CONE}; the sweep takes them"
        ),
    })
}

/// Up to `cap + 1` input positions of the structural cone of `roots` (stops once past `cap`).
fn small_support(aig: &Aig, roots: &[Lit], cap: usize, marks: &mut Marks) -> Vec<u32> {
    marks.start(aig.len());
    let mut found = Vec::new();
    let mut stack: Vec<u32> = roots.iter().map(|r| r.node()).collect();
    while let Some(n) = stack.pop() {
        if !marks.mark(n as usize) {
            continue;
        }
        match aig.node(n) {
            Node::Const => {}
            Node::Input(k) => {
                found.push(k);
                if found.len() > cap {
                    break;
                }
            }
            Node::And(a, b) => {
                stack.push(a.node());
                stack.push(b.node());
            }
        }
    }
    found.sort_unstable();
    found
}

fn union(a: &[u32], b: &[u32]) -> Vec<u32> {
    let mut u: Vec<u32> = a.iter().chain(b).copied().collect();
    u.sort_unstable();
    u.dedup();
    u
}

/// Exhaustive simulation: consecutive open pairs grouped while their combined support (with the
/// constraint's) has at most [`exhaustive::MAX_INPUTS`] inputs.
fn run_exhaustive(cx: &Context<'_>, open: &[usize]) -> Result<StageOutput, String> {
    let cap = exhaustive::MAX_INPUTS;
    let mut marks = Marks::new();
    let mut support = |roots: &[Lit]| small_support(cx.aig, roots, cap, &mut marks);
    let base = support(&[cx.constraint]);
    let mut groups: Vec<(Vec<usize>, Vec<u32>)> = Vec::new();
    for &p in open {
        let s = support(&[cx.pairs[p].reference, cx.pairs[p].candidate]);
        let s = union(&s, &base);
        if s.len() > cap {
            continue;
        }
        match groups.last_mut() {
            Some((members, sup)) if union(sup, &s).len() <= cap => {
                *sup = union(sup, &s);
                members.push(p);
            }
            _ => groups.push((vec![p], s)),
        }
    }
    let mut out = StageOutput::default();
    if cx.sweep_follows {
        pre_sweep(cx, &mut groups, &mut out);
    }
    for (members, sup) in groups {
        if cx.limits.expired() {
            break;
        }
        let t = Instant::now();
        let qs: Vec<(Lit, Lit)> = members
            .iter()
            .map(|&p| (cx.pairs[p].reference, cx.pairs[p].candidate))
            .collect();
        let r = exhaustive::decide(
            cx.aig,
            &qs,
            cx.constraint,
            cap,
            exhaustive::MAX_WORK,
            cx.limits,
        );
        let (decided, note) = match r {
            Ok(ds) => {
                let n = ds.len();
                for (&p, d) in members.iter().zip(ds) {
                    out.findings.push((
                        p,
                        match d {
                            exhaustive::Decision::Equal => Finding::Equal(Method::Exhaustive),
                            exhaustive::Decision::Differ(v) => {
                                Finding::Differ(Method::Exhaustive, v)
                            }
                        },
                    ));
                }
                cx.progress.outputs_done(n);
                (
                    n,
                    format!("support {}: all 2^{} assignments", sup.len(), sup.len()),
                )
            }
            Err(exhaustive::Declined::TooLarge) => (
                0,
                format!("support {}: cone too large to enumerate", sup.len()),
            ),
            Err(exhaustive::Declined::Timeout) => (0, "time limit".to_string()),
        };
        let seconds = t.elapsed().as_secs_f64();
        out.share_seconds(&members, seconds);
        out.groups.push(GroupRecord {
            method: Stage::Exhaustive,
            pairs: members,
            decided,
            seconds,
            note,
        });
    }
    Ok(out)
}

/// Groups whose enumeration would be costly get a time-boxed sweep first ([`super::pre_sweep`]);
/// the pairs it decides leave their groups.
fn pre_sweep(cx: &Context<'_>, groups: &mut Vec<(Vec<usize>, Vec<u32>)>, out: &mut StageOutput) {
    use super::pre_sweep::{try_first, work, MIN_INPUTS, MIN_WORK};
    let (mut costly, mut total) = (Vec::new(), 0u64);
    for (members, sup) in groups.iter() {
        if sup.len() >= MIN_INPUTS {
            let w = work(cx, members, sup.len());
            if (MIN_WORK..=exhaustive::MAX_WORK).contains(&w) {
                costly.extend_from_slice(members);
                total += w;
            }
        }
    }
    if costly.is_empty() {
        return;
    }
    costly.sort_unstable();
    try_first(cx, &costly, total, out);
    let mut done = vec![false; cx.pairs.len()];
    for &(p, _) in &out.findings {
        done[p] = true;
    }
    for (members, _) in groups.iter_mut() {
        members.retain(|&p| !done[p]);
    }
    groups.retain(|(m, _)| !m.is_empty());
}

/// BDD node limit for a graph of `nodes` AND nodes: BDDs a few times the size of the graph
/// (so that a blow-up costs about as much as building the graph a few times), with a floor
/// for small graphs and a ceiling that bounds the manager's memory.
fn bdd_limit(nodes: usize) -> usize {
    (nodes.saturating_mul(16)).clamp(50_000, 1_000_000)
}

/// The BDD decisions of `open` (in order) as findings of `out`; returns how many decided.
fn bdd_findings(open: &[usize], ds: &[Option<bdd::Decision>], out: &mut StageOutput) -> usize {
    let mut decided = 0;
    for (&p, d) in open.iter().zip(ds) {
        let Some(d) = d else { continue };
        decided += 1;
        out.findings.push((
            p,
            match d {
                bdd::Decision::Equal => Finding::Equal(Method::Bdd),
                bdd::Decision::Differ(v) => Finding::Differ(Method::Bdd, v.clone()),
            },
        ));
    }
    decided
}

/// BDDs: all open pairs in one manager (sharing sub-functions); pairs decided before the node
/// limit was reached keep their answers.
fn run_bdd(cx: &Context<'_>, open: &[usize]) -> Result<StageOutput, String> {
    let t = Instant::now();
    let qs: Vec<(Lit, Lit)> = open
        .iter()
        .map(|&p| (cx.pairs[p].reference, cx.pairs[p].candidate))
        .collect();
    let limit = bdd_limit(cx.aig.num_ands());
    let (ds, fig) = bdd::decide(cx.aig, &qs, cx.constraint, limit, cx.limits);
    let mut out = StageOutput::default();
    let decided = bdd_findings(open, &ds, &mut out);
    cx.progress.outputs_done(decided);
    let seconds = t.elapsed().as_secs_f64();
    out.share_seconds(open, seconds);
    out.groups.push(GroupRecord {
        method: Stage::Bdd,
        pairs: open.to_vec(),
        decided,
        seconds,
        note: format!(
            "{} BDD nodes made, at most {} alive at a time ({} garbage collections){}",
            fig.made,
            fig.peak,
            fig.collections,
            if decided < open.len() {
                format!(" (node limit {limit} or time limit reached)")
            } else {
                String::new()
            }
        ),
    });
    Ok(out)
}

/// BDD sweeping ([`bdd_sweep::sweep`]) of the open pairs' cones: the pairs it decides, and,
/// when [`hands_over`] says so and a later method follows, the graph with its merges applied
/// for the later methods.
fn run_bdd_sweep(cx: &Context<'_>, open: &[usize]) -> Result<StageOutput, String> {
    let t = Instant::now();
    let qs: Vec<(Lit, Lit)> = open
        .iter()
        .map(|&p| (cx.pairs[p].reference, cx.pairs[p].candidate))
        .collect();
    let limit = bdd_sweep::limit(cx.aig.num_ands());
    let s = bdd_sweep::sweep(
        cx.aig,
        &qs,
        cx.constraint,
        limit,
        bdd_sweep::NODES_PER_AND,
        cx.limits,
    );
    let mut out = StageOutput::default();
    let decided = bdd_findings(open, &s.decisions, &mut out);
    cx.progress.outputs_done(decided);
    let mut note = format!(
        "{} BDD nodes, {} AND nodes merged, {} cut points",
        s.nodes, s.merged, s.cuts
    );
    if !s.complete {
        note += &format!(" (stopped by the node limit {limit} or the time limit)");
    }
    if hands_over(decided, open.len(), s.merged, cx.aig.num_ands()) {
        let (aig, map) = bdd_sweep::reduce(cx.aig, &s.image);
        let at = |l: Lit| map[l.index()].xor_complement(l.is_complemented());
        note += &format!(
            "; the later methods get the merged graph ({} -> {} AND nodes)",
            cx.aig.num_ands(),
            aig.num_ands()
        );
        out.reduced = Some(Reduced {
            pairs: cx
                .pairs
                .iter()
                .map(|q| super::pairs::PairQuery {
                    reference: at(q.reference),
                    candidate: at(q.candidate),
                })
                .collect(),
            constraint: at(cx.constraint),
            aig,
        });
    }
    out.groups.push(GroupRecord {
        method: Stage::BddSweep,
        pairs: open.to_vec(),
        decided,
        seconds: t.elapsed().as_secs_f64(),
        note,
    });
    Ok(out)
}

/// The BDD sweep hands a merged graph to the later methods when it merged at least one AND
/// node in this many (below that, rebuilding the graph costs more than it saves).
const REDUCE_SHARE: usize = 64;

/// Whether the BDD sweep hands its merged graph over: pairs stay open, it decided at least one,
/// and it merged at least one AND node in [`REDUCE_SHARE`] of the graph's `ands`. A sweep whose
/// cut points decided no pair keeps the original graph for the SAT sweep, whose cut matching
/// finds the same merges itself and more: on the 1024-requester arbiter against its K=6 remap
/// (nothing decided; 11,601 merges, 11,361 cut points) the SAT sweep took 1.1 s on the original
/// graph and 41 s on the merged one, where it refuted 2,000 candidates without a merge and gave
/// the output queries whole cones (one run each, load average about 8).
fn hands_over(decided: usize, open: usize, merged: usize, ands: usize) -> bool {
    decided > 0 && decided < open && merged * REDUCE_SHARE >= ands.max(1)
}

/// SAT sweeping ([`parallel::sweep_groups`]) on every open pair; it decides or stops each.
fn run_sweep(cx: &Context<'_>, open: &[usize]) -> Result<StageOutput, String> {
    let t = Instant::now();
    let swept = parallel::sweep_groups(
        cx.aig,
        cx.pairs,
        cx.constraint,
        open,
        cx.seed,
        cx.words,
        cx.jobs,
        cx.limits,
        cx.progress,
    )?;
    let mut out = StageOutput {
        sat: swept.sat,
        sweep: Some(swept.sweep),
        costs: open.iter().map(|&p| (p, swept.costs[p])).collect(),
        ..StageOutput::default()
    };
    let mut decided = 0;
    for (p, f) in swept.findings.into_iter().enumerate() {
        if let Some(f) = f {
            if !matches!(f, Finding::Stopped(_)) {
                decided += 1;
            }
            out.findings.push((p, f));
        }
    }
    out.groups.push(GroupRecord {
        method: Stage::Sweep,
        pairs: open.to_vec(),
        decided,
        seconds: t.elapsed().as_secs_f64(),
        note: format!("{} SAT calls", out.sat.calls),
    });
    Ok(out)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::engine::pairs::PairQuery;
    use crate::engine::progress::Progress;

    fn cx<'a>(
        aig: &'a Aig,
        pairs: &'a [PairQuery],
        limits: &'a Limits,
        p: &'a Progress,
    ) -> Context<'a> {
        Context {
            aig,
            pairs,
            constraint: Lit::TRUE,
            seed: 1,
            words: None,
            jobs: 1,
            limits,
            progress: p,
            buses: &[],
            arithmetic_only: true,
            sweep_follows: true,
            after_difference: None,
        }
    }

    #[test]
    fn small_supports_go_to_exhaustive_and_wide_ones_onward() {
        let mut g = Aig::new();
        let ins: Vec<Lit> = (0..40).map(|_| g.add_input()).collect();
        // Pair 0: 4 inputs; pair 1: 40 inputs (AND chains in two orders); pair 2: differs.
        let a0 = g.and_all(&ins[..4]);
        let mut b0 = ins[3];
        for &x in ins[..3].iter().rev() {
            b0 = g.and(b0, x);
        }
        let a1 = g.and_all(&ins);
        let mut b1 = ins[39];
        for &x in ins[..39].iter().rev() {
            b1 = g.and(x, b1);
        }
        let a2 = g.or(ins[5], ins[6]);
        let b2 = g.xor(ins[5], ins[6]);
        let pairs = [
            PairQuery {
                reference: a0,
                candidate: b0,
            },
            PairQuery {
                reference: a1,
                candidate: b1,
            },
            PairQuery {
                reference: a2,
                candidate: b2,
            },
        ];
        let limits = Limits::none();
        let progress = Progress::new(false, 3);
        let c = cx(&g, &pairs, &limits, &progress);
        let out = run(
            &c,
            &[0, 1, 2],
            &[Stage::Exhaustive, Stage::Bdd, Stage::Sweep],
        )
        .unwrap();
        assert_eq!(out.findings[0], Some(Finding::Equal(Method::Exhaustive)));
        assert_eq!(out.findings[1], Some(Finding::Equal(Method::Bdd)));
        assert!(matches!(
            out.findings[2],
            Some(Finding::Differ(Method::Exhaustive, _))
        ));
        assert_eq!(out.groups[0].method, Stage::Exhaustive);
        assert_eq!(out.groups[0].pairs, vec![0, 2]);
        // Exhaustive alone leaves the wide pair open with a limit as its reason.
        let out = run(&c, &[0, 1, 2], &[Stage::Exhaustive]).unwrap();
        assert_eq!(
            out.findings[1],
            Some(Finding::Stopped(StopReason::EngineLimit))
        );
    }

    /// `x + y` over `x.len()` bits (carry out dropped), a ripple of full adders.
    fn add(g: &mut Aig, x: &[Lit], y: &[Lit]) -> Vec<Lit> {
        let mut c = Lit::FALSE;
        let mut out = Vec::new();
        for (&a, &b) in x.iter().zip(y) {
            let p = g.xor(a, b);
            out.push(g.xor(p, c));
            let gen = g.and(a, b);
            let pc = g.and(p, c);
            c = g.or(gen, pc);
        }
        out
    }

    /// The 2n-bit product of `a` and `b`, partial products accumulated in the order of `rows`.
    fn multiply(g: &mut Aig, a: &[Lit], b: &[Lit], rows: &[usize]) -> Vec<Lit> {
        let n = a.len();
        let mut acc = vec![Lit::FALSE; 2 * n];
        for &j in rows {
            let mut pp = vec![Lit::FALSE; 2 * n];
            for (i, &x) in a.iter().enumerate() {
                pp[i + j] = g.and(x, b[j]);
            }
            acc = add(g, &pp, &acc);
        }
        acc
    }

    #[test]
    fn bdd_sweep_decides_what_it_can_and_the_sweep_takes_the_merged_graph() {
        // Two 7x7 multipliers accumulating their rows in opposite orders, and one wrong
        // product bit; only the BDD sweep and the SAT sweep are run.
        let mut g = Aig::new();
        let a: Vec<Lit> = (0..7).map(|_| g.add_input()).collect();
        let b: Vec<Lit> = (0..7).map(|_| g.add_input()).collect();
        let up: Vec<usize> = (0..7).collect();
        let down: Vec<usize> = (0..7).rev().collect();
        let r = multiply(&mut g, &a, &b, &up);
        let mut c = multiply(&mut g, &a, &b, &down);
        c[9] = g.xor(c[9], a[0]);
        // And two 24-bit adders of other inputs with carries as majorities written as sums of
        // products: merged carry by carry, so the sweep gets a smaller graph.
        let x: Vec<Lit> = (0..24).map(|_| g.add_input()).collect();
        let y: Vec<Lit> = (0..24).map(|_| g.add_input()).collect();
        let (mut r, mut c) = (r, c);
        r.extend(add(&mut g, &x, &y));
        let mut carry = Lit::FALSE;
        for (&u, &v) in x.iter().zip(&y) {
            let q = g.xnor(v, u);
            c.push(g.xnor(q, carry));
            let (uc, vc, uv) = (g.and(u, carry), g.and(carry, v), g.and(v, u));
            let t = g.or(uc, vc);
            carry = g.or(t, uv);
        }
        let pairs: Vec<PairQuery> = r
            .iter()
            .zip(&c)
            .map(|(&reference, &candidate)| PairQuery {
                reference,
                candidate,
            })
            .collect();
        let limits = Limits::none();
        let progress = Progress::new(false, pairs.len());
        let cxt = cx(&g, &pairs, &limits, &progress);
        let open: Vec<usize> = (0..pairs.len()).collect();
        let out = run(&cxt, &open, &[Stage::BddSweep, Stage::Sweep]).unwrap();
        for (p, f) in out.findings.iter().enumerate() {
            match f {
                Some(Finding::Equal(_)) => assert_ne!(p, 9),
                Some(Finding::Differ(_, v)) => {
                    assert_eq!(p, 9);
                    let e = crate::aig::eval(&g, v, &[r[p], c[p]]);
                    assert_ne!(e[0], e[1]);
                }
                f => panic!("pair {p}: {f:?}"),
            }
        }
        assert_eq!(out.groups[0].method, Stage::BddSweep);
        assert!(out.groups[0].decided >= 24, "{:?}", out.groups[0]);
        assert!(
            out.groups[0]
                .note
                .contains("the later methods get the merged graph"),
            "{:?}",
            out.groups[0]
        );
        assert_eq!(out.groups[1].method, Stage::Sweep);
        // The sweep's work on the merged graph is charged to the pairs it worked on: the
        // pairs' conflicts add up to the run's, and each swept pair has a share of its time.
        let conflicts: u64 = out.costs.iter().map(|c| c.conflicts).sum();
        assert_eq!(conflicts, out.sat.conflicts);
        for &p in &out.groups[1].pairs {
            assert!(out.costs[p].seconds > 0.0, "pair {p}: {:?}", out.costs[p]);
        }
    }

    #[test]
    fn a_bdd_sweep_that_decides_nothing_keeps_the_graph() {
        // Arbiter 1024 against its remap: nothing decided, 11,601 of 77,789 AND nodes merged.
        assert!(!hands_over(0, 1025, 11_601, 77_789));
        assert!(hands_over(1, 1025, 11_601, 77_789));
        // Everything decided, or too few merges: nothing to hand over.
        assert!(!hands_over(1025, 1025, 11_601, 77_789));
        assert!(!hands_over(1, 1025, 10, 77_789));
    }

    #[test]
    fn stages_are_written_alike_in_text_and_json() {
        for s in [
            Stage::Algebra,
            Stage::Exhaustive,
            Stage::Bdd,
            Stage::BddSweep,
            Stage::Sweep,
        ] {
            assert_eq!(serde_json::to_value(s).unwrap(), s.word());
        }
    }

    #[test]
    fn support_walk_stops_past_the_cap() {
        let mut g = Aig::new();
        let ins: Vec<Lit> = (0..50).map(|_| g.add_input()).collect();
        let a = g.and_all(&ins);
        let mut marks = Marks::new();
        assert_eq!(small_support(&g, &[a], 10, &mut marks).len(), 11);
        assert_eq!(small_support(&g, &[a], 60, &mut marks).len(), 50);
    }
}
