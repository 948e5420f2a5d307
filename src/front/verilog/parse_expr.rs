//! Expression parsing: precedence climbing over the levels of IEEE 1364-2005 clause 5.1.2,
//! with one loop per level (left-associative chains never nest) and a bounded nesting depth.

use super::ast::{BinOp, Expr, Select, UnOp, LEVELS};
use super::lexer::{Tok, P};
use super::parser::{PResult, Parser};

fn binop(p: P) -> Option<BinOp> {
    Some(match p {
        P::Star => BinOp::Mul,
        P::Slash => BinOp::Div,
        P::Percent => BinOp::Mod,
        P::Plus => BinOp::Add,
        P::Minus => BinOp::Sub,
        P::Shl => BinOp::Shl,
        P::Shr => BinOp::Shr,
        P::AShl => BinOp::AShl,
        P::AShr => BinOp::AShr,
        P::Lt => BinOp::Lt,
        P::Le => BinOp::Le,
        P::Gt => BinOp::Gt,
        P::Ge => BinOp::Ge,
        P::EqEq => BinOp::Eq,
        P::BangEq => BinOp::Ne,
        P::EqEqEq => BinOp::CaseEq,
        P::BangEqEq => BinOp::CaseNe,
        P::Amp => BinOp::And,
        P::Caret => BinOp::Xor,
        P::TildeCaret | P::CaretTilde => BinOp::Xnor,
        P::Pipe => BinOp::Or,
        P::AmpAmp => BinOp::LogAnd,
        P::PipePipe => BinOp::LogOr,
        _ => return None,
    })
}

impl Parser<'_, '_> {
    /// A full expression (conditional operator included).
    pub fn expr(&mut self) -> PResult<Expr> {
        let pos = self.peek_pos();
        self.enter(pos)?;
        let r = self.cond_expr();
        self.leave();
        r
    }

    fn cond_expr(&mut self) -> PResult<Expr> {
        let c = self.binary(LEVELS - 1)?;
        if self.peek_p(P::Question) {
            let pos = self.bump().pos;
            let t = self.expr()?;
            self.expect_p(P::Colon, "`:` of the conditional operator")?;
            let f = self.expr()?;
            return Ok(Expr::Cond(Box::new([c, t, f]), pos));
        }
        Ok(c)
    }

    fn binary(&mut self, level: usize) -> PResult<Expr> {
        let first = if level == 0 {
            self.unary()?
        } else {
            self.binary(level - 1)?
        };
        let mut rest = Vec::new();
        while let Some(op) = self.peek_binop(level) {
            let pos = self.bump().pos;
            if matches!(op, BinOp::CaseEq | BinOp::CaseNe) {
                self.error(
                    pos,
                    format!(
                        "unsupported: case equality operator `{}` (use `==`/`!=`)",
                        op.text()
                    ),
                );
            }
            let rhs = if level == 0 {
                self.unary()?
            } else {
                self.binary(level - 1)?
            };
            rest.push((op, pos, rhs));
        }
        if self.peek_p(P::Power) {
            let pos = self.peek_pos();
            return Err(self.error(pos, "unsupported: power operator `**`"));
        }
        if rest.is_empty() {
            Ok(first)
        } else {
            Ok(Expr::Chain(Box::new(first), rest))
        }
    }

    fn peek_binop(&mut self, level: usize) -> Option<BinOp> {
        match &self.peek().tok {
            Tok::P(p) => binop(*p).filter(|op| op.level() == level),
            _ => None,
        }
    }

    fn unary(&mut self) -> PResult<Expr> {
        let op = match &self.peek().tok {
            Tok::P(P::Plus) => Some(UnOp::Plus),
            Tok::P(P::Minus) => Some(UnOp::Neg),
            Tok::P(P::Tilde) => Some(UnOp::Not),
            Tok::P(P::Bang) => Some(UnOp::LogNot),
            Tok::P(P::Amp) => Some(UnOp::RedAnd),
            Tok::P(P::TildeAmp) => Some(UnOp::RedNand),
            Tok::P(P::Pipe) => Some(UnOp::RedOr),
            Tok::P(P::TildePipe) => Some(UnOp::RedNor),
            Tok::P(P::Caret) => Some(UnOp::RedXor),
            Tok::P(P::TildeCaret) | Tok::P(P::CaretTilde) => Some(UnOp::RedXnor),
            _ => None,
        };
        match op {
            Some(op) => {
                let pos = self.bump().pos;
                self.enter(pos)?;
                let e = self.unary();
                self.leave();
                Ok(Expr::Unary(op, pos, Box::new(e?)))
            }
            None => self.primary(),
        }
    }

    fn primary(&mut self) -> PResult<Expr> {
        let t = self.bump();
        let pos = t.pos;
        match t.tok {
            Tok::Num(n) => Ok(Expr::Num(n, pos)),
            Tok::Ident(s) if !super::symbols::is_keyword(s) => {
                if self.peek_p(P::LParen) {
                    let n = self.names.name(s).to_string();
                    return Err(self.error(pos, format!("unsupported: function call `{n}(...)`")));
                }
                if self.peek_p(P::Dot) {
                    let n = self.names.name(s).to_string();
                    return Err(
                        self.error(pos, format!("unsupported: hierarchical name `{n}.`..."))
                    );
                }
                if self.peek_p(P::LBrack) {
                    let sel = self.select()?;
                    if self.peek_p(P::LBrack) {
                        let p2 = self.peek_pos();
                        return Err(
                            self.error(p2, "unsupported: multiple selects (arrays of vectors)")
                        );
                    }
                    return Ok(Expr::Index(s, pos, Box::new(sel)));
                }
                Ok(Expr::Ident(s, pos))
            }
            Tok::Sys(s) => {
                let n = self.names.name(s).to_string();
                if !matches!(n.as_str(), "$signed" | "$unsigned" | "$clog2") {
                    return Err(self.error(pos, format!("unsupported: system function `{n}`")));
                }
                self.expect_p(P::LParen, "`(` after a system function")?;
                let a = self.expr()?;
                self.expect_p(P::RParen, "`)`")?;
                Ok(Expr::Call(s, pos, vec![a]))
            }
            Tok::P(P::LParen) => {
                let e = self.expr()?;
                self.expect_p(P::RParen, "`)`")?;
                Ok(e)
            }
            Tok::P(P::LBrace) => self.concat(pos),
            Tok::Real => Err(self.error(pos, "unsupported: real number")),
            Tok::Str => Err(self.error(pos, "unsupported: string literal")),
            other => {
                let d = self.describe(&other);
                Err(self.error(pos, format!("expected an expression, found {d}")))
            }
        }
    }

    fn concat(&mut self, pos: super::lexer::Pos) -> PResult<Expr> {
        let first = self.expr()?;
        if self.peek_p(P::LBrace) {
            self.bump();
            let mut items = vec![self.expr()?];
            while self.eat_p(P::Comma) {
                items.push(self.expr()?);
            }
            self.expect_p(P::RBrace, "`}` closing the replicated items")?;
            self.expect_p(P::RBrace, "`}` closing the replication")?;
            return Ok(Expr::Repl(Box::new(first), items, pos));
        }
        let mut items = vec![first];
        while self.eat_p(P::Comma) {
            items.push(self.expr()?);
        }
        self.expect_p(P::RBrace, "`}` closing the concatenation")?;
        Ok(Expr::Concat(items, pos))
    }

    /// `[i]`, `[m:l]`, `[b+:w]` or `[b-:w]` (the `[` not yet consumed).
    pub fn select(&mut self) -> PResult<Select> {
        self.expect_p(P::LBrack, "`[`")?;
        let a = self.expr()?;
        let sel = if self.eat_p(P::Colon) {
            Select::Part(a, self.expr()?)
        } else if self.eat_p(P::PlusColon) {
            Select::Up(a, self.expr()?)
        } else if self.eat_p(P::MinusColon) {
            Select::Down(a, self.expr()?)
        } else {
            Select::Bit(a)
        };
        self.expect_p(P::RBrack, "`]`")?;
        Ok(sel)
    }
}
