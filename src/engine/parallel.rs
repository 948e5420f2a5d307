//! Output groups and threads for the sweep engine. The open output pairs are cut into groups of
//! consecutive pairs when their cones barely overlap (so that splitting does not repeat work);
//! each group is swept in a private copy of its cone with its own solvers and seed on a thread
//! of a pool of `--jobs` threads, and the findings are put back in output order.
//!
//! **Invariant:** the groups, their seeds and every decision inside a group depend only on the
//! designs and the options other than `--jobs`, so the results are identical for any `--jobs`.

use super::pair_cost::{share_rest, PairCost};
use super::pairs::PairQuery;
use super::progress::Progress;
use super::sweep::{sweep, Cone, SweepStats};
use super::Finding;
use crate::aig::{Aig, Lit};
use crate::sat::{Limits, SatStats};
use rayon::prelude::*;

/// Smallest shared graph (nodes) worth splitting.
const SPLIT_MIN_NODES: usize = 4_000;
/// Largest total cone size, relative to the union, that a split may cost.
const SPLIT_OVERLAP: f64 = 1.25;

/// Cut `open` (pair indices) into consecutive groups: the most groups among 8, 4, 2 whose cones
/// together are at most `SPLIT_OVERLAP` times the union, else one group.
pub(crate) fn groups(aig: &Aig, pairs: &[PairQuery], open: &[usize]) -> Vec<Vec<usize>> {
    let roots = |ps: &[usize]| -> Vec<Lit> {
        ps.iter()
            .flat_map(|&p| [pairs[p].reference, pairs[p].candidate])
            .collect()
    };
    let size = |ps: &[usize]| aig.cone_mask(&roots(ps)).iter().filter(|&&m| m).count();
    if aig.len() >= SPLIT_MIN_NODES && open.len() >= 2 {
        let union = size(open);
        for g in [8usize, 4, 2] {
            if open.len() < g {
                continue;
            }
            let chunks: Vec<Vec<usize>> = open
                .chunks(open.len().div_ceil(g))
                .map(|c| c.to_vec())
                .collect();
            let total: usize = chunks.iter().map(|c| size(c)).sum();
            if (total as f64) <= SPLIT_OVERLAP * union as f64 {
                return chunks;
            }
        }
    }
    vec![open.to_vec()]
}

/// Threads worth starting for `groups` groups when `jobs` were asked for (0: one per core):
/// at most one per group, or one per core when there are fewer groups than cores (the split
/// of a hard pair runs its halves in parallel), never more than asked.
fn useful_threads(jobs: usize, groups: usize, cores: usize) -> usize {
    let useful = groups.max(cores).max(1);
    if jobs == 0 {
        cores.max(1).min(useful)
    } else {
        jobs.min(useful)
    }
}

/// What [`sweep_groups`] found: findings and costs indexed like the pairs (`None` and zero
/// for pairs not in `open`), the solvers' and the sweep's figures.
pub(crate) struct Swept {
    pub findings: Vec<Option<Finding>>,
    pub sat: SatStats,
    pub sweep: SweepStats,
    pub costs: Vec<PairCost>,
}

/// Sweep every group on a pool of `jobs` threads (0: one per core). Findings are indexed like
/// `pairs` (`None` for pairs not in `open`).
#[allow(clippy::too_many_arguments)]
pub(crate) fn sweep_groups(
    aig: &Aig,
    pairs: &[PairQuery],
    constraint: Lit,
    open: &[usize],
    seed: u64,
    words: Option<usize>,
    jobs: usize,
    limits: &Limits,
    progress: &Progress,
) -> Result<Swept, String> {
    let groups = groups(aig, pairs, open);
    log::debug!(
        "sweep: {} open output pairs in {} group(s)",
        open.len(),
        groups.len()
    );
    let single = groups.len() == 1;
    let run_group = |gi: usize, members: &Vec<usize>| {
        let seed = seed ^ (gi as u64).wrapping_mul(0xD1B5_4A32_D192_ED03);
        let qs: Vec<PairQuery> = members.iter().map(|&p| pairs[p]).collect();
        if single {
            let cone = Cone {
                aig,
                pairs: qs,
                constraint,
                seed,
                words,
            };
            return sweep(&cone, limits, progress);
        }
        // A private copy of the group's cone.
        let mut g = Aig::new();
        let ins: Vec<Lit> = (0..aig.num_inputs()).map(|_| g.add_input()).collect();
        let mut roots: Vec<Lit> = qs.iter().flat_map(|q| [q.reference, q.candidate]).collect();
        roots.push(constraint);
        let mapped = g.import(aig, &ins, &roots);
        let local: Vec<PairQuery> = (0..qs.len())
            .map(|j| PairQuery {
                reference: mapped[2 * j],
                candidate: mapped[2 * j + 1],
            })
            .collect();
        let cone = Cone {
            aig: &g,
            pairs: local,
            constraint: mapped[mapped.len() - 1],
            seed,
            words,
        };
        sweep(&cone, limits, progress)
    };
    let run = |gi: usize, members: &Vec<usize>| {
        let t = std::time::Instant::now();
        let (f, s, w, mut c) = run_group(gi, members);
        // Copying the group's cone is the group's shared work too.
        let all: Vec<usize> = (0..c.len()).collect();
        share_rest(&mut c, &all, t.elapsed().as_secs_f64(), s.conflicts);
        (f, s, w, c)
    };
    let cores = std::thread::available_parallelism().map_or(1, |n| n.get());
    let threads = useful_threads(jobs, groups.len(), cores);
    if limits.expired() {
        // No thread is started once the time is up; every open pair is then stopped.
        let f = (0..pairs.len())
            .map(|p| {
                open.contains(&p)
                    .then_some(Finding::Stopped(crate::sat::StopReason::Timeout))
            })
            .collect();
        return Ok(Swept {
            findings: f,
            sat: SatStats::default(),
            sweep: SweepStats::default(),
            costs: vec![PairCost::default(); pairs.len()],
        });
    }
    let pool = rayon::ThreadPoolBuilder::new()
        .num_threads(threads)
        .build()
        .map_err(|e| format!("cannot start worker threads: {e}"))?;
    let results: Vec<_> = pool.install(|| {
        groups
            .par_iter()
            .enumerate()
            .map(|(gi, m)| run(gi, m))
            .collect()
    });
    let mut findings: Vec<Option<Finding>> = (0..pairs.len()).map(|_| None).collect();
    let mut sat = SatStats::default();
    let mut st = SweepStats::default();
    let mut costs = vec![PairCost::default(); pairs.len()];
    for (members, (fs, s, w, c)) in groups.iter().zip(results) {
        for ((&p, f), c) in members.iter().zip(fs).zip(c) {
            findings[p] = Some(f);
            costs[p].add(c);
        }
        sat.add(&s);
        st.add(&w);
    }
    Ok(Swept {
        findings,
        sat,
        sweep: st,
        costs,
    })
}

#[cfg(test)]
mod tests {
    use super::useful_threads;

    /// Issue 13 B1: `--jobs 10000` starts no more threads than there is work or cores for.
    #[test]
    fn threads_are_capped_at_the_useful_number() {
        assert_eq!(useful_threads(10_000, 1, 2), 2);
        assert_eq!(useful_threads(10_000, 8, 2), 8);
        assert_eq!(useful_threads(3, 8, 2), 3);
        assert_eq!(useful_threads(0, 8, 4), 4);
        assert_eq!(useful_threads(1, 8, 4), 1);
        assert_eq!(useful_threads(0, 1, 0), 1);
    }
}
