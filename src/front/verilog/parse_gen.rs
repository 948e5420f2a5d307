//! Parsing of module instances (parameter values, port connections) and generate
//! constructs (`for` loops over a genvar, `if`, `begin : name ... end` blocks).

use super::ast::*;
use super::lexer::{Punct, TokenKind};
use super::parser::{ParseResult, Parser};
use super::pos::Pos;
use super::symbols::{kw, Sym};

impl Parser<'_, '_> {
    pub(super) fn instance(&mut self, out: &mut Vec<Item>) -> ParseResult<()> {
        let (module, _) = self.ident("a module item")?;
        let params = if self.eat_p(Punct::Hash) {
            self.expect_p(Punct::LParen, "`(` of the parameter values")?;
            let c = self.conns()?;
            self.expect_p(Punct::RParen, "`)` closing the parameter values")?;
            Some(c)
        } else {
            None
        };
        loop {
            let (name, pos) = self.ident("an instance name")?;
            // An array of instances (IEEE 1364-2005 clause 12.1.2): `u[3:0]`.
            let array = if self.eat_p(Punct::LBrack) {
                let msb = self.expr()?;
                self.expect_p(Punct::Colon, "`:` in the range of an array of instances")?;
                let lsb = self.expr()?;
                self.expect_p(Punct::RBrack, "`]` closing the range")?;
                Some(Range { msb, lsb })
            } else {
                None
            };
            self.expect_p(Punct::LParen, "`(` of the port connections")?;
            let conns = self.conns()?;
            self.expect_p(Punct::RParen, "`)` closing the port connections")?;
            out.push(Item::Inst(Box::new(Instance {
                module,
                params: params.clone(),
                name,
                conns,
                pos,
                array,
            })));
            if !self.eat_p(Punct::Comma) {
                break;
            }
        }
        self.expect_p(Punct::Semi, "`;` after the instance")
    }

    /// `defparam a.P = e, b.c.Q = f;` (IEEE 1364-2005 clause 12.2.1), the keyword next.
    pub(super) fn defparam(&mut self, out: &mut Vec<Item>) -> ParseResult<()> {
        self.bump();
        loop {
            let pos = self.peek_pos();
            let mut path = vec![self.ident("an instance name")?];
            while self.eat_p(Punct::Dot) {
                path.push(self.ident("an instance or parameter name")?);
            }
            if self.peek_p(Punct::LBrack) {
                return Err(self.unsupported_here(
                    "a `defparam` path through an array of instances or a generate block (name instances of the module and their instances only)",
                ));
            }
            if path.len() < 2 {
                return Err(self.error(
                    pos,
                    "a `defparam` names an instance and its parameter, e.g. `defparam u1.W = 8;`",
                ));
            }
            self.expect_p(Punct::Assign, "`=` in a `defparam`")?;
            let value = self.expr()?;
            out.push(Item::Defparam(Box::new(Defparam { path, value, pos })));
            if !self.eat_p(Punct::Comma) {
                break;
            }
        }
        self.expect_p(Punct::Semi, "`;` after the `defparam`")
    }

    fn conns(&mut self) -> ParseResult<Conns> {
        if self.peek_p(Punct::RParen) {
            return Ok(Conns::Ordered(Vec::new()));
        }
        if self.peek_p(Punct::Dot) {
            let mut v = Vec::new();
            loop {
                self.expect_p(Punct::Dot, "`.name(...)`")?;
                let (n, p) = self.ident("a port or parameter name")?;
                self.expect_p(Punct::LParen, "`(`")?;
                let e = if self.peek_p(Punct::RParen) {
                    None
                } else {
                    Some(self.expr()?)
                };
                self.expect_p(Punct::RParen, "`)`")?;
                v.push((n, p, e));
                if !self.eat_p(Punct::Comma) {
                    break;
                }
            }
            return Ok(Conns::Named(v));
        }
        let mut v = Vec::new();
        loop {
            if self.peek_p(Punct::Comma) || self.peek_p(Punct::RParen) {
                v.push(None);
            } else {
                v.push(Some(self.expr()?));
            }
            if !self.eat_p(Punct::Comma) {
                break;
            }
        }
        Ok(Conns::Ordered(v))
    }

    /// `i = expr` in a `for` header.
    pub fn loop_assign(&mut self) -> ParseResult<(Sym, Pos, Expr)> {
        let (n, p) = self.ident("a loop variable")?;
        if let Some(e) = self.step_assign(Expr::Ident(n, p))? {
            return Ok((n, p, e));
        }
        self.expect_p(Punct::Assign, "`=` in the loop header")?;
        Ok((n, p, self.expr()?))
    }

    /// After an assignment target `lhs`: SystemVerilog's `lhs++`, `lhs--` and
    /// `lhs op= e` for `+ - * & | ^` (IEEE 1800-2017 clause 11.4.1, from memory) as the
    /// value `lhs op e` to assign; `None` (nothing read) when the next token is not one.
    pub fn step_assign(&mut self, lhs: Expr) -> ParseResult<Option<Expr>> {
        let op = match self.peek().kind {
            TokenKind::Punct(Punct::Plus) => BinOp::Add,
            TokenKind::Punct(Punct::Minus) => BinOp::Sub,
            TokenKind::Punct(Punct::Star) => BinOp::Mul,
            TokenKind::Punct(Punct::Amp) => BinOp::And,
            TokenKind::Punct(Punct::Pipe) => BinOp::Or,
            TokenKind::Punct(Punct::Caret) => BinOp::Xor,
            _ => return Ok(None),
        };
        let pos = self.peek_pos();
        let second = self.peek2().kind.clone();
        let rhs = match (op, second) {
            (BinOp::Add, TokenKind::Punct(Punct::Plus))
            | (BinOp::Sub, TokenKind::Punct(Punct::Minus)) => {
                self.bump();
                self.bump();
                Expr::Num(
                    Box::new(super::lexer::NumLit {
                        bits: [vec![super::lexer::B1], vec![super::lexer::B0; 31]].concat(),
                        signed: true,
                        sized: false,
                        text: "1".into(),
                    }),
                    pos,
                )
            }
            (_, TokenKind::Punct(Punct::Assign)) => {
                self.bump();
                self.bump();
                self.expr()?
            }
            _ => return Ok(None),
        };
        Ok(Some(Expr::Chain(Box::new(lhs), vec![(op, pos, rhs)])))
    }

    pub(super) fn gen_for(&mut self, out: &mut Vec<Item>) -> ParseResult<()> {
        let pos = self.bump().pos;
        self.expect_p(Punct::LParen, "`(` after `for`")?;
        if self.eat_kw(kw::GENVAR) {
            let (n, p) = match self.peek().kind {
                TokenKind::Ident(s) => (s, self.peek_pos()),
                _ => return Err(self.error(pos, "expected a genvar name")),
            };
            out.push(Item::Genvar(vec![(n, p)]));
        }
        let init = self.loop_assign()?;
        self.expect_p(Punct::Semi, "`;` in the loop header")?;
        let cond = self.expr()?;
        self.expect_p(Punct::Semi, "`;` in the loop header")?;
        let step = self.loop_assign()?;
        self.expect_p(Punct::RParen, "`)` closing the loop header")?;
        let (name, items) = self.gen_block()?;
        out.push(Item::GenFor(Box::new(GenFor {
            init,
            cond,
            step,
            name,
            items,
            pos,
        })));
        Ok(())
    }

    pub(super) fn gen_if(&mut self, out: &mut Vec<Item>) -> ParseResult<()> {
        let pos = self.bump().pos;
        self.expect_p(Punct::LParen, "`(` after `if`")?;
        let cond = self.expr()?;
        self.expect_p(Punct::RParen, "`)`")?;
        let (_, then) = self.gen_block()?;
        let els = if self.eat_kw(kw::ELSE) {
            if self.peek_kw(kw::IF) {
                let mut v = Vec::new();
                self.enter(pos)?;
                let r = self.gen_if(&mut v);
                self.leave();
                r?;
                v
            } else {
                self.gen_block()?.1
            }
        } else {
            Vec::new()
        };
        out.push(Item::GenIf(Box::new((cond, then, els))));
        Ok(())
    }

    /// `begin [: name] items end`, or a single item.
    fn gen_block(&mut self) -> ParseResult<(Option<Sym>, Vec<Item>)> {
        let pos = self.peek_pos();
        self.enter(pos)?;
        let r = self.gen_block_inner();
        self.leave();
        r
    }

    fn gen_block_inner(&mut self) -> ParseResult<(Option<Sym>, Vec<Item>)> {
        let mut items = Vec::new();
        if self.eat_kw(kw::BEGIN) {
            let name = if self.eat_p(Punct::Colon) {
                Some(self.ident("a block name")?.0)
            } else {
                None
            };
            loop {
                if self.eat_kw(kw::END) {
                    break;
                }
                if matches!(self.peek().kind, TokenKind::Eof) || self.peek_kw(kw::ENDMODULE) {
                    let p = self.peek_pos();
                    return Err(self.error(p, "missing `end` of a generate block"));
                }
                self.item_or_skip(&mut items);
            }
            if self.eat_p(Punct::Colon) {
                self.ident("a block name")?;
            }
            Ok((name, items))
        } else {
            self.item(&mut items)?;
            Ok((None, items))
        }
    }
}
