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
use crate::aig::{Lit, Node};

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

/// The projection of leaf `j` (< 6) on one 64-bit word.
const PROJECTION: [u64; 6] = [
    0xAAAA_AAAA_AAAA_AAAA,
    0xCCCC_CCCC_CCCC_CCCC,
    0xF0F0_F0F0_F0F0_F0F0,
    0xFF00_FF00_FF00_FF00,
    0xFFFF_0000_FFFF_0000,
    0xFFFF_FFFF_0000_0000,
];

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
    /// anchors.
    pub(super) fn match_cut(&mut self, l: Lit, side: u8) -> Cut {
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
        for j in 0..k {
            let n = self.cut.leaves[j] as usize;
            self.cut.slot[n] = (1 + j) as u32;
            for w in 0..words {
                self.cut.tables[(1 + j) * words + w] = if j < 6 {
                    PROJECTION[j]
                } else if (w >> (j - 6)) & 1 == 1 {
                    u64::MAX
                } else {
                    0
                };
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
        while let Some(n) = self.cut.stack.pop() {
            let mut e = self.fo_head[n as usize];
            while e != NO_EDGE {
                edges += 1;
                if edges > UP_EDGES {
                    return Cut::Unknown;
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
                if same || compl {
                    self.cut.matched += 1;
                    return Cut::Equal(Lit::from_node(p, compl != l.is_complemented()));
                }
            }
        }
        Cut::Apart
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
        let (mx, my) = (mask(x), mask(y));
        for w in 0..words {
            let v = (c.tables[ax + w] ^ mx) & (c.tables[ay + w] ^ my);
            c.tables.push(v);
        }
        at
    }
}

/// All ones for a complemented literal, else zero.
#[inline]
fn mask(l: Lit) -> u64 {
    if l.is_complemented() {
        u64::MAX
    } else {
        0
    }
}
