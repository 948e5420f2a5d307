//! The `plain` engine: the textbook single-call miter (Brand 1993). The XORs of all open output
//! pairs are ORed and asserted in one SAT query; UNSAT proves every pair at once. A model is a
//! counterexample for the pairs it separates; those pairs leave the OR and the query repeats
//! until it is UNSAT or stopped. No simulation and no sweeping: the baseline the benchmark
//! compares against, and a fallback.

use super::pair_cost::{share, share_rest, PairCost};
use super::pairs::{mark_separated, PairQuery};
use super::progress::Progress;
use super::{Finding, Method};
use crate::aig::{Aig, Lit};
use crate::cnf::Tseitin;
use crate::sat::{ClauseSink, Limits, Sat, SatResult, SatStats};

/// Decide `pairs` of `aig` under `constraint` with monolithic miter queries. Each call's time
/// and conflicts are shared among the pairs it was asked about, the encoding among all that
/// entered the miter.
pub(crate) fn monolithic(
    aig: &Aig,
    pairs: &[PairQuery],
    constraint: Lit,
    limits: &Limits,
    progress: &Progress,
) -> (Vec<Finding>, SatStats, Vec<PairCost>) {
    let started = std::time::Instant::now();
    let mut costs = vec![PairCost::default(); pairs.len()];
    let mut findings: Vec<Option<Finding>> = pairs
        .iter()
        .map(|p| (p.reference == p.candidate).then_some(Finding::Equal(Method::Structure)))
        .collect();
    progress.outputs_done(findings.iter().flatten().count());
    let mut sat = Sat::new(limits);
    let mut ts = Tseitin::new();
    if constraint != Lit::TRUE {
        let k = ts.lit(aig, &mut sat, constraint);
        sat.clause(&[k]);
    }
    // d_p -> (reference_p xor candidate_p)
    let mut diff = Vec::with_capacity(pairs.len());
    for (p, q) in pairs.iter().enumerate() {
        if findings[p].is_some() {
            diff.push(None);
            continue;
        }
        let a = ts.lit(aig, &mut sat, q.reference);
        let b = ts.lit(aig, &mut sat, q.candidate);
        let d = sat.fresh();
        crate::cnf::xor_if(&mut sat, d, a, b);
        diff.push(Some(d));
    }
    loop {
        let open: Vec<usize> = (0..pairs.len())
            .filter(|&p| findings[p].is_none())
            .collect();
        if open.is_empty() {
            break;
        }
        let act = sat.fresh();
        let mut big = vec![!act];
        big.extend(open.iter().filter_map(|&p| diff[p]));
        sat.clause(&big);
        let (t, before) = (std::time::Instant::now(), sat.stats().conflicts);
        let answer = sat.solve(&[act]);
        let spent = sat.stats().conflicts - before;
        share(&mut costs, &open, t.elapsed().as_secs_f64(), spent);
        match answer {
            SatResult::Unsat => {
                for &p in &open {
                    findings[p] = Some(Finding::Equal(Method::Sat));
                }
                progress.outputs_done(open.len());
            }
            SatResult::Sat => {
                let values: Vec<bool> = aig
                    .inputs()
                    .iter()
                    .map(|&n| ts.var_of(n).is_some_and(|v| sat.value(v)))
                    .collect();
                let before = findings.iter().flatten().count();
                mark_separated(aig, pairs, &values, &mut findings, progress);
                assert!(
                    findings.iter().flatten().count() > before,
                    "internal error: a miter model separates no output pair"
                );
            }
            SatResult::Stopped(s) => {
                for &p in &open {
                    findings[p] = Some(Finding::Stopped(s));
                }
            }
        }
        sat.clause(&[!act]);
    }
    let stats = sat.stats();
    let entered: Vec<usize> = (0..pairs.len()).filter(|&p| diff[p].is_some()).collect();
    share_rest(
        &mut costs,
        &entered,
        started.elapsed().as_secs_f64(),
        stats.conflicts,
    );
    (
        findings.into_iter().map(|f| f.expect("decided")).collect(),
        stats,
        costs,
    )
}
