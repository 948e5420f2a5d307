//! Procedural writes through a variable index: `r[i] = v`, `r[b +: w] = v`, `q[b -: w] <= v`
//! (and the words of arrays, which the parser lowers to `mem[a*W +: W]`, see
//! `parse_array.rs`). Each bit of the target may receive value bit j where the base puts bit
//! j on it; the write is the address decode, one equality per distinct base value, shared by
//! the bits it selects. A base outside the vector writes nothing (IEEE 1364-2005 clause
//! 9.2.1, from memory: a write to an out-of-range address is ignored).

use super::super::bits::{self, extend};
use super::super::context::EvalContext;
use super::super::Elaborator;
use crate::aig::Lit;
use crate::front::verilog::ast::{Expr, Select};
use std::collections::BTreeMap;

/// Where a variable-index write may land: the target net and, per offset it can reach, the
/// condition under which it lands there and the value bit it gives.
pub(super) struct VariableWrite {
    /// The target net.
    pub net: u32,
    /// `(offset, hit, value)` for the offsets the write may reach, in offset order.
    pub bits: Vec<(usize, Lit, Lit)>,
}

impl Elaborator<'_> {
    /// `lhs = rhs` when `lhs` selects a name by an index or base that is not constant:
    /// `None` when it is not such a write (the caller assigns fixed targets), `Some(None)`
    /// when the target was refused (the error is reported).
    pub(super) fn variable_write(
        &mut self,
        ctx: &EvalContext,
        lhs: &Expr,
        rhs: &Expr,
    ) -> Option<Option<VariableWrite>> {
        let Expr::Index(sym, ipos, sel) = lhs else {
            return None;
        };
        let (ix, w, up) = match &**sel {
            Select::Bit(i) => (i, 1usize, true),
            Select::Up(b, w) | Select::Down(b, w) => {
                let w = self.const_int(ctx.scope, w)?;
                if w <= 0 || w as usize > super::super::MAX_WIDTH {
                    return None; // the fixed-target path reports the width
                }
                (b, w as usize, matches!(&**sel, Select::Up(..)))
            }
            Select::Part(..) => return None,
        };
        let iv = self.eval_self(ctx, ix);
        if bits::is_const(&iv.bits) {
            return None;
        }
        let Some(n) = self.target_net(ctx.scope, *sym, *ipos, true) else {
            return Some(None);
        };
        let t = self.expr_type(ctx, rhs);
        let v = self.eval(ctx, rhs, t.width.max(w), t.signed);
        let net = self.core.nets[n as usize].clone();
        let desc = net.msb >= net.lsb;
        let ww = iv.bits.len() + 66;
        let ie = extend(iv.bits, ww, iv.signed);
        let mut hits: BTreeMap<i64, Lit> = BTreeMap::new();
        let mut out = Vec::new();
        for off in 0..net.width {
            let i = net.index(off);
            let (mut any, mut val) = (Lit::FALSE, Lit::FALSE);
            for (j, &vj) in v.iter().take(w).enumerate() {
                // Value bit j lands on index b + d for base b.
                let (j, last) = (j as i64, w as i64 - 1);
                let d = match (up, desc) {
                    (true, true) => j,
                    (true, false) => last - j,
                    (false, true) => j - last,
                    (false, false) => -j,
                };
                let c = i.saturating_sub(d);
                let hit = match hits.get(&c) {
                    Some(&h) => h,
                    None => {
                        let h = bits::eq(&mut self.core.aig, &ie, &bits::constant(c, ww));
                        hits.insert(c, h);
                        h
                    }
                };
                if hit == Lit::FALSE {
                    continue;
                }
                any = self.core.aig.or(any, hit);
                let take = self.core.aig.and(hit, vj);
                val = self.core.aig.or(val, take);
            }
            if any != Lit::FALSE {
                out.push((off as usize, any, val));
            }
        }
        Some(Some(VariableWrite { net: n, bits: out }))
    }
}
