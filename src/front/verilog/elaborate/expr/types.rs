//! Self-determined bit lengths and signedness of expressions (IEEE 1364-2005 clauses
//! 5.4.1 and 5.5.1), used to size every context-determined operation.

use super::super::context::EvalContext;
use super::super::{span, Elaborator, Symbol, MAX_WIDTH};
use crate::front::verilog::ast::{Expr, Select, UnOp};

/// Bit length and signedness of an expression.
#[derive(Copy, Clone, Debug, PartialEq, Eq)]
pub struct ExprType {
    /// Bit length.
    pub width: usize,
    /// Signed?
    pub signed: bool,
}

impl Elaborator<'_> {
    /// The self-determined type of `e` (no diagnostics; evaluation reports them).
    pub(crate) fn expr_type(&mut self, ctx: &EvalContext, e: &Expr) -> ExprType {
        self.core.quiet += 1;
        let t = self.expr_type_inner(ctx, e);
        self.core.quiet -= 1;
        t
    }

    fn expr_type_inner(&mut self, ctx: &EvalContext, e: &Expr) -> ExprType {
        match e {
            Expr::Ident(s, _) => match self.core.lookup(ctx.scope, *s) {
                Some(Symbol::Net(n)) => {
                    let net = &self.core.nets[*n as usize];
                    ExprType {
                        width: net.width as usize,
                        signed: net.signed,
                    }
                }
                Some(Symbol::Param(p)) => ExprType {
                    width: p.0.bits.len(),
                    signed: p.0.signed,
                },
                Some(Symbol::Genvar(_)) => ExprType {
                    width: 32,
                    signed: true,
                },
                Some(Symbol::Func(_)) => ExprType {
                    width: 1,
                    signed: false,
                },
                None => ExprType {
                    width: 1,
                    signed: false,
                },
            },
            Expr::Num(n, _) => ExprType {
                width: n.bits.len(),
                signed: n.signed,
            },
            Expr::Index(_, _, sel) => {
                let w = match &**sel {
                    Select::Bit(_) => 1,
                    Select::Part(m, l) => {
                        match (self.const_int(ctx.scope, m), self.const_int(ctx.scope, l)) {
                            (Some(m), Some(l)) => span(m, l).unwrap_or(1),
                            _ => 1,
                        }
                    }
                    Select::Up(_, w) | Select::Down(_, w) => match self.const_int(ctx.scope, w) {
                        Some(w) if w > 0 && (w as usize) <= MAX_WIDTH => w as usize,
                        _ => 1,
                    },
                };
                ExprType {
                    width: w,
                    signed: false,
                }
            }
            Expr::Unary(op, _, a) => match op {
                UnOp::Plus | UnOp::Neg | UnOp::Not => self.expr_type_inner(ctx, a),
                _ => ExprType {
                    width: 1,
                    signed: false,
                },
            },
            Expr::Chain(first, rest) => {
                let op = rest[0].0;
                match op.level() {
                    // Shifts and `**`: the left operand's type (IEEE 1364-2005 Table 5-22).
                    2 | 10 => self.expr_type_inner(ctx, first),
                    3 | 4 | 8 | 9 => ExprType {
                        width: 1,
                        signed: false,
                    },
                    _ => {
                        let mut t = self.expr_type_inner(ctx, first);
                        for (_, _, e) in rest {
                            let u = self.expr_type_inner(ctx, e);
                            t = ExprType {
                                width: t.width.max(u.width),
                                signed: t.signed && u.signed,
                            };
                        }
                        t
                    }
                }
            }
            Expr::Cond(b, _) => {
                let t = self.expr_type_inner(ctx, &b[1]);
                let f = self.expr_type_inner(ctx, &b[2]);
                ExprType {
                    width: t.width.max(f.width),
                    signed: t.signed && f.signed,
                }
            }
            Expr::Concat(items, _) => {
                let w = items
                    .iter()
                    .map(|i| self.expr_type_inner(ctx, i).width)
                    .sum();
                ExprType {
                    width: w,
                    signed: false,
                }
            }
            Expr::Repl(n, items, _) => {
                let inner: usize = items
                    .iter()
                    .map(|i| self.expr_type_inner(ctx, i).width)
                    .sum();
                let n = self
                    .const_int(ctx.scope, n)
                    .unwrap_or(1)
                    .clamp(0, MAX_WIDTH as i64) as usize;
                ExprType {
                    width: (n * inner).min(MAX_WIDTH),
                    signed: false,
                }
            }
            Expr::Cast(c, _) => self.cast_type(ctx, c),
            Expr::Call(f, _, args) => {
                let name = self.core.name(*f);
                match name {
                    _ if !name.starts_with('$') => self.call_type(ctx.scope, *f),
                    "$signed" => ExprType {
                        width: self.expr_type_inner(ctx, &args[0]).width,
                        signed: true,
                    },
                    "$unsigned" => ExprType {
                        width: self.expr_type_inner(ctx, &args[0]).width,
                        signed: false,
                    },
                    _ => ExprType {
                        width: 32,
                        signed: true,
                    },
                }
            }
        }
    }
}
