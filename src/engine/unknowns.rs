//! Where the designs read unknown values (`x`/`z` literals, out-of-range selects): one line per
//! source for the report, with the advice that goes with it.

use crate::design::{Design, InputKind};
use std::collections::BTreeSet;

/// `side: file:line:col: what`, once per source, in a stable order.
pub fn sources(r: &Design, c: &Design) -> Vec<String> {
    let mut out = BTreeSet::new();
    for (side, d) in [("reference", r), ("candidate", c)] {
        for b in &d.inputs {
            if let InputKind::Unknown { pos, what } = &b.kind {
                out.insert(format!("{side}: {pos}: {what}"));
            }
        }
    }
    out.into_iter().collect()
}

/// What an unknown means for the verdict, printed once when there are any.
pub const ADVICE: &str = "an unknown of the candidate (and, with --strict-unknowns, of the reference) is a free input of its design: the other design must match it for every value it can take; if the cases that read it cannot occur, exclude them with --assume EXPR";
