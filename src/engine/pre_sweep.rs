//! A time-boxed SAT sweep tried before an expensive exhaustive enumeration. Restructured logic
//! with a support near the exhaustive cap (a remapped 12x12 multiplier: 24 inputs, thousands of
//! nodes) costs seconds to enumerate, while sweeping often proves it in a fraction of that; when
//! it does not, the sweep gives up at its budget and the enumeration decides what is left.
//!
//! **Invariant:** only the sweep's decisions (UNSAT answers, re-simulated counterexamples) are
//! kept; a pair it stops on stays open for the enumeration.

use super::exhaustive;
use super::parallel;
use super::stage::{Context, GroupRecord, Stage, StageOutput};
use super::Finding;
use crate::aig::Lit;
use crate::sat::Limits;
use std::time::{Duration, Instant};

/// Smallest estimated enumeration (node-words) worth a sweep first: about half a second.
pub(crate) const MIN_WORK: u64 = 1 << 27;

/// Smallest support worth estimating (below it the enumeration is cheap whatever the cone).
pub(crate) const MIN_INPUTS: usize = 20;

/// Sweep budget per node-word of the enumeration it may save: a quarter of the enumeration's
/// estimated time per node-word (the measurement behind it is in docs/engine.md).
const SECONDS_PER_WORK: f64 = 1.2e-9;

/// Estimated node-words of enumerating the group `members` with `support` inputs.
pub(crate) fn work(cx: &Context<'_>, members: &[usize], support: usize) -> u64 {
    let mut roots: Vec<Lit> = members
        .iter()
        .flat_map(|&p| [cx.pairs[p].reference, cx.pairs[p].candidate])
        .collect();
    roots.push(cx.constraint);
    let nodes = cx.aig.cone_mask(&roots).iter().filter(|&&m| m).count();
    exhaustive::work(nodes, support)
}

/// Sweep `pairs` (whose enumeration would cost `work` node-words) within a quarter of the
/// enumeration's estimated time; returns the sweep's decisions and its record in `out`.
pub(crate) fn try_first(cx: &Context<'_>, pairs: &[usize], work: u64, out: &mut StageOutput) {
    let t = Instant::now();
    let budget = Duration::from_secs_f64(work as f64 * SECONDS_PER_WORK);
    let budget = cx.limits.remaining().map_or(budget, |r| r.min(budget));
    let limits = Limits::new(Some(budget), cx.limits.conflicts_per_query);
    let Ok(swept) = parallel::sweep_groups(
        cx.aig,
        cx.pairs,
        cx.constraint,
        pairs,
        cx.seed,
        cx.words,
        cx.jobs,
        &limits,
        cx.progress,
    ) else {
        return;
    };
    let sat = swept.sat;
    let mut decided = 0;
    for &p in pairs {
        out.costs.push((p, swept.costs[p]));
    }
    for (p, f) in swept.findings.into_iter().enumerate() {
        if let Some(f) = f.filter(|f| !matches!(f, Finding::Stopped(_))) {
            decided += 1;
            out.findings.push((p, f));
        }
    }
    out.sat.add(&sat);
    out.sweep = Some(swept.sweep);
    out.groups.push(GroupRecord {
        method: Stage::Sweep,
        pairs: pairs.to_vec(),
        decided,
        seconds: t.elapsed().as_secs_f64(),
        note: format!(
            "time-boxed ({:.2} s) before enumerating {work} node-words; {} SAT calls",
            budget.as_secs_f64(),
            sat.calls
        ),
    });
}
