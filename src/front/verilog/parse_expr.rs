//! Expression parsing: precedence climbing over the levels of IEEE 1364-2005 clause 5.1.2,
//! with one loop per level (left-associative chains never nest) and a bounded nesting depth.

use super::ast::{BinOp, Cast, Expr, Select, UnOp, LEVELS};
use super::lexer::{Punct, TokenKind};
use super::parser::{ParseResult, Parser};
use super::pos::Pos;

fn binop(p: Punct) -> Option<BinOp> {
    Some(match p {
        Punct::Star => BinOp::Mul,
        Punct::Slash => BinOp::Div,
        Punct::Percent => BinOp::Mod,
        Punct::Plus => BinOp::Add,
        Punct::Minus => BinOp::Sub,
        Punct::Shl => BinOp::Shl,
        Punct::Shr => BinOp::Shr,
        Punct::AShl => BinOp::AShl,
        Punct::AShr => BinOp::AShr,
        Punct::Lt => BinOp::Lt,
        Punct::Le => BinOp::Le,
        Punct::Gt => BinOp::Gt,
        Punct::Ge => BinOp::Ge,
        Punct::EqEq => BinOp::Eq,
        Punct::BangEq => BinOp::Ne,
        Punct::EqEqEq => BinOp::CaseEq,
        Punct::BangEqEq => BinOp::CaseNe,
        Punct::Amp => BinOp::And,
        Punct::Caret => BinOp::Xor,
        Punct::TildeCaret | Punct::CaretTilde => BinOp::Xnor,
        Punct::Pipe => BinOp::Or,
        Punct::AmpAmp => BinOp::LogAnd,
        Punct::PipePipe => BinOp::LogOr,
        _ => return None,
    })
}

impl Parser<'_, '_> {
    /// A full expression (conditional operator included).
    pub fn expr(&mut self) -> ParseResult<Expr> {
        let pos = self.peek_pos();
        self.enter(pos)?;
        let r = self.cond_expr();
        self.leave();
        r
    }

    fn cond_expr(&mut self) -> ParseResult<Expr> {
        let c = self.binary(LEVELS - 1)?;
        if self.peek_p(Punct::Question) {
            let pos = self.bump().pos;
            let t = self.expr()?;
            self.expect_p(Punct::Colon, "`:` of the conditional operator")?;
            let f = self.expr()?;
            return Ok(Expr::Cond(Box::new([c, t, f]), pos));
        }
        Ok(c)
    }

    /// `a ** b ** c` (left-associative, binding tighter than `*` and looser than the unary
    /// operators: IEEE 1364-2005 Table 5-4).
    fn power(&mut self) -> ParseResult<Expr> {
        let first = self.unary()?;
        let mut rest = Vec::new();
        while self.peek_p(Punct::Power) {
            let pos = self.bump().pos;
            rest.push((BinOp::Pow, pos, self.unary()?));
        }
        if rest.is_empty() {
            Ok(first)
        } else {
            Ok(Expr::Chain(Box::new(first), rest))
        }
    }

    fn binary(&mut self, level: usize) -> ParseResult<Expr> {
        let first = if level == 0 {
            self.power()?
        } else {
            self.binary(level - 1)?
        };
        let mut rest = Vec::new();
        while let Some(op) = self.peek_binop(level) {
            let pos = self.bump().pos;
            let rhs = if level == 0 {
                self.power()?
            } else {
                self.binary(level - 1)?
            };
            rest.push((op, pos, rhs));
        }
        if rest.is_empty() {
            Ok(first)
        } else {
            Ok(Expr::Chain(Box::new(first), rest))
        }
    }

    fn peek_binop(&mut self, level: usize) -> Option<BinOp> {
        match &self.peek().kind {
            TokenKind::Punct(p) => binop(*p).filter(|op| op.level() == level),
            _ => None,
        }
    }

    fn unary(&mut self) -> ParseResult<Expr> {
        let op = match &self.peek().kind {
            TokenKind::Punct(Punct::Plus) => Some(UnOp::Plus),
            TokenKind::Punct(Punct::Minus) => Some(UnOp::Neg),
            TokenKind::Punct(Punct::Tilde) => Some(UnOp::Not),
            TokenKind::Punct(Punct::Bang) => Some(UnOp::LogNot),
            TokenKind::Punct(Punct::Amp) => Some(UnOp::RedAnd),
            TokenKind::Punct(Punct::TildeAmp) => Some(UnOp::RedNand),
            TokenKind::Punct(Punct::Pipe) => Some(UnOp::RedOr),
            TokenKind::Punct(Punct::TildePipe) => Some(UnOp::RedNor),
            TokenKind::Punct(Punct::Caret) => Some(UnOp::RedXor),
            TokenKind::Punct(Punct::TildeCaret) | TokenKind::Punct(Punct::CaretTilde) => {
                Some(UnOp::RedXnor)
            }
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

    /// A primary, or a cast of one: `W'(e)` where the primary `W` is the width (a number, a
    /// parameter, a parenthesized constant expression), `T'(e)` with a type `T`, and
    /// `signed'(e)`, `unsigned'(e)` (IEEE 1800-2017 clause 6.24).
    fn primary(&mut self) -> ParseResult<Expr> {
        if self.peek2().kind == TokenKind::Punct(Punct::Tick) {
            if let TokenKind::Ident(k) = self.peek().kind {
                let name = self.names.name(k);
                if name == "signed" || name == "unsigned" {
                    let signed = name == "signed";
                    let pos = self.bump().pos;
                    return self.cast_operand(None, Some(signed), pos);
                }
                if matches!(
                    name,
                    "logic" | "bit" | "reg" | "int" | "integer" | "byte" | "shortint" | "longint"
                ) || self.lookup_type(k).is_some()
                {
                    let pos = self.peek_pos();
                    let t = self.data_type()?;
                    let width = super::parse_types::width_of(&t, pos);
                    return self.cast_operand(Some(width), Some(t.signed), pos);
                }
            }
        }
        let e = self.primary_operand()?;
        if self.peek_p(Punct::Tick) {
            let pos = e.pos();
            return self.cast_operand(Some(e), None, pos);
        }
        Ok(e)
    }

    /// `'( e )` after the width or type of a cast.
    fn cast_operand(
        &mut self,
        width: Option<Expr>,
        signed: Option<bool>,
        pos: Pos,
    ) -> ParseResult<Expr> {
        self.expect_p(Punct::Tick, "`'` of a cast")?;
        self.expect_p(Punct::LParen, "`(` after the `'` of a cast")?;
        let expr = self.expr()?;
        self.expect_p(Punct::RParen, "`)` closing the cast")?;
        Ok(Expr::Cast(
            Box::new(Cast {
                width,
                signed,
                expr,
            }),
            pos,
        ))
    }

    fn primary_operand(&mut self) -> ParseResult<Expr> {
        let t = self.bump();
        let pos = t.pos;
        match t.kind {
            TokenKind::Number(n) => Ok(Expr::Num(n, pos)),
            TokenKind::Ident(s) if !super::symbols::is_keyword(s) => {
                if self.peek_p(Punct::LParen) {
                    // A function call (IEEE 1364-2005 clause 10.4.2).
                    self.bump();
                    let mut args = Vec::new();
                    if !self.eat_p(Punct::RParen) {
                        loop {
                            args.push(self.expr()?);
                            if !self.eat_p(Punct::Comma) {
                                break;
                            }
                        }
                        self.expect_p(Punct::RParen, "`)` closing the function's arguments")?;
                    }
                    return Ok(Expr::Call(s, pos, args));
                }
                if let Some(e) = self.array_ref(s, pos, false)? {
                    return Ok(e);
                }
                if let Some(e) = self.struct_member(s, pos)? {
                    return Ok(e);
                }
                if self.peek_p(Punct::Colon) && self.peek2().kind == TokenKind::Punct(Punct::Colon)
                {
                    return self.scoped_name(s, pos);
                }
                if self.peek_p(Punct::Dot) {
                    let n = self.names.name(s).to_string();
                    return Err(self.unsupported(pos, format!("hierarchical name `{n}.`...")));
                }
                if self.peek_p(Punct::LBrack) {
                    let sel = self.select()?;
                    if self.peek_p(Punct::LBrack) {
                        let p2 = self.peek_pos();
                        return Err(self.unsupported(p2, "multiple selects (arrays of vectors)"));
                    }
                    return Ok(Expr::Index(s, pos, Box::new(sel)));
                }
                Ok(Expr::Ident(s, pos))
            }
            TokenKind::SystemName(s) => {
                let n = self.names.name(s).to_string();
                if !matches!(n.as_str(), "$signed" | "$unsigned" | "$clog2" | "$bits") {
                    return Err(self.unsupported(pos, format!("system function `{n}`")));
                }
                self.expect_p(Punct::LParen, "`(` after a system function")?;
                if n == "$bits" {
                    // IEEE 1800-2017 clause 20.6.2 (from memory): the bits of a type or
                    // of an expression (the latter sized by the elaborator).
                    if let Some(w) = self.bits_of_type()? {
                        self.expect_p(Punct::RParen, "`)`")?;
                        return Ok(w);
                    }
                }
                let a = self.expr()?;
                self.expect_p(Punct::RParen, "`)`")?;
                Ok(Expr::Call(s, pos, vec![a]))
            }
            TokenKind::Punct(Punct::LParen) => {
                let e = self.expr()?;
                self.expect_p(Punct::RParen, "`)`")?;
                Ok(e)
            }
            TokenKind::Punct(Punct::LBrace) => self.concat(pos),
            TokenKind::Real => Err(self.unsupported(pos, "real number")),
            TokenKind::StringLiteral => Err(self.unsupported(pos, "string literal")),
            other => {
                let d = self.describe(&other);
                Err(self.unexpected(pos, "an expression", &d))
            }
        }
    }

    fn concat(&mut self, pos: super::pos::Pos) -> ParseResult<Expr> {
        let first = self.expr()?;
        if self.peek_p(Punct::LBrace) {
            self.bump();
            let mut items = vec![self.expr()?];
            while self.eat_p(Punct::Comma) {
                items.push(self.expr()?);
            }
            self.expect_p(Punct::RBrace, "`}` closing the replicated items")?;
            self.expect_p(Punct::RBrace, "`}` closing the replication")?;
            return Ok(Expr::Repl(Box::new(first), items, pos));
        }
        let mut items = vec![first];
        while self.eat_p(Punct::Comma) {
            items.push(self.expr()?);
        }
        self.expect_p(Punct::RBrace, "`}` closing the concatenation")?;
        Ok(Expr::Concat(items, pos))
    }

    /// `[i]`, `[m:l]`, `[b+:w]` or `[b-:w]` (the `[` not yet consumed).
    pub fn select(&mut self) -> ParseResult<Select> {
        self.expect_p(Punct::LBrack, "`[`")?;
        let a = self.expr()?;
        let sel = if self.eat_p(Punct::Colon) {
            Select::Part(a, self.expr()?)
        } else if self.eat_p(Punct::PlusColon) {
            Select::Up(a, self.expr()?)
        } else if self.eat_p(Punct::MinusColon) {
            Select::Down(a, self.expr()?)
        } else {
            Select::Bit(a)
        };
        self.expect_p(Punct::RBrack, "`]`")?;
        Ok(sel)
    }
}
