//! The one wrapper over varisat: variables, clauses, solving under assumptions, models,
//! limits (conflicts per query, a wall-clock deadline) and statistics.

use serde::Serialize;
use std::sync::atomic::{AtomicBool, Ordering};
use std::sync::Arc;
use std::time::{Duration, Instant};

use varisat::ExtendFormula;
pub use varisat::Lit as CLit;

/// Why a query or a run stopped before an answer.
#[derive(Copy, Clone, Debug, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum StopReason {
    /// The per-query conflict limit was reached.
    ConflictLimit,
    /// The wall-clock time limit was reached.
    Timeout,
    /// The engine's own size limit (support, BDD nodes) was reached.
    EngineLimit,
    /// Another output pair was proved different, which settles the verdict, and the time
    /// allowed after that (`--after-difference`) ran out.
    AfterDifference,
}

impl std::fmt::Display for StopReason {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.write_str(match self {
            StopReason::ConflictLimit => "conflict limit reached",
            StopReason::Timeout => "time limit reached",
            StopReason::EngineLimit => "engine size limit reached",
            StopReason::AfterDifference => {
                "left open once a difference settled the verdict (--decide-all)"
            }
        })
    }
}

/// The answer to one query.
#[derive(Copy, Clone, Debug, PartialEq, Eq)]
pub enum SatResult {
    /// Satisfiable; the model is available from [`Sat::value`].
    Sat,
    /// Unsatisfiable under the assumptions.
    Unsat,
    /// No answer within the limits.
    Stopped(StopReason),
}

/// Resource limits shared by every solver of one run.
#[derive(Clone, Debug)]
pub struct Limits {
    /// Conflicts allowed per query (`None`: no limit).
    pub conflicts_per_query: Option<u64>,
    deadline: Option<Instant>,
    flag: Arc<AtomicBool>,
}

impl Limits {
    /// Limits with an optional wall-clock budget from now and an optional conflict limit per query.
    /// A timer thread raises the stop flag at the deadline, which interrupts a running search.
    pub fn new(timeout: Option<Duration>, conflicts_per_query: Option<u64>) -> Limits {
        let flag = Arc::new(AtomicBool::new(false));
        let deadline = timeout.map(|t| Instant::now() + t);
        if let Some(t) = timeout {
            let f = flag.clone();
            std::thread::spawn(move || {
                std::thread::sleep(t);
                f.store(true, Ordering::Relaxed);
            });
        }
        Limits {
            conflicts_per_query,
            deadline,
            flag,
        }
    }

    /// No limits.
    pub fn none() -> Limits {
        Limits::new(None, None)
    }

    /// Whether the wall-clock budget is spent.
    pub fn expired(&self) -> bool {
        self.flag.load(Ordering::Relaxed) || self.deadline.is_some_and(|d| Instant::now() >= d)
    }

    /// The wall-clock budget left: `None` without a deadline, zero once it has passed.
    pub fn remaining(&self) -> Option<Duration> {
        self.deadline
            .map(|d| d.saturating_duration_since(Instant::now()))
    }

    /// The flag a timer raises at the deadline.
    pub fn flag(&self) -> Arc<AtomicBool> {
        self.flag.clone()
    }
}

/// Something that takes CNF: a solver or a formula being written out.
pub trait ClauseSink {
    /// A fresh variable, returned as its positive literal.
    fn fresh(&mut self) -> CLit;
    /// Add a clause.
    fn clause(&mut self, lits: &[CLit]);
}

/// Statistics of one solver.
#[derive(Copy, Clone, Debug, Default, Serialize, PartialEq, Eq)]
pub struct SatStats {
    /// Queries solved.
    pub calls: u64,
    /// Conflicts over all queries.
    pub conflicts: u64,
    /// Variables created.
    pub vars: u64,
    /// Clauses added.
    pub clauses: u64,
}

impl SatStats {
    /// Add another solver's figures to these.
    pub fn add(&mut self, o: &SatStats) {
        self.calls += o.calls;
        self.conflicts += o.conflicts;
        self.vars += o.vars;
        self.clauses += o.clauses;
    }
}

/// An incremental solver with limits.
pub struct Sat<'a> {
    solver: varisat::Solver<'a>,
    limits: Limits,
    model: Vec<bool>,
    stats: SatStats,
}

impl<'a> Sat<'a> {
    /// A solver under `limits`.
    pub fn new(limits: &Limits) -> Sat<'a> {
        let mut solver = varisat::Solver::new();
        solver.set_interrupt_flag(Some(limits.flag()));
        Sat {
            solver,
            limits: limits.clone(),
            model: Vec::new(),
            stats: SatStats::default(),
        }
    }

    /// Write a proof of every UNSAT answer to `target` in `format` (call before adding clauses).
    pub fn write_proof(&mut self, target: impl std::io::Write + 'a, format: varisat::ProofFormat) {
        self.solver.write_proof(target, format);
    }

    /// Finish the proof output.
    pub fn close_proof(&mut self) -> Result<(), String> {
        self.solver.close_proof().map_err(|e| e.to_string())
    }

    /// Solve under `assumptions`.
    pub fn solve(&mut self, assumptions: &[CLit]) -> SatResult {
        self.solve_within(assumptions, None)
    }

    /// Solve under `assumptions` with at most `conflicts` conflicts (and at most the run's own
    /// per-query limit, whichever is smaller).
    pub fn solve_within(&mut self, assumptions: &[CLit], conflicts: Option<u64>) -> SatResult {
        if self.limits.expired() {
            return SatResult::Stopped(StopReason::Timeout);
        }
        self.solver.assume(assumptions);
        let limit = match (conflicts, self.limits.conflicts_per_query) {
            (Some(a), Some(b)) => Some(a.min(b)),
            (a, b) => a.or(b),
        };
        self.solver.set_conflict_limit(limit);
        let before = self.solver.conflicts();
        let r = self.solver.solve();
        self.stats.calls += 1;
        self.stats.conflicts += self.solver.conflicts() - before;
        match r {
            Ok(true) => {
                let n = self.stats.vars as usize;
                self.model.clear();
                self.model.resize(n, false);
                for l in self.solver.model().expect("a model after SAT") {
                    if l.index() < n {
                        self.model[l.index()] = l.is_positive();
                    }
                }
                SatResult::Sat
            }
            Ok(false) => SatResult::Unsat,
            Err(varisat::solver::SolverError::Interrupted) => {
                SatResult::Stopped(if self.limits.expired() {
                    StopReason::Timeout
                } else {
                    StopReason::ConflictLimit
                })
            }
            Err(e) => panic!("SAT solver failed: {e}"),
        }
    }

    /// Limit the decisions of later queries to the variables of `scope` (`None`: all). A model
    /// found under a scope assigns only what the search reached (the rest reads as false): the
    /// caller must give a scope whose every conflict-free assignment extends to a model, such as
    /// the variables of a cone closed under fan-in ([`crate::cnf::Tseitin::cone_vars`]) plus the
    /// assumptions.
    pub fn set_scope(&mut self, scope: Option<&[CLit]>) {
        match scope {
            None => self.solver.set_decision_scope(None),
            Some(lits) => {
                let vars: Vec<varisat::Var> = lits.iter().map(|l| l.var()).collect();
                self.solver.set_decision_scope(Some(&vars));
            }
        }
    }

    /// The value of `l` in the last model.
    pub fn value(&self, l: CLit) -> bool {
        self.model.get(l.index()).copied().unwrap_or(false) == l.is_positive()
    }

    /// After an UNSAT answer under assumptions: a subset of the assumptions that is already
    /// unsatisfiable with the clauses (empty when the clauses alone are unsatisfiable).
    pub fn failed_core(&self) -> Vec<CLit> {
        self.solver
            .failed_core()
            .map(|c| c.to_vec())
            .unwrap_or_default()
    }

    /// Statistics so far.
    pub fn stats(&self) -> SatStats {
        self.stats
    }
}

impl ClauseSink for Sat<'_> {
    fn fresh(&mut self) -> CLit {
        let v = self.solver.new_var();
        self.stats.vars += 1;
        v.positive()
    }
    fn clause(&mut self, lits: &[CLit]) {
        self.stats.clauses += 1;
        self.solver.add_clause(lits);
    }
}

impl ClauseSink for varisat::CnfFormula {
    fn fresh(&mut self) -> CLit {
        self.new_var().positive()
    }
    fn clause(&mut self, lits: &[CLit]) {
        self.add_clause(lits);
    }
}

#[cfg(test)]
#[allow(clippy::needless_range_loop)]
mod tests {
    use super::*;

    #[test]
    fn answers_and_models() {
        let limits = Limits::none();
        let mut s = Sat::new(&limits);
        let a = s.fresh();
        let b = s.fresh();
        s.clause(&[a, b]);
        s.clause(&[!a]);
        assert_eq!(s.solve(&[]), SatResult::Sat);
        assert!(s.value(b) && !s.value(a));
        assert_eq!(s.solve(&[!b]), SatResult::Unsat);
        assert_eq!(s.solve(&[]), SatResult::Sat);
        assert_eq!(s.stats().calls, 3);
    }

    #[test]
    fn conflict_limit_stops_and_solver_stays_usable() {
        // Pigeonhole 7 into 6: hard for CDCL (common practice), so 10 conflicts cannot decide it.
        let limits = Limits::new(None, Some(10));
        let mut s = Sat::new(&limits);
        let (p, h) = (7, 6);
        let g = s.fresh();
        let x: Vec<Vec<CLit>> = (0..p)
            .map(|_| (0..h).map(|_| s.fresh()).collect())
            .collect();
        for row in &x {
            let mut c = row.clone();
            c.push(!g);
            s.clause(&c);
        }
        for j in 0..h {
            for i in 0..p {
                for k in i + 1..p {
                    s.clause(&[!x[i][j], !x[k][j], !g]);
                }
            }
        }
        assert_eq!(s.solve(&[g]), SatResult::Stopped(StopReason::ConflictLimit));
        // The solver stays usable: without the guard the formula is satisfiable.
        assert_eq!(s.solve(&[!g]), SatResult::Sat);
    }
}
