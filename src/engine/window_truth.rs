//! Truth tables of small windows: the cheap first answer of [`super::window::Window::query_fresh`].
//! From the two literals a cut is grown by expanding its AND node of highest index while it
//! keeps at most [`MAX_LEAVES`] leaves (primary inputs and AND nodes left unexpanded) and the
//! expansions stay within the query's budget; both literals are then simulated over every
//! assignment of the leaves, as bit-parallel truth tables.
//!
//! Soundness: each literal is a function of the window's leaves, so equal tables mean equal
//! functions for every value of the leaves, the reachable ones among them: the literals are
//! equal (an exhaustive enumeration of the window). Unequal tables give one assignment of the
//! leaves under which they differ: a real counterexample when every leaf is a primary input
//! (the window is complete); otherwise the difference may be unreachable, and the SAT query on
//! its larger window takes the question.

use crate::aig::{Aig, Lit, Node};

/// A decision of [`TruthWindow::decide`].
#[derive(Debug, PartialEq, Eq)]
pub(crate) enum TruthAnswer {
    /// The literals are equal for every input vector.
    Equal,
    /// They differ under these values of primary inputs (input position, value).
    Differ(Vec<(u32, bool)>),
}

/// Leaves enumerated at most: 2^10 assignments, 16 words per node.
pub(crate) const MAX_LEAVES: usize = 10;

/// Reusable scratch space of the truth-table check.
#[derive(Default)]
pub(crate) struct TruthWindow {
    /// Per graph node: the query number that last visited it.
    stamp: Vec<u32>,
    /// Per graph node: its position in `nodes` during the query of its stamp.
    local: Vec<u32>,
    query: u32,
    /// The nodes of the current cut's window: the constant, the leaves, the expanded nodes.
    nodes: Vec<u32>,
    leaves: Vec<u32>,
    /// The expanded AND nodes of the cut.
    inner: Vec<u32>,
    tables: Vec<u64>,
    /// Windows decided here.
    pub decided: usize,
}

impl TruthWindow {
    /// Visit node `n` (queue it unless seen in this query).
    fn visit(&mut self, n: u32) {
        let i = n as usize;
        if self.stamp[i] != self.query {
            self.stamp[i] = self.query;
            self.local[i] = self.nodes.len() as u32;
            self.nodes.push(n);
        }
    }

    /// Decide whether `a` and `b` can differ on a cut of at most [`MAX_LEAVES`] leaves reached
    /// by expanding at most `budget` AND nodes of `f`: equal tables, or a difference under a
    /// cut of primary inputs; `None` leaves the query to SAT.
    pub(crate) fn decide(&mut self, f: &Aig, a: Lit, b: Lit, budget: usize) -> Option<TruthAnswer> {
        if self.stamp.len() < f.len() {
            self.stamp.resize(f.len(), 0);
            self.local.resize(f.len(), 0);
        }
        self.query = self.query.wrapping_add(1);
        if self.query == 0 {
            self.stamp.iter_mut().for_each(|s| *s = 0);
            self.query = 1;
        }
        self.nodes.clear();
        self.leaves.clear();
        // The cut starts at the two roots; the AND leaf of highest index is expanded while
        // the cut stays within MAX_LEAVES (reconvergent logic, such as a local rewrite over
        // fan-ins both sides share, closes into a small cut this way).
        for n in [a.node(), b.node()] {
            if n != 0 && !self.leaves.contains(&n) {
                self.leaves.push(n);
            }
        }
        let mut inner = std::mem::take(&mut self.inner);
        inner.clear();
        let answer = self.on_cut(f, a, b, budget, &mut inner);
        self.inner = inner;
        answer
    }

    /// [`TruthWindow::decide`] with `inner` as the scratch list of expanded nodes.
    fn on_cut(
        &mut self,
        f: &Aig,
        a: Lit,
        b: Lit,
        budget: usize,
        inner: &mut Vec<u32>,
    ) -> Option<TruthAnswer> {
        while inner.len() < budget {
            let Some((at, &n)) = self
                .leaves
                .iter()
                .enumerate()
                .filter(|(_, &n)| matches!(f.node(n), Node::And(..)))
                .max_by_key(|(_, &n)| n)
            else {
                break;
            };
            let Node::And(x, y) = f.node(n) else {
                break;
            };
            let (cx, cy) = (x.node(), y.node());
            let fresh = |c: u32| c != 0 && !self.leaves.contains(&c);
            let grown =
                self.leaves.len() - 1 + usize::from(fresh(cx)) + usize::from(fresh(cy) && cy != cx);
            if grown > MAX_LEAVES {
                break;
            }
            self.leaves.swap_remove(at);
            for c in [x.node(), y.node()] {
                if c != 0 && !self.leaves.contains(&c) {
                    self.leaves.push(c);
                }
            }
            inner.push(n);
        }
        if self.leaves.len() > MAX_LEAVES {
            return None;
        }
        // Local slots: the leaves, then the expanded nodes, each node once.
        self.leaves.sort_unstable();
        inner.sort_unstable();
        self.visit(0);
        for i in 0..self.leaves.len() {
            self.visit(self.leaves[i]);
        }
        for &n in inner.iter() {
            self.visit(n);
        }
        let k = self.leaves.len();
        let words = 1usize << k.saturating_sub(6);
        self.tables.clear();
        self.tables.resize(self.nodes.len() * words, 0);
        for (j, &n) in self.leaves.iter().enumerate() {
            let at = self.local[n as usize] as usize * words;
            for w in 0..words {
                self.tables[at + w] = crate::aig::variable_word(j, w as u64);
            }
        }
        // Expanded nodes in topological order (ascending index); a node's fan-ins are earlier
        // in the graph, so they are leaves or expanded nodes computed before it.
        for &n in inner.iter() {
            let Node::And(x, y) = f.node(n) else {
                continue;
            };
            let (at, ax, ay) = (
                self.local[n as usize] as usize * words,
                self.local[x.index()] as usize * words,
                self.local[y.index()] as usize * words,
            );
            let (cx, cy) = (x.complement_mask(), y.complement_mask());
            for w in 0..words {
                self.tables[at + w] = (self.tables[ax + w] ^ cx) & (self.tables[ay + w] ^ cy);
            }
        }
        let (la, lb) = (
            self.local[a.index()] as usize * words,
            self.local[b.index()] as usize * words,
        );
        let (ca, cb) = (a.complement_mask(), b.complement_mask());
        let differ = (0..words).find_map(|w| {
            let d = (self.tables[la + w] ^ ca) ^ (self.tables[lb + w] ^ cb);
            (d != 0).then(|| w * 64 + d.trailing_zeros() as usize)
        });
        let Some(m) = differ else {
            self.decided += 1;
            return Some(TruthAnswer::Equal);
        };
        let mut complete = true;
        let mut values: Vec<(u32, bool)> = Vec::new();
        for (j, &n) in self.leaves.iter().enumerate() {
            match f.node(n) {
                Node::Input(i) => values.push((i, (m >> j) & 1 == 1)),
                _ => complete = false,
            }
        }
        values.sort_unstable();
        self.decided += usize::from(complete);
        // A difference over a cut of inner nodes may be unreachable; the SAT query on the
        // larger window decides it.
        complete.then_some(TruthAnswer::Differ(values))
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::aig::eval;

    #[test]
    fn equal_forms_are_equal_and_a_difference_reproduces() {
        let mut g = Aig::new();
        let ins: Vec<Lit> = (0..8).map(|_| g.add_input()).collect();
        // XOR of eight inputs, as a chain and as a balanced tree.
        let mut chain = ins[0];
        for &x in &ins[1..] {
            chain = g.xor(chain, x);
        }
        let mut level = ins.clone();
        while level.len() > 1 {
            level = level.chunks(2).map(|p| g.xor(p[0], p[1])).collect();
        }
        let tree = level[0];
        let mut t = TruthWindow::default();
        assert!(matches!(
            t.decide(&g, chain, tree, 100),
            Some(TruthAnswer::Equal)
        ));
        // The chain against the tree with one input left out differs; the vector shows it.
        let mut short = ins[1];
        for &x in &ins[2..] {
            short = g.xor(short, x);
        }
        match t.decide(&g, chain, short, 100) {
            Some(TruthAnswer::Differ(v)) => {
                let mut vals = vec![false; 8];
                for (i, b) in v {
                    vals[i as usize] = b;
                }
                let e = eval(&g, &vals, &[chain, short]);
                assert_ne!(e[0], e[1]);
            }
            _ => panic!("the two parities differ"),
        }
        // A budget of two AND nodes leaves AND leaves: a difference there may be unreachable,
        // so the query is left to SAT.
        assert!(t.decide(&g, chain, short, 2).is_none());
    }

    #[test]
    fn too_many_leaves_leave_the_query_to_sat() {
        let mut g = Aig::new();
        let ins: Vec<Lit> = (0..12).map(|_| g.add_input()).collect();
        let a = g.and_all(&ins);
        let b = g.and_all(&ins[..11]);
        let mut t = TruthWindow::default();
        assert!(t.decide(&g, a, b, 100).is_none());
        // Complemented literals and the constant: !(x & y) against !x | !y.
        let (x, y) = (ins[0], ins[1]);
        let n = !g.and(x, y);
        let o = g.or(!x, !y);
        assert!(matches!(t.decide(&g, n, o, 100), Some(TruthAnswer::Equal)));
        let z = g.and(x, !x);
        assert!(matches!(
            t.decide(&g, Lit::FALSE, z, 100),
            Some(TruthAnswer::Equal)
        ));
        // x & y against x (a difference with every leaf an input).
        let xy = g.and(x, y);
        assert!(matches!(
            t.decide(&g, xy, x, 100),
            Some(TruthAnswer::Differ(_))
        ));
    }
}
