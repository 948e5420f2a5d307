//! Function declarations (IEEE 1364-2005 clause 10.4; the ANSI header, `automatic` and
//! `return` of IEEE 1800-2017 clause 13.4, from memory): header, inputs, local variables
//! and body, with every `return` rewritten into an assignment to the function's name that
//! ends its path (so elaboration runs the body like a combinational always block).

use super::ast::*;
use super::lexer::{Punct, TokenKind};
use super::parser::{ParseResult, Parser, Stop};
use super::pos::Pos;
use super::symbols::{kw, Sym};

impl Parser<'_, '_> {
    /// At `function`: read the declaration into `out`; after an error, skip past its
    /// `endfunction` (the error is recorded; its insides give no follow-on errors).
    pub(super) fn function(&mut self, out: &mut Vec<Item>) {
        let pos = self.bump().pos;
        let was = std::mem::replace(&mut self.in_function, true);
        let outer_loops = std::mem::take(&mut self.loop_decls);
        let r = self.function_inner(pos);
        self.in_function = was;
        // `for (int i = ...)` in the body: `i` is a variable of the function, not the module.
        let loops = std::mem::replace(&mut self.loop_decls, outer_loops);
        match r {
            Ok(mut f) => {
                for (n, p) in loops {
                    if !f.decls.iter().any(|d| d.names.iter().any(|x| x.0 == n)) {
                        f.decls.push(super::parser::loop_variable(n, p));
                    }
                }
                out.push(Item::Function(Box::new(f)))
            }
            Err(Stop) => {
                while !matches!(self.peek().kind, TokenKind::Eof)
                    && !self.peek_kw(kw::ENDFUNCTION)
                    && !self.peek_kw(kw::ENDMODULE)
                {
                    self.bump();
                }
                if self.eat_kw(kw::ENDFUNCTION) {
                    self.end_label();
                }
            }
        }
    }

    fn function_inner(&mut self, pos: Pos) -> ParseResult<Function> {
        if !self.eat_kw(kw::AUTOMATIC) {
            if let TokenKind::Ident(k) = self.peek().kind {
                if self.names.name(k) == "static" {
                    self.bump();
                }
            }
        }
        let ret = self.result_type(pos)?;
        let (name, npos) = self.ident("a function name")?;
        if self.peek_p(Punct::Dot) || self.peek_p(Punct::Colon) {
            return Err(self.unsupported(npos, "function of a class or package scope"));
        }
        let mut decls = Vec::new();
        if self.eat_p(Punct::LParen) {
            if !self.peek_p(Punct::RParen) {
                self.ansi_args(&mut decls)?;
            }
            self.expect_p(Punct::RParen, "`)` closing the function's arguments")?;
        }
        self.expect_p(Punct::Semi, "`;` after the function header")?;
        let mut body = Vec::new();
        loop {
            if self.eat_kw(kw::ENDFUNCTION) {
                self.end_label();
                break;
            }
            if matches!(self.peek().kind, TokenKind::Eof) || self.peek_kw(kw::ENDMODULE) {
                return Err(self.error(pos, "missing `endfunction` for this `function`"));
            }
            if body.is_empty() && self.starts_local() {
                let d = self.local_decl()?;
                decls.push(d);
                continue;
            }
            body.push(self.stmt()?);
        }
        let body = tail_returns(body, name, npos).map_err(|p| {
            self.unsupported(
                p,
                "`return` inside a `for` loop (assign the function's name in the loop and return after it)",
            )
        })?;
        Ok(Function {
            name,
            ret,
            decls,
            body,
            pos,
        })
    }

    /// `endfunction : name` (IEEE 1800-2017): the label is skipped.
    fn end_label(&mut self) {
        if self.eat_p(Punct::Colon) {
            let _ = self.ident("the function's name");
        }
    }

    /// The result type: nothing (one bit), `[signed] [range]`, `integer`/`int`,
    /// `reg`/`logic`/`bit [signed] [range]`, or a SystemVerilog data type.
    fn result_type(&mut self, pos: Pos) -> ParseResult<Decl> {
        let mut d = Decl {
            dir: None,
            ty: Some(NetType::Reg),
            signed: false,
            range: None,
            names: Vec::new(),
            pos,
        };
        if let TokenKind::Ident(k) = self.peek().kind {
            if self.names.name(k) == "void" {
                let p = self.peek_pos();
                return Err(self.unsupported(p, "`void` function (a function must give a value)"));
            }
            if k == kw::INTEGER || self.is_int(k) {
                self.bump();
                d.ty = Some(NetType::Integer);
                d.signed = true;
                return Ok(d);
            }
            if k == kw::REG || self.is_sv_type(k) {
                self.bump();
            } else if self.starts_type() && !self.peek_p2_name_end() {
                self.typed_decl(&mut d)?;
                return Ok(d);
            }
        }
        if self.eat_kw(kw::SIGNED) {
            d.signed = true;
        }
        if self.peek_p(Punct::LBrack) {
            d.range = Some(Box::new(self.range()?));
            self.refuse_packed_dims()?;
        }
        Ok(d)
    }

    /// Whether the token after a name ends the function header (`f;` or `f(`): then the
    /// name is the function's, even if a type has the same name.
    fn peek_p2_name_end(&mut self) -> bool {
        matches!(
            self.peek2().kind,
            TokenKind::Punct(Punct::Semi) | TokenKind::Punct(Punct::LParen)
        )
    }

    /// ANSI arguments: `input logic [3:0] a, b, input c` (a declaration without a
    /// direction is an input, like the one before it).
    fn ansi_args(&mut self, decls: &mut Vec<Decl>) -> ParseResult<()> {
        let mut cur: Option<Decl> = None;
        loop {
            let t = self.peek().clone();
            let head = match t.kind {
                TokenKind::Ident(k) if k == kw::OUTPUT || k == kw::INOUT => {
                    return Err(self.unsupported(
                        t.pos,
                        "function argument that is not an `input` (a function gives one value)",
                    ));
                }
                TokenKind::Ident(k) if self.names.name(k) == "ref" => {
                    return Err(self.unsupported(t.pos, "`ref` function argument"));
                }
                TokenKind::Ident(k) if k == kw::INPUT => Some(self.decl_head()?),
                _ if self.starts_local() => {
                    let mut d = self.decl_head()?;
                    d.dir = Some(Dir::Input);
                    Some(d)
                }
                _ => None,
            };
            if let Some(h) = head {
                if let Some(d) = cur.take() {
                    decls.push(d);
                }
                cur = Some(h);
            }
            let (n, p) = self.ident("an argument name")?;
            match cur.as_mut() {
                Some(d) => d.names.push((n, p, None)),
                None => {
                    return Err(self.error(p, "expected an argument direction (`input`) or type"))
                }
            }
            if self.peek_p(Punct::LBrack) || self.peek_p(Punct::Assign) {
                let p = self.peek_pos();
                return Err(self.unsupported(p, "array or default value of a function argument"));
            }
            if !self.eat_p(Punct::Comma) {
                break;
            }
        }
        if let Some(d) = cur {
            decls.push(d);
        }
        Ok(())
    }

    /// Whether a declaration of a function item starts here (an input or a variable).
    fn starts_local(&mut self) -> bool {
        let TokenKind::Ident(k) = self.peek().kind else {
            return false;
        };
        k == kw::INPUT
            || k == kw::OUTPUT
            || k == kw::INOUT
            || k == kw::REG
            || k == kw::INTEGER
            || self.is_int(k)
            || self.is_sv_type(k)
            || self.starts_type()
    }

    /// `input [3:0] a, b;` or `reg [7:0] t;` / `integer i;` inside a function.
    fn local_decl(&mut self) -> ParseResult<Decl> {
        let t = self.peek().clone();
        if matches!(t.kind, TokenKind::Ident(k) if k == kw::OUTPUT || k == kw::INOUT) {
            return Err(self.unsupported(
                t.pos,
                "function argument that is not an `input` (a function gives one value)",
            ));
        }
        let mut d = self.decl_head()?;
        if d.dir.is_some() && d.ty.is_none() {
            d.ty = Some(NetType::Reg);
        }
        loop {
            let (n, p) = self.ident("a name")?;
            if self.peek_p(Punct::LBrack) || self.peek_p(Punct::Assign) {
                let p = self.peek_pos();
                return Err(self.unsupported(
                    p,
                    "array or initial value of a function variable (assign it in the body)",
                ));
            }
            d.names.push((n, p, None));
            if !self.eat_p(Punct::Comma) {
                break;
            }
        }
        self.expect_p(Punct::Semi, "`;` after the declaration")?;
        Ok(d)
    }
}

/// The body `stmts` with every `return e;` made an assignment `name = e;` after which
/// nothing of the body runs: the statements after a statement that may return move into
/// its paths that do not. `Err` with the place of a `return` inside a loop.
fn tail_returns(stmts: Vec<Stmt>, name: Sym, pos: Pos) -> Result<Stmt, Pos> {
    seq(stmts, name, pos)
}

fn seq(mut stmts: Vec<Stmt>, name: Sym, pos: Pos) -> Result<Stmt, Pos> {
    match stmts.iter().position(returns) {
        None => Ok(Stmt::Block(stmts)),
        Some(i) => {
            let rest = stmts.split_off(i + 1);
            let s = stmts.pop().unwrap_or(Stmt::Null);
            stmts.push(then(s, rest, name, pos)?);
            Ok(Stmt::Block(stmts))
        }
    }
}

/// `s` followed by `rest`, where `s` may return.
fn then(s: Stmt, rest: Vec<Stmt>, name: Sym, pos: Pos) -> Result<Stmt, Pos> {
    if !returns(&s) {
        let mut v = vec![s];
        v.extend(rest);
        return seq(v, name, pos);
    }
    Ok(match s {
        Stmt::Return(e, p) => Stmt::Assign(Expr::Ident(name, pos), e, p),
        Stmt::Block(mut v) => {
            v.extend(rest);
            seq(v, name, pos)?
        }
        Stmt::If(c, t, e, p) => {
            let t = then(*t, rest.clone(), name, pos)?;
            let e = then(e.map_or(Stmt::Null, |e| *e), rest, name, pos)?;
            Stmt::If(c, Box::new(t), Some(Box::new(e)), p)
        }
        Stmt::Case(mut c) => {
            let items = std::mem::take(&mut c.items);
            for (labels, st) in items {
                c.items.push((labels, then(st, rest.clone(), name, pos)?));
            }
            c.default = match c.default.take() {
                Some(d) => Some(then(d, rest, name, pos)?),
                None if rest.is_empty() => None,
                None => Some(seq(rest, name, pos)?),
            };
            Stmt::Case(c)
        }
        Stmt::Qualified(q, p, inner) => {
            Stmt::Qualified(q, p, Box::new(then(*inner, rest, name, pos)?))
        }
        Stmt::For(f) => return Err(first_return(&f.body).unwrap_or(f.pos)),
        other => other,
    })
}

/// Whether a `return` is somewhere in `s`.
fn returns(s: &Stmt) -> bool {
    first_return(s).is_some()
}

fn first_return(s: &Stmt) -> Option<Pos> {
    match s {
        Stmt::Return(_, p) => Some(*p),
        Stmt::Block(v) => v.iter().find_map(first_return),
        Stmt::If(_, t, e, _) => first_return(t).or_else(|| e.as_deref().and_then(first_return)),
        Stmt::Case(c) => c
            .items
            .iter()
            .find_map(|(_, s)| first_return(s))
            .or_else(|| c.default.as_ref().and_then(first_return)),
        Stmt::For(f) => first_return(&f.body),
        Stmt::Qualified(_, _, inner) => first_return(inner),
        _ => None,
    }
}
