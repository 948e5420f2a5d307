//! Statement parsing for `always @*` blocks: blocking assignments, `begin`/`end`, `if`,
//! `case`/`casez` and `for`; everything else is reported as unsupported.

use super::ast::{CaseStmt, ForStmt, Stmt};
use super::lexer::{Punct, TokenKind};
use super::parser::{ParseResult, Parser};
use super::symbols::kw;

impl Parser<'_, '_> {
    /// One statement.
    pub fn stmt(&mut self) -> ParseResult<Stmt> {
        let pos = self.peek_pos();
        self.enter(pos)?;
        let r = self.stmt_inner();
        self.leave();
        r
    }

    fn stmt_inner(&mut self) -> ParseResult<Stmt> {
        // SystemVerilog `unique`, `unique0` and `priority` before `case` or `if` (IEEE
        // 1800-2017 clauses 12.4.2 and 12.5.3, from memory): read as the plain statement;
        // the checks they imply are made by the elaborator (`stmt/qualified.rs`) and reported
        // as warnings.
        if let TokenKind::Ident(k) = self.peek().kind {
            let q = match self.names.name(k) {
                "unique" => Some(super::ast::Qualifier::Unique),
                "unique0" => Some(super::ast::Qualifier::Unique0),
                "priority" => Some(super::ast::Qualifier::Priority),
                _ => None,
            };
            if let Some(q) = q {
                if matches!(self.peek2().kind, TokenKind::Ident(c) if c == kw::CASE || c == kw::CASEZ || c == kw::IF)
                {
                    let at = self.bump().pos;
                    let inner = self.stmt_inner()?;
                    return Ok(Stmt::Qualified(q, at, Box::new(inner)));
                }
            }
        }
        let t = self.peek().clone();
        let pos = t.pos;
        if let TokenKind::Ident(k) = t.kind {
            if self.names.name(k) == "return" {
                return self.return_stmt(pos);
            }
            if !super::symbols::is_keyword(k)
                && self.peek2().kind == TokenKind::Punct(Punct::LParen)
            {
                // A task call `t(a, b);` (tasks are not read): the whole statement.
                let n = self.names.name(k).to_string();
                return Err(self.unsupported(pos, format!("task call `{n}(...)` (tasks are not read; write the logic as a function or in the block)")));
            }
        }
        match t.kind {
            TokenKind::Punct(Punct::Semi) => {
                self.bump();
                Ok(Stmt::Null)
            }
            TokenKind::Ident(k) if k == kw::BEGIN => {
                self.bump();
                if self.eat_p(Punct::Colon) {
                    self.ident("a block name")?;
                }
                let mut v = Vec::new();
                loop {
                    if self.eat_kw(kw::END) {
                        break;
                    }
                    if matches!(self.peek().kind, TokenKind::Eof) || self.peek_kw(kw::ENDMODULE) {
                        return Err(self.error(pos, "missing `end` for this `begin`"));
                    }
                    if self.peek_kw(kw::REG) || self.peek_kw(kw::INTEGER) || self.peek_kw(kw::WIRE)
                    {
                        let p = self.peek_pos();
                        return Err(self.unsupported(
                            p,
                            "declaration inside a block (declare it in the module)",
                        ));
                    }
                    // After an error in one statement, skip that statement and go on
                    // with the next (its error is recorded; no follow-on errors).
                    let before = self.taken;
                    match self.stmt() {
                        Ok(s) => v.push(s),
                        Err(_) if self.peek_kw(kw::END) && self.taken > before => {}
                        Err(_) => {
                            self.skip_statement();
                            if self.taken == before {
                                self.bump();
                            }
                        }
                    }
                }
                Ok(Stmt::Block(v))
            }
            TokenKind::Ident(k) if k == kw::IF => {
                self.bump();
                self.expect_p(Punct::LParen, "`(` after `if`")?;
                let c = self.expr()?;
                self.expect_p(Punct::RParen, "`)` after the condition")?;
                let t = self.stmt()?;
                let e = if self.eat_kw(kw::ELSE) {
                    Some(Box::new(self.stmt()?))
                } else {
                    None
                };
                Ok(Stmt::If(c, Box::new(t), e, pos))
            }
            TokenKind::Ident(k) if k == kw::CASE || k == kw::CASEZ => {
                self.bump();
                self.case(k == kw::CASEZ, pos)
            }
            TokenKind::Ident(k) if k == kw::CASEX => {
                Err(self.unsupported(pos, "`casex` (use `casez` with `?` for don't-care bits)"))
            }
            TokenKind::Ident(k) if k == kw::FOR => {
                self.bump();
                self.expect_p(Punct::LParen, "`(` after `for`")?;
                let declares = match self.peek().kind {
                    TokenKind::Ident(k) => k == kw::INTEGER || self.is_int(k),
                    _ => false,
                };
                if declares {
                    self.bump();
                }
                let init = self.loop_assign()?;
                if declares {
                    self.loop_decls.push((init.0, init.1));
                }
                self.expect_p(Punct::Semi, "`;` in the loop header")?;
                let cond = self.expr()?;
                self.expect_p(Punct::Semi, "`;` in the loop header")?;
                let step = self.loop_assign()?;
                self.expect_p(Punct::RParen, "`)` closing the loop header")?;
                let body = self.stmt()?;
                Ok(Stmt::For(Box::new(ForStmt {
                    init,
                    cond,
                    step,
                    body,
                    pos,
                })))
            }
            TokenKind::Ident(k) if super::symbols::is_keyword(k) => {
                let n = self.names.name(k).to_string();
                Err(self.unsupported(
                    pos,
                    format!("`{n}` statement in an always or initial block"),
                ))
            }
            TokenKind::Ident(_) | TokenKind::Punct(Punct::LBrace) => {
                let lhs = self.lvalue()?;
                let p = self.peek_pos();
                if let Some(rhs) = self.step_assign(lhs.clone())? {
                    self.expect_p(Punct::Semi, "`;` after the assignment")?;
                    return Ok(Stmt::Assign(lhs, rhs, p));
                }
                if self.peek_p(Punct::Le) {
                    if self.in_clocked {
                        return self.non_blocking(lhs, p);
                    }
                    self.bump();
                    return Err(self
                        .unsupported(p, "non-blocking assignment `<=` in `always @*` (use `=`)"));
                }
                self.expect_p(Punct::Assign, "`=` in an assignment")?;
                if self.peek_p(Punct::Hash) || self.peek_p(Punct::At) {
                    let p = self.peek_pos();
                    return Err(self.unsupported(p, "intra-assignment timing control"));
                }
                let rhs = self.expr()?;
                self.expect_p(Punct::Semi, "`;` after the assignment")?;
                Ok(Stmt::Assign(lhs, rhs, p))
            }
            TokenKind::SystemName(s) => {
                let n = self.names.name(s).to_string();
                Err(self.unsupported(pos, format!("system task `{n}`")))
            }
            TokenKind::Punct(Punct::Hash) => Err(self.unsupported(pos, "delay control `#`")),
            TokenKind::Punct(Punct::At) => {
                Err(self.unsupported(pos, "event control `@` inside a block"))
            }
            other => {
                let d = self.describe(&other);
                Err(self.unexpected(pos, "a statement", &d))
            }
        }
    }

    /// `return expr;` (IEEE 1800-2017 clause 13.4.1, from memory), in a function only.
    fn return_stmt(&mut self, pos: super::pos::Pos) -> ParseResult<Stmt> {
        self.bump();
        if !self.in_function {
            return Err(self.unsupported(pos, "`return` outside a function"));
        }
        if self.peek_p(Punct::Semi) {
            return Err(self.unsupported(pos, "`return` without a value"));
        }
        let e = self.expr()?;
        self.expect_p(Punct::Semi, "`;` after the returned value")?;
        Ok(Stmt::Return(e, pos))
    }

    /// An assignment target: a name, a select of a name, or a concatenation of targets.
    pub fn lvalue(&mut self) -> ParseResult<super::ast::Expr> {
        // Parsed as a primary; the elaborator checks that it is assignable.
        let pos = self.peek_pos();
        match self.peek().kind {
            TokenKind::Ident(_) | TokenKind::Punct(Punct::LBrace) => {}
            _ => return Err(self.error(pos, "expected an assignment target")),
        }
        let save_depth_ok = self.enter(pos);
        save_depth_ok?;
        let r = self.lvalue_primary();
        self.leave();
        r
    }

    fn lvalue_primary(&mut self) -> ParseResult<super::ast::Expr> {
        use super::ast::Expr;
        let t = self.bump();
        match t.kind {
            TokenKind::Ident(s) if !super::symbols::is_keyword(s) => {
                if let Some(e) = self.array_ref(s, t.pos, true)? {
                    return Ok(e);
                }
                if let Some(e) = self.struct_member(s, t.pos)? {
                    return Ok(e);
                }
                if self.peek_p(Punct::LBrack) {
                    let sel = self.select()?;
                    return Ok(Expr::Index(s, t.pos, Box::new(sel)));
                }
                Ok(Expr::Ident(s, t.pos))
            }
            TokenKind::Punct(Punct::LBrace) => {
                let mut v = vec![self.lvalue()?];
                while self.eat_p(Punct::Comma) {
                    v.push(self.lvalue()?);
                }
                self.expect_p(Punct::RBrace, "`}`")?;
                Ok(Expr::Concat(v, t.pos))
            }
            other => {
                let d = self.describe(&other);
                Err(self.unexpected(t.pos, "an assignment target", &d))
            }
        }
    }

    fn case(&mut self, casez: bool, pos: super::pos::Pos) -> ParseResult<Stmt> {
        self.expect_p(Punct::LParen, "`(` after `case`")?;
        let expr = self.expr()?;
        self.expect_p(Punct::RParen, "`)`")?;
        let inside = self.peek_name_is("inside");
        if inside {
            if casez {
                let p = self.peek_pos();
                return Err(self.unsupported(p, "`casez ... inside` (write `case (...) inside`)"));
            }
            self.bump();
        }
        let mut items = Vec::new();
        let mut ranges = Vec::new();
        let mut default = None;
        loop {
            if self.eat_kw(kw::ENDCASE) {
                break;
            }
            if matches!(self.peek().kind, TokenKind::Eof) || self.peek_kw(kw::ENDMODULE) {
                return Err(self.error(pos, "missing `endcase`"));
            }
            if self.peek_kw(kw::DEFAULT) {
                let p = self.bump().pos;
                self.eat_p(Punct::Colon);
                let s = self.stmt()?;
                if default.is_some() {
                    return Err(self.error(p, "more than one `default` in a case statement"));
                }
                default = Some(s);
                continue;
            }
            let mut labels = Vec::new();
            loop {
                if inside && self.eat_p(Punct::LBrack) {
                    // A range `[lo:hi]`, both bounds included.
                    let lo = self.expr()?;
                    self.expect_p(Punct::Colon, "`:` between the bounds of a range")?;
                    let hi = if let TokenKind::SystemName(_) = self.peek().kind {
                        // Recorded, and read on as `[lo:lo]` so that nothing follows from it.
                        let p = self.bump().pos;
                        let _ = self.unsupported(
                            p,
                            "`$` as a bound of a `case inside` range (write the largest value)",
                        );
                        lo.clone()
                    } else {
                        self.expr()?
                    };
                    self.expect_p(Punct::RBrack, "`]` closing the range")?;
                    ranges.push((items.len(), lo, hi));
                } else {
                    labels.push(self.expr()?);
                }
                if !self.eat_p(Punct::Comma) {
                    break;
                }
            }
            self.expect_p(Punct::Colon, "`:` after the case item")?;
            let s = self.stmt()?;
            items.push((labels, s));
        }
        Ok(Stmt::Case(Box::new(CaseStmt {
            casez,
            inside,
            expr,
            items,
            ranges,
            default,
            pos,
        })))
    }
}
