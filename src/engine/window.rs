//! Bounded-window equality queries: encode only the nodes near two literals (at most a budget
//! of AND nodes), treat the frontier as free variables, and ask whether the literals can differ.
//!
//! Freeing the frontier only adds behaviours, so UNSAT proves the literals equal. A model is a
//! real counterexample only when the window reached the primary inputs everywhere (it is then
//! *complete*); otherwise the caller falls back to a query on the whole cone.
//! Clauses of each query are guarded by an activation literal that is retired afterwards; the
//! solver is replaced every few hundred queries so that retired clauses do not pile up.

use crate::aig::{Aig, Lit, Node};
use crate::sat::{CLit, ClauseSink, Limits, Sat, SatResult, SatStats};
use std::collections::HashMap;

/// Queries per solver before it is replaced.
const QUERIES_PER_SOLVER: usize = 400;

/// The answer of one window query.
pub(crate) enum WindowAnswer {
    /// The literals are equal for every input vector.
    Equal,
    /// They differ under these values of primary inputs (input position, value).
    Differ(Vec<(u32, bool)>),
    /// No decision (truncated window with a model, or the conflict limit).
    Unknown,
}

/// A reusable window prover.
pub(crate) struct Window {
    sat: Sat<'static>,
    limits: Limits,
    queries: usize,
    retired: SatStats,
    vars: HashMap<u32, CLit>,
    order: Vec<u32>,
    stack: Vec<u32>,
}

impl Window {
    /// A window prover under `limits`.
    pub(crate) fn new(limits: &Limits) -> Window {
        Window {
            sat: Sat::new(limits),
            limits: limits.clone(),
            queries: 0,
            retired: SatStats::default(),
            vars: HashMap::new(),
            order: Vec::new(),
            stack: Vec::new(),
        }
    }

    /// Statistics over every solver used so far.
    pub(crate) fn stats(&self) -> SatStats {
        let mut s = self.retired;
        s.add(&self.sat.stats());
        s
    }

    /// Can `a` and `b` differ? Encodes at most `budget` AND nodes, with `conflicts` allowed.
    pub(crate) fn query(
        &mut self,
        f: &Aig,
        a: Lit,
        b: Lit,
        budget: usize,
        conflicts: u64,
    ) -> WindowAnswer {
        if self.queries >= QUERIES_PER_SOLVER {
            self.retired.add(&self.sat.stats());
            self.sat = Sat::new(&self.limits);
            self.queries = 0;
        }
        self.queries += 1;
        // Collect the window: nodes reached from the two roots, AND nodes expanded while the
        // budget lasts.
        self.vars.clear();
        self.order.clear();
        self.stack.clear();
        self.stack.push(a.node());
        self.stack.push(b.node());
        let mut expanded = 0usize;
        let mut complete = true;
        let act = self.sat.fresh();
        while let Some(n) = self.stack.pop() {
            if self.vars.contains_key(&n) {
                continue;
            }
            let v = self.sat.fresh();
            self.vars.insert(n, v);
            if let Node::And(x, y) = f.node(n) {
                if expanded < budget {
                    expanded += 1;
                    self.order.push(n);
                    self.stack.push(x.node());
                    self.stack.push(y.node());
                } else {
                    complete = false;
                }
            } else if n == 0 {
                self.sat.clause(&[!act, !v]);
            }
        }
        for &n in &self.order {
            if let Node::And(x, y) = f.node(n) {
                let z = self.vars[&n];
                let cx = lit_of(self.vars[&x.node()], x);
                let cy = lit_of(self.vars[&y.node()], y);
                self.sat.clause(&[!act, !z, cx]);
                self.sat.clause(&[!act, !z, cy]);
                self.sat.clause(&[!act, z, !cx, !cy]);
            }
        }
        let ca = lit_of(self.vars[&a.node()], a);
        let cb = lit_of(self.vars[&b.node()], b);
        self.sat.clause(&[!act, ca, cb]);
        self.sat.clause(&[!act, !ca, !cb]);
        let answer = match self.sat.solve_within(&[act], Some(conflicts)) {
            SatResult::Unsat => WindowAnswer::Equal,
            SatResult::Sat if complete => {
                let mut values: Vec<(u32, bool)> = self
                    .vars
                    .iter()
                    .filter_map(|(&n, &v)| match f.node(n) {
                        Node::Input(k) => Some((k, self.sat.value(v))),
                        _ => None,
                    })
                    .collect();
                values.sort_unstable();
                WindowAnswer::Differ(values)
            }
            SatResult::Sat | SatResult::Stopped(_) => WindowAnswer::Unknown,
        };
        self.sat.clause(&[!act]);
        answer
    }
}

#[inline]
fn lit_of(v: CLit, l: Lit) -> CLit {
    if l.is_complemented() {
        !v
    } else {
        v
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn window_proves_local_rewrite_and_finds_real_difference() {
        let mut g = Aig::new();
        let a = g.add_input();
        let b = g.add_input();
        let x = g.xor(a, b);
        let o = g.or(a, b);
        let n = g.and(a, b);
        let y = g.and(o, !n);
        let limits = Limits::none();
        let mut w = Window::new(&limits);
        assert!(matches!(w.query(&g, x, y, 100, 1000), WindowAnswer::Equal));
        match w.query(&g, x, n, 100, 1000) {
            WindowAnswer::Differ(v) => {
                let vals: Vec<bool> = v.iter().map(|&(_, b)| b).collect();
                let e = crate::aig::eval(&g, &vals, &[x, n]);
                assert_ne!(e[0], e[1]);
            }
            _ => panic!("xor and and differ"),
        }
        // A budget of one node leaves a free frontier: a model is not trusted.
        assert!(matches!(w.query(&g, x, n, 1, 1000), WindowAnswer::Unknown));
    }
}
