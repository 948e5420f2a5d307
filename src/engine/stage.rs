//! The interface between the portfolio and its methods: the method names ([`Stage`]), what a
//! method is given ([`Context`]) and what it returns ([`StageOutput`], [`GroupRecord`]). Kept
//! apart from the portfolio's table so that a method's file depends on this interface only.

use super::pair_cost::PairCost;
use super::pairs::PairQuery;
use super::progress::Progress;
use super::sweep::SweepStats;
use super::Finding;
use crate::aig::{Aig, Lit};
use crate::sat::{Limits, SatStats};
use serde::Serialize;

/// One method of the portfolio.
#[derive(Copy, Clone, Debug, PartialEq, Eq, Serialize)]
#[serde(rename_all = "kebab-case")]
pub enum Stage {
    /// Word polynomials of arithmetic output buses ([`super::words`]).
    Algebra,
    /// Exhaustive bit-parallel simulation of small supports.
    Exhaustive,
    /// BDDs within a node limit.
    Bdd,
    /// BDD sweeping of internal nodes with cut points ([`super::bdd_sweep`]).
    BddSweep,
    /// SAT sweeping and per-pair queries.
    Sweep,
}

impl Stage {
    /// Word used in reports, the JSON (the same as serde's) and the debug log.
    pub fn word(self) -> &'static str {
        match self {
            Stage::Exhaustive => "exhaustive",
            Stage::Algebra => "algebra",
            Stage::Bdd => "bdd",
            Stage::BddSweep => "bdd-sweep",
            Stage::Sweep => "sweep",
        }
    }
}

/// What one method did with one group of output pairs.
#[derive(Clone, Debug, PartialEq, Serialize)]
pub struct GroupRecord {
    /// The method.
    pub method: Stage,
    /// Output pair indices of the group (into the report's `pairs`), ascending.
    pub pairs: Vec<usize>,
    /// How many of them it decided.
    pub decided: usize,
    /// Wall-clock seconds it spent on the group.
    pub seconds: f64,
    /// What it measured (support size, BDD nodes, ...) or why it declined.
    pub note: String,
}

/// Everything a method needs.
pub(crate) struct Context<'a> {
    pub aig: &'a Aig,
    pub pairs: &'a [PairQuery],
    pub constraint: Lit,
    pub seed: u64,
    pub words: Option<usize>,
    pub jobs: usize,
    pub limits: &'a Limits,
    pub progress: &'a Progress,
    /// Output pairs grouped into words, least significant bit first ([`super::words`]).
    pub buses: &'a [Vec<usize>],
    /// The algebraic method takes only words that look like arithmetic.
    pub arithmetic_only: bool,
    /// The sweep is among the methods run (so that costly enumerations may try it first; not
    /// with `--engine exhaustive`, which runs the enumeration alone).
    pub sweep_follows: bool,
    /// Once a method finds a difference (which settles the verdict), what is left of the run
    /// gets at most this much more time (`--after-difference`). `None`: no such bound (with
    /// `--decide-all`, or when simulation already settled the verdict and `limits` are the
    /// shortened ones).
    pub after_difference: Option<std::time::Duration>,
}

/// What a method returns: findings for the pairs it decided (or, for the last method, for
/// all), group records, and its solver figures.
#[derive(Default)]
pub(crate) struct StageOutput {
    pub findings: Vec<(usize, Finding)>,
    pub groups: Vec<GroupRecord>,
    pub sat: SatStats,
    pub sweep: Option<SweepStats>,
    /// The graph with the method's merges applied (same inputs, every pair and the constraint
    /// mapped into it): the later methods run on it instead.
    pub reduced: Option<Reduced>,
    /// Open pairs the method found hard for the ones after it (bits of an arithmetic word
    /// above a difference already found): the later methods take them last, after the other
    /// pairs, within the time a difference leaves ([`Context::after_difference`]).
    pub deferred: Vec<usize>,
    /// What the method spent on each pair it worked on (entries of one pair add up).
    pub costs: Vec<(usize, PairCost)>,
}

impl StageOutput {
    /// Share `seconds` of work on the group `members` evenly among them (no SAT conflicts).
    pub fn share_seconds(&mut self, members: &[usize], seconds: f64) {
        let each = seconds.max(0.0) / members.len().max(1) as f64;
        self.costs.extend(members.iter().map(|&p| {
            (
                p,
                PairCost {
                    seconds: each,
                    conflicts: 0,
                },
            )
        }));
    }
}

/// A graph a method reduced by proved merges, with the pairs and the constraint mapped into it.
pub(crate) struct Reduced {
    pub aig: Aig,
    pub pairs: Vec<PairQuery>,
    pub constraint: Lit,
}
