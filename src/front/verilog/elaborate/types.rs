//! Self-determined bit lengths and signedness of expressions (IEEE 1364-2005 clauses
//! 5.4.1 and 5.5.1), used to size every context-determined operation.

use super::super::ast::{Expr, Select, UnOp};
use super::expr::Cx;
use super::{Elab, Symbol};

/// Bit length and signedness of an expression.
#[derive(Copy, Clone, Debug, PartialEq, Eq)]
pub struct Ty {
    /// Bit length.
    pub w: usize,
    /// Signed?
    pub s: bool,
}

impl Elab<'_> {
    /// The self-determined type of `e` (no diagnostics; evaluation reports them).
    pub(super) fn ty(&mut self, cx: &Cx, e: &Expr) -> Ty {
        self.quiet += 1;
        let t = self.ty_inner(cx, e);
        self.quiet -= 1;
        t
    }

    fn ty_inner(&mut self, cx: &Cx, e: &Expr) -> Ty {
        match e {
            Expr::Ident(s, _) => match self.lookup(cx.sc, *s) {
                Some(Symbol::Net(n)) => {
                    let net = &self.nets[*n as usize];
                    Ty {
                        w: net.width as usize,
                        s: net.signed,
                    }
                }
                Some(Symbol::Param(p)) => Ty {
                    w: p.0.bits.len(),
                    s: p.0.signed,
                },
                Some(Symbol::Genvar(_)) => Ty { w: 32, s: true },
                None => Ty { w: 1, s: false },
            },
            Expr::Num(n, _) => Ty {
                w: n.bits.len(),
                s: n.signed,
            },
            Expr::Index(_, _, sel) => {
                let w = match &**sel {
                    Select::Bit(_) => 1,
                    Select::Part(m, l) => {
                        match (self.const_int(cx.sc, m), self.const_int(cx.sc, l)) {
                            (Some(m), Some(l)) => super::span(m, l).unwrap_or(1),
                            _ => 1,
                        }
                    }
                    Select::Up(_, w) | Select::Down(_, w) => match self.const_int(cx.sc, w) {
                        Some(w) if w > 0 && (w as usize) <= super::MAX_WIDTH => w as usize,
                        _ => 1,
                    },
                };
                Ty { w, s: false }
            }
            Expr::Unary(op, _, a) => match op {
                UnOp::Plus | UnOp::Neg | UnOp::Not => self.ty_inner(cx, a),
                _ => Ty { w: 1, s: false },
            },
            Expr::Chain(first, rest) => {
                let op = rest[0].0;
                match op.level() {
                    2 => self.ty_inner(cx, first),
                    3 | 4 | 8 | 9 => Ty { w: 1, s: false },
                    _ => {
                        let mut t = self.ty_inner(cx, first);
                        for (_, _, e) in rest {
                            let u = self.ty_inner(cx, e);
                            t = Ty {
                                w: t.w.max(u.w),
                                s: t.s && u.s,
                            };
                        }
                        t
                    }
                }
            }
            Expr::Cond(b, _) => {
                let t = self.ty_inner(cx, &b[1]);
                let f = self.ty_inner(cx, &b[2]);
                Ty {
                    w: t.w.max(f.w),
                    s: t.s && f.s,
                }
            }
            Expr::Concat(items, _) => {
                let w = items.iter().map(|i| self.ty_inner(cx, i).w).sum();
                Ty { w, s: false }
            }
            Expr::Repl(n, items, _) => {
                let inner: usize = items.iter().map(|i| self.ty_inner(cx, i).w).sum();
                let n = self
                    .const_int(cx.sc, n)
                    .unwrap_or(1)
                    .clamp(0, super::MAX_WIDTH as i64) as usize;
                Ty {
                    w: (n * inner).min(super::MAX_WIDTH),
                    s: false,
                }
            }
            Expr::Call(f, _, args) => {
                let name = self.name(*f);
                match name {
                    "$signed" => Ty {
                        w: self.ty_inner(cx, &args[0]).w,
                        s: true,
                    },
                    "$unsigned" => Ty {
                        w: self.ty_inner(cx, &args[0]).w,
                        s: false,
                    },
                    _ => Ty { w: 32, s: true },
                }
            }
        }
    }
}
