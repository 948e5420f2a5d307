//! Case equality `===` / `!==` (IEEE 1364-2005 clause 5.1.8): read as `==` / `!=` where both
//! operands are free of `x` and `z`, since the two agree on 0/1 values. An operand that may
//! carry an unknown value (an `x`/`z` literal, an out-of-range select, through any nets) is
//! refused with `unsupported:` at the operator: there `===` compares the unknown itself, which
//! our model of an unknown as a free 0/1 value cannot express.

use super::super::super::pos::Pos;
use super::super::{Core, Expressions, UNKNOWN_BIT};
use crate::aig::{Lit, Node};

/// Per elaboration node while looking for unknowns: not seen, being walked, free, reads one.
const UNSEEN: u32 = u32::MAX;
const WALKING: u32 = u32::MAX - 1;
const FREE: u32 = u32::MAX - 2;

impl Expressions {
    /// Record the operand bits of a `===`/`!==` at `pos`, to be checked once every net has
    /// its driver (unless `core` is inside a quiet width computation).
    pub(in super::super) fn note_case_eq(
        &mut self,
        core: &Core,
        pos: Pos,
        op: &'static str,
        a: &[Lit],
        b: &[Lit],
    ) {
        if core.quiet == 0 {
            self.case_eq
                .push((pos, op, a.iter().chain(b).copied().collect()));
        }
    }

    /// Every recorded `===`/`!==` whose operands may read an unknown value is an error.
    pub(in super::super) fn check_case_eq(&mut self, core: &mut Core) {
        if self.case_eq.is_empty() {
            return;
        }
        // The unknown each node reads (its index), or FREE; shared by all sites.
        let mut reads = vec![UNSEEN; core.aig.len()];
        let sites = std::mem::take(&mut self.case_eq);
        for (pos, op, lits) in &sites {
            let found = lits
                .iter()
                .find_map(|l| unknown_read(core, l.node(), &mut reads));
            if let Some(u) = found {
                let what = core.unknowns[u as usize].what.clone();
                core.error(
                    *pos,
                    format!("unsupported: `{op}` on a value that may be x or z (it reads {what})"),
                    "equicone reads `===` as `==` only where both sides are free of x and z; compare known values with `==`, or remove the x",
                );
            }
        }
    }
}

/// The unknown that node `root` reads through gates and net drivers, if any (iterative;
/// a loop reads nothing here, the resolver reports it).
fn unknown_read(core: &Core, root: u32, reads: &mut [u32]) -> Option<u32> {
    let mut stack = vec![root];
    while let Some(&n) = stack.last() {
        let ni = n as usize;
        if reads[ni] != UNSEEN && reads[ni] != WALKING {
            stack.pop();
            continue;
        }
        let children: [Option<u32>; 2] = match core.aig.node(n) {
            Node::Const => [None, None],
            Node::And(a, b) => [Some(a.node()), Some(b.node())],
            Node::Input(k) => {
                let o = core.owner[k as usize];
                if o & UNKNOWN_BIT != 0 {
                    reads[ni] = o & !UNKNOWN_BIT;
                    stack.pop();
                    continue;
                }
                [core.drivers[k as usize].map(|d| d.lit.node()), None]
            }
        };
        if reads[ni] == UNSEEN {
            reads[ni] = WALKING;
            let mut pushed = false;
            for c in children.into_iter().flatten() {
                if reads[c as usize] == UNSEEN {
                    stack.push(c);
                    pushed = true;
                }
            }
            if pushed {
                continue;
            }
        }
        // Every child is done (or on the walk: a loop, read as free).
        let r = children
            .into_iter()
            .flatten()
            .map(|c| reads[c as usize])
            .find(|&v| v < FREE)
            .unwrap_or(FREE);
        reads[ni] = r;
        stack.pop();
    }
    Some(reads[root as usize]).filter(|&v| v < FREE)
}
