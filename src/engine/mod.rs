//! The proof engine: pairs two designs in one shared AIG, then runs one of the engines on the
//! open output pairs and turns their findings into a report. Every counterexample is
//! re-simulated on both designs ([`counterexample::confirm`]) before it is reported; every
//! `equivalent` rests on equal literals after sound merges or on an UNSAT answer.
//!
//! Engines: `sweep` (default; [`sweep`], [`parallel`]), `plain` (the single-call miter,
//! [`monolithic`]) and `pairs` (simulation, then one query per output pair, [`pairs`]). An engine
//! returns one [`Finding`] per output pair; this module owns everything after that.

mod bdd;
mod bdd_sweep;
mod classes;
pub mod counterexample;
pub mod dont_care;
mod exhaustive;
mod monolithic;
pub mod pair_cost;
pub mod pair_runs;
pub mod pairing;
mod pairs;
mod parallel;
pub mod portfolio;
mod pre_sweep;
mod progress;
pub mod result;
mod split;
mod stage;
mod steps;
mod sweep;
pub mod unknowns;
mod window;
mod window_truth;
mod words;

use crate::aig::{random_words, simulate_into, SimTable};
use crate::design::Design;
use crate::diag::InputError;
use crate::sat::{Limits, StopReason};
pub use pair_cost::PairCost;
pub use pairing::{pair, PairBy, Shared};
use pairs::PairQuery;
use progress::Progress;
pub use result::{
    Counterexample, Method, PairResult, PairVerdict, ProveReport, Scope, Side, Stats, Verdict,
};
use std::time::{Duration, Instant};
use steps::{apply_findings, overall_verdict, run_engine, structural_pairs};
pub use sweep::SweepStats;

/// Which engine decides the output pairs.
#[derive(Copy, Clone, Debug, PartialEq, Eq, Default, serde::Serialize)]
#[serde(rename_all = "lowercase")]
pub enum EngineKind {
    /// The portfolio: word polynomials for output buses that look arithmetic, exhaustive
    /// simulation for output groups with small supports, BDDs within a node limit, BDD
    /// sweeping with cut points, then SAT sweeping for the rest on the merged graph (the method
    /// of each pair is reported).
    #[default]
    Portfolio,
    /// Simulation, SAT sweeping of internal nodes (merging proved pairs), then per output pair
    /// the same literal or an XOR query; independent output cones on several threads.
    Sweep,
    /// The single-call miter: all output XORs ORed in one SAT query (repeated only to separate
    /// more pairs after a counterexample). No simulation, no sweeping: the baseline.
    Plain,
    /// Simulation, then one incremental SAT query per output pair on its XOR, no sweeping.
    Pairs,
    /// Exhaustive simulation alone (pairs whose support is too large stay undecided).
    Exhaustive,
    /// BDDs alone (pairs past the node limit stay undecided).
    Bdd,
    /// BDD sweeping alone: internal nodes with equal BDDs merged, cut points where a BDD grows
    /// too large (pairs it cannot settle stay undecided).
    #[serde(rename = "bdd-sweep")]
    BddSweep,
    /// Word polynomials alone, on output buses of at least 4 bits (other pairs, and bits past
    /// the term budget, stay undecided).
    Algebra,
}

impl EngineKind {
    /// Every engine, in the order of the command line's list.
    pub const ALL: [EngineKind; 8] = [
        EngineKind::Portfolio,
        EngineKind::Sweep,
        EngineKind::Plain,
        EngineKind::Pairs,
        EngineKind::Exhaustive,
        EngineKind::Bdd,
        EngineKind::BddSweep,
        EngineKind::Algebra,
    ];

    /// Name used in reports.
    pub fn name(self) -> &'static str {
        match self {
            EngineKind::Sweep => "sweep",
            EngineKind::Plain => "plain",
            EngineKind::Pairs => "pairs",
            EngineKind::Portfolio => "portfolio",
            EngineKind::Exhaustive => "exhaustive",
            EngineKind::Bdd => "bdd",
            EngineKind::BddSweep => "bdd-sweep",
            EngineKind::Algebra => "algebra",
        }
    }
}

/// What an engine found for one output pair, before counterexamples are confirmed.
#[derive(Clone, Debug, PartialEq)]
pub(crate) enum Finding {
    /// Equal, and how that was shown.
    Equal(Method),
    /// Different under these values of the shared inputs (to be re-simulated).
    Differ(Method, Vec<bool>),
    /// A limit stopped the engine first.
    Stopped(StopReason),
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
    /// Worker threads for independent output groups (0: one per core). Results do not
    /// depend on it.
    pub jobs: usize,
    /// Show a progress line on standard error.
    pub progress: bool,
    /// Read an `x` of the reference strictly: the candidate must match it for every value it
    /// takes (false: where the reference output is `x` it is a don't-care).
    pub strict_unknowns: bool,
    /// Once a difference is found (by simulation before the engine, or by a method of the
    /// portfolio, such as a word polynomial's remainder), which settles the verdict, the pairs
    /// still open get at most this much more time, all together; those it leaves open are
    /// undecided with [`StopReason::AfterDifference`]. `None`: decide every pair (within
    /// `timeout`).
    pub after_difference: Option<Duration>,
    /// Renamed ports paired by a port map (`--port-map`), before pairing by name.
    pub port_map: Option<std::sync::Arc<crate::portmap::BitMap>>,
}

impl Default for ProveOptions {
    fn default() -> Self {
        ProveOptions {
            pair_by: PairBy::Name,
            free_extra_inputs: false,
            engine: EngineKind::Portfolio,
            timeout: None,
            conflict_limit: None,
            seed: 1,
            sim_words: None,
            jobs: 0,
            progress: false,
            strict_unknowns: false,
            after_difference: None,
            port_map: None,
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

/// The state of one output pair during a run: `None` while open.
type Outcome = Option<PairVerdict>;

/// Whether a pair may still take a verdict from a later finding: open, or stopped (a
/// counterexample found by another pair's query may still separate it).
fn revisable(o: &Outcome) -> bool {
    matches!(o, None | Some(PairVerdict::Undecided(_)))
}

/// Prove `candidate` equivalent to `reference`, or find where they differ.
pub fn prove(
    reference: &Design,
    candidate: &Design,
    opts: &ProveOptions,
) -> Result<ProveReport, ProveError> {
    let mut shared = pairing::pair_mapped(
        reference,
        candidate,
        opts.pair_by,
        opts.free_extra_inputs,
        opts.port_map.as_deref(),
    )?;
    if !opts.strict_unknowns {
        dont_care::apply(&mut shared, reference);
    }
    prove_shared(reference, candidate, shared, &[], opts)
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
    let run_limits = Limits::new(opts.timeout, opts.conflict_limit);
    let mut outcomes = vec![None; shared.pairs.len()];
    let mut cexs: Vec<Counterexample> = Vec::new();

    let memory_at_start = crate::host::measure();
    log::debug!(
        "memory with the shared AIG built: {}",
        crate::host::now_note()
    );
    let progress = Progress::new(opts.progress, shared.pairs.len());
    let sim_start = Instant::now();
    let patterns = if opts.engine == EngineKind::Plain {
        0
    } else {
        simulate_phase(&shared, r, c, opts, &mut outcomes, &mut cexs)?
    };
    let sim_seconds = sim_start.elapsed().as_secs_f64();
    log::debug!(
        "simulation: {} patterns, {} pairs differ",
        patterns,
        cexs.len()
    );
    progress.outputs_done(outcomes.iter().filter(|o| o.is_some()).count());
    let queries: Vec<PairQuery> = (0..shared.pairs.len())
        .map(|p| PairQuery {
            reference: shared.ref_lits[p],
            candidate: shared.cand_lits[p],
        })
        .collect();
    structural_pairs(&queries, &mut outcomes);
    let open: Vec<usize> = (0..shared.pairs.len())
        .filter(|&p| outcomes[p].is_none())
        .collect();
    // A difference settles the verdict: the open pairs then get a bounded time at most.
    let settled = match opts.after_difference {
        Some(grace) if !cexs.is_empty() && !open.is_empty() => {
            let left = run_limits.remaining().map_or(grace, |r| r.min(grace));
            log::debug!(
                "a difference settles the verdict: {} open pairs get {:.1} s more",
                open.len(),
                left.as_secs_f64()
            );
            Some(Limits::new(Some(left), opts.conflict_limit))
        }
        _ => None,
    };
    let limits = settled.as_ref().unwrap_or(&run_limits);
    // Otherwise a difference the portfolio finds settles it (one rule: `--after-difference`).
    let after_difference = if settled.is_some() {
        None
    } else {
        opts.after_difference
    };
    let mut run = run_engine(
        r,
        c,
        &shared,
        &queries,
        &open,
        opts,
        limits,
        after_difference,
        &progress,
    )?;
    progress.finish();
    // Every pair was simulated: the simulation is work they all shared.
    let everyone: Vec<usize> = (0..shared.pairs.len()).collect();
    pair_cost::share(&mut run.costs, &everyone, sim_seconds, 0);
    apply_findings(run.findings, &shared, r, c, &mut outcomes, &mut cexs)?;
    // Pairs the shortened time left open say why, unless the run's own limit ran out as well.
    let cut_short = settled.is_some() && !run_limits.expired();
    for o in outcomes.iter_mut() {
        match o {
            None | Some(PairVerdict::Undecided(StopReason::Timeout)) if cut_short => {
                *o = Some(PairVerdict::Undecided(StopReason::AfterDifference));
            }
            _ => {}
        }
    }
    log::debug!("peak memory: {}", crate::host::peak_note(shared.aig.len()));

    let pairs: Vec<PairResult> = shared
        .pairs
        .iter()
        .zip(&outcomes)
        .zip(&run.costs)
        .map(|((&(ri, ci), o), &cost)| PairResult {
            reference: r.outputs[ri].name.clone(),
            candidate: c.outputs[ci].name.clone(),
            // A pair no engine reached was stopped by the clock.
            verdict: o.unwrap_or(PairVerdict::Undecided(StopReason::Timeout)),
            cost,
        })
        .collect();
    let verdict = overall_verdict(&pairs);
    let ascending_ports = result::AscendingPorts {
        reference: r.ascending_ports(),
        candidate: c.ascending_ports(),
    };
    let mut warnings: Vec<String> = r
        .warnings
        .iter()
        .chain(&c.warnings)
        .map(|w| w.to_string())
        .collect();
    if opts.pair_by == PairBy::Name {
        warnings.extend(direction_warnings(r, c, &ascending_ports));
    }
    Ok(ProveReport {
        schema: 1,
        verdict,
        reference: r.name.clone(),
        candidate: c.name.clone(),
        pair_by: opts.pair_by,
        engine: opts.engine,
        assumptions: assumptions.to_vec(),
        free_inputs: shared.unmatched.clone(),
        ascending_ports,
        paired: if opts.pair_by == PairBy::Position {
            pair_runs::paired_runs(&shared, r, c)
        } else if opts.port_map.is_some() {
            // Only the renamed bits: the rest pair by name.
            let mut runs = pair_runs::paired_runs(&shared, r, c);
            runs.retain(|run| run.reference != run.candidate);
            runs
        } else {
            Vec::new()
        },
        port_map: opts.port_map.as_ref().map(|m| m.file.clone()),
        pairs,
        counterexamples: cexs,
        stats: Stats {
            reference_ands: shared.ands.0,
            candidate_ands: shared.ands.1,
            shared_nodes: shared.aig.len(),
            sim_patterns: patterns,
            sat: run.sat,
            sweep: run.sweep,
            portfolio: run.portfolio,
            engine_memory_bytes: memory_at_start
                .zip(crate::host::measure())
                .map(|(start, end)| end.peak_bytes.saturating_sub(start.resident_bytes)),
            seconds: start.elapsed().as_secs_f64(),
        },
        warnings,
        scope: Scope::ZeroDelayLogic,
        unknowns: unknowns::sources(r, c),
        dont_care_pairs: shared.dont_care.iter().filter(|&&d| d).count(),
    })
}

/// Buses paired by name that are declared `[7:0]` on one side and `[0:7]` on the other: the
/// bits of the same index are paired, so the same number means other bits on each side.
fn direction_warnings(r: &Design, c: &Design, asc: &result::AscendingPorts) -> Vec<String> {
    let wide = |d: &Design, p: &str| {
        d.inputs
            .iter()
            .filter(|b| b.port == p && b.index.is_some())
            .count()
            + d.outputs
                .iter()
                .filter(|o| o.port == p && o.index.is_some())
                .count()
            > 1
    };
    asc.reference
        .symmetric_difference(&asc.candidate)
        .filter(|p| wide(r, p) && wide(c, p))
        .map(|p| {
            let (rd, cd) = if asc.reference.contains(p) {
                ("ascending [lo:hi]", "descending [hi:lo]")
            } else {
                ("descending [hi:lo]", "ascending [lo:hi]")
            };
            format!(
                "warning: `{p}` is declared {rd} in the reference and {cd} in the candidate: pairing by name pairs the bits of the same index ({p}[0] with {p}[0]), so the most significant bit of one side meets the least significant of the other; to pair by significance, declare both alike or use `--pair-by position` (bits in order, least significant first)"
            )
        })
        .collect()
}

/// Words of random patterns for a graph of `nodes` nodes: more for small graphs (the words
/// times the nodes stay under 4 million node-words of simulation work), between 1 and 64. The
/// words are simulated one at a time, so only one word per node is alive.
fn default_words(nodes: usize) -> usize {
    (4_000_000 / nodes.max(1)).clamp(1, 64)
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
    // The first separating pattern of each open pair, one word of the whole graph at a time
    // (so that only one word of values per node is alive).
    let mut first: Vec<Option<usize>> = vec![None; shared.pairs.len()];
    let mut table = SimTable::default();
    let mut row: Vec<Vec<u64>> = vec![vec![0]; ins.len()];
    for w in 0..words {
        for (r, i) in row.iter_mut().zip(&ins) {
            r[0] = i[w];
        }
        simulate_into(&shared.aig, &row, 1, &mut table);
        for p in 0..shared.pairs.len() {
            if outcomes[p].is_some() || first[p].is_some() {
                continue;
            }
            let (a, b) = (shared.ref_lits[p], shared.cand_lits[p]);
            let d = (table.lit_word(a, 0) ^ table.lit_word(b, 0))
                & table.lit_word(shared.constraint, 0);
            if d != 0 {
                first[p] = Some(w * 64 + d.trailing_zeros() as usize);
            }
        }
    }
    for p in 0..shared.pairs.len() {
        if outcomes[p].is_some() {
            continue;
        }
        if let Some(pat) = first[p] {
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
        if revisable(&outcomes[q])
            && cex
                .differing
                .iter()
                .any(|d| d.reference == r.outputs[ri].name && d.candidate == c.outputs[ci].name)
        {
            outcomes[q] = Some(PairVerdict::Different {
                found_by: method,
                counterexample: k,
            });
        }
    }
    cexs.push(cex);
    Ok(())
}
