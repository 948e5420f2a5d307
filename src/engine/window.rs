//! Bounded-window equality queries: encode only the nodes near two literals (at most a budget
//! of AND nodes), treat the frontier as free variables, and ask whether the literals can differ.
//!
//! Freeing the frontier only adds behaviours, so UNSAT proves the literals equal. A model is a
//! real counterexample only when the window reached the primary inputs everywhere (it is then
//! *complete*); otherwise the caller falls back to a query on the whole cone.
//! Clauses of each query are guarded by an activation literal that is retired afterwards; the
//! solver is replaced once it holds a few thousand variables so that retired windows do not
//! slow later queries down.

use crate::aig::{Aig, Lit, Node};
use crate::sat::{CLit, ClauseSink, Limits, Sat, SatResult, SatStats};
use std::collections::HashMap;

/// Variables a window solver may accumulate before it is replaced: varisat assigns every
/// variable of the solver before it reports a model, so retired windows must not pile up.
const VARS_PER_SOLVER: u64 = 4_000;

/// The answer of one window query.
pub(crate) enum WindowAnswer {
    /// The literals are equal for every input vector.
    Equal,
    /// They differ under these values of primary inputs (input position, value).
    Differ(Vec<(u32, bool)>),
    /// A model of a truncated window: these input values (input position, value) and some
    /// frontier values make the literals differ; a real counterexample may or may not extend it.
    Partial(Vec<(u32, bool)>),
    /// No decision (the conflict limit).
    Unknown,
}

/// A reusable window prover.
pub(crate) struct Window {
    sat: Sat<'static>,
    limits: Limits,
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
        if self.sat.stats().vars >= VARS_PER_SOLVER {
            self.retired.add(&self.sat.stats());
            self.sat = Sat::new(&self.limits);
        }
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
        // Breadth first, so that the window holds the nodes nearest the two literals.
        let mut head = 0;
        while head < self.stack.len() {
            let n = self.stack[head];
            head += 1;
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
            SatResult::Sat => {
                let mut values: Vec<(u32, bool)> = self
                    .vars
                    .iter()
                    .filter_map(|(&n, &v)| match f.node(n) {
                        Node::Input(k) => Some((k, self.sat.value(v))),
                        _ => None,
                    })
                    .collect();
                values.sort_unstable();
                if complete {
                    WindowAnswer::Differ(values)
                } else {
                    WindowAnswer::Partial(values)
                }
            }
            SatResult::Stopped(_) => WindowAnswer::Unknown,
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
        // A budget of one node leaves a free frontier: a model is only partial.
        assert!(matches!(
            w.query(&g, x, n, 1, 1000),
            WindowAnswer::Partial(_)
        ));
    }
}
