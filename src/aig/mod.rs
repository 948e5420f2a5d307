//! The and-inverter graph (AIG): literals, nodes in a flat topologically ordered `Vec`,
//! structural hashing, and the small graph utilities every later stage shares.
//!
//! **Invariant:** every AND node's fan-ins refer to nodes with smaller indices, so the node
//! vector is always in topological order. **Invariant:** the AIG never sees names; names of
//! input and output bits live in [`crate::design::Design`].

mod lit;
mod marks;
mod patterns;
#[cfg(test)]
pub(crate) mod random_graph;
mod sim;

pub use lit::Lit;
pub use marks::Marks;
pub use patterns::{mixed_density, one_hot_words};
pub use sim::{
    eval, random_words, simulate, simulate_into, simulate_prefix, variable_word, SimTable,
    PROJECTIONS,
};

use crate::hash::FastMap;

/// One node of the graph.
#[derive(Copy, Clone, Debug, PartialEq, Eq)]
pub enum Node {
    /// The constant-false node (always node 0).
    Const,
    /// Primary input number `k` (position in [`Aig::inputs`]).
    Input(u32),
    /// Two-input AND of the two literals (the smaller literal first).
    And(Lit, Lit),
}

/// An and-inverter graph with structural hashing.
///
/// ```
/// use equicone::aig::{Aig, Lit};
/// let mut g = Aig::new();
/// let a = g.add_input();
/// let b = g.add_input();
/// let x = g.and(a, b);
/// assert_eq!(g.and(b, a), x); // structural hashing
/// assert_eq!(g.and(a, !a), Lit::FALSE); // trivial rules
/// ```
#[derive(Clone, Debug, Default)]
pub struct Aig {
    nodes: Vec<Node>,
    inputs: Vec<u32>,
    strash: FastMap<(Lit, Lit), u32>,
    /// Keep what the source wrote: `x & !x` and `s ? t : t` stay nodes (see [`Aig::as_written`]).
    written: bool,
}

impl Aig {
    /// An empty graph holding only the constant node.
    pub fn new() -> Aig {
        Aig {
            nodes: vec![Node::Const],
            inputs: Vec::new(),
            strash: FastMap::default(),
            written: false,
        }
    }

    /// An empty graph that keeps the structure a source wrote: `x & !x` is a node (not the
    /// constant 0) and `s ? t : t` reads `s`, so each output's structural cone holds every
    /// input its expressions read. The function is the same; only the cone audit uses it.
    pub fn as_written() -> Aig {
        Aig {
            written: true,
            ..Aig::new()
        }
    }

    /// Whether this graph keeps the written structure ([`Aig::as_written`]).
    pub fn is_written(&self) -> bool {
        self.written
    }

    /// Number of nodes, the constant and the inputs included.
    pub fn len(&self) -> usize {
        self.nodes.len()
    }

    /// Whether the graph holds only the constant node.
    pub fn is_empty(&self) -> bool {
        self.nodes.len() == 1
    }

    /// Number of primary inputs.
    pub fn num_inputs(&self) -> usize {
        self.inputs.len()
    }

    /// Number of AND nodes.
    pub fn num_ands(&self) -> usize {
        self.nodes.len() - 1 - self.inputs.len()
    }

    /// The node at `index`.
    #[inline]
    pub fn node(&self, index: u32) -> Node {
        self.nodes[index as usize]
    }

    /// All nodes in topological order.
    pub fn nodes(&self) -> &[Node] {
        &self.nodes
    }

    /// Node indices of the primary inputs, in input order.
    pub fn inputs(&self) -> &[u32] {
        &self.inputs
    }

    /// The literal of primary input `k`.
    pub fn input_lit(&self, k: usize) -> Lit {
        Lit::from_node(self.inputs[k], false)
    }

    /// Add a fresh primary input and return its literal.
    pub fn add_input(&mut self) -> Lit {
        let idx = self.nodes.len() as u32;
        self.nodes.push(Node::Input(self.inputs.len() as u32));
        self.inputs.push(idx);
        Lit::from_node(idx, false)
    }

    /// Reserve room for `n` more nodes.
    pub fn reserve(&mut self, n: usize) {
        self.nodes.reserve(n);
        self.strash.reserve(n);
    }

    /// AND of two literals, with the trivial rules and structural hashing.
    pub fn and(&mut self, a: Lit, b: Lit) -> Lit {
        let (a, b) = if a <= b { (a, b) } else { (b, a) };
        if a == Lit::FALSE || (a == !b && !self.written) {
            return Lit::FALSE;
        }
        if a == Lit::TRUE || a == b {
            return b;
        }
        if let Some(&n) = self.strash.get(&(a, b)) {
            return Lit::from_node(n, false);
        }
        debug_assert!(a.index() < self.nodes.len() && b.index() < self.nodes.len());
        let idx = self.nodes.len() as u32;
        self.nodes.push(Node::And(a, b));
        self.strash.insert((a, b), idx);
        Lit::from_node(idx, false)
    }

    /// Look up an AND without creating it (after the trivial rules).
    pub fn find_and(&self, a: Lit, b: Lit) -> Option<Lit> {
        let (a, b) = if a <= b { (a, b) } else { (b, a) };
        if a == Lit::FALSE || a == !b {
            return Some(Lit::FALSE);
        }
        if a == Lit::TRUE || a == b {
            return Some(b);
        }
        self.strash.get(&(a, b)).map(|&n| Lit::from_node(n, false))
    }

    /// OR of two literals.
    pub fn or(&mut self, a: Lit, b: Lit) -> Lit {
        !self.and(!a, !b)
    }

    /// XOR of two literals (three AND nodes).
    pub fn xor(&mut self, a: Lit, b: Lit) -> Lit {
        if a.is_const() {
            return b.xor_complement(a == Lit::TRUE);
        }
        if b.is_const() {
            return a.xor_complement(b == Lit::TRUE);
        }
        let p = self.and(a, !b);
        let q = self.and(!a, b);
        self.or(p, q)
    }

    /// XNOR of two literals.
    pub fn xnor(&mut self, a: Lit, b: Lit) -> Lit {
        !self.xor(a, b)
    }

    /// Two-way selector: `s ? t : e`.
    pub fn mux(&mut self, s: Lit, t: Lit, e: Lit) -> Lit {
        if !self.written {
            if t == e {
                return t;
            }
            // A data input equal to the select (or its complement) is a constant there.
            let t = if t == s {
                Lit::TRUE
            } else if t == !s {
                Lit::FALSE
            } else {
                t
            };
            let e = if e == s {
                Lit::FALSE
            } else if e == !s {
                Lit::TRUE
            } else {
                e
            };
            // A constant data input leaves one gate: `s ? 1 : e` is `s | e`, and so on.
            if t == Lit::TRUE {
                return self.or(s, e);
            }
            if t == Lit::FALSE {
                return self.and(!s, e);
            }
            if e == Lit::TRUE {
                return self.or(!s, t);
            }
            if e == Lit::FALSE {
                return self.and(s, t);
            }
        }
        let p = self.and(s, t);
        let q = self.and(!s, e);
        self.or(p, q)
    }

    /// AND of many literals as a balanced tree (true for none).
    pub fn and_all(&mut self, lits: &[Lit]) -> Lit {
        self.balanced(lits, Lit::TRUE, Aig::and)
    }

    /// OR of many literals as a balanced tree (false for none).
    pub fn or_all(&mut self, lits: &[Lit]) -> Lit {
        self.balanced(lits, Lit::FALSE, Aig::or)
    }

    /// XOR of many literals as a balanced tree (false for none).
    pub fn xor_all(&mut self, lits: &[Lit]) -> Lit {
        self.balanced(lits, Lit::FALSE, Aig::xor)
    }

    fn balanced(&mut self, lits: &[Lit], unit: Lit, op: fn(&mut Aig, Lit, Lit) -> Lit) -> Lit {
        if lits.is_empty() {
            return unit;
        }
        let mut layer: Vec<Lit> = lits.to_vec();
        while layer.len() > 1 {
            let mut next = Vec::with_capacity(layer.len().div_ceil(2));
            for pair in layer.chunks(2) {
                next.push(if pair.len() == 2 {
                    op(self, pair[0], pair[1])
                } else {
                    pair[0]
                });
            }
            layer = next;
        }
        layer[0]
    }

    /// Copy the cones of `roots` from `other` into this graph, mapping `other`'s input `k`
    /// to `input_map[k]`. Returns the literals of the roots here. Structural hashing merges
    /// whatever this graph already has.
    pub fn import(&mut self, other: &Aig, input_map: &[Lit], roots: &[Lit]) -> Vec<Lit> {
        assert_eq!(
            input_map.len(),
            other.num_inputs(),
            "import: input map must cover every input"
        );
        let cone = other.cone_mask(roots);
        let mut map = vec![Lit::FALSE; other.len()];
        for (i, node) in other.nodes.iter().enumerate() {
            if !cone[i] {
                continue;
            }
            map[i] = match *node {
                Node::Const => Lit::FALSE,
                Node::Input(k) => input_map[k as usize],
                Node::And(a, b) => {
                    let fa = map[a.index()].xor_complement(a.is_complemented());
                    let fb = map[b.index()].xor_complement(b.is_complemented());
                    self.and(fa, fb)
                }
            };
        }
        roots
            .iter()
            .map(|r| map[r.index()].xor_complement(r.is_complemented()))
            .collect()
    }

    /// A mask over node indices: true for every node in the transitive fan-in of `roots`
    /// (the roots included). Iterative, in reverse topological order.
    pub fn cone_mask(&self, roots: &[Lit]) -> Vec<bool> {
        let mut mark = vec![false; self.nodes.len()];
        let mut hi = 0usize;
        for r in roots {
            mark[r.index()] = true;
            hi = hi.max(r.index());
        }
        for i in (0..=hi).rev() {
            if !mark[i] {
                continue;
            }
            if let Node::And(a, b) = self.nodes[i] {
                mark[a.index()] = true;
                mark[b.index()] = true;
            }
        }
        mark
    }

    /// Input positions (indices into [`Aig::inputs`]) in the structural cone of `root`, ascending.
    pub fn cone_inputs(&self, roots: &[Lit]) -> Vec<u32> {
        let mark = self.cone_mask(roots);
        self.inputs
            .iter()
            .enumerate()
            .filter(|(_, &n)| mark[n as usize])
            .map(|(k, _)| k as u32)
            .collect()
    }

    /// Logic level of every node: 0 for constants and inputs, 1 + max of fan-ins for ANDs.
    pub fn levels(&self) -> Vec<u32> {
        let mut lv = vec![0u32; self.nodes.len()];
        for (i, node) in self.nodes.iter().enumerate() {
            if let Node::And(a, b) = *node {
                lv[i] = 1 + lv[a.index()].max(lv[b.index()]);
            }
        }
        lv
    }

    /// Check the graph's invariants; panics with a message on violation (an internal bug).
    pub fn check(&self) {
        assert!(
            matches!(self.nodes.first(), Some(Node::Const)),
            "node 0 must be the constant"
        );
        for (i, node) in self.nodes.iter().enumerate() {
            match *node {
                Node::Const => assert_eq!(i, 0, "constant node not at index 0"),
                Node::Input(k) => assert_eq!(
                    self.inputs[k as usize] as usize, i,
                    "input table out of sync"
                ),
                Node::And(a, b) => {
                    assert!(
                        a.index() < i && b.index() < i,
                        "node {i} is not in topological order"
                    );
                    assert!(a < b, "node {i} fan-ins not normalized");
                }
            }
        }
    }

    /// Run [`Aig::check`] in debug builds only.
    #[inline]
    pub fn debug_check(&self) {
        #[cfg(debug_assertions)]
        self.check();
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn trivial_rules_and_hashing() {
        let mut g = Aig::new();
        let a = g.add_input();
        let b = g.add_input();
        assert_eq!(g.and(a, Lit::FALSE), Lit::FALSE);
        assert_eq!(g.and(a, Lit::TRUE), a);
        assert_eq!(g.and(a, a), a);
        assert_eq!(g.and(a, !a), Lit::FALSE);
        let x = g.and(a, b);
        assert_eq!(g.and(b, a), x);
        assert_eq!(g.num_ands(), 1);
        g.check();
    }

    #[test]
    fn mux_with_a_constant_or_repeated_data_input_is_one_gate() {
        // Every select/data combination drawn from {s, !s, e, !e, 0, 1}: the mux
        // must keep its truth table, and with a constant (or select-equal) data input
        // it must cost at most one AND node.
        let cands = |s: Lit, e: Lit| [s, !s, e, !e, Lit::FALSE, Lit::TRUE];
        for ti in 0..6 {
            for ei in 0..6 {
                let mut g = Aig::new();
                let s = g.add_input();
                let e = g.add_input();
                let (t, f) = (cands(s, e)[ti], cands(s, e)[ei]);
                let m = g.mux(s, t, f);
                let foldable = ti != 2 && ti != 3 || ei != 2 && ei != 3;
                if foldable {
                    assert!(
                        g.num_ands() <= 1,
                        "mux case {ti},{ei}: {} ANDs",
                        g.num_ands()
                    );
                }
                for v in 0..4u32 {
                    let bits = [v & 1 == 1, v & 2 == 2];
                    let got = sim::eval(&g, &bits, &[m, s, t, f]);
                    let want = if got[1] { got[2] } else { got[3] };
                    assert_eq!(
                        got[0], want,
                        "mux case {ti},{ei} at s={} e={}",
                        bits[0], bits[1]
                    );
                }
            }
        }
    }

    #[test]
    fn import_merges_common_structure() {
        let mut g1 = Aig::new();
        let a = g1.add_input();
        let b = g1.add_input();
        let x = g1.xor(a, b);
        let mut g = Aig::new();
        let c = g.add_input();
        let d = g.add_input();
        let y = g.xor(c, d);
        let before = g.len();
        let r = g.import(&g1, &[c, d], &[x]);
        assert_eq!(r[0], y);
        assert_eq!(g.len(), before);
        g.check();
    }

    #[test]
    fn cone_inputs_follow_paths() {
        let mut g = Aig::new();
        let a = g.add_input();
        let _b = g.add_input();
        let c = g.add_input();
        let x = g.and(a, c);
        assert_eq!(g.cone_inputs(&[x]), vec![0, 2]);
        assert_eq!(g.levels()[x.index()], 1);
    }
}
