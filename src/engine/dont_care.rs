//! Unknown values of the reference as don't-cares (the default reading; `--strict-unknowns`
//! turns it off). Where an `x` of the reference reaches one of its outputs and leaves that
//! output without a defined value, the candidate may do anything; the candidate's own unknowns
//! stay free inputs (it must be right for each value they take).
//!
//! "No defined value" is decided by three-valued simulation of the reference's and-inverter
//! graph: each unknown source is `x`, port bits are 0 or 1, an AND with a 0 input is 0, an AND of
//! 1s is 1, anything else is `x`, and an inverter keeps `x`. This is how an IEEE 1364 simulator
//! propagates `x` through gates (clause 7: a 0 on an `and` input decides it). It is sound:
//! where it gives 0 or 1 the output takes that value for every value of the unknowns. It can
//! be more pessimistic than exact dependence (`s ? a : a` with an `x` select is `x` here).
//!
//! The simulation is built into the shared graph as two rails per node, `one` (the node can
//! be 1) and `zero` (it can be 0); the output is defined where not both hold. A pair whose
//! reference has a don't-care region becomes (`value`, `defined ? candidate : value`), so every
//! engine decides "equal wherever the reference is defined" unchanged. Nodes outside the reach
//! of any unknown get `zero = !one` by structural hashing, so the rails cost nothing there.

use crate::aig::{Aig, Lit, Node};
use crate::design::Design;
use crate::engine::pairing::Shared;

/// A literal's rails: can it be 1, can it be 0.
#[derive(Copy, Clone)]
struct Rails {
    one: Lit,
    zero: Lit,
}

impl Rails {
    fn of(self, complemented: bool) -> Rails {
        match complemented {
            false => self,
            true => Rails {
                one: self.zero,
                zero: self.one,
            },
        }
    }
}

/// Copy the cones of `roots` from `src` into `dst` as three-valued logic: `src`'s input `k`
/// is `input_map[k]` when it is known, `x` when `unknown[k]`. Returns per root its value
/// (meaningful where defined) and the literal "the root has a defined value".
pub fn import_ternary(
    dst: &mut Aig,
    src: &Aig,
    input_map: &[Lit],
    unknown: &[bool],
    roots: &[Lit],
) -> Vec<(Lit, Lit)> {
    let cone = src.cone_mask(roots);
    let mut rails = vec![
        Rails {
            one: Lit::FALSE,
            zero: Lit::TRUE
        };
        src.len()
    ];
    for (i, node) in src.nodes().iter().enumerate() {
        if !cone[i] {
            continue;
        }
        rails[i] = match *node {
            Node::Const => Rails {
                one: Lit::FALSE,
                zero: Lit::TRUE,
            },
            Node::Input(k) if unknown[k as usize] => Rails {
                one: Lit::TRUE,
                zero: Lit::TRUE,
            },
            Node::Input(k) => Rails {
                one: input_map[k as usize],
                zero: !input_map[k as usize],
            },
            Node::And(a, b) => {
                let ra = rails[a.index()].of(a.is_complemented());
                let rb = rails[b.index()].of(b.is_complemented());
                Rails {
                    one: dst.and(ra.one, rb.one),
                    zero: dst.or(ra.zero, rb.zero),
                }
            }
        };
    }
    roots
        .iter()
        .map(|r| {
            let x = rails[r.index()].of(r.is_complemented());
            (x.one, !dst.and(x.one, x.zero))
        })
        .collect()
}

/// Make the reference's unknown values don't-cares in `shared`: each pair whose reference
/// output may be `x` compares only where it is defined. Sets `shared.dont_care` and returns
/// how many pairs have a don't-care region.
pub fn apply(shared: &mut Shared, r: &Design) -> usize {
    let unknown: Vec<bool> = r.inputs.iter().map(|b| b.is_unknown()).collect();
    shared.dont_care = vec![false; shared.pairs.len()];
    if !unknown.iter().any(|&u| u) {
        return 0;
    }
    let map: Vec<Lit> = shared
        .ref_input
        .iter()
        .map(|&k| match k {
            usize::MAX => Lit::FALSE,
            k => shared.aig.input_lit(k),
        })
        .collect();
    let roots: Vec<Lit> = shared
        .pairs
        .iter()
        .map(|&(ri, _)| r.outputs[ri].lit)
        .collect();
    let rails = import_ternary(&mut shared.aig, &r.aig, &map, &unknown, &roots);
    let mut count = 0;
    for (p, &(value, defined)) in rails.iter().enumerate() {
        if defined == Lit::TRUE {
            continue;
        }
        count += 1;
        shared.dont_care[p] = true;
        shared.ref_lits[p] = value;
        shared.cand_lits[p] = shared.aig.mux(defined, shared.cand_lits[p], value);
    }
    shared.aig.debug_check();
    count
}

/// Three-valued evaluation of `roots` of `d` with its known inputs at `values` and its
/// unknown sources at `x`: `Some(v)` where defined, `None` where `x`.
pub fn eval_ternary(d: &Design, values: &[bool], roots: &[Lit]) -> Vec<Option<bool>> {
    let aig = &d.aig;
    let cone = aig.cone_mask(roots);
    // Per node: (can be 1, can be 0).
    let mut v = vec![(false, true); aig.len()];
    for (i, node) in aig.nodes().iter().enumerate() {
        if !cone[i] {
            continue;
        }
        v[i] = match *node {
            Node::Const => (false, true),
            Node::Input(k) if d.inputs[k as usize].is_unknown() => (true, true),
            Node::Input(k) => (values[k as usize], !values[k as usize]),
            Node::And(a, b) => {
                let flip =
                    |(one, zero): (bool, bool), c: bool| if c { (zero, one) } else { (one, zero) };
                let x = flip(v[a.index()], a.is_complemented());
                let y = flip(v[b.index()], b.is_complemented());
                (x.0 && y.0, x.1 || y.1)
            }
        };
    }
    roots
        .iter()
        .map(|r| {
            let (one, zero) = v[r.index()];
            let (one, zero) = if r.is_complemented() {
                (zero, one)
            } else {
                (one, zero)
            };
            (one != zero).then_some(one)
        })
        .collect()
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::engine::{pair, PairBy};
    use std::sync::Arc;

    fn verilog(src: &str) -> Design {
        crate::front::verilog::read_verilog(&[(Arc::from("t.v"), src.to_string())], None)
            .expect("reads")
    }

    #[test]
    fn a_case_reading_x_for_unused_values_is_a_dont_care_only_there() {
        let spec = verilog(
            "module m(input [1:0] s, input a, b, c, output reg y);\n  always @* case (s)\n    2'd0: y = a;\n    2'd1: y = b;\n    2'd2: y = c;\n    default: y = 1'bx;\n  endcase\nendmodule\n",
        );
        let mut sh = pair(&spec, &spec, PairBy::Name, false).expect("pairs");
        assert_eq!(apply(&mut sh, &spec), 1);
        // Values: s, a, b, c (s[0], s[1] first).
        let roots = [spec.outputs[0].lit];
        let val = |s: u32, a: bool| {
            let mut ins = vec![s & 1 != 0, s & 2 != 0, a, false, false];
            ins.resize(spec.inputs.len(), false);
            eval_ternary(&spec, &ins, &roots)[0]
        };
        assert_eq!(val(0, true), Some(true));
        assert_eq!(val(0, false), Some(false));
        assert_eq!(val(3, true), None);
        // x & 0 is 0: defined although it reads an unknown.
        let masked =
            verilog("module m(input a, output y);\n  assign y = 1'bx & 1'b0 | a;\nendmodule\n");
        let mut sh = pair(&masked, &masked, PairBy::Name, false).expect("pairs");
        assert_eq!(apply(&mut sh, &masked), 0);
    }
}
