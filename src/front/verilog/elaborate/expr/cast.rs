//! Casts (IEEE 1800-2017 clause 6.24, from memory): `W'(e)` gives `e` the width `W` as an
//! assignment to a `W`-bit variable would (evaluated at the larger of the two widths, then
//! truncated or extended), keeping its signedness; `signed'(e)` and `unsigned'(e)` change only
//! the signedness, like `$signed`/`$unsigned`; a cast to a type `T'(e)` does both (the parser
//! turns the type into its width and signedness).

use super::super::bits::extend;
use super::super::context::EvalContext;
use super::super::{Elaborator, MAX_WIDTH};
use super::types::ExprType;
use crate::aig::Lit;
use crate::front::verilog::ast::Cast;

impl Elaborator<'_> {
    /// The width a cast gives, when it gives one (a constant from 1 to the largest width;
    /// anything else is reported, and the operand's width is kept).
    fn cast_width(&mut self, ctx: &EvalContext, c: &Cast) -> Option<usize> {
        let w = c.width.as_ref()?;
        let n = self.const_int(ctx.scope, w)?;
        if n < 1 || n > MAX_WIDTH as i64 {
            self.core.error(
                w.pos(),
                format!("cast to a width of {n} bits"),
                "a cast's width is a constant from 1 to 65536",
            );
            return None;
        }
        Some(n as usize)
    }

    /// The self-determined type of a cast.
    pub(crate) fn cast_type(&mut self, ctx: &EvalContext, c: &Cast) -> ExprType {
        let inner = self.expr_type(ctx, &c.expr);
        ExprType {
            width: self.cast_width(ctx, c).unwrap_or(inner.width),
            signed: c.signed.unwrap_or(inner.signed),
        }
    }

    /// The value of a cast at the context's `width` and signedness.
    pub(crate) fn eval_cast(
        &mut self,
        ctx: &EvalContext,
        c: &Cast,
        width: usize,
        signed: bool,
    ) -> Vec<Lit> {
        let inner = self.expr_type(ctx, &c.expr);
        let bits = match self.cast_width(ctx, c) {
            Some(n) => {
                let mut v = self.eval(ctx, &c.expr, n.max(inner.width), inner.signed);
                v.truncate(n);
                v
            }
            None => self.eval(ctx, &c.expr, inner.width, inner.signed),
        };
        extend(bits, width, signed)
    }
}
