//! Expression evaluation to AIG literals with the sizing rules of IEEE 1364-2005 clause 5.4
//! (context-determined operands extended to the expression's width before the operation)
//! and the signedness rules of clause 5.5 (signed only when every operand is signed).

use super::super::bits::{self, extend};
use super::super::context::EvalContext;
use super::super::{Elaborator, Sym, Symbol, Value, MAX_DIV_WIDTH, MAX_MUL_WIDTH, MAX_WIDTH};
use super::types::ExprType;
use crate::aig::{Aig, Lit};
use crate::front::verilog::ast::{BinOp, Expr, UnOp};
use crate::front::verilog::lexer::{B0, B1};
use crate::front::verilog::pos::Pos;

/// A named operand: its value and declared range.
pub struct Operand {
    /// Value bits.
    pub val: Value,
    /// Declared left index.
    pub msb: i64,
    /// Declared right index.
    pub lsb: i64,
}

impl Elaborator<'_> {
    /// Evaluate a constant expression; reports and returns `None` when it is not constant.
    pub(crate) fn const_val(&mut self, scope: u32, e: &Expr) -> Option<Value> {
        let ctx = EvalContext::constant(scope);
        let t = self.expr_type(&ctx, e);
        let before = self.core.errors.len();
        let bits = self.eval(&ctx, e, t.width, t.signed);
        if self.core.errors.len() > before {
            return None;
        }
        if !bits::is_const(&bits) {
            self.core.error(
                e.pos(),
                "expression is not constant (x/z bits or non-constant operands)",
                "use only numbers, parameters, genvars and `$clog2` here",
            );
            return None;
        }
        Some(Value {
            bits,
            signed: t.signed,
        })
    }

    /// Evaluate a constant integer expression.
    pub(crate) fn const_int(&mut self, scope: u32, e: &Expr) -> Option<i64> {
        let v = self.const_val(scope, e)?;
        let r = bits::to_i64(&v.bits, v.signed);
        if r.is_none() {
            self.core.error(
                e.pos(),
                "constant does not fit in 64 bits",
                "use a smaller value (constants that index, size or count must fit in 64 bits)",
            );
        }
        r
    }

    /// Evaluate `e` self-determined.
    pub(crate) fn eval_self(&mut self, ctx: &EvalContext, e: &Expr) -> Value {
        let t = self.expr_type(ctx, e);
        Value {
            bits: self.eval(ctx, e, t.width, t.signed),
            signed: t.signed,
        }
    }

    /// Evaluate `e` as a condition: true when any bit is 1.
    pub(crate) fn eval_bool(&mut self, ctx: &EvalContext, e: &Expr) -> Lit {
        let v = self.eval_self(ctx, e);
        self.core.aig.or_all(&v.bits)
    }

    /// Value and range of a name.
    pub(crate) fn operand(&mut self, ctx: &EvalContext, sym: Sym, pos: Pos) -> Option<Operand> {
        match self.core.lookup(ctx.scope, sym).cloned() {
            Some(Symbol::Net(n)) => {
                if ctx.constant {
                    let nm = self.core.name(sym);
                    self.core.error(
                        pos,
                        format!("`{nm}` is not a constant (only parameters and genvars may appear here)"),
                        "use a `parameter` or `localparam` here, or a literal number",
                    );
                    return None;
                }
                let net = &self.core.nets[n as usize];
                let (msb, lsb, signed) = (net.msb, net.lsb, net.signed);
                let mut b = self.core.net_bits(n);
                if let Some(env) = ctx.env {
                    env.overlay(n, &mut b);
                }
                Some(Operand {
                    val: Value { bits: b, signed },
                    msb,
                    lsb,
                })
            }
            Some(Symbol::Param(p)) => {
                let (val, msb, lsb) = *p;
                Some(Operand { val, msb, lsb })
            }
            Some(Symbol::Genvar(Some(v))) => Some(Operand {
                val: *v,
                msb: 31,
                lsb: 0,
            }),
            Some(Symbol::Func(_)) => {
                let nm = self.core.name(sym);
                self.core.error(
                    pos,
                    format!("function `{nm}` is used without its arguments"),
                    "call it with its arguments, e.g. `f(a, b)`",
                );
                None
            }
            Some(Symbol::Genvar(None)) => {
                let nm = self.core.name(sym);
                self.core.error(
                    pos,
                    format!("genvar `{nm}` used outside its generate loop"),
                    "use a genvar only inside the generate `for` loop that it counts",
                );
                None
            }
            None => {
                let nm = self.core.name(sym);
                self.core.error_undeclared(pos, nm);
                None
            }
        }
    }

    /// Evaluate `e` in a context of width `width` and signedness `signed` (`width` at least
    /// its own width).
    pub(crate) fn eval(
        &mut self,
        ctx: &EvalContext,
        e: &Expr,
        width: usize,
        signed: bool,
    ) -> Vec<Lit> {
        let width = width.min(MAX_WIDTH);
        let v = self.eval_inner(ctx, e, width, signed);
        debug_assert!(
            v.len() == width || self.core.quiet > 0 || !self.core.errors.is_empty(),
            "width {} != {width}",
            v.len()
        );
        extend(v, width, signed)
    }

    fn literal(
        &mut self,
        ctx: &EvalContext,
        n: &crate::front::verilog::lexer::NumLit,
        pos: Pos,
    ) -> Vec<Lit> {
        let mut out = Vec::with_capacity(n.bits.len());
        let mut unknown = 0;
        for &b in &n.bits {
            out.push(match b {
                B0 => Lit::FALSE,
                B1 => Lit::TRUE,
                _ => {
                    unknown += 1;
                    Lit::FALSE
                }
            });
        }
        if unknown > 0 {
            if ctx.constant {
                self.core.error(
                    pos,
                    format!("x/z bits in a constant expression (`{}`)", n.text),
                    "use 0/1 digits in constants; `x` and `z` are allowed only in logic",
                );
                return out;
            }
            let what = format!("x/z literal {}", n.text);
            let u = self.core.unknown_bits(unknown, pos, &what, ctx.scope);
            let mut k = 0;
            for (i, &b) in n.bits.iter().enumerate() {
                if b != B0 && b != B1 {
                    out[i] = u[k];
                    k += 1;
                }
            }
        }
        out
    }

    fn eval_inner(
        &mut self,
        ctx: &EvalContext,
        expr: &Expr,
        width: usize,
        signed: bool,
    ) -> Vec<Lit> {
        match expr {
            Expr::Ident(sym, pos) => match self.operand(ctx, *sym, *pos) {
                Some(o) => extend(o.val.bits, width, signed),
                None => vec![Lit::FALSE; width],
            },
            Expr::Num(n, _) if matches!(&*n.text, "'0" | "'1") => {
                vec![Lit::constant(&*n.text == "'1"); width]
            }
            Expr::Num(n, pos) => {
                let v = self.literal(ctx, n, *pos);
                extend(v, width, signed)
            }
            Expr::Index(sym, pos, sel) => {
                let v = self.eval_select(ctx, *sym, *pos, sel);
                extend(v, width, false)
            }
            Expr::Unary(op, _, a) => match op {
                UnOp::Plus => self.eval(ctx, a, width, signed),
                UnOp::Neg => {
                    let v = self.eval(ctx, a, width, signed);
                    bits::neg(&mut self.core.aig, &v)
                }
                UnOp::Not => bits::not(&self.eval(ctx, a, width, signed)),
                _ => {
                    let v = self.eval_self(ctx, a);
                    let g = &mut self.core.aig;
                    let r = match op {
                        UnOp::LogNot => !g.or_all(&v.bits),
                        UnOp::RedAnd => g.and_all(&v.bits),
                        UnOp::RedNand => !g.and_all(&v.bits),
                        UnOp::RedOr => g.or_all(&v.bits),
                        UnOp::RedNor => !g.or_all(&v.bits),
                        UnOp::RedXor => g.xor_all(&v.bits),
                        _ => !g.xor_all(&v.bits),
                    };
                    extend(vec![r], width, false)
                }
            },
            Expr::Chain(first, rest) => self.eval_chain(ctx, first, rest, width, signed),
            Expr::Cond(b, _) => {
                let c = self.eval_bool(ctx, &b[0]);
                if c == Lit::TRUE {
                    return self.eval(ctx, &b[1], width, signed);
                }
                if c == Lit::FALSE {
                    return self.eval(ctx, &b[2], width, signed);
                }
                let t = self.eval(ctx, &b[1], width, signed);
                let f = self.eval(ctx, &b[2], width, signed);
                t.iter()
                    .zip(&f)
                    .map(|(&x, &y)| self.core.aig.mux(c, x, y))
                    .collect()
            }
            Expr::Concat(items, _) => {
                let v = self.concat(ctx, items);
                extend(v, width, false)
            }
            Expr::Repl(n, items, pos) => {
                let count = match self.const_int(ctx.scope, n) {
                    Some(c) if c >= 0 => c as usize,
                    Some(_) => {
                        self.core.error(
                            *pos,
                            "negative replication count",
                            "give the replication a count of 0 or more, e.g. `{4{a}}`",
                        );
                        0
                    }
                    None => 0,
                };
                let inner = self.concat(ctx, items);
                if count.saturating_mul(inner.len()) > MAX_WIDTH {
                    self.core.error(
                        *pos,
                        "replication wider than 65536 bits",
                        "equicone reads values of at most 65536 bits; replicate fewer times",
                    );
                    return vec![Lit::FALSE; width];
                }
                let mut v = Vec::with_capacity(count * inner.len());
                for _ in 0..count {
                    v.extend_from_slice(&inner);
                }
                extend(v, width, false)
            }
            Expr::Cast(c, _) => self.eval_cast(ctx, c, width, signed),
            Expr::Call(f, pos, args) => {
                let name = self.core.name(*f);
                match name {
                    _ if !name.starts_with('$') => match self.call_function(ctx, *f, *pos, args) {
                        Some(v) => extend(v.bits, width, signed),
                        None => vec![Lit::FALSE; width],
                    },
                    "$signed" | "$unsigned" => {
                        let v = self.eval_self(ctx, &args[0]);
                        extend(v.bits, width, signed)
                    }
                    "$bits" => {
                        // IEEE 1800-2017 clause 20.6.2 (from memory): the argument's
                        // self-determined width, a constant; the argument is not evaluated.
                        if let Expr::Ident(n, p) = &args[0] {
                            if self.core.lookup(ctx.scope, *n).is_none() {
                                let nm = self.core.name(*n);
                                self.core.error(
                                    *p,
                                    format!("undeclared name `{nm}` in `$bits`"),
                                    "declare it before this use, or name a type declared with `typedef`",
                                );
                            }
                        }
                        let t = self.expr_type(ctx, &args[0]);
                        extend(bits::constant(t.width as i64, 32), width, signed)
                    }
                    _ => {
                        // $clog2: constant argument only.
                        let r = match self.const_val(ctx.scope, &args[0]) {
                            Some(v) => clog2(&v.bits),
                            None => 0,
                        };
                        let _ = pos;
                        extend(bits::constant(r, 32), width, signed)
                    }
                }
            }
        }
    }

    /// Concatenation: items self-determined, the first item most significant.
    fn concat(&mut self, ctx: &EvalContext, items: &[Expr]) -> Vec<Lit> {
        let mut v = Vec::new();
        for it in items.iter().rev() {
            let b = self.eval_self(ctx, it);
            v.extend_from_slice(&b.bits);
            if v.len() > MAX_WIDTH {
                self.core.error(
                    it.pos(),
                    "concatenation wider than 65536 bits",
                    "equicone reads values of at most 65536 bits; split the concatenation",
                );
                v.truncate(MAX_WIDTH);
                break;
            }
        }
        v
    }

    fn eval_chain(
        &mut self,
        ctx: &EvalContext,
        first: &Expr,
        rest: &[(BinOp, Pos, Expr)],
        width: usize,
        signed: bool,
    ) -> Vec<Lit> {
        let level = rest[0].0.level();
        match level {
            10 => {
                // `**`: the base takes the context, the exponent is self-determined.
                let mut acc = self.eval(ctx, first, width, signed);
                for (_, pos, e) in rest {
                    acc = self.power(ctx, *pos, &acc, e, signed);
                }
                acc
            }
            2 => {
                // Shifts: the left operand takes the context; amounts are self-determined
                // and unsigned.
                let mut acc = self.eval(ctx, first, width, signed);
                for (op, _, e) in rest {
                    let amt = self.eval_self(ctx, e).bits;
                    let (left, fill) = match op {
                        BinOp::Shl | BinOp::AShl => (true, Lit::FALSE),
                        BinOp::Shr => (false, Lit::FALSE),
                        _ => (
                            false,
                            if signed {
                                *acc.last().unwrap_or(&Lit::FALSE)
                            } else {
                                Lit::FALSE
                            },
                        ),
                    };
                    acc = bits::shift(&mut self.core.aig, &acc, &amt, left, fill);
                }
                acc
            }
            3 | 4 => {
                // Relations: operands sized to each other; result 1 bit, unsigned.
                let mut r = {
                    let (op, op_pos, e) = &rest[0];
                    let ta = self.expr_type(ctx, first);
                    let tb = self.expr_type(ctx, e);
                    let t = ExprType {
                        width: ta.width.max(tb.width),
                        signed: ta.signed && tb.signed,
                    };
                    let a = self.eval(ctx, first, t.width, t.signed);
                    let b = self.eval(ctx, e, t.width, t.signed);
                    if matches!(op, BinOp::CaseEq | BinOp::CaseNe) {
                        self.expressions
                            .note_case_eq(&self.core, *op_pos, op.text(), &a, &b);
                    }
                    self.compare(*op, &a, &b, t.signed)
                };
                for (op, op_pos, e) in &rest[1..] {
                    let tb = self.expr_type(ctx, e);
                    let cw = tb.width.max(1);
                    let a = extend(vec![r], cw, false);
                    let b = self.eval(ctx, e, cw, false);
                    if matches!(op, BinOp::CaseEq | BinOp::CaseNe) {
                        self.expressions
                            .note_case_eq(&self.core, *op_pos, op.text(), &a, &b);
                    }
                    r = self.compare(*op, &a, &b, false);
                }
                extend(vec![r], width, false)
            }
            8 | 9 => {
                let mut acc = self.eval_bool(ctx, first);
                for (op, _, e) in rest {
                    let b = self.eval_bool(ctx, e);
                    acc = if *op == BinOp::LogAnd {
                        self.core.aig.and(acc, b)
                    } else {
                        self.core.aig.or(acc, b)
                    };
                }
                extend(vec![acc], width, false)
            }
            _ => {
                let mut acc = self.eval(ctx, first, width, signed);
                for (op, pos, e) in rest {
                    let b = self.eval(ctx, e, width, signed);
                    if *op == BinOp::Mul && acc.len() > MAX_MUL_WIDTH {
                        // An array multiplier of w bits has about w * w / 2 gates.
                        self.core.error(
                            *pos,
                            format!(
                                "unsupported: multiplication {} bits wide (at most {} bits)",
                                acc.len(),
                                MAX_MUL_WIDTH
                            ),
                            "narrow the operands or the assignment target",
                        );
                        acc = vec![Lit::FALSE; acc.len()];
                        continue;
                    }
                    let g = &mut self.core.aig;
                    acc = match op {
                        BinOp::Add => bits::add(g, &acc, &b, Lit::FALSE),
                        BinOp::Sub => bits::sub(g, &acc, &b),
                        BinOp::Mul => bits::mul(g, &acc, &b),
                        BinOp::And => bits::zip(g, &acc, &b, Aig::and),
                        BinOp::Or => bits::zip(g, &acc, &b, Aig::or),
                        BinOp::Xor => bits::zip(g, &acc, &b, Aig::xor),
                        BinOp::Xnor => bits::zip(g, &acc, &b, Aig::xnor),
                        _ => self.divide(ctx, *op, *pos, &acc, &b, signed),
                    };
                }
                acc
            }
        }
    }

    fn compare(&mut self, op: BinOp, a: &[Lit], b: &[Lit], signed: bool) -> Lit {
        let g = &mut self.core.aig;
        let lt = |g: &mut Aig, x: &[Lit], y: &[Lit]| {
            if signed {
                bits::slt(g, x, y)
            } else {
                bits::ult(g, x, y)
            }
        };
        match op {
            BinOp::Eq | BinOp::CaseEq => bits::eq(g, a, b),
            BinOp::Ne | BinOp::CaseNe => !bits::eq(g, a, b),
            BinOp::Lt => lt(g, a, b),
            BinOp::Gt => lt(g, b, a),
            BinOp::Le => !lt(g, b, a),
            _ => !lt(g, a, b),
        }
    }

    /// `/` and `%` (IEEE 1364-2005 clause 5.1.5): constants folded, anything else through
    /// the array divider of `divide.rs` up to [`MAX_DIV_WIDTH`] bits; a divisor of
    /// zero gives an unknown value.
    fn divide(
        &mut self,
        ctx: &EvalContext,
        op: BinOp,
        pos: Pos,
        a: &[Lit],
        b: &[Lit],
        signed: bool,
    ) -> Vec<Lit> {
        let width = a.len();
        if let (Some(x), Some(y)) = (bits::to_i64(a, signed), bits::to_i64(b, signed)) {
            if width <= 63 || signed {
                if y == 0 {
                    return self
                        .core
                        .unknown_bits(width, pos, "division by zero", ctx.scope);
                }
                let r = if op == BinOp::Div {
                    x.wrapping_div(y)
                } else {
                    x.wrapping_rem(y)
                };
                return bits::constant(r, width);
            }
        }
        if b.iter().all(|&l| l == Lit::FALSE) {
            return self
                .core
                .unknown_bits(width, pos, "division by zero", ctx.scope);
        }
        if width > MAX_DIV_WIDTH {
            self.core.error(
                pos,
                format!(
                    "unsupported: `{}` {width} bits wide (at most {} bits)",
                    op.text(),
                    MAX_DIV_WIDTH
                ),
                "narrow the operands or the assignment target",
            );
            return vec![Lit::FALSE; width];
        }
        let r = super::divide::divmod(&mut self.core.aig, a, b, signed, op == BinOp::Mod);
        if bits::is_const(b) {
            return r;
        }
        // A divisor that can be zero: x there (clause 5.1.5), an unknown input.
        let zero = !self.core.aig.or_all(b);
        let u = self
            .core
            .unknown_bits(width, pos, "division by zero", ctx.scope);
        r.iter()
            .zip(&u)
            .map(|(&v, &x)| self.core.aig.mux(zero, x, v))
            .collect()
    }

    /// `base ** exponent` (IEEE 1364-2005 clause 5.1.5): the exponent must be constant; a negative
    /// one follows the clause's table (1 for a base of 1, +-1 for -1, x for 0, else 0) and
    /// then needs a constant base.
    fn power(
        &mut self,
        ctx: &EvalContext,
        pos: Pos,
        base: &[Lit],
        exponent: &Expr,
        signed: bool,
    ) -> Vec<Lit> {
        let width = base.len();
        let exp_value = self.eval_self(ctx, exponent);
        let Some(n) = bits::to_i64(&exp_value.bits, exp_value.signed) else {
            self.core.error(
                pos,
                "unsupported: `**` with an exponent that is not constant",
                "give the exponent as a constant or parameter, or write the product out",
            );
            return vec![Lit::FALSE; width];
        };
        if n >= 0 {
            if width > MAX_MUL_WIDTH {
                self.core.error(
                    pos,
                    format!(
                        "unsupported: `**` {width} bits wide (at most {} bits)",
                        MAX_MUL_WIDTH
                    ),
                    "narrow the operands or the assignment target",
                );
                return vec![Lit::FALSE; width];
            }
            return super::divide::pow_const(&mut self.core.aig, base, n as u64);
        }
        match bits::to_i64(base, signed) {
            Some(0) => self
                .core
                .unknown_bits(width, pos, "zero to a negative power", ctx.scope),
            Some(1) => bits::constant(1, width),
            Some(-1) if signed => bits::constant(if n % 2 == 0 { 1 } else { -1 }, width),
            Some(_) => bits::constant(0, width),
            None => {
                self.core.error(
                    pos,
                    "unsupported: `**` with a negative exponent and a base that is not constant",
                    "give the base as a constant, or write the result out",
                );
                vec![Lit::FALSE; width]
            }
        }
    }
}

/// `$clog2` of constant bits: the number of bits needed to address that many items.
fn clog2(v: &[Lit]) -> i64 {
    let hi = v.iter().rposition(|&l| l == Lit::TRUE);
    match hi {
        None => 0,
        Some(h) => {
            let pow2 = v[..h].iter().all(|&l| l == Lit::FALSE);
            if pow2 {
                h as i64
            } else {
                h as i64 + 1
            }
        }
    }
}
