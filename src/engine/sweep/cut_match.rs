//! Cut matching across the two designs: a node just built in the merged graph is expanded
//! downwards to a cut of *anchors* (primary inputs and nodes that both designs already reach,
//! through hashing or a merge), and its truth table over that cut is computed; then the nodes
//! above the same cut are visited upwards through the fanout lists, each closed one (both
//! fan-ins inside the region) with its own truth table over the cut, and a node of the other
//! design with an equal table (or its complement) is the node's partner. A remapped design's
//! lookup function, once its leaves are merged with the source's nodes, meets the source node it
//! was cut from this way, however large the simulation class both sit in (near-constant nodes
//! of an arbiter fill classes of thousands).
//!
//! Soundness: both nodes are functions of the cut's nodes alone (the upward region is closed
//! under fan-in down to the cut), so equal tables for every assignment of the cut mean equal
//! functions (an exhaustive enumeration over the cut): a merge needs no SAT call.

use super::candidates::BOTH;
use super::{Sweeper, NO_EDGE};
use crate::aig::{variable_word, Lit, Node};

/// Leaves of a matching cut: 2^8 assignments, 4 words per table.
const CUT_LEAVES: usize = 8;
/// AND nodes expanded below the node (a 6-input sum of products has up to about 100).
const CUT_INNER: usize = 160;
/// Fanout edges examined above the cut.
const UP_EDGES: usize = 1_024;

/// The answer of [`Sweeper::match_cut`].
#[derive(Clone, Copy, Debug, PartialEq, Eq)]
pub(super) enum Cut {
    /// Equal to this literal of the merged graph, reached by the other design.
    Equal(Lit),
    /// The cut was found and the region above it visited in full: no node of the other design
    /// computes the node's function over the same anchors.
    Apart,
    /// No answer (the cut or the region above it exceeds its bound).
    Unknown,
}

/// Scratch space of the cut matching.
#[derive(Default)]
pub(super) struct CutScratch {
    /// Per merged-graph node: the query number of its last visit (down or up phase).
    stamp: Vec<u32>,
    /// Per merged-graph node: its table's slot during the visit of its stamp.
    slot: Vec<u32>,
    query: u32,
    leaves: Vec<u32>,
    inner: Vec<u32>,
    stack: Vec<u32>,
    tables: Vec<u64>,
    /// Merges found.
    pub matched: usize,
}

impl CutScratch {
    /// A fresh query number: every stamp older than it is unvisited.
    fn next_query(&mut self, len: usize) -> u32 {
        if self.stamp.len() < len {
            self.stamp.resize(len, 0);
            self.slot.resize(len, 0);
        }
        self.query = self.query.wrapping_add(1);
        if self.query == 0 {
            self.stamp.iter_mut().for_each(|s| *s = 0);
            self.query = 1;
        }
        self.query
    }
}

impl Sweeper<'_> {
    /// Whether merged-graph node `u` is an anchor: an input, or reached by both designs.
    fn anchor(&self, u: u32) -> bool {
        matches!(self.f.node(u), Node::Input(_)) || self.fside[u as usize] == BOTH
    }

    /// A literal of the merged graph equal to `l` (the image just built for a node of one
    /// design, `side` its design marks) and reached by the other design, found over a cut of
    /// anchors; `rep` (the image of the class representative, when it belongs to the other
    /// design) is preferred among equal matches.
    pub(super) fn match_cut(&mut self, l: Lit, side: u8, rep: Option<Lit>) -> Cut {
        let u = l.node();
        if side == BOTH || side == 0 || !matches!(self.f.node(u), Node::And(..)) {
            return Cut::Unknown;
        }
        let q = self.cut.next_query(self.f.len());
        self.cut.leaves.clear();
        self.cut.inner.clear();
        self.cut.stack.clear();
        self.cut.stack.push(u);
        self.cut.stamp[u as usize] = q;
        self.cut.stamp[0] = q;
        while let Some(n) = self.cut.stack.pop() {
            let Node::And(x, y) = self.f.node(n) else {
                continue;
            };
            self.cut.inner.push(n);
            if self.cut.inner.len() > CUT_INNER {
                return Cut::Unknown;
            }
            for c in [x.node(), y.node()] {
                if self.cut.stamp[c as usize] == q {
                    continue;
                }
                self.cut.stamp[c as usize] = q;
                if self.anchor(c) {
                    self.cut.leaves.push(c);
                    if self.cut.leaves.len() > CUT_LEAVES {
                        return Cut::Unknown;
                    }
                } else {
                    self.cut.stack.push(c);
                }
            }
        }
        let k = self.cut.leaves.len();
        let words = 1usize << k.saturating_sub(6);
        // Slots: the constant, the leaves, then every node computed (down, then up).
        self.cut.tables.clear();
        self.cut.tables.resize((1 + k) * words, 0);
        self.cut.slot[0] = 0;
        self.cut.leaves.sort_unstable();
        for (j, &n) in self.cut.leaves.iter().enumerate() {
            self.cut.slot[n as usize] = (1 + j) as u32;
            for w in 0..words {
                self.cut.tables[(1 + j) * words + w] = variable_word(j, w as u64);
            }
        }
        // The node's own table: its expanded nodes in topological order.
        let mut inner = std::mem::take(&mut self.cut.inner);
        inner.sort_unstable();
        for &n in &inner {
            self.table_of(n, words);
        }
        self.cut.inner = inner;
        let mine = self.cut.slot[u as usize] as usize * words;
        // Upwards: a new stamp marks the closed region; the cut and the constant are in it.
        let q = self.cut.next_query(self.f.len());
        self.cut.stamp[0] = q;
        self.cut.stack.clear();
        for j in 0..k {
            let n = self.cut.leaves[j];
            self.cut.stamp[n as usize] = q;
            self.cut.stack.push(n);
        }
        let mut edges = 0;
        let mut best: Option<(u32, bool)> = None;
        while let Some(n) = self.cut.stack.pop() {
            if edges > UP_EDGES {
                break;
            }
            let mut e = self.fo_head[n as usize];
            while e != NO_EDGE {
                edges += 1;
                if edges > UP_EDGES {
                    break;
                }
                let p = e / 2;
                e = self.fo_next[e as usize];
                if p == u || self.cut.stamp[p as usize] == q {
                    continue;
                }
                let Node::And(x, y) = self.f.node(p) else {
                    continue;
                };
                if self.cut.stamp[x.index()] != q || self.cut.stamp[y.index()] != q {
                    continue;
                }
                self.cut.stamp[p as usize] = q;
                let at = self.table_of(p, words);
                self.cut.stack.push(p);
                if self.fside[p as usize] | side != BOTH {
                    continue;
                }
                let t = &self.cut.tables;
                let same = (0..words).all(|w| t[at + w] == t[mine + w]);
                let compl = !same && (0..words).all(|w| t[at + w] == !t[mine + w]);
                if (same || compl) && best.is_none_or(|(b, _)| p < b) {
                    best = Some((p, compl));
                }
            }
        }
        // The representative when it is among the matches (the node every other member is
        // merged onto), else the earliest match: the node the other design's later nodes were
        // built on, so that hashing goes on finding them.
        if let Some(r) = rep.filter(|r| self.cut.stamp[r.index()] == q && r.node() != u) {
            let (at, t) = (self.cut.slot[r.index()] as usize * words, &self.cut.tables);
            let same = (0..words).all(|w| t[at + w] == t[mine + w]);
            let compl = !same && (0..words).all(|w| t[at + w] == !t[mine + w]);
            if same || compl {
                best = Some((r.node(), compl));
            }
        }
        match best {
            Some((p, compl)) => {
                self.cut.matched += 1;
                Cut::Equal(Lit::from_node(p, compl != l.is_complemented()))
            }
            None if edges > UP_EDGES => Cut::Unknown,
            None => Cut::Apart,
        }
    }

    /// Compute the table of AND node `n` from its fan-ins' slots into a new slot; returns
    /// the slot's offset.
    fn table_of(&mut self, n: u32, words: usize) -> usize {
        let Node::And(x, y) = self.f.node(n) else {
            return 0;
        };
        let c = &mut self.cut;
        let at = c.tables.len();
        c.slot[n as usize] = (at / words) as u32;
        let (ax, ay) = (
            c.slot[x.index()] as usize * words,
            c.slot[y.index()] as usize * words,
        );
        let (mx, my) = (x.complement_mask(), y.complement_mask());
        for w in 0..words {
            let v = (c.tables[ax + w] ^ mx) & (c.tables[ay + w] ^ my);
            c.tables.push(v);
        }
        at
    }
}

#[cfg(test)]
mod tests {
    use super::super::candidates::sides;
    use super::super::fixture::{copied, image};
    use super::*;
    use crate::aig::Aig;
    use crate::engine::pairs::PairQuery;
    use crate::sat::Limits;

    /// The merged graph of `g` with the side marks the sweep keeps (nothing merged).
    fn swept<'a>(g: &'a Aig, pairs: &[PairQuery], limits: &Limits) -> (Sweeper<'a>, Vec<u8>) {
        let side = sides(g, pairs);
        let mut sw = copied(g, limits);
        for (i, &s) in side.iter().enumerate() {
            let u = sw.map[i].index();
            sw.fside[u] |= s;
        }
        (sw, side)
    }

    #[test]
    fn a_node_of_the_other_design_over_the_same_cut_is_its_partner() {
        let mut g = Aig::new();
        let ins: Vec<Lit> = (0..3).map(|_| g.add_input()).collect();
        let (a, b, c) = (ins[0], ins[1], ins[2]);
        // The reference: (a & b) & c and a & b & !c; the candidate: a & (b & c), its
        // complement written as !a | !b | !c, and a & (b & !c) regrouped with an XOR.
        let ab = g.and(a, b);
        let x = g.and(ab, c);
        let x2 = g.and(ab, !c);
        let bc = g.and(b, c);
        let y = g.and(a, bc);
        let nbc = g.or(!b, !c);
        let ny = g.or(!a, nbc);
        let bx = g.xor(b, c);
        let bxb = g.and(bx, b);
        let z = g.and(a, bxb);
        let w = g.and(a, !c);
        let pairs = [
            PairQuery {
                reference: x,
                candidate: y,
            },
            PairQuery {
                reference: !x,
                candidate: ny,
            },
            PairQuery {
                reference: x2,
                candidate: z,
            },
            PairQuery {
                reference: x2,
                candidate: w,
            },
        ];
        let limits = Limits::none();
        let (mut sw, side) = swept(&g, &pairs, &limits);
        let ix = image(&sw, x);
        assert_eq!(
            sw.match_cut(image(&sw, y), side[y.index()], None),
            Cut::Equal(ix)
        );
        assert_eq!(
            sw.match_cut(image(&sw, ny), side[ny.index()], None),
            Cut::Equal(!ix),
            "a complemented partner"
        );
        let ix2 = image(&sw, x2);
        assert_eq!(
            sw.match_cut(image(&sw, z), side[z.index()], None),
            Cut::Equal(ix2)
        );
        // a & !c: a function of the inputs that no reference node computes.
        assert_eq!(
            sw.match_cut(image(&sw, w), side[w.index()], None),
            Cut::Apart
        );
        assert_eq!(sw.cut.matched, 3);
        // A node both designs reach is not matched; nor is an input.
        assert_eq!(sw.match_cut(image(&sw, a), BOTH, None), Cut::Unknown);
    }

    #[test]
    fn an_anchor_stops_the_cut_and_a_wide_cut_has_no_answer() {
        let mut g = Aig::new();
        let ins: Vec<Lit> = (0..10).map(|_| g.add_input()).collect();
        // The reference ANDs nine inputs in a chain, the candidate in a balanced tree.
        // (The chain starts at the last input, so no AND is shared with the tree.)
        let x = ins[..8].iter().rev().fold(ins[8], |acc, &i| g.and(acc, i));
        let mut level = ins[..9].to_vec();
        while level.len() > 1 {
            level = level
                .chunks(2)
                .map(|p| {
                    if p.len() == 2 {
                        g.and(p[0], p[1])
                    } else {
                        p[0]
                    }
                })
                .collect();
        }
        let y = level[0];
        assert_ne!(x, y);
        let pairs = [PairQuery {
            reference: x,
            candidate: y,
        }];
        let limits = Limits::none();
        let (mut sw, side) = swept(&g, &pairs, &limits);
        // Nine leaves: more than the cut may hold.
        assert_eq!(
            sw.match_cut(image(&sw, y), side[y.index()], None),
            Cut::Unknown
        );
        // Once the first eight inputs' AND (a reference node) is reached by the candidate too,
        // it is an anchor: the cut of the tree closes over it and the ninth input.
        let mut g2 = Aig::new();
        let ins: Vec<Lit> = (0..9).map(|_| g2.add_input()).collect();
        let m = g2.and_all(&ins[..8]);
        let x = g2.and(m, ins[8]);
        let m2 = g2.and_all(&ins[..8]);
        assert_eq!(m, m2, "hashing shares the eight-input AND");
        let y2 = g2.and(!ins[8], m);
        let pairs = [
            PairQuery {
                reference: x,
                candidate: y2,
            },
            PairQuery {
                reference: m,
                candidate: m2,
            },
        ];
        let (mut sw, side) = swept(&g2, &pairs, &limits);
        assert_eq!(sw.fside[image(&sw, m).index()], BOTH);
        assert_eq!(
            sw.match_cut(image(&sw, y2), side[y2.index()], None),
            Cut::Apart,
            "m & !i8 over the cut (m, i8): no reference node computes it"
        );
    }
}
