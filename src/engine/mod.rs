//! The proof engine: pairs two designs in one shared AIG, looks for counterexamples by random
//! simulation, then decides each remaining output pair with an incremental SAT query on its XOR
//! miter (Brand 1993). Every counterexample is re-simulated on both designs before it is
//! reported; every `equivalent` rests on equal literals or an UNSAT answer.

pub mod counterexample;
pub mod pairing;
pub mod result;
pub mod unknowns;

use crate::aig::{random_words, simulate, Lit};
use crate::cnf::Tseitin;
use crate::design::Design;
use crate::diag::InputError;
use crate::sat::{ClauseSink, Limits, Sat, SatResult, SatStats, StopReason};
pub use pairing::{pair, PairBy, Shared};
pub use result::{Counterexample, Method, PairResult, ProveReport, Stats, Verdict, SCOPE};
use std::time::{Duration, Instant};

/// Which engine decides the output pairs.
#[derive(Copy, Clone, Debug, PartialEq, Eq, Default, clap::ValueEnum)]
pub enum EngineKind {
    /// Simulation, then one incremental SAT query per output pair on the XOR miter.
    #[default]
    Plain,
}

impl EngineKind {
    /// Name used in reports.
    pub fn name(self) -> &'static str {
        match self {
            EngineKind::Plain => "plain",
        }
    }
}

/// Settings of one proof run.
#[derive(Clone, Debug)]
pub struct ProveOptions {
    /// How bits are paired.
    pub pair_by: PairBy,
    /// Leave port inputs without a partner free instead of failing.
    pub free_extra_inputs: bool,
    /// The engine.
    pub engine: EngineKind,
    /// Wall-clock budget for the whole run.
    pub timeout: Option<Duration>,
    /// Conflicts allowed per SAT query.
    pub conflict_limit: Option<u64>,
    /// Seed of the random patterns.
    pub seed: u64,
    /// Words of 64 random patterns (`None`: chosen from the design size).
    pub sim_words: Option<usize>,
}

impl Default for ProveOptions {
    fn default() -> Self {
        ProveOptions {
            pair_by: PairBy::Name,
            free_extra_inputs: false,
            engine: EngineKind::Plain,
            timeout: None,
            conflict_limit: None,
            seed: 1,
            sim_words: None,
        }
    }
}

/// Why `prove` gave no report.
#[derive(Debug)]
pub enum ProveError {
    /// The designs cannot be paired (exit code 2).
    Input(InputError),
    /// An internal check failed; no claim is made.
    Internal(String),
}

impl From<InputError> for ProveError {
    fn from(e: InputError) -> Self {
        ProveError::Input(e)
    }
}

/// The state of one output pair during a run.
#[derive(Copy, Clone, Debug, PartialEq)]
enum Outcome {
    Open,
    Equal(Method),
    Differ(Method, usize),
    Stopped(StopReason),
}

/// Prove `candidate` equivalent to `reference`, or find where they differ.
pub fn prove(
    reference: &Design,
    candidate: &Design,
    opts: &ProveOptions,
) -> Result<ProveReport, ProveError> {
    prove_shared(
        reference,
        candidate,
        pair(reference, candidate, opts.pair_by, opts.free_extra_inputs)?,
        &[],
        opts,
    )
}

/// Prove with an already built shared AIG (e.g. with assumptions in `shared.constraint`).
pub fn prove_shared(
    r: &Design,
    c: &Design,
    shared: Shared,
    assumptions: &[String],
    opts: &ProveOptions,
) -> Result<ProveReport, ProveError> {
    let start = Instant::now();
    let limits = Limits::new(opts.timeout, opts.conflict_limit);
    let mut outcomes = vec![Outcome::Open; shared.pairs.len()];
    let mut cexs: Vec<Counterexample> = Vec::new();

    let patterns = simulate_phase(&shared, r, c, opts, &mut outcomes, &mut cexs)?;
    log::debug!(
        "simulation: {} patterns, {} pairs differ",
        patterns,
        cexs.len()
    );
    for (p, o) in outcomes.iter_mut().enumerate() {
        if *o == Outcome::Open && shared.ref_lits[p] == shared.cand_lits[p] {
            *o = Outcome::Equal(Method::Structure);
        }
    }
    let sat = sat_phase(&shared, r, c, &limits, &mut outcomes, &mut cexs)?;

    let pairs: Vec<PairResult> = shared
        .pairs
        .iter()
        .zip(&outcomes)
        .map(|(&(ri, ci), o)| {
            let (status, method, stopped, counterexample) = match *o {
                Outcome::Equal(m) => (Verdict::Equivalent, m, None, None),
                Outcome::Differ(m, k) => (Verdict::Different, m, None, Some(k)),
                Outcome::Stopped(s) => (Verdict::Undecided, Method::None, Some(s), None),
                Outcome::Open => (
                    Verdict::Undecided,
                    Method::None,
                    Some(StopReason::Timeout),
                    None,
                ),
            };
            PairResult {
                reference: r.outputs[ri].name.clone(),
                candidate: c.outputs[ci].name.clone(),
                status,
                method,
                stopped,
                counterexample,
            }
        })
        .collect();
    let verdict = if pairs.iter().any(|p| p.status == Verdict::Different) {
        Verdict::Different
    } else if pairs.iter().any(|p| p.status == Verdict::Undecided) {
        Verdict::Undecided
    } else {
        Verdict::Equivalent
    };
    let warnings = r
        .warnings
        .iter()
        .chain(&c.warnings)
        .map(|w| w.to_string())
        .collect();
    Ok(ProveReport {
        schema: 1,
        verdict,
        reference: r.name.clone(),
        candidate: c.name.clone(),
        pair_by: opts.pair_by,
        engine: opts.engine.name(),
        assumptions: assumptions.to_vec(),
        free_inputs: shared.unmatched.clone(),
        pairs,
        counterexamples: cexs,
        stats: Stats {
            reference_ands: shared.ands.0,
            candidate_ands: shared.ands.1,
            shared_nodes: shared.aig.len(),
            sim_patterns: patterns,
            sat,
            seconds: start.elapsed().as_secs_f64(),
        },
        warnings,
        scope: SCOPE,
        unknowns: unknowns::sources(r, c),
        diagnosis: None,
    })
}

/// Words of random patterns for a graph of `nodes` nodes: more for small graphs, at most
/// about 64 MiB of simulation values.
fn default_words(nodes: usize) -> usize {
    (8_000_000 / nodes.max(1)).clamp(1, 64)
}

fn simulate_phase(
    shared: &Shared,
    r: &Design,
    c: &Design,
    opts: &ProveOptions,
    outcomes: &mut [Outcome],
    cexs: &mut Vec<Counterexample>,
) -> Result<usize, ProveError> {
    let words = opts
        .sim_words
        .unwrap_or_else(|| default_words(shared.aig.len()));
    if words == 0 {
        return Ok(0);
    }
    let ins = random_words(shared.aig.num_inputs(), words, opts.seed);
    let table = simulate(&shared.aig, &ins, words);
    for p in 0..shared.pairs.len() {
        if outcomes[p] != Outcome::Open {
            continue;
        }
        let (a, b) = (shared.ref_lits[p], shared.cand_lits[p]);
        let hit = (0..words).find_map(|w| {
            let d = (table.lit_word(a, w) ^ table.lit_word(b, w))
                & table.lit_word(shared.constraint, w);
            (d != 0).then(|| w * 64 + d.trailing_zeros() as usize)
        });
        if let Some(pat) = hit {
            let values: Vec<bool> = ins
                .iter()
                .map(|row| (row[pat / 64] >> (pat % 64)) & 1 == 1)
                .collect();
            record(shared, r, c, &values, p, Method::Simulation, outcomes, cexs)?;
        }
    }
    Ok(words * 64)
}

/// Confirm a vector on both designs and mark every pair it separates.
#[allow(clippy::too_many_arguments)]
fn record(
    shared: &Shared,
    r: &Design,
    c: &Design,
    values: &[bool],
    p: usize,
    method: Method,
    outcomes: &mut [Outcome],
    cexs: &mut Vec<Counterexample>,
) -> Result<(), ProveError> {
    let cex =
        counterexample::confirm(shared, r, c, values, p, method).map_err(ProveError::Internal)?;
    let k = cexs.len();
    for (q, &(ri, ci)) in shared.pairs.iter().enumerate() {
        if matches!(outcomes[q], Outcome::Open | Outcome::Stopped(_))
            && cex
                .differing
                .iter()
                .any(|d| d.reference == r.outputs[ri].name && d.candidate == c.outputs[ci].name)
        {
            outcomes[q] = Outcome::Differ(method, k);
        }
    }
    cexs.push(cex);
    Ok(())
}

fn sat_phase(
    shared: &Shared,
    r: &Design,
    c: &Design,
    limits: &Limits,
    outcomes: &mut [Outcome],
    cexs: &mut Vec<Counterexample>,
) -> Result<SatStats, ProveError> {
    if !outcomes.contains(&Outcome::Open) {
        return Ok(SatStats::default());
    }
    let mut sat = Sat::new(limits);
    let mut ts = Tseitin::new();
    if shared.constraint != Lit::TRUE {
        let k = ts.lit(&shared.aig, &mut sat, shared.constraint);
        sat.clause(&[k]);
    }
    for p in 0..shared.pairs.len() {
        if outcomes[p] != Outcome::Open {
            continue;
        }
        if limits.expired() {
            outcomes[p] = Outcome::Stopped(StopReason::Timeout);
            continue;
        }
        let a = ts.lit(&shared.aig, &mut sat, shared.ref_lits[p]);
        let b = ts.lit(&shared.aig, &mut sat, shared.cand_lits[p]);
        let act = sat.fresh();
        sat.clause(&[!act, a, b]);
        sat.clause(&[!act, !a, !b]);
        match sat.solve(&[act]) {
            SatResult::Unsat => {
                outcomes[p] = Outcome::Equal(Method::Sat);
                // Proved equal: keep the equality to help later queries.
                sat.clause(&[!a, b]);
                sat.clause(&[a, !b]);
            }
            SatResult::Sat => {
                let values: Vec<bool> = shared
                    .aig
                    .inputs()
                    .iter()
                    .map(|&n| ts.var_of(n).is_some_and(|v| sat.value(v)))
                    .collect();
                record(shared, r, c, &values, p, Method::Sat, outcomes, cexs)?;
            }
            SatResult::Stopped(s) => outcomes[p] = Outcome::Stopped(s),
        }
        sat.clause(&[!act]);
    }
    Ok(sat.stats())
}
