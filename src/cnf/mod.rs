//! Tseitin encoding of AIG cones into CNF (Tseitin 1968), on demand and incrementally, into any
//! [`ClauseSink`] (a solver or a formula for DIMACS output).
//!
//! An AND node `z = a & b` gives the clauses `(!z | a) (!z | b) (z | !a | !b)`.

pub mod dimacs;

use crate::aig::{Aig, Lit, Marks, Node};
use crate::sat::{CLit, ClauseSink};

/// The XOR miter of one output pair, one direction: the clauses of `d -> (x xor y)`. Enough
/// where `d` is only ever asked to be true (an assumption, or one literal of the clause that
/// some pair differs): a model with `d` true has `x != y`.
pub fn xor_if<S: ClauseSink + ?Sized>(sink: &mut S, d: CLit, x: CLit, y: CLit) {
    sink.clause(&[!d, x, y]);
    sink.clause(&[!d, !x, !y]);
}

/// `d <-> (x xor y)`: the clauses of [`xor_if`] and their converse.
pub fn xor_iff<S: ClauseSink + ?Sized>(sink: &mut S, d: CLit, x: CLit, y: CLit) {
    xor_if(sink, d, x, y);
    sink.clause(&[d, !x, y]);
    sink.clause(&[d, x, !y]);
}

/// `x xor y` asserted outright.
pub fn xor_true<S: ClauseSink + ?Sized>(sink: &mut S, x: CLit, y: CLit) {
    sink.clause(&[x, y]);
    sink.clause(&[!x, !y]);
}

/// The map from AIG nodes to CNF variables, growing as cones are encoded.
#[derive(Clone, Debug, Default)]
pub struct Tseitin {
    map: Vec<Option<CLit>>,
    stack: Vec<u32>,
    todo: Vec<u32>,
    /// Visit marks for [`Tseitin::cone_vars`].
    marks: Marks,
}

impl Tseitin {
    /// An empty map.
    pub fn new() -> Tseitin {
        Tseitin::default()
    }

    /// The CNF literal of `l`, encoding its cone first where that is not done yet.
    pub fn lit<S: ClauseSink>(&mut self, aig: &Aig, sink: &mut S, l: Lit) -> CLit {
        if self.map.len() < aig.len() {
            self.map.resize(aig.len(), None);
        }
        if self.map[l.index()].is_none() {
            self.encode_cone(aig, sink, l.node());
        }
        let v = self.map[l.index()].expect("encoded");
        if l.is_complemented() {
            !v
        } else {
            v
        }
    }

    /// Use `v` as the variable of node `n` (an input), so that several graphs can share their
    /// input variables. Must come before `n` is encoded.
    pub fn bind(&mut self, n: u32, v: CLit) {
        if self.map.len() <= n as usize {
            self.map.resize(n as usize + 1, None);
        }
        assert!(
            self.map[n as usize].is_none(),
            "bind: node {n} is already encoded"
        );
        self.map[n as usize] = Some(v);
    }

    /// The CNF literal of node `n`, if it is encoded.
    pub fn var_of(&self, n: u32) -> Option<CLit> {
        self.map.get(n as usize).copied().flatten()
    }

    /// The variables of every encoded node in the cones of `roots` (which must be encoded), for
    /// a solver's decision scope: an assignment of them that violates no clause extends to the
    /// whole formula by simulating the other nodes, since the cones are closed under fan-in.
    pub fn cone_vars(&mut self, aig: &Aig, roots: &[Lit]) -> Vec<CLit> {
        self.marks.start(aig.len());
        let mut out = Vec::new();
        self.stack.clear();
        self.stack.extend(roots.iter().map(|r| r.node()));
        while let Some(n) = self.stack.pop() {
            if !self.marks.mark(n as usize) {
                continue;
            }
            if let Some(v) = self.map.get(n as usize).copied().flatten() {
                out.push(v);
            }
            if let Node::And(a, b) = aig.node(n) {
                self.stack.push(a.node());
                self.stack.push(b.node());
            }
        }
        out
    }

    fn encode_cone<S: ClauseSink>(&mut self, aig: &Aig, sink: &mut S, root: u32) {
        // Collect the unencoded part of the cone with an explicit stack, then encode it in
        // ascending (topological) order.
        self.stack.clear();
        self.todo.clear();
        self.stack.push(root);
        while let Some(n) = self.stack.pop() {
            if self.map[n as usize].is_some() {
                continue;
            }
            let v = sink.fresh();
            self.map[n as usize] = Some(v);
            self.todo.push(n);
            if let Node::And(a, b) = aig.node(n) {
                self.stack.push(a.node());
                self.stack.push(b.node());
            }
        }
        self.todo.sort_unstable();
        for i in 0..self.todo.len() {
            let n = self.todo[i];
            let z = self.map[n as usize].expect("assigned above");
            match aig.node(n) {
                Node::Const => sink.clause(&[!z]),
                Node::Input(_) => {}
                Node::And(a, b) => {
                    let ca = self.map[a.index()]
                        .expect("fan-in encoded")
                        .xor_complement(a);
                    let cb = self.map[b.index()]
                        .expect("fan-in encoded")
                        .xor_complement(b);
                    sink.clause(&[!z, ca]);
                    sink.clause(&[!z, cb]);
                    sink.clause(&[z, !ca, !cb]);
                }
            }
        }
    }
}

trait Polarity {
    fn xor_complement(self, l: Lit) -> CLit;
}

impl Polarity for CLit {
    #[inline]
    fn xor_complement(self, l: Lit) -> CLit {
        if l.is_complemented() {
            !self
        } else {
            self
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::sat::{Limits, Sat, SatResult};

    #[test]
    fn xor_is_not_and() {
        let mut g = Aig::new();
        let a = g.add_input();
        let b = g.add_input();
        let x = g.xor(a, b);
        let y = g.and(a, b);
        let limits = Limits::none();
        let mut s = Sat::new(&limits);
        let mut t = Tseitin::new();
        let cx = t.lit(&g, &mut s, x);
        let cy = t.lit(&g, &mut s, y);
        assert_eq!(s.solve(&[cx, cy]), SatResult::Unsat);
        assert_eq!(s.solve(&[cx]), SatResult::Sat);
        let ca = t.lit(&g, &mut s, a);
        let cb = t.lit(&g, &mut s, b);
        assert_ne!(s.value(ca), s.value(cb));
        let cf = t.lit(&g, &mut s, Lit::FALSE);
        assert_eq!(s.solve(&[cf]), SatResult::Unsat);
    }
}
