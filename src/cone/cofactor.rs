//! Cofactor miters in the shared AIG: `f|x=0 XOR f|x=1` for an output `f` and an input `x`.
//!
//! Only the nodes on a path from `x` to `f` are rebuilt (twice, with `x` fixed to 0 and to 1);
//! everything else is shared with the original graph, and structural hashing merges what the
//! two cofactors have in common. A miter that hashes to constant false proves independence
//! without a SAT call.

use super::flip::Fanout;
use crate::aig::{Aig, Lit, Marks, Node};

/// Reusable scratch space for building cofactor miters over one original graph.
pub(crate) struct Cofactorer {
    /// Number of nodes of the original graph (the fan-out lists cover these).
    original: usize,
    /// The nodes rebuilt for the current input.
    marks: Marks,
    map0: Vec<Lit>,
    map1: Vec<Lit>,
    order: Vec<u32>,
    stack: Vec<u32>,
}

impl Cofactorer {
    /// Scratch space for a graph of `original` nodes.
    pub(crate) fn new(original: usize) -> Cofactorer {
        Cofactorer {
            original,
            marks: Marks::new(),
            map0: vec![Lit::FALSE; original],
            map1: vec![Lit::FALSE; original],
            order: Vec::new(),
            stack: Vec::new(),
        }
    }

    /// Build `root|x=0 XOR root|x=1` in `g`, where `x` is the original input node `xn` and
    /// `in_cone` marks the original nodes in the cone of `root`. Returns the miter literal.
    pub(crate) fn miter(
        &mut self,
        g: &mut Aig,
        fanout: &Fanout,
        in_cone: &[bool],
        root: Lit,
        xn: u32,
    ) -> Lit {
        let (r0, r1) = self.cofactors(g, fanout, in_cone, root, xn);
        g.xor(r0, r1)
    }

    /// The two cofactors of `root` with respect to input node `xn`.
    pub(crate) fn cofactors(
        &mut self,
        g: &mut Aig,
        fanout: &Fanout,
        in_cone: &[bool],
        root: Lit,
        xn: u32,
    ) -> (Lit, Lit) {
        debug_assert!(root.index() < self.original && (xn as usize) < self.original);
        self.marks.start(self.original);
        // The nodes on a path from x to the root: x's transitive fan-out within the cone.
        self.order.clear();
        self.stack.clear();
        self.marks.mark(xn as usize);
        self.stack.push(xn);
        while let Some(n) = self.stack.pop() {
            self.order.push(n);
            for &f in fanout.of(n as usize) {
                let fi = f as usize;
                if fi < self.original && in_cone[fi] && self.marks.mark(fi) {
                    self.stack.push(f);
                }
            }
        }
        self.order.sort_unstable();
        self.map0[xn as usize] = Lit::FALSE;
        self.map1[xn as usize] = Lit::TRUE;
        for i in 0..self.order.len() {
            let n = self.order[i];
            if let Node::And(a, b) = g.node(n) {
                let (a0, a1) = self.get(a);
                let (b0, b1) = self.get(b);
                self.map0[n as usize] = g.and(a0, b0);
                self.map1[n as usize] = g.and(a1, b1);
            }
        }
        self.get(root)
    }

    /// The two cofactor literals of an original literal (itself where `x` does not reach it).
    #[inline]
    fn get(&self, l: Lit) -> (Lit, Lit) {
        let n = l.index();
        if self.marks.is_marked(n) {
            let c = l.is_complemented();
            (
                self.map0[n].xor_complement(c),
                self.map1[n].xor_complement(c),
            )
        } else {
            (l, l)
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn masked_input_gives_constant_false_miter() {
        // y = (a & t) | (a & !t): the cofactors in t are both `a`.
        let mut g = Aig::new();
        let a = g.add_input();
        let t = g.add_input();
        let p = g.and(a, t);
        let q = g.and(a, !t);
        let y = g.or(p, q);
        let fo = Fanout::new(&g);
        let mask = g.cone_mask(&[y]);
        let mut c = Cofactorer::new(g.len());
        let m = c.miter(&mut g, &fo, &mask, y, t.node());
        assert_eq!(m, Lit::FALSE);
        let (r0, r1) = c.cofactors(&mut g, &fo, &mask, y, a.node());
        assert_eq!((r0, r1), (Lit::FALSE, Lit::TRUE));
    }
}
