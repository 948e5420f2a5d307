//! Bounded-window equality queries: decide only on the nodes near two literals (at most a budget
//! of AND nodes), the frontier acting as free variables, and ask whether the literals can differ.
//!
//! One solver serves every query of a sweep: a node's gate clauses are added the first time a
//! window holds it and stay (they are facts about the graph), so clauses learned in one query
//! help the next, and the solver's decisions are limited to the current window (its *scope*),
//! so that the rest of the graph, already encoded, costs nothing. Only the miter clauses of a
//! query are guarded by an activation literal that is retired afterwards.
//!
//! Every clause is true of the graph, so UNSAT proves the literals equal. A model is a real
//! counterexample only when the window reached the primary inputs everywhere (it is then
//! *complete*: the scope is a cone closed under fan-in, so a conflict-free assignment of it
//! extends to the whole formula); otherwise it is *partial* and the caller tries to extend it.
//! The solver is replaced once it holds many variables, to bound its memory and the reach of
//! propagation.
//!
//! A first, cheaper kind of query ([`Window::query_fresh`]) encodes a small window on its own,
//! guarded by an activation literal, in a separate small solver: it proves most local rewrites
//! at a cost bounded by the window, however large the graph. Before that solver, a window with
//! few leaves is decided by truth tables ([`super::window_truth`]), without SAT.

use super::window_truth::{TruthAnswer as Truth, TruthWindow};
use crate::aig::{Aig, Lit, Marks, Node};
use crate::sat::{CLit, ClauseSink, Limits, Sat, SatResult, SatStats};

/// Variables the small solver of [`Window::query_fresh`] may accumulate before it is replaced
/// (the clauses of spent windows stay until then).
const FRESH_VARS_PER_SOLVER: u64 = 4_000;

/// Variables the solver may accumulate before it is replaced.
const VARS_PER_SOLVER: u64 = 60_000;
/// Activation literals retired together: each unit clause makes varisat simplify its whole
/// clause database, so they are added in batches (until then a spent activation literal is
/// simply never assumed again, and lies outside every scope).
const RETIRE_BATCH: usize = 1_024;

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

/// The small solver of [`Window::query_fresh`] and its scratch space.
struct Fresh {
    sat: Sat<'static>,
    /// Each graph node's variable as a number over every small solver so far, plus one (0:
    /// none); valid for the current query when at least the query's first number.
    var: Vec<u32>,
    /// The number of the current small solver's first variable.
    base: u32,
    order: Vec<u32>,
    /// The window's nodes, breadth first.
    stack: Vec<u32>,
    scope: Vec<CLit>,
}

impl Fresh {
    /// Give node `n` a variable of the current query (whose slots are above `first`) and queue
    /// it, unless it has one already.
    fn visit(&mut self, n: u32, first: u32) {
        if self.var[n as usize] <= first {
            let v = self.sat.fresh();
            self.var[n as usize] = self.base + v.var().index() as u32 + 1;
            self.stack.push(n);
        }
    }
}

/// A reusable window prover.
pub(crate) struct Window {
    /// Truth tables of small windows, tried before the fresh solver.
    truth: TruthWindow,
    fresh: Fresh,
    sat: Sat<'static>,
    limits: Limits,
    retired: SatStats,
    /// Each graph node's slot in the current solver: 0 when not yet seen, else its variable's
    /// index plus one, shifted left, with the low bit set once its gate clauses are in.
    var: Vec<u32>,
    /// The nodes visited by the current query.
    marks: Marks,
    order: Vec<u32>,
    queue: Vec<u32>,
    scope: Vec<CLit>,
    /// Spent activation literals not yet retired by a unit clause.
    spent: Vec<CLit>,
}

impl Window {
    /// A window prover under `limits`.
    pub(crate) fn new(limits: &Limits) -> Window {
        Window {
            truth: TruthWindow::default(),
            fresh: Fresh {
                sat: Sat::new(limits),
                var: Vec::new(),
                base: 0,
                order: Vec::new(),
                stack: Vec::new(),
                scope: Vec::new(),
            },
            sat: Sat::new(limits),
            limits: limits.clone(),
            retired: SatStats::default(),
            var: Vec::new(),
            marks: Marks::new(),
            order: Vec::new(),
            queue: Vec::new(),
            scope: Vec::new(),
            spent: Vec::new(),
        }
    }

    /// Queries of [`Window::query_fresh`] decided by truth tables (no solver).
    pub(crate) fn truth_answers(&self) -> usize {
        self.truth.decided
    }

    /// Statistics over every solver used so far.
    pub(crate) fn stats(&self) -> SatStats {
        let mut s = self.retired;
        s.add(&self.sat.stats());
        s.add(&self.fresh.sat.stats());
        s
    }

    /// Can `a` and `b` differ? A query of its own: encodes at most `budget` AND nodes in a small
    /// solver under an activation literal, with the frontier free, and `conflicts` allowed.
    /// Cheap and bounded whatever the graph's size; most local rewrites are proved here.
    pub(crate) fn query_fresh(
        &mut self,
        f: &Aig,
        a: Lit,
        b: Lit,
        budget: usize,
        conflicts: u64,
    ) -> WindowAnswer {
        match self.truth.decide(f, a, b, budget) {
            Some(Truth::Equal) => return WindowAnswer::Equal,
            Some(Truth::Differ(values)) => return WindowAnswer::Differ(values),
            None => {}
        }
        if self.fresh.sat.stats().vars >= FRESH_VARS_PER_SOLVER {
            let used = self.fresh.sat.stats().vars;
            self.retired.add(&self.fresh.sat.stats());
            self.fresh.sat = Sat::new(&self.limits);
            self.fresh.base = self.fresh.base.saturating_add(used as u32);
            if self.fresh.base > u32::MAX / 2 {
                self.fresh.var.iter_mut().for_each(|v| *v = 0);
                self.fresh.base = 0;
            }
        }
        // Collect the window: nodes reached from the two roots, AND nodes expanded while the
        // budget lasts.
        let fr = &mut self.fresh;
        if fr.var.len() < f.len() {
            fr.var.resize(f.len(), 0);
        }
        let base = fr.base;
        // Slots above `first` belong to this query.
        let first = base + fr.sat.stats().vars as u32;
        let lit = |slot: u32| varisat::Var::from_index((slot - 1 - base) as usize).positive();
        fr.order.clear();
        fr.stack.clear();
        fr.scope.clear();
        let mut expanded = 0usize;
        let mut complete = true;
        let act = fr.sat.fresh();
        fr.scope.push(act);
        for n in [a.node(), b.node()] {
            fr.visit(n, first);
        }
        // Breadth first, so that the window holds the nodes nearest the two literals.
        let mut head = 0;
        while head < fr.stack.len() {
            let n = fr.stack[head];
            head += 1;
            let v = lit(fr.var[n as usize]);
            fr.scope.push(v);
            if let Node::And(x, y) = f.node(n) {
                if expanded < budget {
                    expanded += 1;
                    fr.order.push(n);
                    fr.visit(x.node(), first);
                    fr.visit(y.node(), first);
                } else {
                    complete = false;
                }
            } else if n == 0 {
                fr.sat.clause(&[!act, !v]);
            }
        }
        for &n in &fr.order {
            if let Node::And(x, y) = f.node(n) {
                let z = lit(fr.var[n as usize]);
                let cx = lit_of(lit(fr.var[x.index()]), x);
                let cy = lit_of(lit(fr.var[y.index()]), y);
                fr.sat.clause(&[!act, !z, cx]);
                fr.sat.clause(&[!act, !z, cy]);
                fr.sat.clause(&[!act, z, !cx, !cy]);
            }
        }
        let ca = lit_of(lit(fr.var[a.index()]), a);
        let cb = lit_of(lit(fr.var[b.index()]), b);
        crate::cnf::xor_if(&mut fr.sat, act, ca, cb);
        // Decide only on this window: the variables of earlier windows, whose clauses are
        // all satisfied by their spent activation literals, are left free.
        fr.sat.set_scope(Some(&fr.scope));
        let answer = match fr.sat.solve_within(&[act], Some(conflicts)) {
            SatResult::Unsat => WindowAnswer::Equal,
            SatResult::Sat => {
                let mut values: Vec<(u32, bool)> = fr
                    .stack
                    .iter()
                    .filter_map(|&n| match f.node(n) {
                        Node::Input(k) => Some((k, fr.sat.value(lit(fr.var[n as usize])))),
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
        fr.sat.clause(&[!act]);
        answer
    }

    /// The variable of node `n` if it has one.
    #[inline]
    fn seen(&self, n: u32) -> Option<CLit> {
        let s = self.var[n as usize] >> 1;
        (s != 0).then(|| varisat::Var::from_index(s as usize - 1).positive())
    }

    fn var_of(&mut self, f: &Aig, n: u32) -> CLit {
        if let Some(v) = self.seen(n) {
            return v;
        }
        let v = self.sat.fresh();
        self.var[n as usize] = (v.var().index() as u32 + 1) << 1;
        if let Node::Const = f.node(n) {
            self.sat.clause(&[!v]);
        }
        v
    }

    /// Can `a` and `b` differ? Decides on at most `budget` AND nodes near them, with
    /// `conflicts` allowed.
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
            self.var.iter_mut().for_each(|v| *v = 0);
            self.spent.clear();
        }
        if self.var.len() < f.len() {
            self.var.resize(f.len(), 0);
        }
        self.marks.start(f.len());
        // Collect the window breadth first, so that it holds the nodes nearest the two
        // literals; AND nodes are expanded while the budget lasts.
        self.order.clear();
        self.queue.clear();
        self.scope.clear();
        self.queue.push(a.node());
        self.queue.push(b.node());
        let mut expanded = 0usize;
        let mut complete = true;
        let mut head = 0;
        while head < self.queue.len() {
            let n = self.queue[head];
            head += 1;
            if !self.marks.mark(n as usize) {
                continue;
            }
            let v = self.var_of(f, n);
            self.scope.push(v);
            if let Node::And(x, y) = f.node(n) {
                if expanded < budget {
                    expanded += 1;
                    self.order.push(n);
                    self.queue.push(x.node());
                    self.queue.push(y.node());
                } else {
                    complete = false;
                }
            }
        }
        for i in 0..self.order.len() {
            let n = self.order[i];
            if self.var[n as usize] & 1 == 1 {
                continue;
            }
            self.var[n as usize] |= 1;
            if let Node::And(x, y) = f.node(n) {
                let z = self.seen(n).expect("in the window");
                let cx = lit_of(self.var_of(f, x.node()), x);
                let cy = lit_of(self.var_of(f, y.node()), y);
                self.sat.clause(&[!z, cx]);
                self.sat.clause(&[!z, cy]);
                self.sat.clause(&[z, !cx, !cy]);
            }
        }
        let act = self.sat.fresh();
        self.scope.push(act);
        let ca = lit_of(self.seen(a.node()).expect("in the window"), a);
        let cb = lit_of(self.seen(b.node()).expect("in the window"), b);
        crate::cnf::xor_if(&mut self.sat, act, ca, cb);
        self.sat.set_scope(Some(&self.scope));
        let answer = match self.sat.solve_within(&[act], Some(conflicts)) {
            SatResult::Unsat => WindowAnswer::Equal,
            SatResult::Sat => {
                let mut values: Vec<(u32, bool)> = self
                    .queue
                    .iter()
                    .filter(|&&n| self.marks.is_marked(n as usize))
                    .filter_map(|&n| match f.node(n) {
                        Node::Input(k) => Some((k, self.sat.value(self.seen(n).expect("seen")))),
                        _ => None,
                    })
                    .collect();
                values.sort_unstable();
                values.dedup_by_key(|p| p.0);
                if complete {
                    WindowAnswer::Differ(values)
                } else {
                    WindowAnswer::Partial(values)
                }
            }
            SatResult::Stopped(_) => WindowAnswer::Unknown,
        };
        self.spent.push(act);
        if self.spent.len() >= RETIRE_BATCH {
            for act in std::mem::take(&mut self.spent) {
                self.sat.clause(&[!act]);
            }
        }
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
