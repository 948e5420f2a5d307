//! The steps of one proof run after pairing ([`super::prove_shared`]): pairs already equal by
//! structure, the chosen engine on the open pairs, its findings turned into verdicts (each
//! counterexample confirmed on both designs), and the overall verdict.

use super::pairs::{self, PairQuery};
use super::portfolio::{self, GroupRecord};
use super::progress::Progress;
use super::sweep::SweepStats;
use super::{
    monolithic, parallel, record, revisable, words, EngineKind, Finding, Method, Outcome,
    PairResult, PairVerdict, ProveError, ProveOptions, Shared, Verdict,
};
use crate::cnf::Tseitin;
use crate::design::Design;
use crate::sat::{Limits, Sat, SatStats};

/// Mark the open pairs whose two sides hashed to the same literal: they need no engine.
pub(super) fn structural_pairs(queries: &[PairQuery], outcomes: &mut [Outcome]) {
    for (p, q) in queries.iter().enumerate() {
        if outcomes[p].is_none() && q.reference == q.candidate {
            outcomes[p] = Some(PairVerdict::Equivalent(Method::Structure));
        }
    }
}

/// What the engine returned: a finding per pair (`None` for pairs it was not given), its
/// solver figures, and the sweep's and the portfolio's records when they ran.
pub(super) struct EngineRun {
    pub findings: Vec<Option<Finding>>,
    pub sat: SatStats,
    pub sweep: Option<SweepStats>,
    pub portfolio: Option<Vec<GroupRecord>>,
}

/// Run the engine of `opts` on the `open` pairs of `queries`. `after_difference`: the time
/// left to the run once the portfolio finds a difference (`None` when simulation already
/// settled the verdict, so `limits` are the shortened ones, or with `--decide-all`).
#[allow(clippy::too_many_arguments)]
pub(super) fn run_engine(
    r: &Design,
    c: &Design,
    shared: &Shared,
    queries: &[PairQuery],
    open: &[usize],
    opts: &ProveOptions,
    limits: &Limits,
    after_difference: Option<std::time::Duration>,
    progress: &Progress,
) -> Result<EngineRun, ProveError> {
    let mut sweep_stats = None;
    let mut portfolio_groups = None;
    let (findings, sat): (Vec<Option<Finding>>, SatStats) = match opts.engine {
        _ if open.is_empty() => (vec![None; queries.len()], SatStats::default()),
        EngineKind::Plain => {
            let (f, s) =
                monolithic::monolithic(&shared.aig, queries, shared.constraint, limits, progress);
            (f.into_iter().map(Some).collect(), s)
        }
        EngineKind::Pairs => {
            // Only the open pairs are queried; the others keep their outcome.
            let mut sat = Sat::new(limits);
            let mut ts = Tseitin::new();
            let f = pairs::decide_open_pairs(
                &shared.aig,
                queries,
                shared.constraint,
                open,
                &mut sat,
                &mut ts,
                limits,
                progress,
            );
            (f, sat.stats())
        }
        EngineKind::Portfolio
        | EngineKind::Exhaustive
        | EngineKind::Bdd
        | EngineKind::BddSweep
        | EngineKind::Algebra => {
            let stages: &[portfolio::Stage] = match opts.engine {
                EngineKind::Exhaustive => &[portfolio::Stage::Exhaustive],
                EngineKind::Bdd => &[portfolio::Stage::Bdd],
                EngineKind::BddSweep => &[portfolio::Stage::BddSweep],
                EngineKind::Algebra => &[portfolio::Stage::Algebra],
                _ => &[
                    portfolio::Stage::Algebra,
                    portfolio::Stage::Exhaustive,
                    portfolio::Stage::Bdd,
                    portfolio::Stage::BddSweep,
                    portfolio::Stage::Sweep,
                ],
            };
            let buses = words::output_buses(r, c, shared);
            let cx = portfolio::Context {
                aig: &shared.aig,
                pairs: queries,
                constraint: shared.constraint,
                seed: opts.seed,
                words: opts.sim_words,
                jobs: opts.jobs,
                limits,
                progress,
                buses: &buses,
                arithmetic_only: opts.engine != EngineKind::Algebra,
                sweep_follows: stages.contains(&portfolio::Stage::Sweep),
                after_difference,
            };
            let out = portfolio::run(&cx, open, stages).map_err(ProveError::Internal)?;
            sweep_stats = out.sweep;
            portfolio_groups = Some(out.groups);
            (out.findings, out.sat)
        }
        EngineKind::Sweep => {
            let (f, s, w) = parallel::sweep_groups(
                &shared.aig,
                queries,
                shared.constraint,
                open,
                opts.seed,
                opts.sim_words,
                opts.jobs,
                limits,
                progress,
            )
            .map_err(ProveError::Internal)?;
            sweep_stats = Some(w);
            (f, s)
        }
    };
    Ok(EngineRun {
        findings,
        sat,
        sweep: sweep_stats,
        portfolio: portfolio_groups,
    })
}

/// Turn the engine's findings into verdicts, in output order: confirm each counterexample once
/// ([`record`]); a vector also marks every other pair it separates. A later finding does not
/// overwrite a verdict, except that a confirmed difference replaces a stop.
pub(super) fn apply_findings(
    findings: Vec<Option<Finding>>,
    shared: &Shared,
    r: &Design,
    c: &Design,
    outcomes: &mut [Outcome],
    cexs: &mut Vec<super::Counterexample>,
) -> Result<(), ProveError> {
    for (p, f) in findings.into_iter().enumerate() {
        let Some(f) = f else { continue };
        match f {
            Finding::Equal(m) => {
                if outcomes[p].is_none() {
                    outcomes[p] = Some(PairVerdict::Equivalent(m));
                }
            }
            Finding::Differ(m, values) => {
                if revisable(&outcomes[p]) {
                    record(shared, r, c, &values, p, m, outcomes, cexs)?;
                }
            }
            Finding::Stopped(s) => {
                if outcomes[p].is_none() {
                    outcomes[p] = Some(PairVerdict::Undecided(s));
                }
            }
        }
    }
    Ok(())
}

/// The run's verdict: different if any pair differs, else undecided if any pair is, else
/// equivalent.
pub(super) fn overall_verdict(pairs: &[PairResult]) -> Verdict {
    if pairs.iter().any(|p| p.status() == Verdict::Different) {
        Verdict::Different
    } else if pairs.iter().any(|p| p.status() == Verdict::Undecided) {
        Verdict::Undecided
    } else {
        Verdict::Equivalent
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::aig::Lit;
    use crate::engine::{pair, PairBy};
    use crate::sat::StopReason;
    use std::sync::Arc;

    fn bench(text: &str) -> Design {
        crate::front::bench::read_bench(&Arc::from("t.bench"), text).unwrap()
    }

    /// `y` equal on both sides, `z` an OR against an AND.
    fn designs() -> (Design, Design) {
        let r = bench("INPUT(a)\nINPUT(b)\nOUTPUT(y)\nOUTPUT(z)\ny = AND(a, b)\nz = OR(a, b)\n");
        let c = bench("INPUT(a)\nINPUT(b)\nOUTPUT(y)\nOUTPUT(z)\ny = AND(a, b)\nz = AND(a, b)\n");
        (r, c)
    }

    #[test]
    fn equal_literals_are_equivalent_by_structure_and_nothing_else_is() {
        let q = |a: u32, b: u32| PairQuery {
            reference: Lit::from_node(a, false),
            candidate: Lit::from_node(b, false),
        };
        let queries = [q(3, 3), q(3, 4), q(5, 5)];
        let mut outcomes = vec![None, None, Some(PairVerdict::Equivalent(Method::Sweep))];
        structural_pairs(&queries, &mut outcomes);
        assert_eq!(
            outcomes[0],
            Some(PairVerdict::Equivalent(Method::Structure))
        );
        assert_eq!(outcomes[1], None);
        assert_eq!(outcomes[2], Some(PairVerdict::Equivalent(Method::Sweep)));
    }

    #[test]
    fn findings_become_verdicts_with_confirmed_counterexamples() {
        let (r, c) = designs();
        let shared = pair(&r, &c, PairBy::Name, false).unwrap();
        let mut outcomes = vec![None; 2];
        let mut cexs = Vec::new();
        let findings = vec![
            Some(Finding::Equal(Method::Sweep)),
            Some(Finding::Differ(Method::Sweep, vec![true, false])),
        ];
        apply_findings(findings, &shared, &r, &c, &mut outcomes, &mut cexs).unwrap();
        assert_eq!(outcomes[0], Some(PairVerdict::Equivalent(Method::Sweep)));
        assert_eq!(
            outcomes[1],
            Some(PairVerdict::Different {
                found_by: Method::Sweep,
                counterexample: 0
            })
        );
        assert_eq!(cexs.len(), 1);
        // A later stop does not overwrite a verdict.
        apply_findings(
            vec![None, Some(Finding::Stopped(StopReason::Timeout))],
            &shared,
            &r,
            &c,
            &mut outcomes,
            &mut cexs,
        )
        .unwrap();
        assert!(matches!(outcomes[1], Some(PairVerdict::Different { .. })));
    }

    #[test]
    fn a_difference_replaces_a_stop_and_a_false_one_is_refused() {
        let (r, c) = designs();
        let shared = pair(&r, &c, PairBy::Name, false).unwrap();
        let mut outcomes = vec![None, Some(PairVerdict::Undecided(StopReason::Timeout))];
        let mut cexs = Vec::new();
        apply_findings(
            vec![None, Some(Finding::Differ(Method::Sat, vec![false, true]))],
            &shared,
            &r,
            &c,
            &mut outcomes,
            &mut cexs,
        )
        .unwrap();
        assert!(matches!(
            outcomes[1],
            Some(PairVerdict::Different {
                found_by: Method::Sat,
                ..
            })
        ));
        // a = b = 1: AND and OR agree, so the vector is no counterexample.
        let mut outcomes = vec![None; 2];
        let bogus = vec![None, Some(Finding::Differ(Method::Sat, vec![true, true]))];
        assert!(apply_findings(bogus, &shared, &r, &c, &mut outcomes, &mut cexs).is_err());
        assert_eq!(outcomes[1], None);
    }

    #[test]
    fn the_overall_verdict_is_the_worst_pair() {
        let p = |verdict| PairResult {
            reference: "y".into(),
            candidate: "y".into(),
            verdict,
        };
        let eq = p(PairVerdict::Equivalent(Method::Sweep));
        let open = p(PairVerdict::Undecided(StopReason::Timeout));
        let diff = p(PairVerdict::Different {
            found_by: Method::Sweep,
            counterexample: 0,
        });
        assert_eq!(overall_verdict(&[]), Verdict::Equivalent);
        assert_eq!(
            overall_verdict(std::slice::from_ref(&eq)),
            Verdict::Equivalent
        );
        assert_eq!(
            overall_verdict(&[eq.clone(), open.clone()]),
            Verdict::Undecided
        );
        assert_eq!(overall_verdict(&[open, diff, eq]), Verdict::Different);
    }
}
