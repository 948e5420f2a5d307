//! Bit selects and part selects, constant and variable. A select that may read outside the
//! declared range reads an unknown-value input on exactly the out-of-range index values.

use super::super::bits::{self, extend};
use super::super::context::EvalContext;
use super::super::{span, Elaborator, Sym, Symbol, MAX_WIDTH};
use crate::aig::Lit;
use crate::front::verilog::ast::Select;
use crate::front::verilog::pos::Pos;

/// A named operand of a select whose bits are fetched on demand.
pub(crate) struct LazyOperand {
    /// A net (its bits are its leaves, or an always block's current values), or the
    /// value of a parameter or genvar.
    src: Result<u32, Vec<Lit>>,
    /// Number of bits.
    width: usize,
    /// Declared left index.
    msb: i64,
    /// Declared right index.
    lsb: i64,
}

impl Elaborator<'_> {
    /// Offsets (0 = least significant bit) of declared index `i` for range `msb:lsb`.
    fn off_of(msb: i64, lsb: i64, i: i64) -> i64 {
        // Saturating: an index this far out stays out of any declared range (at most 65536
        // bits within the 32-bit integers).
        if msb >= lsb {
            i.saturating_sub(lsb)
        } else {
            lsb.saturating_sub(i)
        }
    }

    /// Evaluate a select of name `sym`: result bits, LSB first, unsigned.
    pub(crate) fn eval_select(
        &mut self,
        ctx: &EvalContext,
        sym: Sym,
        pos: Pos,
        sel: &Select,
    ) -> Vec<Lit> {
        let width_hint = self
            .expr_type(
                ctx,
                &crate::front::verilog::ast::Expr::Index(sym, pos, Box::new(sel.clone())),
            )
            .width;
        // A net's bits are fetched only where the select reads them: a vector driven bit
        // by bit (`assign v[k] = ...;` for every k) then reads in linear time.
        let o = match self.operand_lazy(ctx, sym, pos) {
            Some(o) => o,
            None => return vec![Lit::FALSE; width_hint],
        };
        let (msb, lsb) = (o.msb, o.lsb);
        let n = o.width as i64;
        let desc = msb >= lsb;
        let nm = self.core.name(sym);
        match sel {
            Select::Part(m, l) => {
                let (m, l) = match (self.const_int(ctx.scope, m), self.const_int(ctx.scope, l)) {
                    (Some(m), Some(l)) => (m, l),
                    _ => return vec![Lit::FALSE; width_hint],
                };
                if (m > l) != desc && m != l && n > 1 {
                    self.core.error(
                        pos,
                        format!("part-select `{nm}[{m}:{l}]` is in the opposite direction to the declaration `[{msb}:{lsb}]`"),
                        "write the bounds in the declaration's order, e.g. `[7:4]` for `[7:0]`",
                    );
                    return vec![Lit::FALSE; width_hint];
                }
                let Some(w) = span(m, l) else {
                    self.core.error(
                        pos,
                        format!("part-select `{nm}[{m}:{l}]` is wider than 65536 bits"),
                        "select at most the declared bits of the vector",
                    );
                    return vec![Lit::FALSE; width_hint];
                };
                let base = Self::off_of(msb, lsb, l).min(Self::off_of(msb, lsb, m));
                let what = format!("out-of-range part-select {nm}[{m}:{l}]");
                self.const_window(ctx, &o, base, w, pos, &what)
            }
            Select::Bit(i) => {
                let iv = self.eval_self(ctx, i);
                if let Some(k) = bits::to_i64(&iv.bits, iv.signed) {
                    let what = format!("out-of-range bit-select {nm}[{k}]");
                    return self.const_window(ctx, &o, Self::off_of(msb, lsb, k), 1, pos, &what);
                }
                if ctx.constant {
                    self.core.error(
                        pos,
                        "select index is not constant",
                        "use a constant index here (a parameter, genvar or number)",
                    );
                    return vec![Lit::FALSE];
                }
                // Offset = i - lsb (descending) or lsb - i (ascending), computed exactly.
                let off = self.offset_vec(&iv.bits, iv.signed, if desc { -lsb } else { lsb }, desc);
                let what = format!("out-of-range bit-select {nm}[...]");
                let data = self.lazy_bits(ctx, &o, 0, o.width);
                self.dyn_window(ctx, &data, &off, 1, pos, &what)
            }
            Select::Up(b, wd) | Select::Down(b, wd) => {
                let up = matches!(sel, Select::Up(..));
                let w = match self.const_int(ctx.scope, wd) {
                    Some(w) if w > 0 && w as usize <= MAX_WIDTH => w,
                    Some(_) => {
                        self.core.error(
                            wd.pos(),
                            "indexed part-select width must be a positive constant of at most 65536",
                            "give the number of bits to select, e.g. `d[s +: 8]`",
                        );
                        return vec![Lit::FALSE];
                    }
                    None => return vec![Lit::FALSE; width_hint],
                };
                // Offset of the least significant selected bit, as a function of the base b:
                // descending: up b-lsb, down b-w+1-lsb; ascending: up lsb-b-w+1, down lsb-b.
                let k = match (desc, up) {
                    (true, true) => -lsb,
                    (true, false) => -w + 1 - lsb,
                    (false, true) => lsb - w + 1,
                    (false, false) => lsb,
                };
                let bv = self.eval_self(ctx, b);
                let what = format!(
                    "out-of-range indexed part-select {nm}[...{}{w}]",
                    if up { "+:" } else { "-:" }
                );
                if let Some(bc) = bits::to_i64(&bv.bits, bv.signed) {
                    let base = if desc {
                        bc.saturating_add(k)
                    } else {
                        k.saturating_sub(bc)
                    };
                    return self.const_window(ctx, &o, base, w as usize, pos, &what);
                }
                if ctx.constant {
                    self.core.error(
                        pos,
                        "select index is not constant",
                        "use a constant index here (a parameter, genvar or number)",
                    );
                    return vec![Lit::FALSE; w as usize];
                }
                if w as usize > o.width {
                    // Each bit is a selector over the vector plus a range check: a window wider
                    // than the vector costs much and reads only unknowns beyond it.
                    self.core.error(
                        pos,
                        format!(
                            "unsupported: variable part-select of {w} bits from the {}-bit `{nm}`",
                            o.width
                        ),
                        "select at most as many bits as the vector has",
                    );
                    return vec![Lit::FALSE; w as usize];
                }
                let off = self.offset_vec(&bv.bits, bv.signed, k, desc);
                let data = self.lazy_bits(ctx, &o, 0, o.width);
                self.dyn_window(ctx, &data, &off, w as usize, pos, &what)
            }
        }
    }

    /// The operand of a select: a net without its bits, anything else as
    /// [`Elaborator::operand`] gives it.
    fn operand_lazy(&mut self, ctx: &EvalContext, sym: Sym, pos: Pos) -> Option<LazyOperand> {
        if !ctx.constant {
            if let Some(Symbol::Net(n)) = self.core.lookup(ctx.scope, sym) {
                let net = &self.core.nets[*n as usize];
                return Some(LazyOperand {
                    src: Ok(*n),
                    width: net.width as usize,
                    msb: net.msb,
                    lsb: net.lsb,
                });
            }
        }
        let o = self.operand(ctx, sym, pos)?;
        Some(LazyOperand {
            width: o.val.bits.len(),
            src: Err(o.val.bits),
            msb: o.msb,
            lsb: o.lsb,
        })
    }

    /// Bits `lo..hi` (offsets, least significant first) of operand `o`.
    fn lazy_bits(&self, ctx: &EvalContext, o: &LazyOperand, lo: usize, hi: usize) -> Vec<Lit> {
        match &o.src {
            Ok(n) => {
                let first = self.core.nets[*n as usize].first as usize;
                (lo..hi)
                    .map(|k| {
                        ctx.env
                            .and_then(|env| env.bit(*n, k))
                            .unwrap_or_else(|| self.core.aig.input_lit(first + k))
                    })
                    .collect()
            }
            Err(bits) => bits[lo..hi].to_vec(),
        }
    }

    /// Signed offset vector `i + k` (descending) or `k - i` (ascending), wide enough to be
    /// exact.
    fn offset_vec(&mut self, i: &[Lit], signed: bool, k: i64, desc: bool) -> Vec<Lit> {
        let ww = i.len() + 66;
        let iv = extend(i.to_vec(), ww, signed);
        let kv = bits::constant(k, ww);
        if desc {
            bits::add(&mut self.core.aig, &iv, &kv, Lit::FALSE)
        } else {
            bits::sub(&mut self.core.aig, &kv, &iv)
        }
    }

    /// `w` bits of operand `o` from offset `base` (constant); bits outside it are unknown.
    fn const_window(
        &mut self,
        ctx: &EvalContext,
        o: &LazyOperand,
        base: i64,
        w: usize,
        pos: Pos,
        what: &str,
    ) -> Vec<Lit> {
        // Only the bits in range are fetched: `data[k]` is bit `lo + k` of the operand.
        let width = o.width as i64;
        let lo = base.clamp(0, width);
        let hi = base.saturating_add(w as i64).clamp(lo, width);
        let data = self.lazy_bits(ctx, o, lo as usize, hi as usize);
        let base = base - lo;
        let n = data.len() as i64;
        let outside = (0..w as i64)
            .filter(|j| !(0..n).contains(&base.saturating_add(*j)))
            .count();
        let mut unk = if outside > 0 {
            if ctx.constant {
                self.core.error(
                    pos,
                    format!("{what} in a constant expression"),
                    "keep constant selects within the declared range",
                );
                vec![Lit::FALSE; outside]
            } else {
                self.core.unknown_bits(outside, pos, what, ctx.scope)
            }
        } else {
            Vec::new()
        }
        .into_iter();
        (0..w as i64)
            .map(|j| {
                let o = base.saturating_add(j);
                if (0..n).contains(&o) {
                    data[o as usize]
                } else {
                    unk.next().unwrap_or(Lit::FALSE)
                }
            })
            .collect()
    }

    /// `w` bits from the symbolic signed offset `off`; an unknown input is read exactly when
    /// a bit's offset falls outside `data`.
    fn dyn_window(
        &mut self,
        ctx: &EvalContext,
        data: &[Lit],
        off: &[Lit],
        w: usize,
        pos: Pos,
        what: &str,
    ) -> Vec<Lit> {
        let n = data.len();
        let k = (usize::BITS - (n.max(2) - 1).leading_zeros()) as usize;
        let mut out = Vec::with_capacity(w);
        for j in 0..w {
            let oj = bits::add_const(&mut self.core.aig, off, j as i64);
            let neg = *oj.last().expect("offset has bits");
            let nv = bits::constant(n as i64, oj.len());
            let below = bits::ult(&mut self.core.aig, &oj, &nv);
            let valid = self.core.aig.and(!neg, below);
            let v = bits::mux_tree(&mut self.core.aig, data, &oj[..k], Lit::FALSE);
            let r = if valid == Lit::TRUE {
                v
            } else {
                let u = self.core.unknown_bits(1, pos, what, ctx.scope)[0];
                self.core.aig.mux(valid, v, u)
            };
            out.push(r);
        }
        out
    }
}
