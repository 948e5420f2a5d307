//! Event-driven flip simulation: simulate a block of input patterns once, then flip one input
//! in every pattern and re-simulate only the nodes whose values change. An output whose
//! words change proves that it depends on the flipped input; the pattern is the evidence.

use super::bits::Bits;
use crate::aig::{simulate, Aig, Lit, Marks, Node, SimTable};
use std::cmp::Reverse;
use std::collections::BinaryHeap;

/// Fan-out lists of every AIG node (compressed rows).
#[derive(Clone, Debug)]
pub(crate) struct Fanout {
    start: Vec<u32>,
    list: Vec<u32>,
}

impl Fanout {
    /// The fan-out lists of `aig` as it is now (nodes added later have none).
    pub(crate) fn new(aig: &Aig) -> Fanout {
        let n = aig.len();
        let mut count = vec![0u32; n + 1];
        for node in aig.nodes() {
            if let Node::And(a, b) = *node {
                count[a.index()] += 1;
                count[b.index()] += 1;
            }
        }
        let mut start = vec![0u32; n + 1];
        for i in 0..n {
            start[i + 1] = start[i] + count[i];
        }
        let mut fill = start.clone();
        let mut list = vec![0u32; start[n] as usize];
        for (i, node) in aig.nodes().iter().enumerate() {
            if let Node::And(a, b) = *node {
                for f in [a.index(), b.index()] {
                    list[fill[f] as usize] = i as u32;
                    fill[f] += 1;
                }
            }
        }
        Fanout { start, list }
    }

    /// Nodes that read node `n`.
    #[inline]
    pub(crate) fn of(&self, n: usize) -> &[u32] {
        match (self.start.get(n), self.start.get(n + 1)) {
            (Some(&s), Some(&e)) => &self.list[s as usize..e as usize],
            _ => &[],
        }
    }
}

/// One block of patterns, simulated, ready for flips.
pub(crate) struct FlipSim<'a> {
    aig: &'a Aig,
    fanout: &'a Fanout,
    words: usize,
    inputs: Vec<Vec<u64>>,
    table: SimTable,
    scratch: Vec<u64>,
    /// Nodes whose words changed in the current flip.
    changed: Marks,
    /// Nodes queued for re-simulation in the current flip.
    queued: Marks,
    /// Whether any flip was made yet.
    flipped: bool,
    heap: BinaryHeap<Reverse<u32>>,
    /// Node evaluations done by flips so far (a cost figure).
    pub(crate) work: u64,
}

impl<'a> FlipSim<'a> {
    /// Simulate `aig` on `inputs` (one row of `words` words per input).
    pub(crate) fn new(aig: &'a Aig, fanout: &'a Fanout, inputs: Vec<Vec<u64>>) -> FlipSim<'a> {
        let words = inputs.first().map_or(1, |r| r.len()).max(1);
        let table = simulate(aig, &inputs, words);
        FlipSim {
            aig,
            fanout,
            words,
            inputs,
            table,
            scratch: vec![0u64; aig.len() * words],
            changed: Marks::new(),
            queued: Marks::new(),
            flipped: false,
            heap: BinaryHeap::new(),
            work: 0,
        }
    }

    /// Flip primary input `k` in every pattern and propagate the change through its fan-out,
    /// in topological order, stopping wherever a node's words do not change.
    pub(crate) fn flip(&mut self, k: usize) {
        self.changed.start(self.aig.len());
        self.queued.start(self.aig.len());
        self.flipped = true;
        let w = self.words;
        let xn = self.aig.inputs()[k] as usize;
        for i in 0..w {
            self.scratch[xn * w + i] = !self.table.values[xn * w + i];
        }
        self.changed.mark(xn);
        self.heap.clear();
        for &f in self.fanout.of(xn) {
            if self.queued.mark(f as usize) {
                self.heap.push(Reverse(f));
            }
        }
        while let Some(Reverse(n)) = self.heap.pop() {
            let n = n as usize;
            let Node::And(a, b) = self.aig.node(n as u32) else {
                continue;
            };
            self.work += 1;
            let (ia, ib) = (a.index(), b.index());
            let (ma, mb) = (a.complement_mask(), b.complement_mask());
            let (ca, cb) = (self.changed.is_marked(ia), self.changed.is_marked(ib));
            let mut differs = false;
            for i in 0..w {
                let va = if ca {
                    self.scratch[ia * w + i]
                } else {
                    self.table.values[ia * w + i]
                };
                let vb = if cb {
                    self.scratch[ib * w + i]
                } else {
                    self.table.values[ib * w + i]
                };
                let v = (va ^ ma) & (vb ^ mb);
                self.scratch[n * w + i] = v;
                differs |= v != self.table.values[n * w + i];
            }
            if differs {
                self.changed.mark(n);
                for &f in self.fanout.of(n) {
                    if self.queued.mark(f as usize) {
                        self.heap.push(Reverse(f));
                    }
                }
            }
        }
    }

    /// After [`FlipSim::flip`]: the first pattern in which `root` changed, if any.
    pub(crate) fn first_difference(&self, root: Lit) -> Option<usize> {
        let n = root.index();
        if !self.flipped || !self.changed.is_marked(n) {
            return None;
        }
        let w = self.words;
        (0..w).find_map(|i| {
            let d = self.table.values[n * w + i] ^ self.scratch[n * w + i];
            (d != 0).then(|| i * 64 + d.trailing_zeros() as usize)
        })
    }

    /// The value of `root` in pattern `p` before any flip.
    pub(crate) fn value(&self, root: Lit, p: usize) -> bool {
        self.table.lit_bit(root, p)
    }

    /// The value of every primary input in pattern `p`.
    pub(crate) fn pattern(&self, p: usize) -> Bits {
        let mut b = Bits::new(self.inputs.len());
        for (k, row) in self.inputs.iter().enumerate() {
            b.set(k, (row[p / 64] >> (p % 64)) & 1 == 1);
        }
        b
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::aig::{eval, random_words};

    #[test]
    fn flip_finds_a_sensitizing_pattern_and_it_is_real() {
        // y = a ? b : c, z = b & c
        let mut g = Aig::new();
        let a = g.add_input();
        let b = g.add_input();
        let c = g.add_input();
        let y = g.mux(a, b, c);
        let z = g.and(b, c);
        let fo = Fanout::new(&g);
        let mut s = FlipSim::new(&g, &fo, random_words(3, 2, 7));
        for k in 0..3 {
            s.flip(k);
            for root in [y, z] {
                if let Some(p) = s.first_difference(root) {
                    let mut v = s.pattern(p).to_bools();
                    let before = eval(&g, &v, &[root])[0];
                    v[k] = !v[k];
                    assert_ne!(before, eval(&g, &v, &[root])[0], "input {k}");
                }
            }
        }
        // z does not read a: flipping a never changes z.
        s.flip(0);
        assert_eq!(s.first_difference(z), None);
        assert!(s.first_difference(y).is_some());
    }
}
