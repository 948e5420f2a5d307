//! Latch analysis by value coverage: whether the condition under which an `always` block
//! assigns a variable bit holds for every value of the signals it depends on (a `case`,
//! `casez` or `if` chain that covers every value of its selector needs no `default`).
//!
//! The condition is a literal of the elaborator's graph; it is decided by evaluating it on
//! every assignment of the net bits it reads (bit-parallel, at most [`MAX_LEAVES`] of them),
//! so the answer is exact, never a guess. Wider conditions are not proved and stay latches.

use super::super::{Core, Lowering};
use crate::aig::{Aig, Lit, Node};

/// Most net bits a coverage condition may read to be decided by enumeration.
pub const MAX_LEAVES: usize = 16;
/// Most graph nodes a coverage condition may have.
const MAX_NODES: usize = 20_000;

/// Whether a condition holds everywhere.
#[derive(Clone, Debug, PartialEq, Eq)]
pub enum Coverage {
    /// True for every value of the bits it reads.
    Complete,
    /// False for this assignment of leaves (leaf number, value).
    Gap(Vec<(u32, bool)>),
    /// Too large to decide by enumeration.
    Undecided,
}

impl Lowering<'_> {
    /// Decide whether `cond` (of `aig`) is true for every value of the net bits it reads
    /// (memoized).
    pub(crate) fn coverage(&mut self, aig: &Aig, cond: Lit) -> Coverage {
        if cond == Lit::TRUE {
            return Coverage::Complete;
        }
        if let Some(c) = self.coverage_memo.get(&cond.raw()) {
            return c.clone();
        }
        let c = decide(aig, cond);
        self.coverage_memo.insert(cond.raw(), c.clone());
        c
    }
}

/// Whether `cond` is true for every assignment of the leaves it reads, by enumeration.
fn decide(aig: &Aig, cond: Lit) -> Coverage {
    // The cone of `cond`, with an explicit stack.
    let mut seen = crate::hash::FastMap::default();
    let mut cone: Vec<u32> = Vec::new();
    let mut leaves: Vec<u32> = Vec::new();
    let mut stack = vec![cond.node()];
    while let Some(n) = stack.pop() {
        if seen.insert(n, ()).is_some() {
            continue;
        }
        cone.push(n);
        if cone.len() > MAX_NODES {
            return Coverage::Undecided;
        }
        match aig.node(n) {
            Node::Const => {}
            Node::Input(_) => {
                leaves.push(n);
                if leaves.len() > MAX_LEAVES {
                    return Coverage::Undecided;
                }
            }
            Node::And(a, b) => {
                stack.push(a.node());
                stack.push(b.node());
            }
        }
    }
    // Children have smaller node numbers than their parents.
    cone.sort_unstable();
    leaves.sort_unstable();
    let k = leaves.len();
    let words = if k <= 6 { 1 } else { 1usize << (k - 6) };
    let valid = if k >= 6 {
        !0u64
    } else {
        (1u64 << (1 << k)) - 1
    };
    let index: crate::hash::FastMap<u32, usize> =
        cone.iter().enumerate().map(|(i, &n)| (n, i)).collect();
    let mut val: Vec<Vec<u64>> = Vec::with_capacity(cone.len());
    let lit_word = |val: &Vec<Vec<u64>>, l: Lit, w: usize| -> u64 {
        let v = val[index[&l.node()]][w];
        if l.is_complemented() {
            !v
        } else {
            v
        }
    };
    for &n in &cone {
        let row: Vec<u64> = match aig.node(n) {
            Node::Const => vec![0; words],
            Node::Input(_) => {
                let j = leaves.binary_search(&n).unwrap_or(0);
                (0..words)
                    .map(|w| crate::aig::variable_word(j, w as u64))
                    .collect()
            }
            Node::And(a, b) => (0..words)
                .map(|w| lit_word(&val, a, w) & lit_word(&val, b, w))
                .collect(),
        };
        val.push(row);
    }
    for w in 0..words {
        let miss = !lit_word(&val, cond, w) & valid;
        if miss != 0 {
            let m = w * 64 + miss.trailing_zeros() as usize;
            let assignment = leaves
                .iter()
                .enumerate()
                .filter_map(|(j, &n)| match aig.node(n) {
                    Node::Input(leaf) => Some((leaf, (m >> j) & 1 == 1)),
                    _ => None,
                })
                .collect();
            return Coverage::Gap(assignment);
        }
    }
    Coverage::Complete
}

/// A gap for messages: `s[1]=1, s[0]=0`, most significant bit of each net first.
pub(crate) fn gap_text(core: &Core, gap: &[(u32, bool)]) -> String {
    let mut named: Vec<(String, u32, bool)> = gap
        .iter()
        .map(|&(leaf, v)| (core.leaf_name(leaf), leaf, v))
        .collect();
    named.sort_by_key(|n| std::cmp::Reverse(n.1));
    named
        .iter()
        .map(|(n, _, v)| format!("{n}={}", u8::from(*v)))
        .collect::<Vec<_>>()
        .join(", ")
}
